import { redirect } from 'next/navigation';
import { AppShell } from '@/components/shell/AppShell';
import { currentUserOrNull } from '@/lib/auth/guards';
import { getOrganization } from '@/lib/data/users';

export const dynamic = 'force-dynamic';

export default async function SignedInLayout({ children }: { children: React.ReactNode }) {
  const user = await currentUserOrNull();
  if (!user) redirect('/signin');
  const org = await getOrganization({ orgId: user.orgId });
  return (
    <AppShell user={user} orgName={org.name}>
      {children}
    </AppShell>
  );
}
