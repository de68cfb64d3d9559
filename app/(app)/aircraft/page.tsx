import type { Metadata } from 'next';
import { EmptyState, PageHeader } from '@/components/ui/primitives';
import { pageUser } from '@/lib/auth/page';

export const metadata: Metadata = { title: 'Aircraft' };

export default async function Page() {
  await pageUser('org:read');
  return (
    <>
      <PageHeader title="Aircraft" subtitle="Aircraft profiles, heaters and thermal parameters." />
      <EmptyState title="No aircraft shown yet">Each aircraft's engine class, oil quantity, cover and heaters will be listed here.</EmptyState>
    </>
  );
}
