import { beforeAll, describe, expect, it } from 'vitest';
import { call, DEMO, freshDatabase, signInAs, signOut } from './helpers';

let route: typeof import('@/app/api/v1/simulations/route');

const valid = {
  start: '2026-12-01T15:00:00Z',
  end: '2026-12-02T06:00:00Z',
  outputEveryMinutes: 60,
  outside: [
    { at: '2026-12-01T15:00:00Z', tempC: -2 },
    { at: '2026-12-02T06:00:00Z', tempC: -12 },
  ],
  shelter: { kind: 'hangar', heatCapacityJPerK: 2.5e6, lossWPerK: 350 },
  engine: { nodes: [{ name: 'oil', heatCapacityJPerK: 90000, lossWPerK: 20, initialTempC: 80 }] },
};

beforeAll(async () => {
  await freshDatabase();
  route = await import('@/app/api/v1/simulations/route');
});

describe('POST /api/v1/simulations', () => {
  it('answers 401 without a session', async () => {
    signOut();
    expect((await call(route.POST, { method: 'POST', body: valid })).status).toBe(401);
  });

  it('answers the series for a signed-in pilot, both ends included', async () => {
    await signInAs(DEMO.pilot);
    const r = await call(route.POST, { method: 'POST', body: valid });
    expect(r.status).toBe(200);
    expect(r.body.series).toHaveLength(16);
    expect(r.body.series[0].at).toBe('2026-12-01T15:00:00.000Z');
    expect(r.body.series[0].oilC).toBeCloseTo(80, 6);
    expect(r.body.series.at(-1).at).toBe('2026-12-02T06:00:00.000Z');
    expect(r.body.series[0].engineC).toBeNull();
    expect(r.body.energyWh).toBe(0);
  });

  const bad: [string, unknown, string][] = [
    ['missing nodes', { ...valid, engine: {} }, 'engine.nodes'],
    ['end before start', { ...valid, end: '2026-12-01T14:00:00Z' }, 'end'],
    ['NaN as a string', { ...valid, outputEveryMinutes: 'NaN' }, 'outputEveryMinutes'],
    ['unknown node', { ...valid, engine: { nodes: [{ name: 'gearbox', heatCapacityJPerK: 1, lossWPerK: 1, initialTempC: 1 }] } }, 'engine.nodes.0.name'],
    [
      '10⁶ outside points',
      { ...valid, outside: Array.from({ length: 1_000_000 }, (_, i) => ({ at: new Date(Date.parse(valid.start) + i * 1000).toISOString(), tempC: 0 })) },
      'outside',
    ],
  ];
  for (const [name, body, field] of bad) {
    it(`bad input (${name}) is 422 naming ${field}`, async () => {
      await signInAs(DEMO.pilot);
      const r = await call(route.POST, { method: 'POST', body });
      expect(r.status).toBe(422);
      expect(r.body.fields.map((f: { field: string }) => f.field)).toContain(field);
      expect(r.text).not.toMatch(/\n\s+at /);
    });
  }
});
