// A fleet-size seed for load tests and the benchmarks (npm run db:seed -- --fleet N): N invented
// aircraft added to one organization, spread over its airfields and shelters, each with the heaters of
// its engine class, a pilot, a last shutdown this afternoon or yesterday's and a departure tomorrow
// morning (local time of its airfield). Never part of the demo. Registrations follow an invented
// scheme no registry issues: "Q-F" and a four-digit serial (Q-F0001 …), continued on a second run.
// Every number here is invented; the thermal values are the class presets (lib/thermal/presets.ts).
import { Op } from 'sequelize';
import { db } from '@/models';
import { writeTransaction } from '@/models/transaction';
import { ENGINE_CLASSES, ENGINE_CLASS_IDS, type EngineClassId } from '@/lib/thermal/presets';
import { DEFAULT_SLOT_MINUTES, type HeaterControl } from '@/lib/validation/aircraft';
import { addDays, localDateOf, zonedTimeToUtc } from '@/lib/time';
import { aircraftDefaultsFor } from '@/lib/defaults';

export const FLEET_PREFIX = 'Q-F';
export const FLEET_MAX = 9999;
const TYPES: Record<EngineClassId, string[]> = {
  'lc-drysump-4': ['Two-seat high-wing trainer', 'Two-seat low-wing tourer'],
  'ac-wetsump-4': ['Four-seat high-wing', 'Four-seat low-wing'],
  'ac-wetsump-6': ['Six-seat low-wing', 'Four-seat high-wing, long range'],
};
const CONTROLS: HeaterControl[] = ['relay', 'timer', 'relay', 'manual'];
const CHUNK = 500;

export interface FleetSummary {
  organizationId: number;
  added: number;
  first: string | null;
  last: string | null;
  airfields: number;
  shelters: number;
  departures: number;
}

const serialOf = (reg: string) => Number(reg.slice(FLEET_PREFIX.length));
export const fleetRegistration = (n: number) => `${FLEET_PREFIX}${String(n).padStart(4, '0')}`;

/**
 * Adds `count` aircraft to the organization `orgId` (default: the first organization), in one write
 * transaction. The organization needs at least one shelter that is not archived and one active user.
 */
export async function seedFleet({ count, orgId, now = new Date() }: { count: number; orgId?: number; now?: Date }): Promise<FleetSummary> {
  if (!Number.isInteger(count) || count < 1 || count > FLEET_MAX) throw new Error(`fleet size must be a whole number from 1 to ${FLEET_MAX}`);
  const { Organization, User, Airfield, Shelter, Aircraft, Heater, AircraftPilot, Departure } = db();
  return writeTransaction(async (transaction) => {
    const org = orgId ? await Organization.findByPk(orgId, { transaction }) : await Organization.findOne({ order: [['id', 'ASC']], transaction });
    if (!org) throw new Error(orgId ? `no organization ${orgId}` : 'no organization yet: seed the demo first');
    const airfields = await Airfield.findAll({ where: { organizationId: org.id, archivedAt: null }, order: [['id', 'ASC']], transaction });
    const zoneOf = new Map(airfields.map((a) => [a.id, a.timeZone]));
    const shelters = (
      await Shelter.findAll({ where: { organizationId: org.id, archivedAt: null }, order: [['id', 'ASC']], transaction })
    ).filter((s) => zoneOf.has(s.airfieldId));
    if (!shelters.length) throw new Error(`organization ${org.id} has no shelter to put a fleet in`);
    const users = await User.findAll({ where: { organizationId: org.id, active: true }, order: [['id', 'ASC']], transaction });
    const pilots = users.filter((u) => u.role === 'pilot');
    const bookers = users.filter((u) => u.role !== 'pilot');
    const flyers = pilots.length ? pilots : users;
    if (!flyers.length) throw new Error(`organization ${org.id} has no active user to fly the fleet`);

    const existing = await Aircraft.findAll({
      where: { organizationId: org.id, registration: { [Op.like]: `${FLEET_PREFIX}%` } },
      attributes: ['registration'],
      transaction,
    });
    const start = existing.map((a) => serialOf(a.registration)).filter(Number.isFinite).reduce((m, n) => Math.max(m, n), 0) + 1;
    if (start + count - 1 > FLEET_MAX) throw new Error(`the fleet scheme ends at ${fleetRegistration(FLEET_MAX)}; ${start - 1} are taken`);

    // Aircraft, round-robin over the shelters (so every airfield and every shelter kind gets its share).
    const specs = Array.from({ length: count }, (_, i) => {
      const serial = start + i;
      const engineClass = ENGINE_CLASS_IDS[serial % ENGINE_CLASS_IDS.length];
      const shelter = shelters[i % shelters.length];
      return { serial, engineClass, shelter, pilot: flyers[i % flyers.length] };
    });
    const zoneOfShelter = (s: (typeof shelters)[number]) => zoneOf.get(s.airfieldId) ?? 'UTC';
    for (let i = 0; i < specs.length; i += CHUNK) {
      await Aircraft.bulkCreate(
        specs.slice(i, i + CHUNK).map((s) => {
          const d = aircraftDefaultsFor(s.engineClass);
          const zone = zoneOfShelter(s.shelter);
          // Shut down this afternoon (15:30–17:55 local), or yesterday's if that is not yet 30 minutes past.
          let day = localDateOf(zone, now.getTime());
          const minutes = 15 * 60 + 30 + (s.serial % 30) * 5;
          let shutdown = zonedTimeToUtc(zone, day.year, day.month, day.day, 0, minutes);
          if (shutdown > now.getTime() - 30 * 60_000) {
            day = addDays(day, -1);
            shutdown = zonedTimeToUtc(zone, day.year, day.month, day.day, 0, minutes);
          }
          const preset = ENGINE_CLASSES[s.engineClass];
          const types = TYPES[s.engineClass];
          return {
            organizationId: org.id,
            shelterId: s.shelter.id,
            registration: fleetRegistration(s.serial),
            typeLabel: types[s.serial % types.length],
            engineClass: s.engineClass,
            oilQuantityL: d.oilQuantityL,
            thermal: d.thermal,
            coverOnByDefault: s.serial % 3 !== 0,
            lastShutdownAt: new Date(shutdown),
            lastShutdownOilC: preset.shutdownOilC - (s.serial % 9),
          };
        }),
        { transaction },
      );
    }
    // Ids by registration (bulk inserts do not return ids on every dialect).
    const regs = specs.map((s) => fleetRegistration(s.serial));
    const idOf = new Map<string, number>();
    for (let i = 0; i < regs.length; i += CHUNK) {
      const rows = await Aircraft.findAll({ where: { organizationId: org.id, registration: regs.slice(i, i + CHUNK) }, attributes: ['id', 'registration'], transaction });
      for (const r of rows) idOf.set(r.registration, r.id);
    }

    const heaters = specs.flatMap((s) => {
      const control = CONTROLS[s.serial % CONTROLS.length];
      const list = ENGINE_CLASSES[s.engineClass].heaters.map((h) => ({ ...h }));
      // The liquid-cooled-head class's preset pad cannot lift it to its ready temperature on a cold
      // night; most of these carry a larger pad (still within the usual 100–500 W), some keep the small one.
      if (s.engineClass === 'lc-drysump-4' && s.serial % 4 !== 0) for (const h of list) if (h.kind === 'oil-pad') h.powerW = 300;
      return list.map((h) => ({
        organizationId: org.id,
        aircraftId: idOf.get(fleetRegistration(s.serial))!,
        kind: h.kind,
        powerW: h.powerW,
        node: h.node,
        control,
        slotMinutes: DEFAULT_SLOT_MINUTES[control],
      }));
    });
    for (let i = 0; i < heaters.length; i += CHUNK) await Heater.bulkCreate(heaters.slice(i, i + CHUNK), { transaction });

    const links = specs.map((s) => ({ aircraftId: idOf.get(fleetRegistration(s.serial))!, userId: s.pilot.id }));
    for (let i = 0; i < links.length; i += CHUNK) await AircraftPilot.bulkCreate(links.slice(i, i + CHUNK), { transaction });

    // Departures tomorrow morning, 06:00–09:55 local at the aircraft's airfield.
    const departures = specs.map((s, i) => {
      const zone = zoneOfShelter(s.shelter);
      const tomorrow = addDays(localDateOf(zone, now.getTime()), 1);
      const minutes = 6 * 60 + (i % 48) * 5;
      return {
        organizationId: org.id,
        aircraftId: idOf.get(fleetRegistration(s.serial))!,
        pilotId: s.pilot.id,
        bookedById: i % 2 === 0 || !bookers.length ? s.pilot.id : bookers[i % bookers.length].id,
        departAt: new Date(zonedTimeToUtc(zone, tomorrow.year, tomorrow.month, tomorrow.day, Math.floor(minutes / 60), minutes % 60)),
        readyC: ENGINE_CLASSES[s.engineClass].readyC,
        floorC: null,
        notes: '',
      };
    });
    for (let i = 0; i < departures.length; i += CHUNK) await Departure.bulkCreate(departures.slice(i, i + CHUNK), { transaction });

    return {
      organizationId: org.id,
      added: count,
      first: regs[0] ?? null,
      last: regs[regs.length - 1] ?? null,
      airfields: new Set(specs.map((s) => s.shelter.airfieldId)).size,
      shelters: new Set(specs.map((s) => s.shelter.id)).size,
      departures: departures.length,
    };
  });
}
