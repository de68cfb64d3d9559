// The relay dispatch job: for relay-controlled heaters of confirmed heat plans, publish the schedule
// ahead (QoS 1, retained, re-sent every run with the same command id so a broker restart loses nothing
// and a relay never sees a command twice as two), record every command and interlock refusal, and raise
// an operator alert that doubles as the switch-on reminder when a relay has not acknowledged in a minute.
import { createHash } from 'node:crypto';
import { Op } from 'sequelize';
import { db } from '@/models';
import { logSkipped } from '@/lib/log';
import { can } from '@/lib/auth/permissions';
import { recordDeviceEvent } from '@/lib/data/devices';
import { ACK_TIMEOUT_MS, applyInterlocks, relayCommand, type OnWindow } from './commands';
import { deviceTopic } from './topics';

const MIN = 60_000;
/** Commands go out this far ahead of the first switch-on. */
export const DISPATCH_HORIZON_MS = 24 * 60 * MIN;
/** After departure the aircraft counts as flying for this long (estimate: until it is back and marked parked). */
const FLYING_AFTER_DEPARTURE_MS = 12 * 60 * MIN;

export type Publish = (topic: string, payload: string, opts: { qos: 1; retain: boolean }) => Promise<void>;

export interface DispatchReport {
  sent: number;
  resent: number;
  refusals: number;
  timeouts: number;
  skipped: number;
}

function commandIdOf(deviceId: number, windows: OnWindow[]): string {
  return createHash('sha256').update(`${deviceId}|${JSON.stringify(windows)}`).digest('base64url').slice(0, 22);
}

export async function dispatchRelayCommands({ now, publish }: { now: Date; publish: Publish }): Promise<DispatchReport> {
  const { HeatPlan, Departure, Device, Heater, DeviceEvent, User, Alert } = db();
  const nowMs = now.getTime();
  const report: DispatchReport = { sent: 0, resent: 0, refusals: 0, timeouts: 0, skipped: 0 };
  const plans = await HeatPlan.findAll({ where: { confirmedAt: { [Op.ne]: null } }, order: [['id', 'ASC']] });
  for (const plan of plans) {
    try {
      if (!plan.confirmedKey || plan.confirmedKey !== plan.inputsKey) continue; // confirmation no longer holds
      const dep = await Departure.findOne({ where: { id: plan.departureId, organizationId: plan.organizationId, cancelledAt: null } });
      if (!dep || dep.departAt.getTime() <= nowMs) continue;
      const result = plan.result as { heaterOn?: { fromMs: number; toMs: number }[] } | null;
      const asked = (result?.heaterOn ?? []).map((i) => ({ fromMs: i.fromMs, untilMs: i.toMs })).filter((w) => w.untilMs > nowMs);
      if (!asked.length || asked[0].fromMs - nowMs > DISPATCH_HORIZON_MS) continue;
      const relays = await Device.findAll({ where: { organizationId: plan.organizationId, aircraftId: dep.aircraftId, kind: 'relay' }, order: [['id', 'ASC']] });
      if (!relays.length) continue;
      const heaters = await Heater.findAll({ where: { aircraftId: dep.aircraftId, control: 'relay' }, order: [['id', 'ASC']] });
      if (!heaters.length) continue;
      const departMs = dep.departAt.getTime();
      const flying = [{ fromMs: departMs, untilMs: departMs + FLYING_AFTER_DEPARTURE_MS }];
      // One relay switches all the aircraft's relay-controlled heaters: every heater's interlocks apply.
      let windows = asked;
      const refusals: { heaterId: number; reason: string; window: OnWindow }[] = [];
      for (const h of heaters) {
        const r = applyInterlocks({ heaterKind: h.kind, windows, flying });
        for (const x of r.refusals) refusals.push({ heaterId: h.id, reason: x.reason, window: x.window });
        windows = r.windows;
      }
      for (const relay of relays) {
        const commandId = commandIdOf(relay.id, windows);
        const known = await DeviceEvent.findOne({ where: { organizationId: plan.organizationId, deviceId: relay.id, kind: 'command', commandId } });
        // The job's clock (not the row's createdAt) dates a command: tests and replays pass `now`.
        const sentAtMs = known ? Number((known.detail as { sentAtMs?: unknown }).sentAtMs ?? known.createdAt.getTime()) : nowMs;
        const cmd = relayCommand({ commandId, nowMs: sentAtMs, windows });
        await publish(deviceTopic(plan.organizationId, relay.name, 'cmd'), JSON.stringify(cmd), { qos: 1, retain: true });
        if (known) {
          report.resent++;
        } else {
          report.sent++;
          await recordDeviceEvent({ orgId: plan.organizationId, deviceId: relay.id, aircraftId: dep.aircraftId, kind: 'command', commandId, detail: { departureId: dep.id, planId: plan.id, sentAtMs, command: cmd } });
          for (const x of refusals) {
            report.refusals++;
            await recordDeviceEvent({ orgId: plan.organizationId, deviceId: relay.id, aircraftId: dep.aircraftId, kind: 'refusal', commandId, detail: { heaterId: x.heaterId, reason: x.reason, from: new Date(x.window.fromMs).toISOString(), until: new Date(x.window.untilMs).toISOString() } });
          }
          continue;
        }
        // Acknowledged within a minute? Otherwise: once per command, an alert with the switch-on time.
        const acked = await DeviceEvent.findOne({ where: { deviceId: relay.id, kind: { [Op.in]: ['ack', 'timeout'] }, commandId } });
        if (acked || nowMs - sentAtMs <= ACK_TIMEOUT_MS) continue;
        report.timeouts++;
        await recordDeviceEvent({ orgId: plan.organizationId, deviceId: relay.id, aircraftId: dep.aircraftId, kind: 'timeout', commandId, detail: { departureId: dep.id } });
        const switchOn = windows[0] ? new Date(windows[0].fromMs) : null;
        const users = await User.findAll({ where: { organizationId: plan.organizationId, active: true }, order: [['id', 'ASC']] });
        for (const u of users.filter((x) => can(x.role, 'aircraft:edit'))) {
          await Alert.create({
            organizationId: plan.organizationId,
            userId: u.id,
            kind: 'switch-on',
            subjectKey: `relay-silent:d${dep.id}:${commandId}`,
            revision: 1,
            departureId: dep.id,
            airfieldId: null,
            title: `Relay "${relay.label}" did not answer: switch the heater on by hand${switchOn ? ` at ${switchOn.toISOString().slice(11, 16)} UTC` : ''}`,
            data: { relayId: relay.id, departureId: dep.id, switchOnAt: switchOn?.toISOString() ?? null, fallback: 'manual-switch-on' },
            state: { commandId },
            link: '/board',
          });
        }
      }
    } catch (err) {
      report.skipped++;
      logSkipped('relay dispatch of a plan', { org: plan.organizationId, plan: plan.id }, err);
    }
  }
  return report;
}
