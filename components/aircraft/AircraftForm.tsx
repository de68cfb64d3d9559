'use client';
import { useRouter } from 'next/navigation';
import { useId, useMemo, useRef, useState } from 'react';
import { Button, Card } from '@/components/ui/primitives';
import { useConfirm } from '@/components/ui/ConfirmDialog';
import { ResultNotice, type FormResult } from './ResultNotice';
import { SelectField, TextField } from '@/components/ui/Field';
import { sendJson } from '@/lib/client/fetcher';
import { zonedTimeToUtc, zoneLabel } from '@/lib/time';
import { localIsoMinutes } from '@/lib/weather/tz';
import { fromDisplayTemp, fromDisplayVolume, tempLabel, toDisplayTemp, toDisplayVolume, volumeLabel, type TempUnit, type VolumeUnit } from '@/lib/units';
import type { AircraftRecord, EngineClassOption, PilotChoice, ShelterChoice } from '@/lib/views/aircraft';
import type { ThermalParams } from '@/lib/views/aircraft';
import { HEATER_CONTROL_HINT, HEATER_CONTROL_LABEL, HEATER_CONTROLS, HEATER_KINDS, HEATER_KIND_IDS, type HeaterControl, type HeaterKind } from '@/lib/validation/aircraft';
import { SHELTER_KIND_LABEL } from '@/lib/validation/airfields';
import { fmtPower, fmtTemp } from './format';

type Node = 'oil' | 'engine';
interface HeaterDraft {
  key: number;
  kind: HeaterKind;
  powerW: string;
  node: Node;
  control: HeaterControl;
  slotMinutes: string;
}
interface ThermalDraft {
  nodes: { name: Node; capacityKJ: string; loss: string }[];
  coupling: string;
  cover: string;
  wind: string;
}
interface Draft {
  registration: string;
  typeLabel: string;
  engineClass: string;
  oil: string;
  coverOnByDefault: boolean;
  shelterId: string;
  heaters: HeaterDraft[];
  pilotIds: number[];
  shutdownLocal: string;
  shutdownOil: string;
  thermal: ThermalDraft;
}

const num = (s: string) => Number(s.trim().replace(/\u2212/g, '-').replace(',', '.'));
const round = (v: number, digits: number) => Math.round(v * 10 ** digits) / 10 ** digits;
const show = (v: number, digits = 2) => String(round(v, digits));

/** A number typed in the user's unit → the stored unit; empty → null; unreadable text is sent as typed (the server names it). */
function convert(s: string, fn: (n: number) => number, digits: number): number | string | null {
  if (s.trim() === '') return null;
  const n = num(s);
  return Number.isFinite(n) ? round(fn(n), digits) : s;
}

function thermalDraft(t: ThermalParams): ThermalDraft {
  return {
    nodes: t.nodes.map((n) => ({ name: n.name, capacityKJ: show(n.heatCapacityJPerK / 1000, 3), loss: show(n.lossWPerK, 3) })),
    coupling: t.couplingWPerK !== undefined ? show(t.couplingWPerK, 3) : '',
    cover: show(t.coverFactor, 3),
    wind: t.windCoefficient !== undefined ? show(t.windCoefficient, 3) : '',
  };
}

function thermalBody(t: ThermalDraft) {
  const n = (s: string, k = 1) => (s.trim() === '' ? undefined : Number.isFinite(num(s)) ? round(num(s) * k, 6) : s);
  return {
    nodes: t.nodes.map((x) => ({ name: x.name, heatCapacityJPerK: n(x.capacityKJ, 1000), lossWPerK: n(x.loss) })),
    ...(t.nodes.length > 1 ? { couplingWPerK: n(t.coupling) } : {}),
    coverFactor: n(t.cover),
    ...(t.wind.trim() !== '' ? { windCoefficient: n(t.wind) } : {}),
  };
}

let heaterKey = 1;
function heaterDraft(h: { kind: string; powerW: number; node: Node; control?: HeaterControl; slotMinutes?: number }): HeaterDraft {
  return {
    key: heaterKey++,
    kind: (HEATER_KIND_IDS as string[]).includes(h.kind) ? (h.kind as HeaterKind) : 'oil-pad',
    powerW: String(h.powerW),
    node: h.node,
    control: h.control ?? 'relay',
    slotMinutes: h.slotMinutes !== undefined ? String(h.slotMinutes) : '',
  };
}

/** Server field paths → input ids, so each error shows beside its input. */
function inputIdFor(field: string): string {
  const [head, ...rest] = field.split('.');
  if (head === 'heaters' && rest.length === 2) return `ac-heater-${rest[0]}-${rest[1]}`;
  if (head === 'thermal') {
    if (rest[0] === 'nodes') return `ac-thermal-${rest[1]}-${rest[2] === 'lossWPerK' ? 'loss' : 'capacity'}`;
    return `ac-thermal-${rest[0]}`;
  }
  return `ac-${head}`;
}

const LABELS: Record<string, string> = {
  registration: 'Registration',
  typeLabel: 'Type',
  engineClass: 'Engine class',
  oilQuantityL: 'Oil quantity',
  shelterId: 'Home shelter',
  heaters: 'Heaters',
  pilotIds: 'Pilots who may book',
  lastShutdownAt: 'Last shutdown time',
  lastShutdownOilC: 'Oil temperature at shutdown',
  thermal: 'Thermal parameters',
};

export function AircraftForm({
  initial,
  shelters,
  pilots,
  classes,
  tempUnit,
  volumeUnit,
}: {
  initial?: AircraftRecord;
  shelters: ShelterChoice[];
  pilots: PilotChoice[];
  classes: EngineClassOption[];
  tempUnit: TempUnit;
  volumeUnit: VolumeUnit;
}) {
  const router = useRouter();
  const uid = useId();
  const editing = Boolean(initial);
  const classOf = (id: string) => classes.find((c) => c.id === id) ?? classes[0];
  const zoneOfShelter = (id: string) => shelters.find((g) => g.shelters.some((s) => String(s.id) === id))?.airfield.timeZone ?? 'UTC';

  const [draft, setDraft] = useState<Draft>(() => {
    const cls = classOf(initial?.engineClass ?? classes[0].id);
    const shelterId = initial?.shelter ? String(initial.shelter.id) : '';
    const zone = zoneOfShelter(shelterId);
    return {
      registration: initial?.registration ?? '',
      typeLabel: initial?.typeLabel ?? '',
      engineClass: cls.id,
      oil: initial ? show(toDisplayVolume(initial.oilQuantityL, volumeUnit), 2) : '',
      coverOnByDefault: initial?.coverOnByDefault ?? true,
      shelterId,
      heaters: initial ? initial.heaters.map(heaterDraft) : [],
      pilotIds: initial?.pilotIds ?? [],
      shutdownLocal: initial?.lastShutdownAt ? localIsoMinutes(zone, Date.parse(initial.lastShutdownAt)) : '',
      shutdownOil: initial?.lastShutdownOilC != null ? show(toDisplayTemp(initial.lastShutdownOilC, tempUnit), 1) : '',
      thermal: thermalDraft(initial?.thermal ?? cls.thermal),
    };
  });
  const [thermalState, setThermalState] = useState<'kept' | 'edited' | 'reset'>('kept');
  const [fields, setFields] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<FormResult | null>(null);
  const [pending, setPending] = useState(false);
  const summaryRef = useRef<HTMLDivElement>(null);

  const cls = classOf(draft.engineClass);
  const zone = zoneOfShelter(draft.shelterId);
  const zoneName = zone === 'UTC' ? 'UTC' : `${zone}, ${zoneLabel(zone, Date.now())}`;
  const source = thermalState === 'reset' ? 'preset' : thermalState === 'edited' ? 'manual' : (initial?.thermal.source ?? 'preset');

  const set = <K extends keyof Draft>(k: K, v: Draft[K]) => setDraft((d) => ({ ...d, [k]: v }));
  const err = (field: string) => fields[field];

  function changeClass(id: string) {
    const next = classOf(id);
    setDraft((d) => ({ ...d, engineClass: id, thermal: thermalState === 'edited' ? d.thermal : thermalDraft(next.thermal) }));
    if (thermalState !== 'edited' && editing) setThermalState('reset');
  }
  function setThermal(fn: (t: ThermalDraft) => ThermalDraft) {
    setDraft((d) => ({ ...d, thermal: fn(d.thermal) }));
    setThermalState('edited');
  }
  function resetThermal() {
    setDraft((d) => ({ ...d, thermal: thermalDraft(cls.thermal) }));
    setThermalState(editing ? 'reset' : 'kept');
  }
  function setHeater(i: number, patch: Partial<HeaterDraft>) {
    setDraft((d) => ({ ...d, heaters: d.heaters.map((h, j) => (j === i ? { ...h, ...patch } : h)) }));
  }

  function body() {
    let lastShutdownAt: string | null = null;
    const m = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})$/.exec(draft.shutdownLocal);
    if (m) lastShutdownAt = new Date(zonedTimeToUtc(zone, +m[1], +m[2], +m[3], +m[4], +m[5])).toISOString();
    const oil = convert(draft.oil, (v) => fromDisplayVolume(v, volumeUnit), 3);
    const b: Record<string, unknown> = {
      registration: draft.registration,
      typeLabel: draft.typeLabel,
      engineClass: draft.engineClass,
      oilQuantityL: oil ?? (editing ? cls.oilQuantityL : undefined),
      coverOnByDefault: draft.coverOnByDefault,
      shelterId: draft.shelterId === '' ? null : Number(draft.shelterId),
      heaters: draft.heaters.map((h) => ({ kind: h.kind, powerW: h.powerW, node: h.node, control: h.control, slotMinutes: h.slotMinutes })),
      pilotIds: draft.pilotIds,
      lastShutdownAt,
      lastShutdownOilC: convert(draft.shutdownOil, (v) => fromDisplayTemp(v, tempUnit), 2),
    };
    // Thermal parameters go only when touched (so a fitted profile stays fitted); null resets to the preset.
    if (thermalState === 'edited') b.thermal = thermalBody(draft.thermal);
    else if (thermalState === 'reset' && editing) b.thermal = null;
    return b;
  }

  async function onSubmit(e: React.FormEvent) {
    e.preventDefault();
    setPending(true);
    setMessage(null);
    const r = editing ? await sendJson<{ aircraft: AircraftRecord }>(`/api/aircraft/${initial!.id}`, 'PATCH', body()) : await sendJson<{ aircraft: AircraftRecord }>('/api/aircraft', 'POST', body());
    setPending(false);
    if (r.ok) {
      setFields({});
      setThermalState('kept');
      if (!editing) {
        router.push(`/aircraft/${r.data.aircraft.id}?added=1&tab=profile`);
        return;
      }
      setMessage({ tone: 'info', text: `Saved ${r.data.aircraft.registration}.` });
      router.refresh();
    } else {
      setFields(r.fields);
      setMessage({ tone: 'caution', text: r.message });
      requestAnimationFrame(() => summaryRef.current?.focus());
    }
  }

  const { confirm, dialog } = useConfirm();
  async function archive() {
    if (!initial) return;
    const ok = await confirm({
      title: `Archive ${initial.registration}?`,
      body: 'Its departures still to come are cancelled; its history stays.',
      confirmLabel: 'Archive aircraft',
    });
    if (!ok) return;
    setPending(true);
    const r = await sendJson<{ cancelledDepartures: number }>(`/api/aircraft/${initial.id}`, 'DELETE');
    setPending(false);
    if (r.ok) router.push('/aircraft');
    else setMessage({ tone: 'caution', text: r.message });
  }

  const fieldErrors = Object.entries(fields);
  const tau = useMemo(() => {
    const n = draft.thermal.nodes[0];
    const c = num(n.capacityKJ) * 1000;
    const g = num(n.loss);
    return Number.isFinite(c / g) && g > 0 ? c / g / 3600 : null;
  }, [draft.thermal]);

  return (
    <form onSubmit={onSubmit} noValidate aria-busy={pending} className="space-y-4">
      {dialog}
      <div ref={summaryRef} tabIndex={-1} className="outline-none">
        <ResultNotice
          result={message}
          failTitle="Not saved"
          errors={fieldErrors.map(([f, m]) => ({ key: f, label: LABELS[f.split('.')[0]] ?? f, message: m, href: `#${inputIdFor(f)}` }))}
        />
      </div>

      <div className="grid gap-4 lg:grid-cols-2">
        <Card aria-labelledby={`${uid}-id`}>
          <h2 id={`${uid}-id`} className="text-lg font-semibold">Aircraft</h2>
          <div className="mt-4 grid gap-4 sm:grid-cols-2">
            <TextField
              id="ac-registration"
              label="Registration"
              value={draft.registration}
              onChange={(e) => set('registration', e.target.value.toUpperCase())}
              error={err('registration')}
              hint="Capital letters and digits, hyphens inside."
              autoComplete="off"
              autoCapitalize="characters"
              spellCheck={false}
              maxLength={10}
            />
            <TextField id="ac-typeLabel" label="Type" value={draft.typeLabel} onChange={(e) => set('typeLabel', e.target.value)} error={err('typeLabel')} hint="E.g. four-seat high-wing." maxLength={80} />
            <div className="sm:col-span-2">
              <SelectField id="ac-engineClass" label="Engine class" value={draft.engineClass} onChange={(e) => changeClass(e.target.value)} error={err('engineClass')} hint={`Ready temperature ${fmtTemp(cls.readyC, tempUnit)}, typical oil at shutdown ${fmtTemp(cls.shutdownOilC, tempUnit)}.`}>
                {classes.map((c) => (
                  <option key={c.id} value={c.id}>{c.label}</option>
                ))}
              </SelectField>
            </div>
            <TextField
              id="ac-oilQuantityL"
              label={`Oil quantity (${volumeLabel(volumeUnit)})`}
              inputMode="decimal"
              value={draft.oil}
              placeholder={show(toDisplayVolume(cls.oilQuantityL, volumeUnit), 1)}
              onChange={(e) => set('oil', e.target.value)}
              error={err('oilQuantityL')}
              hint={`Empty: the class's ${show(toDisplayVolume(cls.oilQuantityL, volumeUnit), 1)} ${volumeLabel(volumeUnit)}.`}
            />
          </div>
        </Card>

        <Card aria-labelledby={`${uid}-home`}>
          <h2 id={`${uid}-home`} className="text-lg font-semibold">Home and cover</h2>
          <div className="mt-4 space-y-4">
            <SelectField id="ac-shelterId" label="Home shelter" value={draft.shelterId} onChange={(e) => set('shelterId', e.target.value)} error={err('shelterId')} hint="Where it spends the night: the forecast and the shelter's behaviour come from here.">
              <option value="">No home shelter yet</option>
              {shelters.map((g) => (
                <optgroup key={g.airfield.id} label={`${g.airfield.name} (${g.airfield.ident})`}>
                  {g.shelters.map((s) => (
                    <option key={s.id} value={s.id}>
                      {s.name} — {SHELTER_KIND_LABEL[s.kind]}
                    </option>
                  ))}
                </optgroup>
              ))}
            </SelectField>
            <label className="flex min-h-11 items-start gap-3 rounded-xl border border-slate-200 p-3 dark:border-slate-700">
              <input id="ac-coverOnByDefault" type="checkbox" className="mt-0.5 h-5 w-5 accent-ice-700" checked={draft.coverOnByDefault} onChange={(e) => set('coverOnByDefault', e.target.checked)} />
              <span>
                <span className="block text-sm font-medium text-slate-800 dark:text-slate-200">Cover on by default</span>
                <span className="block text-xs text-slate-500 dark:text-slate-400">An insulated engine cover is fitted overnight; it slows the cool-down.</span>
              </span>
            </label>
          </div>
        </Card>
      </div>

      <Card aria-labelledby={`${uid}-heat`}>
        <div className="flex flex-wrap items-center justify-between gap-2">
          <h2 id={`${uid}-heat`} className="text-lg font-semibold">Heaters</h2>
          <div className="flex flex-wrap gap-2">
            <Button
              type="button"
              variant="secondary"
              onClick={() => set('heaters', cls.heaters.map((h) => heaterDraft({ ...h, control: 'relay' })))}
            >
              Use the class's usual heaters
            </Button>
            <Button
              type="button"
              variant="secondary"
              disabled={draft.heaters.length >= 6}
              onClick={() => set('heaters', [...draft.heaters, heaterDraft({ kind: 'oil-pad', powerW: HEATER_KINDS['oil-pad'].typicalPowerW, node: 'oil' })])}
            >
              Add a heater
            </Button>
          </div>
        </div>
        {err('heaters') ? <p className="mt-2 text-sm font-medium text-red-700 dark:text-red-300">{err('heaters')}</p> : null}
        {draft.heaters.length === 0 ? (
          <p className="mt-3 text-sm text-slate-600 dark:text-slate-400">
            No heater fitted. Thawline will still forecast the oil, but cannot plan preheat for this aircraft.
          </p>
        ) : (
          <ol className="mt-4 space-y-3">
            {draft.heaters.map((h, i) => (
              <li key={h.key}>
                <fieldset className="rounded-xl border border-slate-200 p-3 dark:border-slate-700">
                  <legend className="px-1 text-sm font-semibold text-ember-700 dark:text-ember-300">Heater {i + 1}</legend>
                  <div className="grid grid-cols-2 gap-3 lg:grid-cols-[1.4fr_0.8fr_0.9fr_1.1fr_0.7fr_auto] lg:items-start">
                    <div className="col-span-2 lg:col-span-1">
                    <SelectField
                      id={`ac-heater-${i}-kind`}
                      label="Kind"
                      value={h.kind}
                      error={err(`heaters.${i}.kind`)}
                      onChange={(e) => {
                        const kind = e.target.value as HeaterKind;
                        setHeater(i, { kind, node: HEATER_KINDS[kind].node, powerW: String(HEATER_KINDS[kind].typicalPowerW) });
                      }}
                    >
                      {HEATER_KIND_IDS.map((k) => (
                        <option key={k} value={k}>{HEATER_KINDS[k].label}</option>
                      ))}
                    </SelectField>
                    </div>
                    <TextField id={`ac-heater-${i}-powerW`} label="Power (W)" inputMode="numeric" value={h.powerW} onChange={(e) => setHeater(i, { powerW: e.target.value })} error={err(`heaters.${i}.powerW`)} />
                    <SelectField id={`ac-heater-${i}-node`} label="Heats" value={h.node} onChange={(e) => setHeater(i, { node: e.target.value as Node })} error={err(`heaters.${i}.node`)}>
                      <option value="oil">The oil</option>
                      <option value="engine">The engine</option>
                    </SelectField>
                    <div className="col-span-2 lg:col-span-1">
                    <SelectField
                      id={`ac-heater-${i}-control`}
                      label="Switched by"
                      value={h.control}
                      onChange={(e) => setHeater(i, { control: e.target.value as HeaterControl })}
                      error={err(`heaters.${i}.control`)}
                      hint={HEATER_CONTROL_HINT[h.control]}
                    >
                      {HEATER_CONTROLS.map((c) => (
                        <option key={c} value={c}>{HEATER_CONTROL_LABEL[c]}</option>
                      ))}
                    </SelectField>
                    </div>
                    <TextField id={`ac-heater-${i}-slotMinutes`} label="Step (min)" inputMode="numeric" placeholder="auto" value={h.slotMinutes} onChange={(e) => setHeater(i, { slotMinutes: e.target.value })} error={err(`heaters.${i}.slotMinutes`)} />
                    <div className="self-end lg:self-start lg:pt-6">
                      <Button type="button" variant="ghost" className="w-full text-red-700 dark:text-red-300" onClick={() => set('heaters', draft.heaters.filter((_, j) => j !== i))}>
                        Remove<span className="sr-only"> heater {i + 1}</span>
                      </Button>
                    </div>
                  </div>
                </fieldset>
              </li>
            ))}
          </ol>
        )}
        {draft.heaters.length ? (
          <p className="mt-3 text-sm text-slate-600 dark:text-slate-400">
            Total {fmtPower(draft.heaters.reduce((s, h) => s + (Number.isFinite(num(h.powerW)) ? num(h.powerW) : 0), 0))}. Keep heaters and cords away from fuel and fabric;
            never leave a combustion heater unattended.
          </p>
        ) : null}
      </Card>

      <div className="grid gap-4 lg:grid-cols-2">
        <Card aria-labelledby={`${uid}-pilots`}>
          <fieldset aria-describedby={err('pilotIds') ? 'ac-pilotIds-error' : undefined}>
            <legend id={`${uid}-pilots`} className="text-lg font-semibold">Pilots who may book</legend>
            <p className="text-sm text-slate-600 dark:text-slate-400">Operators and managers can book any aircraft.</p>
            {pilots.length === 0 ? (
              <p className="mt-3 text-sm text-slate-600">Your organization has no pilots yet.</p>
            ) : (
              <>
                <div className="mt-2 flex gap-2">
                  <button type="button" id="ac-pilotIds" className="min-h-11 rounded-lg px-2 text-sm font-semibold text-ice-700 hover:bg-ice-50 dark:text-ice-300 dark:hover:bg-slate-800" onClick={() => set('pilotIds', pilots.map((p) => p.id))}>
                    Select all
                  </button>
                  <button type="button" className="min-h-11 rounded-lg px-2 text-sm font-semibold text-ice-700 hover:bg-ice-50 dark:text-ice-300 dark:hover:bg-slate-800" onClick={() => set('pilotIds', [])}>
                    Clear
                  </button>
                </div>
                <ul className="mt-1 grid gap-1 sm:grid-cols-2">
                  {pilots.map((p) => (
                    <li key={p.id}>
                      <label className="flex min-h-11 items-center gap-3 rounded-lg px-2 hover:bg-slate-50 dark:hover:bg-slate-800/60">
                        <input
                          type="checkbox"
                          className="h-5 w-5 accent-ice-700"
                          checked={draft.pilotIds.includes(p.id)}
                          onChange={(e) => set('pilotIds', e.target.checked ? [...draft.pilotIds, p.id] : draft.pilotIds.filter((x) => x !== p.id))}
                        />
                        <span className="text-sm">
                          <span className="font-medium text-slate-900 dark:text-white">{p.name}</span>
                          <span className="block text-xs text-slate-500">{p.email}</span>
                        </span>
                      </label>
                    </li>
                  ))}
                </ul>
              </>
            )}
            {err('pilotIds') ? (
              <p id="ac-pilotIds-error" className="mt-2 text-sm font-medium text-red-700 dark:text-red-300">
                {err('pilotIds')}
              </p>
            ) : null}
          </fieldset>
        </Card>

        <Card aria-labelledby={`${uid}-shut`}>
          <h2 id={`${uid}-shut`} className="text-lg font-semibold">Last shutdown</h2>
          <p className="text-sm text-slate-600 dark:text-slate-400">The cool-down starts here. Leave empty to use the class's typical values.</p>
          <div className="mt-4 grid gap-4 sm:grid-cols-2">
            <TextField
              id="ac-lastShutdownAt"
              label="Time"
              type="datetime-local"
              value={draft.shutdownLocal}
              onChange={(e) => set('shutdownLocal', e.target.value)}
              error={err('lastShutdownAt')}
              hint={`Local time at the home airfield (${zoneName}).`}
            />
            <TextField
              id="ac-lastShutdownOilC"
              label={`Oil temperature (${tempLabel(tempUnit)})`}
              inputMode="decimal"
              value={draft.shutdownOil}
              placeholder={show(toDisplayTemp(cls.shutdownOilC, tempUnit), 0)}
              onChange={(e) => set('shutdownOil', e.target.value)}
              error={err('lastShutdownOilC')}
              hint={`Empty: typical ${fmtTemp(cls.shutdownOilC, tempUnit)} for the class.`}
            />
          </div>
        </Card>
      </div>

      <Card>
        <details className="group" open={thermalState === 'edited' || fieldErrors.some(([f]) => f.startsWith('thermal'))}>
          <summary className="flex min-h-11 cursor-pointer list-none items-center justify-between gap-2 text-lg font-semibold [&::-webkit-details-marker]:hidden">
            <span className="inline-flex items-center gap-2">
              <svg viewBox="0 0 20 20" className="h-4 w-4 text-slate-500 transition-transform group-open:rotate-90" fill="currentColor" aria-hidden="true">
                <path d="M7 4l7 6-7 6z" />
              </svg>
              Thermal parameters <span className="text-sm font-normal text-slate-500">(advanced)</span>
            </span>
            <span className={`whitespace-nowrap rounded-full px-2.5 py-1 text-xs font-semibold ${source === 'fitted' ? 'bg-ice-100 text-ice-900 dark:bg-ice-900 dark:text-ice-100' : source === 'manual' ? 'bg-amber-100 text-amber-900 dark:bg-amber-950 dark:text-amber-100' : 'bg-slate-100 text-slate-700 dark:bg-slate-800 dark:text-slate-300'}`}>
              {source === 'fitted' ? 'Fitted from a log' : source === 'manual' ? 'Entered by hand' : 'Class preset'}
            </span>
          </summary>
          <p className="mt-2 text-sm text-slate-600 dark:text-slate-400">
            Estimated from the engine class. Change them only if you know better values; a fit from a cool-down log is more reliable.
            {tau !== null ? ` Oil node alone, uncovered: C/G ≈ ${tau.toFixed(1)} h.` : ''}
          </p>
          <div className="mt-4 grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
            {draft.thermal.nodes.map((n, i) => (
              <div key={n.name} className="contents">
                <TextField
                  id={`ac-thermal-${i}-capacity`}
                  label={`${n.name === 'oil' ? 'Oil' : 'Engine'} heat capacity (kJ/K)`}
                  inputMode="decimal"
                  value={n.capacityKJ}
                  onChange={(e) => setThermal((t) => ({ ...t, nodes: t.nodes.map((x, j) => (j === i ? { ...x, capacityKJ: e.target.value } : x)) }))}
                  error={err(`thermal.nodes.${i}.heatCapacityJPerK`)}
                />
                <TextField
                  id={`ac-thermal-${i}-loss`}
                  label={`${n.name === 'oil' ? 'Oil' : 'Engine'} heat loss (W/K)`}
                  inputMode="decimal"
                  value={n.loss}
                  onChange={(e) => setThermal((t) => ({ ...t, nodes: t.nodes.map((x, j) => (j === i ? { ...x, loss: e.target.value } : x)) }))}
                  error={err(`thermal.nodes.${i}.lossWPerK`)}
                />
              </div>
            ))}
            {draft.thermal.nodes.length > 1 ? (
              <TextField id="ac-thermal-couplingWPerK" label="Oil–engine coupling (W/K)" inputMode="decimal" value={draft.thermal.coupling} onChange={(e) => setThermal((t) => ({ ...t, coupling: e.target.value }))} error={err('thermal.couplingWPerK')} />
            ) : null}
            <TextField id="ac-thermal-coverFactor" label="Cover factor" inputMode="decimal" value={draft.thermal.cover} onChange={(e) => setThermal((t) => ({ ...t, cover: e.target.value }))} error={err('thermal.coverFactor')} hint="Losses × this with the cover on (0–1)." />
            <TextField id="ac-thermal-windCoefficient" label="Wind coefficient" inputMode="decimal" value={draft.thermal.wind} placeholder="default" onChange={(e) => setThermal((t) => ({ ...t, wind: e.target.value }))} error={err('thermal.windCoefficient')} hint="On a tie-down: losses × (1 + k·√wind)." />
          </div>
          <Button type="button" variant="secondary" className="mt-4" onClick={resetThermal}>
            Use the class preset
          </Button>
        </details>
      </Card>

      <div className="flex flex-col-reverse gap-3 sm:flex-row sm:items-center sm:justify-between">
        {editing ? (
          <Button type="button" variant="danger" onClick={archive} disabled={pending}>
            Archive aircraft
          </Button>
        ) : (
          <span />
        )}
        <div className="flex flex-col gap-3 sm:flex-row">
          <Button type="button" variant="secondary" onClick={() => router.push('/aircraft')}>
            {editing ? 'Back to the fleet' : 'Cancel'}
          </Button>
          <Button type="submit" disabled={pending}>
            {pending ? 'Saving…' : editing ? 'Save changes' : 'Add aircraft'}
          </Button>
        </div>
      </div>
    </form>
  );
}

