import 'server-only';
import { randomBytes } from 'node:crypto';
import bcrypt from 'bcryptjs';
import { Op } from 'sequelize';
import { db } from '@/models';
import type { Device } from '@/models/Device';
import type { DeviceEventKind } from '@/models/DeviceEvent';
import { NotFound } from '@/lib/api/errors';
import { writeTransaction } from '@/models/transaction';
import { devicePrefix, mqttUsername } from '@/lib/devices/topics';
import type { DeviceCreateInput } from '@/lib/validation/devices';

export interface DeviceView {
  id: number;
  kind: Device['kind'];
  measures: Device['measures'];
  label: string;
  aircraftId: number | null;
  shelterId: number | null;
  username: string;
  topicPrefix: string;
  lastSeenAt: string | null;
}

function view(d: Device): DeviceView {
  return {
    id: d.id,
    kind: d.kind,
    measures: d.measures,
    label: d.label,
    aircraftId: d.aircraftId,
    shelterId: d.shelterId,
    username: mqttUsername(d.organizationId, d.name),
    topicPrefix: devicePrefix(d.organizationId, d.name),
    lastSeenAt: d.lastSeenAt ? d.lastSeenAt.toISOString() : null,
  };
}

export async function listDevices({ orgId }: { orgId: number }): Promise<DeviceView[]> {
  const { Device } = db();
  const rows = await Device.findAll({ where: { organizationId: orgId }, order: [['label', 'ASC'], ['id', 'ASC']] });
  return rows.map(view);
}

/** A new device with generated credentials; the password is returned here once and stored only hashed. */
export async function createDevice({ orgId, input }: { orgId: number; input: DeviceCreateInput }): Promise<{ device: DeviceView; password: string }> {
  const { Device, Aircraft, Shelter } = db();
  const password = randomBytes(18).toString('base64url');
  const secretHash = await bcrypt.hash(password, 10);
  const device = await writeTransaction(async (transaction) => {
    const onShelter = input.kind === 'probe' && input.measures === 'shelter';
    if (onShelter) {
      const shelter = await Shelter.findOne({ where: { id: input.shelterId!, organizationId: orgId }, transaction });
      if (!shelter) throw new NotFound('shelter');
    } else {
      const aircraft = await Aircraft.findOne({ where: { id: input.aircraftId!, organizationId: orgId }, transaction });
      if (!aircraft) throw new NotFound('aircraft');
    }
    return Device.create(
      {
        organizationId: orgId,
        kind: input.kind,
        measures: input.kind === 'probe' ? input.measures! : null,
        aircraftId: onShelter ? null : input.aircraftId!,
        shelterId: onShelter ? input.shelterId! : null,
        label: input.label,
        name: `${input.kind === 'relay' ? 'r' : 'p'}${randomBytes(5).toString('hex')}`,
        secretHash,
        lastSeenAt: null,
      },
      { transaction },
    );
  }, { retryOnUnique: true });
  return { device: view(device), password };
}

export async function removeDevice({ orgId, deviceId }: { orgId: number; deviceId: number }): Promise<{ removed: true }> {
  const { Device } = db();
  await writeTransaction(async (transaction) => {
    const d = await Device.findOne({ where: { id: deviceId, organizationId: orgId }, transaction });
    if (!d) throw new NotFound('device');
    await d.destroy({ transaction });
  });
  return { removed: true };
}

/** The device for an MQTT user name `<orgId>.<name>` if the password matches its hash, else null. */
export async function authenticateDevice(username: string, password: string): Promise<Device | null> {
  const m = /^(\d{1,10})\.([a-z0-9]{1,40})$/.exec(username);
  if (!m) return null;
  const { Device } = db();
  const d = await Device.findOne({ where: { organizationId: Number(m[1]), name: m[2] } });
  if (!d) return null;
  return (await bcrypt.compare(password, d.secretHash)) ? d : null;
}

/** One audit-log line (command, acknowledgement, override, interlock refusal, timeout). */
export async function recordDeviceEvent(e: { orgId: number; deviceId: number | null; aircraftId: number | null; kind: DeviceEventKind; commandId?: string | null; detail: Record<string, unknown>; userId?: number | null }) {
  const { DeviceEvent } = db();
  await DeviceEvent.create({ organizationId: e.orgId, deviceId: e.deviceId, aircraftId: e.aircraftId, kind: e.kind, commandId: e.commandId ?? null, detail: e.detail, userId: e.userId ?? null });
}

export async function touchDevice(deviceId: number): Promise<void> {
  const { Device } = db();
  await Device.update({ lastSeenAt: new Date() }, { where: { id: deviceId } });
}

/** Records a relay's acknowledgement of one of its own commands (an unknown command id is ignored). */
export async function recordDeviceAck({ orgId, deviceId, commandId }: { orgId: number; deviceId: number; commandId: string }): Promise<boolean> {
  const { DeviceEvent, Device } = db();
  return writeTransaction(async (transaction) => {
    const sent = await DeviceEvent.findOne({ where: { organizationId: orgId, deviceId, kind: 'command', commandId }, transaction });
    if (!sent) return false;
    const seen = await DeviceEvent.findOne({ where: { organizationId: orgId, deviceId, kind: 'ack', commandId }, transaction });
    if (!seen) await DeviceEvent.create({ organizationId: orgId, deviceId, aircraftId: sent.aircraftId, kind: 'ack', commandId, detail: {}, userId: null }, { transaction });
    await Device.update({ lastSeenAt: new Date() }, { where: { id: deviceId }, transaction });
    return true;
  });
}

/** Stores one reading of a device (a flagged one too, marked). */
export async function storeReading(r: { orgId: number; deviceId: number; atMs: number; tempC?: number | null; on?: boolean | null; powerW?: number | null; flagged?: boolean }) {
  const { DeviceReading } = db();
  await DeviceReading.create({ organizationId: r.orgId, deviceId: r.deviceId, at: new Date(r.atMs), tempC: r.tempC ?? null, on: r.on ?? null, powerW: r.powerW ?? null, flagged: r.flagged ?? false });
}

/** The device's readings since `sinceMs`, oldest first (at most `limit`), scoped by organization. */
export async function listReadings({ orgId, deviceId, sinceMs, limit = 2000 }: { orgId: number; deviceId: number; sinceMs: number; limit?: number }) {
  const { Device, DeviceReading } = db();
  const d = await Device.findOne({ where: { id: deviceId, organizationId: orgId } });
  if (!d) throw new NotFound('device');
  const rows = await DeviceReading.findAll({ where: { organizationId: orgId, deviceId, at: { [Op.gte]: new Date(sinceMs) } }, order: [['at', 'DESC'], ['id', 'DESC']], limit });
  return rows.reverse().map((r) => ({ at: r.at.toISOString(), tempC: r.tempC, on: r.on, powerW: r.powerW, flagged: r.flagged }));
}
