import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import mqtt from 'mqtt';
import { call, DEMO, freshDatabase, signInAs } from './helpers';
import type { EmbeddedBroker } from '@/lib/devices/broker';

let models: ReturnType<Awaited<typeof import('@/models')>['db']>;
let broker: EmbeddedBroker;
let data: typeof import('@/lib/data/devices');
let dispatch: typeof import('@/lib/devices/dispatch');

beforeAll(async () => {
  models = await freshDatabase();
  data = await import('@/lib/data/devices');
  dispatch = await import('@/lib/devices/dispatch');
  const { ensureBroker } = await import('@/lib/devices/service');
  broker = await ensureBroker(0);
});

afterAll(async () => {
  const { stopBroker } = await import('@/lib/devices/service');
  await stopBroker();
});

const NOW = new Date(Date.UTC(2027, 0, 14, 20));
const H = 3_600_000;

async function setup() {
  const op = (await models.User.findOne({ where: { email: DEMO.operator } }))!;
  const orgId = op.organizationId;
  const aircraft = (await models.Aircraft.findOne({ where: { organizationId: orgId }, order: [['id', 'ASC']] }))!;
  await models.Heater.destroy({ where: { aircraftId: aircraft.id } });
  await models.Heater.create({ organizationId: orgId, aircraftId: aircraft.id, kind: 'oil-pad', powerW: 200, node: 'oil', control: 'relay', slotMinutes: 5 } as never);
  const dep = await models.Departure.create({ organizationId: orgId, aircraftId: aircraft.id, pilotId: op.id, bookedById: op.id, departAt: new Date(NOW.getTime() + 12 * H), readyC: 20 } as never);
  const heaterOn = [
    { fromMs: NOW.getTime() + 9 * H, toMs: NOW.getTime() + 10 * H },
    { fromMs: NOW.getTime() + 11 * H, toMs: NOW.getTime() + 13 * H }, // runs past departure: cut by the flying interlock
  ];
  await models.HeatPlan.create({
    organizationId: orgId, departureId: dep.id, inputsKey: 'k1', computedAt: NOW, status: 'warming', oilAtDepartureC: 21, energyKWh: 0.6,
    result: { heaterOn }, confirmedAt: NOW, confirmedKey: 'k1', confirmedById: op.id,
  } as never);
  const { device, password } = await data.createDevice({ orgId, input: { kind: 'relay', label: 'Relay A', aircraftId: aircraft.id } });
  return { orgId, aircraft, dep, device, password };
}

describe('relay commands from a confirmed plan (embedded broker, real client)', () => {
  it('sends the schedule with a hard expiry, records the acknowledgement, re-sends without doubling, and alerts on silence', async () => {
    const s = await setup();
    const relay = await mqtt.connectAsync(`mqtt://127.0.0.1:${broker.port}`, { username: s.device.username, password: s.password, reconnectPeriod: 0 });
    const got: string[] = [];
    relay.on('message', (_t, p) => got.push(p.toString()));
    await relay.subscribeAsync(`${s.device.topicPrefix}cmd`, { qos: 1 });
    const publish = broker.publish.bind(broker) as never;

    const r1 = await dispatch.dispatchRelayCommands({ now: NOW, publish });
    expect(r1).toMatchObject({ sent: 1, refusals: 1, skipped: 0 });
    await new Promise((r) => setTimeout(r, 200));
    const cmd = JSON.parse(got[0]);
    expect(cmd.windows).toEqual([
      { from: new Date(NOW.getTime() + 9 * H).toISOString(), until: new Date(NOW.getTime() + 10 * H).toISOString() },
      { from: new Date(NOW.getTime() + 11 * H).toISOString(), until: new Date(NOW.getTime() + 12 * H).toISOString() },
    ]);
    expect(cmd.expiresAt).toBe(new Date(NOW.getTime() + 12 * H).toISOString());

    // A broker restart loses nothing: the next run re-sends the same command id, recorded once.
    const r2 = await dispatch.dispatchRelayCommands({ now: new Date(NOW.getTime() + 30_000), publish });
    expect(r2).toMatchObject({ sent: 0, resent: 1, timeouts: 0 });
    await new Promise((r) => setTimeout(r, 200));
    expect(JSON.parse(got[got.length - 1]).commandId).toBe(cmd.commandId);

    await relay.publishAsync(`${s.device.topicPrefix}ack`, JSON.stringify({ commandId: cmd.commandId }), { qos: 1 });
    await new Promise((r) => setTimeout(r, 300));
    const events = await models.DeviceEvent.findAll({ where: { deviceId: s.device.id }, order: [['id', 'ASC']] });
    expect(events.map((e) => e.kind)).toEqual(['command', 'refusal', 'ack']);
    expect(events[1].detail).toMatchObject({ reason: 'aircraft-flying' });
    await relay.endAsync();

    // Acknowledged: no alert after the minute.
    const r3 = await dispatch.dispatchRelayCommands({ now: new Date(NOW.getTime() + 5 * 60_000), publish });
    expect(r3.timeouts).toBe(0);

    // A second relay that never answers: after a minute, one timeout and an alert per operator, once.
    const silent = await data.createDevice({ orgId: s.orgId, input: { kind: 'relay', label: 'Relay B', aircraftId: s.aircraft.id } });
    await dispatch.dispatchRelayCommands({ now: new Date(NOW.getTime() + 6 * 60_000), publish });
    const r4 = await dispatch.dispatchRelayCommands({ now: new Date(NOW.getTime() + 8 * 60_000), publish });
    expect(r4.timeouts).toBe(1);
    const r5 = await dispatch.dispatchRelayCommands({ now: new Date(NOW.getTime() + 9 * 60_000), publish });
    expect(r5.timeouts).toBe(0);
    const alerts = await models.Alert.findAll({ where: { organizationId: s.orgId, departureId: s.dep.id } });
    expect(alerts.length).toBeGreaterThan(0);
    expect(alerts[0].title).toContain('Relay B');
    expect((await models.DeviceEvent.findAll({ where: { deviceId: silent.device.id, kind: 'timeout' } })).length).toBe(1);
  });

  it('manual override: on now for N minutes through the interlocks, recorded with who asked; combustion heaters refused', async () => {
    const route = await import('@/app/api/devices/[id]/override/route');
    const op = await signInAs(DEMO.operator);
    const relay = (await models.Device.findOne({ where: { organizationId: op.organizationId, kind: 'relay', label: 'Relay A' } }))!;
    const bad = await call(route.POST as never, { method: 'POST', params: { id: String(relay.id) }, body: { action: 'on' } });
    expect(bad.status).toBe(422);
    expect((bad.body as { fields: { field: string }[] }).fields.map((f) => f.field)).toEqual(['minutes']);
    const ok = await call(route.POST as never, { method: 'POST', params: { id: String(relay.id) }, body: { action: 'on', minutes: 30 } });
    expect(ok.status).toBe(200);
    const cmd = (ok.body as { command: { windows: { from: string; until: string }[] } }).command;
    expect(Date.parse(cmd.windows[0].until) - Date.parse(cmd.windows[0].from)).toBe(30 * 60_000);
    const events = await models.DeviceEvent.findAll({ where: { deviceId: relay.id, kind: 'override' } });
    expect(events.map((e) => e.userId)).toEqual([op.id]);

    await models.Heater.update({ kind: 'forced-air-propane' }, { where: { aircraftId: relay.aircraftId! } });
    const refused = await call(route.POST as never, { method: 'POST', params: { id: String(relay.id) }, body: { action: 'on', minutes: 30 } });
    expect((refused.body as { refused: string[]; command: { windows: unknown[] } })).toMatchObject({ refused: ['combustion-heater'], command: { windows: [] } });

    await signInAs(DEMO.otherManager);
    expect((await call(route.POST as never, { method: 'POST', params: { id: String(relay.id) }, body: { action: 'off' } })).status).toBe(404);
  });
});
