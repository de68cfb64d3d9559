import { apiRoute, idParam } from '@/lib/api/route';
import { overrideRelay } from '@/lib/devices/override';
import { runningBroker } from '@/lib/devices/service';
import { deviceOverrideSchema } from '@/lib/validation/devices';

export const dynamic = 'force-dynamic';

/** On now for N minutes, or off now; interlocks apply and the answer names any refusal. */
export const POST = apiRoute({ permission: 'plans:manage', body: deviceOverrideSchema }, async ({ user, params, body }) => {
  const broker = await runningBroker();
  return overrideRelay({
    orgId: user.orgId, userId: user.id, deviceId: idParam(params), input: body, now: new Date(),
    publish: broker ? (topic, payload, opts) => broker.publish(topic, payload, opts) : null,
  });
});
