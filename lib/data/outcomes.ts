import 'server-only';
import { Op, type Transaction } from 'sequelize';
import { db } from '@/models';
import type { DepartureOutcome } from '@/models/DepartureOutcome';
import type { HeatPlan } from '@/models/HeatPlan';
import { Conflict } from '@/lib/api/errors';
import { estimateBias, type BiasEstimate } from '@/lib/outcomes/stats';
import { buildSeasonReport } from '@/lib/outcomes/report';
import type { OutcomeEntry, OutcomeView } from '@/lib/outcomes/types';
import { OUTCOME_ENTRY_HOURS, type OutcomeInput } from '@/lib/validation/outcomes';
import { writeTransaction } from '@/models/transaction';
import { getDeparture, listDepartures, type Actor } from './departures';

// Morning outcomes, always scoped to one organization. A pilot records the mornings of departures they
// fly or booked; roles with 'departures:book-any' any in the organization (the same rule as changing a
// departure, so another pilot's departure is "not found"). Each outcome keeps a snapshot of what the
// stored Heat plan predicted when it was recorded, so the Season report never depends on plans being
// recomputed.

const HOUR_MS = 3_600_000;
/** A morning may be recorded from this long before the departure time (an early start). */
const EARLY_MS = 2 * HOUR_MS;

export type { OutcomeEntry, OutcomeView };

interface PlanResultLike {
  result?: { baselines?: { allNight?: { energyKWh?: number } } } | null;
}

/** What the stored plan predicted, as an outcome's snapshot. */
function snapshotOf(plan: HeatPlan | null) {
  if (!plan) return { predictedOilC: null, probabilityReady: null, energyKWh: null, usualEnergyKWh: null, planStatus: null };
  const computed = plan.result as PlanResultLike | null;
  const usual = computed?.result?.baselines?.allNight?.energyKWh;
  return {
    predictedOilC: Number.isFinite(plan.oilAtDepartureC) ? plan.oilAtDepartureC : null,
    probabilityReady: plan.probabilityReady ?? null,
    energyKWh: Number.isFinite(plan.energyKWh) ? plan.energyKWh : null,
    usualEnergyKWh: typeof usual === 'number' && Number.isFinite(usual) ? usual : null,
    planStatus: plan.status,
  };
}

function viewOf(o: DepartureOutcome, names: Map<number, string>): OutcomeView {
  return {
    departureId: o.departureId,
    flown: o.flown,
    oilAtStartC: o.oilAtStartC ?? null,
    recordedBy: o.recordedById ? { id: o.recordedById, name: names.get(o.recordedById) ?? 'Former user' } : null,
    recordedAt: new Date(o.recordedAt).toISOString(),
    predictedOilC: o.predictedOilC ?? null,
    probabilityReady: o.probabilityReady ?? null,
    readyC: o.readyC,
    energyKWh: o.energyKWh ?? null,
    usualEnergyKWh: o.usualEnergyKWh ?? null,
    notes: o.notes ?? '',
  };
}

async function namesOf(orgId: number, ids: (number | null)[], transaction?: Transaction) {
  const { User } = db();
  const want = [...new Set(ids.filter((x): x is number => !!x))];
  if (!want.length) return new Map<number, string>();
  const users = await User.findAll({ where: { organizationId: orgId, id: want }, attributes: ['id', 'name'], transaction });
  return new Map(users.map((u) => [u.id, u.name]));
}

/**
 * Records (or changes) the Morning outcome of a departure. The first recording takes the snapshot of the
 * stored plan; recording again changes what was recorded and who recorded it, and keeps the snapshot.
 */
export async function recordOutcome({ orgId, actor, departureId, input, now = new Date() }: { orgId: number; actor: Actor; departureId: number; input: OutcomeInput; now?: Date }): Promise<OutcomeView> {
  const { DepartureOutcome, HeatPlan, Aircraft } = db();
  return writeTransaction(async (transaction) => {
    const d = await getDeparture({ orgId, departureId, actor, transaction });
    if (d.cancelled) throw new Conflict('This departure was cancelled: there is no morning to record.');
    if (d.departAtMs - EARLY_MS > now.getTime()) throw new Conflict('The morning can be recorded from two hours before the departure time.');
    const existing = await DepartureOutcome.findOne({ where: { organizationId: orgId, departureId }, transaction });
    const recorded = { flown: input.flown, oilAtStartC: input.flown ? input.oilAtStartC : null, notes: input.notes, recordedById: actor.id, recordedAt: now };
    let row: DepartureOutcome;
    if (existing) {
      row = await existing.update(recorded, { transaction });
    } else {
      const plan = await HeatPlan.findOne({ where: { organizationId: orgId, departureId }, transaction });
      const ac = await Aircraft.findOne({ where: { id: d.aircraft.id, organizationId: orgId }, attributes: ['id', 'thermal'], transaction });
      const source = (ac?.thermal as { source?: string } | undefined)?.source ?? null;
      row = await DepartureOutcome.create(
        { organizationId: orgId, departureId, aircraftId: d.aircraft.id, readyC: d.readyC, thermalSource: source, ...snapshotOf(plan), ...recorded },
        { transaction },
      );
    }
    return viewOf(row, await namesOf(orgId, [row.recordedById], transaction));
  }, { retryOnUnique: true });
}

/** Removes a departure's Morning outcome (undo); nothing to remove is not an error. */
export async function deleteOutcome({ orgId, actor, departureId }: { orgId: number; actor: Actor; departureId: number }): Promise<{ removed: boolean }> {
  const { DepartureOutcome } = db();
  return writeTransaction(async (transaction) => {
    await getDeparture({ orgId, departureId, actor, transaction });
    const n = await DepartureOutcome.destroy({ where: { organizationId: orgId, departureId }, transaction });
    return { removed: n > 0 };
  });
}

/** The outcome of one departure, or null. */
export async function getOutcome({ orgId, actor, departureId }: { orgId: number; actor: Actor; departureId: number }): Promise<OutcomeView | null> {
  const { DepartureOutcome } = db();
  await getDeparture({ orgId, departureId, actor });
  const row = await DepartureOutcome.findOne({ where: { organizationId: orgId, departureId } });
  return row ? viewOf(row, await namesOf(orgId, [row.recordedById])) : null;
}

/**
 * Departures whose morning may be recorded now: not cancelled, departure time from 36 hours ago until
 * two hours ahead, with the stored plan's prediction (the entry's prefill) and any outcome so far.
 */
export async function outcomeEntries({ orgId, pilotId, aircraftId, now = new Date() }: { orgId: number; pilotId?: number; aircraftId?: number; now?: Date }): Promise<OutcomeEntry[]> {
  const { DepartureOutcome, HeatPlan } = db();
  const nowMs = now.getTime();
  const deps = await listDepartures({ orgId, fromMs: nowMs - OUTCOME_ENTRY_HOURS * HOUR_MS, toMs: nowMs + EARLY_MS, pilotId, aircraftId });
  if (!deps.length) return [];
  const ids = deps.map((d) => d.id);
  const [outcomes, plans] = await Promise.all([
    DepartureOutcome.findAll({ where: { organizationId: orgId, departureId: ids } }),
    HeatPlan.findAll({ where: { organizationId: orgId, departureId: ids }, attributes: ['departureId', 'oilAtDepartureC', 'probabilityReady'] }),
  ]);
  const names = await namesOf(orgId, outcomes.map((o) => o.recordedById));
  const outBy = new Map(outcomes.map((o) => [o.departureId, viewOf(o, names)]));
  const planBy = new Map(plans.map((p) => [p.departureId, p]));
  return deps
    .map((d) => {
      const p = planBy.get(d.id);
      const o = outBy.get(d.id) ?? null;
      return {
        departureId: d.id,
        departAt: d.departAt,
        timeZone: d.timeZone,
        aircraft: { id: d.aircraft.id, registration: d.aircraft.registration },
        pilot: d.pilot,
        readyC: d.readyC,
        predictedOilC: o?.predictedOilC ?? (p && Number.isFinite(p.oilAtDepartureC) ? p.oilAtDepartureC : null),
        probabilityReady: o?.probabilityReady ?? p?.probabilityReady ?? null,
        outcome: o,
      };
    })
    .sort((a, b) => Date.parse(b.departAt) - Date.parse(a.departAt));
}

/** An outcome with its departure time and aircraft, for the statistics and the Season report. */
export interface SeasonOutcome extends OutcomeView {
  aircraftId: number;
  departAt: string;
  thermalSource: string | null;
}

/** Every outcome of departures in [fromMs, toMs), optionally of one aircraft, earliest first. */
export async function listOutcomes({ orgId, fromMs, toMs, aircraftId }: { orgId: number; fromMs: number; toMs: number; aircraftId?: number }): Promise<SeasonOutcome[]> {
  const { DepartureOutcome, Departure } = db();
  const rows = await DepartureOutcome.findAll({
    where: { organizationId: orgId, ...(aircraftId ? { aircraftId } : {}) },
    include: [{ model: Departure, as: 'departure', attributes: ['departAt', 'organizationId'], required: true, where: { organizationId: orgId, departAt: { [Op.gte]: new Date(fromMs), [Op.lt]: new Date(toMs) } } }],
  });
  const names = await namesOf(orgId, rows.map((o) => o.recordedById));
  return rows
    .map((o) => {
      const dep = (o as unknown as { departure: { departAt: Date } }).departure;
      return { ...viewOf(o, names), aircraftId: o.aircraftId, departAt: new Date(dep.departAt).toISOString(), thermalSource: o.thermalSource ?? null };
    })
    .sort((a, b) => Date.parse(a.departAt) - Date.parse(b.departAt));
}

/** The error of one flown outcome with a prediction: recorded − predicted, K. */
export function errorOf(o: Pick<OutcomeView, 'flown' | 'oilAtStartC' | 'predictedOilC'>): number | null {
  return o.flown && o.oilAtStartC !== null && o.predictedOilC !== null ? o.oilAtStartC - o.predictedOilC : null;
}

/**
 * Per aircraft: the posterior bias of the predicted oil at start and the predictive model-error σ from
 * its Morning outcomes (lib/outcomes/stats.ts: a conjugate Normal–scaled-inverse-χ² update centred on
 * zero bias with the class prior). Aircraft without outcomes get the prior. For the planner to use.
 */
export async function outcomeStatsByAircraft({ orgId, aircraftIds, now = new Date(), days = 365 }: { orgId: number; aircraftIds?: number[]; now?: Date; days?: number }): Promise<Map<number, BiasEstimate>> {
  const { Aircraft } = db();
  const fleet = await Aircraft.findAll({ where: { organizationId: orgId, ...(aircraftIds ? { id: aircraftIds } : {}) }, attributes: ['id', 'thermal'] });
  const outs = await listOutcomes({ orgId, fromMs: now.getTime() - days * 24 * HOUR_MS, toMs: now.getTime() + HOUR_MS });
  const errs = new Map<number, number[]>();
  for (const o of outs) {
    const e = errorOf(o);
    if (e !== null) errs.set(o.aircraftId, [...(errs.get(o.aircraftId) ?? []), e]);
  }
  return new Map(fleet.map((a) => [a.id, estimateBias(errs.get(a.id) ?? [], (a.thermal as { source?: string } | null)?.source)]));
}

/** The Season report of departures in [fromMs, toMs) (lib/outcomes/report.ts). */
export async function seasonReport({ orgId, fromMs, toMs }: { orgId: number; fromMs: number; toMs: number }) {
  const { Aircraft } = db();
  const [outs, fleet] = await Promise.all([
    listOutcomes({ orgId, fromMs, toMs }),
    Aircraft.findAll({ where: { organizationId: orgId }, attributes: ['id', 'registration', 'thermal'], order: [['registration', 'ASC']] }),
  ]);
  return buildSeasonReport(
    outs,
    fleet.map((a) => ({ id: a.id, registration: a.registration, thermalSource: (a.thermal as { source?: string } | null)?.source ?? null })),
  );
}
