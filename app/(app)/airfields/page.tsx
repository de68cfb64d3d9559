import type { Metadata } from 'next';
import { EmptyState, PageHeader } from '@/components/ui/primitives';
import { pageUser } from '@/lib/auth/page';

export const metadata: Metadata = { title: 'Airfields' };

export default async function Page() {
  await pageUser('org:read');
  return (
    <>
      <PageHeader title="Airfields" subtitle="Airfields and their shelters." />
      <EmptyState title="No airfields shown yet">Airfields, their heated hangars, T-hangars and tie-down lines will be listed here.</EmptyState>
    </>
  );
}
