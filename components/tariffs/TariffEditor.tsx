'use client';
import { useMemo, useState } from 'react';
import { Button, Card, Notice } from '@/components/ui/primitives';
import { ResultNotice, type FormResult } from '@/components/ui/ResultNotice';
import { SelectField, TextField } from '@/components/ui/Field';
import { sendJson } from '@/lib/client/fetcher';
import { localDateOf } from '@/lib/time';
import type { TariffRecord } from '@/lib/views/tariffs';
import { HOURS, MAX_PERIODS, MONTH_NAMES, MONTHS } from '@/lib/validation/tariffs';

type DayKind = 'weekday' | 'weekend';
type Month = 'all' | number;

// Cheaper periods are drawn cold, dearer ones warm; the period's initial is printed in each hour too,
// so the schedule reads without colour.
const SWATCHES = [
  'bg-ice-200 text-ice-950 dark:bg-ice-800 dark:text-ice-50',
  'bg-ice-50 text-ice-900 dark:bg-ice-950 dark:text-ice-100',
  'bg-slate-200 text-slate-900 dark:bg-slate-700 dark:text-slate-50',
  'bg-amber-100 text-amber-950 dark:bg-amber-900 dark:text-amber-50',
  'bg-ember-100 text-ember-900 dark:bg-ember-900 dark:text-ember-50',
  'bg-ember-200 text-ember-900 dark:bg-ember-800 dark:text-ember-50',
  'bg-ember-300 text-ember-950 dark:bg-ember-700 dark:text-white',
  'bg-ember-500 text-white dark:bg-ember-600',
];

const num = (s: string) => Number(s.trim().replace(',', '.'));
const hh = (h: number) => String(h).padStart(2, '0');

/** Hour ranges of each period in a 24-hour row: "22–07, 12–13". */
function ranges(row: (number | null)[], p: number): string {
  const out: string[] = [];
  // Start where the period does not run, so a night across midnight reads as one range.
  const start = row.findIndex((x) => x !== p);
  if (start === -1) return 'all day';
  for (let k = 0; k < HOURS; k++) {
    const h = (start + k) % HOURS;
    if (row[h] === p && row[(h + HOURS - 1) % HOURS] !== p) {
      let e = h;
      while (row[(e + 1) % HOURS] === p && (e + 1) % HOURS !== h) e = (e + 1) % HOURS;
      out.push(`${hh(h)}–${hh((e + 1) % HOURS)}`);
    }
  }
  return out.join(', ');
}

export function TariffEditor({ initial, canEdit }: { initial: TariffRecord; canEdit: boolean }) {
  const [currency, setCurrency] = useState(initial.currency);
  const [periods, setPeriods] = useState(initial.periods.map((p) => ({ name: p.name, price: String(p.pricePerKWh) })));
  const [sched, setSched] = useState<Record<DayKind, number[][]>>({ weekday: structuredClone(initial.weekdaySchedule), weekend: structuredClone(initial.weekendSchedule) });
  const [month, setMonth] = useState<Month>(() => (initial.weekdaySchedule.every((r) => r.join() === initial.weekdaySchedule[0].join()) && initial.weekendSchedule.every((r) => r.join() === initial.weekendSchedule[0].join()) ? 'all' : localDateOf(initial.timeZone, Date.now()).month - 1));
  const [brush, setBrush] = useState(0);
  const [fields, setFields] = useState<Record<string, string>>({});
  const [result, setResult] = useState<FormResult | null>(null);
  const [pending, setPending] = useState(false);
  const [source, setSource] = useState(initial.source);

  // Colour by price rank.
  const swatchOf = useMemo(() => {
    const prices = periods.map((p, i) => ({ i, v: Number.isFinite(num(p.price)) ? num(p.price) : Infinity }));
    const order = [...prices].sort((a, b) => a.v - b.v).map((x) => x.i);
    const n = periods.length;
    // Two or three periods read best as cold / neutral / warm; more spread along the whole scale.
    const picks: Record<number, number[]> = { 1: [1], 2: [0, 6], 3: [0, 2, 7] };
    return (i: number) => SWATCHES[picks[n]?.[order.indexOf(i)] ?? Math.round((order.indexOf(i) / (n - 1)) * (SWATCHES.length - 1))];
  }, [periods]);

  /** The row shown: the month's, or for "all months" the common value per hour (null where months differ). */
  const rowOf = (kind: DayKind): (number | null)[] =>
    month === 'all' ? Array.from({ length: HOURS }, (_, h) => (sched[kind].every((r) => r[h] === sched[kind][0][h]) ? sched[kind][0][h] : null)) : sched[kind][month];

  function paint(kind: DayKind, h: number) {
    setSched((s) => ({ ...s, [kind]: s[kind].map((r, m) => (month === 'all' || m === month ? r.map((p, j) => (j === h ? brush : p)) : r)) }));
  }
  function addPeriod() {
    setPeriods((p) => [...p, { name: `Period ${p.length + 1}`, price: '' }]);
    setBrush(periods.length);
  }
  function removePeriod(i: number) {
    // Its hours go to the first remaining period.
    const fix = (m: number[][]) => m.map((r) => r.map((p) => (p === i ? 0 : p > i ? p - 1 : p)));
    setSched((s) => ({ weekday: fix(s.weekday), weekend: fix(s.weekend) }));
    setPeriods((p) => p.filter((_, j) => j !== i));
    setBrush(0);
  }
  function makeFlat() {
    setPeriods((p) => [{ name: 'Flat', price: p[0]?.price ?? '0.20' }]);
    const zero = Array.from({ length: MONTHS }, () => Array(HOURS).fill(0));
    setSched({ weekday: zero, weekend: structuredClone(zero) });
    setBrush(0);
  }

  async function save(e: React.FormEvent) {
    e.preventDefault();
    setPending(true);
    setResult(null);
    const body = {
      currency,
      periods: periods.map((p) => ({ name: p.name, pricePerKWh: p.price })),
      weekdaySchedule: sched.weekday,
      weekendSchedule: sched.weekend,
    };
    const r = await sendJson<{ tariff: TariffRecord }>(`/api/airfields/${initial.airfieldId}/tariff`, 'PUT', body);
    setPending(false);
    if (r.ok) {
      setFields({});
      setSource('stored');
      setResult({ tone: 'info', text: 'Tariff saved. New Heat plans use it.' });
    } else {
      setFields(r.fields);
      setResult({ tone: 'caution', text: r.message });
    }
  }

  const errorList = Object.entries(fields).filter(([f]) => !/^periods\.\d+\.(name|pricePerKWh)$/.test(f) && f !== 'currency');

  return (
    <form onSubmit={save} noValidate aria-busy={pending} className="space-y-4">
      {source === 'default' ? (
        <Notice title="No tariff stored yet">
          Heat plans for this airfield use a flat default price of {initial.periods[0].pricePerKWh.toFixed(2)} {initial.currency}/kWh until a tariff is saved.
        </Notice>
      ) : null}

      <Card aria-labelledby="periods-h">
        <div className="flex flex-wrap items-center justify-between gap-2">
          <h2 id="periods-h" className="text-lg font-semibold">Periods and prices</h2>
          {canEdit ? (
            <div className="flex flex-wrap gap-2">
              <Button type="button" variant="secondary" onClick={addPeriod} disabled={periods.length >= MAX_PERIODS}>
                Add a period
              </Button>
              <Button type="button" variant="secondary" onClick={makeFlat}>
                Make it a flat price
              </Button>
            </div>
          ) : null}
        </div>
        <div className="mt-4 max-w-[10rem]">
          <TextField id="tariff-currency" label="Currency" value={currency} onChange={(e) => setCurrency(e.target.value.toUpperCase())} error={fields.currency} readOnly={!canEdit} maxLength={3} autoCapitalize="characters" />
        </div>
        <fieldset className="mt-4">
          <legend className="text-sm font-medium text-slate-800 dark:text-slate-200">{canEdit ? 'Choose a period to paint hours with' : 'Periods'}</legend>
          <ul className="mt-2 space-y-2">
            {periods.map((p, i) => (
              <li key={i} className={`grid grid-cols-[auto_1fr_6.5rem] items-end gap-3 rounded-xl border p-3 sm:grid-cols-[auto_1fr_10rem_auto] ${brush === i && canEdit ? 'border-ice-500 ring-2 ring-ice-200 dark:ring-ice-800' : 'border-slate-200 dark:border-slate-700'}`}>
                <label className="flex min-h-11 items-center gap-2 text-sm font-medium">
                  <input type="radio" name="brush" className="h-5 w-5 accent-ice-700" checked={brush === i} onChange={() => setBrush(i)} disabled={!canEdit} />
                  <span className={`inline-flex h-8 w-8 items-center justify-center rounded-lg text-xs font-bold ${swatchOf(i)}`} aria-hidden="true">
                    {p.name.slice(0, 1).toUpperCase() || '?'}
                  </span>
                  <span className="sr-only">Paint with {p.name || `period ${i + 1}`}</span>
                </label>
                <TextField id={`tariff-period-${i}-name`} label="Name" value={p.name} readOnly={!canEdit} error={fields[`periods.${i}.name`]} onChange={(e) => setPeriods((ps) => ps.map((x, j) => (j === i ? { ...x, name: e.target.value } : x)))} />
                <TextField id={`tariff-period-${i}-price`} label={`Price (${currency || '—'}/kWh)`} inputMode="decimal" value={p.price} readOnly={!canEdit} error={fields[`periods.${i}.pricePerKWh`]} onChange={(e) => setPeriods((ps) => ps.map((x, j) => (j === i ? { ...x, price: e.target.value } : x)))} />
                {canEdit && periods.length > 1 ? (
                  <Button type="button" variant="ghost" className="col-span-3 justify-self-end text-red-700 dark:text-red-300 sm:col-span-1" onClick={() => removePeriod(i)}>
                    Remove<span className="sr-only"> {p.name}</span>
                  </Button>
                ) : (
                  <span className="hidden sm:block" />
                )}
              </li>
            ))}
          </ul>
        </fieldset>
      </Card>

      <Card aria-labelledby="hours-h">
        <div className="flex flex-wrap items-end justify-between gap-3">
          <div>
            <h2 id="hours-h" className="text-lg font-semibold">Hours</h2>
            <p className="text-sm text-slate-600 dark:text-slate-400">
              Local hours at {initial.airfieldName} ({initial.timeZone}); a daylight-saving change is handled by the clock, not here.
              {canEdit ? ' Select hours to give them the chosen period.' : ''}
            </p>
          </div>
          <div className="w-48">
            <SelectField id="tariff-month" label="Months" value={String(month)} onChange={(e) => setMonth(e.target.value === 'all' ? 'all' : Number(e.target.value))}>
              <option value="all">All months</option>
              {MONTH_NAMES.map((m, i) => (
                <option key={m} value={i}>{m}</option>
              ))}
            </SelectField>
          </div>
        </div>
        {(['weekday', 'weekend'] as const).map((kind) => {
          const row = rowOf(kind);
          return (
            <div key={kind} className="mt-5">
              <h3 className="text-sm font-semibold text-slate-800 dark:text-slate-200">{kind === 'weekday' ? 'Monday to Friday' : 'Saturday and Sunday'}</h3>
              <div className="mt-2 grid grid-cols-6 gap-1 sm:grid-cols-12 xl:grid-cols-24" role="group" aria-label={kind === 'weekday' ? 'Weekday hours' : 'Weekend hours'}>
                {row.map((p, h) => {
                  const name = p === null ? 'months differ' : (periods[p]?.name ?? '?');
                  const cell = `flex min-h-11 flex-col items-center justify-center rounded-lg text-xs tabular-nums ${p === null ? 'bg-[repeating-linear-gradient(45deg,var(--color-slate-100),var(--color-slate-100)_4px,var(--color-slate-300)_4px,var(--color-slate-300)_8px)] text-slate-700 dark:text-slate-900' : swatchOf(p)}`;
                  const inner = (
                    <>
                      <span className="font-semibold">{hh(h)}</span>
                      <span className="text-[0.65rem] leading-none opacity-80" aria-hidden="true">{p === null ? '·' : name.slice(0, 1).toUpperCase()}</span>
                    </>
                  );
                  return canEdit ? (
                    <button
                      key={h}
                      type="button"
                      className={`${cell} outline-offset-2 hover:ring-2 hover:ring-ice-400 focus-visible:ring-2 focus-visible:ring-ice-500`}
                      aria-label={`${hh(h)}:00 to ${hh((h + 1) % 24)}:00: ${name}. Set to ${periods[brush]?.name ?? ''}`}
                      onClick={() => paint(kind, h)}
                    >
                      {inner}
                    </button>
                  ) : (
                    <span key={h} className={cell} title={name}>
                      {inner}
                      <span className="sr-only">: {name}</span>
                    </span>
                  );
                })}
              </div>
              <ul className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-xs text-slate-600 dark:text-slate-400">
                {periods.map((pp, i) =>
                  row.includes(i) ? (
                    <li key={i}>
                      <span className="font-semibold text-slate-800 dark:text-slate-200">{pp.name}</span> {ranges(row, i)}
                    </li>
                  ) : null,
                )}
                {row.includes(null) ? <li>Striped hours differ between months: choose a month to see them.</li> : null}
              </ul>
            </div>
          );
        })}
      </Card>

      {canEdit ? (
        <div className="flex flex-col gap-3 sm:flex-row sm:items-center sm:justify-end">
          <Button type="submit" disabled={pending}>
            {pending ? 'Saving…' : 'Save tariff'}
          </Button>
        </div>
      ) : null}
      <ResultNotice result={result} okTitle="Saved" failTitle="Not saved" errors={errorList.map(([f, m]) => ({ key: f, message: m }))} />
    </form>
  );
}
