import { apiRoute, idParam } from '@/lib/api/route';
import { deleteLog, getLog } from '@/lib/data/logs';

export const dynamic = 'force-dynamic';

/** A stored log: its series for the chart, the suggested cool-down and its last fit. */
export const GET = apiRoute({ permission: 'aircraft:edit' }, async ({ user, params }) =>
  getLog({ orgId: user.orgId, aircraftId: idParam(params), logId: idParam(params, 'logId') }),
);

/** Removes a log; profile revisions applied from it stay (they no longer point to it). */
export const DELETE = apiRoute({ permission: 'aircraft:edit' }, async ({ user, params }) =>
  deleteLog({ orgId: user.orgId, aircraftId: idParam(params), logId: idParam(params, 'logId') }),
);
