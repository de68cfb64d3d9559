import { MAX_LOG_BYTES } from '@/lib/fit/csv';
import { apiRoute, idParam } from '@/lib/api/route';
import { listLogs, storeLog } from '@/lib/data/logs';
import { logUploadQuery } from '@/lib/validation/logs';
import { LOG_TOO_LARGE, uploadStream } from './body';

export const dynamic = 'force-dynamic';

/** The aircraft's uploaded temperature logs, newest first (without their points). */
export const GET = apiRoute({ permission: 'aircraft:edit' }, async ({ user, params }) => ({
  logs: await listLogs({ orgId: user.orgId, aircraftId: idParam(params) }),
}));

/**
 * Stores a logger CSV sent as the request body (?fileName=…&unit=auto|C|F). Refused whole with every
 * problem listed (422, field "file") when any row has one; over 5 MB is 413.
 */
export const POST = apiRoute({ permission: 'aircraft:edit', query: logUploadQuery, maxBodyBytes: MAX_LOG_BYTES, tooLargeMessage: LOG_TOO_LARGE, created: true }, async ({ req, user, params, query }) =>
  storeLog({ orgId: user.orgId, aircraftId: idParam(params), userId: user.id, source: uploadStream(req), fileName: query.fileName, unit: query.unit }),
);
