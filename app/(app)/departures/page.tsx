import type { Metadata } from 'next';
import { EmptyState, PageHeader } from '@/components/ui/primitives';
import { pageUser } from '@/lib/auth/page';

export const metadata: Metadata = { title: 'Departures' };

export default async function Page() {
  await pageUser('departures:book-own');
  return (
    <>
      <PageHeader title="Departures" subtitle="Your first flights of the day and whether the oil will be warm enough." />
      <EmptyState title="No departures booked">Book the first flight of a day and Thawline will show the predicted oil temperature at departure.</EmptyState>
    </>
  );
}
