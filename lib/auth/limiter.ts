import { RateLimiterMemory, RateLimiterPostgres, type RateLimiterAbstract } from 'rate-limiter-flexible';
import { env } from '@/lib/env';
import { getSequelize } from '@/models/db';
import { Invalid, TooManyRequests } from '@/lib/api/errors';
import { clientAddress } from './client-address';

// Limits on guessing, none of which one caller can turn against everyone:
// - sign-in, per account: the first SIGNIN_MAX_PER_ACCOUNT failures within a day cost nothing; each
//   further one makes the account wait twice as long as the last (1 s, 2 s, 4 s … at most 60 s) before
//   any password is checked again, from every address. The right password from a new address waits at
//   most a minute: the account is slowed, never locked out.
// - sign-in, per address: SIGNIN_MAX_PER_ADDRESS failures within 15 minutes block that address only.
// - token links (invitation, reset, calendar feed): misses per address within 15 minutes; reset requests
//   per address. The address is the connection's (lib/auth/client-address.ts); when it cannot be known
//   the per-address limits are skipped rather than shared by every such caller.
// Counters live in memory for the embedded SQLite set-up (one process); with DATABASE_URL on PostgreSQL
// every instance counts in one table (rate_limits) of the shared database.

export const ACCOUNT_WINDOW_S = 24 * 3600;
export const ADDRESS_WINDOW_S = 15 * 60;
export const MAX_DELAY_S = 60;
export const TOKEN_MISSES_PER_ADDRESS = 30;
export const RESET_REQUESTS_PER_ADDRESS = 10;

/** The part of a rate-limiter-flexible limiter used here. */
type Limiter = Pick<RateLimiterAbstract, 'get' | 'penalty' | 'block' | 'delete'>;
interface Limiters {
  accountFailures: Limiter;
  accountDelay: Limiter;
  addressFailures: Limiter;
  tokenMisses: Limiter;
  resetRequests: Limiter;
}

const g = globalThis as unknown as { __thawlineLimiters?: Limiters };

/**
 * One counter. On PostgreSQL the package creates its table (CREATE TABLE IF NOT EXISTS rate_limits) when
 * constructed and refuses calls until that is done, so every call waits for it.
 */
function make(keyPrefix: string, points: number, duration: number): Limiter {
  const e = env();
  // The table comes from migration 008-rate-limits (tableCreated): the store's own creation at first use
  // raced between instances starting together; waiting on `ready` stays for a store that is not ready.
  if (!(e.DATABASE_URL && getSequelize().getDialect() === 'postgres')) return new RateLimiterMemory({ keyPrefix, points, duration });
  let limiter: RateLimiterPostgres | undefined;
  const ready = new Promise<RateLimiterPostgres>((resolve, reject) => {
    limiter = new RateLimiterPostgres({ storeClient: getSequelize(), storeType: 'sequelize', tableName: 'rate_limits', tableCreated: true, keyPrefix, points, duration }, (err?: unknown) =>
      // With tableCreated the store calls back inside its constructor, before `limiter` is assigned.
      err ? reject(err) : queueMicrotask(() => resolve(limiter!)),
    );
  });
  ready.catch(() => {});
  return {
    get: async (key: string) => (await ready).get(key),
    penalty: async (key: string, n?: number) => (await ready).penalty(key, n),
    block: async (key: string, secs: number) => (await ready).block(key, secs),
    delete: async (key: string) => (await ready).delete(key),
  };
}

function limiters(): Limiters {
  if (!g.__thawlineLimiters) {
    const e = env();
    g.__thawlineLimiters = {
      accountFailures: make('signin-account', 1_000_000, ACCOUNT_WINDOW_S),
      // Only block() is used: a blocked key is the account's current delay.
      accountDelay: make('signin-delay', 1, MAX_DELAY_S),
      addressFailures: make('signin-address', e.SIGNIN_MAX_PER_ADDRESS, ADDRESS_WINDOW_S),
      tokenMisses: make('token-miss', TOKEN_MISSES_PER_ADDRESS, ADDRESS_WINDOW_S),
      resetRequests: make('reset-request', RESET_REQUESTS_PER_ADDRESS, ADDRESS_WINDOW_S),
    };
  }
  return g.__thawlineLimiters;
}

/** For tests: forget every counter. */
export function resetLimiters() {
  g.__thawlineLimiters = undefined;
}

/** The delay after the n-th failure on one account: 0 for the free ones, then 1, 2, 4 … MAX_DELAY_S seconds. */
export function delayAfterFailures(n: number, free: number = env().SIGNIN_MAX_PER_ACCOUNT): number {
  if (n < free) return 0;
  return Math.min(MAX_DELAY_S, 2 ** (n - free));
}

async function blockedMs(l: Limiter, key: string, limit: number): Promise<number> {
  const r = await l.get(key);
  return r && r.consumedPoints >= limit ? r.msBeforeNext : 0;
}

/** Seconds to wait before another attempt is allowed, or 0 when the caller may try now. */
export async function signInBlockedFor(account: string, address: string | null): Promise<number> {
  const l = limiters();
  const e = env();
  const waits = [await blockedMs(l.accountDelay, account, 1)];
  if (address) waits.push(await blockedMs(l.addressFailures, address, e.SIGNIN_MAX_PER_ADDRESS));
  return Math.ceil(Math.max(...waits) / 1000);
}

export async function recordFailedSignIn(account: string, address: string | null) {
  const l = limiters();
  const r = await l.accountFailures.penalty(account, 1);
  const delay = delayAfterFailures(r.consumedPoints);
  if (delay > 0) await l.accountDelay.block(account, delay);
  if (address) await l.addressFailures.penalty(address, 1);
}

export async function clearFailedSignIns(account: string) {
  const l = limiters();
  await Promise.all([l.accountFailures.delete(account), l.accountDelay.delete(account)]);
}

/** Refuses (429) a caller whose address has missed too many token links lately. */
export async function assertTokenAttemptsLeft(req: { headers: Pick<Headers, 'get'> }) {
  const address = clientAddress(req.headers);
  if (!address) return;
  const ms = await blockedMs(limiters().tokenMisses, address, TOKEN_MISSES_PER_ADDRESS);
  if (ms > 0) throw new TooManyRequests(Math.ceil(ms / 1000));
}

/** Counts a token link that matched nothing usable (unknown, used, expired). */
export async function recordTokenMiss(req: { headers: Pick<Headers, 'get'> }) {
  const address = clientAddress(req.headers);
  if (address) await limiters().tokenMisses.penalty(address, 1);
}

/** Counts a reset request from this address; over the limit, 429. */
export async function consumeResetRequest(req: Request) {
  const address = clientAddress(req.headers);
  if (!address) return;
  const l = limiters().resetRequests;
  const r = await l.penalty(address, 1);
  if (r.consumedPoints > RESET_REQUESTS_PER_ADDRESS) throw new TooManyRequests(Math.ceil(r.msBeforeNext / 1000));
}

/**
 * For the invitation and reset pages, which look a token up to show its form: null when the address
 * may look, else the seconds to wait. A token that matches nothing is counted by the caller.
 */
export async function tokenPageWait(h: Pick<Headers, 'get'>): Promise<number> {
  try {
    await assertTokenAttemptsLeft({ headers: h });
    return 0;
  } catch (err) {
    if (err instanceof TooManyRequests) return err.retryAfterSeconds;
    throw err;
  }
}

/**
 * Runs a single-use token's action under the per-address miss limit: refused (429) once the address
 * has missed too often, and a miss (a 422 on the field "token") is counted.
 */
export async function limitTokenUse<T>(req: Request, use: () => Promise<T>): Promise<T> {
  await assertTokenAttemptsLeft(req);
  try {
    return await use();
  } catch (err) {
    if (err instanceof Invalid && err.fields?.some((f) => f.field === 'token')) await recordTokenMiss(req);
    throw err;
  }
}
