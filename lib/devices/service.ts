// This process's device link: the embedded broker (when MQTT_URL is not set) wired to the stored
// device credentials, and what devices report (acknowledgements into the audit log, last-seen times).
import { authenticateDevice, recordDeviceAck, storeReading, touchDevice } from '@/lib/data/devices';
import { startEmbeddedBroker, type EmbeddedBroker } from './broker';
import { parseAck, parseState, parseTemp } from './commands';

const g = globalThis as unknown as { __thawlineBroker?: Promise<EmbeddedBroker> };

/** Starts the embedded broker once per process; a failure (port taken) rejects and can be retried. */
export function ensureBroker(port: number): Promise<EmbeddedBroker> {
  g.__thawlineBroker ??= startEmbeddedBroker(port, {
    authenticate: async (username, password) => {
      const d = await authenticateDevice(username, password);
      if (!d) return null;
      await touchDevice(d.id);
      return { id: d.id, orgId: d.organizationId, name: d.name };
    },
    onDeviceMessage: async (device, channel, payload) => {
      const text = payload.toString('utf8');
      if (channel === 'temp' || channel === 'state') {
        const nowMs = Date.now();
        const t = channel === 'temp' ? parseTemp(text, nowMs) : null;
        const s = channel === 'state' ? parseState(text, nowMs) : null;
        if (t) await storeReading({ orgId: device.orgId, deviceId: device.id, atMs: t.atMs, tempC: t.tempC, flagged: t.flagged });
        if (s) await storeReading({ orgId: device.orgId, deviceId: device.id, atMs: s.atMs, on: s.on, powerW: s.powerW });
        return touchDevice(device.id);
      }
      const ack = parseAck(text);
      if (ack) await recordDeviceAck({ orgId: device.orgId, deviceId: device.id, commandId: ack.commandId });
    },
  }).catch((err) => {
    g.__thawlineBroker = undefined;
    throw err;
  });
  return g.__thawlineBroker;
}

export async function runningBroker(): Promise<EmbeddedBroker | null> {
  return (await g.__thawlineBroker?.catch(() => null)) ?? null;
}

export async function stopBroker(): Promise<void> {
  const b = await runningBroker();
  g.__thawlineBroker = undefined;
  await b?.close();
}
