import type { Metadata } from 'next';
import { inspectToken, TOKEN_PROBLEM_MESSAGE } from '@/lib/data/tokens';
import { TOKEN_RE } from '@/lib/validation/tokens';
import { NewPasswordForm, TokenProblem } from '../../reset/NewPasswordForm';

// The token is in the path: the page sends no Referer anywhere, so it never leaves this site.
export const metadata: Metadata = { title: 'Accept your invitation', referrer: 'no-referrer', robots: { index: false } };
export const dynamic = 'force-dynamic';

export default async function InvitePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const t = TOKEN_RE.test(token) ? await inspectToken({ token, purpose: 'invite' }) : ({ ok: false, problem: 'invalid' } as const);
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
