// Shared test set-up.
import { vi } from 'vitest';

// 'server-only' throws outside a React Server Component bundle.
vi.mock('server-only', () => ({}));

// Route handlers read the session through lib/auth/session; tests choose who is signed in (or nobody)
// with signInAs()/signOut() from tests/integration/helpers.ts. Everything after reading the claims
// (user lookup, active flag, role, organization) runs for real.
vi.mock('@/lib/auth/session', async () => {
  const stub = await import('./integration/session-stub');
  return { readSession: async () => stub.currentClaims() };
});
