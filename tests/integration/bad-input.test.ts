// Input that cannot stop a job: text fields refuse control characters (422 naming the field), and a
// row already stored with one (or a row that fails for any reason) is skipped by the alert job, which
// still alerts every other organization and logs ids and the error's name only.
import { afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { call, DEMO, freshDatabase, signInAs } from './helpers';

let models: Awaited<ReturnType<typeof freshDatabase>>;
let me: typeof import('@/app/api/me/route');
let users: typeof import('@/app/api/users/route');
let departures: typeof import('@/app/api/departures/route');
let evaluate: typeof import('@/lib/alerts/evaluate');

const HOUR = 3_600_000;

beforeAll(async () => {
  models = await freshDatabase();
  me = await import('@/app/api/me/route');
  users = await import('@/app/api/users/route');
  departures = await import('@/app/api/departures/route');
  evaluate = await import('@/lib/alerts/evaluate');
});
afterEach(() => vi.restoreAllMocks());

describe('control characters in text fields', () => {
  it('PATCH /api/me with a NUL in the name is 422 naming the field; the name is unchanged', async () => {
    const u = await signInAs(DEMO.pilot);
    const r = await call(me.PATCH, { method: 'PATCH', body: { name: 'A\u0000B' } });
    expect(r.status).toBe(422);
    expect(r.body.fields.map((f: { field: string }) => f.field)).toEqual(['name']);
    expect(r.body.fields[0].message).toMatch(/control character/);
    expect((await models.User.findByPk(u.id))!.name).toBe(u.name);
    for (const bad of ['A\u0007B', 'A\u001bB', 'A\u007fB', 'A\tB', 'A\nB']) {
      expect((await call(me.PATCH, { method: 'PATCH', body: { name: bad } })).status).toBe(422);
    }
    expect((await call(me.PATCH, { method: 'PATCH', body: { name: 'Tove Rask-Lind' } })).status).toBe(200);
  });

  it('POST /api/users with a NUL in the name or the e-mail is 422 naming the field, and writes nothing', async () => {
    await signInAs(DEMO.manager);
    const before = await models.User.count();
    const a = await call(users.POST, { method: 'POST', body: { name: 'New\u0000Member', email: 'nul.name@frostvale.test', role: 'pilot' } });
    expect(a.status).toBe(422);
    expect(a.body.fields[0].field).toBe('name');
    const b = await call(users.POST, { method: 'POST', body: { name: 'New Member', email: 'nul\u0000@frostvale.test', role: 'pilot' } });
    expect(b.status).toBe(422);
    expect(b.body.fields[0].field).toBe('email');
    expect(await models.User.count()).toBe(before);
  });

  it('notes keep tabs and line breaks but refuse NUL', async () => {
    await signInAs(DEMO.operator);
    const aircraftId = (await models.Aircraft.findOne({ where: { registration: 'Q-KAPA' } }))!.id;
    const day = new Date(Date.now() + 40 * 24 * HOUR).toISOString().slice(0, 10);
    const bad = await call(departures.POST, { method: 'POST', body: { aircraftId, departAt: `${day}T07:30`, notes: 'a\u0000b' } });
    expect(bad.status).toBe(422);
    expect(bad.body.fields[0].field).toBe('notes');
    const ok = await call(departures.POST, { method: 'POST', body: { aircraftId, departAt: `${day}T07:30`, notes: 'Line one\n\tLine two' } });
    expect(ok.status).toBe(201);
    expect(ok.body.departure.notes).toBe('Line one\n\tLine two');
  });
});

describe('the alert job with a bad row in one organization', () => {
  /** A departure of the other organization that is sure to need a warning (a ready temperature no heater reaches). */
  async function ridgewayShortDeparture() {
    const org = (await models.Organization.findOne({ where: { name: 'Ridgeway Aero Group' } }))!;
    const aircraft = (await models.Aircraft.findOne({ where: { organizationId: org.id } }))!;
    const pilot = (await models.User.findOne({ where: { organizationId: org.id, role: 'pilot' } }))!;
    await models.Departure.create({ organizationId: org.id, aircraftId: aircraft.id, pilotId: pilot.id, bookedById: pilot.id, departAt: new Date(Date.now() + 14 * HOUR), readyC: 95, notes: '' });
    return org.id;
  }
  const frostvale = async () => (await models.Organization.findOne({ where: { name: 'Frostvale Flying Club' } }))!.id;
  const oilAlerts = (orgId: number) => models.Alert.count({ where: { organizationId: orgId, kind: 'oil-too-cold' } });

  it('an alert that cannot be written in one organization is logged by ids and skipped; the other organization is alerted', async () => {
    const ridgeway = await ridgewayShortDeparture();
    const first = await frostvale();
    const token = 'tok_SECRET_0123456789abcdef';
    const create = models.Alert.create.bind(models.Alert);
    vi.spyOn(models.Alert, 'create').mockImplementation((async (values: { organizationId: number }, opts: unknown) => {
      if (values.organizationId === first) {
        // Shaped like a driver error: the statement and its values (a link with a token) travel with it.
        const err = Object.assign(new Error(`SQLITE_ERROR: near "${token}": syntax error`), {
          name: 'SequelizeDatabaseError',
          sql: `INSERT INTO outbox_messages (text) VALUES ('https://x.test/invite/${token}')`,
          parent: { code: 'SQLITE_ERROR' },
        });
        throw err;
      }
      return create(values as never, opts as never);
    }) as never);
    const logged: string[] = [];
    vi.spyOn(console, 'error').mockImplementation((...args: unknown[]) => void logged.push(args.map((a) => (typeof a === 'string' ? a : JSON.stringify(a))).join(' ')));
    const r = await evaluate.evaluateAlerts({ now: new Date() });
    expect(r.skipped).toBeGreaterThan(0);
    expect(await oilAlerts(first)).toBe(0);
    expect(await oilAlerts(ridgeway)).toBeGreaterThan(0);
    expect(logged.length).toBe(r.skipped);
    for (const line of logged) {
      expect(line).toMatch(/alert skipped \(org=\d+ user=\d+ kind=[a-z-]+ departure=\d+/);
      expect(line).toContain('SequelizeDatabaseError (SQLITE_ERROR)');
      expect(line).not.toContain(token);
      expect(line).not.toMatch(/INSERT|VALUES/);
    }
    // The next run, with the fault gone, catches up.
    vi.restoreAllMocks();
    const again = await evaluate.evaluateAlerts({ now: new Date() });
    expect(again.skipped).toBe(0);
    expect(await oilAlerts(first)).toBeGreaterThan(0);
  });

  it('a NUL stored in an aircraft type label (inserted directly) stops nothing: both organizations are alerted, the mail carries no NUL', async () => {
    await models.Alert.destroy({ where: {} });
    await models.OutboxMessage.destroy({ where: {} });
    const first = await frostvale();
    const ridgeway = (await models.Organization.findOne({ where: { name: 'Ridgeway Aero Group' } }))!.id;
    // Every aircraft of the first organization gets the bad label, through a bound parameter (a NUL;
    // PostgreSQL stores no NUL in text at all, so there another C0 control stands in for it).
    const bad = models.sequelize.getDialect() === 'postgres' ? '\u0001' : '\u0000';
    await models.sequelize.query('UPDATE aircraft SET "typeLabel" = $label WHERE "organizationId" = $org', { bind: { label: `Two-seat${bad}trainer`, org: first } });
    expect((await models.Aircraft.findOne({ where: { organizationId: first } }))!.typeLabel).toContain(bad);
    const logged: string[] = [];
    vi.spyOn(console, 'error').mockImplementation((...args: unknown[]) => void logged.push(args.join(' ')));
    const r = await evaluate.evaluateAlerts({ now: new Date() });
    expect(r.skipped).toBe(0);
    expect(logged).toEqual([]);
    expect(await oilAlerts(first)).toBeGreaterThan(0);
    expect(await oilAlerts(ridgeway)).toBeGreaterThan(0);
    const mails = await models.OutboxMessage.findAll({ where: { organizationId: first } });
    expect(mails.length).toBeGreaterThan(0);
    for (const m of mails) expect(/[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]/.test(`${m.subject}${m.text}${m.html}`)).toBe(false);
    // And the mail job delivers them (to a transport that accepts anything).
    const { deliverDue } = await import('@/lib/mail/deliver');
    const sent: string[] = [];
    const d = await deliverDue({ now: new Date(), holder: 'test', limit: 200, transport: { send: async (m: { to: string }) => void sent.push(m.to), close: () => {} } as never });
    expect(d.sent).toBe(await models.OutboxMessage.count());
  });
});
