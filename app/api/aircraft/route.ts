import { apiRoute } from '@/lib/api/route';
import { createAircraft, listAircraft } from '@/lib/data/aircraft';
import { aircraftCreateSchema, aircraftListQuery } from '@/lib/validation/aircraft';

export const dynamic = 'force-dynamic';

/** The organization's aircraft (archived ones with ?archived=1), optionally of one airfield. */
export const GET = apiRoute({ permission: 'org:read', query: aircraftListQuery }, async ({ user, query }) => ({
  aircraft: await listAircraft({ orgId: user.orgId, includeArchived: query.archived === '1', airfieldId: query.airfieldId }),
}));

/** A new aircraft with its heaters and pilots, in one transaction. */
export const POST = apiRoute({ permission: 'aircraft:edit', body: aircraftCreateSchema, created: true }, async ({ user, body }) => ({
  aircraft: await createAircraft({ orgId: user.orgId, input: body }),
}));
