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

export const metadata: Metadata = { title: 'Aircraft' };

export default async function Page({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<{ added?: string }> }) {
  const user = await pageUser('org:read');
  const { id } = await params;
  const { added } = await searchParams;
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
  const [shelters, pilots] = canEdit ? await Promise.all([listShelterChoices({ orgId: user.orgId }), listPilotChoices({ orgId: user.orgId })]) : [[], []];
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
        {a.archived ? <Notice tone="caution" title="Archived">This aircraft is archived: it is not planned and cannot be booked.</Notice> : null}
      </div>
      {canEdit ? (
        <AircraftForm initial={a} shelters={shelters} pilots={pilots} classes={engineClassOptions()} tempUnit={user.tempUnit} volumeUnit={user.volumeUnit} />
      ) : (
        <AircraftSummary a={a} tempUnit={user.tempUnit} volumeUnit={user.volumeUnit} />
      )}
    </>
  );
}
