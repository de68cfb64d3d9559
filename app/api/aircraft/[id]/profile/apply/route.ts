import { apiRoute, idParam } from '@/lib/api/route';
import { applyFit } from '@/lib/data/logs';
import { applyFitSchema } from '@/lib/validation/logs';

export const dynamic = 'force-dynamic';

/** Applies a log's fit (one or two nodes) to the profile; the profile before it stays in the history. */
export const POST = apiRoute({ permission: 'aircraft:edit', body: applyFitSchema, created: true }, async ({ user, params, body }) =>
  applyFit({ orgId: user.orgId, aircraftId: idParam(params), userId: user.id, logId: body.logId, model: body.model, note: body.note }),
);
