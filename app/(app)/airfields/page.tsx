import type { Metadata } from 'next';
import { ButtonLink, PageHeader } from '@/components/ui/primitives';
import { AirfieldsTable } from '@/components/airfields/AirfieldsTable';
import { pageUser } from '@/lib/auth/page';
import { can } from '@/lib/auth/permissions';
import { listAirfields } from '@/lib/data/airfields';
import { pageRefreshMode, tonightForAirfields } from '@/lib/data/forecasts';

export const metadata: Metadata = { title: 'Airfields' };

export default async function Page() {
  const user = await pageUser('org:read');
  const airfields = await listAirfields({ orgId: user.orgId });
  const now = new Date();
  const weather = await tonightForAirfields({ orgId: user.orgId, airfieldIds: airfields.map((a) => a.id), now, refresh: pageRefreshMode() });
  const canEdit = can(user.role, 'airfields:edit');
  return (
    <>
      <PageHeader
        title="Airfields"
        subtitle="Your airfields and their shelters, with tonight’s forecast low."
        actions={canEdit ? <ButtonLink href="/airfields/new">Add airfield</ButtonLink> : null}
      />
      <AirfieldsTable initial={airfields.map((a) => ({ ...a, ...weather.get(a.id) }))} unit={user.tempUnit} canEdit={canEdit} nowMs={now.getTime()} />
    </>
  );
}
