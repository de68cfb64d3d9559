import type { Metadata } from 'next';
import { AlertsView } from '@/components/alerts/AlertsView';
import { PreferencesForm } from '@/components/alerts/PreferencesForm';
import { Card, PageHeader } from '@/components/ui/primitives';
import { pageUser } from '@/lib/auth/page';
import { getAlertPreferences, listAlerts } from '@/lib/data/alerts';
import { morningBoard } from '@/lib/data/plans';
import { can } from '@/lib/auth/permissions';
import { OilTooColdBanner } from '@/components/board/OilTooColdBanner';
import { timeZoneNames } from '@/lib/time';

export const metadata: Metadata = { title: 'Alerts' };
export const dynamic = 'force-dynamic';

export default async function AlertsPage() {
  const user = await pageUser('org:read');
  const seesOrg = can(user.role, 'plans:manage');
  const [alerts, prefs, board] = await Promise.all([
    listAlerts({ orgId: user.orgId, userId: user.id }),
    getAlertPreferences({ orgId: user.orgId, userId: user.id, role: user.role }),
    // Managers and operators see every current too-cold warning of the organization, whether or not
    // the alert was addressed to them.
    seesOrg ? morningBoard({ orgId: user.orgId, refresh: 'never' }) : Promise.resolve(null),
  ]);
  const tooCold = board?.plans.filter((p) => p.status === 'short' || p.status === 'unplanned') ?? [];
  return (
    <>
      <PageHeader title="Alerts" subtitle="Oil-too-cold warnings, switch-on reminders and cold-night notices, newest first. Times are the airfield's own." />
      {seesOrg ? (
        tooCold.length ? (
          <OilTooColdBanner plans={tooCold} units={user.tempUnit} showPilot title="Current warnings for the organization" />
        ) : (
          <p className="mb-5 text-sm text-slate-600 dark:text-slate-400">No departure of the organization is predicted too cold for the next morning.</p>
        )
      ) : null}
      <div className="grid items-start gap-5 xl:grid-cols-[minmax(0,1fr)_22rem]">
        <AlertsView initial={alerts} unit={user.tempUnit} />
        <Card id="preferences" aria-labelledby="prefs-h" className="scroll-mt-20 xl:sticky xl:top-6">
          <h2 id="prefs-h" className="text-lg font-semibold text-slate-900 dark:text-white">Alert preferences</h2>
          <p className="mb-4 mt-1 text-sm text-slate-600 dark:text-slate-400">Every e-mail also carries a link to stop that kind of e-mail.</p>
          <PreferencesForm initial={prefs} zones={timeZoneNames()} />
        </Card>
      </div>
    </>
  );
}
