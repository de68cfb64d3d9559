import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/primitives';
import { pageUser } from '@/lib/auth/page';
import { listAirfields } from '@/lib/data/airfields';
import { SoakWhatIf } from './SoakWhatIf';

export const metadata: Metadata = { title: 'Soak forecast' };

export default async function SoakPage() {
  const user = await pageUser('simulate');
  const airfields = await listAirfields({ orgId: user.orgId });
  const sites = airfields.map((a) => ({ id: a.id, name: a.name, latitude: a.latitude, longitude: a.longitude, timeZone: a.timeZone }));
  return (
    <>
      <PageHeader title="Soak forecast" subtitle="What if: how an engine's oil cools overnight, and what a heater does to it." />
      <SoakWhatIf sites={sites} units={user.tempUnit} />
    </>
  );
}
