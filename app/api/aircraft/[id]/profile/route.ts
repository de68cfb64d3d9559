import { apiRoute, idParam } from '@/lib/api/route';
import { getProfile } from '@/lib/data/logs';

export const dynamic = 'force-dynamic';

/** The aircraft's thermal profile and its history (fits applied, reverts), newest first. */
export const GET = apiRoute({ permission: 'org:read' }, async ({ user, params }) => getProfile({ orgId: user.orgId, aircraftId: idParam(params) }));
