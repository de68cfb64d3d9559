import 'server-only';
import { db } from '@/models';
import type { OilCheck } from '@/models/OilCheck';
import type { OilChange } from '@/models/OilChange';
import { Conflict, Forbidden, Invalid, NotFound } from '@/lib/api/errors';
import { can } from '@/lib/auth/permissions';
import type { CurrentUser } from '@/lib/auth/guards';
import { getAircraft, listAircraft, type AircraftRecord } from '@/lib/data/aircraft';
import { resolveDepartAt } from '@/lib/data/departures';
import { zoneOf } from '@/lib/data/logs';
import { ENGINE_CLASSES, type EngineClassId } from '@/lib/thermal/presets';
import { analyseChecks, consumptionSummary, oilChangeDue, } from '@/lib/oil';
import type { DepartAtInput } from '@/lib/validation/departures';
import type { OilChangeInput, OilCheckInput, OilSettings } from '@/lib/validation/oil';
import type { OilAircraftChoice, OilChangeRecord, OilCheckRecord, OilLog } from '@/lib/views/oil';

export type { OilAircraftChoice, OilChangeRecord, OilCheckRecord, OilLog };

// The Oil log: cold oil checks and oil changes of one aircraft, scoped to the organization. Stored in
// litres and °C; the page converts to the person's units. Corrections and figures come from lib/oil.

/** Entries more than this far ahead of now are refused (a clock a little fast is fine). */
const FUTURE_SLACK_MS = 10 * 60_000;

type WithAuthor<T> = T & { author?: { id: number; name: string } | null };

export function usualConsumption(engineClass: string): number | null {
  return engineClass in ENGINE_CLASSES ? ENGINE_CLASSES[engineClass as EngineClassId].oilConsumptionLPerH : null;
}

/** The organization's aircraft for the Oil log's picker (archived ones left out). */
export async function listOilAircraft({ orgId }: { orgId: number }): Promise<OilAircraftChoice[]> {
  const list = await listAircraft({ orgId });
  return list.map((a) => ({ id: a.id, registration: a.registration, typeLabel: a.typeLabel, airfield: a.airfield?.name ?? null }));
}

function aircraftPart(a: AircraftRecord): OilLog['aircraft'] {
  return {
    id: a.id,
    registration: a.registration,
    typeLabel: a.typeLabel,
    engineClass: a.engineClass,
    engineClassLabel: a.engineClassLabel,
    oilQuantityL: a.oilQuantityL,
    drySump: a.engineClass.includes('drysump'),
    timeZone: zoneOf(a),
    oilChangeIntervalHours: a.oilChangeIntervalHours,
    oilChangeIntervalMonths: a.oilChangeIntervalMonths,
  };
}

/** The aircraft's checks (newest first) with corrected levels, its changes, consumption and the next change. */
export async function getOilLog({ orgId, aircraftId, now = new Date() }: { orgId: number; aircraftId: number; now?: Date }): Promise<OilLog> {
  const aircraft = await getAircraft({ orgId, aircraftId });
  const { OilCheck, OilChange, User } = db();
  const author = { model: User, as: 'author', attributes: ['id', 'name'] };
  const checks = (await OilCheck.findAll({ where: { organizationId: orgId, aircraftId }, include: [author], order: [['checkedAt', 'ASC'], ['id', 'ASC']] })) as WithAuthor<OilCheck>[];
  const changes = (await OilChange.findAll({ where: { organizationId: orgId, aircraftId }, include: [author], order: [['changedAt', 'ASC'], ['id', 'ASC']] })) as WithAuthor<OilChange>[];
  const checkIn = checks.map((c) => ({ id: c.id, atMs: new Date(c.checkedAt).getTime(), levelL: c.levelL, oilTempC: c.oilTempC, engineHours: c.engineHours ?? null, addedL: c.addedL ?? 0 }));
  const changeIn = changes.map((c) => ({ id: c.id, atMs: new Date(c.changedAt).getTime(), engineHours: c.engineHours }));
  const analysis = new Map(analyseChecks(checkIn, changeIn).map((a) => [a.id, a]));
  const usual = usualConsumption(aircraft.engineClass);
  const hoursSeen = [...checkIn.map((c) => c.engineHours), ...changeIn.map((c) => c.engineHours)].filter((h): h is number => h !== null);
  const currentHours = hoursSeen.length ? Math.max(...hoursSeen) : null;
  const last = changeIn.length ? changeIn[changeIn.length - 1] : null;
  const who = (a: { id: number; name: string } | null | undefined) => (a ? { id: a.id, name: a.name } : null);
  return {
    aircraft: aircraftPart(aircraft),
    checks: checks
      .map((c) => {
        const a = analysis.get(c.id)!;
        return {
          id: c.id,
          checkedAt: new Date(c.checkedAt).toISOString(),
          levelL: c.levelL,
          correctedL: a.correctedL,
          oilTempC: c.oilTempC,
          outsideTempC: c.outsideTempC,
          bladesTurned: c.bladesTurned ?? null,
          engineHours: c.engineHours ?? null,
          addedL: c.addedL ?? 0,
          notes: c.notes ?? '',
          author: who(c.author),
          oilAgeHours: a.oilAgeHours,
          oilAgeDays: a.oilAgeDays,
          sincePreviousLPerH: a.sincePreviousLPerH,
        };
      })
      .reverse(),
    changes: changes
      .map((c) => ({
        id: c.id,
        changedAt: new Date(c.changedAt).toISOString(),
        engineHours: c.engineHours,
        oilGrade: c.oilGrade,
        quantityL: c.quantityL ?? null,
        notes: c.notes ?? '',
        author: who(c.author),
      }))
      .reverse(),
    consumption: consumptionSummary(checkIn, changeIn, usual),
    due: oilChangeDue({
      last: last ? { atMs: last.atMs, engineHours: last.engineHours } : null,
      intervalHours: aircraft.oilChangeIntervalHours,
      intervalMonths: aircraft.oilChangeIntervalMonths,
      currentHours,
      nowMs: now.getTime(),
    }),
    currentHours,
  };
}

function instant(input: DepartAtInput, zone: string, field: string, now: Date): Date {
  const ms = resolveDepartAt(input, zone);
  if (ms > now.getTime() + FUTURE_SLACK_MS) throw new Invalid([{ field, message: 'This time is still to come: enter when it happened.' }]);
  return new Date(ms);
}

async function writable(orgId: number, aircraftId: number) {
  const a = await getAircraft({ orgId, aircraftId });
  if (a.archived) throw new Conflict('This aircraft is archived: its Oil log is closed.');
  return a;
}

export async function addOilCheck({ orgId, aircraftId, userId, input, now = new Date() }: { orgId: number; aircraftId: number; userId: number; input: OilCheckInput; now?: Date }) {
  const a = await writable(orgId, aircraftId);
  const { OilCheck } = db();
  const row = await OilCheck.create({
    organizationId: orgId,
    aircraftId,
    userId,
    checkedAt: instant(input.checkedAt, zoneOf(a), 'checkedAt', now),
    levelL: input.levelL,
    oilTempC: input.oilTempC,
    outsideTempC: input.outsideTempC,
    bladesTurned: input.bladesTurned,
    engineHours: input.engineHours,
    addedL: input.addedL,
    notes: input.notes,
  });
  return { id: row.id };
}

export async function addOilChange({ orgId, aircraftId, userId, input, now = new Date() }: { orgId: number; aircraftId: number; userId: number; input: OilChangeInput; now?: Date }) {
  const a = await writable(orgId, aircraftId);
  const { OilChange } = db();
  const row = await OilChange.create({
    organizationId: orgId,
    aircraftId,
    userId,
    changedAt: instant(input.changedAt, zoneOf(a), 'changedAt', now),
    engineHours: input.engineHours,
    oilGrade: input.oilGrade,
    quantityL: input.quantityL,
    notes: input.notes,
  });
  return { id: row.id };
}

/** Removes an entry: its author may, and anyone who edits aircraft; others are refused (403). */
export async function deleteOilEntry({ orgId, aircraftId, actor, kind, entryId }: { orgId: number; aircraftId: number; actor: CurrentUser; kind: 'check' | 'change'; entryId: number }) {
  await getAircraft({ orgId, aircraftId });
  const { OilCheck, OilChange } = db();
  const where = { id: entryId, organizationId: orgId, aircraftId };
  const row = kind === 'check' ? await OilCheck.findOne({ where }) : await OilChange.findOne({ where });
  if (!row) throw new NotFound(kind === 'check' ? 'Oil check' : 'Oil change');
  if (row.userId !== actor.id && !can(actor.role, 'aircraft:edit')) throw new Forbidden('Only whoever entered it, an operator or a manager may remove this entry.');
  await row.destroy();
  return { ok: true };
}

export async function updateOilSettings({ orgId, aircraftId, settings }: { orgId: number; aircraftId: number; settings: OilSettings }) {
  await writable(orgId, aircraftId);
  const { Aircraft } = db();
  const a = await Aircraft.findOne({ where: { id: aircraftId, organizationId: orgId } });
  if (!a) throw new NotFound('Aircraft');
  if (settings.oilChangeIntervalHours !== undefined) a.oilChangeIntervalHours = settings.oilChangeIntervalHours;
  if (settings.oilChangeIntervalMonths !== undefined) a.oilChangeIntervalMonths = settings.oilChangeIntervalMonths;
  await a.save();
  return { oilChangeIntervalHours: a.oilChangeIntervalHours ?? null, oilChangeIntervalMonths: a.oilChangeIntervalMonths ?? null };
}
