// The embedded MQTT broker (aedes) on 127.0.0.1, used when MQTT_URL is not set, so the whole device
// loop runs offline. Devices sign in with their generated credentials (checked against the stored bcrypt
// hash); the ACL lets a device subscribe only under its own prefix and publish only its own ack, state
// and temp topics. The server itself publishes in-process (no credentials), as the only sender on cmd.
import { createServer, type Server } from 'node:net';
import type { AddressInfo } from 'node:net';
import { Aedes, type Client } from 'aedes';
import { describeError } from '@/lib/log';
import { parseDeviceTopic, withinOwnTopics } from './topics';

export interface DeviceIdentity {
  id: number;
  orgId: number;
  name: string;
}

export interface BrokerHooks {
  /** Checks a device's credentials; null refuses the connection. */
  authenticate(username: string, password: string): Promise<DeviceIdentity | null>;
  /** A device published on one of its own topics (ack, state or temp). */
  onDeviceMessage?(device: DeviceIdentity, channel: 'ack' | 'state' | 'temp', payload: Buffer): void | Promise<void>;
}

export interface EmbeddedBroker {
  port: number;
  aedes: Aedes;
  /** Publishes from the server (QoS 1 by default). */
  publish(topic: string, payload: string, opts?: { retain?: boolean; qos?: 0 | 1 }): Promise<void>;
  close(): Promise<void>;
}

const identities = new WeakMap<Client, DeviceIdentity>();

export async function startEmbeddedBroker(port: number, hooks: BrokerHooks): Promise<EmbeddedBroker> {
  const aedes = await Aedes.createBroker({
    authenticate(client, username, password, done) {
      if (!username || !password) {
        done(Object.assign(new Error('bad credentials'), { returnCode: 4 }) as never, false);
        return;
      }
      hooks
        .authenticate(username, password.toString('utf8'))
        .then((d) => {
          if (!d) return done(Object.assign(new Error('bad credentials'), { returnCode: 4 }) as never, false);
          identities.set(client, d);
          done(null, true);
        })
        .catch((err) => {
          console.error('[thawline] broker authentication failed:', describeError(err));
          done(Object.assign(new Error('server unavailable'), { returnCode: 3 }) as never, false);
        });
    },
    authorizePublish(client, packet, done) {
      if (!client) return done(null); // the server's own publications
      const d = identities.get(client);
      const t = parseDeviceTopic(packet.topic);
      if (!d || !t || t.orgId !== d.orgId || t.deviceName !== d.name || t.channel === 'cmd') return done(new Error('not your topic'));
      done(null);
    },
    authorizeSubscribe(client, sub, done) {
      const d = client ? identities.get(client) : undefined;
      // A refused filter is answered with the failure code 0x80 in SUBACK (the connection stays up).
      if (!d || !withinOwnTopics(d.orgId, d.name, sub.topic)) return done(null, null);
      done(null, sub);
    },
  });
  aedes.on('publish', (packet, client) => {
    if (!client || !hooks.onDeviceMessage) return;
    const d = identities.get(client);
    const t = parseDeviceTopic(packet.topic);
    if (!d || !t || t.channel === 'cmd') return;
    Promise.resolve(hooks.onDeviceMessage(d, t.channel, Buffer.from(packet.payload))).catch((err) =>
      console.error(`[thawline] device message of device ${d.id} not handled:`, describeError(err)),
    );
  });
  const server: Server = createServer(aedes.handle);
  try {
    await new Promise<void>((resolve, reject) => {
      server.once('error', reject);
      server.listen(port, '127.0.0.1', () => resolve());
    });
  } catch (err) {
    await new Promise<void>((r) => aedes.close(() => r()));
    throw err;
  }
  return {
    port: (server.address() as AddressInfo).port,
    aedes,
    publish: (topic, payload, opts = {}) =>
      new Promise((resolve, reject) =>
        aedes.publish(
          { cmd: 'publish', topic, payload: Buffer.from(payload), qos: opts.qos ?? 1, retain: opts.retain ?? false, dup: false },
          (err) => (err ? reject(err) : resolve()),
        ),
      ),
    close: () =>
      new Promise<void>((resolve) => {
        server.close(() => aedes.close(() => resolve()));
        const clients = (aedes as unknown as { clients?: Record<string, Client> }).clients ?? {};
        for (const c of Object.values(clients)) c.close();
      }),
  };
}
