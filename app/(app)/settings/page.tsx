import type { Metadata } from 'next';
import { Card, Notice, PageHeader } from '@/components/ui/primitives';
import { pageUser } from '@/lib/auth/page';
import { can, ROLE_LABEL } from '@/lib/auth/permissions';
import { getPlanningSettings } from '@/lib/data/organization';
import { PasswordForm, PlanningForm, UnitsForm } from './forms';

export const metadata: Metadata = { title: 'Settings' };

export default async function SettingsPage() {
  const user = await pageUser('org:read');
  const planning = can(user.role, 'users:manage') ? await getPlanningSettings({ orgId: user.orgId }) : null;
  return (
    <>
      <PageHeader title="Settings" subtitle={`${user.name} · ${user.email} · ${ROLE_LABEL[user.role]}`} />
      {user.mustChangePassword ? (
        <div className="mb-4">
          <Notice tone="caution" title="Choose your own password">
            You signed in with a temporary password. Set one only you know.
          </Notice>
        </div>
      ) : null}
      <div className="grid gap-4 lg:grid-cols-2">
        <Card aria-labelledby="units-h">
          <h2 id="units-h" className="text-lg font-semibold">Units</h2>
          <p className="mb-4 text-sm text-slate-600 dark:text-slate-400">How temperatures and oil quantities are shown to you.</p>
          <UnitsForm tempUnit={user.tempUnit} volumeUnit={user.volumeUnit} />
        </Card>
        <Card aria-labelledby="pw-h">
          <h2 id="pw-h" className="text-lg font-semibold">Password</h2>
          <p className="mb-4 text-sm text-slate-600 dark:text-slate-400">At least 10 characters.</p>
          <PasswordForm />
        </Card>
        {planning ? (
          <Card aria-labelledby="plan-h">
            <h2 id="plan-h" className="text-lg font-semibold">Planning (organization)</h2>
            <p className="mb-4 text-sm text-slate-600 dark:text-slate-400">For every aircraft of the organization. Estimates only: the manufacturer&apos;s instructions come first.</p>
            <PlanningForm targetChance={planning.targetChance} holdMinutes={planning.holdMinutes} />
          </Card>
        ) : null}
      </div>
    </>
  );
}
