import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { Card, PageHeader } from '@/components/ui/primitives';
import { PlanDetail } from '@/components/board/PlanDetail';
import { NotFound } from '@/lib/api/errors';
import { pageUser } from '@/lib/auth/page';
import { can } from '@/lib/auth/permissions';
import { getDeparture, type DepartureRecord } from '@/lib/data/departures';
import { formatDayTime, zoneLabel } from '@/lib/time';

export const metadata: Metadata = { title: 'Heat plan' };

/** One departure's Soak forecast and heat plan at the full width of the page. */
export default async function Page({ params }: { params: Promise<{ id: string }> }) {
  const user = await pageUser('departures:book-own');
  const { id } = await params;
  let d: DepartureRecord;
  try {
    d = await getDeparture({ orgId: user.orgId, departureId: /^[0-9]{1,12}$/.test(id) ? Number(id) : -1, actor: { id: user.id, bookAny: can(user.role, 'departures:book-any') } });
  } catch (e) {
    if (e instanceof NotFound) notFound();
    throw e;
  }
  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 text-sm">
        <Link href="/departures" className="text-ice-700 hover:underline dark:text-ice-300">Departures</Link>
      </nav>
      <PageHeader
        title={`${d.aircraft.registration}: soak forecast and heat plan`}
        subtitle={`Departs ${formatDayTime(d.departAtMs, d.timeZone)} ${zoneLabel(d.timeZone, d.departAtMs)} at ${d.aircraft.airfield?.name ?? 'its airfield'} · ${d.pilot.name}`}
      />
      <Card>
        <PlanDetail departureId={d.id} units={user.tempUnit} canConfirm={can(user.role, 'plans:manage')} />
      </Card>
    </>
  );
}
