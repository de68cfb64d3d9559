import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { ButtonLink, Notice, PageHeader } from '@/components/ui/primitives';
import { AircraftForm } from '@/components/aircraft/AircraftForm';
import { AircraftFacts, AircraftSummary } from '@/components/aircraft/AircraftSummary';
import { NotFound } from '@/lib/api/errors';
import { pageUser } from '@/lib/auth/page';
import { can } from '@/lib/auth/permissions';
import { engineClassOptions, getAircraft, listPilotChoices, listShelterChoices, mayBook, type AircraftRecord } from '@/lib/data/aircraft';
import { listDepartures } from '@/lib/data/departures';
import { plansForDepartures } from '@/lib/data/plans';
import { ReadinessCell } from '@/components/board/ReadinessCell';
import { formatDayTime } from '@/lib/time';
import { OutcomeSection } from '@/components/outcomes/OutcomeCard';
import { outcomeEntries } from '@/lib/data/outcomes';

export const metadata: Metadata = { title: 'Aircraft' };

export default async function Page({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<{ added?: string; tab?: string }> }) {
  const user = await pageUser('org:read');
  const { id } = await params;
  const { added, tab: tabParam } = await searchParams;
  const tab = tabParam === 'profile' ? 'profile' : 'departures';
  const aircraftId = /^[0-9]{1,12}$/.test(id) ? Number(id) : -1;
  let a: AircraftRecord;
  try {
    a = await getAircraft({ orgId: user.orgId, aircraftId });
  } catch (e) {
    if (e instanceof NotFound) notFound();
    throw e;
  }
  const canEdit = can(user.role, 'aircraft:edit');
  const canBook = !a.archived && (can(user.role, 'departures:book-any') || (can(user.role, 'departures:book-own') && (await mayBook({ aircraftId: a.id, userId: user.id }))));
  const [shelters, pilots] = canEdit && tab === 'profile' ? await Promise.all([listShelterChoices({ orgId: user.orgId }), listPilotChoices({ orgId: user.orgId })]) : [[], []];
  const nowMs = Date.now();
  // The aircraft's next two weeks of departures with their plans (a pilot without 'book any' sees their own).
  const bookAny = can(user.role, 'departures:book-any');
  const departures =
    tab === 'departures'
      ? await listDepartures({ orgId: user.orgId, aircraftId: a.id, fromMs: nowMs - 30 * 60_000, toMs: nowMs + 14 * 86_400_000, pilotId: bookAny ? undefined : user.id })
      : [];
  const plans = departures.length ? await plansForDepartures({ orgId: user.orgId, departures, now: new Date(nowMs) }) : [];
  // Mornings of the last 36 hours to record (a pilot: their own departures; roles that book for anyone: all).
  const mornings =
    tab === 'departures' && can(user.role, 'departures:book-own')
      ? await outcomeEntries({ orgId: user.orgId, aircraftId: a.id, pilotId: bookAny ? undefined : user.id, now: new Date(nowMs) })
      : [];
  const tabClass = (on: boolean) =>
    `inline-flex min-h-11 items-center border-b-2 px-3 text-sm font-semibold ${on ? 'border-ice-700 text-slate-900 dark:border-ice-300 dark:text-white' : 'border-transparent text-slate-600 hover:text-slate-900 dark:text-slate-400'}`;
  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 text-sm">
        <Link href="/aircraft" className="text-ice-700 hover:underline dark:text-ice-300">Aircraft</Link>
      </nav>
      <PageHeader
        title={a.registration}
        subtitle={a.typeLabel}
        actions={canBook ? <ButtonLink href={`/departures?aircraft=${a.id}`} variant={canEdit ? 'secondary' : 'primary'}>Book a departure</ButtonLink> : null}
      />
      <div className="mb-4 space-y-3">
        <AircraftFacts a={a} volumeUnit={user.volumeUnit} />
        {added ? <Notice title="Aircraft added">{a.registration} is in the fleet. Check its heaters and pilots below.</Notice> : null}
        {a.heaterWarnings.map((w) => (
          <Notice key={w.code} tone="caution" title="Heater warning">
            {w.text} Suggestion: {w.suggestion}
          </Notice>
        ))}
        {a.archived ? <Notice tone="caution" title="Archived">This aircraft is archived: it is not planned and cannot be booked.</Notice> : null}
      </div>
      <nav aria-label="Aircraft sections" className="mb-4 flex gap-2 border-b border-slate-200 dark:border-slate-800">
        <Link href={`/aircraft/${a.id}`} aria-current={tab === 'departures' ? 'page' : undefined} className={tabClass(tab === 'departures')}>
          Departures
        </Link>
        <Link href={`/aircraft/${a.id}?tab=profile`} aria-current={tab === 'profile' ? 'page' : undefined} className={tabClass(tab === 'profile')}>
          Profile
        </Link>
      </nav>
      {tab === 'departures' ? (
        <section aria-labelledby="ac-deps-h" className="space-y-3">
          <OutcomeSection entries={mornings} tempUnit={user.tempUnit} showPilot={bookAny} />
          <h2 id="ac-deps-h" className="text-lg font-semibold text-slate-900 dark:text-white">Upcoming departures</h2>
          {plans.length ? (
            <ul className="grid gap-3 lg:grid-cols-2">
              {plans.map((p) => (
                <li key={p.departureId} className="rounded-2xl border border-slate-200 bg-white p-4 dark:border-slate-800 dark:bg-slate-900">
                  <p className="mb-2 font-semibold text-slate-900 dark:text-white">
                    {formatDayTime(Date.parse(p.departAt), p.airfield?.timeZone ?? 'UTC')} <span className="font-normal text-slate-600 dark:text-slate-400">· {p.pilot.name}</span>
                  </p>
                  <ReadinessCell plan={p} units={user.tempUnit} nowMs={nowMs} />
                </li>
              ))}
            </ul>
          ) : (
            <p className="text-sm text-slate-600 dark:text-slate-400">No departures booked in the next two weeks{canBook ? ': use “Book a departure” above.' : '.'}</p>
          )}
        </section>
      ) : canEdit ? (
        <AircraftForm initial={a} shelters={shelters} pilots={pilots} classes={engineClassOptions()} tempUnit={user.tempUnit} volumeUnit={user.volumeUnit} />
      ) : (
        <AircraftSummary a={a} tempUnit={user.tempUnit} volumeUnit={user.volumeUnit} />
      )}
    </>
  );
}
