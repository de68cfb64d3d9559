import 'server-only';
import { Op } from 'sequelize';
import { db } from '@/models';
import type { Alert, AlertKind } from '@/models/Alert';
import type { OutboxMessage } from '@/models/OutboxMessage';
import { NotFound } from '@/lib/api/errors';
import type { Role } from '@/lib/auth/permissions';
import { kindsFor } from '@/lib/alerts/audience';
import { preferencesFor, } from '@/lib/alerts/preferences';
import type { AlertData, Audience, OilTooColdData } from '@/lib/alerts/content';
import type { UnsubscribeKind } from '@/lib/mail/links';
import type { AlertPreferencesInput } from '@/lib/validation/alerts';
import { updatePreferences as updateUserPreferences } from './users';
import { writeTransaction } from '@/models/transaction';
import type { AlertView, EmailState, PreferencesView } from '@/lib/views/alerts';

export type { AlertView, EmailState, PreferencesView };

// A user's alerts and alert preferences. Alerts belong to one user in one organization: anyone
// else's is "not found".

function audienceOf(a: Alert): Audience {
  if (a.kind === 'cold-night') return 'manager';
  if (a.kind === 'oil-too-cold' && (a.data as OilTooColdData).pilot?.id === a.userId) return 'pilot';
  return 'operator';
}

function emailOf(m: OutboxMessage | undefined, now: Date): AlertView['email'] {
  if (!m) return { state: 'app-only', at: null };
  const iso = (d: Date | null | undefined) => (d ? d.toISOString() : null);
  switch (m.status) {
    case 'sent':
      return { state: 'sent', at: iso(m.sentAt) };
    case 'failed':
      return { state: 'failed', at: iso(m.updatedAt) };
    case 'expired':
    case 'cancelled':
      return { state: 'not-sent', at: null };
    default:
      return m.attempts === 0 && m.nextAttemptAt.getTime() > now.getTime() ? { state: 'held', at: iso(m.nextAttemptAt) } : { state: 'queued', at: iso(m.nextAttemptAt) };
  }
}

const unreadWhere = (orgId: number, userId: number) => ({ organizationId: orgId, userId, acknowledgedAt: null, resolvedAt: null, supersededAt: null });

export async function unreadAlertCount({ orgId, userId }: { orgId: number; userId: number }): Promise<number> {
  const { Alert } = db();
  return Alert.count({ where: unreadWhere(orgId, userId) });
}

/** The user's alerts, newest first: the current revision of each (or every revision with show 'all'). */
export async function listAlerts({ orgId, userId, show = 'current', limit = 50, now = new Date() }: { orgId: number; userId: number; show?: 'current' | 'all'; limit?: number; now?: Date }) {
  const { Alert, OutboxMessage } = db();
  const rows = await Alert.findAll({
    where: { organizationId: orgId, userId, ...(show === 'current' ? { supersededAt: null } : {}) },
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
    limit,
  });
  const mails = rows.length ? await OutboxMessage.findAll({ where: { alertId: { [Op.in]: rows.map((r) => r.id) } } }) : [];
  const byAlert = new Map(mails.map((m) => [m.alertId, m]));
  const alerts: AlertView[] = rows.map((a) => ({
    id: a.id,
    kind: a.kind,
    title: a.title,
    audience: audienceOf(a),
    revision: a.revision,
    createdAt: a.createdAt.toISOString(),
    acknowledgedAt: a.acknowledgedAt ? a.acknowledgedAt.toISOString() : null,
    resolvedAt: a.resolvedAt ? a.resolvedAt.toISOString() : null,
    link: a.link,
    data: a.data as AlertData,
    email: emailOf(byAlert.get(a.id), now),
  }));
  return { alerts, unread: await unreadAlertCount({ orgId, userId }), generatedAt: now.toISOString() };
}

export async function acknowledgeAlert({ orgId, userId, alertId, acknowledged, now = new Date() }: { orgId: number; userId: number; alertId: number; acknowledged: boolean; now?: Date }) {
  const { Alert } = db();
  const a = await Alert.findOne({ where: { id: alertId, organizationId: orgId, userId } });
  if (!a) throw new NotFound('Alert');
  await a.update({ acknowledgedAt: acknowledged ? (a.acknowledgedAt ?? now) : null });
  return { id: a.id, acknowledgedAt: a.acknowledgedAt ? a.acknowledgedAt.toISOString() : null, unread: await unreadAlertCount({ orgId, userId }) };
}

export async function acknowledgeAll({ orgId, userId, kind, now = new Date() }: { orgId: number; userId: number; kind?: AlertKind; now?: Date }) {
  const { Alert } = db();
  const [n] = await Alert.update({ acknowledgedAt: now }, { where: { ...unreadWhere(orgId, userId), ...(kind ? { kind } : {}) } });
  return { acknowledged: n, unread: await unreadAlertCount({ orgId, userId }) };
}

export async function getAlertPreferences({ orgId, userId, role }: { orgId: number; userId: number; role: Role }): Promise<PreferencesView> {
  const { User } = db();
  const u = await User.findOne({ where: { id: userId, organizationId: orgId }, attributes: ['id', 'tempUnit'] });
  if (!u) throw new NotFound('User');
  const p = (await preferencesFor(orgId, [userId])).get(userId)!;
  return { ...p, kinds: kindsFor(role), tempUnit: u.tempUnit };
}

/** Saves what was sent (the rest stays as it was); the row is written on first save. */
export async function saveAlertPreferences({ orgId, userId, role, input }: { orgId: number; userId: number; role: Role; input: AlertPreferencesInput }) {
  const { AlertPreference } = db();
  const { tempUnit, ...prefs } = input;
  await writeTransaction(async (transaction) => {
    const current = (await preferencesFor(orgId, [userId])).get(userId)!;
    const next = { ...current, ...Object.fromEntries(Object.entries(prefs).filter(([, v]) => v !== undefined)) };
    const [row] = await AlertPreference.findOrCreate({ where: { userId }, defaults: { userId, organizationId: orgId, ...next }, transaction });
    await row.update(
      {
        oilTooCold: next.oilTooCold,
        switchOn: next.switchOn,
        coldNight: next.coldNight,
        emailEnabled: next.emailEnabled,
        quietStart: next.quietStart,
        quietEnd: next.quietEnd,
        timeZone: next.timeZone,
        reminderLeadMinutes: next.reminderLeadMinutes,
      },
      { transaction },
    );
  });
  if (tempUnit) await updateUserPreferences({ userId, tempUnit });
  return getAlertPreferences({ orgId, userId, role });
}

/**
 * The signed unsubscribe link: that kind's e-mail goes off (the alert stays in the app), or every
 * alert e-mail with 'all'. Returns the user's first name for the page, or null for an unknown user.
 */
export async function unsubscribe({ userId, kind }: { userId: number; kind: UnsubscribeKind }) {
  const { User } = db();
  const u = await User.findOne({ where: { id: userId, active: true } });
  if (!u) return null;
  const input: AlertPreferencesInput =
    kind === 'all' ? { emailEnabled: false } : kind === 'oil-too-cold' ? { oilTooCold: 'app' } : kind === 'switch-on' ? { switchOn: 'app' } : { coldNight: 'app' };
  await saveAlertPreferences({ orgId: u.organizationId, userId: u.id, role: u.role, input });
  return { name: u.name.split(' ')[0], email: u.email };
}

/** Whether the link's e-mail is on now (the unsubscribe page says what the click would change). */
export async function unsubscribeState({ userId, kind }: { userId: number; kind: UnsubscribeKind }) {
  const { User } = db();
  const u = await User.findOne({ where: { id: userId, active: true } });
  if (!u) return null;
  const p = (await preferencesFor(u.organizationId, [u.id])).get(u.id)!;
  const on = kind === 'all' ? p.emailEnabled : kind === 'oil-too-cold' ? p.oilTooCold === 'email' : kind === 'switch-on' ? p.switchOn === 'email' : p.coldNight === 'email';
  return { on: on && (kind === 'all' || p.emailEnabled), name: u.name.split(' ')[0] };
}
