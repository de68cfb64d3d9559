import { beforeAll, describe, expect, it } from 'vitest';
import { call, DEMO, freshDatabase, signInAs, signOut } from './helpers';

let me: typeof import('@/app/api/me/route');
let users: typeof import('@/app/api/users/route');
let userById: typeof import('@/app/api/users/[id]/route');
let health: typeof import('@/app/api/health/route');
let password: typeof import('@/app/api/me/password/route');

beforeAll(async () => {
  await freshDatabase();
  me = await import('@/app/api/me/route');
  users = await import('@/app/api/users/route');
  userById = await import('@/app/api/users/[id]/route');
  health = await import('@/app/api/health/route');
  password = await import('@/app/api/me/password/route');
});

describe('health and session', () => {
  it('health answers 200 when the database answers', async () => {
    const r = await call(health.GET);
    expect(r.status).toBe(200);
    expect(r.body.status).toBe('ok');
  });

  it('a request with no session answers 401', async () => {
    signOut();
    expect((await call(me.GET)).status).toBe(401);
    expect((await call(users.GET)).status).toBe(401);
  });

  it('/api/me tells who is signed in, with role and organization', async () => {
    await signInAs(DEMO.operator);
    const r = await call(me.GET);
    expect(r.status).toBe(200);
    expect(r.body.role).toBe('operator');
    expect(r.body.organization.name).toBe('Frostvale Flying Club');
    expect(r.body.permissions).toContain('plans:manage');
  });
});

describe('user administration', () => {
  it('a pilot and an operator are refused the user list (403)', async () => {
    await signInAs(DEMO.pilot);
    expect((await call(users.GET)).status).toBe(403);
    await signInAs(DEMO.operator);
    expect((await call(users.GET)).status).toBe(403);
  });

  it('a manager lists only their own organization', async () => {
    await signInAs(DEMO.manager);
    const r = await call(users.GET);
    expect(r.status).toBe(200);
    const emails = r.body.users.map((u: { email: string }) => u.email);
    expect(emails).toContain(DEMO.pilot);
    expect(emails).not.toContain(DEMO.otherManager);
  });

  it('bad input is 422 naming the field, and nothing is written', async () => {
    await signInAs(DEMO.manager);
    const before = (await call(users.GET)).body.users.length;
    const r = await call(users.POST, { method: 'POST', body: { name: '', email: 'not-an-email', role: 'captain', temporaryPassword: 'short' } });
    expect(r.status).toBe(422);
    const fields = r.body.fields.map((f: { field: string }) => f.field);
    expect(fields).toEqual(expect.arrayContaining(['name', 'email', 'role', 'temporaryPassword']));
    expect((await call(users.GET)).body.users.length).toBe(before);
  });

  it('malformed JSON is a 422, never a stack trace', async () => {
    await signInAs(DEMO.manager);
    const r = await call(users.POST, { method: 'POST', rawBody: '{"name": ' });
    expect(r.status).toBe(422);
    expect(r.text).not.toMatch(/at .*\.ts|SELECT|Sequelize/);
  });

  it('a manager adds a user with a temporary password, changes the role and deactivates', async () => {
    await signInAs(DEMO.manager);
    const r = await call(users.POST, { method: 'POST', body: { name: 'New Pilot', email: 'new.pilot@frostvale.test', role: 'pilot', temporaryPassword: 'temporary-123' } });
    expect(r.status).toBe(201);
    expect(r.body.user.mustChangePassword).toBe(true);
    // The answer carries no id (it would tell a taken address from a free one): the list has it.
    expect(r.body.user.id).toBeUndefined();
    const { db } = await import('@/models');
    const id = String((await db().User.findOne({ where: { email: 'new.pilot@frostvale.test' } }))!.id);
    const dup = await call(users.POST, { method: 'POST', body: { name: 'Again', email: 'new.pilot@frostvale.test', role: 'pilot', temporaryPassword: 'temporary-123' } });
    expect(dup.status).toBe(409);
    const role = await call(userById.PATCH, { method: 'PATCH', params: { id }, body: { role: 'operator' } });
    expect(role.status).toBe(200);
    expect(role.body.user.role).toBe('operator');
    const off = await call(userById.PATCH, { method: 'PATCH', params: { id }, body: { active: false } });
    expect(off.body.user.active).toBe(false);
    // The deactivated user's session stops working at once.
    await signInAs('new.pilot@frostvale.test');
    expect((await call(me.GET)).status).toBe(401);
  });

  it("another organization's user answers 404", async () => {
    const { db } = await import('@/models');
    const other = await db().User.findOne({ where: { email: DEMO.otherManager } });
    await signInAs(DEMO.manager);
    const r = await call(userById.PATCH, { method: 'PATCH', params: { id: String(other!.id) }, body: { role: 'pilot' } });
    expect(r.status).toBe(404);
    const still = await db().User.findByPk(other!.id);
    expect(still!.role).toBe('manager');
  });

  it('a manager cannot demote or deactivate themselves', async () => {
    const u = await signInAs(DEMO.manager);
    const r = await call(userById.PATCH, { method: 'PATCH', params: { id: String(u.id) }, body: { active: false } });
    expect(r.status).toBe(403);
  });
});

describe('own settings', () => {
  it('every user changes their units', async () => {
    await signInAs(DEMO.pilot);
    const r = await call(me.PATCH, { method: 'PATCH', body: { tempUnit: 'F', volumeUnit: 'qt' } });
    expect(r.status).toBe(200);
    expect((await call(me.GET)).body.units).toEqual({ temperature: 'F', volume: 'qt' });
    const bad = await call(me.PATCH, { method: 'PATCH', body: { tempUnit: 'K' } });
    expect(bad.status).toBe(422);
    expect(bad.body.fields[0].field).toBe('tempUnit');
  });

  it('changing the password needs the current one', async () => {
    await signInAs(DEMO.pilot);
    const wrong = await call(password.POST, { method: 'POST', body: { currentPassword: 'nope-nope-nope', newPassword: 'another-pass-1' } });
    expect(wrong.status).toBe(422);
    expect(wrong.body.fields[0].field).toBe('currentPassword');
    const ok = await call(password.POST, { method: 'POST', body: { currentPassword: DEMO.password, newPassword: 'another-pass-1' } });
    expect(ok.status).toBe(200);
  });
});
