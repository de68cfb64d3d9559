import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/primitives';
import { AirfieldForm } from '@/components/airfields/AirfieldForm';
import { pageUser } from '@/lib/auth/page';
import { airfieldOr404, formContext } from '../../load';

export const metadata: Metadata = { title: 'Edit airfield' };

export default async function Page({ params }: { params: Promise<{ id: string }> }) {
  const user = await pageUser('airfields:edit');
  const airfield = await airfieldOr404(user.orgId, (await params).id);
  const ctx = await formContext(user.orgId);
  return (
    <>
      <PageHeader title={`Edit ${airfield.name}`} subtitle="Moving the airfield fetches a new forecast for its new position." />
      <AirfieldForm mode="edit" airfield={airfield} {...ctx} />
    </>
  );
}
