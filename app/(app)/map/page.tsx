import type { Metadata } from 'next';
import { EmptyState, PageHeader } from '@/components/ui/primitives';
import { pageUser } from '@/lib/auth/page';

export const metadata: Metadata = { title: 'Site map' };

export default async function Page() {
  await pageUser('org:read');
  return (
    <>
      <PageHeader title="Site map" subtitle="Every airfield, coloured by its aircraft's readiness for the morning." />
      <EmptyState title="The map is on its way">Your airfields will appear here with tonight's forecast low and the readiness of the aircraft in their shelters.</EmptyState>
    </>
  );
}
