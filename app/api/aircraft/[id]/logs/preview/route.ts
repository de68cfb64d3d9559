import { apiRoute, idParam } from '@/lib/api/route';
import { previewLog } from '@/lib/data/logs';
import { logUploadQuery } from '@/lib/validation/logs';
import { uploadStream } from '../body';

export const dynamic = 'force-dynamic';

/** Reads a logger CSV (the request body) without storing it: columns, units, problems by row, the suggested cool-down. */
export const POST = apiRoute({ permission: 'aircraft:edit', query: logUploadQuery }, async ({ req, user, params, query }) => ({
  preview: await previewLog({ orgId: user.orgId, aircraftId: idParam(params), source: uploadStream(req), fileName: query.fileName, unit: query.unit }),
}));
