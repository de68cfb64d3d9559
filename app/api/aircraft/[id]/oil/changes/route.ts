import { apiRoute, idParam, readJson } from '@/lib/api/route';
import { addOilChange, getOilLog } from '@/lib/data/oil';
import { oilChangeSchema } from '@/lib/validation/oil';

export const dynamic = 'force-dynamic';

/** Records an oil change: when, engine hours, oil grade, quantity in the person's unit. */
export const POST = apiRoute({ permission: 'oil-log:write', created: true }, async ({ req, user, params }) => {
  const input = oilChangeSchema(user).parse(await readJson(req));
  const aircraftId = idParam(params);
  const { id } = await addOilChange({ orgId: user.orgId, aircraftId, userId: user.id, input });
  return { id, oilLog: await getOilLog({ orgId: user.orgId, aircraftId }) };
});
