import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/primitives';
import { AirfieldForm } from '@/components/airfields/AirfieldForm';
import { pageUser } from '@/lib/auth/page';
import { formContext } from '../load';

export const metadata: Metadata = { title: 'New airfield' };

export default async function Page() {
  const user = await pageUser('airfields:edit');
  const ctx = await formContext(user.orgId);
  return (
    <>
      <PageHeader title="New airfield" subtitle="Where it is, its time zone, and the shelters aircraft are kept in." />
      <AirfieldForm mode="create" {...ctx} />
    </>
  );
}
