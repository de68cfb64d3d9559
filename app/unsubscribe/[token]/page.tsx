import type { Metadata } from 'next';
import { Card } from '@/components/ui/primitives';
import { buttonClass } from '@/components/ui/primitives';
import { unsubscribeState } from '@/lib/data/alerts';
import { verifyUnsubscribe, type UnsubscribeKind } from '@/lib/mail/links';

export const metadata: Metadata = { title: 'E-mail preferences', referrer: 'no-referrer', robots: { index: false } };
export const dynamic = 'force-dynamic';

const WHAT: Record<UnsubscribeKind, string> = {
  'oil-too-cold': 'oil-too-cold warnings',
  'switch-on': 'switch-on reminders',
  'cold-night': 'cold-night notices',
  all: 'alert e-mails',
};

// A mail scanner that follows the link changes nothing: one click on the button (a POST) does, as
// does a mail program's one-click request (RFC 8058) to …/one-click.
export default async function UnsubscribePage({ params, searchParams }: { params: Promise<{ token: string }>; searchParams: Promise<{ done?: string }> }) {
  const { token } = await params;
  const { done } = await searchParams;
  const v = verifyUnsubscribe(token);
  const state = v ? await unsubscribeState(v) : null;
  if (!v || !state) {
    return (
      <Card className="p-6">
        <h1 className="text-xl font-semibold text-slate-900 dark:text-white">This link does not work</h1>
        <p role="alert" className="mt-2 text-sm text-slate-700 dark:text-slate-300">
          The unsubscribe link is damaged or its account is closed. Sign in and change your alert preferences instead.
        </p>
        <a href="/alerts#preferences" className={buttonClass('primary', 'mt-5 w-full')}>Sign in to your preferences</a>
      </Card>
    );
  }
  const what = WHAT[v.kind];
  if (done || !state.on) {
    return (
      <Card className="p-6">
        <h1 className="text-xl font-semibold text-slate-900 dark:text-white">No more {what} by e-mail</h1>
        <p role="status" className="mt-2 text-sm text-slate-700 dark:text-slate-300">
          {state.name}, you will not get {what} by e-mail any more.
          {v.kind !== 'all' ? ' They still appear on your alerts page in Thawline.' : ' Alerts still appear in Thawline.'}
        </p>
        <p className="mt-3 text-sm text-slate-600 dark:text-slate-400">Changed your mind? Turn them on again in your alert preferences.</p>
        <a href="/alerts#preferences" className={buttonClass('secondary', 'mt-5 w-full')}>Alert preferences</a>
      </Card>
    );
  }
  return (
    <Card className="p-6">
      <h1 className="text-xl font-semibold text-slate-900 dark:text-white">Stop {what} by e-mail?</h1>
      <p className="mt-2 text-sm text-slate-700 dark:text-slate-300">
        {state.name}, one click and Thawline stops sending you {what} by e-mail.
        {v.kind === 'oil-too-cold' ? ' The warning itself stays on your alerts page: an engine too cold to fly is worth knowing.' : ' They stay on your alerts page.'}
      </p>
      <form method="post" action={`/unsubscribe/${token}/one-click`} className="mt-5">
        <input type="hidden" name="source" value="page" />
        <button type="submit" className={buttonClass('primary', 'w-full')}>Stop {what} by e-mail</button>
      </form>
    </Card>
  );
}
