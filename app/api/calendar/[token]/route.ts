import { feedCalendar, publicBaseUrl } from '@/lib/data/calendar';
import { describeError } from '@/lib/log';

export const dynamic = 'force-dynamic';

/** The public, secret feed URL: the token is the only credential; unknown or revoked tokens are 404. */
export async function GET(req: Request, ctx: { params: Promise<{ token: string }> }) {
  try {
    const { token } = await ctx.params;
    const ics = await feedCalendar({ token: token.replace(/\.ics$/, ''), baseUrl: publicBaseUrl(req) });
    if (ics === null) return new Response('Not found', { status: 404, headers: { 'content-type': 'text/plain' } });
    return new Response(ics, { headers: { 'content-type': 'text/calendar; charset=utf-8', 'cache-control': 'no-store' } });
  } catch (err) {
    console.error(`[thawline] calendar feed failed: ${describeError(err)}`);
    return new Response('Unavailable', { status: 503, headers: { 'content-type': 'text/plain' } });
  }
}
