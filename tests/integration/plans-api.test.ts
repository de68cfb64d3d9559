import fs from 'node:fs';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { call, DEMO, freshDatabase, signInAs, signOut } from './helpers';

let route: typeof import('@/app/api/v1/plans/route');

const valid = JSON.parse(fs.readFileSync(path.resolve('data/examples/plan-least-cost.json'), 'utf8'));

beforeAll(async () => {
  await freshDatabase();
  route = await import('@/app/api/v1/plans/route');
});

describe('POST /api/v1/plans', () => {
  it('answers 401 without a session', async () => {
    signOut();
    expect((await call(route.POST as never, { method: 'POST', body: valid })).status).toBe(401);
  });

  it('answers the heat plan for a signed-in pilot (200, the same JSON as the CLI)', async () => {
    await signInAs(DEMO.pilot);
    const r = await call(route.POST as never, { method: 'POST', body: valid });
    expect(r.status).toBe(200);
    expect(r.body.status).toBe('warming');
    expect(r.body.heaterOn.at(-1).to).toBe('2025-01-16T07:30:00.000Z');
    expect(r.body.oilAtDepartureC).toBeGreaterThanOrEqual(15);
    expect(r.body.baselines.allNight.energyKWh).toBeGreaterThan(r.body.energyKWh);
    expect(typeof r.body.probabilityReady).toBe('number');
  });

  it('answers for an operator too, in single-start mode', async () => {
    await signInAs(DEMO.operator);
    const r = await call(route.POST as never, { method: 'POST', body: { ...valid, plan: { ...valid.plan, mode: 'single-start' } } });
    expect(r.status).toBe(200);
    expect(r.body.heaterOn).toHaveLength(1);
    expect(r.body.latestSwitchOnAt).toBeDefined();
  });

  const bad: [string, unknown, string][] = [
    ['unknown node', { ...valid, plan: { ...valid.plan, heater: { node: 'gearbox', powerW: 200 } } }, 'plan.heater.node'],
    ['departure outside the run', { ...valid, plan: { ...valid.plan, departure: '2025-01-17T07:30:00Z' } }, 'plan.departure'],
    ['no plan', { ...valid, plan: undefined }, 'plan'],
    ['heaters given', { ...valid, heaters: [{ node: 'oil', powerW: 100, from: valid.start, to: valid.end }] }, 'heaters'],
    ['NaN power', { ...valid, plan: { ...valid.plan, heater: { node: 'oil', powerW: 'NaN' } } }, 'plan.heater.powerW'],
  ];
  for (const [name, body, field] of bad) {
    it(`bad input (${name}) is 422 naming ${field}`, async () => {
      await signInAs(DEMO.pilot);
      const r = await call(route.POST as never, { method: 'POST', body });
      expect(r.status).toBe(422);
      expect(r.body.fields.map((f: { field: string }) => f.field)).toContain(field);
      expect(r.text).not.toMatch(/\n\s+at /);
    });
  }
});
