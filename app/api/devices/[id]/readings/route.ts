import { z } from 'zod';
import { apiRoute, idParam } from '@/lib/api/route';
import { listReadings } from '@/lib/data/devices';

export const dynamic = 'force-dynamic';

const query = z.object({ hours: z.coerce.number().int().min(1).max(72).default(12) });

/** The device's readings of the last `hours` (default 12), oldest first; flagged ones marked. */
export const GET = apiRoute({ permission: 'org:read', query }, async ({ user, params, query: q }) => ({
  readings: await listReadings({ orgId: user.orgId, deviceId: idParam(params), sinceMs: Date.now() - q.hours * 3_600_000 }),
}));
