import type { Role } from '@/lib/auth/permissions';
import 'next-auth';
import 'next-auth/jwt';

declare module 'next-auth' {
  interface Session {
    user: { id: number; role: Role; orgId: number; name?: string | null; email?: string | null };
  }
}

declare module 'next-auth/jwt' {
  interface JWT {
    uid: number;
    role: Role;
    orgId: number;
  }
}
