'use client';
// A stored log's fit: the fit over the data with its residuals, the figures (τ, G, RMSE, R², each
// parameter's uncertainty), the window and options to fit again, and applying the fit to the profile.
import { useMemo, useState } from 'react';
import { Button, Card } from '@/components/ui/primitives';
import { TextField } from '@/components/ui/Field';
import { CooldownChart, type ModelCurve } from '@/components/charts/CooldownChart';
import { sendJson } from '@/lib/client/fetcher';
import { formatDateTime, formatDayTime } from '@/lib/time';
import { tempLabel, toDisplayDelta, toDisplayTemp, type TempUnit } from '@/lib/units';
import type { LogRecord, SeriesForChart, StoredFit } from '@/lib/views/logs';
import type { Estimate } from '@/lib/fit/cooldown';
import { fmtEstimate, fmtKJ, fmtRelative } from './format';
import { StatusArea } from '@/components/ui/StatusArea';

interface Props {
  aircraftId: number;
  log: LogRecord;
  series: SeriesForChart;
  suggestion: { startMs: number; endMs: number } | null;
  fit: StoredFit | null;
  zone: string;
  tempUnit: TempUnit;
  capacity: { total: number; oilShare: number } | null;
  onFitted: (fit: StoredFit, log: LogRecord) => void;
  onApplied: () => void;
}

const MIN = 60_000;

export function FitResults({ aircraftId, log, series, suggestion, fit, zone, tempUnit, capacity, onFitted, onApplied }: Props) {
  const t0 = series.tMs[0];
  const t1 = series.tMs[series.tMs.length - 1];
  const initial = fit?.window ?? log.window ?? suggestion ?? { startMs: t0, endMs: t1 };
  const [win, setWin] = useState({ startMs: initial.startMs, endMs: initial.endMs });
  const [coverOn, setCoverOn] = useState(fit?.coverOn ?? log.coverOn);
  const [twoNode, setTwoNode] = useState(true);
  const [kj, setKj] = useState(String(Math.round((fit?.heatCapacityJPerK ?? capacity?.total ?? 0) / 100) / 10));
  const [fields, setFields] = useState<Record<string, string>>({});
  const [pending, setPending] = useState<'' | 'fit' | 'one-node' | 'two-node'>('');
  const [status, setStatus] = useState('');
  const [error, setError] = useState('');
  const span = Math.max(1, Math.round((t1 - t0) / MIN));

  async function refit() {
    setPending('fit');
    setError('');
    setFields({});
    const body: Record<string, unknown> = { window: { start: new Date(win.startMs).toISOString(), end: new Date(win.endMs).toISOString() }, coverOn, twoNode };
    if (kj.trim()) body.heatCapacityJPerK = Number(kj.replace(',', '.')) * 1000;
    const r = await sendJson<{ fit: StoredFit; log: LogRecord }>(`/api/aircraft/${aircraftId}/logs/${log.id}/fit`, 'POST', body);
    setPending('');
    if (r.ok) {
      onFitted(r.data.fit, r.data.log);
      setStatus('Fitted.');
    } else {
      setFields(r.fields);
      setError(r.fields.window ?? r.fields['window.start'] ?? r.fields['window.end'] ?? r.message);
    }
  }

  async function apply(model: 'one-node' | 'two-node') {
    setPending(model);
    setError('');
    const r = await sendJson(`/api/aircraft/${aircraftId}/profile/apply`, 'POST', { logId: log.id, model });
    setPending('');
    if (r.ok) {
      setStatus(`Applied the ${model} fit to the profile. The profile before it is kept in the history: restore it there if needed.`);
      onApplied();
    } else setError(r.message);
  }

  const models = useMemo<ModelCurve[]>(() => {
    if (!fit) return [];
    const m: ModelCurve[] = [{ id: 'one', label: 'One-node', values: fit.chart.oneNodeC, primary: fit.recommended === 'one-node' }];
    if (fit.chart.twoNodeC && fit.twoNode?.supported) m.push({ id: 'two', label: 'Two-node', values: fit.chart.twoNodeC, primary: fit.recommended === 'two-node' });
    return m;
  }, [fit]);

  const delta = tempUnit === 'F' ? '°F' : 'K';
  const d = (k: number, digits = 2) => `${toDisplayDelta(k, tempUnit).toFixed(digits)} ${delta}`;
  const temp = (e: Estimate) => fmtEstimate({ value: toDisplayTemp(e.value, tempUnit), sigma: toDisplayDelta(e.sigma, tempUnit) }, 1) + ` ${tempLabel(tempUnit)}`;
  const offset = (e: Estimate) => fmtEstimate({ value: toDisplayDelta(e.value, tempUnit), sigma: toDisplayDelta(e.sigma, tempUnit) }, 2) + ` ${delta}`;
  const one = fit?.oneNode;
  const two = fit?.twoNode;

  return (
    <Card aria-labelledby="fit-h">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div>
          <h2 id="fit-h" className="text-lg font-semibold">Fit: {log.fileName}</h2>
          <p className="text-sm text-slate-600 dark:text-slate-400">
            {log.rowCount.toLocaleString('en-GB')} rows, uploaded {formatDateTime(Date.parse(log.uploadedAt), zone)}
            {log.uploadedBy ? ` by ${log.uploadedBy.name}` : ''}
          </p>
        </div>
        {fit ? (
          <span className="rounded-full bg-ice-100 px-3 py-1 text-xs font-semibold text-ice-900 dark:bg-ice-900 dark:text-ice-100">
            Recommended: {fit.recommended === 'two-node' ? 'two nodes' : 'one node'}
          </span>
        ) : null}
      </div>

      <div className="mt-4">
        <CooldownChart
          tMs={fit ? fit.chart.tMs : series.tMs}
          oilC={fit ? fit.chart.oilC : series.oilC}
          ambientC={fit ? fit.chart.ambientC : series.ambientC}
          models={models}
          window={fit ? null : win}
          points={fit ? 'dots' : 'line'}
          unit={tempUnit}
          zone={zone}
          label={fit ? 'The fit over the logged cool-down, with residuals' : 'The stored log'}
        />
      </div>

      {fit && one ? (
        <div className="mt-5 grid gap-4 lg:grid-cols-2">
          <section aria-labelledby="fit-one-h" className="rounded-xl border border-slate-200 p-3 dark:border-slate-800">
            <h3 id="fit-one-h" className="font-semibold">One node (oil and engine together)</h3>
            <table className="mt-2 w-full text-sm">
              <caption className="sr-only">One-node fit: value ± one standard error</caption>
              <tbody className="[&_td]:py-1 [&_td]:whitespace-nowrap [&_th]:py-1 [&_th]:pr-3 [&_th]:text-left [&_th]:font-normal [&_th]:text-slate-600 dark:[&_th]:text-slate-400">
                <tr>
                  <th scope="row">Time constant τ</th>
                  <td className="tabular-nums font-semibold">{fmtEstimate(one.tauH)} h</td>
                  <td className="hidden pl-2 text-right text-xs text-slate-500 sm:table-cell">{fmtRelative(one.tauH)}</td>
                </tr>
                <tr>
                  <th scope="row">Heat loss G = C/τ{fit.coverOn ? ' (cover on)' : ''}</th>
                  <td className="tabular-nums font-semibold">{fmtEstimate(one.lossWPerK)} W/K</td>
                  <td className="hidden pl-2 text-right text-xs text-slate-500 sm:table-cell">{fmtRelative(one.lossWPerK)}</td>
                </tr>
                <tr>
                  <th scope="row">{fit.surroundings === 'logged' ? 'Surroundings vs logged ambient' : 'Surroundings (constant)'}</th>
                  <td className="tabular-nums">{fit.surroundings === 'logged' ? offset(one.level) : temp(one.level)}</td>
                  <td />
                </tr>
                <tr>
                  <th scope="row">Oil at the window start</th>
                  <td className="tabular-nums">{temp(one.startC)}</td>
                  <td />
                </tr>
                <tr>
                  <th scope="row">RMSE · R²</th>
                  <td className="tabular-nums">
                    {d(one.rmseK)} · {one.r2.toFixed(4)}
                  </td>
                  <td />
                </tr>
              </tbody>
            </table>
            <Button className="mt-3 w-full sm:w-auto" onClick={() => apply('one-node')} disabled={pending !== ''}>
              {pending === 'one-node' ? 'Applying…' : 'Apply one-node fit'}
            </Button>
          </section>
          <section aria-labelledby="fit-two-h" className="rounded-xl border border-slate-200 p-3 dark:border-slate-800">
            <h3 id="fit-two-h" className="font-semibold">Two nodes (oil; engine mass)</h3>
            {two?.oilLossWPerK ? (
              <table className="mt-2 w-full text-sm">
                <caption className="sr-only">Two-node fit: value ± one standard error</caption>
                <tbody className="[&_td]:py-1 [&_td]:whitespace-nowrap [&_th]:py-1 [&_th]:pr-3 [&_th]:text-left [&_th]:font-normal [&_th]:text-slate-600 dark:[&_th]:text-slate-400">
                  <tr>
                    <th scope="row">Oil loss</th>
                    <td className="tabular-nums font-semibold">{fmtEstimate(two.oilLossWPerK)} W/K</td>
                    <td className="hidden pl-2 text-right text-xs text-slate-500 sm:table-cell">{fmtRelative(two.oilLossWPerK)}</td>
                  </tr>
                  <tr>
                    <th scope="row">Engine loss</th>
                    <td className="tabular-nums font-semibold">{fmtEstimate(two.engineLossWPerK!)} W/K</td>
                    <td className="hidden pl-2 text-right text-xs text-slate-500 sm:table-cell">{fmtRelative(two.engineLossWPerK!)}</td>
                  </tr>
                  <tr>
                    <th scope="row">Oil–engine coupling</th>
                    <td className="tabular-nums font-semibold">{fmtEstimate(two.couplingWPerK!)} W/K</td>
                    <td className="hidden pl-2 text-right text-xs text-slate-500 sm:table-cell">{fmtRelative(two.couplingWPerK!)}</td>
                  </tr>
                  <tr>
                    <th scope="row">τ fast · slow</th>
                    <td className="tabular-nums">
                      {two.tauFastH!.toFixed(2)} h · {two.tauSlowH!.toFixed(2)} h
                    </td>
                    <td />
                  </tr>
                  <tr>
                    <th scope="row">RMSE · R²</th>
                    <td className="tabular-nums">
                      {d(two.rmseK!)} · {two.r2!.toFixed(4)}
                    </td>
                    <td />
                  </tr>
                </tbody>
              </table>
            ) : null}
            <p className={`mt-2 text-sm ${two?.supported ? 'text-ice-800 dark:text-ice-200' : 'text-slate-600 dark:text-slate-400'}`}>{two?.reason ?? 'Not tried for this fit.'}</p>
            {two?.supported ? (
              <Button className="mt-3 w-full sm:w-auto" onClick={() => apply('two-node')} disabled={pending !== ''}>
                {pending === 'two-node' ? 'Applying…' : 'Apply two-node fit'}
              </Button>
            ) : null}
          </section>
        </div>
      ) : null}

      {fit ? (
        <p className="mt-3 text-xs text-slate-500 dark:text-slate-400">
          ± is one standard error from the fit (covariance s²·(JᵀJ)⁻¹); it assumes independent logger noise, so treat it as a lower bound. Heat capacity {fmtKJ(fit.heatCapacityJPerK)}
          {capacity ? `, ${Math.round(capacity.oilShare * 100)} % of it in the oil node for two nodes` : ''}. {fit.window.points.toLocaleString('en-GB')} points from {fit.window.rows.toLocaleString('en-GB')} rows.
        </p>
      ) : null}

      <StatusArea status={status} error={error} />
      <form
        className="mt-5 space-y-4 rounded-xl bg-slate-50 p-3 dark:bg-slate-800/50"
        onSubmit={(e) => {
          e.preventDefault();
          void refit();
        }}
        noValidate
      >
        <h3 className="font-semibold">Cool-down window and options</h3>
        <div className="grid gap-4 sm:grid-cols-2">
          <Slider id="win-start" label="Window start" valueMs={win.startMs} t0={t0} span={span} zone={zone} onChange={(ms) => setWin((w) => ({ startMs: Math.min(ms, w.endMs - 30 * MIN), endMs: w.endMs }))} />
          <Slider id="win-end" label="Window end" valueMs={win.endMs} t0={t0} span={span} zone={zone} onChange={(ms) => setWin((w) => ({ startMs: w.startMs, endMs: Math.max(ms, w.startMs + 30 * MIN) }))} />
        </div>
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField
            id="fit-capacity"
            label="Heat capacity, oil and engine (kJ/K)"
            inputMode="decimal"
            value={kj}
            onChange={(e) => setKj(e.target.value)}
            error={fields.heatCapacityJPerK}
            hint={capacity ? `From the profile: ${fmtKJ(capacity.total)}. G scales with it; τ does not.` : undefined}
          />
          <div className="space-y-3 pt-1">
            <label className="flex min-h-11 items-center gap-3 text-sm">
              <input type="checkbox" className="h-5 w-5 accent-ice-700" checked={coverOn} onChange={(e) => setCoverOn(e.target.checked)} />
              The engine cover was on while logging
            </label>
            <label className="flex min-h-11 items-center gap-3 text-sm">
              <input type="checkbox" className="h-5 w-5 accent-ice-700" checked={twoNode} onChange={(e) => setTwoNode(e.target.checked)} />
              Try two nodes
            </label>
          </div>
        </div>
        <div className="flex flex-wrap gap-2">
          <Button type="submit" disabled={pending !== ''}>
            {pending === 'fit' ? 'Fitting…' : fit ? 'Fit again' : 'Fit'}
          </Button>
          {suggestion ? (
            <Button type="button" variant="secondary" onClick={() => setWin({ startMs: suggestion.startMs, endMs: suggestion.endMs })}>
              Use the suggested window
            </Button>
          ) : null}
        </div>
      </form>
    </Card>
  );
}

function Slider({ id, label, valueMs, t0, span, zone, onChange }: { id: string; label: string; valueMs: number; t0: number; span: number; zone: string; onChange: (ms: number) => void }) {
  const v = Math.round((valueMs - t0) / MIN);
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="flex justify-between text-sm font-medium text-slate-800 dark:text-slate-200">
        <span>{label}</span>
        <span className="tabular-nums text-slate-600 dark:text-slate-300">{formatDayTime(valueMs, zone)}</span>
      </label>
      <input
        id={id}
        type="range"
        min={0}
        max={span}
        step={1}
        value={Math.min(Math.max(v, 0), span)}
        aria-valuetext={formatDayTime(valueMs, zone)}
        onChange={(e) => onChange(t0 + Number(e.target.value) * MIN)}
        className="h-11 w-full accent-ice-700"
      />
    </div>
  );
}
