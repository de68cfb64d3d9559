import 'server-only';
import crypto from 'node:crypto';
import { db } from '@/models';
import { NotFound } from '@/lib/api/errors';
import { env } from '@/lib/env';
import { switchOnCalendar, type SwitchOnEvent } from '@/lib/calendar/feed';
import { plansBetween } from './plans';

// Secret, revocable iCalendar feeds of switch-on events. The token is shown once; only its hash is kept.

const sha256 = (s: string) => crypto.createHash('sha256').update(s).digest('hex');

export interface FeedRow {
  id: number;
  airfield: { id: number; name: string } | null;
  createdAt: string;
  revokedAt: string | null;
}

export async function listFeeds({ orgId, userId }: { orgId: number; userId: number }): Promise<FeedRow[]> {
  const { CalendarFeed, Airfield } = db();
  const feeds = await CalendarFeed.findAll({ where: { organizationId: orgId, userId }, order: [['createdAt', 'DESC']] });
  const afs = await Airfield.findAll({ where: { organizationId: orgId }, attributes: ['id', 'name'] });
  const name = new Map(afs.map((a) => [a.id, a.name]));
  return feeds.map((f) => ({
    id: f.id,
    airfield: f.airfieldId ? { id: f.airfieldId, name: name.get(f.airfieldId) ?? '' } : null,
    createdAt: f.createdAt.toISOString(),
    revokedAt: f.revokedAt ? f.revokedAt.toISOString() : null,
  }));
}

/** A new feed; the URL (with its secret) is returned this once. */
export async function createFeed({ orgId, userId, airfieldId, baseUrl }: { orgId: number; userId: number; airfieldId?: number; baseUrl: string }) {
  const { CalendarFeed, Airfield } = db();
  if (airfieldId) {
    const af = await Airfield.findOne({ where: { id: airfieldId, organizationId: orgId } });
    if (!af) throw new NotFound('Airfield');
  }
  const token = crypto.randomBytes(24).toString('base64url');
  const feed = await CalendarFeed.create({ organizationId: orgId, userId, airfieldId: airfieldId ?? null, tokenHash: sha256(token) });
  return { id: feed.id, url: `${baseUrl.replace(/\/$/, '')}/api/calendar/${token}` };
}

export async function revokeFeed({ orgId, userId, feedId }: { orgId: number; userId: number; feedId: number }) {
  const { CalendarFeed } = db();
  const f = await CalendarFeed.findOne({ where: { id: feedId, organizationId: orgId, userId } });
  if (!f) throw new NotFound('Calendar feed');
  if (!f.revokedAt) await f.update({ revokedAt: new Date() });
  return { id: f.id, revoked: true };
}

/** The feed's calendar, or null for an unknown or revoked token (the route answers 404 either way). */
export async function feedCalendar({ token, now = new Date(), baseUrl }: { token: string; now?: Date; baseUrl: string }): Promise<string | null> {
  if (!/^[A-Za-z0-9_-]{20,64}$/.test(token)) return null;
  const { CalendarFeed, User } = db();
  const f = await CalendarFeed.findOne({ where: { tokenHash: sha256(token) } });
  if (!f || f.revokedAt) return null;
  const owner = await User.findOne({ where: { id: f.userId, organizationId: f.organizationId } });
  if (!owner?.active) return null;
  const plans = await plansBetween({ orgId: f.organizationId, fromMs: now.getTime() - 6 * 3_600_000, toMs: now.getTime() + 7 * 86_400_000, now, refresh: 'if-old' });
  const events: SwitchOnEvent[] = plans
    .filter((p) => p.switchOnAt && p.heater && (!f.airfieldId || p.airfield?.id === f.airfieldId))
    .map((p) => ({
      departureId: p.departureId,
      registration: p.aircraft.registration,
      airfieldName: p.airfield?.name ?? '',
      shelterName: p.shelter?.name ?? null,
      heaterLabel: p.heater!.kindLabel,
      control: p.heater!.control === 'manual' ? 'switched by hand' : p.heater!.control === 'timer' ? 'set the timer' : 'switched relay',
      switchOnAtMs: Date.parse(p.switchOnAt!),
      heaterOffAtMs: p.heaterOn.length ? Date.parse(p.heaterOn[p.heaterOn.length - 1].to) : Date.parse(p.departAt),
      departAtMs: Date.parse(p.departAt),
      readyC: p.readyC,
      oilAtDepartureC: p.oilAtDepartureC,
      status: p.status,
      holdUntilMs: p.hold?.heaterOn ? Date.parse(p.hold.until) : null,
      url: `${baseUrl.replace(/\/$/, '')}/board`,
    }));
  return switchOnCalendar(events, 'Thawline switch-on times');
}

export function publicBaseUrl(req: Request): string {
  if (env().NEXTAUTH_URL) return env().NEXTAUTH_URL!;
  const u = new URL(req.url);
  return `${u.protocol}//${req.headers.get('host') ?? u.host}`;
}
