// The device contract's topic namespace (pure; documented in the README, "Device contract").
//   thawline/v1/<orgId>/<deviceName>/cmd     server → relay (retained, QoS 1): the switching schedule
//   thawline/v1/<orgId>/<deviceName>/ack     relay → server: the command id it accepted
//   thawline/v1/<orgId>/<deviceName>/state   relay → server: on/off and measured power
//   thawline/v1/<orgId>/<deviceName>/temp    probe → server: a temperature reading
// A device may publish and subscribe only under its own prefix.
export const TOPIC_ROOT = 'thawline/v1';
export const DEVICE_CHANNELS = ['cmd', 'ack', 'state', 'temp'] as const;
export type DeviceChannel = (typeof DEVICE_CHANNELS)[number];

export const DEVICE_KINDS = ['relay', 'probe'] as const;
export type DeviceKind = (typeof DEVICE_KINDS)[number];
export const PROBE_MEASURES = ['oil', 'engine', 'shelter'] as const;
export type ProbeMeasure = (typeof PROBE_MEASURES)[number];

/** The device's own prefix, ending in '/'. */
export function devicePrefix(orgId: number, deviceName: string): string {
  return `${TOPIC_ROOT}/${orgId}/${deviceName}/`;
}

export function deviceTopic(orgId: number, deviceName: string, channel: DeviceChannel): string {
  return `${devicePrefix(orgId, deviceName)}${channel}`;
}

/** Whether a topic or subscription filter stays inside the device's own prefix (no wildcard above it). */
export function withinOwnTopics(orgId: number, deviceName: string, topicOrFilter: string): boolean {
  const prefix = devicePrefix(orgId, deviceName);
  if (!topicOrFilter.startsWith(prefix)) return false;
  const rest = topicOrFilter.slice(prefix.length);
  return rest.length > 0 && !rest.startsWith('/');
}

/** Splits a topic into its org, device and channel, or null when it is not a device topic. */
export function parseDeviceTopic(topic: string): { orgId: number; deviceName: string; channel: DeviceChannel } | null {
  const parts = topic.split('/');
  if (parts.length !== 5 || `${parts[0]}/${parts[1]}` !== TOPIC_ROOT) return null;
  const orgId = Number(parts[2]);
  const channel = parts[4] as DeviceChannel;
  if (!Number.isInteger(orgId) || orgId <= 0 || !DEVICE_CHANNELS.includes(channel)) return null;
  return { orgId, deviceName: parts[3], channel };
}

/** MQTT user names are `<orgId>.<deviceName>` so the broker can find the device without a scan. */
export function mqttUsername(orgId: number, deviceName: string): string {
  return `${orgId}.${deviceName}`;
}
