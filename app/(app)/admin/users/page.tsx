import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/primitives';
import { pageUser } from '@/lib/auth/page';
import { listUsers } from '@/lib/data/users';
import { UsersAdmin } from './UsersAdmin';

export const metadata: Metadata = { title: 'Users' };

export default async function UsersPage() {
  const user = await pageUser('users:manage');
  const users = await listUsers({ orgId: user.orgId });
  return (
    <>
      <PageHeader title="Users" subtitle="Who may sign in to your organization, and in which role." />
      <UsersAdmin initial={users} selfId={user.id} />
    </>
  );
}
