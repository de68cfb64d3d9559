import { beforeAll, describe, expect, it } from 'vitest';
import { call, DEMO, freshDatabase, signInAs, signOut } from './helpers';

let route: typeof import('@/app/api/airfields/[id]/tariff/route');
let data: typeof import('@/lib/data/tariffs');
let models: ReturnType<Awaited<typeof import('@/models')>['db']>;

beforeAll(async () => {
  models = await freshDatabase();
  route = await import('@/app/api/airfields/[id]/tariff/route');
  data = await import('@/lib/data/tariffs');
});

async function airfieldId(name: string) {
  return String((await models.Airfield.findOne({ where: { name } }))!.id);
}

const flat = (price: number) => ({
  currency: 'SEK',
  periods: [{ name: 'Flat', pricePerKWh: price }],
  weekdaySchedule: Array.from({ length: 12 }, () => Array(24).fill(0)),
  weekendSchedule: Array.from({ length: 12 }, () => Array(24).fill(0)),
});

describe('airfield tariffs', () => {
  it('needs a session', async () => {
    signOut();
    expect((await call(route.GET, { params: { id: await airfieldId('Kettle Lake') } })).status).toBe(401);
  });

  it('the demo airfields carry a stored three-period tariff with the evening peak 2–3× the night price (docs/sources.md, from memory)', async () => {
    await signInAs(DEMO.operator);
    const r = await call(route.GET, { params: { id: await airfieldId('Kettle Lake') } });
    expect(r.status).toBe(200);
    const t = r.body.tariff;
    expect(t.source).toBe('stored');
    expect(t.timeZone).toBe('Europe/Helsinki');
    expect(t.periods.map((p: { name: string }) => p.name)).toEqual(['Night', 'Day', 'Evening peak']);
    const ratio = t.periods[2].pricePerKWh / t.periods[0].pricePerKWh;
    expect(ratio).toBeGreaterThanOrEqual(2);
    expect(ratio).toBeLessThanOrEqual(3);
    expect(t.weekdaySchedule).toHaveLength(12);
    expect(t.weekdaySchedule[0]).toHaveLength(24);
  });

  it('an airfield with no tariff answers the flat default, marked "default"', async () => {
    const org = (await models.Organization.findOne({ where: { name: 'Frostvale Flying Club' } }))!;
    const af = await models.Airfield.create({ organizationId: org.id, name: 'Test Meadow', ident: 'XTMD', latitude: 61, longitude: 24, elevationM: 100, timeZone: 'Europe/Helsinki' });
    await signInAs(DEMO.pilot);
    const r = await call(route.GET, { params: { id: String(af.id) } });
    expect(r.status).toBe(200);
    expect(r.body.tariff.source).toBe('default');
    expect(r.body.tariff.periods).toEqual([{ name: 'Flat (default)', pricePerKWh: 0.2 }]);
    expect(r.body.tariff.currency).toBe('EUR');
  });

  it('only roles with airfields:edit store a tariff (an operator is 403)', async () => {
    await signInAs(DEMO.operator);
    const r = await call(route.PUT, { method: 'PUT', params: { id: await airfieldId('Birchmoor') }, body: flat(0.5) });
    expect(r.status).toBe(403);
  });

  it('a manager replaces the tariff; getTariff and tariffPeriodsBetween then use it', async () => {
    await signInAs(DEMO.manager);
    const id = await airfieldId('Birchmoor');
    const r = await call(route.PUT, { method: 'PUT', params: { id }, body: flat(1.25) });
    expect(r.status).toBe(200);
    expect(r.body.tariff).toMatchObject({ source: 'stored', currency: 'SEK', periods: [{ name: 'Flat', pricePerKWh: 1.25 }] });
    const org = (await models.Organization.findOne({ where: { name: 'Frostvale Flying Club' } }))!;
    const t = await data.getTariff({ orgId: org.id, airfieldId: Number(id) });
    const from = Date.parse('2027-01-10T12:00:00Z');
    expect(data.tariffPeriodsBetween({ tariff: t, timeZone: t.timeZone, fromMs: from, toMs: from + 12 * 3600_000 })).toEqual([
      { fromMs: from, toMs: from + 12 * 3600_000, pricePerKWh: 1.25, period: 'Flat' },
    ]);
  });

  it('bad input is 422 naming the field, and the stored tariff stays', async () => {
    await signInAs(DEMO.manager);
    const id = await airfieldId('Kettle Lake');
    const before = (await call(route.GET, { params: { id } })).body.tariff;
    const bad = await call(route.PUT, {
      method: 'PUT',
      params: { id },
      body: { ...flat(-1), currency: '€', weekendSchedule: [[0]] },
    });
    expect(bad.status).toBe(422);
    const fields = bad.body.fields.map((f: { field: string }) => f.field);
    expect(fields).toEqual(expect.arrayContaining(['currency', 'periods.0.pricePerKWh', 'weekendSchedule']));
    expect((await call(route.GET, { params: { id } })).body.tariff).toEqual(before);
  });

  it("another organization's airfield is 404", async () => {
    await signInAs(DEMO.manager);
    const id = await airfieldId('Ridgeway Field');
    expect((await call(route.GET, { params: { id } })).status).toBe(404);
    expect((await call(route.PUT, { method: 'PUT', params: { id }, body: flat(0.3) })).status).toBe(404);
  });
});
