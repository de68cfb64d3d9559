import type { Metadata } from 'next';
import { EmptyState, PageHeader } from '@/components/ui/primitives';
import { pageUser } from '@/lib/auth/page';

export const metadata: Metadata = { title: 'Oil log' };

export default async function Page() {
  await pageUser('oil-log:write');
  return (
    <>
      <PageHeader title="Oil log" subtitle="Cold oil checks, oil changes and consumption." />
      <EmptyState title="No oil checks recorded">Daily cold oil checks and oil changes will be listed here, with levels corrected to a reference temperature.</EmptyState>
    </>
  );
}
