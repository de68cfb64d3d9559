import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Op } from 'sequelize';
import { DEMO, call, freshDatabase, signInAs, signOut } from './helpers';
import { startSmtpUrl, stopSmtpUrl, type TestSmtp } from '../support/smtp';

// The alerts end to end against a real SMTP server (smtp-server on 127.0.0.1, port 0): evaluation on the
// seeded demo writes alerts and outbox rows, delivery sends them through nodemailer via SMTP_URL.

let smtp: TestSmtp;
let models: Awaited<ReturnType<typeof freshDatabase>>;
const now0 = new Date();

beforeAll(async () => {
  smtp = await startSmtpUrl();
  models = await freshDatabase();
});
afterAll(() => stopSmtpUrl(smtp));

async function evaluate(now: Date) {
  const { evaluateAlerts } = await import('@/lib/alerts/evaluate');
  return evaluateAlerts({ now });
}
async function deliver(now: Date) {
  const { deliverDue } = await import('@/lib/mail/deliver');
  return deliverDue({ now, holder: 'test', limit: 200 });
}
async function user(email: string) {
  return (await models.User.findOne({ where: { email } }))!;
}
const to = (email: string) => smtp.received.filter((m) => m.envelopeTo.includes(email));
/** The plain text with its line wrapping undone. */
const flat = (text: string) => text.replace(/\s+/g, ' ');

describe('oil-too-cold warning', () => {
  it("reaches the demo pilot once for their short departure, in their units and the airfield's local time", async () => {
    const pilot = await user(DEMO.pilot);
    await pilot.update({ tempUnit: 'F' });
    const r = await evaluate(now0);
    expect(r.created).toBeGreaterThan(0);
    await deliver(now0);
    const mails = to(DEMO.pilot).filter((m) => /too cold|needs heat/.test(m.subject));
    const sipi = mails.filter((m) => m.subject.includes('Q-SIPI'));
    expect(sipi).toHaveLength(1);
    const m = sipi[0];
    expect(m.subject).toMatch(/^Q-SIPI will be too cold for the \w{3} 07:30 departure$/);
    // 20 °C ready temperature = 68 °F (exact by the definition of the Fahrenheit scale; from memory).
    expect(m.text).toContain('Ready temperature:');
    expect(m.text).toMatch(/Ready temperature:\s+68 °F/);
    expect(m.text).not.toMatch(/\d °C/);
    // The departure is at 07:30 local time at Birchmoor (Europe/Helsinki), shown with the zone's name.
    expect(m.text).toMatch(/07:30 (EET|GMT\+2)/);
    expect(m.text).toContain('What would fix it');
    expect(flat(m.text)).toMatch(/A heater of at least \d+ W would reach the ready temperature in time/);
    expect(flat(m.text)).toContain("Follow the engine and aircraft manufacturer's cold-weather instructions");
    expect(flat(m.text)).toContain('Preheaters can start fires');
    expect(flat(m.text)).toContain('Before turning a propeller by hand');
    expect(m.text).toMatch(/http:\/\/localhost:3000\/departures/);
    expect(m.text).toMatch(/\/unsubscribe\/\d+\.oil-too-cold\.[A-Za-z0-9_-]{22}/);
    expect(m.html).toContain('Q-SIPI');
    expect(m.html).toContain('68 °F');
    expect(m.html).not.toMatch(/<img|<link|@import|url\(|<script/i);
    expect(m.headers['list-unsubscribe']).toMatch(/^<http:\/\/localhost:3000\/unsubscribe\/.+\/one-click>$/);
    expect(m.headers['list-unsubscribe-post']).toBe('List-Unsubscribe=One-Click');
    // The unplanned departure (no heater) is warned too, with its own remedy.
    const halla = mails.find((x) => x.subject.includes('Q-HALLA'))!;
    expect(halla.subject).toContain('has no heat plan');
    expect(flat(halla.text)).toContain("Fit a preheater in the aircraft's profile");
    // Every e-mail went once.
    const keys = smtp.received.map((x) => `${x.envelopeTo.join()}|${x.messageId}`);
    expect(new Set(keys).size).toBe(keys.length);
  });

  it('also reaches the operators, naming the pilot, and links them to the Morning board', async () => {
    const ops = to('operator@frostvale.test').filter((m) => m.subject.includes('Q-SIPI') && m.subject.includes('too cold'));
    expect(ops).toHaveLength(1);
    expect(flat(ops[0].text)).toContain("Tove Rask's departure");
    expect(ops[0].text).toMatch(/Ready temperature:\s+20 °C/);
    expect(ops[0].text).toContain('/board');
  });

  it('is not sent again while the prediction holds, and again (marked updated) when it changes materially', async () => {
    const before = smtp.received.length;
    const again = await evaluate(new Date(now0.getTime() + 60_000));
    expect(again.queued).toBe(0);
    await deliver(new Date(now0.getTime() + 60_000));
    expect(smtp.received.length).toBe(before);

    const sipi = (await models.Aircraft.findOne({ where: { registration: 'Q-SIPI' } }))!;
    const dep = (await models.Departure.findOne({ where: { aircraftId: sipi.id, cancelledAt: null, departAt: { [Op.gt]: new Date() } }, order: [['departAt', 'ASC']] }))!;
    await dep.update({ readyC: dep.readyC + 5 });
    const later = new Date(now0.getTime() + 2 * 60_000);
    await evaluate(later);
    await deliver(later);
    const updated = to(DEMO.pilot).filter((m) => m.subject.startsWith('Updated: Q-SIPI'));
    expect(updated).toHaveLength(1);
    // 25 °C = 77 °F (from memory, by the definition of the scale).
    expect(updated[0].text).toMatch(/Ready temperature:\s+77 °F/);
    expect(flat(updated[0].text)).toContain('The prediction has changed since the last message.');
  });

  it('judges a change material by status, departure time, ready temperature or more than 2 K of predicted oil', async () => {
    const { isMaterialChange } = await import('@/lib/alerts/evaluate');
    const base = { status: 'short', oilC: 10, departAt: '2026-12-03T05:30:00.000Z', readyC: 20 };
    expect(isMaterialChange('oil-too-cold', base, { ...base, oilC: 11.9 })).toBe(false);
    expect(isMaterialChange('oil-too-cold', base, { ...base, oilC: 12.1 })).toBe(true);
    expect(isMaterialChange('oil-too-cold', base, { ...base, oilC: 7.9 })).toBe(true);
    expect(isMaterialChange('oil-too-cold', base, { ...base, status: 'unplanned' })).toBe(true);
    expect(isMaterialChange('oil-too-cold', base, { ...base, departAt: '2026-12-03T06:00:00.000Z' })).toBe(true);
    expect(isMaterialChange('switch-on', { switchOnMs: 0, departAt: 'x' }, { switchOnMs: 14 * 60_000, departAt: 'x' }, -1)).toBe(false);
    const h = 3_600_000;
    expect(isMaterialChange('switch-on', { switchOnMs: h, departAt: 'x' }, { switchOnMs: h + 15 * 60_000, departAt: 'x' }, 0)).toBe(true);
    expect(isMaterialChange('switch-on', { switchOnMs: h, departAt: 'x' }, { switchOnMs: h - 15 * 60_000, departAt: 'x' }, 0)).toBe(true);
    // Once the time sent has passed, a later one is no news: the heater should be on already.
    expect(isMaterialChange('switch-on', { switchOnMs: h, departAt: 'x' }, { switchOnMs: h + 50 * 60_000, departAt: 'x' }, h + 20 * 60_000)).toBe(false);
  });

  it('shows in the app with an unread count; acknowledging is the owner’s alone', async () => {
    const { GET } = await import('@/app/api/alerts/route');
    const { PATCH } = await import('@/app/api/alerts/[id]/route');
    const { POST: ackAll } = await import('@/app/api/alerts/acknowledge-all/route');
    const { GET: unread } = await import('@/app/api/alerts/unread/route');
    signOut();
    expect((await call(GET)).status).toBe(401);
    await signInAs(DEMO.pilot);
    const list = await call(GET);
    expect(list.status).toBe(200);
    const sipi = list.body.alerts.find((a: any) => a.kind === 'oil-too-cold' && a.data.aircraft.registration === 'Q-SIPI');
    expect(sipi).toBeTruthy();
    expect(sipi.audience).toBe('pilot');
    expect(sipi.revision).toBe(2);
    expect(sipi.email.state).toBe('sent');
    // Superseded revisions are not listed by default.
    expect(list.body.alerts.filter((a: any) => a.data.aircraft?.registration === 'Q-SIPI' && a.kind === 'oil-too-cold')).toHaveLength(1);
    const n = list.body.unread;
    expect(n).toBeGreaterThanOrEqual(2);
    expect((await call(PATCH, { method: 'PATCH', params: { id: String(sipi.id) }, body: { acknowledged: 'yes' } })).body.fields[0].field).toBe('acknowledged');
    const ack = await call(PATCH, { method: 'PATCH', params: { id: String(sipi.id) }, body: { acknowledged: true } });
    expect(ack.status).toBe(200);
    expect(ack.body.unread).toBe(n - 1);
    expect((await call(unread)).body.unread).toBe(n - 1);
    // Another user's alert, and another organization's user: not found.
    await signInAs(DEMO.operator);
    expect((await call(PATCH, { method: 'PATCH', params: { id: String(sipi.id) }, body: { acknowledged: true } })).status).toBe(404);
    await signInAs(DEMO.otherManager);
    expect((await call(PATCH, { method: 'PATCH', params: { id: String(sipi.id) }, body: { acknowledged: true } })).status).toBe(404);
    expect((await call(GET)).body.alerts).toHaveLength(0);
    await signInAs(DEMO.pilot);
    const all = await call(ackAll, { method: 'POST', body: {} });
    expect(all.body.unread).toBe(0);
  });
});

describe('switch-on reminder', () => {
  it('reaches each operator once, before the switch-on time of a heater switched by hand', async () => {
    const { plansBetween } = await import('@/lib/data/plans');
    const routa = (await models.Aircraft.findOne({ where: { registration: 'Q-ROUTA' } }))!;
    await models.Heater.update({ control: 'manual', slotMinutes: 30 }, { where: { aircraftId: routa.id } });
    // Its own manual asks for warm oil at start, so the mild heated hangar still needs heat (the maker's rule).
    await routa.update({ minStartOilC: 15 });
    const org = (await models.Organization.findOne({ where: { name: 'Frostvale Flying Club' } }))!;
    // The plan as it stands 20 minutes before its switch-on time (the forecast is refreshed at that time).
    const planAt = async (now: Date) =>
      (await plansBetween({ orgId: org.id, fromMs: now.getTime(), toMs: now.getTime() + 36 * 3_600_000, now, refresh: 'if-old' })).find((p) => p.aircraft.registration === 'Q-ROUTA')!;
    let plan = await planAt(now0);
    expect(plan.heater?.control).toBe('manual');
    expect(plan.switchOnAt).toBeTruthy();
    plan = await planAt(new Date(Date.parse(plan.switchOnAt!) - 20 * 60_000));
    const switchOn = Date.parse(plan.switchOnAt!);
    const at = new Date(switchOn - 20 * 60_000);
    await evaluate(at);
    await deliver(at);
    for (const op of ['operator@frostvale.test', 'operator2@frostvale.test']) {
      const mails = to(op).filter((m) => m.subject.startsWith("Switch on Q-ROUTA's"));
      expect(mails).toHaveLength(1);
      expect(flat(mails[0].text)).toContain('This heater is switched by hand.');
      expect(flat(mails[0].text)).toContain('Preheaters can start fires');
    }
    // Pilots do not get switch-on reminders.
    expect(to(DEMO.pilot).filter((m) => m.subject.startsWith('Switch on'))).toHaveLength(0);
    const next = new Date(switchOn - 10 * 60_000);
    await evaluate(next);
    await deliver(next);
    expect(to('operator@frostvale.test').filter((m) => m.subject.startsWith("Switch on Q-ROUTA's"))).toHaveLength(1);
  });
});

describe('cold-night notice', () => {
  it("reaches the managers once at the organization's notice time, listing aircraft that need heat and the planned energy", async () => {
    const { evaluateColdNight } = await import('@/lib/alerts/evaluate');
    const { localDateOf, zonedTimeToUtc } = await import('@/lib/time');
    const org = (await models.Organization.findOne({ where: { name: 'Frostvale Flying Club' } }))!;
    // 18:00 local on the day before the demo's departures, the notice five minutes later.
    const sipi = (await models.Aircraft.findOne({ where: { registration: 'Q-SIPI' } }))!;
    const dep = (await models.Departure.findOne({ where: { aircraftId: sipi.id, cancelledAt: null, departAt: { [Op.gt]: new Date() } }, order: [['departAt', 'ASC']] }))!;
    const d = localDateOf('Europe/Helsinki', new Date(dep.departAt).getTime() - 24 * 3_600_000);
    const at = new Date(zonedTimeToUtc('Europe/Helsinki', d.year, d.month, d.day, 18, 5));
    await org.update({ coldNightThresholdC: 10, coldNightNoticeAt: '18:00' });
    const r = await evaluateColdNight({ now: at, orgIds: [org.id] });
    expect(r.created).toBe(1); // the one manager
    await deliver(at);
    const mails = to(DEMO.manager).filter((m) => m.subject.startsWith('Cold night:'));
    expect(mails).toHaveLength(1);
    const m = mails[0];
    expect(m.subject).toMatch(/^Cold night: −?\d+ °C forecast at .+ and 2 other airfields$/);
    for (const name of ['Kettle Lake', 'Birchmoor', 'Stonegate Strip']) expect(m.text).toContain(name);
    expect(m.text).toContain('Aircraft that need heat');
    expect(m.text).toMatch(/Total planned\s+\d+(\.\d)? kWh/);
    expect(m.text).toContain('Q-SIPI');
    expect(m.html).toContain('Total planned');
    // Operators and pilots do not get it; a second evaluation sends nothing more.
    expect(to('operator@frostvale.test').filter((x) => x.subject.startsWith('Cold night'))).toHaveLength(0);
    await evaluateColdNight({ now: new Date(at.getTime() + 5 * 60_000) });
    await deliver(new Date(at.getTime() + 5 * 60_000));
    expect(to(DEMO.manager).filter((x) => x.subject.startsWith('Cold night:'))).toHaveLength(1);
    // The other organization's manager hears only of their own airfields.
    await evaluateColdNight({ now: at });
    await deliver(at);
    for (const other of to(DEMO.otherManager)) {
      expect(other.text).not.toContain('Kettle Lake');
      expect(other.text).not.toContain('Q-SIPI');
    }
  });
});
