import { apiRoute, idParam } from '@/lib/api/route';
import { can } from '@/lib/auth/permissions';
import { planDetail } from '@/lib/data/plans';

export const dynamic = 'force-dynamic';

/** A departure's heat plan and Soak forecast; a pilot sees only departures they fly or booked. */
export const GET = apiRoute({ permission: 'org:read' }, async ({ user, params }) =>
  planDetail({ orgId: user.orgId, departureId: idParam(params), actor: { id: user.id, bookAny: can(user.role, 'departures:book-any') } }),
);
