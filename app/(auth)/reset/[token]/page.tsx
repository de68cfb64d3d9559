import type { Metadata } from 'next';
import { headers } from 'next/headers';
import { recordTokenMiss, tokenPageWait } from '@/lib/auth/limiter';
import { inspectToken, TOKEN_PROBLEM_MESSAGE } from '@/lib/data/tokens';
import { TOKEN_RE } from '@/lib/validation/tokens';
import { NewPasswordForm, TokenProblem } from '../NewPasswordForm';

// The token is in the path: the page sends no Referer anywhere, so it never leaves this site.
export const metadata: Metadata = { title: 'Choose a new password', referrer: 'no-referrer', robots: { index: false } };
export const dynamic = 'force-dynamic';

export default async function ResetPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  // Token look-ups count against the address like the token routes (lib/auth/limiter.ts).
  const h = await headers();
  const wait = await tokenPageWait(h);
  if (wait > 0) {
    const minutes = Math.max(1, Math.ceil(wait / 60));
    return <TokenProblem title="Reset link" message={`Too many links were tried from this address. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`} action={{ href: '/forgot', label: 'Ask for a new link' }} />;
  }
  const t = TOKEN_RE.test(token) ? await inspectToken({ token, purpose: 'reset' }) : ({ ok: false, problem: 'invalid' } as const);
  if (!t.ok) await recordTokenMiss({ headers: h });
  if (!t.ok) return <TokenProblem title="Reset link" message={TOKEN_PROBLEM_MESSAGE.reset[t.problem]} action={{ href: '/forgot', label: 'Ask for a new link' }} />;
  return (
    <NewPasswordForm
      token={token}
      endpoint="/api/tokens/reset"
      email={t.user.email}
      title="Choose a new password"
      intro="The link works once. Your old password stops working when you save."
      submitLabel="Save and sign in"
    />
  );
}
