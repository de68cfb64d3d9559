import { apiRoute, idParam } from '@/lib/api/route';
import { archiveAircraft, getAircraft, updateAircraft } from '@/lib/data/aircraft';
import { aircraftUpdateSchema } from '@/lib/validation/aircraft';

export const dynamic = 'force-dynamic';

export const GET = apiRoute({ permission: 'org:read' }, async ({ user, params }) => ({
  aircraft: await getAircraft({ orgId: user.orgId, aircraftId: idParam(params) }),
}));

/** Any fields; `heaters` and `pilotIds`, when given, replace the lists (all in one transaction). */
export const PATCH = apiRoute({ permission: 'aircraft:edit', body: aircraftUpdateSchema }, async ({ user, body, params }) => ({
  aircraft: await updateAircraft({ orgId: user.orgId, aircraftId: idParam(params), patch: body }),
}));

/** Archives the aircraft (history kept) and cancels its departures still to come. */
export const DELETE = apiRoute({ permission: 'aircraft:edit' }, async ({ user, params }) => archiveAircraft({ orgId: user.orgId, aircraftId: idParam(params) }));
