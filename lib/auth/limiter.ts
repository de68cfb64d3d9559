import { RateLimiterMemory } from 'rate-limiter-flexible';
import { env } from '@/lib/env';

// Failed sign-ins are limited per account and per address over a 15-minute window. The counters are
// in memory (one app process); several instances would use one of the package's shared stores.
const g = globalThis as unknown as { __thawlineLimiters?: { account: RateLimiterMemory; address: RateLimiterMemory } };

function limiters() {
  if (!g.__thawlineLimiters) {
    const e = env();
    g.__thawlineLimiters = {
      account: new RateLimiterMemory({ keyPrefix: 'signin-account', points: e.SIGNIN_MAX_PER_ACCOUNT, duration: 15 * 60 }),
      address: new RateLimiterMemory({ keyPrefix: 'signin-address', points: e.SIGNIN_MAX_PER_ADDRESS, duration: 15 * 60 }),
    };
  }
  return g.__thawlineLimiters;
}

/** Seconds to wait before another attempt is allowed, or 0 when the caller may try now. */
export async function signInBlockedFor(account: string, address: string): Promise<number> {
  const l = limiters();
  const [a, b] = await Promise.all([l.account.get(account), l.address.get(address)]);
  const e = env();
  const waits = [
    a && a.consumedPoints >= e.SIGNIN_MAX_PER_ACCOUNT ? a.msBeforeNext : 0,
    b && b.consumedPoints >= e.SIGNIN_MAX_PER_ADDRESS ? b.msBeforeNext : 0,
  ];
  return Math.ceil(Math.max(...waits) / 1000);
}

export async function recordFailedSignIn(account: string, address: string) {
  const l = limiters();
  await Promise.all([l.account.penalty(account, 1), l.address.penalty(address, 1)]);
}

export async function clearFailedSignIns(account: string) {
  await limiters().account.delete(account);
}
