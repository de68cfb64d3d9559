import 'server-only';
import { getServerSession } from 'next-auth';
import { authOptions } from './options';
import type { Role } from './permissions';

export interface SessionClaims {
  userId: number;
  orgId: number;
  role: Role;
  /** The user's session version when this session was issued (undefined in sessions from before it existed). */
  sessionVersion: number | undefined;
}

/** The signed session's claims, or null. The only place that reads the session cookie (tests replace it). */
export async function readSession(): Promise<SessionClaims | null> {
  const s = await getServerSession(authOptions);
  if (!s?.user?.id) return null;
  return { userId: s.user.id, orgId: s.user.orgId, role: s.user.role, sessionVersion: s.user.sessionVersion };
}
