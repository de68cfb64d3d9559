import { NextResponse } from 'next/server';
import { unsubscribe } from '@/lib/data/alerts';
import { verifyUnsubscribe } from '@/lib/mail/links';
import { toErrorResponse } from '@/lib/api/errors';

export const dynamic = 'force-dynamic';

/**
 * Public, signed: turns one kind of alert e-mail off. Mail programs POST "List-Unsubscribe=One-Click"
 * here (RFC 8058) and get a short answer; the unsubscribe page's button is sent back to the page.
 */
export async function POST(req: Request, ctx: { params: Promise<{ token: string }> }) {
  try {
    const { token } = await ctx.params;
    const form = await req.formData().catch(() => null);
    const fromPage = form?.get('source') === 'page';
    const v = verifyUnsubscribe(token);
    const done = v ? await unsubscribe(v) : null;
    if (fromPage) {
      // A relative Location keeps the browser on the host it came from (behind a proxy too).
      return new Response(null, { status: 303, headers: { Location: `/unsubscribe/${encodeURIComponent(token)}${done ? '?done=1' : ''}` } });
    }
    if (!done) return NextResponse.json({ error: 'not_found', message: 'This unsubscribe link is not valid.' }, { status: 404 });
    return NextResponse.json({ ok: true, message: 'Unsubscribed.' });
  } catch (err) {
    const { status, body } = toErrorResponse(err);
    return NextResponse.json(body, { status });
  }
}
