import { apiRoute } from '@/lib/api/route';
import { createAirfield, listAirfields } from '@/lib/data/airfields';
import { tonightForAirfields } from '@/lib/data/forecasts';
import { readinessByAirfield } from '@/lib/data/plans';
import { airfieldCreateSchema, airfieldListQuery } from '@/lib/validation/airfields';

export const dynamic = 'force-dynamic';

/** The organization's airfields with their shelters; `?forecast=tonight` adds tonight's low (refreshing forecasts older than an hour) and the morning's worst readiness. */
export const GET = apiRoute({ permission: 'org:read', query: airfieldListQuery }, async ({ user, query }) => {
  const airfields = await listAirfields({ orgId: user.orgId, includeArchived: query.archived === '1' });
  if (query.forecast !== 'tonight') return { airfields };
  const weather = await tonightForAirfields({ orgId: user.orgId, airfieldIds: airfields.map((a) => a.id), now: new Date(), refresh: 'if-old' });
  const ready = await readinessByAirfield({ orgId: user.orgId, refresh: 'never' });
  return { airfields: airfields.map((a) => ({ ...a, ...weather.get(a.id), morning: ready.get(a.id) ?? null })) };
});

/** A new airfield, with its first shelters in the same transaction. */
export const POST = apiRoute({ permission: 'airfields:edit', body: airfieldCreateSchema, created: true }, async ({ user, body }) => ({
  airfield: await createAirfield({ orgId: user.orgId, input: body }),
}));
