import { z } from 'zod';
import { apiRoute, idParam } from '@/lib/api/route';
import { getAirfield, removeAirfield, updateAirfield } from '@/lib/data/airfields';
import { airfieldUpdateSchema } from '@/lib/validation/airfields';

export const dynamic = 'force-dynamic';

const query = z.object({ archived: z.enum(['0', '1']).optional() });

export const GET = apiRoute({ permission: 'org:read', query }, async ({ user, params, query }) => ({
  airfield: await getAirfield({ orgId: user.orgId, airfieldId: idParam(params), includeArchived: query.archived === '1' }),
}));

/** Change fields; `{"archived": false}` restores an archived airfield. */
export const PATCH = apiRoute({ permission: 'airfields:edit', body: airfieldUpdateSchema }, async ({ user, params, body }) => ({
  airfield: await updateAirfield({ orgId: user.orgId, airfieldId: idParam(params), patch: body }),
}));

/** Deleted when no aircraft is homed in its shelters; archived otherwise. Answers `{ result }`. */
export const DELETE = apiRoute({ permission: 'airfields:edit' }, async ({ user, params }) =>
  removeAirfield({ orgId: user.orgId, airfieldId: idParam(params) }),
);
