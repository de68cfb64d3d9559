import { redirect } from 'next/navigation';
import { currentUserOrNull } from '@/lib/auth/guards';
import { HOME } from '@/lib/auth/permissions';

export const dynamic = 'force-dynamic';

export default async function Root() {
  const user = await currentUserOrNull();
  redirect(user ? HOME[user.role] : '/signin');
}
