import { apiRoute } from '@/lib/api/route';
import { createDevice, listDevices } from '@/lib/data/devices';
import { deviceCreateSchema } from '@/lib/validation/devices';

export const dynamic = 'force-dynamic';

/** The organization's relays and probes (never their secrets). */
export const GET = apiRoute({ permission: 'aircraft:edit' }, async ({ user }) => ({ devices: await listDevices({ orgId: user.orgId }) }));

/** A new device; the answer carries its MQTT password, shown this once. */
export const POST = apiRoute({ permission: 'aircraft:edit', body: deviceCreateSchema, created: true }, async ({ user, body }) =>
  createDevice({ orgId: user.orgId, input: body }));
