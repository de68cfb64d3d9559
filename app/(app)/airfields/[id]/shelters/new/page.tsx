import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/primitives';
import { ShelterForm } from '@/components/airfields/ShelterForm';
import { pageUser } from '@/lib/auth/page';
import { airfieldOr404 } from '../../../load';

export const metadata: Metadata = { title: 'New shelter' };

export default async function Page({ params }: { params: Promise<{ id: string }> }) {
  const user = await pageUser('airfields:edit');
  const airfield = await airfieldOr404(user.orgId, (await params).id);
  return (
    <>
      <PageHeader title="New shelter" subtitle={`At ${airfield.name} (${airfield.ident}).`} />
      <ShelterForm mode="create" airfieldId={airfield.id} airfieldName={airfield.name} />
    </>
  );
}
