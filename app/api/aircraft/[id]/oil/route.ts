import { apiRoute, idParam } from '@/lib/api/route';
import { getOilLog } from '@/lib/data/oil';

export const dynamic = 'force-dynamic';

/** The Oil log of an aircraft: checks with corrected levels, changes, oil used per hour, the next change. SI units. */
export const GET = apiRoute({ permission: 'oil-log:write' }, async ({ user, params }) => getOilLog({ orgId: user.orgId, aircraftId: idParam(params) }));
