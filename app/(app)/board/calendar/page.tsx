import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/primitives';
import { pageUser } from '@/lib/auth/page';
import { listAirfields } from '@/lib/data/airfields';
import { listFeeds } from '@/lib/data/calendar';
import { CalendarFeeds } from './CalendarFeeds';

export const metadata: Metadata = { title: 'Calendar feed' };

export default async function CalendarPage() {
  const user = await pageUser('plans:manage');
  const [feeds, airfields] = await Promise.all([listFeeds({ orgId: user.orgId, userId: user.id }), listAirfields({ orgId: user.orgId })]);
  return (
    <>
      <PageHeader title="Calendar feed" subtitle="Switch-on times as calendar events, with a reminder 10 minutes before. Subscribe from your phone's calendar." />
      <CalendarFeeds initial={feeds} airfields={airfields.map((a) => ({ id: a.id, name: a.name }))} />
    </>
  );
}
