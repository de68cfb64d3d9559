import type { Role } from '@/lib/auth/permissions';
import 'next-auth';
import 'next-auth/jwt';

declare module 'next-auth' {
  interface Session {
    user: { id: number; role: Role; orgId: number; sessionVersion: number; name?: string | null; email?: string | null };
  }
}

declare module 'next-auth/jwt' {
  interface JWT {
    uid: number;
    role: Role;
    orgId: number;
    /** The user's session version at sign-in (users.sessionVersion); a mismatch ends the session. */
    sv: number;
  }
}
