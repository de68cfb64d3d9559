import type { Metadata } from 'next';
import Link from 'next/link';
import { PageHeader } from '@/components/ui/primitives';
import { AircraftForm } from '@/components/aircraft/AircraftForm';
import { pageUser } from '@/lib/auth/page';
import { engineClassOptions, listPilotChoices, listShelterChoices } from '@/lib/data/aircraft';

export const metadata: Metadata = { title: 'Add aircraft' };

export default async function Page() {
  const user = await pageUser('aircraft:edit');
  const [shelters, pilots] = await Promise.all([listShelterChoices({ orgId: user.orgId }), listPilotChoices({ orgId: user.orgId })]);
  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 text-sm">
        <Link href="/aircraft" className="text-ice-700 hover:underline dark:text-ice-300">Aircraft</Link>
      </nav>
      <PageHeader title="Add aircraft" subtitle="Start from the engine class; its oil quantity, thermal parameters and usual heaters fill in what you leave empty." />
      <AircraftForm shelters={shelters} pilots={pilots} classes={engineClassOptions()} tempUnit={user.tempUnit} volumeUnit={user.volumeUnit} />
    </>
  );
}
