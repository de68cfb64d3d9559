// Manual override of a relay (on now for N minutes / off now): through the same interlocks as a plan,
// published as a command with its own id and expiry, recorded in the audit log with who asked.
import { randomBytes } from 'node:crypto';
import { Op } from 'sequelize';
import { db } from '@/models';
import { Conflict, NotFound } from '@/lib/api/errors';
import { recordDeviceEvent } from '@/lib/data/devices';
import { applyInterlocks, relayCommand } from './commands';
import { deviceTopic } from './topics';
import type { Publish } from './dispatch';
import type { DeviceOverrideInput } from '@/lib/validation/devices';

const FLYING_AFTER_DEPARTURE_MS = 12 * 3_600_000;

export async function overrideRelay({ orgId, userId, deviceId, input, now, publish }: { orgId: number; userId: number; deviceId: number; input: DeviceOverrideInput; now: Date; publish: Publish | null }) {
  const { Device, Heater, Departure } = db();
  const relay = await Device.findOne({ where: { id: deviceId, organizationId: orgId, kind: 'relay' } });
  if (!relay || !relay.aircraftId) throw new NotFound('relay');
  if (!publish) throw new Conflict('The MQTT broker is not running in this server: the relay cannot be reached.');
  const nowMs = now.getTime();
  const asked = input.action === 'on' ? [{ fromMs: nowMs, untilMs: nowMs + input.minutes * 60_000 }] : [];
  const heaters = await Heater.findAll({ where: { aircraftId: relay.aircraftId, control: 'relay' }, order: [['id', 'ASC']] });
  const deps = await Departure.findAll({ where: { aircraftId: relay.aircraftId, organizationId: orgId, cancelledAt: null, departAt: { [Op.lte]: new Date(nowMs + 24 * 3_600_000) } } });
  const flying = deps.map((d) => ({ fromMs: d.departAt.getTime(), untilMs: d.departAt.getTime() + FLYING_AFTER_DEPARTURE_MS }));
  let windows = asked;
  const refusals: { heaterId: number; reason: string }[] = [];
  for (const h of heaters) {
    const r = applyInterlocks({ heaterKind: h.kind, windows, flying });
    for (const x of r.refusals) refusals.push({ heaterId: h.id, reason: x.reason });
    windows = r.windows;
  }
  if (!heaters.length) windows = [];
  const commandId = randomBytes(12).toString('base64url');
  const cmd = relayCommand({ commandId, nowMs, windows });
  await publish(deviceTopic(orgId, relay.name, 'cmd'), JSON.stringify(cmd), { qos: 1, retain: true });
  await recordDeviceEvent({ orgId, deviceId: relay.id, aircraftId: relay.aircraftId, kind: 'command', commandId, userId, detail: { override: input, sentAtMs: nowMs, command: cmd } });
  await recordDeviceEvent({ orgId, deviceId: relay.id, aircraftId: relay.aircraftId, kind: 'override', commandId, userId, detail: { action: input.action, minutes: input.action === 'on' ? input.minutes : null } });
  for (const x of refusals) await recordDeviceEvent({ orgId, deviceId: relay.id, aircraftId: relay.aircraftId, kind: 'refusal', commandId, userId, detail: x });
  return { command: cmd, refused: refusals.map((r) => r.reason) };
}
