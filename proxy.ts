import { NextResponse, type NextRequest } from 'next/server';
import { getToken } from 'next-auth/jwt';
import { env } from '@/lib/env';
import { contentSecurityPolicy, newNonce } from '@/lib/security/headers';

// Sends signed-out visitors to sign-in. It reads only the signed session cookie (no database);
// every layout, page and route handler checks the session, role and organization again.
// It also gives every response its Content-Security-Policy with a fresh nonce: the policy goes on the
// request too, where Next.js reads the nonce and puts it on the scripts it renders.
const PUBLIC = ['/signin', '/api/auth', '/api/health', '/api/fake-weather', '/api/calendar', '/unsubscribe', '/invite', '/reset', '/forgot', '/api/tokens'];

function isHttps(req: NextRequest): boolean {
  const forwarded = req.headers.get('x-forwarded-proto');
  return (forwarded ? forwarded.split(',')[0].trim() : req.nextUrl.protocol.replace(/:$/, '')) === 'https';
}

export async function proxy(req: NextRequest) {
  const { pathname } = req.nextUrl;
  const https = isHttps(req);
  const csp = contentSecurityPolicy({ nonce: newNonce(), tileUrl: env().MAP_TILE_URL, dev: process.env.NODE_ENV === 'development', https });
  const withCsp = <R extends NextResponse>(res: R): R => {
    res.headers.set('Content-Security-Policy', csp);
    return res;
  };
  const next = () => {
    const headers = new Headers(req.headers);
    headers.set('Content-Security-Policy', csp);
    return withCsp(NextResponse.next({ request: { headers } }));
  };
  if (PUBLIC.some((p) => pathname === p || pathname.startsWith(p + '/'))) return next();
  // next-auth marks its cookie Secure and names it __Secure-… when its origin is HTTPS (NEXTAUTH_URL,
  // else the request's scheme): look for the one it set.
  const base = env().NEXTAUTH_URL;
  const token = await getToken({ req, secret: env().NEXTAUTH_SECRET, secureCookie: base ? base.startsWith('https://') : https });
  if (token) return next();
  if (pathname.startsWith('/api/')) {
    return withCsp(NextResponse.json({ error: 'unauthenticated', message: 'Sign in to continue.' }, { status: 401 }));
  }
  const url = req.nextUrl.clone();
  url.pathname = '/signin';
  url.search = pathname === '/' ? '' : `?next=${encodeURIComponent(pathname + req.nextUrl.search)}`;
  return withCsp(NextResponse.redirect(url));
}

export const config = {
  matcher: ['/((?!_next/static|_next/image|favicon.ico|.*\\.(?:png|svg|ico|woff2)$).*)'],
};
