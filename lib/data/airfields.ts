import 'server-only';
import { fn, col, Op, type Transaction } from 'sequelize';
import { ZodError } from 'zod';
import { db } from '@/models';
import type { Airfield, Shelter } from '@/models';
import { AppError, Conflict, NotFound } from '@/lib/api/errors';
import {
  completeShelter,
  shelterSchema,
  type AirfieldCreate,
  type AirfieldUpdate,
  type ShelterKind,
  type ShelterUpdate,
  type ShelterValues,
} from '@/lib/validation/airfields';
import { writeTransaction } from '@/models/transaction';
import type { AirfieldRow, RemoveResult, ShelterRow } from '@/lib/views/airfields';

export type { AirfieldRow, RemoveResult, ShelterRow };

// Airfields and their shelters, always scoped to one organization. Another organization's record
// is "not found", never "forbidden": it does not exist for the caller.

function conflictOn(field: string, message: string): AppError {
  return new AppError(409, 'conflict', message, [{ field, message }]);
}

function shelterRow(s: Shelter, aircraftCount: number): ShelterRow {
  const air = s.kind !== 'tie-down' && s.lossWPerK > 0;
  return {
    id: s.id,
    airfieldId: s.airfieldId,
    name: s.name,
    kind: s.kind,
    heatCapacityJPerK: s.heatCapacityJPerK,
    lossWPerK: s.lossWPerK,
    solarApertureM2: s.solarApertureM2,
    setpointC: s.setpointC ?? null,
    heatingPowerW: s.heatingPowerW ?? null,
    archived: s.archivedAt != null,
    aircraftCount,
    timeConstantH: air ? s.heatCapacityJPerK / s.lossWPerK / 3600 : null,
  };
}

function airfieldRow(a: Airfield, shelters: ShelterRow[]): AirfieldRow {
  const visible = shelters.filter((s) => s.airfieldId === a.id);
  return {
    id: a.id,
    name: a.name,
    ident: a.ident,
    latitude: a.latitude,
    longitude: a.longitude,
    elevationM: a.elevationM,
    timeZone: a.timeZone,
    archived: a.archivedAt != null,
    shelters: visible,
    aircraftCount: visible.reduce((n, s) => n + s.aircraftCount, 0),
  };
}

/** Aircraft not archived per shelter id, for an organization. */
async function activeAircraftByShelter(orgId: number, transaction?: Transaction): Promise<Map<number, number>> {
  const { Aircraft } = db();
  const rows = (await Aircraft.findAll({
    attributes: ['shelterId', [fn('COUNT', col('id')), 'n']],
    where: { organizationId: orgId, archivedAt: null, shelterId: { [Op.ne]: null } },
    group: ['shelterId'],
    raw: true,
    transaction,
  })) as unknown as { shelterId: number; n: number | string }[];
  return new Map(rows.map((r) => [r.shelterId, Number(r.n)]));
}

/** Any aircraft (archived ones too: their history points here) homed in these shelters. */
async function aircraftUsing(orgId: number, shelterIds: number[], transaction: Transaction): Promise<number> {
  if (shelterIds.length === 0) return 0;
  const { Aircraft } = db();
  return Aircraft.count({ where: { organizationId: orgId, shelterId: { [Op.in]: shelterIds } }, transaction });
}

const byName = (a: { name: string }, b: { name: string }) => a.name.localeCompare(b.name, 'en', { sensitivity: 'base' });

export async function listAirfields({ orgId, includeArchived = false }: { orgId: number; includeArchived?: boolean }): Promise<AirfieldRow[]> {
  const { Airfield, Shelter } = db();
  const airfields = await Airfield.findAll({
    where: { organizationId: orgId, ...(includeArchived ? {} : { archivedAt: null }) },
    order: [['name', 'ASC']],
  });
  if (airfields.length === 0) return [];
  const shelters = await Shelter.findAll({
    where: { organizationId: orgId, airfieldId: { [Op.in]: airfields.map((a) => a.id) }, ...(includeArchived ? {} : { archivedAt: null }) },
  });
  const counts = await activeAircraftByShelter(orgId);
  const rows = shelters.map((s) => shelterRow(s, counts.get(s.id) ?? 0)).sort(byName);
  return airfields.map((a) => airfieldRow(a, rows)).sort(byName);
}

/** The airfield record itself, scoped to the organization (NotFound otherwise). */
export async function findAirfield({ orgId, airfieldId, transaction }: { orgId: number; airfieldId: number; transaction?: Transaction }) {
  const { Airfield } = db();
  const a = airfieldId > 0 ? await Airfield.findOne({ where: { id: airfieldId, organizationId: orgId }, transaction }) : null;
  if (!a) throw new NotFound('Airfield');
  return a;
}

/** One airfield with its shelters (archived shelters too when asked). */
export async function getAirfield({ orgId, airfieldId, includeArchived = false }: { orgId: number; airfieldId: number; includeArchived?: boolean }): Promise<AirfieldRow> {
  const { Shelter } = db();
  const a = await findAirfield({ orgId, airfieldId });
  const shelters = await Shelter.findAll({ where: { organizationId: orgId, airfieldId: a.id, ...(includeArchived ? {} : { archivedAt: null }) } });
  const counts = await activeAircraftByShelter(orgId);
  return airfieldRow(a, shelters.map((s) => shelterRow(s, counts.get(s.id) ?? 0)).sort(byName));
}

async function assertIdentFree(orgId: number, ident: string, exceptId: number | null, transaction: Transaction) {
  const { Airfield } = db();
  const clash = await Airfield.findOne({
    where: { organizationId: orgId, ident, archivedAt: null, ...(exceptId ? { id: { [Op.ne]: exceptId } } : {}) },
    transaction,
  });
  if (clash) throw conflictOn('ident', `Another airfield already uses the identifier ${ident}.`);
}

async function assertShelterNameFree(airfieldId: number, name: string, exceptId: number | null, field: string, transaction: Transaction) {
  const { Shelter } = db();
  const siblings = await Shelter.findAll({ attributes: ['id', 'name'], where: { airfieldId, archivedAt: null }, transaction });
  const lower = name.toLocaleLowerCase('en');
  if (siblings.some((s) => s.id !== exceptId && s.name.toLocaleLowerCase('en') === lower)) {
    throw conflictOn(field, `This airfield already has a shelter called "${name}".`);
  }
}

async function insertShelter(orgId: number, airfieldId: number, s: ShelterValues, field: string, transaction: Transaction) {
  const { Shelter } = db();
  await assertShelterNameFree(airfieldId, s.name, null, field, transaction);
  return Shelter.create({ organizationId: orgId, airfieldId, ...s }, { transaction });
}

/** A new airfield and its first shelters, in one transaction: all of it is written or none. */
export async function createAirfield({ orgId, input }: { orgId: number; input: AirfieldCreate }): Promise<AirfieldRow> {
  const { Airfield } = db();
  const id = await writeTransaction(async (transaction) => {
    await assertIdentFree(orgId, input.ident, null, transaction);
    const { shelters, ...fields } = input;
    const a = await Airfield.create({ organizationId: orgId, ...fields }, { transaction });
    for (const [i, s] of shelters.entries()) await insertShelter(orgId, a.id, s, `shelters.${i}.name`, transaction);
    return a.id;
  });
  return getAirfield({ orgId, airfieldId: id });
}

export async function updateAirfield({ orgId, airfieldId, patch }: { orgId: number; airfieldId: number; patch: AirfieldUpdate }): Promise<AirfieldRow> {
  db();
  await writeTransaction(async (transaction) => {
    const a = await findAirfield({ orgId, airfieldId, transaction });
    const { archived, ...fields } = patch;
    const willBeActive = archived === undefined ? a.archivedAt == null : !archived;
    if (willBeActive && (fields.ident !== undefined || archived === false)) {
      await assertIdentFree(orgId, fields.ident ?? a.ident, a.id, transaction);
    }
    for (const [k, v] of Object.entries(fields)) if (v !== undefined) a.set(k as keyof typeof fields, v as never);
    if (archived !== undefined) a.archivedAt = archived ? (a.archivedAt ?? new Date()) : null;
    await a.save({ transaction });
  });
  return getAirfield({ orgId, airfieldId, includeArchived: true });
}

/**
 * Removes an airfield: archived when any aircraft is homed in one of its shelters (their history
 * stays whole), deleted with its shelters and cached forecast otherwise.
 */
export async function removeAirfield({ orgId, airfieldId }: { orgId: number; airfieldId: number }): Promise<RemoveResult> {
  const { Shelter, Forecast } = db();
  return writeTransaction(async (transaction) => {
    const a = await findAirfield({ orgId, airfieldId, transaction });
    const shelterIds = (await Shelter.findAll({ attributes: ['id'], where: { airfieldId: a.id }, transaction })).map((s) => s.id);
    const aircraftCount = await aircraftUsing(orgId, shelterIds, transaction);
    if (aircraftCount > 0) {
      a.archivedAt = a.archivedAt ?? new Date();
      await a.save({ transaction });
      return { result: 'archived', aircraftCount } as const;
    }
    await Forecast.destroy({ where: { airfieldId: a.id }, transaction });
    await Shelter.destroy({ where: { airfieldId: a.id }, transaction });
    await a.destroy({ transaction });
    return { result: 'deleted' } as const;
  });
}

// ---------------------------------------------------------------------------------------------
// Shelters

export async function listShelters({ orgId, airfieldId, includeArchived = false }: { orgId: number; airfieldId: number; includeArchived?: boolean }): Promise<ShelterRow[]> {
  return (await getAirfield({ orgId, airfieldId, includeArchived })).shelters;
}

async function findShelter(orgId: number, airfieldId: number, shelterId: number, transaction: Transaction) {
  const { Shelter } = db();
  await findAirfield({ orgId, airfieldId, transaction });
  const s = shelterId > 0 ? await Shelter.findOne({ where: { id: shelterId, airfieldId, organizationId: orgId }, transaction }) : null;
  if (!s) throw new NotFound('Shelter');
  return s;
}

async function shelterById(orgId: number, shelterId: number): Promise<ShelterRow> {
  const { Shelter } = db();
  const s = await Shelter.findOne({ where: { id: shelterId, organizationId: orgId } });
  if (!s) throw new NotFound('Shelter');
  const counts = await activeAircraftByShelter(orgId);
  return shelterRow(s, counts.get(s.id) ?? 0);
}

export async function createShelter({ orgId, airfieldId, input }: { orgId: number; airfieldId: number; input: ShelterValues }): Promise<ShelterRow> {
  db();
  const id = await writeTransaction(async (transaction) => {
    const a = await findAirfield({ orgId, airfieldId, transaction });
    if (a.archivedAt) throw new Conflict('This airfield is archived: restore it before adding shelters.');
    return (await insertShelter(orgId, a.id, input, 'name', transaction)).id;
  });
  return shelterById(orgId, id);
}

/**
 * Changes a shelter. The change is merged with the stored shelter and the whole is checked again
 * (so a change of kind is checked against the new kind); a new kind with no thermal values given
 * takes that kind's preset.
 */
export async function updateShelter({ orgId, airfieldId, shelterId, patch }: { orgId: number; airfieldId: number; shelterId: number; patch: ShelterUpdate }): Promise<ShelterRow> {
  db();
  await writeTransaction(async (transaction) => {
    const s = await findShelter(orgId, airfieldId, shelterId, transaction);
    const { archived, ...change } = patch;
    const kindChanged = change.kind !== undefined && change.kind !== s.kind;
    const kind: ShelterKind = change.kind ?? s.kind;
    const base = kindChanged
      ? completeShelter({ name: s.name, kind })
      : {
          name: s.name,
          kind,
          heatCapacityJPerK: s.heatCapacityJPerK,
          lossWPerK: s.lossWPerK,
          solarApertureM2: s.solarApertureM2,
          setpointC: s.setpointC ?? undefined,
          heatingPowerW: s.heatingPowerW ?? undefined,
        };
    const merged = { ...base, ...Object.fromEntries(Object.entries(change).filter(([, v]) => v !== undefined)) };
    const checked = shelterSchema.safeParse(merged);
    if (!checked.success) throw new ZodError(checked.error.issues);
    const willBeActive = archived === undefined ? s.archivedAt == null : !archived;
    if (willBeActive && (change.name !== undefined || archived === false)) {
      await assertShelterNameFree(s.airfieldId, checked.data.name, s.id, 'name', transaction);
    }
    s.set(checked.data);
    if (archived !== undefined) s.archivedAt = archived ? (s.archivedAt ?? new Date()) : null;
    await s.save({ transaction });
  });
  return shelterById(orgId, shelterId);
}

/** Removes a shelter: archived while aircraft are homed in it, deleted otherwise. */
export async function removeShelter({ orgId, airfieldId, shelterId }: { orgId: number; airfieldId: number; shelterId: number }): Promise<RemoveResult> {
  db();
  return writeTransaction(async (transaction) => {
    const s = await findShelter(orgId, airfieldId, shelterId, transaction);
    const aircraftCount = await aircraftUsing(orgId, [s.id], transaction);
    if (aircraftCount > 0) {
      s.archivedAt = s.archivedAt ?? new Date();
      await s.save({ transaction });
      return { result: 'archived', aircraftCount } as const;
    }
    await s.destroy({ transaction });
    return { result: 'deleted' } as const;
  });
}
