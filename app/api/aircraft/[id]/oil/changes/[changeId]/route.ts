import { apiRoute, idParam } from '@/lib/api/route';
import { deleteOilEntry } from '@/lib/data/oil';

export const dynamic = 'force-dynamic';

/** Removes an oil change: whoever entered it, or an operator or manager. */
export const DELETE = apiRoute({ permission: 'oil-log:write' }, async ({ user, params }) =>
  deleteOilEntry({ orgId: user.orgId, aircraftId: idParam(params), actor: user, kind: 'change', entryId: idParam(params, 'changeId') }),
);
