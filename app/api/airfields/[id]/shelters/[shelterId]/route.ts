import { apiRoute, idParam } from '@/lib/api/route';
import { listShelters, removeShelter, updateShelter } from '@/lib/data/airfields';
import { NotFound } from '@/lib/api/errors';
import { shelterUpdateSchema } from '@/lib/validation/airfields';

export const dynamic = 'force-dynamic';

export const GET = apiRoute({ permission: 'org:read' }, async ({ user, params }) => {
  const shelterId = idParam(params, 'shelterId');
  const shelter = (await listShelters({ orgId: user.orgId, airfieldId: idParam(params), includeArchived: true })).find((s) => s.id === shelterId);
  if (!shelter) throw new NotFound('Shelter');
  return { shelter };
});

/** Change fields (the whole shelter is checked again); `{"archived": false}` restores it. */
export const PATCH = apiRoute({ permission: 'airfields:edit', body: shelterUpdateSchema }, async ({ user, params, body }) => ({
  shelter: await updateShelter({ orgId: user.orgId, airfieldId: idParam(params), shelterId: idParam(params, 'shelterId'), patch: body }),
}));

/** Deleted when no aircraft is homed in it; archived otherwise. Answers `{ result }`. */
export const DELETE = apiRoute({ permission: 'airfields:edit' }, async ({ user, params }) =>
  removeShelter({ orgId: user.orgId, airfieldId: idParam(params), shelterId: idParam(params, 'shelterId') }),
);
