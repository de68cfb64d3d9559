import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import bcrypt from 'bcryptjs';
import { DEMO, call, freshDatabase, signInAs, signOut } from './helpers';
import { startSmtpUrl, stopSmtpUrl, type TestSmtp } from '../support/smtp';

// Invitations and password resets by e-mail with signed, expiring, single-use tokens, delivered to a
// real SMTP server started here.

let smtp: TestSmtp;
let models: Awaited<ReturnType<typeof freshDatabase>>;

beforeAll(async () => {
  smtp = await startSmtpUrl();
  models = await freshDatabase();
});
afterAll(() => stopSmtpUrl(smtp));

async function deliver(now = new Date()) {
  const { deliverDue } = await import('@/lib/mail/deliver');
  return deliverDue({ now, holder: 'test' });
}
const lastTo = (email: string) => [...smtp.received].reverse().find((m) => m.envelopeTo.includes(email))!;
const tokenIn = (text: string, path: 'invite' | 'reset') => new RegExp(`/${path}/([A-Za-z0-9_-]{43})`).exec(text)![1];

describe('invitations', () => {
  it('a manager invites by e-mail; the invitee chooses a password once with the link', async () => {
    const users = await import('@/app/api/users/route');
    const accept = await import('@/app/api/tokens/invite/route');
    await signInAs(DEMO.manager);
    const r = await call(users.POST, { method: 'POST', body: { name: 'Nea Frost', email: 'nea.frost@frostvale.test', role: 'pilot' } });
    expect(r.status).toBe(201);
    expect(r.body.invited).toBe(true);
    expect(r.body.user.mustChangePassword).toBe(true);
    await deliver();
    const mail = lastTo('nea.frost@frostvale.test');
    expect(mail.subject).toBe('Maren Holt invited you to Frostvale Flying Club on Thawline');
    expect(mail.text).toContain('Choose your password');
    expect(mail.text).toContain('Thawline gives estimates.');
    expect(mail.html).toContain('Choose your password');
    const token = tokenIn(mail.text, 'invite');
    // Only a keyed hash of the token is stored.
    expect(await models.Token.count({ where: { tokenHash: token } })).toBe(0);

    signOut();
    const bad = await call(accept.POST, { method: 'POST', body: { token, password: 'long-enough-1', confirm: 'different-one' } });
    expect(bad.status).toBe(422);
    expect(bad.body.fields.map((f: any) => f.field)).toContain('confirm');
    const short = await call(accept.POST, { method: 'POST', body: { token, password: 'short' } });
    expect(short.body.fields.map((f: any) => f.field)).toContain('password');
    const ok = await call(accept.POST, { method: 'POST', body: { token, name: 'Nea Frost-Lind', password: 'my-own-password-1', confirm: 'my-own-password-1' } });
    expect(ok.status).toBe(200);
    expect(ok.body.email).toBe('nea.frost@frostvale.test');
    const u = (await models.User.findOne({ where: { email: 'nea.frost@frostvale.test' } }))!;
    expect(await bcrypt.compare('my-own-password-1', u.passwordHash)).toBe(true);
    expect(u.mustChangePassword).toBe(false);
    expect(u.name).toBe('Nea Frost-Lind');

    const again = await call(accept.POST, { method: 'POST', body: { token, password: 'another-password-2' } });
    expect(again.status).toBe(422);
    expect(again.body.fields[0]).toEqual({ field: 'token', message: expect.stringContaining('already used') });
    expect(await bcrypt.compare('my-own-password-1', (await u.reload()).passwordHash)).toBe(true);
  });

  it('a new invitation makes the earlier link stop working; only managers send one, only to someone without a password', async () => {
    const users = await import('@/app/api/users/route');
    const resend = await import('@/app/api/tokens/invitations/route');
    const accept = await import('@/app/api/tokens/invite/route');
    await signInAs(DEMO.manager);
    await call(users.POST, { method: 'POST', body: { name: 'Oli Haze', email: 'oli.haze@frostvale.test', role: 'operator' } });
    const created = { body: { user: (await models.User.findOne({ where: { email: 'oli.haze@frostvale.test' } }))! } };
    await deliver();
    const first = tokenIn(lastTo('oli.haze@frostvale.test').text, 'invite');
    expect((await call(resend.POST, { method: 'POST', body: { userId: created.body.user.id } })).status).toBe(201);
    await deliver();
    const second = tokenIn(lastTo('oli.haze@frostvale.test').text, 'invite');
    expect(second).not.toBe(first);
    signOut();
    const old = await call(accept.POST, { method: 'POST', body: { token: first, password: 'oli-password-1' } });
    expect(old.status).toBe(422);
    expect(old.body.fields[0].message).toContain('expired');
    expect((await call(accept.POST, { method: 'POST', body: { token: second, password: 'oli-password-1' } })).status).toBe(200);
    expect((await call(resend.POST, { method: 'POST', body: { userId: created.body.user.id } })).status).toBe(401);
    await signInAs(DEMO.pilot);
    expect((await call(resend.POST, { method: 'POST', body: { userId: created.body.user.id } })).status).toBe(403);
    await signInAs(DEMO.manager);
    expect((await call(resend.POST, { method: 'POST', body: { userId: created.body.user.id } })).status).toBe(409);
    await signInAs(DEMO.otherManager);
    expect((await call(resend.POST, { method: 'POST', body: { userId: created.body.user.id } })).status).toBe(404);
  });

  it('refuses a damaged token naming the field', async () => {
    const accept = await import('@/app/api/tokens/invite/route');
    signOut();
    const r = await call(accept.POST, { method: 'POST', body: { token: 'abc', password: 'long-enough-1' } });
    expect(r.status).toBe(422);
    expect(r.body.fields[0].field).toBe('token');
    const unknown = await call(accept.POST, { method: 'POST', body: { token: 'A'.repeat(43), password: 'long-enough-1' } });
    expect(unknown.body.fields[0]).toEqual({ field: 'token', message: expect.stringContaining('not valid') });
  });
});

describe('password reset', () => {
  it('answers the same whether or not the address has an account, and sends at most one link per ten minutes', async () => {
    const req = await import('@/app/api/tokens/reset-request/route');
    signOut();
    const before = await models.OutboxMessage.count({ where: { kind: 'reset' } });
    const known = await call(req.POST, { method: 'POST', body: { email: DEMO.operator } });
    const unknown = await call(req.POST, { method: 'POST', body: { email: 'nobody@nowhere.test' } });
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(known.status);
    expect(unknown.body).toEqual(known.body);
    await call(req.POST, { method: 'POST', body: { email: DEMO.operator } });
    // The work behind the answer is queued (the answer does not wait for it): wait for it here.
    const { settleQueuedResets } = await import('@/lib/data/tokens');
    await settleQueuedResets();
    expect(await models.OutboxMessage.count({ where: { kind: 'reset' } })).toBe(before + 1);
    const badEmail = await call(req.POST, { method: 'POST', body: { email: 'not an address' } });
    expect(badEmail.status).toBe(422);
    expect(badEmail.body.fields[0].field).toBe('email');
  });

  it('refuses an expired link and a reused one; a fresh link sets the new password', async () => {
    const { requestPasswordReset, resetPassword } = await import('@/lib/data/tokens');
    const reset = await import('@/app/api/tokens/reset/route');
    const t0 = new Date(Date.now() + 3 * 3_600_000);
    await requestPasswordReset({ email: DEMO.pilot, now: t0 });
    await deliver(t0);
    const mail = lastTo(DEMO.pilot);
    expect(mail.subject).toBe('Reset your Thawline password');
    const expired = tokenIn(mail.text, 'reset');
    await expect(resetPassword({ token: expired, password: 'new-password-77', now: new Date(t0.getTime() + 61 * 60_000) })).rejects.toMatchObject({
      status: 422,
      fields: [{ field: 'token', message: expect.stringContaining('expired') }],
    });
    await requestPasswordReset({ email: DEMO.pilot });
    await deliver();
    const fresh = tokenIn(lastTo(DEMO.pilot).text, 'reset');
    expect(fresh).not.toBe(expired);
    signOut();
    const ok = await call(reset.POST, { method: 'POST', body: { token: fresh, password: 'new-password-77', confirm: 'new-password-77' } });
    expect(ok.status).toBe(200);
    const u = (await models.User.findOne({ where: { email: DEMO.pilot } }))!;
    expect(await bcrypt.compare('new-password-77', u.passwordHash)).toBe(true);
    expect(await bcrypt.compare(DEMO.password, u.passwordHash)).toBe(false);
    const reused = await call(reset.POST, { method: 'POST', body: { token: fresh, password: 'yet-another-88' } });
    expect(reused.status).toBe(422);
    expect(reused.body.fields[0].message).toContain('already used');
  });
});
