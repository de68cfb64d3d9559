import { apiRoute, idParam } from '@/lib/api/route';
import { fitLog } from '@/lib/data/logs';
import { fitRequestSchema } from '@/lib/validation/logs';

export const dynamic = 'force-dynamic';

/** Fits the cool-down (the window given, or the suggested one); the window and the fit are kept on the log. */
export const POST = apiRoute({ permission: 'aircraft:edit', body: fitRequestSchema }, async ({ user, params, body }) =>
  fitLog({ orgId: user.orgId, aircraftId: idParam(params), logId: idParam(params, 'logId'), input: body }),
);
