import { apiRoute } from '@/lib/api/route';
import { acceptInvitation } from '@/lib/data/tokens';
import { acceptInviteSchema } from '@/lib/validation/tokens';
import { limitTokenUse } from '@/lib/auth/limiter';

/** Public: the invitee chooses a password with the single-use token from the invitation e-mail. */
export const POST = apiRoute({ public: true, body: acceptInviteSchema, maxBodyBytes: 4096 }, async ({ req, body }) => {
  const done = await limitTokenUse(req, () => acceptInvitation({ token: body.token, password: body.password, name: body.name }));
  return { ok: true, email: done.email };
});
