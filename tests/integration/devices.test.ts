import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import mqtt from 'mqtt';
import { call, DEMO, freshDatabase, signInAs, signOut } from './helpers';
import type { EmbeddedBroker } from '@/lib/devices/broker';

let route: typeof import('@/app/api/devices/route');
let one: typeof import('@/app/api/devices/[id]/route');
let data: typeof import('@/lib/data/devices');
let models: ReturnType<Awaited<typeof import('@/models')>['db']>;
let broker: EmbeddedBroker;
const received: { channel: string; payload: string }[] = [];

beforeAll(async () => {
  models = await freshDatabase();
  route = await import('@/app/api/devices/route');
  one = await import('@/app/api/devices/[id]/route');
  data = await import('@/lib/data/devices');
  const { startEmbeddedBroker } = await import('@/lib/devices/broker');
  broker = await startEmbeddedBroker(0, {
    authenticate: async (u, p) => {
      const d = await data.authenticateDevice(u, p);
      return d ? { id: d.id, orgId: d.organizationId, name: d.name } : null;
    },
    onDeviceMessage: (_d, channel, payload) => void received.push({ channel, payload: payload.toString() }),
  });
});

afterAll(async () => {
  await broker?.close();
});

function connect(username: string, password: string): Promise<mqtt.MqttClient> {
  return new Promise((resolve, reject) => {
    const c = mqtt.connect(`mqtt://127.0.0.1:${broker.port}`, { username, password, reconnectPeriod: 0, connectTimeout: 5000 });
    c.once('connect', () => resolve(c));
    c.once('error', (err) => {
      c.end(true);
      reject(err);
    });
  });
}

async function aircraftOf(email: string) {
  const u = (await models.User.findOne({ where: { email } }))!;
  return (await models.Aircraft.findOne({ where: { organizationId: u.organizationId } }))!;
}

describe('devices', () => {
  let creds: { username: string; password: string; topicPrefix: string; id: number };

  it('needs a session and aircraft:edit', async () => {
    signOut();
    expect((await call(route.GET as never, {})).status).toBe(401);
    await signInAs(DEMO.pilot);
    expect((await call(route.GET as never, {})).status).toBe(403);
  });

  it('refuses bad input naming the field, and another organization\'s aircraft', async () => {
    await signInAs(DEMO.operator);
    const bad = await call(route.POST as never, { method: 'POST', body: { kind: 'probe', label: 'Sump\u0000' } });
    expect(bad.status).toBe(422);
    const fields = (bad.body as { fields: { field: string }[] }).fields.map((f) => f.field);
    expect(fields).toContain('label');
    const noMeasure = await call(route.POST as never, { method: 'POST', body: { kind: 'probe', label: 'Sump' } });
    expect((noMeasure.body as { fields: { field: string }[] }).fields.map((f) => f.field)).toEqual(['measures', 'aircraftId']);
    const other = await aircraftOf(DEMO.otherManager);
    expect((await call(route.POST as never, { method: 'POST', body: { kind: 'relay', label: 'R', aircraftId: other.id } })).status).toBe(404);
  });

  it('adds a relay, shows its password once and stores only a hash', async () => {
    await signInAs(DEMO.operator);
    const a = await aircraftOf(DEMO.operator);
    const res = await call(route.POST as never, { method: 'POST', body: { kind: 'relay', label: 'Nose heater relay', aircraftId: a.id } });
    expect(res.status).toBe(201);
    const body = res.body as { device: { id: number; username: string; topicPrefix: string }; password: string };
    expect(body.password.length).toBeGreaterThanOrEqual(20);
    creds = { ...body.device, password: body.password };
    const row = (await models.Device.findByPk(body.device.id))!;
    expect(row.secretHash).not.toContain(body.password);
    const list = await call(route.GET as never, {});
    expect(JSON.stringify(list.body)).not.toContain(body.password);
  });

  it('the broker refuses wrong credentials', async () => {
    await expect(connect(creds.username, 'wrong-password')).rejects.toThrow();
    await expect(connect('1.nosuchdevice', 'x')).rejects.toThrow();
  });

  it('a device publishes under its own topics only, and subscribes only there', async () => {
    const c = await connect(creds.username, creds.password);
    await c.publishAsync(`${creds.topicPrefix}ack`, JSON.stringify({ commandId: 'c1' }), { qos: 1 });
    // Outside its own topics: aedes drops the connection of a client whose publication is refused.
    const closed = new Promise<void>((r) => c.once('close', () => r()));
    c.publish('thawline/v1/999/other/temp', '{"tempC":5}', { qos: 1 });
    await closed;
    expect(received).toEqual([{ channel: 'ack', payload: '{"commandId":"c1"}' }]);
    c.end(true);

    const s = await connect(creds.username, creds.password);
    // Refused with SUBACK failure 0x80 (the client rejects the promise); its own cmd topic is granted.
    await expect(s.subscribeAsync('thawline/v1/#', { qos: 1 })).rejects.toThrow(/Subscribe error/);
    const granted = await s.subscribeAsync(`${creds.topicPrefix}cmd`, { qos: 1 });
    expect(granted.map((g) => g.qos)).toEqual([1]);
    // Commands from the server reach it (retained: a late subscriber gets the schedule too).
    const got = new Promise<string>((r) => s.once('message', (_t, p) => r(p.toString())));
    await broker.publish(`${creds.topicPrefix}cmd`, '{"commandId":"c2"}', { retain: true });
    expect(await got).toBe('{"commandId":"c2"}');
    s.end(true);
  });

  it('stores probe readings, flags impossible ones, and serves them org-scoped', async () => {
    const { ensureBroker, stopBroker } = await import('@/lib/devices/service');
    const b = await ensureBroker(0);
    try {
      await signInAs(DEMO.operator);
      const a = await aircraftOf(DEMO.operator);
      const made = await call(route.POST as never, { method: 'POST', body: { kind: 'probe', measures: 'oil', label: 'Sump probe', aircraftId: a.id } });
      const p = made.body as { device: { id: number; username: string; topicPrefix: string }; password: string };
      const c = await mqtt.connectAsync(`mqtt://127.0.0.1:${b.port}`, { username: p.device.username, password: p.password, reconnectPeriod: 0 });
      await c.publishAsync(`${p.device.topicPrefix}temp`, JSON.stringify({ tempC: -4.25 }), { qos: 1 });
      await c.publishAsync(`${p.device.topicPrefix}temp`, JSON.stringify({ tempC: 850 }), { qos: 1 });
      await c.publishAsync(`${p.device.topicPrefix}temp`, 'not json', { qos: 1 });
      await new Promise((r) => setTimeout(r, 300));
      await c.endAsync();
      const readings = await import('@/app/api/devices/[id]/readings/route');
      const res = await call(readings.GET as never, { params: { id: String(p.device.id) } });
      expect(res.status).toBe(200);
      const list = (res.body as { readings: { tempC: number; flagged: boolean }[] }).readings;
      expect(list.map((r) => [r.tempC, r.flagged])).toEqual([[-4.25, false], [850, true]]);
      await signInAs(DEMO.otherManager);
      expect((await call(readings.GET as never, { params: { id: String(p.device.id) } })).status).toBe(404);
    } finally {
      await stopBroker();
    }
  });

  it('a taken port fails only the broker start (EADDRINUSE, reported as port-in-use by lib/jobs)', async () => {
    const { startEmbeddedBroker } = await import('@/lib/devices/broker');
    await expect(startEmbeddedBroker(broker.port, { authenticate: async () => null })).rejects.toMatchObject({ code: 'EADDRINUSE' });
  });

  it('removing a device stops its credentials', async () => {
    await signInAs(DEMO.operator);
    expect((await call(one.DELETE as never, { method: 'DELETE', params: { id: String(creds.id) } })).status).toBe(200);
    await expect(connect(creds.username, creds.password)).rejects.toThrow();
  });
});
