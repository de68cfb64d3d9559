import { formatTemp } from '@/components/airfields/format';
import { formatDayTime } from '@/lib/time';
import type { PlanView } from '@/lib/views/plans';

/** The oil-too-cold warning on screen: each departure that will not be ready, what would fix it, and the cautions. */
export function OilTooColdBanner({ plans, units, showPilot = false, title }: { plans: PlanView[]; units: 'C' | 'F'; showPilot?: boolean; title?: string }) {
  if (!plans.length) return null;
  return (
    <section role="alert" aria-labelledby="cold-h" className="mb-5 rounded-2xl border-2 border-red-400 bg-red-50 p-4 text-red-950 dark:border-red-700 dark:bg-red-950 dark:text-red-50">
      <h2 id="cold-h" className="flex items-center gap-2 text-base font-bold">
        <span aria-hidden="true" className="grid h-7 w-7 place-items-center rounded-full bg-red-700 text-white">!</span>
        {title ? `${title}: ` : 'Oil too cold: '}
        {plans.length === 1 ? 'a departure will not be ready' : `${plans.length} departures will not be ready`}
      </h2>
      <ul className="mt-3 space-y-3">
        {plans.map((p) => {
          const zone = p.airfield?.timeZone ?? 'UTC';
          return (
            <li key={p.departureId} className="rounded-xl bg-white/70 p-3 text-sm dark:bg-red-900/40">
              <p className="font-semibold">
                {p.aircraft.registration} · departs {formatDayTime(Date.parse(p.departAt), zone)} at {p.airfield?.name ?? '—'}
                {showPilot ? <span className="font-normal"> · {p.pilot.name}</span> : null}
              </p>
              <p>
                Predicted oil at departure {formatTemp(p.oilAtDepartureC, units, 0)}, ready temperature {formatTemp(p.readyC, units, 0)}.{' '}
                {p.status === 'unplanned' ? (p.heater ? 'No heat plan yet.' : 'No heater is fitted.') : 'The heater cannot warm it in time.'}
              </p>
              <p className="mt-1">
                <span className="font-semibold">What would fix it: </span>
                {p.fix?.readyAt ? `with the heater on from now it is ready at ${formatDayTime(Date.parse(p.fix.readyAt), zone)}; ` : ''}
                {p.fix?.powerNeededW && (!p.heater || p.fix.powerNeededW > p.heater.powerW) ? `about ${Math.ceil(p.fix.powerNeededW / 50) * 50} W of heat would make it on time (${p.heater ? `${Math.round(p.heater.powerW)} W fitted` : 'none fitted'}); ` : ''}
                move the departure later, move the aircraft into a heated hangar, or ask your operator for a stronger heater.
              </p>
            </li>
          );
        })}
      </ul>
      <p className="mt-3 text-xs">
        Estimates only: the engine and aircraft manufacturer&apos;s cold-weather instructions, your operator&apos;s procedures and local rules come first. Never start an engine below its minimum oil
        temperature. Preheaters can start fires: no open flame, never leave a combustion heater unattended. Before turning a propeller by hand: ignition off, treat it as live, chocks in. No take-off with
        frost, ice or snow on wings, tail or propeller.
      </p>
    </section>
  );
}
