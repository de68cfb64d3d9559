import { apiRoute, idParam } from '@/lib/api/route';
import { revokeFeed } from '@/lib/data/calendar';

export const DELETE = apiRoute({ permission: 'plans:manage' }, async ({ user, params }) => revokeFeed({ orgId: user.orgId, userId: user.id, feedId: idParam(params) }));
