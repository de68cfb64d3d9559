import type { Metadata } from 'next';
import { EmptyState, PageHeader } from '@/components/ui/primitives';
import { pageUser } from '@/lib/auth/page';

export const metadata: Metadata = { title: 'Soak forecast' };

export default async function Page() {
  await pageUser('simulate');
  return (
    <>
      <PageHeader title="Soak forecast" subtitle="What-if: how an engine's oil cools overnight." />
      <EmptyState title="Soak forecast coming">Pick an engine class, shelter, cover and heater to see the predicted oil curve.</EmptyState>
    </>
  );
}
