import type { Metadata } from 'next';
import { ButtonLink, PageHeader } from '@/components/ui/primitives';
import { AircraftTable } from '@/components/aircraft/AircraftTable';
import { pageUser } from '@/lib/auth/page';
import { can } from '@/lib/auth/permissions';
import { listAircraft } from '@/lib/data/aircraft';

export const metadata: Metadata = { title: 'Aircraft' };

export default async function Page() {
  const user = await pageUser('org:read');
  const canEdit = can(user.role, 'aircraft:edit');
  const aircraft = await listAircraft({ orgId: user.orgId });
  return (
    <>
      <PageHeader
        title="Aircraft"
        subtitle="Engine class, oil, home shelter, cover and heaters of each aircraft: what its Soak forecast and Heat plan are built from."
        actions={canEdit ? <ButtonLink href="/aircraft/new">Add aircraft</ButtonLink> : null}
      />
      <AircraftTable initial={aircraft} tempUnit={user.tempUnit} volumeUnit={user.volumeUnit} canEdit={canEdit} />
    </>
  );
}
