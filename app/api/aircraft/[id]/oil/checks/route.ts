import { apiRoute, idParam, readJson } from '@/lib/api/route';
import { addOilCheck, getOilLog } from '@/lib/data/oil';
import { oilCheckSchema } from '@/lib/validation/oil';

export const dynamic = 'force-dynamic';

/** Records a cold oil check, entered in the person's own units (level in L or US qt, temperatures in °C or °F). */
export const POST = apiRoute({ permission: 'oil-log:write', created: true }, async ({ req, user, params }) => {
  const input = oilCheckSchema(user).parse(await readJson(req));
  const aircraftId = idParam(params);
  const { id } = await addOilCheck({ orgId: user.orgId, aircraftId, userId: user.id, input });
  return { id, oilLog: await getOilLog({ orgId: user.orgId, aircraftId }) };
});
