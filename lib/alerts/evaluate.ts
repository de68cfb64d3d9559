// Alert evaluation: reads the heat plans and forecasts (refreshing a forecast older than an hour), writes in-app alerts (one revision per
// material change) and queues their e-mails in the outbox. Run by the scheduler every 10 minutes
// (cold-night notices by their own job); safe to run again at any time: nothing is sent twice.
// Organizations and recipients are evaluated independently: one that fails is logged (ids and error
// name only), counted in `skipped` and passed over, and the others still get their alerts.
import { Op } from 'sequelize';
import { db } from '@/models';
import type { AlertKind } from '@/models/Alert';
import type { User } from '@/models/User';
import { plansBetween, type PlanView } from '@/lib/data/plans';
import { tonightForAirfields } from '@/lib/data/forecasts';
import { addDays, localDateKey, localDateOf, tonightWindow, zonedTimeToUtc } from '@/lib/time';
import { enqueueMail } from '@/lib/mail/outbox';
import { minutesOfDay, quietHoursEnd } from '@/lib/mail/quiet';
import { alertLink, renderAlertMail } from '@/lib/mail/templates';
import { ALERT_ROLES } from './audience';
import { channelFor, preferencesFor, quietOf, respectsQuietHours, type Preferences } from './preferences';
import {
  coldNightTitle,
  oilTooColdTitle,
  switchOnTitle,
  type AlertData,
  type Audience,
  type ColdNightData,
  type OilTooColdData,
  type SwitchOnData,
} from './content';
import { writeTransaction } from '@/models/transaction';
import { logSkipped } from '@/lib/log';

const MIN = 60_000;
const HOUR = 60 * MIN;
/** Departures this far ahead are checked for the oil-too-cold warning. */
export const WARNING_HORIZON_MS = 36 * HOUR;
/** A change of the predicted oil at departure larger than this (K) is material and is sent again. */
export const MATERIAL_OIL_CHANGE_K = 2;
/** A switch-on time that moved by at least this much gets a new reminder. */
export const MATERIAL_SWITCH_ON_SHIFT_MS = 15 * MIN;
/** A reminder still goes this long after its switch-on time ("it was due at …"). */
export const REMINDER_GRACE_MS = 30 * MIN;
/** The cold-night notice goes within this long after the organization's notice time. */
export const NOTICE_WINDOW_MS = 3 * HOUR;

export interface EvaluationReport {
  created: number;
  unchanged: number;
  resolved: number;
  queued: number;
  heldForQuietHours: number;
  /** Alerts (or whole organizations) that failed and were skipped this time; the next run tries again. */
  skipped: number;
}

const emptyReport = (): EvaluationReport => ({ created: 0, unchanged: 0, resolved: 0, queued: 0, heldForQuietHours: 0, skipped: 0 });

interface Recipient {
  user: User;
  audience: Audience;
  prefs: Preferences;
}

interface Candidate {
  orgId: number;
  kind: AlertKind;
  subjectKey: string;
  recipient: Recipient;
  state: Record<string, unknown>;
  data: AlertData;
  title: string;
  departureId?: number | null;
  airfieldId?: number | null;
  /** A mail that could not go by then is pointless. */
  expiresAt?: Date | null;
}

type Material = (prev: Record<string, unknown>, next: Record<string, unknown>, nowMs: number) => boolean;

const MATERIAL: Record<AlertKind, Material> = {
  'oil-too-cold': (a, b) =>
    a.status !== b.status ||
    a.departAt !== b.departAt ||
    a.readyC !== b.readyC ||
    (a.oilC === null) !== (b.oilC === null) ||
    (typeof a.oilC === 'number' && typeof b.oilC === 'number' && Math.abs(a.oilC - b.oilC) > MATERIAL_OIL_CHANGE_K),
  // A heater that should already be on stays on: a later time after the one sent has passed is no news
  // (a heater too weak for its plan is told "switch on now" at every evaluation otherwise).
  'switch-on': (a, b, nowMs) =>
    a.departAt !== b.departAt ||
    (Math.abs(Number(a.switchOnMs) - Number(b.switchOnMs)) >= MATERIAL_SWITCH_ON_SHIFT_MS && !(Number(a.switchOnMs) <= nowMs && Number(b.switchOnMs) > Number(a.switchOnMs))),
  // One notice a night.
  'cold-night': () => false,
};

const round1 = (v: number | null) => (v === null ? null : Math.round(v * 10) / 10);

/** Whether a new prediction differs enough from the one last sent to be sent again. */
export function isMaterialChange(kind: AlertKind, prev: Record<string, unknown>, next: Record<string, unknown>, nowMs = 0): boolean {
  return MATERIAL[kind](prev, next, nowMs);
}

/** Writes the alert (a new revision when there is none or the change is material) and queues its e-mail. */
async function notify(c: Candidate, now: Date, report: EvaluationReport): Promise<void> {
  const before = { ...report };
  try {
    await notifyOne(c, now, report);
  } catch (err) {
    // One recipient's alert that cannot be written (a bad stored value, a database refusal) is skipped.
    Object.assign(report, before, { skipped: before.skipped + 1 });
    logSkipped('alert', { org: c.orgId, user: c.recipient.user.id, kind: c.kind, departure: c.departureId, airfield: c.airfieldId }, err);
  }
}

async function notifyOne(c: Candidate, now: Date, report: EvaluationReport): Promise<void> {
  const { Alert } = db();
  const { user, prefs, audience } = c.recipient;
  const channel = channelFor(prefs, c.kind);
  if (channel === 'off') return;
  const latest = await Alert.findOne({ where: { userId: user.id, subjectKey: c.subjectKey }, order: [['revision', 'DESC']] });
  if (latest && !latest.resolvedAt && !MATERIAL[c.kind](latest.state as Record<string, unknown>, c.state, now.getTime())) {
    // Same prediction, near enough: the shown figures follow quietly, nothing is sent.
    if (JSON.stringify(latest.data) !== JSON.stringify(c.data)) await latest.update({ data: c.data, title: c.title });
    report.unchanged++;
    return;
  }
  if (latest && c.kind === 'cold-night') {
    report.unchanged++;
    return;
  }
  const changed = !!latest && !latest.resolvedAt;
  const revision = (latest?.revision ?? 0) + 1;
  const link = alertLink(c.kind, audience).path;
  try {
    await writeTransaction(async (transaction) => {
      if (latest && !latest.supersededAt) await latest.update({ supersededAt: now }, { transaction });
      const alert = await Alert.create(
        {
          organizationId: c.orgId,
          userId: user.id,
          kind: c.kind,
          subjectKey: c.subjectKey,
          revision,
          departureId: c.departureId ?? null,
          airfieldId: c.airfieldId ?? null,
          title: c.title,
          data: c.data,
          state: c.state,
          link,
        },
        { transaction },
      );
      report.created++;
      if (channel !== 'email') return;
      const quietEnd = respectsQuietHours(c.kind) ? quietHoursEnd(quietOf(prefs), now.getTime()) : null;
      if (quietEnd !== null && c.expiresAt && quietEnd >= c.expiresAt.getTime()) {
        report.heldForQuietHours++;
        return; // it would arrive too late to matter: shown in the app only
      }
      const mail = renderAlertMail(c.kind, c.data, { id: user.id, name: user.name, email: user.email, tempUnit: user.tempUnit, audience }, { nowMs: now.getTime(), changed });
      await enqueueMail({
        organizationId: c.orgId,
        userId: user.id,
        alertId: alert.id,
        kind: c.kind,
        to: user.email,
        mail,
        dedupeKey: `alert:${c.subjectKey}:u${user.id}:r${revision}`,
        notBefore: quietEnd !== null ? new Date(quietEnd) : undefined,
        expiresAt: c.expiresAt ?? null,
        now,
        transaction,
      });
      report.queued++;
      if (quietEnd !== null) report.heldForQuietHours++;
    });
  } catch (err) {
    // Another evaluation wrote this revision first (unique user, subject, revision): nothing more to do.
    if ((err as { name?: string }).name === 'SequelizeUniqueConstraintError') return;
    throw err;
  }
}

/** Marks open alerts of these kinds resolved when their subject is no longer current. */
async function resolveStale(orgId: number, kinds: AlertKind[], current: Set<string>, now: Date, report: EvaluationReport) {
  const { Alert } = db();
  const open = await Alert.findAll({ where: { organizationId: orgId, kind: { [Op.in]: kinds }, resolvedAt: null, supersededAt: null } });
  for (const a of open) {
    if (!current.has(`${a.userId}|${a.subjectKey}`)) {
      await a.update({ resolvedAt: now });
      report.resolved++;
    }
  }
}

async function recipientsOf(orgId: number) {
  const { User } = db();
  const users = await User.findAll({ where: { organizationId: orgId, active: true } });
  const prefs = await preferencesFor(orgId, users.map((u) => u.id));
  const byId = new Map(users.map((u) => [u.id, u]));
  const withRole = (kind: AlertKind, audience: Audience): Recipient[] =>
    users.filter((u) => ALERT_ROLES[kind].includes(u.role)).map((u) => ({ user: u, audience, prefs: prefs.get(u.id)! }));
  const one = (id: number, audience: Audience): Recipient | null => {
    const u = byId.get(id);
    return u ? { user: u, audience, prefs: prefs.get(u.id)! } : null;
  };
  return { withRole, one };
}

function oilData(p: PlanView): OilTooColdData {
  return {
    departureId: p.departureId,
    departAt: p.departAt,
    readyC: p.readyC,
    aircraft: { id: p.aircraft.id, registration: p.aircraft.registration, typeLabel: p.aircraft.typeLabel, coverOnByDefault: p.aircraft.coverOnByDefault },
    airfield: p.airfield!,
    shelter: p.shelter,
    pilot: p.pilot,
    status: p.status as 'short' | 'unplanned',
    summary: p.summary,
    oilAtDepartureC: round1(p.oilAtDepartureC),
    probabilityReady: p.probabilityReady === null ? null : Math.round(p.probabilityReady * 100) / 100,
    heater: p.heater ? { kindLabel: p.heater.kindLabel, powerW: p.heater.powerW, control: p.heater.control } : null,
    switchOnAt: p.switchOnAt,
    fix: p.fix,
    frost: !!p.frost?.likely,
  };
}

function switchOnData(p: PlanView): SwitchOnData {
  return {
    departureId: p.departureId,
    departAt: p.departAt,
    switchOnAt: p.switchOnAt!,
    readyC: p.readyC,
    status: p.status,
    oilAtDepartureC: round1(p.oilAtDepartureC),
    aircraft: { id: p.aircraft.id, registration: p.aircraft.registration },
    airfield: p.airfield!,
    shelter: p.shelter,
    heater: { kindLabel: p.heater!.kindLabel, powerW: p.heater!.powerW },
    pilot: p.pilot,
    holdUntil: p.hold?.heaterOn ? p.hold.until : null,
    frost: !!p.frost?.likely,
  };
}

/** The oil-too-cold warnings and switch-on reminders of every organization (or the ones given). */
export async function evaluateAlerts({ now = new Date(), orgIds }: { now?: Date; orgIds?: number[] } = {}): Promise<EvaluationReport> {
  const { Organization } = db();
  const report = emptyReport();
  const orgs = await Organization.findAll({ where: orgIds ? { id: { [Op.in]: orgIds } } : {}, attributes: ['id'] });
  for (const org of orgs) {
    try {
      await evaluateOrganization(org.id, now, report);
    } catch (err) {
      report.skipped++;
      logSkipped('alert evaluation of an organization', { org: org.id }, err);
    }
  }
  return report;
}

async function evaluateOrganization(orgId: number, now: Date, report: EvaluationReport) {
  const org = { id: orgId };
  const plans = await plansBetween({ orgId: org.id, fromMs: now.getTime(), toMs: now.getTime() + WARNING_HORIZON_MS, now, refresh: 'if-old' });
  const who = await recipientsOf(org.id);
  const current = new Set<string>();
  for (const p of plans) {
    if (!p.airfield || p.problem) continue;
    if (p.status === 'short' || p.status === 'unplanned') {
      const data = oilData(p);
      const subjectKey = `oil-too-cold:d${p.departureId}`;
      const pilot = who.one(p.pilot.id, 'pilot');
      const list = [...(pilot ? [pilot] : []), ...who.withRole('oil-too-cold', 'operator').filter((r) => r.user.id !== p.pilot.id)];
      for (const r of list) {
        current.add(`${r.user.id}|${subjectKey}`);
        await notify(
          {
            orgId: org.id,
            kind: 'oil-too-cold',
            subjectKey,
            recipient: r,
            state: { status: p.status, oilC: data.oilAtDepartureC, departAt: p.departAt, readyC: p.readyC },
            data,
            title: oilTooColdTitle(data),
            departureId: p.departureId,
            airfieldId: p.airfield.id,
            expiresAt: new Date(Date.parse(p.departAt)),
          },
          now,
          report,
        );
      }
    }
    if (p.heater?.control === 'manual' && p.switchOnAt) {
      const switchOnMs = Date.parse(p.switchOnAt);
      const subjectKey = `switch-on:d${p.departureId}`;
      for (const r of who.withRole('switch-on', 'operator')) {
        const lead = r.prefs.reminderLeadMinutes * MIN;
        const inWindow = now.getTime() >= switchOnMs - lead && now.getTime() < switchOnMs + REMINDER_GRACE_MS;
        // Keep an open reminder current until its switch-on time has passed.
        if (now.getTime() < switchOnMs + REMINDER_GRACE_MS) current.add(`${r.user.id}|${subjectKey}`);
        if (!inWindow) continue;
        const data = switchOnData(p);
        await notify(
          {
            orgId: org.id,
            kind: 'switch-on',
            subjectKey,
            recipient: r,
            state: { switchOnMs, departAt: p.departAt },
            data,
            title: switchOnTitle(data),
            departureId: p.departureId,
            airfieldId: p.airfield.id,
            expiresAt: new Date(switchOnMs + REMINDER_GRACE_MS),
          },
          now,
          report,
        );
      }
    }
  }
  await resolveStale(org.id, ['oil-too-cold', 'switch-on'], current, now, report);
}

/** The instant of the notice time ('HH:MM') on the local date of `ms`, or of the day before. */
function noticeInstants(zone: string, hhmm: string, ms: number): number[] {
  const m = minutesOfDay(hhmm);
  const today = localDateOf(zone, ms);
  return [addDays(today, -1), today].map((d) => zonedTimeToUtc(zone, d.year, d.month, d.day, Math.floor(m / 60), m % 60));
}

/**
 * The cold-night notice: within three hours after the organization's notice time (local to each
 * group of airfields sharing a zone), managers hear of every airfield whose forecast low tonight is
 * below the threshold, with the aircraft booked for the morning that need heat and the planned energy.
 */
export async function evaluateColdNight({ now = new Date(), orgIds }: { now?: Date; orgIds?: number[] } = {}): Promise<EvaluationReport> {
  const { Organization, Airfield } = db();
  const report = emptyReport();
  const orgs = await Organization.findAll({ where: orgIds ? { id: { [Op.in]: orgIds } } : {} });
  for (const org of orgs) {
    try {
      const airfields = await Airfield.findAll({ where: { organizationId: org.id, archivedAt: null }, order: [['name', 'ASC']] });
      const zones = new Map<string, typeof airfields>();
      for (const a of airfields) zones.set(a.timeZone, [...(zones.get(a.timeZone) ?? []), a]);
      const who = await recipientsOf(org.id);
      for (const [zone, afs] of zones) {
        const noticeMs = noticeInstants(zone, org.coldNightNoticeAt, now.getTime()).find((t) => now.getTime() >= t && now.getTime() < t + NOTICE_WINDOW_MS);
        if (noticeMs === undefined) continue;
        const night = tonightWindow(zone, new Date(noticeMs));
        const lows = await tonightForAirfields({ orgId: org.id, airfieldIds: afs.map((a) => a.id), now: new Date(noticeMs), refresh: 'if-old' });
        const cold = afs
          .map((a) => ({ a, low: lows.get(a.id)?.tonight.low ?? null }))
          .filter((x): x is { a: (typeof afs)[number]; low: { tempC: number; at: string } } => !!x.low && x.low.tempC < org.coldNightThresholdC);
        if (!cold.length) continue;
        const coldIds = new Set(cold.map((x) => x.a.id));
        // The morning after the night: departures until 15:00 local the next day.
        const next = addDays(night.evening, 1);
        const plans = (await plansBetween({ orgId: org.id, fromMs: now.getTime(), toMs: zonedTimeToUtc(zone, next.year, next.month, next.day, 15), now, refresh: 'if-old' })).filter(
          (p) => p.airfield && coldIds.has(p.airfield.id),
        );
        const need = plans.filter((p) => p.status !== 'ready');
        const currency = need.find((p) => p.cost !== null)?.currency ?? plans[0]?.currency ?? 'EUR';
        const data: ColdNightData = {
          thresholdC: org.coldNightThresholdC,
          timeZone: zone,
          evening: localDateKey(night.evening),
          night: { from: new Date(night.fromMs).toISOString(), to: new Date(night.toMs).toISOString() },
          airfields: cold.map((x) => ({ id: x.a.id, name: x.a.name, ident: x.a.ident, lowC: Math.round(x.low.tempC * 10) / 10, lowAt: x.low.at })),
          aircraft: need.map((p) => ({
            departureId: p.departureId,
            registration: p.aircraft.registration,
            airfield: p.airfield!.name,
            departAt: p.departAt,
            status: p.status,
            switchOnAt: p.switchOnAt,
            energyKWh: Math.round(p.energyKWh * 100) / 100,
          })),
          totals: {
            energyKWh: Math.round(need.reduce((s, p) => s + p.energyKWh, 0) * 100) / 100,
            cost: need.some((p) => p.cost !== null) ? Math.round(need.reduce((s, p) => s + (p.cost ?? 0), 0) * 100) / 100 : null,
            currency,
          },
        };
        const subjectKey = `cold-night:${zone}:${data.evening}`;
        for (const r of who.withRole('cold-night', 'manager')) {
          await notify(
            { orgId: org.id, kind: 'cold-night', subjectKey, recipient: r, state: { evening: data.evening }, data, title: coldNightTitle(data), expiresAt: new Date(night.toMs) },
            now,
            report,
          );
        }
      }
    } catch (err) {
      report.skipped++;
      logSkipped('cold-night notice of an organization', { org: org.id }, err);
    }
  }
  return report;
}

