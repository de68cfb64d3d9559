import { apiRoute } from '@/lib/api/route';
import { resetPassword } from '@/lib/data/tokens';
import { resetPasswordSchema } from '@/lib/validation/tokens';

/** Public: a new password with the single-use token from the reset e-mail. */
export const POST = apiRoute({ public: true, body: resetPasswordSchema, maxBodyBytes: 4096 }, async ({ body }) => {
  const done = await resetPassword({ token: body.token, password: body.password });
  return { ok: true, email: done.email };
});
