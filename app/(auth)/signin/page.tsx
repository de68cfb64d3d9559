import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { currentUserOrNull } from '@/lib/auth/guards';
import { HOME } from '@/lib/auth/permissions';
import { SignInForm } from './SignInForm';

export const metadata: Metadata = { title: 'Sign in' };
export const dynamic = 'force-dynamic';

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ next?: string; error?: string }> }) {
  const user = await currentUserOrNull();
  const { next, error } = await searchParams;
  if (user) redirect(HOME[user.role]);
  // Only same-site paths are followed after sign-in.
  const safeNext = next && next.startsWith('/') && !next.startsWith('//') ? next : undefined;
  return <SignInForm next={safeNext} initialError={error ? 'Sign-in failed. Check your e-mail and password.' : undefined} />;
}
