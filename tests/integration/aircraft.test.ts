import { beforeAll, describe, expect, it } from 'vitest';
import { Op } from 'sequelize';
import { call, DEMO, freshDatabase, signInAs, signOut } from './helpers';

let list: typeof import('@/app/api/aircraft/route');
let one: typeof import('@/app/api/aircraft/[id]/route');
let models: ReturnType<Awaited<typeof import('@/models')>['db']>;
let Heater: typeof import('@/models/Heater').Heater;
let AircraftPilot: typeof import('@/models/AircraftPilot').AircraftPilot;
let Departure: typeof import('@/models/Departure').Departure;

beforeAll(async () => {
  models = await freshDatabase();
  list = await import('@/app/api/aircraft/route');
  one = await import('@/app/api/aircraft/[id]/route');
  Heater = (await import('@/models/Heater')).Heater;
  AircraftPilot = (await import('@/models/AircraftPilot')).AircraftPilot;
  Departure = (await import('@/models/Departure')).Departure;
});

async function idOf(registration: string) {
  const a = await models.Aircraft.findOne({ where: { registration } });
  return String(a!.id);
}
async function userId(email: string) {
  return (await models.User.findOne({ where: { email } }))!.id;
}
async function shelterId(name: string) {
  return (await models.Shelter.findOne({ where: { name } }))!.id;
}

const newAircraft = (extra: Record<string, unknown> = {}) => ({
  registration: 'q-nova',
  typeLabel: 'Two-seat tourer',
  engineClass: 'ac-wetsump-4',
  coverOnByDefault: true,
  heaters: [{ kind: 'oil-pad', powerW: 250, node: 'oil', control: 'relay' }],
  ...extra,
});

describe('reading aircraft', () => {
  it('needs a session', async () => {
    signOut();
    expect((await call(list.GET as never)).status).toBe(401);
  });

  it('every role lists the fleet of its own organization with heaters, pilots, shelter and airfield', async () => {
    await signInAs(DEMO.pilot);
    const r = await call(list.GET as never);
    expect(r.status).toBe(200);
    const regs = r.body.aircraft.map((a: { registration: string }) => a.registration);
    expect(regs).toContain('Q-KAPA');
    expect(regs).not.toContain('Q-RIDGE');
    const kapa = r.body.aircraft.find((a: { registration: string }) => a.registration === 'Q-KAPA');
    expect(kapa.heaters.length).toBeGreaterThan(0);
    expect(kapa.shelter.name).toBe('T-hangar row A');
    expect(kapa.airfield.timeZone).toBe('Europe/Helsinki');
    expect(kapa.pilotIds).toContain(await userId(DEMO.pilot));
    // The ready temperature default comes from the engine class preset.
    expect(kapa.classDefaults.readyC).toBe(20);
  });

  it("another organization's aircraft is 404, and so is a malformed id", async () => {
    await signInAs(DEMO.manager);
    expect((await call(one.GET as never, { params: { id: await idOf('Q-RIDGE') } })).status).toBe(404);
    expect((await call(one.GET as never, { params: { id: 'abc' } })).status).toBe(404);
  });
});

describe('adding aircraft', () => {
  it('pilots may not add or change aircraft (403)', async () => {
    await signInAs(DEMO.pilot);
    expect((await call(list.POST as never, { method: 'POST', body: newAircraft() })).status).toBe(403);
    expect((await call(one.PATCH as never, { method: 'PATCH', params: { id: await idOf('Q-KAPA') }, body: { typeLabel: 'x' } })).status).toBe(403);
    expect((await call(one.DELETE as never, { method: 'DELETE', params: { id: await idOf('Q-KAPA') } })).status).toBe(403);
  });

  it('an operator adds an aircraft with heaters and pilots; thermal parameters and oil come from the class preset', async () => {
    await signInAs(DEMO.operator);
    const pilot = await userId(DEMO.pilot);
    const r = await call(list.POST as never, {
      method: 'POST',
      body: newAircraft({ shelterId: await shelterId('T-hangars'), pilotIds: [pilot, pilot] }),
    });
    expect(r.status).toBe(201);
    const a = r.body.aircraft;
    expect(a.registration).toBe('Q-NOVA');
    expect(a.thermal.source).toBe('preset');
    expect(a.oilQuantityL).toBe(7.5);
    expect(a.heaters).toHaveLength(1);
    expect(a.heaters[0]).toMatchObject({ kind: 'oil-pad', powerW: 250, node: 'oil', control: 'relay', slotMinutes: 5 });
    expect(a.pilotIds).toEqual([pilot]);
    expect(a.airfield.name).toBe('Stonegate Strip');
    expect(a.lastShutdownAt).toBeNull();
    expect(a.classDefaults.shutdownOilC).toBeGreaterThan(50);
  });

  it('bad input is 422 naming each field, and nothing is written', async () => {
    await signInAs(DEMO.operator);
    const before = await models.Aircraft.count();
    const heatersBefore = await Heater.count();
    const r = await call(list.POST as never, {
      method: 'POST',
      body: { registration: 'bad mark!', typeLabel: '', engineClass: 'rotary-9', oilQuantityL: 'lots', heaters: [{ kind: 'oil-pad', powerW: -5, node: 'tail', control: 'timer' }] },
    });
    expect(r.status).toBe(422);
    const fields = r.body.fields.map((f: { field: string }) => f.field);
    expect(fields).toEqual(expect.arrayContaining(['registration', 'typeLabel', 'engineClass', 'oilQuantityL', 'heaters.0.powerW', 'heaters.0.node']));
    expect(await models.Aircraft.count()).toBe(before);
    expect(await Heater.count()).toBe(heatersBefore);
  });

  it("another organization's shelter or pilots are refused (422) and nothing is half-written", async () => {
    await signInAs(DEMO.operator);
    const before = await models.Aircraft.count();
    const otherPilot = await userId('pilot@ridgeway.test');
    const r1 = await call(list.POST as never, { method: 'POST', body: newAircraft({ registration: 'Q-ODD', shelterId: await shelterId('Hangar 1') }) });
    expect(r1.status).toBe(422);
    expect(r1.body.fields[0].field).toBe('shelterId');
    const r2 = await call(list.POST as never, { method: 'POST', body: newAircraft({ registration: 'Q-ODD', pilotIds: [otherPilot] }) });
    expect(r2.status).toBe(422);
    expect(r2.body.fields[0].field).toBe('pilotIds');
    expect(await models.Aircraft.count()).toBe(before);
  });

  it('a registration already in the fleet is a 409', async () => {
    await signInAs(DEMO.operator);
    const r = await call(list.POST as never, { method: 'POST', body: newAircraft({ registration: 'Q-KAPA' }) });
    expect(r.status).toBe(409);
    expect(r.body.message).toMatch(/Q-KAPA/);
  });

  it('a last shutdown in the future is refused; the oil temperature is checked', async () => {
    await signInAs(DEMO.operator);
    const r = await call(list.POST as never, {
      method: 'POST',
      body: newAircraft({ registration: 'Q-LATE', lastShutdownAt: new Date(Date.now() + 3 * 3600_000).toISOString(), lastShutdownOilC: 400 }),
    });
    expect(r.status).toBe(422);
    expect(r.body.fields.map((f: { field: string }) => f.field)).toEqual(expect.arrayContaining(['lastShutdownOilC']));
    const r2 = await call(list.POST as never, { method: 'POST', body: newAircraft({ registration: 'Q-LATE', lastShutdownAt: new Date(Date.now() + 3 * 3600_000).toISOString() }) });
    expect(r2.status).toBe(422);
    expect(r2.body.fields[0].field).toBe('lastShutdownAt');
  });
});

describe('changing aircraft', () => {
  it('PATCH replaces heaters and pilots together', async () => {
    await signInAs(DEMO.operator);
    const id = await idOf('Q-TAIMI');
    const p2 = await userId('pilot2@frostvale.test');
    const r = await call(one.PATCH as never, {
      method: 'PATCH',
      params: { id },
      body: {
        heaters: [
          { kind: 'oil-pad', powerW: 300, node: 'oil', control: 'timer' },
          { kind: 'forced-air-electric', powerW: 1500, node: 'engine', control: 'manual', slotMinutes: 10 },
        ],
        pilotIds: [p2],
      },
    });
    expect(r.status).toBe(200);
    expect(r.body.aircraft.heaters.map((h: { powerW: number }) => h.powerW)).toEqual([300, 1500]);
    expect(r.body.aircraft.heaters[0].slotMinutes).toBe(15);
    expect(r.body.aircraft.heaters[1].slotMinutes).toBe(10);
    expect(r.body.aircraft.pilotIds).toEqual([p2]);
    expect(await AircraftPilot.count({ where: { aircraftId: Number(id) } })).toBe(1);
  });

  it('a failing part leaves the whole change unwritten', async () => {
    await signInAs(DEMO.operator);
    const id = await idOf('Q-TAIMI');
    const heatersBefore = await Heater.count({ where: { aircraftId: Number(id) } });
    const r = await call(one.PATCH as never, {
      method: 'PATCH',
      params: { id },
      body: { typeLabel: 'Renamed', heaters: [], pilotIds: [await userId('pilot@ridgeway.test')] },
    });
    expect(r.status).toBe(422);
    const a = await models.Aircraft.findByPk(Number(id));
    expect(a!.typeLabel).not.toBe('Renamed');
    expect(await Heater.count({ where: { aircraftId: Number(id) } })).toBe(heatersBefore);
  });

  it('thermal parameters: an override is "manual", null resets to the preset, a new engine class brings its own', async () => {
    await signInAs(DEMO.manager);
    const id = await idOf('Q-HALLA');
    const cur = (await call(one.GET as never, { params: { id } })).body.aircraft.thermal;
    const cover = Math.round(cur.coverFactor * 80) / 100; // any value other than the preset's
    const override = { ...cur, coverFactor: cover };
    const r1 = await call(one.PATCH as never, { method: 'PATCH', params: { id }, body: { thermal: override } });
    expect(r1.body.aircraft.thermal.source).toBe('manual');
    expect(r1.body.aircraft.thermal.coverFactor).toBe(cover);
    const r2 = await call(one.PATCH as never, { method: 'PATCH', params: { id }, body: { thermal: null } });
    expect(r2.body.aircraft.thermal).toEqual(cur);
    const r3 = await call(one.PATCH as never, { method: 'PATCH', params: { id }, body: { engineClass: 'ac-wetsump-6' } });
    expect(r3.body.aircraft.thermal.source).toBe('preset');
    expect(r3.body.aircraft.thermal.nodes[0].heatCapacityJPerK).toBeGreaterThan(cur.nodes[0].heatCapacityJPerK);
    const bad = await call(one.PATCH as never, { method: 'PATCH', params: { id }, body: { thermal: { ...cur, coverFactor: 3 } } });
    expect(bad.status).toBe(422);
    expect(bad.body.fields[0].field).toBe('thermal.coverFactor');
  });

  it('unknown fields and empty changes are 422', async () => {
    await signInAs(DEMO.operator);
    const id = await idOf('Q-HALLA');
    expect((await call(one.PATCH as never, { method: 'PATCH', params: { id }, body: {} })).status).toBe(422);
    expect((await call(one.PATCH as never, { method: 'PATCH', params: { id }, body: { organizationId: 2 } })).status).toBe(422);
  });

  it("another organization's aircraft cannot be changed or archived (404)", async () => {
    await signInAs(DEMO.operator);
    const id = await idOf('Q-RIDGE');
    expect((await call(one.PATCH as never, { method: 'PATCH', params: { id }, body: { typeLabel: 'Mine now' } })).status).toBe(404);
    expect((await call(one.DELETE as never, { method: 'DELETE', params: { id } })).status).toBe(404);
    expect((await models.Aircraft.findByPk(Number(id)))!.archivedAt).toBeNull();
  });

  it('DELETE archives the aircraft, cancels its departures to come and hides it from the list', async () => {
    await signInAs(DEMO.operator);
    const id = await idOf('Q-LUMI');
    const upcoming = await Departure.count({ where: { aircraftId: Number(id), cancelledAt: null, departAt: { [Op.gt]: new Date() } } });
    expect(upcoming).toBeGreaterThan(0);
    const r = await call(one.DELETE as never, { method: 'DELETE', params: { id } });
    expect(r.status).toBe(200);
    expect(r.body.archived).toBe(true);
    expect(r.body.cancelledDepartures).toBe(upcoming);
    const regs = (await call(list.GET as never)).body.aircraft.map((a: { registration: string }) => a.registration);
    expect(regs).not.toContain('Q-LUMI');
    const withArchived = (await call(list.GET as never, { url: '/api/aircraft?archived=1' })).body.aircraft;
    expect(withArchived.find((a: { registration: string }) => a.registration === 'Q-LUMI').archived).toBe(true);
    const back = await call(one.PATCH as never, { method: 'PATCH', params: { id }, body: { archived: false } });
    expect(back.body.aircraft.archived).toBe(false);
  });
});
