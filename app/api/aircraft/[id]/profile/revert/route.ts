import { apiRoute, idParam } from '@/lib/api/route';
import { revertProfile } from '@/lib/data/logs';
import { revertSchema } from '@/lib/validation/logs';

export const dynamic = 'force-dynamic';

/** Makes an earlier profile current again (recorded as a new revision, so this too can be undone). */
export const POST = apiRoute({ permission: 'aircraft:edit', body: revertSchema, created: true }, async ({ user, params, body }) =>
  revertProfile({ orgId: user.orgId, aircraftId: idParam(params), userId: user.id, revisionId: body.revisionId, note: body.note }),
);
