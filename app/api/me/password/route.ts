import { apiRoute } from '@/lib/api/route';
import { changePassword } from '@/lib/data/users';
import { changePasswordSchema } from '@/lib/validation/auth';

export const POST = apiRoute({ body: changePasswordSchema }, async ({ user, body }) => {
  await changePassword({ userId: user.id, ...body });
  return { ok: true };
});
