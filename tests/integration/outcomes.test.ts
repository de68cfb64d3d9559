import { beforeAll, describe, expect, it } from 'vitest';
import { call, DEMO, freshDatabase, signInAs, signOut } from './helpers';

let route: typeof import('@/app/api/departures/[id]/outcome/route');
let data: typeof import('@/lib/data/outcomes');
let models: ReturnType<Awaited<typeof import('@/models')>['db']>;

const HOUR = 3_600_000;

beforeAll(async () => {
  models = await freshDatabase();
  route = await import('@/app/api/departures/[id]/outcome/route');
  data = await import('@/lib/data/outcomes');
});

async function idOf(email: string) {
  return (await models.User.findOne({ where: { email } }))!;
}

/** A departure of the pilot's that left `hoursAgo` hours ago, with a stored plan to snapshot. */
async function pastDeparture(pilotEmail: string, registration: string, hoursAgo: number, plan = true) {
  const pilot = await idOf(pilotEmail);
  const ac = (await models.Aircraft.findOne({ where: { registration } }))!;
  const d = await models.Departure.create({
    organizationId: ac.organizationId,
    aircraftId: ac.id,
    pilotId: pilot.id,
    bookedById: pilot.id,
    departAt: new Date(Date.now() - hoursAgo * HOUR),
    readyC: 15,
  });
  if (plan) {
    await models.HeatPlan.create({
      organizationId: ac.organizationId,
      departureId: d.id,
      inputsKey: 'test',
      computedAt: new Date(Date.now() - (hoursAgo + 10) * HOUR),
      status: 'warming',
      oilAtDepartureC: 17.5,
      energyKWh: 2.4,
      probabilityReady: 0.92,
      result: { status: 'warming', freeOilC: 3, result: { baselines: { allNight: { energyKWh: 5.1 }, hoursBefore: [] } } },
    });
  }
  return d;
}

const put = (id: number, body: unknown) => call(route.PUT as never, { method: 'PUT', params: { id: String(id) }, body });

describe('Morning outcomes', () => {
  it('needs a session', async () => {
    signOut();
    expect((await put(1, { flown: true, oilAtStart: 10 })).status).toBe(401);
  });

  it('a pilot records their own morning in their unit; the plan’s prediction is kept beside it', async () => {
    const d = await pastDeparture(DEMO.pilot, 'Q-TAIMI', 30);
    const me = await signInAs(DEMO.pilot);
    const r = await put(d.id, { flown: true, oilAtStart: 59, unit: 'F' });
    expect(r.status).toBe(200);
    expect(r.body.outcome.oilAtStartC).toBeCloseTo(15, 5); // 59 °F = 15 °C (definition of the scales)
    expect(r.body.outcome.recordedBy).toEqual({ id: me.id, name: me.name });
    expect(r.body.outcome.predictedOilC).toBe(17.5);
    expect(r.body.outcome.probabilityReady).toBe(0.92);
    expect(r.body.outcome.usualEnergyKWh).toBe(5.1);
    expect(r.body.outcome.energyKWh).toBe(2.4);

    // Recording again changes it (one row per departure); the snapshot stays even if the plan changes.
    await models.HeatPlan.update({ oilAtDepartureC: 30 }, { where: { departureId: d.id } });
    const again = await put(d.id, { flown: false });
    expect(again.status).toBe(200);
    expect(again.body.outcome.flown).toBe(false);
    expect(again.body.outcome.oilAtStartC).toBeNull();
    expect(again.body.outcome.predictedOilC).toBe(17.5);
    expect(await models.DepartureOutcome.count({ where: { departureId: d.id } })).toBe(1);

    // Undo.
    const del = await call(route.DELETE as never, { method: 'DELETE', params: { id: String(d.id) } });
    expect(del.status).toBe(200);
    expect(await models.DepartureOutcome.count({ where: { departureId: d.id } })).toBe(0);
  });

  it('422 names the field: a flown morning needs a temperature in range; notes refuse control characters', async () => {
    const d = await pastDeparture(DEMO.pilot, 'Q-KUURA', 20);
    await signInAs(DEMO.pilot);
    const missing = await put(d.id, { flown: true });
    expect(missing.status).toBe(422);
    expect(missing.body.fields.map((f: { field: string }) => f.field)).toContain('oilAtStart');
    const hot = await put(d.id, { flown: true, oilAtStart: 400 });
    expect(hot.status).toBe(422);
    expect(hot.body.fields[0].field).toBe('oilAtStart');
    const text = await put(d.id, { flown: true, oilAtStart: 'warm' });
    expect(text.status).toBe(422);
    expect(text.body.fields[0].field).toBe('oilAtStart');
    const ctl = await put(d.id, { flown: false, notes: 'a\u0000b' });
    expect(ctl.status).toBe(422);
    expect(ctl.body.fields[0].field).toBe('notes');
    const noFlown = await put(d.id, { oilAtStart: 12 });
    expect(noFlown.status).toBe(422);
    expect(noFlown.body.fields[0].field).toBe('flown');
    expect(await models.DepartureOutcome.count({ where: { departureId: d.id } })).toBe(0);
  });

  it('another pilot’s departure and another organization’s are not found; an operator records any in the organization', async () => {
    const d = await pastDeparture(DEMO.pilot, 'Q-ROUTA', 10);
    await signInAs('pilot2@frostvale.test');
    expect((await put(d.id, { flown: true, oilAtStart: 12 })).status).toBe(404);
    await signInAs(DEMO.otherManager);
    expect((await put(d.id, { flown: true, oilAtStart: 12 })).status).toBe(404);
    expect((await call(route.DELETE as never, { method: 'DELETE', params: { id: String(d.id) } })).status).toBe(404);
    const op = await signInAs(DEMO.operator);
    const r = await put(d.id, { flown: true, oilAtStart: 12 });
    expect(r.status).toBe(200);
    expect(r.body.outcome.recordedBy.id).toBe(op.id);
  });

  it('a departure still far ahead or cancelled has no morning to record (409)', async () => {
    const ahead = await pastDeparture(DEMO.pilot, 'Q-HALLA', -30, false);
    await signInAs(DEMO.pilot);
    expect((await put(ahead.id, { flown: true, oilAtStart: 12 })).status).toBe(409);
    const gone = await pastDeparture(DEMO.pilot, 'Q-LUMI', 5, false);
    await gone.update({ cancelledAt: new Date() });
    expect((await put(gone.id, { flown: true, oilAtStart: 12 })).status).toBe(409);
  });

  it('the entries list the last 36 hours with the prediction as prefill; the statistics start from the class prior', async () => {
    const d = await pastDeparture(DEMO.pilot, 'Q-SIPI', 3);
    const me = await idOf(DEMO.pilot);
    const entries = await data.outcomeEntries({ orgId: me.organizationId, pilotId: me.id });
    const e = entries.find((x) => x.departureId === d.id)!;
    expect(e.predictedOilC).toBe(17.5);
    expect(e.outcome).toBeNull();
    expect(entries.every((x) => Date.parse(x.departAt) > Date.now() - 36 * HOUR)).toBe(true);

    const ac = (await models.Aircraft.findOne({ where: { registration: 'Q-SIPI' } }))!;
    const before = (await data.outcomeStatsByAircraft({ orgId: me.organizationId, aircraftIds: [ac.id] })).get(ac.id)!;
    await signInAs(DEMO.pilot);
    await put(d.id, { flown: true, oilAtStart: 0 });
    const after = (await data.outcomeStatsByAircraft({ orgId: me.organizationId, aircraftIds: [ac.id] })).get(ac.id)!;
    expect(after.n).toBe(before.n + 1);
    expect(after.biasK).toBeLessThan(before.biasK); // recorded 17.5 K below the prediction
  });
});

describe('the demo season', () => {
  it('has weeks of recorded mornings per aircraft (some not flown) and a last morning to record', async () => {
    const org = (await models.Organization.findOne({ where: { name: 'Frostvale Flying Club' } }))!;
    const rows = await models.DepartureOutcome.findAll({ where: { organizationId: org.id } });
    expect(rows.length).toBeGreaterThan(100);
    expect(rows.some((o) => !o.flown)).toBe(true);
    for (const o of rows.slice(0, 20)) {
      const d = (await models.Departure.findByPk(o.departureId))!;
      expect(d.aircraftId).toBe(o.aircraftId);
      expect(d.departAt.getTime()).toBeLessThan(Date.now());
    }
    const pilot = await idOf(DEMO.pilot);
    const entries = await data.outcomeEntries({ orgId: org.id, pilotId: pilot.id });
    expect(entries.some((e) => e.aircraft.registration === 'Q-TAIMI' && e.outcome === null && e.predictedOilC !== null)).toBe(true);
    const report = await data.seasonReport({ orgId: org.id, fromMs: Date.now() - 60 * 24 * HOUR, toMs: Date.now() + HOUR });
    expect(report.aircraft.length).toBeGreaterThanOrEqual(6);
    expect(report.organization.points.length).toBeGreaterThan(80);
    expect(report.organization.reliability.reduce((a, r) => a + r.n, 0)).toBeGreaterThan(50);
  });
});
