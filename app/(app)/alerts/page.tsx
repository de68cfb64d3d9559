import type { Metadata } from 'next';
import { AlertsView } from '@/components/alerts/AlertsView';
import { PreferencesForm } from '@/components/alerts/PreferencesForm';
import { Card, PageHeader } from '@/components/ui/primitives';
import { pageUser } from '@/lib/auth/page';
import { getAlertPreferences, listAlerts } from '@/lib/data/alerts';
import { timeZoneNames } from '@/lib/time';

export const metadata: Metadata = { title: 'Alerts' };
export const dynamic = 'force-dynamic';

export default async function AlertsPage() {
  const user = await pageUser('org:read');
  const [alerts, prefs] = await Promise.all([listAlerts({ orgId: user.orgId, userId: user.id }), getAlertPreferences({ orgId: user.orgId, userId: user.id, role: user.role })]);
  return (
    <>
      <PageHeader title="Alerts" subtitle="Oil-too-cold warnings, switch-on reminders and cold-night notices, newest first. Times are the airfield's own." />
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
