import type { Metadata } from 'next';
import { headers } from 'next/headers';
import { recordTokenMiss, tokenPageWait } from '@/lib/auth/limiter';
import { inspectToken, TOKEN_PROBLEM_MESSAGE } from '@/lib/data/tokens';
import { TOKEN_RE } from '@/lib/validation/tokens';
import { NewPasswordForm, TokenProblem } from '../../reset/NewPasswordForm';

// The token is in the path: the page sends no Referer anywhere, so it never leaves this site.
export const metadata: Metadata = { title: 'Accept your invitation', referrer: 'no-referrer', robots: { index: false } };
export const dynamic = 'force-dynamic';

export default async function InvitePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  // Token look-ups count against the address like the token routes (lib/auth/limiter.ts).
  const h = await headers();
  const wait = await tokenPageWait(h);
  if (wait > 0) {
    const minutes = Math.max(1, Math.ceil(wait / 60));
    return <TokenProblem title="Invitation" message={`Too many links were tried from this address. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`} action={{ href: '/signin', label: 'Go to sign-in' }} />;
  }
  const t = TOKEN_RE.test(token) ? await inspectToken({ token, purpose: 'invite' }) : ({ ok: false, problem: 'invalid' } as const);
  if (!t.ok) await recordTokenMiss({ headers: h });
  if (!t.ok) return <TokenProblem title="Invitation" message={TOKEN_PROBLEM_MESSAGE.invite[t.problem]} action={{ href: '/signin', label: 'Go to sign-in' }} />;
  return (
    <NewPasswordForm
      token={token}
      endpoint="/api/tokens/invite"
      email={t.user.email}
      askName={t.user.name}
      title="Welcome to Thawline"
      intro="Check your name and choose a password to finish setting up your account. The invitation works once."
      submitLabel="Create my account"
    />
  );
}
