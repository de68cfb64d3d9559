// Links in e-mails: absolute URLs on the public base, and the signed unsubscribe link. The base is
// NEXTAUTH_URL when set, else the origin this server listens on (http://localhost:$PORT; `next start`
// puts the port it serves on into PORT). Never a request's Host header: anyone can send a reset request
// with a forged Host and would then choose where the victim's reset link points.
// The only secrets that appear in a URL are the single-use tokens (invitation, reset) and the
// unsubscribe signature, which can do nothing but turn one kind of alert e-mail off.
import crypto from 'node:crypto';
import { env } from '@/lib/env';

export type UnsubscribeKind = 'oil-too-cold' | 'switch-on' | 'cold-night' | 'all';
const KINDS: readonly UnsubscribeKind[] = ['oil-too-cold', 'switch-on', 'cold-night', 'all'];

export function baseUrl(): string {
  const e = env();
  return (e.NEXTAUTH_URL ?? `http://localhost:${e.PORT}`).replace(/\/+$/, '');
}

export function absoluteUrl(path: string): string {
  return `${baseUrl()}${path.startsWith('/') ? path : `/${path}`}`;
}

function hmac(purpose: string, value: string): Buffer {
  return crypto.createHmac('sha256', env().NEXTAUTH_SECRET).update(`${purpose}\n${value}`).digest();
}

/** A keyed hash for storing single-use tokens (a leaked table cannot be checked against guesses offline). */
export function tokenDigest(token: string): string {
  return hmac('token', token).toString('hex');
}

/** "<userId>.<kind>.<signature>": stable for a user and kind, verifiable without a database row. */
export function signUnsubscribe(userId: number, kind: UnsubscribeKind): string {
  const payload = `${userId}.${kind}`;
  return `${payload}.${hmac('unsubscribe', payload).subarray(0, 16).toString('base64url')}`;
}

export function verifyUnsubscribe(token: string): { userId: number; kind: UnsubscribeKind } | null {
  const m = /^([1-9][0-9]{0,11})\.([a-z-]{3,16})\.([A-Za-z0-9_-]{22})$/.exec(token);
  if (!m || !KINDS.includes(m[2] as UnsubscribeKind)) return null;
  const expected = hmac('unsubscribe', `${m[1]}.${m[2]}`).subarray(0, 16);
  const given = Buffer.from(m[3], 'base64url');
  if (given.length !== expected.length || !crypto.timingSafeEqual(given, expected)) return null;
  return { userId: Number(m[1]), kind: m[2] as UnsubscribeKind };
}

export function unsubscribeUrl(userId: number, kind: UnsubscribeKind): string {
  return absoluteUrl(`/unsubscribe/${signUnsubscribe(userId, kind)}`);
}

/** The RFC 8058 one-click endpoint (mail programs POST to it). */
export function oneClickUnsubscribeUrl(userId: number, kind: UnsubscribeKind): string {
  return absoluteUrl(`/unsubscribe/${signUnsubscribe(userId, kind)}/one-click`);
}
