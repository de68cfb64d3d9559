import { NextResponse, type NextRequest } from 'next/server';
import { getToken } from 'next-auth/jwt';
import { env } from '@/lib/env';

// Sends signed-out visitors to sign-in. It reads only the signed session cookie (no database);
// every layout, page and route handler checks the session, role and organization again.
const PUBLIC = ['/signin', '/api/auth', '/api/health', '/api/fake-weather', '/api/calendar', '/unsubscribe', '/invite', '/reset', '/forgot', '/api/tokens'];

export async function proxy(req: NextRequest) {
  const { pathname } = req.nextUrl;
  if (PUBLIC.some((p) => pathname === p || pathname.startsWith(p + '/'))) return NextResponse.next();
  const token = await getToken({ req, secret: env().NEXTAUTH_SECRET });
  if (token) return NextResponse.next();
  if (pathname.startsWith('/api/')) {
    return NextResponse.json({ error: 'unauthenticated', message: 'Sign in to continue.' }, { status: 401 });
  }
  const url = req.nextUrl.clone();
  url.pathname = '/signin';
  url.search = pathname === '/' ? '' : `?next=${encodeURIComponent(pathname + req.nextUrl.search)}`;
  return NextResponse.redirect(url);
}

export const config = {
  matcher: ['/((?!_next/static|_next/image|favicon.ico|.*\\.(?:png|svg|ico|woff2)$).*)'],
};
