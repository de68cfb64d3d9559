import net from 'node:net';
import { env } from '@/lib/env';

// The client's address, for the sign-in and token limits. It must come from the connection, not from
// anything the client writes: Next.js fills in X-Forwarded-For from the socket only when the request has
// none, and keeps one the client sent, so that header alone can be anything. instrumentation.ts therefore
// stamps every incoming request, in the server process, with its socket's address (PEER_HEADER),
// overwriting whatever a client put there. X-Forwarded-For is then believed only hop by hop from the
// right, while the hop that handed it to us is one of TRUSTED_PROXIES.

export const PEER_HEADER = 'x-thawline-peer';
const g = globalThis as unknown as { __thawlinePeerStamp?: boolean; __thawlineTrusted?: { key: string; list: net.BlockList } };

/** Called by instrumentation.ts once the stamp is installed; until then PEER_HEADER is not believed. */
export function markPeerStamped() {
  g.__thawlinePeerStamp = true;
}

function normalize(a: string): string {
  const v = a.trim().replace(/^\[|\]$/g, '');
  const mapped = /^::ffff:(\d+\.\d+\.\d+\.\d+)$/i.exec(v);
  return mapped ? mapped[1] : v;
}

function trustedList(entries: string[]): net.BlockList {
  const key = entries.join(',');
  if (g.__thawlineTrusted?.key === key) return g.__thawlineTrusted.list;
  const list = new net.BlockList();
  for (const e of entries) {
    const [addr, bits] = e.split('/');
    const a = normalize(addr);
    const family = net.isIP(a) === 6 ? 'ipv6' : 'ipv4';
    if (bits === undefined) list.addAddress(a, family);
    else list.addSubnet(a, Number(bits), family);
  }
  g.__thawlineTrusted = { key, list };
  return list;
}

function isTrusted(a: string, list: net.BlockList): boolean {
  const family = net.isIP(a);
  return family !== 0 && list.check(a, family === 6 ? 'ipv6' : 'ipv4');
}

type HeaderSource = Pick<Headers, 'get'> | Record<string, unknown> | undefined | null;

function header(h: HeaderSource, name: string): string | null {
  if (!h) return null;
  if (typeof (h as Pick<Headers, 'get'>).get === 'function') return (h as Pick<Headers, 'get'>).get(name);
  const v = (h as Record<string, unknown>)[name];
  return typeof v === 'string' ? v : Array.isArray(v) ? String(v[v.length - 1]) : null;
}

/**
 * The client address, or null when it cannot be known honestly (no stamped connection address: a test
 * calling a handler directly, or a server without instrumentation). Callers then skip limits keyed by
 * address rather than put every such client in one shared bucket.
 */
export function clientAddress(h: HeaderSource, trusted: string[] = env().TRUSTED_PROXIES): string | null {
  const peer = g.__thawlinePeerStamp ? header(h, PEER_HEADER) : null;
  if (!peer || !net.isIP(normalize(peer))) return null;
  let addr = normalize(peer);
  if (!trusted.length) return addr;
  const list = trustedList(trusted);
  const hops = (header(h, 'x-forwarded-for') ?? '').split(',').map((x) => x.trim()).filter(Boolean);
  for (let i = hops.length - 1; i >= 0 && isTrusted(addr, list); i--) {
    const hop = normalize(hops[i]);
    if (!net.isIP(hop)) break;
    addr = hop;
  }
  return addr;
}
