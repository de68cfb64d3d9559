import { apiRoute } from '@/lib/api/route';
import { listAlerts } from '@/lib/data/alerts';
import { alertListQuery } from '@/lib/validation/alerts';

export const dynamic = 'force-dynamic';

/** The signed-in user's alerts (current revisions, newest first) with the unread count. */
export const GET = apiRoute({ permission: 'org:read', query: alertListQuery }, async ({ user, query }) =>
  listAlerts({ orgId: user.orgId, userId: user.id, show: query.show, limit: query.limit }),
);
