import 'server-only';
import { NextResponse } from 'next/server';
import type { ZodType } from 'zod';
import { requireUser, assertCan, type CurrentUser } from '@/lib/auth/guards';
import type { Permission } from '@/lib/auth/permissions';
import { Forbidden, Invalid, TooLarge, TooManyRequests, UnsupportedMediaType, toErrorResponse } from './errors';

const MAX_BODY_BYTES = 2 * 1024 * 1024;

type Params = Record<string, string | string[] | undefined>;

export interface RouteContext<B, Q> {
  req: Request;
  user: CurrentUser;
  body: B;
  query: Q;
  params: Params;
}

interface RouteOptions<B, Q> {
  /** Coarse permission checked right after the session. Record-level checks happen in the handler. */
  permission?: Permission;
  body?: ZodType<B>;
  query?: ZodType<Q>;
  /** Public routes (health) skip the session. */
  public?: boolean;
  /** Answer 201 instead of 200 (routes that create a record). */
  created?: boolean;
  /** Largest accepted body in bytes (default 2 MiB), for every method; an upload route sets its own. */
  maxBodyBytes?: number;
  /** The 413 message for this route (an upload names its limit and what to do). */
  tooLargeMessage?: string;
}

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Cross-site request refusal for state-changing methods. A browser names where a request comes from in
 * Origin (every cross-origin request, and same-origin POST/PATCH/PUT/DELETE) and Sec-Fetch-Site; a
 * request carrying either must come from our own origin. A request with neither (curl, scripts, the
 * tests' direct calls) is not a browser acting for someone else and passes; it still needs the session.
 * next-auth's own routes keep next-auth's CSRF token.
 */
export function assertSameOrigin(req: Request) {
  if (SAFE_METHODS.has(req.method.toUpperCase())) return;
  const site = req.headers.get('sec-fetch-site');
  const origin = req.headers.get('origin');
  if (site !== null && site !== 'same-origin' && site !== 'none') throw new Forbidden('Cross-site requests are refused.');
  if (origin !== null && origin !== requestOrigin(req)) throw new Forbidden('Cross-site requests are refused.');
}

/** The origin the request was addressed to (Next.js builds req.url from the Host and the scheme). */
function requestOrigin(req: Request): string {
  const u = new URL(req.url);
  const host = req.headers.get('x-forwarded-host') ?? req.headers.get('host') ?? u.host;
  const proto = req.headers.get('x-forwarded-proto') ?? u.protocol.replace(/:$/, '');
  return `${proto.split(',')[0].trim()}://${host.split(',')[0].trim()}`;
}

/** A declared Content-Length over the limit is refused before anything is read, on every route. */
function assertDeclaredLength(req: Request, maxBytes: number, message?: string) {
  const declared = req.headers.get('content-length');
  if (declared !== null && Number(declared) > maxBytes) throw new TooLarge(message);
}

/**
 * Every JSON route handler runs through here, in one order: session → permission → parse input
 * (body and query, zod) → the handler loads records scoped to user.orgId and checks ownership → act.
 * Any thrown error becomes a status and a JSON body by toErrorResponse; nothing else leaks.
 */
export function apiRoute<B = undefined, Q = undefined>(
  opts: RouteOptions<B, Q>,
  handler: (ctx: RouteContext<B, Q>) => Promise<unknown>,
) {
  return async (req: Request, ctx?: { params?: Promise<Params> | Params }) => {
    try {
      assertSameOrigin(req);
      assertDeclaredLength(req, opts.maxBodyBytes ?? MAX_BODY_BYTES, opts.tooLargeMessage);
      const user = opts.public ? (null as unknown as CurrentUser) : await requireUser();
      if (opts.permission) assertCan(user, opts.permission);
      const params = (await ctx?.params) ?? {};
      const query = opts.query
        ? opts.query.parse(Object.fromEntries(new URL(req.url).searchParams.entries()))
        : (undefined as Q);
      const body = opts.body ? opts.body.parse(await readJson(req, opts.maxBodyBytes)) : (undefined as B);
      const result = await handler({ req, user, body, query, params });
      if (result instanceof Response) return result;
      return NextResponse.json(result ?? { ok: true }, { status: opts.created ? 201 : 200 });
    } catch (err) {
      const { status, body } = toErrorResponse(err);
      const headers = err instanceof TooManyRequests ? { 'retry-after': String(err.retryAfterSeconds) } : undefined;
      return NextResponse.json(body, { status, headers });
    }
  };
}

/**
 * The JSON body: Content-Type application/json (else 415), at most maxBytes bytes as counted on the wire
 * (else 413, reading stops there), UTF-8, parsed.
 */
export async function readJson(req: Request, maxBytes = MAX_BODY_BYTES): Promise<unknown> {
  const type = (req.headers.get('content-type') ?? '').split(';')[0].trim().toLowerCase();
  if (type !== 'application/json') throw new UnsupportedMediaType();
  assertDeclaredLength(req, maxBytes);
  const bytes = await readBytes(req, maxBytes);
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    throw new Invalid([{ field: '(body)', message: 'The body is not valid UTF-8.' }]);
  }
  if (!text.trim()) throw new Invalid([{ field: '(body)', message: 'Send a JSON body.' }]);
  try {
    return JSON.parse(text);
  } catch {
    throw new Invalid([{ field: '(body)', message: 'The body is not valid JSON.' }]);
  }
}

/** The body's bytes, refused with 413 as soon as they pass maxBytes (a body without Content-Length too). */
async function readBytes(req: Request, maxBytes: number): Promise<Uint8Array> {
  if (!req.body) return new Uint8Array(0);
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      total += value.byteLength;
      if (total > maxBytes) {
        await reader.cancel().catch(() => {});
        throw new TooLarge();
      }
      chunks.push(value);
    }
  } finally {
    reader.releaseLock();
  }
  const out = new Uint8Array(total);
  let at = 0;
  for (const c of chunks) {
    out.set(c, at);
    at += c.byteLength;
  }
  return out;
}

/** A positive integer id from a route parameter; anything else is a 404 (not a 422: ids are not user input). */
export function idParam(params: Params, name = 'id'): number {
  const raw = params[name];
  const n = typeof raw === 'string' && /^[0-9]{1,12}$/.test(raw) ? Number(raw) : NaN;
  if (!Number.isSafeInteger(n) || n <= 0) return -1;
  return n;
}
