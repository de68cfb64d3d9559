import { apiRoute } from '@/lib/api/route';
import { resetPassword } from '@/lib/data/tokens';
import { resetPasswordSchema } from '@/lib/validation/tokens';
import { limitTokenUse } from '@/lib/auth/limiter';

/** Public: a new password with the single-use token from the reset e-mail. */
export const POST = apiRoute({ public: true, body: resetPasswordSchema, maxBodyBytes: 4096 }, async ({ req, body }) => {
  const done = await limitTokenUse(req, () => resetPassword({ token: body.token, password: body.password }));
  return { ok: true, email: done.email };
});
