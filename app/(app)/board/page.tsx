import type { Metadata } from 'next';
import { MorningBoard } from '@/components/board/MorningBoard';
import { HeatCautions } from '@/components/board/Cautions';
import { PageHeader, ButtonLink } from '@/components/ui/primitives';
import { pageUser } from '@/lib/auth/page';
import { can } from '@/lib/auth/permissions';
import { morningBoard } from '@/lib/data/plans';

export const metadata: Metadata = { title: 'Morning board' };
export const dynamic = 'force-dynamic';

export default async function BoardPage() {
  const user = await pageUser('plans:manage');
  const board = await morningBoard({ orgId: user.orgId });
  return (
    <>
      <PageHeader
        title="Morning board"
        subtitle="The next morning's departures in switch-on order, with the predicted oil temperature at departure."
        actions={<ButtonLink href="/board/calendar" variant="secondary">Calendar feed</ButtonLink>}
      />
      <MorningBoard initial={board} units={user.tempUnit} canConfirm={can(user.role, 'plans:manage')} />
      <div className="mt-6">
        <HeatCautions />
      </div>
    </>
  );
}
