// Alert preferences: how each kind reaches a user, the e-mail master switch, quiet hours and the
// switch-on reminder's lead time. A user without a row has the defaults; quiet hours are read in the
// user's chosen zone, else the zone of the organization's first airfield.
import { Op } from 'sequelize';
import { db } from '@/models';
import type { AlertChannel, Preferences } from '@/lib/views/alerts';
import type { AlertKind } from '@/models/Alert';
import type { QuietHours } from '@/lib/mail/quiet';

export type { Preferences };

export const DEFAULT_LEAD_MINUTES = 30;

export function defaultPreferences(timeZone: string): Preferences {
  return { oilTooCold: 'email', switchOn: 'email', coldNight: 'email', emailEnabled: true, quietStart: null, quietEnd: null, timeZone, reminderLeadMinutes: DEFAULT_LEAD_MINUTES };
}

/** The zone quiet hours are read in when the user chose none: the organization's first airfield's. */
export async function organizationZone(orgId: number): Promise<string> {
  const { Airfield } = db();
  const a = await Airfield.findOne({ where: { organizationId: orgId, archivedAt: null }, order: [['id', 'ASC']], attributes: ['timeZone'] });
  return a?.timeZone ?? 'UTC';
}

export async function preferencesFor(orgId: number, userIds: number[]): Promise<Map<number, Preferences>> {
  const { AlertPreference } = db();
  const zone = await organizationZone(orgId);
  const rows = userIds.length ? await AlertPreference.findAll({ where: { organizationId: orgId, userId: { [Op.in]: userIds } } }) : [];
  const byUser = new Map(rows.map((r) => [r.userId, r]));
  const out = new Map<number, Preferences>();
  for (const id of userIds) {
    const r = byUser.get(id);
    out.set(
      id,
      r
        ? {
            oilTooCold: r.oilTooCold === 'app' ? 'app' : 'email',
            switchOn: r.switchOn,
            coldNight: r.coldNight,
            emailEnabled: r.emailEnabled,
            quietStart: r.quietStart ?? null,
            quietEnd: r.quietEnd ?? null,
            timeZone: r.timeZone || zone,
            reminderLeadMinutes: r.reminderLeadMinutes,
          }
        : defaultPreferences(zone),
    );
  }
  return out;
}

/** How an alert of this kind reaches the user: by e-mail too, in the app only, or not at all. */
export function channelFor(p: Preferences, kind: AlertKind): AlertChannel {
  const c: AlertChannel = kind === 'oil-too-cold' ? p.oilTooCold : kind === 'switch-on' ? p.switchOn : p.coldNight;
  if (c === 'email' && !p.emailEnabled) return 'app';
  return c;
}

export function quietOf(p: Preferences): QuietHours {
  return { start: p.quietStart, end: p.quietEnd, timeZone: p.timeZone };
}

/** Whether quiet hours hold this kind's e-mail back (the oil-too-cold warning always goes). */
export function respectsQuietHours(kind: AlertKind): boolean {
  return kind !== 'oil-too-cold';
}
