// This process's device link: the embedded broker (when MQTT_URL is not set) wired to the stored
// device credentials, and what devices report (acknowledgements into the audit log, last-seen times).
import { authenticateDevice, recordDeviceAck, touchDevice } from '@/lib/data/devices';
import { startEmbeddedBroker, type EmbeddedBroker } from './broker';
import { parseAck } from './commands';

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
      if (channel !== 'ack') return touchDevice(device.id);
      const ack = parseAck(payload.toString('utf8'));
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
