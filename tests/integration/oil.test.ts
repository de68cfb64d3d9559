import { beforeAll, describe, expect, it } from 'vitest';
import { call, DEMO, freshDatabase, signInAs, signOut } from './helpers';

let oil: typeof import('@/app/api/aircraft/[id]/oil/route');
let checks: typeof import('@/app/api/aircraft/[id]/oil/checks/route');
let oneCheck: typeof import('@/app/api/aircraft/[id]/oil/checks/[checkId]/route');
let changes: typeof import('@/app/api/aircraft/[id]/oil/changes/route');
let oneChange: typeof import('@/app/api/aircraft/[id]/oil/changes/[changeId]/route');
let settings: typeof import('@/app/api/aircraft/[id]/oil/settings/route');
let models: ReturnType<Awaited<typeof import('@/models')>['db']>;

beforeAll(async () => {
  models = await freshDatabase();
  oil = await import('@/app/api/aircraft/[id]/oil/route');
  checks = await import('@/app/api/aircraft/[id]/oil/checks/route');
  oneCheck = await import('@/app/api/aircraft/[id]/oil/checks/[checkId]/route');
  changes = await import('@/app/api/aircraft/[id]/oil/changes/route');
  oneChange = await import('@/app/api/aircraft/[id]/oil/changes/[changeId]/route');
  settings = await import('@/app/api/aircraft/[id]/oil/settings/route');
});

async function idOf(registration: string) {
  return String((await models.Aircraft.findOne({ where: { registration } }))!.id);
}
async function setUnits(email: string, tempUnit: 'C' | 'F', volumeUnit: 'L' | 'qt') {
  await models.User.update({ tempUnit, volumeUnit }, { where: { email } });
}
const check = (extra: Record<string, unknown> = {}) => ({ checkedAt: '2026-11-30T07:30', level: 2.9, oilTemp: -6, outsideTemp: -8, bladesTurned: 7, engineHours: 470.2, notes: 'Cold check', ...extra });

describe('reading the Oil log', () => {
  it('needs a session', async () => {
    signOut();
    expect((await call(oil.GET, { params: { id: await idOf('Q-KAPA') } })).status).toBe(401);
  });

  it('shows the seeded season: checks newest first with corrected levels, changes, oil used per hour and the next change', async () => {
    await signInAs(DEMO.pilot);
    const r = await call(oil.GET, { params: { id: await idOf('Q-ROUTA') } });
    expect(r.status).toBe(200);
    const log = r.body;
    expect(log.checks.length).toBeGreaterThan(20);
    expect(Date.parse(log.checks[0].checkedAt)).toBeGreaterThan(Date.parse(log.checks[1].checkedAt));
    expect(log.changes.length).toBe(2);
    expect(log.consumption.recentLPerH).toBeGreaterThan(0);
    expect(log.consumption.high).toBe(false);
    expect(log.due.status).not.toBe('unknown');
    expect(log.aircraft.timeZone).toBe('Europe/Helsinki');
    const warm = log.checks.find((c: { oilTempC: number }) => c.oilTempC > 30);
    expect(warm.correctedL).toBeLessThan(warm.levelL);
  });

  it('flags an aircraft using more oil than its engine class usually does', async () => {
    await signInAs(DEMO.operator);
    const r = await call(oil.GET, { params: { id: await idOf('Q-TAIMI') } });
    expect(r.body.consumption.high).toBe(true);
    expect(r.body.consumption.recentLPerH).toBeGreaterThan(r.body.consumption.usualLPerH);
  });

  it("another organization's aircraft is not found (404), for reading and writing", async () => {
    await signInAs(DEMO.otherManager);
    const id = await idOf('Q-KAPA');
    expect((await call(oil.GET, { params: { id } })).status).toBe(404);
    expect((await call(checks.POST, { method: 'POST', body: check(), params: { id } })).status).toBe(404);
    expect((await call(changes.POST, { method: 'POST', body: { changedAt: '2026-11-30T10:00', engineHours: 1, oilGrade: 'SAE 15W-50' }, params: { id } })).status).toBe(404);
    expect((await call(settings.PATCH, { method: 'PATCH', body: { oilChangeIntervalHours: 50 }, params: { id } })).status).toBe(404);
    const c = (await models.OilCheck.findOne({ where: { aircraftId: Number(id) } }))!;
    expect((await call(oneCheck.DELETE, { method: 'DELETE', params: { id: await idOf('Q-RIDGE'), checkId: String(c.id) } })).status).toBe(404);
  });
});

describe('recording a cold oil check', () => {
  it('a pilot records a check in their own units (°F, US quarts); it is stored in °C and litres, in the airfield zone', async () => {
    await setUnits(DEMO.pilot, 'F', 'qt');
    await signInAs(DEMO.pilot);
    const id = await idOf('Q-KAPA');
    const r = await call(checks.POST, { method: 'POST', body: check({ level: 3.2, oilTemp: 20, outsideTemp: 14 }), params: { id } });
    expect(r.status).toBe(201);
    const row = (await models.OilCheck.findByPk(r.body.id))!;
    expect(row.levelL).toBeCloseTo(3.2 * 0.946352946, 6);
    expect(row.oilTempC).toBeCloseTo(-6.667, 3);
    expect(row.outsideTempC).toBeCloseTo(-10, 6);
    // 07:30 in Helsinki in winter (UTC+2).
    expect(new Date(row.checkedAt).toISOString()).toBe('2026-11-30T05:30:00.000Z');
    expect(row.userId).toBe((await models.User.findOne({ where: { email: DEMO.pilot } }))!.id);
    expect(r.body.oilLog.checks.some((c: { id: number }) => c.id === r.body.id)).toBe(true);
    await setUnits(DEMO.pilot, 'C', 'L');
  });

  it('a reading taken at 90 °C is shown corrected to 15 °C about 5 % lower (Engineering ToolBox β; common practice)', async () => {
    await signInAs(DEMO.operator);
    const id = await idOf('Q-LUMI');
    const r = await call(checks.POST, { method: 'POST', body: check({ level: 3.0, oilTemp: 90, outsideTemp: -2, checkedAt: '2026-11-30T13:10' }), params: { id } });
    expect(r.status).toBe(201);
    const rec = r.body.oilLog.checks.find((c: { id: number }) => c.id === r.body.id);
    expect(rec.levelL).toBe(3);
    expect(rec.correctedL / rec.levelL - 1).toBeGreaterThan(-0.06);
    expect(rec.correctedL / rec.levelL - 1).toBeLessThan(-0.045);
  });

  it('refuses bad input with 422 naming each field, in the person’s units, and stores nothing', async () => {
    await setUnits(DEMO.pilot, 'F', 'L');
    await signInAs(DEMO.pilot);
    const id = await idOf('Q-KAPA');
    const before = await models.OilCheck.count();
    const r = await call(checks.POST, { method: 'POST', body: { checkedAt: 'yesterday', level: '', oilTemp: 900, outsideTemp: 'cold', bladesTurned: 2.5 }, params: { id } });
    expect(r.status).toBe(422);
    const f = Object.fromEntries(r.body.fields.map((x: { field: string; message: string }) => [x.field, x.message]));
    expect(Object.keys(f).sort()).toEqual(['bladesTurned', 'checkedAt', 'level', 'oilTemp', 'outsideTemp']);
    expect(f.oilTemp).toBe('The oil temperature must be between −76 °F and 302 °F.');
    expect(f.level).toBe('Enter the dipstick level.');
    const future = await call(checks.POST, { method: 'POST', body: check({ checkedAt: '2099-01-01T07:00' }), params: { id } });
    expect(future.status).toBe(422);
    expect(future.body.fields[0].field).toBe('checkedAt');
    const junk = await call(checks.POST, { method: 'POST', rawBody: '{"level": 3,', params: { id } });
    expect(junk.status).toBe(422);
    expect(junk.text).not.toMatch(/at .*\.ts|SELECT|Sequelize/);
    expect(await models.OilCheck.count()).toBe(before);
    await setUnits(DEMO.pilot, 'C', 'L');
  });

  it('removing an entry: its author may, others need aircraft:edit (403), operators may', async () => {
    const id = await idOf('Q-KAPA');
    await signInAs(DEMO.pilot);
    const mine = await call(checks.POST, { method: 'POST', body: check({ checkedAt: '2026-11-29T07:40' }), params: { id } });
    expect((await call(oneCheck.DELETE, { method: 'DELETE', params: { id, checkId: String(mine.body.id) } })).status).toBe(200);
    const someoneElse = (await models.OilCheck.findOne({ where: { aircraftId: Number(id), userId: (await models.User.findOne({ where: { email: 'pilot2@frostvale.test' } }))!.id } }))!;
    const refused = await call(oneCheck.DELETE, { method: 'DELETE', params: { id, checkId: String(someoneElse.id) } });
    expect(refused.status).toBe(403);
    await signInAs(DEMO.operator);
    expect((await call(oneCheck.DELETE, { method: 'DELETE', params: { id, checkId: String(someoneElse.id) } })).status).toBe(200);
    expect((await call(oneCheck.DELETE, { method: 'DELETE', params: { id, checkId: String(someoneElse.id) } })).status).toBe(404);
  });
});

describe('oil changes and the interval', () => {
  it('an oil change resets the oil age and the next change', async () => {
    await signInAs(DEMO.operator);
    const id = await idOf('Q-TAIMI');
    const before = await call(oil.GET, { params: { id } });
    const hours = before.body.currentHours;
    const r = await call(changes.POST, { method: 'POST', body: { changedAt: '2026-12-01T09:00', engineHours: hours, oilGrade: 'SAE 15W-50', quantity: 7.5, notes: 'Filter cut open: clean.' }, params: { id } });
    expect(r.status).toBe(201);
    expect(r.body.oilLog.changes[0]).toMatchObject({ engineHours: hours, oilGrade: 'SAE 15W-50', quantityL: 7.5 });
    expect(r.body.oilLog.due.dueAtHours).toBeCloseTo(hours + 50, 6);
    expect(r.body.oilLog.due.status).toBe('ok');
    const bad = await call(changes.POST, { method: 'POST', body: { changedAt: '2026-12-01T09:00', engineHours: -1, oilGrade: '' }, params: { id } });
    expect(bad.status).toBe(422);
    expect(bad.body.fields.map((f: { field: string }) => f.field).sort()).toEqual(['engineHours', 'oilGrade']);
    const del = await call(oneChange.DELETE, { method: 'DELETE', params: { id, changeId: String(r.body.id) } });
    expect(del.status).toBe(200);
  });

  it('the interval is set per aircraft by operators and managers (pilots 403), and may be cleared', async () => {
    const id = await idOf('Q-HALLA');
    await signInAs(DEMO.pilot);
    expect((await call(settings.PATCH, { method: 'PATCH', body: { oilChangeIntervalHours: 25 }, params: { id } })).status).toBe(403);
    await signInAs(DEMO.operator);
    const ok = await call(settings.PATCH, { method: 'PATCH', body: { oilChangeIntervalHours: 25, oilChangeIntervalMonths: null }, params: { id } });
    expect(ok.status).toBe(200);
    expect(ok.body.settings).toEqual({ oilChangeIntervalHours: 25, oilChangeIntervalMonths: null });
    const log = await call(oil.GET, { params: { id } });
    expect(log.body.due.by).toBe('hours');
    const bad = await call(settings.PATCH, { method: 'PATCH', body: { oilChangeIntervalMonths: 1.5 }, params: { id } });
    expect(bad.status).toBe(422);
    expect(bad.body.fields[0].field).toBe('oilChangeIntervalMonths');
    const none = await call(settings.PATCH, { method: 'PATCH', body: {}, params: { id } });
    expect(none.status).toBe(422);
  });
});
