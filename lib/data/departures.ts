import 'server-only';
import { Op, type Transaction, type WhereOptions } from 'sequelize';
import { db } from '@/models';
import { Departure } from '@/models/Departure';
import { Conflict, Forbidden, Invalid, NotFound } from '@/lib/api/errors';
import { formatDayTime, localDateKey, localDateOf, zonedTimeToUtc } from '@/lib/time';
import { MAX_DAYS_AHEAD, MIN_HOURS_BETWEEN, type DepartAtInput, type DepartureCreate, type DepartureUpdate } from '@/lib/validation/departures';
import { getAircraft, loadAircraftRecords, mayBook, type AircraftRecord } from './aircraft';
import { writeTransaction } from '@/models/transaction';
export type { DepartureRecord } from '@/lib/views/departures';
import type { DepartureRecord } from '@/lib/views/departures';

// Departures (the first flight of a day per aircraft), always scoped to one organization. A pilot
// books and changes their own, for aircraft they may fly; roles with 'departures:book-any' for anyone.
// A departure another pilot flies is "not found" for a pilot, as is anything of another organization.

const HOUR_MS = 3_600_000;
const DAY_MS = 24 * HOUR_MS;


/** Who is acting: their id and whether they may book for anyone. */
export interface Actor {
  id: number;
  bookAny: boolean;
}

function zoneOf(a: AircraftRecord): string {
  return a.airfield?.timeZone ?? 'UTC';
}

async function toRecords(rows: Departure[], orgId: number, transaction?: Transaction): Promise<DepartureRecord[]> {
  if (!rows.length) return [];
  const { User } = db();
  const aircraftIds = [...new Set(rows.map((r) => r.aircraftId))];
  const userIds = [...new Set(rows.flatMap((r) => [r.pilotId, r.bookedById, ...(r.readyLoweredById ? [r.readyLoweredById] : [])]))];
  const [aircraft, users] = await Promise.all([
    loadAircraftRecords({ orgId, where: { id: aircraftIds }, transaction }),
    User.findAll({ where: { id: userIds, organizationId: orgId }, attributes: ['id', 'name'], transaction }),
  ]);
  const acById = new Map(aircraft.map((a) => [a.id, a]));
  const nameById = new Map(users.map((u) => [u.id, u.name]));
  const person = (id: number) => ({ id, name: nameById.get(id) ?? 'Former user' });
  return rows.flatMap((d) => {
    const a = acById.get(d.aircraftId);
    if (!a) return [];
    const zone = zoneOf(a);
    const ms = new Date(d.departAt).getTime();
    return [
      {
        id: d.id,
        departAt: new Date(ms).toISOString(),
        departAtMs: ms,
        timeZone: zone,
        localDate: localDateKey(localDateOf(zone, ms)),
        readyC: d.readyC,
        floorC: d.floorC ?? null,
        holdMinutes: d.holdMinutes ?? 30,
        classReadyC: a.classDefaults.readyC,
        lowestReadyC: lowestReady(a),
        readyLowered: d.readyLoweredById && d.readyLoweredAt ? { by: person(d.readyLoweredById).name, at: new Date(d.readyLoweredAt).toISOString() } : null,
        notes: d.notes ?? '',
        cancelled: d.cancelledAt != null,
        cancelledAt: d.cancelledAt ? new Date(d.cancelledAt).toISOString() : null,
        pilot: person(d.pilotId),
        bookedBy: person(d.bookedById),
        aircraft: a,
        createdAt: new Date(d.createdAt).toISOString(),
        updatedAt: new Date(d.updatedAt).toISOString(),
      },
    ];
  });
}

/**
 * Departures in [fromMs, toMs), earliest first, each with its aircraft (heaters, home shelter and
 * airfield included). Cancelled ones only when asked. `pilotId` keeps one pilot's; `airfieldId` those
 * whose aircraft lives at that airfield.
 */
export async function listDepartures({
  orgId,
  fromMs,
  toMs,
  pilotId,
  airfieldId,
  aircraftId,
  includeCancelled = false,
}: {
  orgId: number;
  fromMs: number;
  toMs: number;
  pilotId?: number;
  airfieldId?: number;
  aircraftId?: number;
  includeCancelled?: boolean;
}): Promise<DepartureRecord[]> {
  const where: WhereOptions<Departure> = {
    organizationId: orgId,
    departAt: { [Op.gte]: new Date(fromMs), [Op.lt]: new Date(toMs) },
    ...(pilotId ? { pilotId } : {}),
    ...(aircraftId ? { aircraftId } : {}),
    ...(includeCancelled ? {} : { cancelledAt: null }),
  };
  db();
  const rows = await Departure.findAll({ where, order: [['departAt', 'ASC'], ['id', 'ASC']] });
  const list = await toRecords(rows, orgId);
  return airfieldId ? list.filter((d) => d.aircraft.airfield?.id === airfieldId) : list;
}

/** One departure; a pilot without 'book any' sees only departures they fly or booked. */
export async function getDeparture({ orgId, departureId, actor, transaction }: { orgId: number; departureId: number; actor?: Actor; transaction?: Transaction }): Promise<DepartureRecord> {
  db();
  const row = await Departure.findOne({ where: { id: departureId, organizationId: orgId }, transaction });
  if (!row || (actor && !actor.bookAny && row.pilotId !== actor.id && row.bookedById !== actor.id)) throw new NotFound('Departure');
  const [rec] = await toRecords([row], orgId, transaction);
  if (!rec) throw new NotFound('Departure');
  return rec;
}

/** The instant of a departure time as sent, reading a local wall time in the airfield's zone. */
export function resolveDepartAt(input: DepartAtInput, timeZone: string): number {
  if (input.kind === 'instant') return input.ms;
  return zonedTimeToUtc(timeZone, input.year, input.month, input.day, input.hour, input.minute);
}

function fmtC(c: number) {
  const f = Math.round((c * 9) / 5 + 32);
  return `${String(c).replace('-', '\u2212')} °C (${String(f).replace('-', '\u2212')} °F)`;
}

/** The aircraft's own figure a ready temperature may be lowered to (below the class's), or null. */
function lowestReady(a: AircraftRecord): number | null {
  const m = a.makerRule?.minStartOilC;
  return m !== undefined && m < a.classDefaults.readyC ? m : null;
}

/** The checks every booking and change passes: time window, temperatures, one departure a day. */
async function checkDeparture(
  {
    orgId,
    aircraft,
    departAtMs,
    readyC,
    floorC,
    exceptId,
    now,
    mayLower = false,
  }: { orgId: number; aircraft: AircraftRecord; departAtMs: number; readyC: number; floorC: number | null; exceptId?: number; now: Date; mayLower?: boolean },
  transaction: Transaction,
) {
  const issues: { field: string; message: string }[] = [];
  const nowMs = now.getTime();
  if (departAtMs <= nowMs) issues.push({ field: 'departAt', message: 'That time has already passed. Book a departure still to come.' });
  else if (departAtMs > nowMs + MAX_DAYS_AHEAD * DAY_MS) issues.push({ field: 'departAt', message: `Book at most ${MAX_DAYS_AHEAD} days ahead.` });
  const minReady = aircraft.classDefaults.readyC;
  const lowest = lowestReady(aircraft);
  if (readyC < minReady) {
    if (!mayLower || lowest === null) {
      issues.push({
        field: 'readyC',
        message:
          lowest === null
            ? `The ready temperature cannot be below the engine class’s ${fmtC(minReady)}. Raise it or leave it empty.`
            : `The ready temperature cannot be below the engine class’s ${fmtC(minReady)}; an operator may lower it to the aircraft’s ${fmtC(lowest)}.`,
      });
    } else if (readyC < lowest) {
      issues.push({ field: 'readyC', message: `The ready temperature can be lowered to the aircraft’s figure, ${fmtC(lowest)}, not below.` });
    }
  }
  if (floorC !== null && floorC > readyC) issues.push({ field: 'floorC', message: 'The overnight floor cannot be above the ready temperature.' });
  if (issues.length) throw new Invalid(issues);

  const zone = zoneOf(aircraft);
  const day = localDateKey(localDateOf(zone, departAtMs));
  const near = await Departure.findAll({
    where: {
      organizationId: orgId,
      aircraftId: aircraft.id,
      cancelledAt: null,
      departAt: { [Op.gt]: new Date(departAtMs - 2 * DAY_MS), [Op.lt]: new Date(departAtMs + 2 * DAY_MS) },
      ...(exceptId ? { id: { [Op.ne]: exceptId } } : {}),
    },
    transaction,
  });
  const clash = near.find((d) => {
    const ms = new Date(d.departAt).getTime();
    return Math.abs(ms - departAtMs) < MIN_HOURS_BETWEEN * HOUR_MS || localDateKey(localDateOf(zone, ms)) === day;
  });
  if (clash) {
    const at = new Date(clash.departAt).getTime();
    throw new Conflict(
      `${aircraft.registration} already has a departure at ${formatDayTime(at, zone)} (${zone}). ` +
        `Book one first flight a day per aircraft, at least ${MIN_HOURS_BETWEEN} hours apart, or change that departure instead.`,
    );
  }
}

/**
 * Takes the aircraft's row lock for the rest of the transaction, so two bookings of one aircraft check
 * for a clash one after the other (PostgreSQL; on SQLite the IMMEDIATE transaction already serialises writers).
 */
async function lockAircraft({ orgId, aircraftId }: { orgId: number; aircraftId: number }, transaction: Transaction) {
  const { Aircraft } = db();
  await Aircraft.findOne({ where: { id: aircraftId, organizationId: orgId }, attributes: ['id'], lock: transaction.LOCK.UPDATE, transaction });
}

async function checkPilot({ orgId, pilotId }: { orgId: number; pilotId: number }, transaction: Transaction) {
  const { User } = db();
  const u = await User.findOne({ where: { id: pilotId, organizationId: orgId, active: true }, transaction });
  if (!u) throw new Invalid([{ field: 'pilotId', message: 'Choose an active pilot of your organization.' }]);
}

function usableAircraft(a: AircraftRecord) {
  if (a.archived) throw new Invalid([{ field: 'aircraftId', message: `${a.registration} is archived and cannot be booked.` }]);
  if (!a.airfield) {
    throw new Invalid([{ field: 'aircraftId', message: `${a.registration} has no home shelter yet, so Thawline cannot plan its preheat. An operator sets one on its profile.` }]);
  }
}

export async function bookDeparture({ orgId, actor, input, now = new Date() }: { orgId: number; actor: Actor; input: DepartureCreate; now?: Date }): Promise<DepartureRecord> {
  db();
  return writeTransaction(async (transaction) => {
    await lockAircraft({ orgId, aircraftId: input.aircraftId }, transaction);
    const aircraft = await getAircraft({ orgId, aircraftId: input.aircraftId, transaction });
    const pilotId = input.pilotId ?? actor.id;
    if (!actor.bookAny) {
      if (pilotId !== actor.id) throw new Forbidden('You can book departures for yourself only. An operator can book for someone else.');
      if (!(await mayBook({ aircraftId: aircraft.id, userId: actor.id, transaction }))) {
        throw new Forbidden(`You are not listed among the pilots who may fly ${aircraft.registration}. Ask an operator to add you or to book it.`);
      }
    } else if (pilotId !== actor.id) {
      await checkPilot({ orgId, pilotId }, transaction);
    }
    usableAircraft(aircraft);
    const departAtMs = resolveDepartAt(input.departAt, zoneOf(aircraft));
    const readyC = input.readyC ?? aircraft.classDefaults.readyC;
    const floorC = input.floorC ?? null;
    const holdMinutes = input.holdMinutes ?? (await db().Organization.findByPk(orgId, { attributes: ['holdMinutes'], transaction }))?.holdMinutes ?? 30;
    await checkDeparture({ orgId, aircraft, departAtMs, readyC, floorC, now, mayLower: actor.bookAny }, transaction);
    const lowered = readyC < aircraft.classDefaults.readyC;
    const row = await Departure.create(
      {
        organizationId: orgId,
        aircraftId: aircraft.id,
        pilotId,
        bookedById: actor.id,
        departAt: new Date(departAtMs),
        readyC,
        floorC,
        holdMinutes,
        notes: input.notes,
        readyLoweredById: lowered ? actor.id : null,
        readyLoweredAt: lowered ? now : null,
      },
      { transaction },
    );
    return getDeparture({ orgId, departureId: row.id, transaction });
  });
}

/** Loads a departure the actor may change (their own, or any with 'book any'), still to come and not cancelled. */
async function changeable({ orgId, departureId, actor, now }: { orgId: number; departureId: number; actor: Actor; now: Date }, transaction: Transaction) {
  const row = await Departure.findOne({ where: { id: departureId, organizationId: orgId }, transaction });
  if (!row) throw new NotFound('Departure');
  const own = row.pilotId === actor.id || row.bookedById === actor.id;
  if (!actor.bookAny && !own) throw new NotFound('Departure');
  if (row.cancelledAt) throw new Conflict('This departure was cancelled. Book a new one instead.');
  if (new Date(row.departAt).getTime() <= now.getTime()) throw new Conflict('This departure time has passed; it can no longer be changed.');
  return row;
}

export async function updateDeparture({
  orgId,
  actor,
  departureId,
  patch,
  now = new Date(),
}: {
  orgId: number;
  actor: Actor;
  departureId: number;
  patch: DepartureUpdate;
  now?: Date;
}): Promise<DepartureRecord> {
  db();
  return writeTransaction(async (transaction) => {
    const row = await changeable({ orgId, departureId, actor, now }, transaction);
    if (patch.pilotId !== undefined && patch.pilotId !== row.pilotId) {
      if (!actor.bookAny) throw new Forbidden('Only an operator or a manager can hand a departure to another pilot.');
      await checkPilot({ orgId, pilotId: patch.pilotId }, transaction);
      row.pilotId = patch.pilotId;
    }
    await lockAircraft({ orgId, aircraftId: row.aircraftId }, transaction);
    const aircraft = await getAircraft({ orgId, aircraftId: row.aircraftId, transaction });
    usableAircraft(aircraft);
    const departAtMs = patch.departAt ? resolveDepartAt(patch.departAt, zoneOf(aircraft)) : new Date(row.departAt).getTime();
    const readyC = patch.readyC ?? row.readyC;
    const floorC = patch.floorC === undefined ? (row.floorC ?? null) : patch.floorC;
    await checkDeparture({ orgId, aircraft, departAtMs, readyC, floorC, exceptId: row.id, now, mayLower: actor.bookAny }, transaction);
    // Lowered below the class's: recorded (who, when) when it changes; cleared once it is back up.
    if (readyC < aircraft.classDefaults.readyC) {
      if (readyC !== row.readyC || !row.readyLoweredAt) {
        row.readyLoweredById = actor.id;
        row.readyLoweredAt = now;
      }
    } else {
      row.readyLoweredById = null;
      row.readyLoweredAt = null;
    }
    row.departAt = new Date(departAtMs);
    row.readyC = readyC;
    row.floorC = floorC;
    if (patch.holdMinutes !== undefined) row.holdMinutes = patch.holdMinutes;
    if (patch.notes !== undefined) row.notes = patch.notes;
    await row.save({ transaction });
    return getDeparture({ orgId, departureId: row.id, transaction });
  });
}

export async function cancelDeparture({ orgId, actor, departureId, now = new Date() }: { orgId: number; actor: Actor; departureId: number; now?: Date }): Promise<DepartureRecord> {
  db();
  return writeTransaction(async (transaction) => {
    const row = await changeable({ orgId, departureId, actor, now }, transaction);
    row.cancelledAt = now;
    await row.save({ transaction });
    return getDeparture({ orgId, departureId: row.id, transaction });
  });
}
