import type { Metadata } from 'next';
import { inspectToken, TOKEN_PROBLEM_MESSAGE } from '@/lib/data/tokens';
import { TOKEN_RE } from '@/lib/validation/tokens';
import { NewPasswordForm, TokenProblem } from '../NewPasswordForm';

// The token is in the path: the page sends no Referer anywhere, so it never leaves this site.
export const metadata: Metadata = { title: 'Choose a new password', referrer: 'no-referrer', robots: { index: false } };
export const dynamic = 'force-dynamic';

export default async function ResetPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const t = TOKEN_RE.test(token) ? await inspectToken({ token, purpose: 'reset' }) : ({ ok: false, problem: 'invalid' } as const);
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
