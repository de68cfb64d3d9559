import { apiRoute, idParam } from '@/lib/api/route';
import { removeDevice } from '@/lib/data/devices';

export const dynamic = 'force-dynamic';

/** Removes the device: its credentials stop working at its next connection. */
export const DELETE = apiRoute({ permission: 'aircraft:edit' }, async ({ user, params }) => removeDevice({ orgId: user.orgId, deviceId: idParam(params) }));
