import { apiRoute, idParam } from '@/lib/api/route';
import { updateOilSettings } from '@/lib/data/oil';
import { oilSettingsSchema } from '@/lib/validation/oil';

export const dynamic = 'force-dynamic';

/** The aircraft's oil-change interval: engine hours and/or months (null clears one). */
export const PATCH = apiRoute({ permission: 'aircraft:edit', body: oilSettingsSchema }, async ({ user, params, body }) => ({
  settings: await updateOilSettings({ orgId: user.orgId, aircraftId: idParam(params), settings: body }),
}));
