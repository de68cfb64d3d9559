'use client';
// Fit from log: choose an aircraft, read a logger CSV (preview with problems by row), store it, fit the
// cool-down, apply the fit to the aircraft's profile, and go back to any earlier profile.
import { useRouter } from 'next/navigation';
import { useEffect, useState } from 'react';
import useSWR from 'swr';
import { Button, Card, EmptyState, Notice } from '@/components/ui/primitives';
import { useConfirm } from '@/components/ui/ConfirmDialog';
import { SelectField } from '@/components/ui/Field';
import { fetcher, sendFile, sendJson } from '@/lib/client/fetcher';
import { formatDateTime } from '@/lib/time';
import type { TempUnit } from '@/lib/units';
import type { LogPreview, LogRecord, SeriesForChart, StoredFit } from '@/lib/views/logs';
import type { ThermalParams } from '@/lib/views/aircraft';
import { FitResults } from './FitResults';
import { ProfileHistory, type Profile } from './ProfileHistory';
import { UploadForm } from './UploadForm';
import { StatusArea } from '@/components/ui/StatusArea';
import { PreviewDetails } from './PreviewDetails';

export interface CalibrationAircraft {
  id: number;
  registration: string;
  typeLabel: string;
  engineClassLabel: string;
  timeZone: string;
  thermal: ThermalParams;
  coverOnByDefault: boolean;
  archived: boolean;
  /** The heat capacity a fit assumes (the profile's total) and the oil node's share of it. */
  capacity: { total: number; oilShare: number };
}

interface Props {
  aircraft: CalibrationAircraft[];
  selectedId: number | null;
  initialLogs: LogRecord[];
  initialProfile: Profile | null;
  tempUnit: TempUnit;
}

interface Active {
  log: LogRecord;
  series: SeriesForChart;
  suggestion: { startMs: number; endMs: number } | null;
  fit: StoredFit | null;
}

export function CalibrationView({ aircraft, selectedId, initialLogs, initialProfile, tempUnit }: Props) {
  const router = useRouter();
  const [aircraftId, setAircraftId] = useState<number | null>(selectedId);
  const current = aircraft.find((a) => a.id === aircraftId) ?? null;
  const zone = current?.timeZone ?? 'UTC';
  const first = selectedId === aircraftId;
  const logs = useSWR<{ logs: LogRecord[] }>(aircraftId ? `/api/aircraft/${aircraftId}/logs` : null, fetcher, { fallbackData: first ? { logs: initialLogs } : undefined });
  const profile = useSWR<Profile>(aircraftId ? `/api/aircraft/${aircraftId}/profile` : null, fetcher, { fallbackData: first && initialProfile ? initialProfile : undefined });

  const [preview, setPreview] = useState<{ file: File; unit: 'auto' | 'C' | 'F'; data: LogPreview } | null>(null);
  const [active, setActive] = useState<Active | null>(null);
  const [status, setStatus] = useState('');
  const [error, setError] = useState('');
  const [busy, setBusy] = useState<'' | 'store' | 'open'>('');

  useEffect(() => {
    setPreview(null);
    setActive(null);
    setStatus('');
    setError('');
  }, [aircraftId]);

  function choose(id: number) {
    setAircraftId(id);
    router.replace(`/calibration?aircraft=${id}`, { scroll: false });
  }

  async function storeAndFit() {
    if (!preview || !aircraftId) return;
    setBusy('store');
    setError('');
    setStatus('Storing the log…');
    const q = new URLSearchParams({ fileName: preview.file.name, unit: preview.unit });
    const r = await sendFile<{ log: LogRecord; preview: LogPreview }>(`/api/aircraft/${aircraftId}/logs?${q}`, preview.file);
    if (!r.ok) {
      setBusy('');
      setStatus('');
      setError(r.message);
      return;
    }
    await logs.mutate();
    setStatus('Stored. Fitting the cool-down…');
    const fit = await sendJson<{ fit: StoredFit; log: LogRecord }>(`/api/aircraft/${aircraftId}/logs/${r.data.log.id}/fit`, 'POST', { coverOn: false });
    setBusy('');
    const base = { series: r.data.preview.series, suggestion: r.data.preview.suggestion };
    if (fit.ok) {
      setActive({ ...base, log: fit.data.log, fit: fit.data.fit });
      setStatus(`Stored ${r.data.log.fileName} and fitted its cool-down.`);
      requestAnimationFrame(() => document.getElementById('fit-h')?.scrollIntoView({ behavior: 'smooth', block: 'start' }));
    } else {
      setActive({ ...base, log: r.data.log, fit: null });
      setStatus(`Stored ${r.data.log.fileName}.`);
      setError(fit.message);
    }
    setPreview(null);
    void logs.mutate();
  }

  async function open(logId: number) {
    if (!aircraftId) return;
    setBusy('open');
    setError('');
    try {
      const d = await fetcher<{ log: LogRecord; series: SeriesForChart; suggestion: { startMs: number; endMs: number } | null; fit: StoredFit | null }>(`/api/aircraft/${aircraftId}/logs/${logId}`);
      setActive({ log: d.log, series: d.series, suggestion: d.suggestion, fit: d.fit });
      setPreview(null);
      setStatus(`Opened ${d.log.fileName}.`);
    } catch (e) {
      setError((e as Error).message);
    } finally {
      setBusy('');
    }
  }

  const { confirm, dialog } = useConfirm();
  async function remove(l: LogRecord) {
    if (!aircraftId) return;
    const ok = await confirm({
      title: `Remove ${l.fileName}?`,
      body: 'The log and its fits are removed. Profile changes already applied from it stay in the history.',
      confirmLabel: 'Remove log',
    });
    if (!ok) return;
    setError('');
    const r = await sendJson(`/api/aircraft/${aircraftId}/logs/${l.id}`, 'DELETE');
    if (!r.ok) {
      setError(r.message);
      return;
    }
    if (active?.log.id === l.id) setActive(null);
    setStatus(`Removed ${l.fileName}.`);
    void logs.mutate();
  }

  const logList = logs.data?.logs ?? [];

  if (!aircraft.length) {
    return <EmptyState title="No aircraft yet">Add an aircraft profile first; then upload a logged cool-down for it here.</EmptyState>;
  }

  return (
    <div className="grid gap-4 xl:grid-cols-[minmax(0,1fr)_24rem]">
      {dialog}
      <div className="min-w-0 space-y-4">
        <Card aria-labelledby="cal-upload-h">
          <h2 id="cal-upload-h" className="text-lg font-semibold">Upload a logged cool-down</h2>
          <p className="mb-4 mt-1 text-sm text-slate-600 dark:text-slate-400">
            A CSV from a temperature logger: a time column and the oil temperature, ideally the air next to the engine too. Up to 5 MB; times are read in the airfield&apos;s zone ({zone}).
          </p>
          <div className="mb-4 max-w-md">
            <SelectField id="cal-aircraft" label="Aircraft" value={aircraftId ?? ''} onChange={(e) => choose(Number(e.target.value))}>
              {aircraft.map((a) => (
                <option key={a.id} value={a.id}>
                  {a.registration} — {a.typeLabel}
                  {a.archived ? ' (archived)' : ''}
                </option>
              ))}
            </SelectField>
          </div>
          {aircraftId ? (
            <UploadForm
              key={aircraftId}
              aircraftId={aircraftId}
              onPreview={(file, unit, data) => {
                setPreview({ file, unit, data });
                setActive(null);
                setError('');
                setStatus(data.ok ? `Read ${file.name}: ${data.rowCount.toLocaleString('en-GB')} rows, no problems.` : `Read ${file.name}: ${data.problemCount} problem${data.problemCount === 1 ? '' : 's'} to fix.`);
              }}
              onError={(m) => {
                setPreview(null);
                setError(m);
                setStatus('');
              }}
            />
          ) : null}
          <StatusArea status={status} error={error} />
        </Card>

        {preview ? (
          <Card aria-labelledby="cal-preview-h">
            <div className="flex flex-wrap items-start justify-between gap-3">
              <div>
                <h2 id="cal-preview-h" className="text-lg font-semibold">Preview: {preview.data.fileName}</h2>
                <p className="text-sm text-slate-600 dark:text-slate-400">Nothing is stored until you choose to.</p>
              </div>
              <Button onClick={storeAndFit} disabled={!preview.data.ok || busy !== ''}>
                {busy === 'store' ? 'Storing and fitting…' : 'Store and fit'}
              </Button>
            </div>
            <PreviewDetails preview={preview.data} zone={zone} tempUnit={tempUnit} />
          </Card>
        ) : null}

        {active ? (
          <FitResults
            key={active.log.id}
            aircraftId={aircraftId!}
            log={active.log}
            series={active.series}
            suggestion={active.suggestion}
            fit={active.fit}
            zone={zone}
            tempUnit={tempUnit}
            capacity={current?.capacity ?? null}
            onFitted={(fit, log) => setActive((a) => (a ? { ...a, fit, log } : a))}
            onApplied={() => void profile.mutate()}
          />
        ) : null}

        {!preview && !active ? (
          <StoredLogs logs={logList} zone={zone} onOpen={open} onRemove={remove} busy={busy === 'open'} />
        ) : (
          <details className="rounded-2xl border border-slate-200 bg-white p-4 dark:border-slate-800 dark:bg-slate-900">
            <summary className="min-h-11 cursor-pointer py-2 text-sm font-semibold">Stored logs of this aircraft ({logList.length})</summary>
            <StoredLogs logs={logList} zone={zone} onOpen={open} onRemove={remove} busy={busy === 'open'} bare />
          </details>
        )}
      </div>

      <div className="min-w-0 space-y-4">
        {current && profile.data ? <ProfileHistory aircraftId={current.id} registration={current.registration} profile={profile.data} zone={zone} onChanged={() => void profile.mutate()} /> : null}
        <Notice tone="info" title="How the fit works">
          The fit finds how fast the oil cools towards the air around it (the time constant τ). Heat loss G follows as heat capacity ÷ τ, so the
          heat capacity comes from the profile. Two nodes (oil and engine mass) are offered when the data clearly support them.
        </Notice>
      </div>
    </div>
  );
}

function StoredLogs({ logs, zone, onOpen, onRemove, busy, bare = false }: { logs: LogRecord[]; zone: string; onOpen: (id: number) => void; onRemove: (l: LogRecord) => void; busy: boolean; bare?: boolean }) {
  const body = logs.length ? (
    <ul className="divide-y divide-slate-200 dark:divide-slate-800">
      {logs.map((l) => (
        <li key={l.id} className="flex flex-wrap items-center justify-between gap-3 py-3">
          <div className="min-w-0">
            <p className="truncate font-medium text-slate-900 dark:text-white">{l.fileName}</p>
            <p className="text-xs text-slate-600 dark:text-slate-400">
              {l.rowCount.toLocaleString('en-GB')} rows · {formatDateTime(Date.parse(l.startAt), zone)} → {formatDateTime(Date.parse(l.endAt), zone)}
            </p>
            <p className="text-xs text-slate-500 dark:text-slate-400">
              Uploaded {formatDateTime(Date.parse(l.uploadedAt), zone)}
              {l.uploadedBy ? ` by ${l.uploadedBy.name}` : ''}
              {l.fitted ? ' · fitted' : ''}
            </p>
          </div>
          <div className="flex gap-2">
            <Button variant="secondary" onClick={() => onOpen(l.id)} disabled={busy}>
              Open<span className="sr-only"> {l.fileName}</span>
            </Button>
            <Button variant="danger" onClick={() => onRemove(l)} disabled={busy}>
              Remove<span className="sr-only"> {l.fileName}</span>
            </Button>
          </div>
        </li>
      ))}
    </ul>
  ) : (
    <p className="py-2 text-sm text-slate-600 dark:text-slate-400">No logs stored for this aircraft yet.</p>
  );
  if (bare) return body;
  return (
    <Card aria-labelledby="cal-logs-h">
      <h2 id="cal-logs-h" className="text-lg font-semibold">Stored logs</h2>
      {body}
    </Card>
  );
}
