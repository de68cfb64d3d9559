import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { PageHeader } from '@/components/ui/primitives';
import { ShelterForm } from '@/components/airfields/ShelterForm';
import { pageUser } from '@/lib/auth/page';
import { airfieldOr404 } from '../../../../load';

export const metadata: Metadata = { title: 'Edit shelter' };

export default async function Page({ params }: { params: Promise<{ id: string; shelterId: string }> }) {
  const user = await pageUser('airfields:edit');
  const { id, shelterId } = await params;
  const airfield = await airfieldOr404(user.orgId, id, true);
  const shelter = airfield.shelters.find((s) => String(s.id) === shelterId);
  if (!shelter) notFound();
  return (
    <>
      <PageHeader title={`Edit ${shelter.name}`} subtitle={`At ${airfield.name} (${airfield.ident}).`} />
      <ShelterForm mode="edit" airfieldId={airfield.id} airfieldName={airfield.name} shelter={shelter} />
    </>
  );
}
