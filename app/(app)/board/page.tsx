import type { Metadata } from 'next';
import { EmptyState, PageHeader } from '@/components/ui/primitives';
import { pageUser } from '@/lib/auth/page';

export const metadata: Metadata = { title: 'Morning board' };

export default async function Page() {
  await pageUser('plans:manage');
  return (
    <>
      <PageHeader title="Morning board" subtitle="Tomorrow's departures in switch-on order." />
      <EmptyState title="No departures planned yet">Each booked departure will show here with its predicted oil temperature, its switch-on time and whether it will be ready.</EmptyState>
    </>
  );
}
