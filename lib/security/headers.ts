// The Content-Security-Policy that proxy.ts puts on every page response, with its nonce. Pure: no I/O.
// The headers that never change (nosniff, Referrer-Policy, X-Frame-Options) are in next.config.js
// headers(), so static files carry them too.

/**
 * Where map tiles may come from: the origin of MAP_TILE_URL, with a `{s}` subdomain placeholder widened
 * to a wildcard. Empty or unparsable → none (the offline outline basemap needs no outside images).
 */
export function tileSources(tileUrl: string): string[] {
  if (!tileUrl.trim()) return [];
  const sample = tileUrl.replace(/\{s\}/g, 'sub-placeholder').replace(/\{[^}]*\}/g, '0');
  try {
    const u = new URL(sample);
    if (u.protocol !== 'https:' && u.protocol !== 'http:') return [];
    const host = u.host.replace(/^sub-placeholder\./, '*.').replace(/sub-placeholder/, '*');
    return [`${u.protocol}//${host}`];
  } catch {
    return [];
  }
}

/**
 * The Content-Security-Policy for one page response. Scripts run only with this response's nonce
 * ('strict-dynamic' lets Next.js's own loader add its chunks), as the Next.js App Router guide on CSP
 * describes. Styles allow inline: Leaflet positions tiles and markers with style attributes, and
 * React's style props are attributes too (a nonce cannot cover attributes).
 */
export function contentSecurityPolicy({ nonce, tileUrl, dev = false, https = false }: { nonce: string; tileUrl: string; dev?: boolean; https?: boolean }): string {
  const tiles = tileSources(tileUrl);
  const directives: [string, string[]][] = [
    ['default-src', ["'self'"]],
    ['script-src', ["'self'", `'nonce-${nonce}'`, "'strict-dynamic'", ...(dev ? ["'unsafe-eval'"] : [])]],
    ['style-src', ["'self'", "'unsafe-inline'"]],
    ['img-src', ["'self'", 'data:', 'blob:', ...tiles]],
    ['font-src', ["'self'", 'data:']],
    ['connect-src', ["'self'", ...(dev ? ['ws:', 'wss:'] : [])]],
    ['frame-src', ["'self'"]],
    ['worker-src', ["'self'", 'blob:']],
    ['object-src', ["'none'"]],
    ['base-uri', ["'self'"]],
    ['form-action', ["'self'"]],
    ['frame-ancestors', ["'none'"]],
  ];
  const text = directives.map(([k, v]) => `${k} ${v.join(' ')}`);
  if (https) text.push('upgrade-insecure-requests');
  return text.join('; ');
}

/** A fresh nonce: 16 random bytes, base64. */
export function newNonce(): string {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  return btoa(String.fromCharCode(...bytes));
}
