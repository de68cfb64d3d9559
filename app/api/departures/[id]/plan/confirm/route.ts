import { apiRoute, idParam } from '@/lib/api/route';
import { confirmPlan } from '@/lib/data/plans';

export const dynamic = 'force-dynamic';

/** An operator confirms the heat plan as it stands; a later change of its inputs needs a new confirmation. */
export const POST = apiRoute({ permission: 'plans:manage' }, async ({ user, params }) => confirmPlan({ orgId: user.orgId, departureId: idParam(params), userId: user.id }));
