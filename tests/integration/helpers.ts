import os from 'node:os';
import path from 'node:path';
import fs from 'node:fs';
import { setClaims } from './session-stub';

/**
 * A fresh database for this test file, migrated and seeded with the demo scenario: a new SQLite file,
 * or with TEST_DATABASE_URL (npm run test:pg) a new PostgreSQL database on that server.
 * Call in beforeAll; models are imported after the environment points at the new database.
 */
export async function freshDatabase() {
  if (process.env.TEST_DATABASE_URL) {
    process.env.DATABASE_URL = await createPgDatabase(process.env.TEST_DATABASE_URL);
  } else {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'thawline-test-'));
    process.env.DATABASE_FILE = path.join(dir, 'test.sqlite');
    delete process.env.DATABASE_URL;
  }
  process.env.THAWLINE_JOBS = 'off';
  const { resetEnvCache } = await import('@/lib/env');
  resetEnvCache();
  const models = await import('@/models');
  await models.closeSequelize();
  await models.migrate();
  const { seedDemo } = await import('@/lib/seed/demo');
  await seedDemo();
  return models.db();
}

/** Creates an empty database named for this run and file on the server of `serverUrl`; returns its URL. */
export async function createPgDatabase(serverUrl: string): Promise<string> {
  const { Client } = await import('pg');
  const name = `${process.env.THAWLINE_TEST_DB_PREFIX ?? 'thawline_t'}_${process.pid}_${Math.random().toString(36).slice(2, 8)}`;
  const c = new Client({ connectionString: serverUrl });
  await c.connect();
  try {
    await c.query(`CREATE DATABASE "${name}"`);
  } finally {
    await c.end();
  }
  const u = new URL(serverUrl);
  u.pathname = `/${name}`;
  return u.toString();
}

export async function signInAs(email: string) {
  const { db } = await import('@/models');
  const u = await db().User.findOne({ where: { email } });
  if (!u) throw new Error(`no demo user ${email}`);
  setClaims({ userId: u.id, orgId: u.organizationId, role: u.role, sessionVersion: u.sessionVersion });
  return u;
}

export function signOut() {
  setClaims(null);
}

/** Any route handler: apiRoute()'s, next-auth's, a plain `GET(req)`. */
type RouteHandler = (req: Request, ctx: any) => Response | Promise<Response>;
/** The route parameters a handler reads (`{ id: string }` …), from its own signature. */
type ParamsOf<H> = [H] extends [never]
  ? Record<string, string>
  : H extends (req: Request, ctx: infer C) => unknown
    ? NonNullable<C> extends { params?: infer P }
      ? Awaited<P>
      : Record<string, string>
    : Record<string, string>;

export interface CallOptions<P> {
  method?: string;
  url?: string;
  body?: unknown;
  rawBody?: BodyInit;
  params?: P;
  headers?: Record<string, string | null>;
}

/**
 * Calls a route handler as Next.js would, and returns the status and the parsed JSON body. By default
 * the request looks like the app's own page calling its API (Origin http://localhost, Sec-Fetch-Site
 * same-origin, JSON); `headers` replaces any of them (a null value leaves that header out). Generic
 * over the handler: pass the route module's export as it is (no cast); `params` is typed from it.
 */
export async function call<H extends RouteHandler>(handler: H, opts: CallOptions<ParamsOf<H>> = {}) {
  const url = `http://localhost${opts.url ?? '/api/test'}`;
  const headers: Record<string, string> = {};
  const wanted: Record<string, string | null> = { 'content-type': 'application/json', origin: 'http://localhost', 'sec-fetch-site': 'same-origin', ...opts.headers };
  for (const [k, v] of Object.entries(wanted)) if (v !== null) headers[k] = v;
  const init: RequestInit & { duplex?: 'half' } = { method: opts.method ?? 'GET', headers };
  if (opts.rawBody !== undefined) init.body = opts.rawBody;
  else if (opts.body !== undefined) init.body = JSON.stringify(opts.body);
  if (init.body instanceof ReadableStream) init.duplex = 'half';
  const res = await handler(new Request(url, init), { params: Promise.resolve(opts.params ?? {}) });
  const text = await res.text();
  let json: any = null;
  try {
    json = JSON.parse(text);
  } catch {
    json = text;
  }
  return { status: res.status, body: json, text };
}

export const DEMO = {
  manager: 'manager@frostvale.test',
  operator: 'operator@frostvale.test',
  pilot: 'pilot@frostvale.test',
  otherManager: 'manager@ridgeway.test',
  password: 'thaw-demo-2026',
};
