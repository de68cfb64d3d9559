import { z } from 'zod';
import { apiRoute, idParam } from '@/lib/api/route';
import { createShelter, listShelters } from '@/lib/data/airfields';
import { shelterSchema } from '@/lib/validation/airfields';

export const dynamic = 'force-dynamic';

const query = z.object({ archived: z.enum(['0', '1']).optional() });

export const GET = apiRoute({ permission: 'org:read', query }, async ({ user, params, query }) => ({
  shelters: await listShelters({ orgId: user.orgId, airfieldId: idParam(params), includeArchived: query.archived === '1' }),
}));

/** A new shelter; thermal values not given are prefilled from its kind's preset. */
export const POST = apiRoute({ permission: 'airfields:edit', body: shelterSchema, created: true }, async ({ user, params, body }) => ({
  shelter: await createShelter({ orgId: user.orgId, airfieldId: idParam(params), input: body }),
}));
