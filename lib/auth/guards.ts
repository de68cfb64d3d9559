import 'server-only';
import { db } from '@/models';
import { Forbidden, Unauthenticated } from '@/lib/api/errors';
import { readSession } from './session';
import { can, type Permission, type Role } from './permissions';

export interface CurrentUser {
  id: number;
  orgId: number;
  role: Role;
  email: string;
  name: string;
  tempUnit: 'C' | 'F';
  volumeUnit: 'L' | 'qt';
  mustChangePassword: boolean;
}

/**
 * The signed-in user, re-read from the database on every request so that a deactivation or a role change
 * takes effect at once. Throws Unauthenticated when there is no valid session, including a signed one
 * whose session version is no longer the user's (signed out, password changed or reset, role changed,
 * deactivated or reactivated since it was issued).
 */
export async function requireUser(): Promise<CurrentUser> {
  const claims = await readSession();
  if (!claims) throw new Unauthenticated();
  const { User } = db();
  const u = await User.findByPk(claims.userId);
  if (!u || !u.active || u.organizationId !== claims.orgId || claims.sessionVersion !== u.sessionVersion) throw new Unauthenticated('Your session has ended. Sign in again.');
  return {
    id: u.id,
    orgId: u.organizationId,
    role: u.role,
    email: u.email,
    name: u.name,
    tempUnit: u.tempUnit,
    volumeUnit: u.volumeUnit,
    mustChangePassword: u.mustChangePassword,
  };
}

export function assertCan(user: Pick<CurrentUser, 'role'>, permission: Permission) {
  if (!can(user.role, permission)) throw new Forbidden();
}

/** For server components: the user or null (no throw). */
export async function currentUserOrNull(): Promise<CurrentUser | null> {
  try {
    return await requireUser();
  } catch {
    return null;
  }
}
