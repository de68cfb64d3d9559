import 'server-only';
import { NextResponse } from 'next/server';
import type { ZodType } from 'zod';
import { requireUser, assertCan, type CurrentUser } from '@/lib/auth/guards';
import type { Permission } from '@/lib/auth/permissions';
import { Invalid, TooLarge, toErrorResponse } from './errors';

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
  /** Largest accepted body (default 2 MiB). */
  maxBodyBytes?: number;
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
      return NextResponse.json(body, { status });
    }
  };
}

export async function readJson(req: Request, maxBytes = MAX_BODY_BYTES): Promise<unknown> {
  const len = Number(req.headers.get('content-length') ?? 0);
  if (len > maxBytes) throw new TooLarge();
  const text = await req.text();
  if (text.length > maxBytes) throw new TooLarge();
  if (!text.trim()) throw new Invalid([{ field: '(body)', message: 'Send a JSON body.' }]);
  try {
    return JSON.parse(text);
  } catch {
    throw new Invalid([{ field: '(body)', message: 'The body is not valid JSON.' }]);
  }
}

/** A positive integer id from a route parameter; anything else is a 404 (not a 422: ids are not user input). */
export function idParam(params: Params, name = 'id'): number {
  const raw = params[name];
  const n = typeof raw === 'string' && /^[0-9]{1,12}$/.test(raw) ? Number(raw) : NaN;
  if (!Number.isSafeInteger(n) || n <= 0) return -1;
  return n;
}
