// Demo rows for planning: heaters, the pilots who may book each aircraft, a time-of-use tariff per
// airfield, last shutdowns and a week of departures from tomorrow morning. Every number here is
// invented for the demo. Times are local to each airfield and follow ctx.now, so the demo is always
// "tonight and the coming week".
import { db } from '@/models';
import { Heater } from '@/models/Heater';
import { AircraftPilot } from '@/models/AircraftPilot';
import { Tariff } from '@/models/Tariff';
import { Departure } from '@/models/Departure';
import { ENGINE_CLASSES, type EngineClassId } from '@/lib/thermal/presets';
import { DEFAULT_SLOT_MINUTES, type HeaterControl, type HeaterKind } from '@/lib/validation/aircraft';
import { uniformSchedule } from '@/lib/validation/tariffs';
import { addDays, localDateOf, zonedTimeToUtc, type LocalDate } from '@/lib/time';
import type { SeedContext } from './demo';

type HeaterSpec = { kind: HeaterKind; powerW: number; node: 'oil' | 'engine'; control: HeaterControl };

/** Heaters per registration; absent: the class preset switched by relay. */
const HEATERS: Record<string, HeaterSpec[] | 'preset-timer' | 'preset-relay'> = {
  // The class's small tank pad cannot lift the liquid-cooled-head engines to their ready temperature
  // on a cold night, so these two carry a larger pad (still within the usual 100–500 W).
  'Q-KAPA': [{ kind: 'oil-pad', powerW: 300, node: 'oil', control: 'timer' }],
  'Q-LUMI': [{ kind: 'oil-pad', powerW: 300, node: 'oil', control: 'relay' }],
  // Too weak on purpose: the class's 100 W pad, uncovered on an open tie-down — the demo's "short" case.
  'Q-SIPI': [{ kind: 'oil-pad', powerW: 100, node: 'oil', control: 'manual' }],
  'Q-ROUTA': 'preset-timer',
  'Q-TAIMI': 'preset-relay',
  // No heater at all — the demo's "unplanned" case.
  'Q-HALLA': [],
  'Q-KUURA': 'preset-relay',
  'Q-VIIMA': 'preset-relay',
};

/** Who may book what (pilot@ flies everything but Q-VIIMA). */
const PILOTS: Record<string, string[]> = {
  'pilot@frostvale.test': ['Q-KAPA', 'Q-LUMI', 'Q-SIPI', 'Q-ROUTA', 'Q-TAIMI', 'Q-HALLA', 'Q-KUURA'],
  'pilot2@frostvale.test': ['Q-ROUTA', 'Q-TAIMI', 'Q-HALLA', 'Q-KUURA', 'Q-VIIMA'],
  'pilot3@frostvale.test': ['Q-KAPA', 'Q-LUMI', 'Q-SIPI', 'Q-VIIMA'],
  'pilot@ridgeway.test': ['Q-RIDGE'],
};

/** Night, day and evening-peak prices per kWh by airfield key (peak ≈ 2.5× night). */
const TARIFFS: Record<string, [number, number, number]> = {
  kettle: [0.08, 0.14, 0.2],
  birchmoor: [0.07, 0.13, 0.18],
  stonegate: [0.09, 0.15, 0.22],
  ridge: [0.08, 0.14, 0.21],
};

/** Tomorrow morning: registration, local time, pilot, booked by the pilot (else by the first operator), options. */
const TOMORROW: { reg: string; at: [number, number]; pilot: string; self: boolean; readyC?: number; floorC?: number; notes?: string }[] = [
  { reg: 'Q-KAPA', at: [6, 30], pilot: 'pilot3@frostvale.test', self: false, notes: 'Early circuit session.' },
  { reg: 'Q-ROUTA', at: [7, 0], pilot: 'pilot2@frostvale.test', self: true, floorC: 5 },
  { reg: 'Q-SIPI', at: [7, 30], pilot: 'pilot@frostvale.test', self: true },
  { reg: 'Q-TAIMI', at: [8, 0], pilot: 'pilot@frostvale.test', self: false },
  { reg: 'Q-KUURA', at: [8, 30], pilot: 'pilot2@frostvale.test', self: true, readyC: 20, notes: 'Full load; warmer oil wanted.' },
  { reg: 'Q-HALLA', at: [9, 15], pilot: 'pilot@frostvale.test', self: true },
  { reg: 'Q-LUMI', at: [10, 0], pilot: 'pilot3@frostvale.test', self: true },
  { reg: 'Q-RIDGE', at: [7, 45], pilot: 'pilot@ridgeway.test', self: true },
];

function weekdaySchedule(night: number, day: number, peak: number | null): number[] {
  return Array.from({ length: 24 }, (_, h) => (h >= 22 || h < 7 ? night : peak !== null && h >= 17 && h < 21 ? peak : day));
}

/** Winter months (Nov–Mar) have the weekday evening peak; the rest of the year and weekends do not. */
function demoTariffSchedules() {
  const winterWeekday = weekdaySchedule(0, 1, 2);
  const plain = weekdaySchedule(0, 1, null);
  const weekday = Array.from({ length: 12 }, (_, m) => (m >= 10 || m <= 2 ? [...winterWeekday] : [...plain]));
  return { weekdaySchedule: weekday, weekendSchedule: uniformSchedule(plain) };
}

export async function seedPlanning(ctx: SeedContext): Promise<void> {
  const { transaction, now, scenario } = ctx;
  const { Aircraft } = db();
  const operatorOf: Record<string, number> = {};
  const zoneOfShelter: Record<string, string> = {};
  const airfieldOfShelter: Record<string, string> = {};
  const aircraftMeta: Record<string, { orgKey: string; engineClass: string; shelter: string }> = {};
  for (const o of scenario.organizations) {
    const op = o.users.find((u) => u.role === 'operator') ?? o.users.find((u) => u.role === 'manager');
    if (op) operatorOf[o.key] = ctx.userIds[op.email];
    for (const a of o.airfields) for (const s of a.shelters) (zoneOfShelter[s.key] = a.timeZone), (airfieldOfShelter[s.key] = a.key);
    for (const ac of o.aircraft) aircraftMeta[ac.registration] = { orgKey: o.key, engineClass: ac.engineClass, shelter: ac.shelter };
  }
  const zoneOf = (reg: string) => zoneOfShelter[aircraftMeta[reg].shelter] ?? 'UTC';

  // Heaters.
  const heaterRows = Object.entries(aircraftMeta).flatMap(([reg, meta]) => {
    const spec = HEATERS[reg] ?? 'preset-relay';
    const list: HeaterSpec[] =
      typeof spec === 'string'
        ? ENGINE_CLASSES[meta.engineClass as EngineClassId].heaters.map((h) => ({ ...h, control: spec === 'preset-timer' ? 'timer' : 'relay' }))
        : spec;
    return list.map((h) => ({
      organizationId: ctx.orgIds[meta.orgKey],
      aircraftId: ctx.aircraftIds[reg],
      kind: h.kind,
      powerW: h.powerW,
      node: h.node,
      control: h.control,
      slotMinutes: DEFAULT_SLOT_MINUTES[h.control],
    }));
  });
  await Heater.bulkCreate(heaterRows, { transaction });

  // Pilots who may book.
  const links = Object.entries(PILOTS).flatMap(([email, regs]) =>
    ctx.userIds[email] ? regs.filter((r) => ctx.aircraftIds[r]).map((r) => ({ aircraftId: ctx.aircraftIds[r], userId: ctx.userIds[email] })) : [],
  );
  await AircraftPilot.bulkCreate(links, { transaction });

  // A three-period tariff per airfield.
  const schedules = demoTariffSchedules();
  for (const o of scenario.organizations) {
    for (const a of o.airfields) {
      const [night, day, peak] = TARIFFS[a.key] ?? [0.08, 0.14, 0.2];
      await Tariff.create(
        {
          organizationId: ctx.orgIds[o.key],
          airfieldId: ctx.airfieldIds[a.key],
          currency: 'EUR',
          periods: [
            { name: 'Night', pricePerKWh: night },
            { name: 'Day', pricePerKWh: day },
            { name: 'Evening peak', pricePerKWh: peak },
          ],
          weekdaySchedule: structuredClone(schedules.weekdaySchedule),
          weekendSchedule: structuredClone(schedules.weekendSchedule),
        },
        { transaction },
      );
    }
  }

  // Last shutdowns: the latest late afternoon or evening before now (every other aircraft a day earlier);
  // one left empty so the class's typical oil temperature applies.
  const regs = Object.keys(aircraftMeta);
  for (const [i, reg] of regs.entries()) {
    const zone = zoneOf(reg);
    const today = localDateOf(zone, now.getTime());
    const minutes = 15 * 60 + 30 + (i % 5) * 35; // 15:30 … 17:50
    let day: LocalDate = i % 2 === 0 ? today : addDays(today, -1);
    let at = zonedTimeToUtc(zone, day.year, day.month, day.day, 0, minutes);
    if (at > now.getTime() - 30 * 60_000) {
      day = addDays(day, -1);
      at = zonedTimeToUtc(zone, day.year, day.month, day.day, 0, minutes);
    }
    const preset = ENGINE_CLASSES[aircraftMeta[reg].engineClass as EngineClassId];
    const oilC = reg === 'Q-HALLA' ? null : Math.round(preset.shutdownOilC + ((i * 7) % 11) - 5);
    await Aircraft.update({ lastShutdownAt: new Date(at), lastShutdownOilC: oilC }, { where: { id: ctx.aircraftIds[reg] }, transaction });
  }

  // Departures: tomorrow morning, then a few a day for the rest of the week.
  const rows: { organizationId: number; aircraftId: number; pilotId: number; bookedById: number; departAt: Date; readyC: number; floorC: number | null; notes: string }[] = [];
  const book = (reg: string, day: LocalDate, hour: number, minute: number, pilotEmail: string, self: boolean, extra: { readyC?: number; floorC?: number; notes?: string } = {}) => {
    const meta = aircraftMeta[reg];
    const pilotId = ctx.userIds[pilotEmail];
    if (!meta || !pilotId) return;
    const zone = zoneOf(reg);
    rows.push({
      organizationId: ctx.orgIds[meta.orgKey],
      aircraftId: ctx.aircraftIds[reg],
      pilotId,
      bookedById: self ? pilotId : operatorOf[meta.orgKey],
      departAt: new Date(zonedTimeToUtc(zone, day.year, day.month, day.day, hour, minute)),
      readyC: extra.readyC ?? ENGINE_CLASSES[meta.engineClass as EngineClassId].readyC,
      floorC: extra.floorC ?? null,
      notes: extra.notes ?? '',
    });
  };
  const tomorrowOf = (reg: string) => addDays(localDateOf(zoneOf(reg), now.getTime()), 1);
  for (const t of TOMORROW) book(t.reg, tomorrowOf(t.reg), t.at[0], t.at[1], t.pilot, t.self, t);

  const club = scenario.organizations[0];
  const clubRegs = club.aircraft.map((a) => a.registration);
  const pilotsOf = (reg: string) => Object.entries(PILOTS).filter(([, r]) => r.includes(reg)).map(([e]) => e);
  for (let k = 1; k <= 6; k++) {
    for (let j = 0; j < 3; j++) {
      const reg = clubRegs[(k * 3 + j) % clubRegs.length];
      const pilots = pilotsOf(reg);
      if (!pilots.length) continue;
      const minutes = 6 * 60 + 45 + j * 75 + (k % 2) * 15;
      book(reg, addDays(tomorrowOf(reg), k), Math.floor(minutes / 60), minutes % 60, pilots[(k + j) % pilots.length], (k + j) % 2 === 0);
    }
  }
  await Departure.bulkCreate(rows, { transaction });
}
