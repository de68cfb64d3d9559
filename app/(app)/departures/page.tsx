import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/primitives';
import { BookingForm, type BookableAircraft } from '@/components/departures/BookingForm';
import { DepartureList } from '@/components/departures/DepartureList';
import { pageUser } from '@/lib/auth/page';
import { can } from '@/lib/auth/permissions';
import { aircraftIdsFlownBy, listAircraft, listPilotChoices, type AircraftRecord } from '@/lib/data/aircraft';
import { listDepartures } from '@/lib/data/departures';
import { plansForDepartures } from '@/lib/data/plans';
import { ReadinessCell } from '@/components/board/ReadinessCell';
import { OilTooColdBanner } from '@/components/board/OilTooColdBanner';
import { OutcomeSection } from '@/components/outcomes/OutcomeCard';
import { outcomeEntries } from '@/lib/data/outcomes';

export const metadata: Metadata = { title: 'Departures' };

const HOUR_MS = 3_600_000;

function bookable(a: AircraftRecord): BookableAircraft[] {
  if (!a.airfield || !a.shelter) return [];
  return [
    {
      id: a.id,
      registration: a.registration,
      typeLabel: a.typeLabel,
      airfield: { id: a.airfield.id, name: a.airfield.name, timeZone: a.airfield.timeZone },
      shelterName: a.shelter.name,
      classReadyC: a.classDefaults.readyC,
      heaterW: a.heaters.reduce((s, h) => s + h.powerW, 0),
    },
  ];
}

export default async function Page({ searchParams }: { searchParams: Promise<{ aircraft?: string }> }) {
  const user = await pageUser('departures:book-own');
  const { aircraft: pre } = await searchParams;
  const bookAny = can(user.role, 'departures:book-any');
  const nowMs = Date.now();
  const [fleet, flies, pilots, departures, mornings] = await Promise.all([
    listAircraft({ orgId: user.orgId }),
    bookAny ? Promise.resolve(null) : aircraftIdsFlownBy({ orgId: user.orgId, userId: user.id }),
    bookAny ? listPilotChoices({ orgId: user.orgId }) : Promise.resolve([]),
    // The same window and scope as GET /api/departures, so SWR takes over seamlessly.
    listDepartures({ orgId: user.orgId, fromMs: nowMs - 6 * HOUR_MS, toMs: nowMs + 14 * 24 * HOUR_MS, pilotId: bookAny ? undefined : user.id }),
    // Mornings of the last 36 hours, for the "Oil at start" cards (Morning outcomes).
    outcomeEntries({ orgId: user.orgId, pilotId: bookAny ? undefined : user.id, now: new Date(nowMs) }),
  ]);
  const plans = await plansForDepartures({ orgId: user.orgId, departures, now: new Date(nowMs) });
  const readiness = Object.fromEntries(plans.map((p) => [p.departureId, <ReadinessCell key={p.departureId} plan={p} units={user.tempUnit} nowMs={nowMs} />]));
  // The oil-too-cold warning: my own departures (as pilot) that will not be ready.
  // The banner warns about the coming morning (within 36 h); later days show it in their row.
  const tooCold = plans.filter((p) => p.pilot.id === user.id && (p.status === 'short' || p.status === 'unplanned') && Date.parse(p.departAt) < nowMs + 36 * HOUR_MS);
  const choices = fleet.filter((a) => !flies || flies.includes(a.id)).flatMap(bookable);
  const pilotChoices = bookAny ? [{ id: user.id, name: user.name }, ...pilots.filter((p) => p.id !== user.id)] : undefined;
  return (
    <>
      <PageHeader
        title="Departures"
        subtitle={bookAny ? 'Every booked first flight of the day, and booking for any pilot.' : 'Your first flights of the day and whether the oil will be warm enough.'}
      />
      <OilTooColdBanner plans={tooCold} units={user.tempUnit} />
      <OutcomeSection entries={mornings} tempUnit={user.tempUnit} showPilot={bookAny} />
      {choices.length ? (
        <a href="#book-h" className="mb-4 inline-flex min-h-11 items-center rounded-xl bg-ice-700 px-4 text-sm font-semibold text-white hover:bg-ice-800 dark:bg-ice-500 dark:text-slate-950">
          Book a departure
        </a>
      ) : null}
      <div className="grid gap-5">
        <div className="order-2 max-w-xl scroll-mt-20">
          {choices.length ? (
            <BookingForm aircraft={choices} pilots={pilotChoices} selfId={user.id} tempUnit={user.tempUnit} nowMs={nowMs} preselect={pre ? Number(pre) : undefined} />
          ) : (
            <p className="rounded-2xl border border-dashed border-slate-300 p-5 text-sm text-slate-600 dark:border-slate-700 dark:text-slate-400">
              You are not listed as a pilot of any aircraft yet. Ask an operator to add you to the aircraft you fly.
            </p>
          )}
        </div>
        <section aria-labelledby="upcoming-h" className="order-1 min-w-0">
          <h2 id="upcoming-h" className="mb-3 text-lg font-semibold">{bookAny ? 'Upcoming departures' : 'Your upcoming departures'}</h2>
          <DepartureList initial={departures} tempUnit={user.tempUnit} selfId={user.id} manageAll={bookAny} nowMs={nowMs} extraById={readiness} extraLabel="Readiness at departure" />
        </section>
      </div>
    </>
  );
}
