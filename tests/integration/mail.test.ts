import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Op } from 'sequelize';
import { DEMO, call, freshDatabase, signInAs } from './helpers';
import { startSmtpUrl, stopSmtpUrl, testSmtp, type TestSmtp } from '../support/smtp';

// The outbox and its delivery against a real SMTP server started here (smtp-server, 127.0.0.1, port 0),
// reached through SMTP_URL: refusals and outages, a worker dying mid-delivery, two workers at once,
// quiet hours, the one-click unsubscribe, and the embedded local capture with its viewer API.

let smtp: TestSmtp;
let models: Awaited<ReturnType<typeof freshDatabase>>;
const t0 = new Date();
const at = (ms: number) => new Date(t0.getTime() + ms);
const MIN = 60_000;

beforeAll(async () => {
  smtp = await startSmtpUrl();
  models = await freshDatabase();
});
afterAll(() => stopSmtpUrl(smtp));

async function enqueue(key: string, email = DEMO.pilot, now = t0) {
  const { enqueueMail } = await import('@/lib/mail/outbox');
  const u = (await models.User.findOne({ where: { email } }))!;
  return enqueueMail({
    organizationId: u.organizationId,
    userId: u.id,
    kind: 'reset',
    to: u.email,
    mail: { subject: `Test ${key}`, text: `Body of ${key}`, html: `<p>Body of ${key}</p>` },
    dedupeKey: `test:${key}`,
    now,
  });
}
async function deliver(now: Date, holder = 'worker-a', transport?: import('@/lib/mail/transport').MailTransport) {
  const { deliverDue } = await import('@/lib/mail/deliver');
  return deliverDue({ now, holder, limit: 100, ...(transport ? { transport } : {}) });
}
const received = (key: string) => smtp.received.filter((m) => m.subject === `Test ${key}`);

describe('the outbox', () => {
  it('writes one row for one de-duplication key', async () => {
    const a = await enqueue('dedupe');
    const b = await enqueue('dedupe');
    expect(a.created).toBe(true);
    expect(b.created).toBe(false);
    expect(b.id).toBe(a.id);
    expect(await models.OutboxMessage.count({ where: { dedupeKey: 'test:dedupe' } })).toBe(1);
    await deliver(t0);
    expect(received('dedupe')).toHaveLength(1);
  });

  it('retries while the server refuses mail or is down, and delivers each message once when it is back', async () => {
    const keys = ['r1', 'r2', 'r3'];
    for (const k of keys) await enqueue(k);
    smtp.refuseMail(true);
    const first = await deliver(t0);
    expect(first.retried).toBe(3);
    const rows = await models.OutboxMessage.findAll({ where: { dedupeKey: keys.map((k) => `test:${k}`) } });
    for (const r of rows) {
      expect(r.status).toBe('pending');
      expect(r.attempts).toBe(1);
      expect(r.lastError).toMatch(/451/);
      expect(r.nextAttemptAt.getTime()).toBe(t0.getTime() + 1 * MIN);
    }
    // Not yet due: nothing is tried.
    expect((await deliver(at(30_000))).retried).toBe(0);
    // The server is down altogether.
    await smtp.stop();
    const down = await deliver(at(1 * MIN + 1000));
    expect(down.retried).toBe(3);
    const r2 = (await models.OutboxMessage.findOne({ where: { dedupeKey: 'test:r1' } }))!;
    expect(r2.attempts).toBe(2);
    expect(r2.lastError).toMatch(/ECONNREFUSED|connect/i);
    expect(r2.nextAttemptAt.getTime()).toBe(at(1 * MIN + 1000).getTime() + 2 * MIN);
    // Back, accepting again.
    await smtp.restart();
    smtp.refuseMail(false);
    const back = await deliver(at(4 * MIN));
    expect(back.sent).toBe(3);
    for (const k of keys) expect(received(k)).toHaveLength(1);
    expect((await deliver(at(10 * MIN))).sent).toBe(0);
    for (const k of keys) expect(received(k)).toHaveLength(1);
  });

  it('leaves a message claimed by a worker that died alone until the claim lapses, then sends it with the same Message-ID', async () => {
    const { id } = await enqueue('crash');
    await models.OutboxMessage.update({ status: 'sending', claimedBy: 'worker-that-died', claimedUntil: at(5 * MIN), attempts: 1 }, { where: { id } });
    expect((await deliver(at(1 * MIN), 'worker-b')).sent).toBe(0);
    expect(received('crash')).toHaveLength(0);
    expect((await deliver(at(6 * MIN), 'worker-b')).sent).toBe(1);
    const row = (await models.OutboxMessage.findByPk(id))!;
    expect(row.status).toBe('sent');
    expect(received('crash')).toHaveLength(1);
    expect(received('crash')[0].messageId).toBe(row.messageId);
  });

  it('sends each message once when two workers deliver at the same time', async () => {
    const slow = await testSmtp({ dataDelayMs: 40 });
    const { loopbackTransport } = await import('@/lib/mail/transport');
    const keys = ['p1', 'p2', 'p3', 'p4', 'p5', 'p6'];
    for (const k of keys) await enqueue(k, DEMO.operator, at(20 * MIN));
    const [a, b] = await Promise.all([deliver(at(20 * MIN), 'worker-a', loopbackTransport(slow.port)), deliver(at(20 * MIN), 'worker-b', loopbackTransport(slow.port))]);
    expect(a.sent + b.sent).toBe(keys.length);
    const ids = slow.received.map((m) => m.messageId);
    expect(ids).toHaveLength(keys.length);
    expect(new Set(ids).size).toBe(keys.length);
    await slow.stop();
  });

  it('backs off 1, 2, 4 … minutes, capped at an hour', async () => {
    const { backoffMinutes } = await import('@/lib/mail/deliver');
    expect([1, 2, 3, 4, 5, 6, 7, 12].map(backoffMinutes)).toEqual([1, 2, 4, 8, 16, 32, 60, 60]);
  });
});

describe('quiet hours', () => {
  it('hold the cold-night notice until they end, while the oil-too-cold warning goes at once', async () => {
    const { localDateOf, zonedTimeToUtc, formatTime } = await import('@/lib/time');
    const { evaluateAlerts, evaluateColdNight } = await import('@/lib/alerts/evaluate');
    const org = (await models.Organization.findOne({ where: { name: 'Frostvale Flying Club' } }))!;
    const pilot = (await models.User.findOne({ where: { email: DEMO.pilot } }))!;
    const manager = (await models.User.findOne({ where: { email: DEMO.manager } }))!;
    const zone = 'Europe/Helsinki';
    // The pilot's quiet hours cover the evaluation time.
    const now = at(30 * MIN);
    await models.AlertPreference.upsert({
      userId: pilot.id,
      organizationId: org.id,
      quietStart: formatTime(now.getTime() - 60 * MIN, zone),
      quietEnd: formatTime(now.getTime() + 60 * MIN, zone),
      timeZone: zone,
    });
    await evaluateAlerts({ now, orgIds: [org.id] });
    const warning = (await models.OutboxMessage.findOne({ where: { userId: pilot.id, kind: 'oil-too-cold' } }))!;
    expect(warning.nextAttemptAt.getTime()).toBeLessThanOrEqual(now.getTime());
    await deliver(now);
    expect(smtp.received.filter((m) => m.envelopeTo.includes(DEMO.pilot) && /too cold|needs heat/.test(m.subject)).length).toBeGreaterThan(0);

    // The manager's quiet hours 17:00–19:00; the notice is due at 18:00 on the evening before the departures.
    const dep = (await models.Departure.findOne({ where: { organizationId: org.id, cancelledAt: null, departAt: { [Op.gt]: new Date() } }, order: [['departAt', 'ASC']] }))!;
    const d = localDateOf(zone, new Date(dep.departAt).getTime() - 24 * 3_600_000);
    const evening = new Date(zonedTimeToUtc(zone, d.year, d.month, d.day, 18, 5));
    const quietEnd = zonedTimeToUtc(zone, d.year, d.month, d.day, 19, 0);
    await models.AlertPreference.upsert({ userId: manager.id, organizationId: org.id, quietStart: '17:00', quietEnd: '19:00', timeZone: zone });
    await org.update({ coldNightThresholdC: 10, coldNightNoticeAt: '18:00' });
    const r = await evaluateColdNight({ now: evening, orgIds: [org.id] });
    expect(r.heldForQuietHours).toBe(1);
    const notice = (await models.OutboxMessage.findOne({ where: { userId: manager.id, kind: 'cold-night' } }))!;
    expect(notice.nextAttemptAt.getTime()).toBe(quietEnd);
    const coldMail = () => smtp.received.filter((m) => m.envelopeTo.includes(DEMO.manager) && m.subject.startsWith('Cold night'));
    await deliver(evening);
    expect(coldMail()).toHaveLength(0);
    // The alert is in the app meanwhile, its e-mail shown as held.
    const { listAlerts } = await import('@/lib/data/alerts');
    const shown = (await listAlerts({ orgId: org.id, userId: manager.id, now: evening })).alerts.find((a) => a.kind === 'cold-night')!;
    expect(shown.email.state).toBe('held');
    await deliver(new Date(quietEnd + 30_000));
    expect(coldMail()).toHaveLength(1);
  });

  it('read a window across midnight in the zone (22:00–06:30)', async () => {
    const { inQuietHours, quietHoursEnd } = await import('@/lib/mail/quiet');
    const { zonedTimeToUtc } = await import('@/lib/time');
    const q = { start: '22:00', end: '06:30', timeZone: 'Europe/Helsinki' };
    const t = (h: number, m = 0, day = 10) => zonedTimeToUtc('Europe/Helsinki', 2026, 12, day, h, m);
    expect(inQuietHours(q, t(21, 59))).toBe(false);
    expect(inQuietHours(q, t(22, 0))).toBe(true);
    expect(inQuietHours(q, t(3, 0))).toBe(true);
    expect(inQuietHours(q, t(6, 30))).toBe(false);
    expect(quietHoursEnd(q, t(23, 15))).toBe(t(6, 30, 11));
    expect(quietHoursEnd(q, t(2, 0))).toBe(t(6, 30, 10));
    expect(quietHoursEnd(q, t(12, 0))).toBeNull();
    expect(inQuietHours({ ...q, start: null, end: null }, t(3, 0))).toBe(false);
  });
});

describe('unsubscribe', () => {
  it("turns that kind's e-mail off with the one-click link, keeps the alert in the app, and refuses a forged link", async () => {
    const { POST } = await import('@/app/unsubscribe/[token]/one-click/route');
    const msg = smtp.received.find((m) => m.envelopeTo.includes('operator2@frostvale.test') && /too cold|needs heat/.test(m.subject));
    expect(msg).toBeTruthy();
    const url = /^<(.+)>$/.exec(msg!.headers['list-unsubscribe'])![1];
    const token = /\/unsubscribe\/([^/]+)\/one-click$/.exec(url)![1];
    const post = (tok: string, body: string) =>
      POST(new Request(`http://localhost/unsubscribe/${tok}/one-click`, { method: 'POST', headers: { 'content-type': 'application/x-www-form-urlencoded' }, body }), {
        params: Promise.resolve({ token: tok }),
      });
    const forged = token.slice(0, -2) + (token.endsWith('AA') ? 'BB' : 'AA');
    expect((await post(forged, 'List-Unsubscribe=One-Click')).status).toBe(404);
    const res = await post(token, 'List-Unsubscribe=One-Click');
    expect(res.status).toBe(200);
    const op2 = (await models.User.findOne({ where: { email: 'operator2@frostvale.test' } }))!;
    const pref = (await models.AlertPreference.findByPk(op2.id))!;
    expect(pref.oilTooCold).toBe('app');
    expect(pref.switchOn).toBe('email');
    // A warning already queued for them is not sent; new ones are shown in the app only.
    const { enqueueMail } = await import('@/lib/mail/outbox');
    await enqueueMail({ organizationId: op2.organizationId, userId: op2.id, kind: 'oil-too-cold', to: op2.email, mail: { subject: 'Queued before', text: 'x', html: 'x' }, dedupeKey: 'test:queued-before' });
    const r = await deliver(new Date());
    expect(r.cancelled).toBeGreaterThanOrEqual(1);
    expect(smtp.received.filter((m) => m.subject === 'Queued before')).toHaveLength(0);
    // The page's button comes back to the page, marked done.
    const page = await post(token, 'source=page');
    expect(page.status).toBe(303);
    expect(page.headers.get('location')).toMatch(/\/unsubscribe\/.+\?done=1$/);
  });
});

describe('the local capture', () => {
  it("keeps what it receives, once per Message-ID, for the recipient's organization's managers only", async () => {
    const { startCapture } = await import('@/lib/mail/capture');
    const { loopbackTransport } = await import('@/lib/mail/transport');
    const capture = await startCapture({ port: 0 });
    try {
      expect(capture.port).toBeGreaterThan(0);
      const { id } = await enqueue('captured', DEMO.operator, at(40 * MIN));
      const t = loopbackTransport(capture.port);
      expect((await deliver(at(40 * MIN), 'worker-a', t)).sent).toBe(1);
      // Sent again (as after a crash between sending and marking): still one copy.
      await models.OutboxMessage.update({ status: 'pending', nextAttemptAt: at(40 * MIN) }, { where: { id } });
      expect((await deliver(at(41 * MIN), 'worker-a', t)).sent).toBe(1);
      const rows = await models.CapturedMail.findAll({ where: { subject: 'Test captured' } });
      expect(rows).toHaveLength(1);
      const op = (await models.User.findOne({ where: { email: DEMO.operator } }))!;
      expect(rows[0].organizationId).toBe(op.organizationId);
      expect(rows[0].text).toBe('Body of captured');
      expect(rows[0].html).toBe('<p>Body of captured</p>');
      expect(rows[0].recipients).toEqual([DEMO.operator]);

      const { GET } = await import('@/app/api/mail/route');
      const { GET: one } = await import('@/app/api/mail/[id]/route');
      await signInAs(DEMO.operator);
      expect((await call(GET)).status).toBe(403);
      await signInAs(DEMO.manager);
      const list = await call(GET);
      expect(list.status).toBe(200);
      expect(list.body.messages.map((m: any) => m.subject)).toContain('Test captured');
      expect(list.body.outbox.counts.sent).toBeGreaterThan(0);
      const detail = await call(one, { params: { id: String(rows[0].id) } });
      // The source is kept as received; a manager who is not the recipient of a reset-kind message is
      // not shown it (it would carry the single-use link).
      expect(rows[0].raw).toContain('Subject: Test captured');
      expect(detail.body.message.text).toBe('Body of captured');
      expect(detail.body.message.redacted).toBe(true);
      expect(detail.body.message.raw).not.toContain('Subject: Test captured');
      await signInAs(DEMO.otherManager);
      expect((await call(GET)).body.messages.map((m: any) => m.subject)).not.toContain('Test captured');
      expect((await call(one, { params: { id: String(rows[0].id) } })).status).toBe(404);
    } finally {
      await capture.close();
    }
  });
});
