'use client';
// The operator's device list: add a relay or probe (its MQTT password is shown once), remove one.
import { useState } from 'react';
import useSWR from 'swr';
import { Button, Card, EmptyState, Notice } from '@/components/ui/primitives';
import { SelectField, TextField } from '@/components/ui/Field';
import { useConfirm } from '@/components/ui/ConfirmDialog';
import { fetcher, sendJson } from '@/lib/client/fetcher';

export interface DeviceRow {
  id: number;
  kind: 'relay' | 'probe';
  measures: 'oil' | 'engine' | 'shelter' | null;
  label: string;
  aircraftId: number | null;
  shelterId: number | null;
  username: string;
  topicPrefix: string;
  lastSeenAt: string | null;
}
interface Choice {
  id: number;
  label: string;
}

const KIND_LABEL = { relay: 'Heater relay', probe: 'Temperature probe' } as const;
const MEASURE_LABEL = { oil: 'Oil temperature', engine: 'Engine temperature', shelter: 'Shelter air' } as const;

export function DevicesManager({ initial, aircraft, shelters }: { initial: DeviceRow[]; aircraft: Choice[]; shelters: Choice[] }) {
  const { data, mutate } = useSWR<{ devices: DeviceRow[] }>('/api/devices', fetcher, { fallbackData: { devices: initial } });
  const devices = data?.devices ?? initial;
  const [kind, setKind] = useState<'relay' | 'probe'>('relay');
  const [measures, setMeasures] = useState<'oil' | 'engine' | 'shelter'>('oil');
  const [label, setLabel] = useState('');
  const [aircraftId, setAircraftId] = useState(aircraft[0]?.id ? String(aircraft[0].id) : '');
  const [shelterId, setShelterId] = useState(shelters[0]?.id ? String(shelters[0].id) : '');
  const [fields, setFields] = useState<Record<string, string>>({});
  const [status, setStatus] = useState('');
  const [pending, setPending] = useState(false);
  const [created, setCreated] = useState<{ device: DeviceRow; password: string } | null>(null);
  const { confirm, dialog } = useConfirm();
  const onShelter = kind === 'probe' && measures === 'shelter';
  const nameOf = (d: DeviceRow) =>
    d.aircraftId ? aircraft.find((a) => a.id === d.aircraftId)?.label : shelters.find((s) => s.id === d.shelterId)?.label;

  async function add(e: React.FormEvent) {
    e.preventDefault();
    setPending(true);
    setStatus('');
    const body = {
      kind,
      label,
      ...(kind === 'probe' ? { measures } : {}),
      ...(onShelter ? { shelterId: Number(shelterId) || undefined } : { aircraftId: Number(aircraftId) || undefined }),
    };
    const r = await sendJson<{ device: DeviceRow; password: string }>('/api/devices', 'POST', body);
    setPending(false);
    if (!r.ok) {
      setFields(r.fields);
      setStatus(r.message);
      return;
    }
    setFields({});
    setLabel('');
    setCreated(r.data);
    setStatus(`${r.data.device.label} added.`);
    void mutate();
  }

  async function override(d: DeviceRow, body: { action: 'on'; minutes: number } | { action: 'off' }) {
    const r = await sendJson<{ refused: string[] }>(`/api/devices/${d.id}/override`, 'POST', body);
    if (!r.ok) return setStatus(r.message);
    const refused = r.data.refused.length ? ` Interlock: ${[...new Set(r.data.refused)].join(', ')}.` : '';
    setStatus(`${d.label}: ${body.action === 'on' ? `on for ${body.minutes} minutes` : 'off'} sent.${refused}`);
  }

  async function remove(d: DeviceRow) {
    if (!(await confirm({ title: `Remove ${d.label}?`, body: 'Its credentials stop working; a relay then stays off once its last schedule expires.', confirmLabel: 'Remove device', tone: 'danger' }))) return;
    const r = await sendJson(`/api/devices/${d.id}`, 'DELETE');
    setStatus(r.ok ? `${d.label} removed.` : r.message);
    void mutate();
  }

  return (
    <div className="grid gap-4 lg:grid-cols-[2fr_1fr]">
      {dialog}
      <Card aria-labelledby="devices-h">
        <h2 id="devices-h" className="mb-3 text-lg font-semibold">Your devices</h2>
        {devices.length === 0 ? (
          <EmptyState title="No devices yet">Add a heater relay or a probe: it signs in to the MQTT broker with the credentials shown once.</EmptyState>
        ) : (
          <ul className="divide-y divide-slate-200 dark:divide-slate-800">
            {devices.map((d) => (
              <li key={d.id} className="flex flex-wrap items-center justify-between gap-3 py-3">
                <div className="min-w-0">
                  <p className="font-medium">{d.label}</p>
                  <p className="text-sm text-slate-600 dark:text-slate-400">
                    {d.kind === 'relay' ? KIND_LABEL.relay : `${KIND_LABEL.probe} · ${MEASURE_LABEL[d.measures ?? 'oil']}`} · {nameOf(d) ?? '—'}
                  </p>
                  <p className="break-all font-mono text-xs text-slate-500">{d.topicPrefix}</p>
                  <p className="text-xs text-slate-500">{d.lastSeenAt ? `Last heard ${new Date(d.lastSeenAt).toLocaleString()}` : 'Not connected yet'}</p>
                </div>
                <div className="flex flex-wrap gap-2">
                  {d.kind === 'relay' ? (
                    <>
                      <Button variant="heat" onClick={() => void override(d, { action: 'on', minutes: 30 })}>On for 30 min</Button>
                      <Button variant="secondary" onClick={() => void override(d, { action: 'off' })}>Off now</Button>
                    </>
                  ) : null}
                  <Button variant="danger" onClick={() => void remove(d)}>Remove</Button>
                </div>
              </li>
            ))}
          </ul>
        )}
      </Card>
      <div className="grid content-start gap-4">
        {created ? (
          <Notice tone="caution" title="Copy these credentials now">
            <p>They are shown only this once; Thawline keeps only a hash of the password.</p>
            <dl className="mt-2 grid gap-1 font-mono text-xs">
              <dt className="font-sans font-semibold">User name</dt>
              <dd className="break-all">{created.device.username}</dd>
              <dt className="font-sans font-semibold">Password</dt>
              <dd className="break-all">{created.password}</dd>
              <dt className="font-sans font-semibold">Topics</dt>
              <dd className="break-all">{created.device.topicPrefix}…</dd>
            </dl>
            <Button variant="secondary" className="mt-2" onClick={() => setCreated(null)}>I have copied them</Button>
          </Notice>
        ) : null}
        <Card aria-labelledby="add-h">
          <h2 id="add-h" className="mb-3 text-lg font-semibold">Add a device</h2>
          <form onSubmit={add} className="grid gap-3" noValidate>
            <SelectField id="device-kind" label="Kind" value={kind} onChange={(e) => setKind(e.target.value as 'relay' | 'probe')} error={fields.kind}>
              <option value="relay">{KIND_LABEL.relay}</option>
              <option value="probe">{KIND_LABEL.probe}</option>
            </SelectField>
            {kind === 'probe' ? (
              <SelectField id="device-measures" label="Measures" value={measures} onChange={(e) => setMeasures(e.target.value as 'oil' | 'engine' | 'shelter')} error={fields.measures}>
                {(['oil', 'engine', 'shelter'] as const).map((m) => <option key={m} value={m}>{MEASURE_LABEL[m]}</option>)}
              </SelectField>
            ) : null}
            <TextField id="device-label" label="Name" value={label} onChange={(e) => setLabel(e.target.value)} error={fields.label} maxLength={80} />
            {onShelter ? (
              <SelectField id="device-shelter" label="Shelter" value={shelterId} onChange={(e) => setShelterId(e.target.value)} error={fields.shelterId}>
                {shelters.map((s) => <option key={s.id} value={s.id}>{s.label}</option>)}
              </SelectField>
            ) : (
              <SelectField id="device-aircraft" label="Aircraft" value={aircraftId} onChange={(e) => setAircraftId(e.target.value)} error={fields.aircraftId} hint={kind === 'relay' ? 'Switches this aircraft’s heaters set to “Switched relay”. Combustion heaters are never switched.' : undefined}>
                {aircraft.map((a) => <option key={a.id} value={a.id}>{a.label}</option>)}
              </SelectField>
            )}
            <Button type="submit" disabled={pending}>{pending ? 'Adding…' : 'Add device'}</Button>
            <p role="status" aria-live="polite" className="text-sm">{status}</p>
          </form>
        </Card>
        <Notice tone="info" title="Safety">
          Thawline gives estimates and switches only what the plan says. The manufacturer’s cold-weather instructions, your operator’s procedures and local rules come first. Preheaters can start fires: keep heaters and cords away from fuel and fabric, and never leave combustion heaters unattended — Thawline never switches them.
        </Notice>
      </div>
    </div>
  );
}
