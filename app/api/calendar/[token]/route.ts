import { feedCalendar, publicBaseUrl } from '@/lib/data/calendar';
import { assertTokenAttemptsLeft, recordTokenMiss } from '@/lib/auth/limiter';
import { TooManyRequests } from '@/lib/api/errors';
import { describeError } from '@/lib/log';

export const dynamic = 'force-dynamic';

/**
 * The public, secret feed URL: the token is the only credential; unknown or revoked tokens are 404, and
 * an address that misses too often is answered 429 for a while (lib/auth/limiter.ts).
 */
export async function GET(req: Request, ctx: { params: Promise<{ token: string }> }) {
  try {
    await assertTokenAttemptsLeft(req);
    const { token } = await ctx.params;
    const ics = await feedCalendar({ token: token.replace(/\.ics$/, ''), baseUrl: publicBaseUrl(req) });
    if (ics === null) {
      await recordTokenMiss(req);
      return new Response('Not found', { status: 404, headers: { 'content-type': 'text/plain' } });
    }
    return new Response(ics, { headers: { 'content-type': 'text/calendar; charset=utf-8', 'cache-control': 'no-store' } });
  } catch (err) {
    if (err instanceof TooManyRequests) {
      return new Response('Too many requests', { status: 429, headers: { 'content-type': 'text/plain', 'retry-after': String(err.retryAfterSeconds) } });
    }
    console.error(`[thawline] calendar feed failed: ${describeError(err)}`);
    return new Response('Unavailable', { status: 503, headers: { 'content-type': 'text/plain' } });
  }
}
