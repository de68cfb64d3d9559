import { apiRoute } from '@/lib/api/route';
import { resendInvitation } from '@/lib/data/tokens';
import { resendInvitationSchema } from '@/lib/validation/tokens';
import { deliverSoon } from '@/lib/jobs';

/** A manager sends a new invitation (the earlier link stops working). */
export const POST = apiRoute({ permission: 'users:manage', body: resendInvitationSchema, created: true }, async ({ user, body }) => {
  const r = await resendInvitation({ orgId: user.orgId, actorId: user.id, userId: body.userId });
  deliverSoon();
  return { ok: true, expiresAt: r.expiresAt.toISOString() };
});
