// npm run devices:simulate — device simulator for the demo. Signs in to the broker as simulated relays
// and probes of every aircraft with a relay-controlled heater (created on first run, labelled
// "Simulated …"; their passwords are re-issued at each start, only theirs), obeys commands (on inside
// a window, off from the expiry on even when the server is gone), acknowledges them, and publishes relay
// state and oil temperatures from the soak model (lib/nowcast stepping, Gaussian noise).
// Options: --url mqtt://127.0.0.1:1883 (default: MQTT_URL, else the embedded broker's port)
//          --every 10 (seconds between readings), --shelter -5 (shelter air °C), --noise 0.1 (K σ)
import { randomBytes } from 'node:crypto';
import bcrypt from 'bcryptjs';
import mqtt from 'mqtt';
import { db } from '@/models';
import { env } from '@/lib/env';
import { deviceTopic, mqttUsername } from '@/lib/devices/topics';
import { parseAck, relayOnAt, type RelayCommand } from '@/lib/devices/commands';
import { initialState, nowcastModel, predict } from '@/lib/nowcast/kalman';

function arg(name: string, fallback: string): string {
  const i = process.argv.indexOf(`--${name}`);
  return i > 0 && process.argv[i + 1] ? process.argv[i + 1] : fallback;
}

function gaussian(): number {
  const u = 1 - Math.random();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * Math.random());
}

async function simulatedDevice(orgId: number, aircraftId: number, kind: 'relay' | 'probe', label: string) {
  const { Device } = db();
  const password = randomBytes(18).toString('base64url');
  const secretHash = await bcrypt.hash(password, 10);
  let d = await Device.findOne({ where: { organizationId: orgId, aircraftId, kind, label } });
  if (d) await d.update({ secretHash });
  else
    d = await Device.create({
      organizationId: orgId, kind, measures: kind === 'probe' ? 'oil' : null, aircraftId, shelterId: null, label,
      name: `${kind === 'relay' ? 'r' : 'p'}${randomBytes(5).toString('hex')}`, secretHash, lastSeenAt: null,
    });
  return { device: d, password };
}

async function main() {
  const e = env();
  const url = arg('url', e.MQTT_URL ?? `mqtt://127.0.0.1:${e.MQTT_BROKER_PORT}`);
  const everyS = Number(arg('every', '10'));
  const shelterC = Number(arg('shelter', '-5'));
  const noiseK = Number(arg('noise', '0.1'));
  const { Heater, Aircraft } = db();
  const heaters = await Heater.findAll({ where: { control: 'relay' }, order: [['aircraftId', 'ASC']] });
  const aircraftIds = [...new Set(heaters.map((h) => h.aircraftId))];
  if (!aircraftIds.length) console.log('No aircraft has a relay-controlled heater: set one heater to "Switched relay" first.');
  for (const id of aircraftIds) {
    const a = (await Aircraft.findByPk(id))!;
    const relay = await simulatedDevice(a.organizationId, a.id, 'relay', `Simulated relay ${a.registration}`);
    const probe = await simulatedDevice(a.organizationId, a.id, 'probe', `Simulated oil probe ${a.registration}`);
    const oil = a.thermal.nodes.find((n) => n.name === 'oil')!;
    const eng = a.thermal.nodes.find((n) => n.name === 'engine');
    const model = nowcastModel({ oil, engine: eng, couplingWPerK: a.thermal.couplingWPerK });
    const power = heaters.filter((h) => h.aircraftId === id && h.kind !== 'forced-air-propane');
    let state = initialState(model, [shelterC + 2, shelterC + 2], 0);
    let command: RelayCommand | null = null;
    const orgId = a.organizationId;
    const rc = mqtt.connect(url, { username: mqttUsername(orgId, relay.device.name), password: relay.password });
    const pc = mqtt.connect(url, { username: mqttUsername(orgId, probe.device.name), password: probe.password });
    rc.on('connect', () => {
      console.log(`[sim] relay of ${a.registration} connected`);
      void rc.subscribeAsync(deviceTopic(orgId, relay.device.name, 'cmd'), { qos: 1 });
    });
    rc.on('message', (_t, payload) => {
      try {
        const c = JSON.parse(payload.toString()) as RelayCommand;
        command = c;
        const ack = parseAck(JSON.stringify({ commandId: c.commandId }));
        if (ack) rc.publish(deviceTopic(orgId, relay.device.name, 'ack'), JSON.stringify(ack), { qos: 1 });
        console.log(`[sim] relay of ${a.registration}: command ${c.commandId}, ${c.windows.length} window(s), expires ${c.expiresAt}`);
      } catch {
        console.log(`[sim] relay of ${a.registration}: unreadable command ignored`);
      }
    });
    for (const c of [rc, pc]) c.on('error', (err) => console.log(`[sim] ${a.registration}: ${err.message}`));
    setInterval(() => {
      const now = Date.now();
      const on = command ? relayOnAt(command, now) : false; // expiry honoured with or without the server
      const watts = on ? power.reduce((s, h) => s + h.powerW, 0) : 0;
      const byNode = { oil: on ? power.filter((h) => h.node === 'oil').reduce((s, h) => s + h.powerW, 0) : 0, engine: on ? power.filter((h) => h.node === 'engine').reduce((s, h) => s + h.powerW, 0) : 0 };
      state = predict(model, state, everyS, { shelterC0: shelterC, shelterC1: shelterC, powerW: byNode }, { processK2PerHour: 0, measurementK2: 0 });
      const at = new Date(now).toISOString();
      rc.publish(deviceTopic(orgId, relay.device.name, 'state'), JSON.stringify({ on, powerW: watts, at }));
      pc.publish(deviceTopic(orgId, probe.device.name, 'temp'), JSON.stringify({ tempC: Math.round((state.x[0] + noiseK * gaussian()) * 100) / 100, at }));
    }, everyS * 1000);
  }
}

main().catch((err) => {
  console.error('[sim] failed:', err instanceof Error ? err.message : 'error');
  process.exit(1);
});
