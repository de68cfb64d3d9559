import { apiRoute, idParam } from '@/lib/api/route';
import { acknowledgeAlert } from '@/lib/data/alerts';
import { acknowledgeSchema } from '@/lib/validation/alerts';

/** Acknowledge one of your alerts (or mark it unread again). Anyone else's alert is not found. */
export const PATCH = apiRoute({ permission: 'org:read', body: acknowledgeSchema }, async ({ user, body, params }) =>
  acknowledgeAlert({ orgId: user.orgId, userId: user.id, alertId: idParam(params), acknowledged: body.acknowledged }),
);
