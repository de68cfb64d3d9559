import { apiRoute } from '@/lib/api/route';
import { acknowledgeAll } from '@/lib/data/alerts';
import { acknowledgeAllSchema } from '@/lib/validation/alerts';

/** Acknowledge all your unread alerts (optionally of one kind). */
export const POST = apiRoute({ permission: 'org:read', body: acknowledgeAllSchema }, async ({ user, body }) =>
  acknowledgeAll({ orgId: user.orgId, userId: user.id, kind: body.kind }),
);
