import { beforeAll, describe, expect, it } from 'vitest';
import { call, DEMO, freshDatabase, signInAs } from './helpers';

// npm run db:seed -- --fleet N: invented aircraft with heaters and tomorrow morning's departures, over the
// organization's airfields and shelters; a second run continues the numbering; the board reads them.

let models: Awaited<ReturnType<typeof freshDatabase>>;
beforeAll(async () => {
  models = await freshDatabase();
});

describe('fleet seed', () => {
  it('adds N aircraft with heaters, a pilot and a departure tomorrow morning each, across airfields and shelters', async () => {
    const { seedFleet } = await import('@/lib/seed/fleet');
    const { localDateOf, addDays, localHourOf } = await import('@/lib/time');
    const manager = await models.User.findOne({ where: { email: DEMO.manager } });
    const orgId = manager!.organizationId;
    const demoAircraft = await models.Aircraft.count({ where: { organizationId: orgId } });
    const now = new Date();
    const f = await seedFleet({ count: 30, now });
    expect(f).toMatchObject({ organizationId: orgId, added: 30, first: 'Q-F0001', last: 'Q-F0030', departures: 30 });

    const fleet = await models.Aircraft.findAll({
      where: { organizationId: orgId },
      include: [{ model: models.Shelter, as: 'shelter', include: [{ model: models.Airfield, as: 'airfield' }] }, { model: models.Heater, as: 'heaters' }],
    });
    const added = fleet.filter((a) => a.registration.startsWith('Q-F'));
    expect(fleet.length).toBe(demoAircraft + 30);
    expect(added.every((a) => /^Q-F\d{4}$/.test(a.registration))).toBe(true);
    const airfields = await models.Airfield.count({ where: { organizationId: orgId, archivedAt: null } });
    const shelterIds = new Set(added.map((a) => a.shelterId));
    expect(new Set(added.map((a) => (a as any).shelter.airfieldId)).size).toBe(airfields);
    expect(shelterIds.size).toBe(await models.Shelter.count({ where: { organizationId: orgId, archivedAt: null } }));
    expect(new Set(added.map((a) => (a as any).shelter.kind)).size).toBeGreaterThanOrEqual(3);
    expect(new Set(added.map((a) => a.engineClass)).size).toBe(3);
    for (const a of added) {
      expect((a as any).heaters.length).toBeGreaterThan(0);
      expect(a.lastShutdownAt!.getTime()).toBeLessThan(now.getTime());
      const deps = await models.Departure.findAll({ where: { aircraftId: a.id } });
      expect(deps).toHaveLength(1);
      const zone = (a as any).shelter.airfield.timeZone as string;
      const tomorrow = addDays(localDateOf(zone, now.getTime()), 1);
      expect(localDateOf(zone, deps[0].departAt.getTime())).toEqual(tomorrow);
      const hour = localHourOf(zone, deps[0].departAt.getTime());
      expect(hour).toBeGreaterThanOrEqual(6);
      expect(hour).toBeLessThan(10);
      expect(await models.AircraftPilot.count({ where: { aircraftId: a.id, userId: deps[0].pilotId } })).toBe(1);
    }
  });

  it('a second run continues the scheme, and the Morning board plans every departure', async () => {
    const { seedFleet } = await import('@/lib/seed/fleet');
    const f = await seedFleet({ count: 5 });
    expect(f).toMatchObject({ first: 'Q-F0031', last: 'Q-F0035' });
    await expect(seedFleet({ count: 0 })).rejects.toThrow(/fleet size/);
    await signInAs(DEMO.operator);
    const board = await import('@/app/api/board/route');
    const r = await call(board.GET);
    expect(r.status).toBe(200);
    const regs = (r.body.plans as { aircraft: { registration: string } }[]).map((p) => p.aircraft.registration).filter((x) => x.startsWith('Q-F'));
    expect(regs).toHaveLength(35);
    // One stored heat plan per fleet departure.
    const fleetDeps = await models.Departure.findAll({ include: [{ model: models.Aircraft, as: 'aircraft', where: { registration: regs } }] });
    const plans = await models.HeatPlan.count({ where: { departureId: fleetDeps.map((d) => d.id) } });
    expect(plans).toBe(35);
  });
});
