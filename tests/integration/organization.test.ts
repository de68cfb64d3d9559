import { beforeAll, describe, expect, it } from 'vitest';
import { call, DEMO, freshDatabase, signInAs, signOut } from './helpers';

let route: typeof import('@/app/api/organization/route');

beforeAll(async () => {
  await freshDatabase();
  route = await import('@/app/api/organization/route');
}, 120_000);

describe('the organization’s planning settings', () => {
  it('need a session; members read them, only managers change them', async () => {
    signOut();
    expect((await call(route.GET)).status).toBe(401);
    await signInAs(DEMO.pilot);
    const r = await call(route.GET);
    expect(r.status).toBe(200);
    expect(r.body.planning).toEqual({ targetChance: 0.9, holdMinutes: 30 });
    expect((await call(route.PATCH, { method: 'PATCH', body: { targetChance: 0.8 } })).status).toBe(403);
    await signInAs(DEMO.operator);
    expect((await call(route.PATCH, { method: 'PATCH', body: { targetChance: 0.8 } })).status).toBe(403);
  });

  it('refuse a chance outside 50–99 % and a start window outside 0–120 min, naming the field', async () => {
    await signInAs(DEMO.manager);
    const low = await call(route.PATCH, { method: 'PATCH', body: { targetChance: 0.3 } });
    expect(low.status).toBe(422);
    expect(low.body.fields[0].field).toBe('targetChance');
    const long = await call(route.PATCH, { method: 'PATCH', body: { holdMinutes: 150 } });
    expect(long.status).toBe(422);
    expect(long.body.fields[0].field).toBe('holdMinutes');
  });

  it('a higher aim makes the heat plans aim higher', async () => {
    const me = await signInAs(DEMO.manager);
    const { morningBoard } = await import('@/lib/data/plans');
    expect((await call(route.PATCH, { method: 'PATCH', body: { targetChance: 0.6 } })).status).toBe(200);
    // The first read fetches the forecasts (the local fake).
    const at60 = await morningBoard({ orgId: me.organizationId, refresh: 'if-old' });
    expect((await call(route.PATCH, { method: 'PATCH', body: { targetChance: 0.97 } })).status).toBe(200);
    const at97 = await morningBoard({ orgId: me.organizationId, refresh: 'never' });
    let compared = 0;
    for (const p of at97.plans.filter((x) => x.status === 'warming')) {
      const q = at60.plans.find((x) => x.departureId === p.departureId);
      if (q?.status !== 'warming') continue;
      expect(p.chance!.target).toBeCloseTo(0.97, 9);
      expect(p.energyKWh).toBeGreaterThanOrEqual(q.energyKWh - 1e-9);
      compared++;
    }
    expect(compared).toBeGreaterThan(0);
  });

  it('30 simultaneous changes: no 5xx, one row, the settings one of the values sent', async () => {
    await signInAs(DEMO.manager);
    const sent = Array.from({ length: 30 }, (_, i) => 0.6 + i / 100);
    const res = await Promise.all(sent.map((v) => call(route.PATCH, { method: 'PATCH', body: { targetChance: v } })));
    expect(res.map((r) => r.status).every((s) => s === 200)).toBe(true);
    const now = (await call(route.GET)).body.planning.targetChance;
    expect(sent.some((v) => Math.abs(v - now) < 1e-9)).toBe(true);
  });
});
