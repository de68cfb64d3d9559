import 'server-only';
import { Op, type Transaction, type WhereOptions } from 'sequelize';
import { db } from '@/models';
import type { Aircraft, ThermalParams } from '@/models/Aircraft';
import { Heater } from '@/models/Heater';
import { AircraftPilot } from '@/models/AircraftPilot';
import { Departure } from '@/models/Departure';
import { Conflict, Invalid, NotFound } from '@/lib/api/errors';
import { aircraftDefaultsFor } from '@/lib/seed/defaults';
import { heaterWarnings, type EngineClassId } from '@/lib/thermal/presets';
import {
  classDefaults,
  ENGINE_CLASSES,
  ENGINE_CLASS_IDS,
  HEATER_KINDS,
  type AircraftCreate,
  type AircraftUpdate,
  type HeaterInput,
  type HeaterKind,
  type ThermalInput,
} from '@/lib/validation/aircraft';
import { writeTransaction } from '@/models/transaction';

// Aircraft profiles with their heaters and the pilots who may book them, always scoped to one
// organization. Another organization's aircraft is "not found": it does not exist for the caller.
// A profile, its heaters and its pilots are written in one transaction.

export type { HeaterRecord, ShelterRef, AirfieldRef, AircraftRecord, ShelterChoice, PilotChoice, EngineClassOption } from '@/lib/views/aircraft';
import type { AircraftRecord, ShelterChoice, PilotChoice, EngineClassOption } from '@/lib/views/aircraft';







type AircraftWithIncludes = Aircraft & {
  heaters?: Heater[];
  pilots?: { id: number; name: string }[];
  shelter?: (import('@/models/Shelter').Shelter & { airfield?: import('@/models/Airfield').Airfield }) | null;
};

function makerRuleOf(a: Aircraft): AircraftRecord['makerRule'] {
  const c = ENGINE_CLASSES[a.engineClass as EngineClassId]?.makerRule;
  const own = { preheatBelowC: a.preheatBelowC ?? null, soakHours: a.preheatSoakHours ?? null, minStartOilC: a.minStartOilC ?? null };
  const preheatBelowC = own.preheatBelowC ?? c?.preheatBelowC;
  const soakHours = own.soakHours ?? c?.soakHours;
  const minStartOilC = own.minStartOilC ?? c?.minStartOilC;
  if (preheatBelowC === undefined || soakHours === undefined || minStartOilC === undefined) return null;
  return { preheatBelowC, soakHours, minStartOilC, estimate: own.preheatBelowC === null || own.soakHours === null || own.minStartOilC === null };
}

function toRecord(a: AircraftWithIncludes): AircraftRecord {
  const cd = classDefaults(a.engineClass);
  const sh = a.shelter ?? null;
  const af = sh?.airfield ?? null;
  const pilots = [...(a.pilots ?? [])].map((p) => ({ id: p.id, name: p.name })).sort((x, y) => x.name.localeCompare(y.name));
  return {
    id: a.id,
    registration: a.registration,
    typeLabel: a.typeLabel,
    engineClass: a.engineClass,
    engineClassLabel: cd?.label ?? a.engineClass,
    oilQuantityL: a.oilQuantityL,
    thermal: a.thermal,
    coverOnByDefault: a.coverOnByDefault,
    shelter: sh
      ? {
          id: sh.id,
          name: sh.name,
          kind: sh.kind,
          heatCapacityJPerK: sh.heatCapacityJPerK,
          lossWPerK: sh.lossWPerK,
          solarApertureM2: sh.solarApertureM2,
          setpointC: sh.setpointC ?? null,
          heatingPowerW: sh.heatingPowerW ?? null,
        }
      : null,
    airfield: af
      ? { id: af.id, name: af.name, ident: af.ident, latitude: af.latitude, longitude: af.longitude, elevationM: af.elevationM, timeZone: af.timeZone }
      : null,
    heaters: [...(a.heaters ?? [])]
      .sort((x, y) => x.id - y.id)
      .map((h) => ({
        id: h.id,
        kind: h.kind,
        kindLabel: HEATER_KINDS[h.kind as HeaterKind]?.label ?? h.kind,
        powerW: h.powerW,
        node: h.node,
        control: h.control,
        slotMinutes: h.slotMinutes,
      })),
    pilots,
    pilotIds: pilots.map((p) => p.id),
    lastShutdownAt: a.lastShutdownAt ? new Date(a.lastShutdownAt).toISOString() : null,
    lastShutdownOilC: a.lastShutdownOilC ?? null,
    classDefaults: { readyC: cd?.readyC ?? 15, shutdownOilC: cd?.shutdownOilC ?? 80, oilL: cd?.oilL ?? a.oilQuantityL, engineReadyC: cd?.engineReadyC ?? null, readinessOil: cd?.readinessOil ?? 'oil' },
    engineReadyC: a.engineReadyC ?? null,
    makerRule: makerRuleOf(a),
    heaterWarnings: heaterWarnings(a.engineClass, a.heaters ?? []),
    oilChangeIntervalHours: a.oilChangeIntervalHours ?? null,
    oilChangeIntervalMonths: a.oilChangeIntervalMonths ?? null,
    archived: a.archivedAt != null,
    updatedAt: new Date(a.updatedAt).toISOString(),
  };
}

function includes() {
  const { User, Shelter, Airfield } = db();
  return [
    { model: Heater, as: 'heaters' },
    { model: User, as: 'pilots', attributes: ['id', 'name'], through: { attributes: [] } },
    { model: Shelter, as: 'shelter', include: [{ model: Airfield, as: 'airfield' }] },
  ];
}

/** Aircraft records matching a where clause inside the organization, by registration. */
export async function loadAircraftRecords({ orgId, where = {}, transaction }: { orgId: number; where?: WhereOptions<Aircraft>; transaction?: Transaction }) {
  const { Aircraft } = db();
  const rows = await Aircraft.findAll({
    where: { ...(where as object), organizationId: orgId },
    include: includes(),
    order: [['registration', 'ASC']],
    transaction,
  });
  return rows.map((r) => toRecord(r as AircraftWithIncludes));
}

export async function listAircraft({ orgId, includeArchived = false, airfieldId }: { orgId: number; includeArchived?: boolean; airfieldId?: number }): Promise<AircraftRecord[]> {
  const list = await loadAircraftRecords({ orgId, where: includeArchived ? {} : { archivedAt: null } });
  return airfieldId ? list.filter((a) => a.airfield?.id === airfieldId) : list;
}

export async function getAircraft({ orgId, aircraftId, transaction }: { orgId: number; aircraftId: number; transaction?: Transaction }): Promise<AircraftRecord> {
  const [a] = await loadAircraftRecords({ orgId, where: { id: aircraftId }, transaction });
  if (!a) throw new NotFound('Aircraft');
  return a;
}

/** True when the user is among the pilots who may book the aircraft. */
export async function mayBook({ aircraftId, userId, transaction }: { aircraftId: number; userId: number; transaction?: Transaction }): Promise<boolean> {
  db();
  return (await AircraftPilot.count({ where: { aircraftId, userId }, transaction })) > 0;
}

/** Ids of the organization's aircraft the user may book. */
export async function aircraftIdsFlownBy({ orgId, userId }: { orgId: number; userId: number }): Promise<number[]> {
  const { Aircraft } = db();
  const links = await AircraftPilot.findAll({ where: { userId } });
  if (!links.length) return [];
  const rows = await Aircraft.findAll({ where: { organizationId: orgId, id: links.map((l) => l.aircraftId), archivedAt: null }, attributes: ['id'] });
  return rows.map((r) => r.id);
}

/** The organization's shelters grouped by airfield, for the home-shelter select. */
export async function listShelterChoices({ orgId }: { orgId: number }): Promise<ShelterChoice[]> {
  const { Airfield, Shelter } = db();
  const fields = await Airfield.findAll({ where: { organizationId: orgId, archivedAt: null }, order: [['name', 'ASC']] });
  const shelters = await Shelter.findAll({ where: { organizationId: orgId, archivedAt: null }, order: [['name', 'ASC']] });
  return fields.map((f) => ({
    airfield: { id: f.id, name: f.name, ident: f.ident, timeZone: f.timeZone },
    shelters: shelters.filter((s) => s.airfieldId === f.id).map((s) => ({ id: s.id, name: s.name, kind: s.kind })),
  }));
}

/** Active pilots of the organization, for the "pilots who may book" checkboxes. */
export async function listPilotChoices({ orgId }: { orgId: number }): Promise<PilotChoice[]> {
  const { User } = db();
  const users = await User.findAll({ where: { organizationId: orgId, role: 'pilot', active: true }, order: [['name', 'ASC']] });
  const links = users.length ? await AircraftPilot.findAll({ where: { userId: users.map((u) => u.id) } }) : [];
  return users.map((u) => ({ id: u.id, name: u.name, email: u.email, aircraftIds: links.filter((l) => l.userId === u.id).map((l) => l.aircraftId) }));
}

// ---------------------------------------------------------------------------------------------
// Writing

function presetThermal(engineClass: string, oilL?: number): ThermalParams {
  return structuredClone(aircraftDefaultsFor(engineClass, oilL).thermal);
}

function sameThermal(a: ThermalInput | ThermalParams, b: ThermalParams): boolean {
  const strip = (t: ThermalInput | ThermalParams) =>
    JSON.stringify({
      nodes: t.nodes.map((n) => [n.name, n.heatCapacityJPerK, n.lossWPerK]),
      c: t.nodes.length > 1 ? (t.couplingWPerK ?? null) : null,
      f: t.coverFactor,
      w: t.windCoefficient ?? null,
    });
  return strip(a) === strip(b);
}

/** The thermal parameters to store: given ones (manual unless equal to the preset or to what is stored), else the preset. */
function resolveThermal(engineClass: string, given: ThermalInput | null | undefined, stored?: ThermalParams, oilL?: number): ThermalParams {
  const preset = presetThermal(engineClass, oilL);
  if (!given) return preset;
  const t: ThermalParams = {
    nodes: given.nodes.map((n) => ({ name: n.name, heatCapacityJPerK: n.heatCapacityJPerK, lossWPerK: n.lossWPerK })),
    ...(given.nodes.length > 1 ? { couplingWPerK: given.couplingWPerK } : {}),
    coverFactor: given.coverFactor,
    ...(given.windCoefficient !== undefined ? { windCoefficient: given.windCoefficient } : {}),
    source: 'manual',
  };
  if (stored && sameThermal(t, stored)) t.source = stored.source;
  else if (sameThermal(t, preset)) t.source = 'preset';
  return t;
}

const SHUTDOWN_FUTURE_SLACK_MS = 5 * 60_000;

async function checkReferences(
  { orgId, shelterId, pilotIds, lastShutdownAt, now }: { orgId: number; shelterId?: number | null; pilotIds?: number[]; lastShutdownAt?: Date | null; now: Date },
  transaction: Transaction,
) {
  const { Shelter, User } = db();
  const issues: { field: string; message: string }[] = [];
  if (shelterId != null) {
    const sh = await Shelter.findOne({ where: { id: shelterId, organizationId: orgId, archivedAt: null }, transaction });
    if (!sh) issues.push({ field: 'shelterId', message: 'Choose one of your organization’s shelters.' });
  }
  if (pilotIds?.length) {
    const found = await User.count({ where: { id: pilotIds, organizationId: orgId, active: true }, transaction });
    if (found !== pilotIds.length) issues.push({ field: 'pilotIds', message: 'Choose pilots of your organization (active users only).' });
  }
  if (lastShutdownAt && lastShutdownAt.getTime() > now.getTime() + SHUTDOWN_FUTURE_SLACK_MS) {
    issues.push({ field: 'lastShutdownAt', message: 'The last shutdown cannot be in the future.' });
  }
  if (issues.length) throw new Invalid(issues);
}

async function checkRegistrationFree({ orgId, registration, exceptId }: { orgId: number; registration: string; exceptId?: number }, transaction: Transaction) {
  const { Aircraft } = db();
  const other = await Aircraft.findOne({
    where: { organizationId: orgId, registration, ...(exceptId ? { id: { [Op.ne]: exceptId } } : {}) },
    transaction,
  });
  if (other) {
    throw new Conflict(
      other.archivedAt
        ? `${registration} belongs to an archived aircraft. Bring that one back instead of adding it again.`
        : `${registration} is already in your fleet.`,
    );
  }
}

async function replaceHeaters({ orgId, aircraftId, heaters }: { orgId: number; aircraftId: number; heaters: HeaterInput[] }, transaction: Transaction) {
  await Heater.destroy({ where: { aircraftId }, transaction });
  // One bound INSERT each (a bulk insert puts the values into the SQL text).
  for (const h of heaters) {
    await Heater.create({ organizationId: orgId, aircraftId, kind: h.kind, powerW: h.powerW, node: h.node, control: h.control, slotMinutes: h.slotMinutes }, { transaction });
  }
}

async function replacePilots({ aircraftId, pilotIds }: { aircraftId: number; pilotIds: number[] }, transaction: Transaction) {
  await AircraftPilot.destroy({ where: { aircraftId }, transaction });
  for (const userId of pilotIds) await AircraftPilot.create({ aircraftId, userId }, { transaction });
}

export async function createAircraft({ orgId, input, now = new Date() }: { orgId: number; input: AircraftCreate; now?: Date }): Promise<AircraftRecord> {
  const { Aircraft } = db();
  return writeTransaction(async (transaction) => {
    await checkReferences({ orgId, shelterId: input.shelterId, pilotIds: input.pilotIds, lastShutdownAt: input.lastShutdownAt, now }, transaction);
    await checkRegistrationFree({ orgId, registration: input.registration }, transaction);
    const preset = aircraftDefaultsFor(input.engineClass);
    const row = await Aircraft.create(
      {
        organizationId: orgId,
        shelterId: input.shelterId ?? null,
        registration: input.registration,
        typeLabel: input.typeLabel,
        engineClass: input.engineClass,
        oilQuantityL: input.oilQuantityL ?? preset.oilQuantityL,
        // The preset's oil heat capacity follows the oil quantity entered.
        thermal: resolveThermal(input.engineClass, input.thermal, undefined, input.oilQuantityL ?? undefined),
        coverOnByDefault: input.coverOnByDefault,
        lastShutdownAt: input.lastShutdownAt ?? null,
        lastShutdownOilC: input.lastShutdownOilC ?? null,
        engineReadyC: input.engineReadyC ?? null,
        preheatBelowC: input.preheatBelowC ?? null,
        preheatSoakHours: input.preheatSoakHours ?? null,
        minStartOilC: input.minStartOilC ?? null,
      },
      { transaction },
    );
    await replaceHeaters({ orgId, aircraftId: row.id, heaters: input.heaters }, transaction);
    await replacePilots({ aircraftId: row.id, pilotIds: input.pilotIds }, transaction);
    return getAircraft({ orgId, aircraftId: row.id, transaction });
  });
}

export async function updateAircraft({ orgId, aircraftId, patch, now = new Date() }: { orgId: number; aircraftId: number; patch: AircraftUpdate; now?: Date }): Promise<AircraftRecord> {
  const { Aircraft } = db();
  return writeTransaction(async (transaction) => {
    const a = await Aircraft.findOne({ where: { id: aircraftId, organizationId: orgId }, transaction });
    if (!a) throw new NotFound('Aircraft');
    await checkReferences({ orgId, shelterId: patch.shelterId, pilotIds: patch.pilotIds, lastShutdownAt: patch.lastShutdownAt, now }, transaction);
    if (patch.registration && patch.registration !== a.registration) {
      await checkRegistrationFree({ orgId, registration: patch.registration, exceptId: a.id }, transaction);
      a.registration = patch.registration;
    }
    if (patch.typeLabel !== undefined) a.typeLabel = patch.typeLabel;
    const classChanged = patch.engineClass !== undefined && patch.engineClass !== a.engineClass;
    if (patch.engineClass !== undefined) a.engineClass = patch.engineClass;
    if (patch.oilQuantityL !== undefined) a.oilQuantityL = patch.oilQuantityL;
    if (patch.thermal !== undefined || classChanged) {
      a.thermal = patch.thermal !== undefined ? resolveThermal(a.engineClass, patch.thermal, classChanged ? undefined : a.thermal) : presetThermal(a.engineClass);
      a.changed('thermal', true);
    }
    if (patch.coverOnByDefault !== undefined) a.coverOnByDefault = patch.coverOnByDefault;
    if (patch.shelterId !== undefined) a.shelterId = patch.shelterId;
    if (patch.lastShutdownAt !== undefined) a.lastShutdownAt = patch.lastShutdownAt;
    if (patch.lastShutdownOilC !== undefined) a.lastShutdownOilC = patch.lastShutdownOilC;
    if (patch.engineReadyC !== undefined) a.engineReadyC = patch.engineReadyC;
    if (patch.preheatBelowC !== undefined) a.preheatBelowC = patch.preheatBelowC;
    if (patch.preheatSoakHours !== undefined) a.preheatSoakHours = patch.preheatSoakHours;
    if (patch.minStartOilC !== undefined) a.minStartOilC = patch.minStartOilC;
    if (patch.archived === false) a.archivedAt = null;
    if (patch.archived === true && !a.archivedAt) a.archivedAt = now;
    await a.save({ transaction });
    if (patch.heaters) await replaceHeaters({ orgId, aircraftId: a.id, heaters: patch.heaters }, transaction);
    if (patch.pilotIds) await replacePilots({ aircraftId: a.id, pilotIds: patch.pilotIds }, transaction);
    return getAircraft({ orgId, aircraftId: a.id, transaction });
  });
}

/** Archives the aircraft (its history stays) and cancels its departures still to come. */
export async function archiveAircraft({ orgId, aircraftId, now = new Date() }: { orgId: number; aircraftId: number; now?: Date }) {
  const { Aircraft } = db();
  return writeTransaction(async (transaction) => {
    const a = await Aircraft.findOne({ where: { id: aircraftId, organizationId: orgId }, transaction });
    if (!a) throw new NotFound('Aircraft');
    if (!a.archivedAt) {
      a.archivedAt = now;
      await a.save({ transaction });
    }
    const [cancelled] = await Departure.update(
      { cancelledAt: now },
      { where: { aircraftId: a.id, organizationId: orgId, cancelledAt: null, departAt: { [Op.gt]: now } }, transaction },
    );
    return { archived: true as const, cancelledDepartures: cancelled, aircraft: await getAircraft({ orgId, aircraftId: a.id, transaction }) };
  });
}


/** The engine classes with the values a new profile starts from (for the form). */
export function engineClassOptions(): EngineClassOption[] {
  return ENGINE_CLASS_IDS.map((id) => {
    const p = ENGINE_CLASSES[id];
    const d = aircraftDefaultsFor(id);
    return { id, label: p.label, oilQuantityL: d.oilQuantityL, readyC: p.readyC, shutdownOilC: p.shutdownOilC, heaters: p.heaters.map((h) => ({ ...h })), thermal: structuredClone(d.thermal) };
  });
}
