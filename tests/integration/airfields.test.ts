import { beforeAll, describe, expect, it } from 'vitest';
import { call, DEMO, freshDatabase, signInAs, signOut } from './helpers';
import { SHELTER_KINDS } from '@/lib/thermal/presets';

let list: typeof import('@/app/api/airfields/route');
let item: typeof import('@/app/api/airfields/[id]/route');
let shelters: typeof import('@/app/api/airfields/[id]/shelters/route');
let shelterItem: typeof import('@/app/api/airfields/[id]/shelters/[shelterId]/route');
let forecast: typeof import('@/app/api/airfields/[id]/forecast/route');
let models: Awaited<ReturnType<typeof freshDatabase>>;

let kettleId: number;
let ridgeId: number;
let ridgeShelterId: number;

beforeAll(async () => {
  models = await freshDatabase();
  list = await import('@/app/api/airfields/route');
  item = await import('@/app/api/airfields/[id]/route');
  shelters = await import('@/app/api/airfields/[id]/shelters/route');
  shelterItem = await import('@/app/api/airfields/[id]/shelters/[shelterId]/route');
  forecast = await import('@/app/api/airfields/[id]/forecast/route');
  kettleId = (await models.Airfield.findOne({ where: { ident: 'XKTL' } }))!.id;
  const ridge = (await models.Airfield.findOne({ where: { ident: 'XRDG' } }))!;
  ridgeId = ridge.id;
  ridgeShelterId = (await models.Shelter.findOne({ where: { airfieldId: ridge.id } }))!.id;
});

const P = (id: number, extra: Record<string, string> = {}) => ({ id: String(id), ...extra });

function newAirfield(over: Record<string, unknown> = {}) {
  return { name: 'Pine Hollow', ident: 'XPNH', latitude: 61.9, longitude: 24.4, elevationM: 102, timeZone: 'Europe/Helsinki', ...over };
}

async function counts() {
  return { airfields: await models.Airfield.count(), shelters: await models.Shelter.count() };
}

function fieldsOf(body: { fields?: { field: string }[] }) {
  return (body.fields ?? []).map((f) => f.field);
}

describe('reading airfields', () => {
  it('signed out is 401', async () => {
    signOut();
    expect((await call(list.GET)).status).toBe(401);
    expect((await call(item.GET, { params: P(kettleId) })).status).toBe(401);
  });

  it.each([DEMO.manager, DEMO.operator, DEMO.pilot])('%s reads the organization’s airfields and shelters, and only those', async (email) => {
    await signInAs(email);
    const r = await call(list.GET);
    expect(r.status).toBe(200);
    const idents = r.body.airfields.map((a: { ident: string }) => a.ident);
    expect(idents).toEqual(expect.arrayContaining(['XKTL', 'XBRM', 'XSTG']));
    expect(idents).not.toContain('XRDG');
    const kettle = r.body.airfields.find((a: { ident: string }) => a.ident === 'XKTL');
    expect(kettle.shelters.map((s: { kind: string }) => s.kind).sort()).toEqual(['heated-hangar', 't-hangar', 'tie-down']);
    expect(kettle.aircraftCount).toBeGreaterThan(0);

    const one = await call(item.GET, { params: P(kettleId) });
    expect(one.status).toBe(200);
    expect(one.body.airfield.timeZone).toBe('Europe/Helsinki');
    expect((await call(shelters.GET, { params: P(kettleId) })).body.shelters).toHaveLength(3);
  });

  it('another organization’s airfield, its shelters and its forecast are 404', async () => {
    await signInAs(DEMO.manager);
    expect((await call(item.GET, { params: P(ridgeId) })).status).toBe(404);
    expect((await call(item.PATCH, { method: 'PATCH', params: P(ridgeId), body: { name: 'Mine now' } })).status).toBe(404);
    expect((await call(item.DELETE, { method: 'DELETE', params: P(ridgeId) })).status).toBe(404);
    expect((await call(shelters.GET, { params: P(ridgeId) })).status).toBe(404);
    expect((await call(shelters.POST, { method: 'POST', params: P(ridgeId), body: { name: 'Sneaky', kind: 't-hangar' } })).status).toBe(404);
    expect((await call(forecast.GET, { params: P(ridgeId) })).status).toBe(404);
    // Their shelter's id under one of our airfields is not found either.
    expect((await call(shelterItem.PATCH, { method: 'PATCH', params: P(kettleId, { shelterId: String(ridgeShelterId) }), body: { name: 'x' } })).status).toBe(404);
    expect((await call(shelterItem.DELETE, { method: 'DELETE', params: P(ridgeId, { shelterId: String(ridgeShelterId) }) })).status).toBe(404);
    expect((await models.Airfield.findByPk(ridgeId))!.name).toBe('Ridgeway Field');
  });

  it('ids that are not ids are 404', async () => {
    await signInAs(DEMO.pilot);
    for (const id of ['abc', '0', '-3', '1.5', '99999999']) {
      expect((await call(item.GET, { params: { id } })).status).toBe(404);
    }
  });
});

describe('editing is for managers', () => {
  it.each([DEMO.pilot, DEMO.operator])('%s may not create, change or remove airfields or shelters (403), and nothing changes', async (email) => {
    await signInAs(email);
    const before = await counts();
    expect((await call(list.POST, { method: 'POST', body: newAirfield({ ident: 'XNOPE' }) })).status).toBe(403);
    expect((await call(item.PATCH, { method: 'PATCH', params: P(kettleId), body: { name: 'Renamed' } })).status).toBe(403);
    expect((await call(item.DELETE, { method: 'DELETE', params: P(kettleId) })).status).toBe(403);
    expect((await call(shelters.POST, { method: 'POST', params: P(kettleId), body: { name: 'New', kind: 't-hangar' } })).status).toBe(403);
    const sid = (await models.Shelter.findOne({ where: { airfieldId: kettleId } }))!.id;
    expect((await call(shelterItem.PATCH, { method: 'PATCH', params: P(kettleId, { shelterId: String(sid) }), body: { name: 'x' } })).status).toBe(403);
    expect((await call(shelterItem.DELETE, { method: 'DELETE', params: P(kettleId, { shelterId: String(sid) }) })).status).toBe(403);
    expect(await counts()).toEqual(before);
    expect((await models.Airfield.findByPk(kettleId))!.name).toBe('Kettle Lake');
  });

  it('a manager creates an airfield with its first shelters; thermal values come from the kind presets', async () => {
    await signInAs(DEMO.manager);
    const r = await call(list.POST, {
      method: 'POST',
      body: newAirfield({
        timeZone: 'europe/helsinki',
        ident: 'xpnh',
        shelters: [
          { name: 'Row B', kind: 't-hangar' },
          { name: 'Warm shed', kind: 'heated-hangar', setpointC: '6', heatingPowerW: '9000' },
          { name: 'Grass line', kind: 'tie-down' },
        ],
      }),
    });
    expect(r.status).toBe(201);
    const a = r.body.airfield;
    expect(a.ident).toBe('XPNH');
    expect(a.timeZone).toBe('Europe/Helsinki');
    const byName = Object.fromEntries(a.shelters.map((s: { name: string }) => [s.name, s]));
    const t = SHELTER_KINDS['t-hangar'].hangar!;
    expect(byName['Row B']).toMatchObject({ heatCapacityJPerK: t.heatCapacityJPerK, lossWPerK: t.lossWPerK, setpointC: null });
    expect(byName['Row B'].timeConstantH).toBeCloseTo(t.heatCapacityJPerK / t.lossWPerK / 3600, 6);
    expect(byName['Warm shed']).toMatchObject({ setpointC: 6, heatingPowerW: 9000, heatCapacityJPerK: SHELTER_KINDS['heated-hangar'].hangar!.heatCapacityJPerK });
    expect(byName['Grass line']).toMatchObject({ heatCapacityJPerK: 0, lossWPerK: 0, timeConstantH: null });
  });
});

describe('bad input is 422 naming the field, and nothing is written', () => {
  const cases: [string, Record<string, unknown>, string][] = [
    ['latitude 91', { latitude: 91 }, 'latitude'],
    ['longitude −181', { longitude: -181 }, 'longitude'],
    ['an unknown time zone', { timeZone: 'Mars/Olympus_Mons' }, 'timeZone'],
    ['a UTC offset instead of a zone', { timeZone: '+02:00' }, 'timeZone'],
    ['an empty name', { name: '   ' }, 'name'],
    ['a 10 kB name', { name: 'x'.repeat(10 * 1024) }, 'name'],
    ['latitude as text', { latitude: 'north' }, 'latitude'],
    ['a negative heat capacity on a shelter', { shelters: [{ name: 'Cold', kind: 'unheated-hangar', heatCapacityJPerK: -5 }] }, 'shelters.0.heatCapacityJPerK'],
    ['a heated hangar with no heating power', { shelters: [{ name: 'Warm', kind: 'heated-hangar', heatingPowerW: 0 }] }, 'shelters.0.heatingPowerW'],
    ['an unknown shelter kind', { shelters: [{ name: 'Igloo', kind: 'igloo' }] }, 'shelters.0.kind'],
  ];
  it.each(cases)('%s', async (_label, over, field) => {
    await signInAs(DEMO.manager);
    const before = await counts();
    const r = await call(list.POST, { method: 'POST', body: newAirfield({ ident: 'XBAD', ...over }) });
    expect(r.status).toBe(422);
    expect(fieldsOf(r.body)).toContain(field);
    expect(r.text).not.toMatch(/Sequelize|SELECT|at .*\.ts/);
    expect(await counts()).toEqual(before);
  });

  it('a negative heat capacity on a new shelter, and on a changed one', async () => {
    await signInAs(DEMO.manager);
    const before = await counts();
    const r = await call(shelters.POST, { method: 'POST', params: P(kettleId), body: { name: 'Cold', kind: 't-hangar', heatCapacityJPerK: -1 } });
    expect(r.status).toBe(422);
    expect(fieldsOf(r.body)).toEqual(['heatCapacityJPerK']);
    const s = (await models.Shelter.findOne({ where: { airfieldId: kettleId, kind: 't-hangar' } }))!;
    const p = await call(shelterItem.PATCH, { method: 'PATCH', params: P(kettleId, { shelterId: String(s.id) }), body: { heatCapacityJPerK: '-2' } });
    expect(p.status).toBe(422);
    expect(fieldsOf(p.body)).toEqual(['heatCapacityJPerK']);
    expect((await models.Shelter.findByPk(s.id))!.heatCapacityJPerK).toBe(s.heatCapacityJPerK);
    expect(await counts()).toEqual(before);
  });

  it('a change with latitude 91 leaves the airfield as it was', async () => {
    await signInAs(DEMO.manager);
    const r = await call(item.PATCH, { method: 'PATCH', params: P(kettleId), body: { latitude: 91, name: 'Moved' } });
    expect(r.status).toBe(422);
    expect(fieldsOf(r.body)).toEqual(['latitude']);
    const a = (await models.Airfield.findByPk(kettleId))!;
    expect([a.name, a.latitude]).toEqual(['Kettle Lake', 61.52]);
  });
});

describe('nothing half-written', () => {
  it('an airfield whose second shelter clashes is not created at all, nor its first shelter (409 naming the field)', async () => {
    await signInAs(DEMO.manager);
    const before = await counts();
    const r = await call(list.POST, {
      method: 'POST',
      body: newAirfield({ ident: 'XHLF', shelters: [{ name: 'Hangar A', kind: 't-hangar' }, { name: 'hangar a', kind: 'unheated-hangar' }] }),
    });
    expect(r.status).toBe(409);
    expect(fieldsOf(r.body)).toEqual(['shelters.1.name']);
    expect(await counts()).toEqual(before);
    expect(await models.Airfield.findOne({ where: { ident: 'XHLF' } })).toBeNull();
  });

  it('an identifier already in use is a conflict on that field', async () => {
    await signInAs(DEMO.manager);
    const r = await call(list.POST, { method: 'POST', body: newAirfield({ ident: 'XKTL' }) });
    expect(r.status).toBe(409);
    expect(fieldsOf(r.body)).toEqual(['ident']);
  });
});

describe('changing and removing', () => {
  it('a manager renames and moves an airfield', async () => {
    await signInAs(DEMO.manager);
    const id = (await models.Airfield.findOne({ where: { ident: 'XPNH' } }))!.id;
    const r = await call(item.PATCH, { method: 'PATCH', params: P(id), body: { name: 'Pine Hollow Field', latitude: '62,05', elevationM: 110 } });
    expect(r.status).toBe(200);
    expect(r.body.airfield).toMatchObject({ name: 'Pine Hollow Field', latitude: 62.05, elevationM: 110 });
  });

  it('changing a shelter’s kind takes the new kind’s preset; the whole shelter is checked again', async () => {
    await signInAs(DEMO.manager);
    const af = (await models.Airfield.findOne({ where: { ident: 'XPNH' } }))!;
    const s = (await models.Shelter.findOne({ where: { airfieldId: af.id, name: 'Grass line' } }))!;
    const params = P(af.id, { shelterId: String(s.id) });
    const r = await call(shelterItem.PATCH, { method: 'PATCH', params, body: { kind: 'heated-hangar' } });
    expect(r.status).toBe(200);
    const preset = SHELTER_KINDS['heated-hangar'].hangar!;
    expect(r.body.shelter).toMatchObject({ kind: 'heated-hangar', setpointC: preset.setpointC, heatingPowerW: preset.heatingPowerW, lossWPerK: preset.lossWPerK });
    const bad = await call(shelterItem.PATCH, { method: 'PATCH', params, body: { heatingPowerW: 0 } });
    expect(bad.status).toBe(422);
    expect(fieldsOf(bad.body)).toEqual(['heatingPowerW']);
    const back = await call(shelterItem.PATCH, { method: 'PATCH', params, body: { kind: 'tie-down' } });
    expect(back.body.shelter).toMatchObject({ kind: 'tie-down', heatCapacityJPerK: 0, setpointC: null, heatingPowerW: null });
  });

  it('a shelter with aircraft is archived, not deleted; an unused one is deleted', async () => {
    await signInAs(DEMO.manager);
    const used = (await models.Shelter.findOne({ where: { airfieldId: kettleId, kind: 't-hangar' } }))!;
    const r = await call(shelterItem.DELETE, { method: 'DELETE', params: P(kettleId, { shelterId: String(used.id) }) });
    expect(r.status).toBe(200);
    expect(r.body.result).toBe('archived');
    expect(r.body.aircraftCount).toBeGreaterThan(0);
    expect((await models.Shelter.findByPk(used.id))!.archivedAt).not.toBeNull();
    const visible = (await call(shelters.GET, { params: P(kettleId) })).body.shelters.map((s: { id: number }) => s.id);
    expect(visible).not.toContain(used.id);
    const all = (await call(shelters.GET, { params: P(kettleId), url: '/api/x?archived=1' })).body.shelters.map((s: { id: number }) => s.id);
    expect(all).toContain(used.id);
    const restored = await call(shelterItem.PATCH, { method: 'PATCH', params: P(kettleId, { shelterId: String(used.id) }), body: { archived: false } });
    expect(restored.body.shelter.archived).toBe(false);

    const fresh = await call(shelters.POST, { method: 'POST', params: P(kettleId), body: { name: 'Spare bay', kind: 't-hangar' } });
    expect(fresh.status).toBe(201);
    const d = await call(shelterItem.DELETE, { method: 'DELETE', params: P(kettleId, { shelterId: String(fresh.body.shelter.id) }) });
    expect(d.body.result).toBe('deleted');
    expect(await models.Shelter.findByPk(fresh.body.shelter.id)).toBeNull();
  });

  it('an airfield whose shelters hold aircraft is archived and can be restored; an unused one is deleted with its shelters', async () => {
    await signInAs(DEMO.manager);
    const r = await call(item.DELETE, { method: 'DELETE', params: P(kettleId) });
    expect(r.body.result).toBe('archived');
    expect((await call(list.GET)).body.airfields.map((a: { id: number }) => a.id)).not.toContain(kettleId);
    expect((await call(list.GET, { url: '/api/airfields?archived=1' })).body.airfields.map((a: { id: number }) => a.id)).toContain(kettleId);
    expect((await call(shelters.POST, { method: 'POST', params: P(kettleId), body: { name: 'Late', kind: 't-hangar' } })).status).toBe(409);
    const back = await call(item.PATCH, { method: 'PATCH', params: P(kettleId), body: { archived: false } });
    expect(back.body.airfield.archived).toBe(false);

    const af = (await models.Airfield.findOne({ where: { ident: 'XPNH' } }))!;
    const d = await call(item.DELETE, { method: 'DELETE', params: P(af.id) });
    expect(d.body.result).toBe('deleted');
    expect(await models.Airfield.findByPk(af.id)).toBeNull();
    expect(await models.Shelter.count({ where: { airfieldId: af.id } })).toBe(0);
    expect((await call(item.GET, { params: P(af.id) })).status).toBe(404);
  });
});
