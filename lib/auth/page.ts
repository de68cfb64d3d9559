import 'server-only';
import { forbidden, redirect } from 'next/navigation';
import { currentUserOrNull, type CurrentUser } from './guards';
import { can, type Permission } from './permissions';

/** For pages: the signed-in user holding the permission; signed out → sign-in, lacking it → the 403 page. */
export async function pageUser(permission: Permission = 'org:read'): Promise<CurrentUser> {
  const user = await currentUserOrNull();
  if (!user) redirect('/signin');
  if (!can(user.role, permission)) forbidden();
  return user;
}
