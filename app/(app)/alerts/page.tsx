import type { Metadata } from 'next';
import { EmptyState, PageHeader } from '@/components/ui/primitives';
import { pageUser } from '@/lib/auth/page';

export const metadata: Metadata = { title: 'Alerts' };

export default async function Page() {
  await pageUser('org:read');
  return (
    <>
      <PageHeader title="Alerts" subtitle="Oil-too-cold warnings, switch-on reminders and cold-night notices." />
      <EmptyState title="No alerts">When an engine will be too cold at departure, or a heater needs switching on, it will show here and by e-mail.</EmptyState>
    </>
  );
}
