// Write transactions that wait, never fail. Every transactional write goes through writeTransaction():
// - SQLite: `BEGIN IMMEDIATE`, so the write lock is taken at the start (a deferred transaction that reads
//   first and upgrades to write later fails with SQLITE_BUSY in WAL mode instead of waiting). Within one
//   process the write transactions also queue behind each other, so they never hold the
//   libuv threads waiting on one another's lock.
// - PostgreSQL: a plain transaction; row locks (`lock: transaction.LOCK.UPDATE`) serialise conflicts.
// - On both: a bounded retry with jitter when the database reports busy/locked (SQLite) or a
//   serialization failure or deadlock (PostgreSQL 40001, 40P01); a unique violation only when the
//   caller asks (`retryOnUnique`: the retry then finds the row the other writer stored).
// A writeTransaction() called inside another joins it (same transaction, no new lock, no retry of its own).
// Single writes outside any transaction queue and retry the same way on SQLite (guardWrites below).
import { AsyncLocalStorage } from 'node:async_hooks';
import { Transaction, type Sequelize } from 'sequelize';
import { getSequelize } from './db';

export interface WriteOptions {
  /** Retry on a unique-key violation too (the caller's re-run finds what the other writer stored). */
  retryOnUnique?: boolean;
  /** Attempts in all, the first included (default 8). */
  attempts?: number;
  /** Run inside this transaction instead (no new transaction, no retry). */
  transaction?: Transaction | null;
  sequelize?: Sequelize;
}

const SQLITE_RETRY = new Set(['SQLITE_BUSY', 'SQLITE_LOCKED']);
const PG_RETRY = new Set(['40001', '40P01']);
const DEFAULT_ATTEMPTS = 8;
const BASE_DELAY_MS = 20;
const MAX_DELAY_MS = 1_000;

const current = new AsyncLocalStorage<Transaction>();

/** The code a driver gave the error (Sequelize wraps it in `parent`/`original`). */
export function errorCode(err: unknown): string | undefined {
  const e = err as { code?: unknown; parent?: { code?: unknown }; original?: { code?: unknown } } | null;
  const code = e?.parent?.code ?? e?.original?.code ?? e?.code;
  return typeof code === 'string' ? code : undefined;
}

/** Whether the error is the database asking us to try again (busy, locked, serialization, deadlock). */
export function isRetryableWriteError(err: unknown, { retryOnUnique = false } = {}): boolean {
  const code = errorCode(err);
  if (code && (SQLITE_RETRY.has(code) || PG_RETRY.has(code))) return true;
  const name = (err as { name?: string } | null)?.name;
  // Sequelize maps SQLITE_BUSY to a TimeoutError; the message names the code.
  if (name === 'SequelizeTimeoutError') return true;
  const message = String((err as { message?: unknown } | null)?.message ?? '');
  if (/SQLITE_(BUSY|LOCKED)|database is locked/.test(message)) return true;
  return retryOnUnique && name === 'SequelizeUniqueConstraintError';
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Full jitter on an exponential step: 0 … min(cap, base·2^n). */
function backoff(attempt: number): number {
  return Math.random() * Math.min(MAX_DELAY_MS, BASE_DELAY_MS * 2 ** attempt);
}

// One queue per Sequelize instance for SQLite writers in this process.
const queues = new WeakMap<Sequelize, Promise<unknown>>();

async function queued<T>(s: Sequelize, fn: () => Promise<T>): Promise<T> {
  const prev = queues.get(s) ?? Promise.resolve();
  let release!: () => void;
  const mine = new Promise<void>((r) => (release = r));
  const tail = prev.then(() => mine);
  queues.set(s, tail);
  await prev;
  try {
    return await fn();
  } finally {
    release();
    if (queues.get(s) === tail) queues.delete(s);
  }
}

/**
 * Runs `fn` in a write transaction (see the top of this file), retrying the whole of `fn` on a busy or
 * serialization error. `fn` must do nothing outside the database that cannot be repeated.
 */
export async function writeTransaction<T>(fn: (transaction: Transaction) => Promise<T>, opts: WriteOptions = {}): Promise<T> {
  const outer = opts.transaction ?? live(current.getStore());
  if (outer) return fn(outer);
  const s = opts.sequelize ?? getSequelize();
  guardWrites(s);
  const sqlite = s.getDialect() === 'sqlite';
  const once = () => s.transaction(sqlite ? { type: Transaction.TYPES.IMMEDIATE } : {}, (t) => current.run(t, () => fn(t)));
  return withRetry(() => (sqlite ? queued(s, once) : once()), opts);
}

async function withRetry<T>(fn: () => Promise<T>, opts: { attempts?: number; retryOnUnique?: boolean }): Promise<T> {
  const attempts = Math.max(1, opts.attempts ?? DEFAULT_ATTEMPTS);
  for (let attempt = 0; ; attempt++) {
    try {
      return await fn();
    } catch (err) {
      if (attempt + 1 >= attempts || !isRetryableWriteError(err, opts)) throw err;
      await sleep(backoff(attempt));
    }
  }
}

/** The transaction of the surrounding writeTransaction(), unless it has already ended. */
function live(t: Transaction | undefined): Transaction | undefined {
  return t && !(t as unknown as { finished?: string }).finished ? t : undefined;
}

const WRITE_TYPES = new Set(['INSERT', 'UPDATE', 'BULKUPDATE', 'BULKDELETE', 'DELETE', 'UPSERT']);
const WRITE_SQL = /^\s*(INSERT|UPDATE|DELETE|REPLACE)\b/i;
const guarded = new WeakSet<Sequelize>();

/**
 * Every dialect: a query issued inside a writeTransaction() without its `transaction` runs in that
 * transaction (on SQLite it would wait on the lock the transaction itself holds; on PostgreSQL it would
 * need a second pool connection, and a full pool of such transactions would wait on each other).
 * SQLite only: every query outside a transaction that writes (a model's create, update, destroy, a raw
 * INSERT …) joins the same in-process queue as the write transactions and is retried on busy.
 * Called by db(); safe to call again.
 */
export function guardWrites(s: Sequelize) {
  if (guarded.has(s)) return;
  guarded.add(s);
  const sqlite = s.getDialect() === 'sqlite';
  const query = s.query.bind(s) as (sql: unknown, options?: Record<string, unknown>) => Promise<unknown>;
  (s as unknown as { query: typeof query }).query = (sql, options) => {
    const o = options ?? {};
    if (o.transaction) return query(sql, o);
    const t = live(current.getStore());
    if (t) return query(sql, { ...o, transaction: t });
    if (!sqlite) return query(sql, o);
    const text = typeof sql === 'string' ? sql : String((sql as { query?: unknown } | null)?.query ?? '');
    const writes = WRITE_TYPES.has(String(o.type ?? '')) || WRITE_SQL.test(text);
    if (!writes) return query(sql, o);
    return withRetry(() => queued(s, () => query(sql, o)), {});
  };
}
