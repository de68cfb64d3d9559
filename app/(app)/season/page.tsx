import type { Metadata } from 'next';
import Link from 'next/link';
import { Card, EmptyState, PageHeader } from '@/components/ui/primitives';
import { OutcomeScatter } from '@/components/charts/OutcomeScatter';
import { ReliabilityChart } from '@/components/charts/ReliabilityChart';
import { pageUser } from '@/lib/auth/page';
import { seasonReport } from '@/lib/data/outcomes';
import type { AircraftReport, ReportGroup } from '@/lib/outcomes/report';
import { PRIOR_SIGMA_K } from '@/lib/outcomes/stats';
import { toDisplayDelta, type TempUnit } from '@/lib/units';

export const metadata: Metadata = { title: 'Season report' };

const DAY_MS = 86_400_000;
const RANGES = [30, 60, 120, 365] as const;

const minus = (s: string) => s.replace('-', '\u2212');
function delta(k: number | null, unit: TempUnit, digits = 1, sign = true): string {
  if (k === null || !Number.isFinite(k)) return '—';
  const v = toDisplayDelta(k, unit);
  const s = (Math.abs(v) < 0.05 ? 0 : v).toFixed(digits);
  return `${sign && v > 0.05 ? '+' : ''}${minus(s)} ${unit === 'F' ? '°F' : 'K'}`;
}
const pct = (p: number | null) => (p === null ? '—' : `${Math.round(p * 100)}\u00a0%`);
const nb = (s: string) => s.replace(/ %/g, '\u00a0%');
const kwh = (v: number) => `${v >= 100 ? Math.round(v) : v.toFixed(1)} kWh`;

function Tile({ label, value, note }: { label: string; value: string; note?: string }) {
  return (
    <div className="rounded-2xl border border-slate-200 bg-white p-4 shadow-sm dark:border-slate-800 dark:bg-slate-900">
      <p className="text-xs font-semibold uppercase tracking-wide text-slate-500 dark:text-slate-400">{label}</p>
      <p className="mt-1 text-2xl font-semibold tabular-nums text-slate-900 dark:text-white">{value}</p>
      {note ? <p className="mt-0.5 text-xs text-slate-600 dark:text-slate-400">{note}</p> : null}
    </div>
  );
}

function Summary({ g, unit, bias }: { g: ReportGroup; unit: TempUnit; bias?: AircraftReport['bias'] }) {
  const saved = g.energy.usualKWh > 0 ? 1 - g.energy.plannedKWh / g.energy.usualKWh : null;
  return (
    <div className="grid grid-cols-2 gap-3 lg:grid-cols-4">
      <Tile label="Mornings recorded" value={String(g.recorded)} note={`${g.flown} flown · ${g.notFlown} not flown`} />
      <Tile
        label="Error at start"
        value={delta(g.errors.meanK, unit)}
        note={g.errors.sdK !== null ? `recorded − predicted; spread ±${delta(g.errors.sdK, unit, 1, false)}` : 'recorded − predicted'}
      />
      {bias ? (
        <Tile label="Bias estimate" value={delta(bias.biasK, unit)} note={`±${delta(bias.biasSdK, unit, 1, false)}; next morning within ±${delta(bias.predictiveSigmaK, unit, 1, false)} (1σ)`} />
      ) : (
        <Tile label="Ready at start" value={pct(g.readyShare)} note="of flown mornings with a temperature" />
      )}
      <Tile
        label="Energy"
        value={g.energy.mornings ? kwh(g.energy.plannedKWh) : '—'}
        note={g.energy.mornings ? `against ${kwh(g.energy.usualKWh)} all night${saved !== null ? ` · ${Math.round(saved * 100)} % less` : ''}` : 'no planned mornings'}
      />
    </div>
  );
}

function ReliabilityTable({ g }: { g: ReportGroup }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-left text-sm">
        <caption className="sr-only">How often the stated chance of being ready held, by band of stated chance</caption>
        <thead className="text-xs text-slate-600 dark:text-slate-400">
          <tr className="border-b border-slate-200 dark:border-slate-800">
            <th scope="col" className="py-2 pr-3 font-semibold">Stated chance</th>
            <th scope="col" className="px-3 py-2 text-right font-semibold">Mornings</th>
            <th scope="col" className="px-3 py-2 text-right font-semibold">Ready</th>
            <th scope="col" className="py-2 pl-3 text-right font-semibold">
              Share <span className="block font-normal">95{'\u00a0'}% interval</span>
            </th>
          </tr>
        </thead>
        <tbody className="divide-y divide-slate-200 tabular-nums dark:divide-slate-800">
          {g.reliability.map((r) => (
            <tr key={r.label}>
              <th scope="row" className="whitespace-nowrap py-2 pr-3 font-medium text-slate-900 dark:text-white">
                {nb(r.label)}
                {r.meanStated !== null ? <span className="block text-xs font-normal text-slate-500">mean stated {pct(r.meanStated)}</span> : null}
              </th>
              <td className="px-3 py-2 text-right">{r.n}</td>
              <td className="px-3 py-2 text-right">{r.ready}</td>
              <td className="py-2 pl-3 text-right">
                {r.n ? (
                  <>
                    <span className={`font-semibold ${r.hi !== null && r.meanStated !== null && r.hi < r.meanStated ? 'text-amber-800 dark:text-amber-300' : 'text-slate-900 dark:text-white'}`}>{pct(r.share)}</span>
                    <span className="block whitespace-nowrap text-xs text-slate-500">
                      {pct(r.lo)}–{pct(r.hi)}
                    </span>
                  </>
                ) : (
                  '—'
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function AircraftTable({ rows, unit, days }: { rows: AircraftReport[]; unit: TempUnit; days: number }) {
  const link = (a: AircraftReport) => `/season?aircraft=${a.aircraftId}&days=${days}`;
  return (
    <>
      <ul className="space-y-2 md:hidden">
        {rows.map((a) => (
          <li key={a.aircraftId}>
            <Link href={link(a)} className="block rounded-xl border border-slate-200 p-3 hover:bg-ice-50/60 dark:border-slate-800 dark:hover:bg-slate-800/60">
              <span className="flex items-baseline justify-between gap-2">
                <span className="font-semibold tracking-wide text-ice-800 dark:text-ice-300">{a.registration}</span>
                <span className="text-xs text-slate-600 dark:text-slate-400">
                  {a.flown} flown · {a.notFlown} not flown
                </span>
              </span>
              <span className="mt-1 grid grid-cols-3 gap-2 text-sm tabular-nums">
                <span>
                  <span className="block text-xs text-slate-500">Bias</span>
                  {delta(a.bias.biasK, unit)}
                </span>
                <span>
                  <span className="block text-xs text-slate-500">Model σ</span>±{delta(a.bias.predictiveSigmaK, unit, 1, false)}
                </span>
                <span>
                  <span className="block text-xs text-slate-500">Ready</span>
                  {pct(a.readyShare)}
                </span>
              </span>
            </Link>
          </li>
        ))}
      </ul>
      <div className="hidden overflow-x-auto md:block">
        <table className="w-full text-left text-sm">
          <caption className="sr-only">Per aircraft: mornings, error of the predicted oil at start, bias estimate, model error, readiness and energy</caption>
          <thead className="text-xs text-slate-600 dark:text-slate-400">
            <tr className="border-b border-slate-200 dark:border-slate-800">
              <th scope="col" className="py-2 pr-3 font-semibold">Aircraft</th>
              <th scope="col" className="px-3 py-2 text-right font-semibold">Mornings</th>
              <th scope="col" className="px-3 py-2 text-right font-semibold">Mean error</th>
              <th scope="col" className="px-3 py-2 text-right font-semibold">Spread</th>
              <th scope="col" className="px-3 py-2 text-right font-semibold">Bias estimate</th>
              <th scope="col" className="px-3 py-2 text-right font-semibold">Model σ</th>
              <th scope="col" className="px-3 py-2 text-right font-semibold">Ready at start</th>
              <th scope="col" className="py-2 pl-3 text-right font-semibold">Energy (all night)</th>
            </tr>
          </thead>
          <tbody className="divide-y divide-slate-200 tabular-nums dark:divide-slate-800">
            {rows.map((a) => (
              <tr key={a.aircraftId} className="hover:bg-ice-50/50 dark:hover:bg-slate-800/40">
                <th scope="row" className="py-2 pr-3">
                  <Link href={link(a)} className="inline-flex min-h-10 items-center font-semibold tracking-wide text-slate-900 hover:text-ice-700 hover:underline dark:text-white dark:hover:text-ice-300">
                    {a.registration}
                  </Link>
                </th>
                <td className="px-3 py-2 text-right">
                  {a.flown}
                  <span className="text-xs text-slate-500"> + {a.notFlown} not flown</span>
                </td>
                <td className="px-3 py-2 text-right">{delta(a.errors.meanK, unit)}</td>
                <td className="px-3 py-2 text-right">±{delta(a.errors.sdK, unit, 1, false)}</td>
                <td className="px-3 py-2 text-right font-semibold">
                  {delta(a.bias.biasK, unit)}
                  <span className="block text-xs font-normal text-slate-500">±{delta(a.bias.biasSdK, unit, 1, false)}</span>
                </td>
                <td className="px-3 py-2 text-right">±{delta(a.bias.predictiveSigmaK, unit, 1, false)}</td>
                <td className="px-3 py-2 text-right">{pct(a.readyShare)}</td>
                <td className="py-2 pl-3 text-right">
                  {a.energy.mornings ? (
                    <>
                      {kwh(a.energy.plannedKWh)}
                      <span className="block text-xs text-slate-500">{kwh(a.energy.usualKWh)}</span>
                    </>
                  ) : (
                    '—'
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </>
  );
}

const chip = (on: boolean) =>
  `inline-flex min-h-11 items-center whitespace-nowrap rounded-full border px-4 text-sm font-semibold ${
    on ? 'border-ice-700 bg-ice-700 text-white dark:border-ice-300 dark:bg-ice-300 dark:text-slate-950' : 'border-slate-300 bg-white text-slate-700 hover:bg-slate-100 dark:border-slate-700 dark:bg-slate-900 dark:text-slate-200 dark:hover:bg-slate-800'
  }`;

export default async function Page({ searchParams }: { searchParams: Promise<{ aircraft?: string; days?: string }> }) {
  const user = await pageUser('plans:manage');
  const sp = await searchParams;
  const days = RANGES.find((d) => String(d) === sp.days) ?? 120;
  const nowMs = Date.now();
  const report = await seasonReport({ orgId: user.orgId, fromMs: nowMs - days * DAY_MS, toMs: nowMs + DAY_MS });
  const selected = report.aircraft.find((a) => String(a.aircraftId) === sp.aircraft) ?? null;
  const g: ReportGroup = selected ?? report.organization;
  const unit = user.tempUnit;
  const q = (o: { aircraft?: number | null; days?: number }) => {
    const p = new URLSearchParams();
    const a = o.aircraft === undefined ? selected?.aircraftId : o.aircraft;
    if (a) p.set('aircraft', String(a));
    p.set('days', String(o.days ?? days));
    return `/season?${p}`;
  };
  const scope = selected ? selected.registration : 'the organization';
  return (
    <>
      <PageHeader
        title="Season report"
        subtitle="Predicted against recorded oil at start, how often the stated chance of being ready held, and the energy used against the usual rule of heating all night."
      />
      <nav aria-label="Period" className="mb-3 flex flex-wrap gap-2">
        {RANGES.map((d) => (
          <Link key={d} href={q({ days: d })} aria-current={d === days ? 'page' : undefined} className={chip(d === days)}>
            {d === 365 ? 'Last year' : `Last ${d} days`}
          </Link>
        ))}
      </nav>
      <nav aria-label="Aircraft" className="-mx-4 mb-5 overflow-x-auto px-4 pb-1 sm:mx-0 sm:px-0">
        <ul className="flex gap-2 sm:flex-wrap">
          <li>
            <Link href={q({ aircraft: null })} aria-current={!selected ? 'page' : undefined} className={chip(!selected)}>
              Whole organization
            </Link>
          </li>
          {report.aircraft.map((a) => (
            <li key={a.aircraftId}>
              <Link href={q({ aircraft: a.aircraftId })} aria-current={selected?.aircraftId === a.aircraftId ? 'page' : undefined} className={chip(selected?.aircraftId === a.aircraftId)}>
                {a.registration}
              </Link>
            </li>
          ))}
        </ul>
      </nav>

      {report.organization.recorded === 0 ? (
        <EmptyState title="No mornings recorded yet">
          After a departure, the pilot or an operator records the oil temperature shown at start on the Departures page. The report fills in from there.
        </EmptyState>
      ) : (
        <div className="space-y-5">
          <h2 className="sr-only">Summary for {scope}</h2>
          <Summary g={g} unit={unit} bias={selected?.bias} />

          <div className="grid gap-5 xl:grid-cols-5">
            <Card className="xl:col-span-3" aria-labelledby="scatter-h">
              <h2 id="scatter-h" className="text-lg font-semibold text-slate-900 dark:text-white">Predicted against recorded</h2>
              <p className="mb-3 text-sm text-slate-600 dark:text-slate-400">
                Oil at start for every flown morning of {scope}. Above the dashed line the oil was warmer than the plan predicted.
              </p>
              <OutcomeScatter points={g.points} unit={unit} title={`Predicted against recorded oil at start, ${scope}`} />
            </Card>
            <Card className="xl:col-span-2" aria-labelledby="rel-h">
              <h2 id="rel-h" className="text-lg font-semibold text-slate-900 dark:text-white">Did the stated chance hold?</h2>
              <p className="mb-3 text-sm text-slate-600 dark:text-slate-400">Of the mornings whose plan stated a chance in each band, the share ready at start (oil at or above the ready temperature).</p>
              <ReliabilityChart rows={g.reliability} />
              <div className="mt-4">
                <ReliabilityTable g={g} />
              </div>
            </Card>
          </div>

          {selected ? (
            <Card aria-labelledby="bias-h">
              <h2 id="bias-h" className="text-lg font-semibold text-slate-900 dark:text-white">What {selected.registration}’s mornings say about its model</h2>
              <dl className="mt-3 grid gap-3 text-sm sm:grid-cols-3">
                <div>
                  <dt className="text-slate-600 dark:text-slate-400">Bias estimate (add to a prediction)</dt>
                  <dd className="text-lg font-semibold tabular-nums">
                    {delta(selected.bias.biasK, unit)} <span className="text-sm font-normal text-slate-500">±{delta(selected.bias.biasSdK, unit, 1, false)}</span>
                  </dd>
                </div>
                <div>
                  <dt className="text-slate-600 dark:text-slate-400">Model error for the next morning (1σ)</dt>
                  <dd className="text-lg font-semibold tabular-nums">±{delta(selected.bias.predictiveSigmaK, unit, 1, false)}</dd>
                </div>
                <div>
                  <dt className="text-slate-600 dark:text-slate-400">Mornings behind it</dt>
                  <dd className="text-lg font-semibold tabular-nums">{selected.bias.n}</dd>
                </div>
              </dl>
              <p className="mt-3 text-sm text-slate-600 dark:text-slate-400">
                The estimate starts from the engine class: no bias and a model error of ±{delta(selected.bias.priorSigmaK, unit, 1, false)} for
                {selected.thermalSource === 'fitted' ? ' parameters fitted from a log' : ' a class preset'}, and moves towards the aircraft’s own mornings as they
                accumulate, so a handful of mornings cannot swing it far.
              </p>
            </Card>
          ) : null}

          <Card aria-labelledby="fleet-h">
            <h2 id="fleet-h" className="text-lg font-semibold text-slate-900 dark:text-white">By aircraft</h2>
            <p className="mb-3 text-sm text-slate-600 dark:text-slate-400">
              Error = recorded − predicted oil at start. Bias and model σ start from the class (±{delta(PRIOR_SIGMA_K.preset, unit, 0, false)} for a preset) and
              follow each aircraft’s mornings.
            </p>
            <AircraftTable rows={report.aircraft} unit={unit} days={days} />
          </Card>

          <p className="text-xs text-slate-500 dark:text-slate-400">
            Thawline gives estimates. Follow the engine and aircraft manufacturer’s cold-weather instructions, the operator’s procedures and local regulations; they
            override anything Thawline shows.
          </p>
        </div>
      )}
    </>
  );
}
