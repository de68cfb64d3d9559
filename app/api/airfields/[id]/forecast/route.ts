import { apiRoute, idParam } from '@/lib/api/route';
import { getAirfield } from '@/lib/data/airfields';
import { forecastView } from '@/lib/data/forecasts';

export const dynamic = 'force-dynamic';

async function view(orgId: number, airfieldId: number, refresh: 'if-old' | 'force') {
  const airfield = await getAirfield({ orgId, airfieldId });
  return { forecast: await forecastView({ orgId, airfieldId: airfield.id, shelters: airfield.shelters, now: new Date(), refresh }) };
}

/** The cached forecast with tonight's low, sun times and the 48 h shelter curves; refreshed first when older than an hour. */
export const GET = apiRoute({ permission: 'org:read' }, async ({ user, params }) => view(user.orgId, idParam(params), 'if-old'));

/** Fetch a new forecast now (anyone who may read the airfield may ask); a failure keeps the last one, marked stale. */
export const POST = apiRoute({ permission: 'org:read' }, async ({ user, params }) => view(user.orgId, idParam(params), 'force'));
