import { NextResponse } from 'next/server';
import { apiRoute } from '@/lib/api/route';
import { requestPasswordReset } from '@/lib/data/tokens';
import { RESET_REQUEST_ANSWER, resetRequestSchema } from '@/lib/validation/tokens';
import { deliverSoon } from '@/lib/jobs';

/** Public: asks for a reset link. The answer is the same whether or not the address has an account. */
export const POST = apiRoute({ public: true, body: resetRequestSchema, maxBodyBytes: 2048 }, async ({ body }) => {
  await requestPasswordReset({ email: body.email });
  deliverSoon();
  return NextResponse.json({ ok: true, message: RESET_REQUEST_ANSWER }, { status: 202 });
});
