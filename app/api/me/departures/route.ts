import { apiRoute } from '@/lib/api/route';
import { pilotPlans } from '@/lib/data/plans';

export const dynamic = 'force-dynamic';

/** The signed-in user's own upcoming departures (as pilot) with predicted oil, readiness and chance of being ready. */
export const GET = apiRoute({ permission: 'departures:book-own' }, async ({ user }) => ({ plans: await pilotPlans({ orgId: user.orgId, pilotId: user.id }) }));
