// Writes under concurrency: simultaneous requests wait for the write lock instead of failing. Every
// request below is started at once (Promise.all); the answers are counted and the rows checked.
import { beforeAll, describe, expect, it } from 'vitest';
import { call, DEMO, freshDatabase, signInAs } from './helpers';

let models: ReturnType<Awaited<typeof import('@/models')>['db']>;
let departures: typeof import('@/app/api/departures/route');
let departure: typeof import('@/app/api/departures/[id]/route');
let users: typeof import('@/app/api/users/route');
let alertPrefs: typeof import('@/app/api/me/preferences/route');
let board: typeof import('@/app/api/board/route');
let jobs: typeof import('@/lib/jobs/definitions');

const HOUR = 3_600_000;
const DAY = 24 * HOUR;
const ZONE = 'Europe/Helsinki';

beforeAll(async () => {
  models = await freshDatabase();
  departures = await import('@/app/api/departures/route');
  departure = await import('@/app/api/departures/[id]/route');
  users = await import('@/app/api/users/route');
  alertPrefs = await import('@/app/api/me/preferences/route');
  board = await import('@/app/api/board/route');
  jobs = await import('@/lib/jobs/definitions');
});

/** A local date `days` ahead in the airfield's zone, read with Intl alone. */
function localDay(days: number) {
  const parts = new Intl.DateTimeFormat('en-CA', { timeZone: ZONE, year: 'numeric', month: '2-digit', day: '2-digit' }).formatToParts(Date.now() + days * DAY);
  const get = (t: string) => parts.find((p) => p.type === t)!.value;
  return `${get('year')}-${get('month')}-${get('day')}`;
}

async function aircraftId(registration: string) {
  return (await models.Aircraft.findOne({ where: { registration } }))!.id;
}

/** How many answers had each status, e.g. { 201: 50 }. */
function tally(statuses: number[]) {
  const out: Record<number, number> = {};
  for (const s of statuses) out[s] = (out[s] ?? 0) + 1;
  return out;
}

describe('simultaneous writes', () => {
  it('50 bookings of one aircraft on 50 different days: 50 × 201, 50 rows', async () => {
    await signInAs(DEMO.operator);
    const id = await aircraftId('Q-KAPA');
    const before = await models.Departure.count({ where: { aircraftId: id } });
    // Days 8 … 57: beyond the seeded week and within the 60 days one may book ahead.
    const res = await Promise.all(Array.from({ length: 50 }, (_, i) => call(departures.POST, { method: 'POST', body: { aircraftId: id, departAt: `${localDay(8 + i)}T07:30` } })));
    expect(tally(res.map((r) => r.status))).toEqual({ 201: 50 });
    expect(await models.Departure.count({ where: { aircraftId: id } })).toBe(before + 50);
  });

  it('50 bookings of one aircraft on the same day: 1 × 201 and 49 × 409 (the clash is the user’s), one row', async () => {
    await signInAs(DEMO.operator);
    const id = await aircraftId('Q-LUMI');
    const before = await models.Departure.count({ where: { aircraftId: id } });
    const day = localDay(20);
    const res = await Promise.all(
      Array.from({ length: 50 }, (_, i) => call(departures.POST, { method: 'POST', body: { aircraftId: id, departAt: `${day}T${String(6 + (i % 10)).padStart(2, '0')}:${String(i % 60).padStart(2, '0')}` } })),
    );
    expect(tally(res.map((r) => r.status))).toEqual({ 201: 1, 409: 49 });
    expect(await models.Departure.count({ where: { aircraftId: id } })).toBe(before + 1);
  });

  it('50 changes of one departure: 50 × 200 and the last write wins', async () => {
    await signInAs(DEMO.operator);
    const id = await aircraftId('Q-SIPI');
    const made = await call(departures.POST, { method: 'POST', body: { aircraftId: id, departAt: `${localDay(25)}T08:00` } });
    expect(made.status).toBe(201);
    const depId = String(made.body.departure.id);
    const finished: string[] = [];
    const res = await Promise.all(
      Array.from({ length: 50 }, async (_, i) => {
        const r = await call(departure.PATCH, { method: 'PATCH', params: { id: depId }, body: { notes: `change ${i}` } });
        if (r.status === 200) finished.push(r.body.departure.notes);
        return r;
      }),
    );
    expect(tally(res.map((r) => r.status))).toEqual({ 200: 50 });
    const row = await models.Departure.findByPk(Number(depId));
    expect(row!.notes).toBe(finished[finished.length - 1]);
    expect(new Set(finished).size).toBe(50);
  });

  it('50 invitations of one address: 1 × 201 and 49 × 409, one user and one invitation e-mail', async () => {
    await signInAs(DEMO.manager);
    const email = 'new.member@frostvale.test';
    const res = await Promise.all(Array.from({ length: 50 }, () => call(users.POST, { method: 'POST', body: { name: 'New Member', email, role: 'pilot' } })));
    expect(tally(res.map((r) => r.status))).toEqual({ 201: 1, 409: 49 });
    const u = await models.User.findAll({ where: { email } });
    expect(u).toHaveLength(1);
    expect(await models.OutboxMessage.count({ where: { userId: u[0].id, kind: 'invite' } })).toBe(1);
    expect(await models.Token.count({ where: { userId: u[0].id, purpose: 'invite' } })).toBe(1);
  });

  it('20 first saves of alert preferences: 20 × 200, one row', async () => {
    const me = await signInAs('pilot2@frostvale.test');
    await models.AlertPreference.destroy({ where: { userId: me.id } });
    const res = await Promise.all(
      Array.from({ length: 20 }, (_, i) => call(alertPrefs.PUT, { method: 'PUT', body: { reminderLeadMinutes: 30 + i, quietStart: '22:00', quietEnd: '06:00' } })),
    );
    expect(tally(res.map((r) => r.status))).toEqual({ 200: 20 });
    expect(await models.AlertPreference.count({ where: { userId: me.id } })).toBe(1);
  });

  it('board reads during the plan job and bookings: no 500, one stored plan per departure', async () => {
    await models.HeatPlan.destroy({ where: {} });
    await signInAs(DEMO.operator);
    const job = jobs.JOBS.find((j) => j.name === 'plan-recompute')!;
    const id = await aircraftId('Q-TAIMI');
    const before = await models.Departure.count({ where: { aircraftId: id } });
    const [reads, runs, bookings] = await Promise.all([
      Promise.all(Array.from({ length: 20 }, () => call(board.GET))),
      Promise.all(Array.from({ length: 3 }, () => job.run({ now: new Date(), holder: 'test' }))),
      Promise.all(Array.from({ length: 10 }, (_, i) => call(departures.POST, { method: 'POST', body: { aircraftId: id, departAt: `${localDay(30 + i)}T07:00` } }))),
    ]);
    expect(tally(reads.map((r) => r.status))).toEqual({ 200: 20 });
    expect(tally(bookings.map((r) => r.status))).toEqual({ 201: 10 });
    expect(runs.every((r) => (r as { skipped: number }).skipped === 0)).toBe(true);
    expect(await models.Departure.count({ where: { aircraftId: id } })).toBe(before + 10);
    const plans = await models.HeatPlan.findAll({ attributes: ['departureId'] });
    expect(plans.length).toBeGreaterThan(0);
    expect(new Set(plans.map((p) => p.departureId)).size).toBe(plans.length);
    // Every departure the board shows has exactly one stored plan.
    const shown = reads[0].body.plans.filter((p: { problem?: string }) => !p.problem).map((p: { departureId: number }) => p.departureId);
    for (const d of shown) expect(plans.filter((p) => p.departureId === d)).toHaveLength(1);
  });
});
