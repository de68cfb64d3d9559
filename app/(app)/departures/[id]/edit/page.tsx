import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { Card, Notice, PageHeader } from '@/components/ui/primitives';
import { EditDepartureForm } from '@/components/departures/EditDepartureForm';
import { NotFound } from '@/lib/api/errors';
import { pageUser } from '@/lib/auth/page';
import { can } from '@/lib/auth/permissions';
import { listPilotChoices } from '@/lib/data/aircraft';
import { getDeparture, type DepartureRecord } from '@/lib/data/departures';
import { formatDayTime } from '@/lib/time';

export const metadata: Metadata = { title: 'Change departure' };

export default async function Page({ params }: { params: Promise<{ id: string }> }) {
  const user = await pageUser('departures:book-own');
  const { id } = await params;
  const bookAny = can(user.role, 'departures:book-any');
  let d: DepartureRecord;
  try {
    // The same scope as the API: a pilot without 'book any' reaches only departures they fly or booked.
    d = await getDeparture({ orgId: user.orgId, departureId: /^[0-9]{1,12}$/.test(id) ? Number(id) : -1, actor: { id: user.id, bookAny } });
  } catch (e) {
    if (e instanceof NotFound) notFound();
    throw e;
  }
  const nowMs = Date.now();
  const pilots = bookAny ? [{ id: user.id, name: user.name }, ...(await listPilotChoices({ orgId: user.orgId })).filter((p) => p.id !== user.id)] : undefined;
  if (pilots && !pilots.some((p) => p.id === d.pilot.id)) pilots.push(d.pilot);
  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 text-sm">
        <Link href="/departures" className="text-ice-700 hover:underline dark:text-ice-300">Departures</Link>
      </nav>
      <PageHeader title={`Change ${d.aircraft.registration}`} subtitle={`Booked for ${formatDayTime(d.departAtMs, d.timeZone)} at ${d.aircraft.airfield?.name ?? 'its airfield'}`} />
      <Card className="max-w-xl">
        {d.cancelled ? (
          <Notice tone="caution" title="Cancelled">This departure is cancelled and cannot be changed; book a new one.</Notice>
        ) : d.departAtMs < nowMs ? (
          <Notice tone="caution" title="Past">This departure has left; it can no longer be changed.</Notice>
        ) : (
          <EditDepartureForm d={d} tempUnit={user.tempUnit} nowMs={nowMs} pilots={pilots} />
        )}
      </Card>
    </>
  );
}
