import { NextResponse } from 'next/server';
import { apiRoute } from '@/lib/api/route';
import { queuePasswordReset } from '@/lib/data/tokens';
import { consumeResetRequest } from '@/lib/auth/limiter';
import { RESET_REQUEST_ANSWER, resetRequestSchema } from '@/lib/validation/tokens';
import { deliverSoon } from '@/lib/jobs';

/**
 * Public: asks for a reset link. The answer is the same, by the same path, whether or not the address
 * has an account: the look-up and the e-mail are queued and run after the answer is decided.
 */
export const POST = apiRoute({ public: true, body: resetRequestSchema, maxBodyBytes: 2048 }, async ({ req, body }) => {
  await consumeResetRequest(req);
  queuePasswordReset({ email: body.email, then: deliverSoon });
  return NextResponse.json({ ok: true, message: RESET_REQUEST_ANSWER }, { status: 202 });
});
