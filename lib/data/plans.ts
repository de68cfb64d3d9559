import 'server-only';
import crypto from 'node:crypto';
import { db } from '@/models';
import { NotFound } from '@/lib/api/errors';
import { planDeparture, windowMinimum } from '@/lib/planner';
import type { PlanResult } from '@/lib/planner/types';
import { simulate } from '@/lib/thermal';
import { withHeater } from '@/lib/planner/model';
import { MAX_SOAK_HOURS, plannedHeaterFor, planRequestFor, primaryHeater, soakModelFor, type PlanRecords } from '@/lib/plans/build';
import { forecastFor } from './forecasts';
import { getDeparture, listDepartures, type Actor, type DepartureRecord } from './departures';
import { tariffPeriodsBetween, tariffsFor, type TariffRecord } from './tariffs';
import type { Airfield } from '@/models/Airfield';
import type { Forecast } from '@/models/Forecast';
import type { HeatPlan } from '@/models/HeatPlan';
import type { InferCreationAttributes } from 'sequelize';

// Heat plans: computed from the departure, the aircraft and its heaters, the shelter, the airfield's
// cached forecast and tariff; stored with a fingerprint of those inputs, recomputed when it changes.

import { worstReadiness, type Readiness } from '@/lib/plans/state';
import { frostRisk } from '@/lib/plans/frost';
import { makerVerdict } from '@/lib/plans/maker-rule';
import { ENGINE_CLASSES, type EngineClassId } from '@/lib/thermal/presets';
import { COVER_OFF_PROBABILITY, FITTED_LOSS_REL_SIGMA, planForChance, PRESET_ERRORS, PRESET_LOSS_REL_SIGMA, type ChanceBreakdown, type ErrorModel } from '@/lib/planner/chance';
import type { BiasEstimate } from '@/lib/outcomes/stats';
import { outcomeStatsByAircraft } from './outcomes';
export type { PlanView } from '@/lib/views/plans';
import type { PlanView } from '@/lib/views/plans';
export type { Readiness };

/** Plans are recomputed at most this often for the same inputs (the clock moves the earliest switch-on). */
const NOW_STEP_MS = 10 * 60_000;
const iso = (ms: number | null | undefined) => (ms === null || ms === undefined ? null : new Date(ms).toISOString());


interface Context {
  forecasts: Map<number, Forecast | null>;
  tariffs: Map<number, TariffRecord>;
  now: Date;
  /** The organization's "plan to be ready with this chance". */
  targetChance: number;
  /** What each aircraft's morning outcomes taught (bias and σ), by aircraft id. */
  outcomes: Map<number, BiasEstimate>;
}

/** Hotter than this, a heated oil node is not believable: pad thermostats and the oil itself stop short of it (estimate). */
const MAX_HEATED_OIL_C = 100;

/** Outcomes take over from the preset's error figures once there are this many mornings. */
const OUTCOMES_TRUSTED_FROM = 3;

/**
 * The error sources for an aircraft: a class preset's (or fitted profile's) heat-loss σ, the heater
 * tolerance and the cover; once enough mornings are recorded, their posterior bias and predictive σ
 * replace the model, heater and cover terms (the recorded errors contain them; the forecast term stays,
 * which counts it twice and errs towards caution).
 */
function errorModelFor(d: DepartureRecord, ctx: Context): ErrorModel {
  const o = ctx.outcomes.get(d.aircraft.id);
  if (o && o.n >= OUTCOMES_TRUSTED_FROM) return { lossRelSigma: 0, powerRelSigma: 0, coverOffProbability: 0, biasK: o.biasK, outcomeSigmaK: o.predictiveSigmaK };
  const fitted = d.aircraft.thermal.source === 'fitted';
  return { ...PRESET_ERRORS, lossRelSigma: fitted ? FITTED_LOSS_REL_SIGMA : PRESET_LOSS_REL_SIGMA, coverOffProbability: d.aircraft.coverOnByDefault ? COVER_OFF_PROBABILITY : 0 };
}

function recordsFor(d: DepartureRecord, ctx: Context): PlanRecords | null {
  const af = d.aircraft.airfield;
  const fc = af ? ctx.forecasts.get(af.id) : null;
  if (!af || !fc || !fc.hours?.length) return null;
  const tariff = ctx.tariffs.get(af.id) ?? null;
  // Prices from before the earliest possible switch-on (now, or the soak start) to after departure.
  const startMs = Math.min(ctx.now.getTime(), d.departAtMs - MAX_SOAK_HOURS * 3_600_000) - 3_600_000;
  return {
    departure: { id: d.id, departAtMs: d.departAtMs, readyC: d.readyC, floorC: d.floorC, holdMinutes: d.holdMinutes },
    aircraft: {
      engineClass: d.aircraft.engineClass,
      thermal: d.aircraft.thermal,
      coverOnByDefault: d.aircraft.coverOnByDefault,
      lastShutdownAtMs: d.aircraft.lastShutdownAt ? Date.parse(d.aircraft.lastShutdownAt) : null,
      lastShutdownOilC: d.aircraft.lastShutdownOilC,
      engineReadyC: d.aircraft.engineReadyC,
      makerRule: d.aircraft.makerRule,
    },
    heaters: d.aircraft.heaters.map((h) => ({ kind: h.kind, powerW: h.powerW, node: h.node, control: h.control, slotMinutes: h.slotMinutes })),
    shelter: d.aircraft.shelter,
    site: { lat: af.latitude, lon: af.longitude },
    hours: fc.hours,
    tariff: tariffPeriodsBetween({ tariff, timeZone: af.timeZone, fromMs: startMs, toMs: d.departAtMs + (d.holdMinutes + 60) * 60_000 }).map((p) => ({
      fromMs: p.fromMs,
      toMs: p.toMs,
      pricePerKWh: p.pricePerKWh,
    })),
    forecastIssuedAtMs: fc.fetchedAt ? new Date(fc.fetchedAt).getTime() : null,
    chance: { target: ctx.targetChance, errors: errorModelFor(d, ctx) },
  };
}

function keyOf(r: PlanRecords, nowMs: number) {
  const h = crypto.createHash('sha256');
  h.update(JSON.stringify({ ...r, hours: r.hours.length, issued: r.forecastIssuedAtMs, now: Math.floor(nowMs / NOW_STEP_MS) }));
  h.update(JSON.stringify(r.hours));
  return h.digest('hex');
}

interface Computed {
  status: Readiness;
  result: PlanResult | null;
  freeOilC: number | null;
  problem?: string;
  /** The chance's breakdown by source and the target it was planned for. */
  chance?: { target: number; meetsTarget: boolean; breakdown: ChanceBreakdown };
}

function compute(r: PlanRecords, nowMs: number): Computed {
  const model = soakModelFor(r);
  // The maker's rule first: a departure that meets it unheated needs no heat (no plan, no warning).
  const rule = r.aircraft.makerRule;
  if (rule) {
    const startOil = ENGINE_CLASSES[r.aircraft.engineClass as EngineClassId]?.readinessOil ?? 'oil';
    const v = makerVerdict(model, rule, { departureMs: r.departure.departAtMs, holdMinutes: r.departure.holdMinutes, startOil });
    if (v.noHeatNeeded) return { status: 'no-heat', result: null, freeOilC: simulate(model, { atMs: [r.departure.departAtMs] }).oilC[0] };
  }
  const req = planRequestFor(r, Math.floor(nowMs / NOW_STEP_MS) * NOW_STEP_MS, model);
  if (!req) {
    const s = simulate(model, { atMs: [r.departure.departAtMs] });
    const free = s.oilC[0];
    // Ready without heat only if the oil holds through the start window too.
    const dep = r.departure.departAtMs;
    const w = windowMinimum(model, dep, dep + (r.departure.holdMinutes ?? 0) * 60_000);
    return { status: w.oilC >= r.departure.readyC ? 'ready' : 'unplanned', result: null, freeOilC: free };
  }
  if (!r.chance) {
    const result = planDeparture(req);
    return { status: result.status, result, freeOilC: result.freeOilAtDepartureC };
  }
  // Plans aim at the organization's chance, counting every error source, not the forecast alone.
  const c = planForChance(req, r.chance.target, r.chance.errors);
  const chance = { target: c.targetChance, meetsTarget: c.meetsTarget, breakdown: c.breakdown };
  // A plan that reaches the engine's thresholds only by overheating the oil is no plan: a pad's
  // thermostat and the oil itself set a limit (MAX_HEATED_OIL_C, estimate). Say so instead of showing it.
  if (c.result.heaterOn.length) {
    const heated = simulate(withHeater(req.model, req.heater, c.result.heaterOn), { outputEveryMinutes: 10 });
    const hottest = Math.max(...heated.oilC);
    if (hottest > MAX_HEATED_OIL_C) {
      return {
        status: 'short',
        result: { ...c.result, status: 'short' },
        freeOilC: c.result.freeOilAtDepartureC,
        chance,
        problem: `Only by overheating the oil (${Math.round(hottest)} °C): this heater cannot warm the whole engine; fit a heater on the engine (cylinder bands or a sump pad on the engine side)`,
      };
    }
  }
  return { status: c.result.status, result: c.result, freeOilC: c.result.freeOilAtDepartureC, chance };
}

/** A heat plan is "on track" only at or above the organization's chance; below it, say the chance and what would raise it. */
function chanceSummary(c: Computed): string | null {
  if (!c.chance || c.status !== 'warming' || !c.result) return null;
  const pct = (p: number) => `${Math.round(p * 100)} %`;
  if (c.chance.meetsTarget) return `Heat plan on track: ${pct(c.result.probabilityReady)} chance (aim ${pct(c.chance.target)})`;
  return `Only ${pct(c.result.probabilityReady)} chance of being ready (aim ${pct(c.chance.target)}): a cover, a stronger heater, a warmer shelter or a later departure would raise it`;
}

function summaryOf(status: Readiness, v: { heater: PlanView['heater']; fix: PlanView['fix'] }): string {
  switch (status) {
    case 'no-heat':
      return 'No heat needed by the engine maker’s rule (estimate: follow the manual)';
    case 'ready':
      return 'Warm enough without heat';
    case 'warming':
      return 'Heat plan on track';
    case 'short':
      return v.fix?.readyAt ? 'Cannot be ready in time' : 'Heater too weak to reach the ready temperature';
    default:
      return v.heater ? 'Needs heat, no plan' : 'Needs heat: no heater fitted';
  }
}

function viewOf(d: DepartureRecord, c: Computed, plan: { computedAt: Date; confirmedBy: string | null; confirmedAt: Date | null } | null, ctx: Context, currency: string): PlanView {
  const r = c.result;
  const heater = primaryHeater(d.aircraft.heaters);
  const af = d.aircraft.airfield;
  const fc = af ? ctx.forecasts.get(af.id) : null;
  const fix = r?.fix ? { readyAt: iso(r.fix.readyAtMs), powerNeededW: r.fix.powerNeededW } : null;
  const heaterView = heater ? { kind: heater.kind, kindLabel: heater.kindLabel, powerW: heater.powerW, control: heater.control } : null;
  const base = r ? [r.baselines.allNight, ...r.baselines.hoursBefore] : [];
  return {
    departureId: d.id,
    departAt: d.departAt,
    readyC: d.readyC,
    floorC: d.floorC,
    holdMinutes: d.holdMinutes,
    hold: r?.hold ? { until: iso(r.hold.untilMs)!, minOilC: r.hold.minOilC, minEngineC: r.hold.minEngineC ?? null, heaterOn: r.hold.heaterOn } : null,
    notes: d.notes,
    aircraft: { id: d.aircraft.id, registration: d.aircraft.registration, typeLabel: d.aircraft.typeLabel, engineClassLabel: d.aircraft.engineClassLabel, coverOnByDefault: d.aircraft.coverOnByDefault },
    pilot: d.pilot,
    airfield: af ? { id: af.id, name: af.name, ident: af.ident, timeZone: af.timeZone } : null,
    shelter: d.aircraft.shelter ? { name: d.aircraft.shelter.name, kind: d.aircraft.shelter.kind } : null,
    heater: heaterView,
    status: c.status,
    summary: c.problem ?? chanceSummary(c) ?? summaryOf(c.status, { heater: heaterView, fix }),
    chance: c.chance
      ? {
          target: c.chance.target,
          meetsTarget: c.chance.meetsTarget,
          forecastK: c.chance.breakdown.forecastK,
          aircraftK: c.chance.breakdown.aircraftK,
          heaterK: c.chance.breakdown.heaterK,
          outcomesK: c.chance.breakdown.outcomesK,
          biasK: c.chance.breakdown.expectedOilC - (r?.oilAtDepartureC ?? c.chance.breakdown.expectedOilC),
          coverDropK: c.chance.breakdown.coverDropK,
          coverOffProbability: c.chance.breakdown.coverOffProbability,
        }
      : null,
    mode: r?.mode ?? null,
    switchOnAt: r && r.heaterOn.length ? iso(r.switchOnAtMs ?? r.heaterOn[0].fromMs) : null,
    heaterOn: (r?.heaterOn ?? []).map((i) => ({ from: iso(i.fromMs)!, to: iso(i.toMs)! })),
    oilAtDepartureC: r ? r.oilAtDepartureC : c.freeOilC,
    freeOilAtDepartureC: c.freeOilC,
    probabilityReady: r ? r.probabilityReady : null,
    energyKWh: r?.energyKWh ?? 0,
    cost: r?.cost ?? null,
    currency,
    fix: c.status === 'short' ? fix : null,
    baselines: base.map((b) => ({
      rule: b.rule,
      hours: b.hours,
      energyKWh: b.energyKWh,
      cost: b.cost ?? null,
      oilAtDepartureC: b.oilAtDepartureC,
      meetsReady: b.meetsReady,
      savedKWh: b.saved.energyKWh,
      savedCost: b.saved.cost ?? null,
    })),
    floor: r?.floor ? { minOilC: r.floor.minOilC, met: r.floor.met } : null,
    confirmed: plan?.confirmedAt && plan.confirmedBy ? { by: plan.confirmedBy, at: plan.confirmedAt.toISOString() } : null,
    computedAt: (plan?.computedAt ?? ctx.now).toISOString(),
    forecast: fc ? { fetchedAt: fc.fetchedAt ? new Date(fc.fetchedAt).toISOString() : null, stale: !!fc.lastErrorKind } : null,
    frost: frostOf(d, fc),
    warnings: d.aircraft.heaterWarnings ?? [],
    readyLowered: d.readyLowered ?? null,
  };
}

function frostOf(d: DepartureRecord, fc: Forecast | null | undefined): PlanView['frost'] {
  const af = d.aircraft.airfield;
  if (!af || !fc?.hours?.length) return null;
  const hours = fc.hours.map((h) => ({ atMs: Date.parse(h.at), tempC: h.tempC, dewPointC: h.dewPointC, windMps: h.windMps, cloudFraction: h.cloudFraction }));
  const r = frostRisk({ hours, shelterKind: d.aircraft.shelter?.kind ?? null, departAtMs: d.departAtMs, lat: af.latitude, lon: af.longitude });
  return r ? { likely: r.likely, hours: r.hours, from: iso(r.fromMs), to: iso(r.toMs) } : null;
}

async function contextFor(orgId: number, departures: DepartureRecord[], now: Date, refresh: 'never' | 'if-old'): Promise<Context> {
  const { Airfield } = db();
  const ids = [...new Set(departures.map((d) => d.aircraft.airfield?.id).filter((x): x is number => !!x))];
  const airfields = ids.length ? await Airfield.findAll({ where: { organizationId: orgId, id: ids } }) : [];
  const forecasts = new Map<number, Forecast | null>();
  await Promise.all(airfields.map(async (a: Airfield) => forecasts.set(a.id, await forecastFor({ airfield: a, now, refresh }))));
  const tariffs = await tariffsFor({ orgId, airfieldIds: ids });
  const aircraftIds = [...new Set(departures.map((d) => d.aircraft.id))];
  const [org, outcomes] = await Promise.all([
    db().Organization.findByPk(orgId, { attributes: ['id', 'targetChance'] }),
    aircraftIds.length ? outcomeStatsByAircraft({ orgId, aircraftIds, now }) : Promise.resolve(new Map<number, BiasEstimate>()),
  ]);
  return { forecasts, tariffs, now, targetChance: org?.targetChance ?? 0.9, outcomes };
}

type StoredPlan = Omit<InferCreationAttributes<HeatPlan>, 'id' | 'createdAt' | 'updatedAt' | 'confirmedById' | 'confirmedAt' | 'confirmedKey'>;

/**
 * Stores a computed plan with one upsert on the departure's unique key, so simultaneous readers and the
 * plan job leave one row per departure and none of them fails; a confirmation lapses unless it was given
 * for these inputs (`keepConfirmation`).
 */
async function storePlan(values: StoredPlan, keepConfirmation: boolean): Promise<HeatPlan> {
  const { HeatPlan } = db();
  const v = keepConfirmation ? values : { ...values, confirmedAt: null, confirmedById: null, confirmedKey: null };
  await HeatPlan.upsert(v, { conflictFields: ['departureId'], fields: Object.keys(v) as (keyof StoredPlan)[] });
  const row = await HeatPlan.findOne({ where: { organizationId: values.organizationId, departureId: values.departureId } });
  if (!row) throw new Error('heat plan: the stored plan was not found');
  return row;
}

/**
 * Plans for the given departures: each is read from its stored Heat plan when the inputs are unchanged,
 * otherwise recomputed and stored (a confirmation lapses when the inputs change).
 */
async function plansFor(orgId: number, departures: DepartureRecord[], now: Date, refresh: 'never' | 'if-old', given?: Context): Promise<PlanView[]> {
  if (!departures.length) return [];
  const { HeatPlan, User } = db();
  const ctx = given ?? (await contextFor(orgId, departures, now, refresh));
  const stored = await HeatPlan.findAll({ where: { organizationId: orgId, departureId: departures.map((d) => d.id) } });
  const byDep = new Map(stored.map((p) => [p.departureId, p]));
  const confirmers = new Map(
    (await User.findAll({ where: { organizationId: orgId, id: stored.map((p) => p.confirmedById).filter((x): x is number => !!x) }, attributes: ['id', 'name'] })).map((u) => [u.id, u.name]),
  );
  const out: PlanView[] = [];
  for (const d of departures) {
    const currency = d.aircraft.airfield ? (ctx.tariffs.get(d.aircraft.airfield.id)?.currency ?? 'EUR') : 'EUR';
    const rec = recordsFor(d, ctx);
    if (!rec) {
      out.push({ ...viewOf(d, { status: 'unplanned', result: null, freeOilC: null }, null, ctx, currency), summary: 'No forecast yet for this airfield', problem: 'no-forecast' });
      continue;
    }
    let row = byDep.get(d.id);
    // Once a stored plan's switch-on time has come, the heater is on by that plan: the plan keeps its own
    // clock, so it (and its switch-on time on every page, alert and e-mail) stays put until another input
    // changes. Recomputing from "now" would restart the plan as if the oil had not been heated.
    const underWay = !!row?.switchOnAt && row.switchOnAt.getTime() <= now.getTime();
    const key = keyOf(rec, underWay ? row!.computedAt.getTime() : now.getTime());
    let computed: Computed;
    if (row && row.inputsKey === key) {
      computed = row.result as Computed;
    } else {
      try {
        computed = compute(rec, now.getTime());
      } catch (err) {
        // One aircraft's bad data must not take the board down: show it as needing attention.
        console.error(`[thawline] heat plan for departure ${d.id} failed`, err);
        out.push({ ...viewOf(d, { status: 'unplanned', result: null, freeOilC: null }, null, ctx, currency), summary: 'Could not compute a plan: check the aircraft profile', problem: 'plan-failed' });
        continue;
      }
      const values = {
        organizationId: orgId,
        departureId: d.id,
        inputsKey: key,
        computedAt: now,
        status: computed.status,
        switchOnAt: computed.result?.heaterOn.length ? new Date(computed.result.switchOnAtMs ?? computed.result.heaterOn[0].fromMs) : null,
        oilAtDepartureC: computed.result?.oilAtDepartureC ?? computed.freeOilC ?? 0,
        energyKWh: computed.result?.energyKWh ?? 0,
        cost: computed.result?.cost ?? null,
        probabilityReady: computed.result?.probabilityReady ?? null,
        result: computed,
      };
      row = await storePlan(values, row?.confirmedKey === key);
    }
    const confirmed = row.confirmedKey === row.inputsKey && row.confirmedById ? confirmers.get(row.confirmedById) ?? null : null;
    out.push(viewOf(d, computed, { computedAt: row.computedAt, confirmedBy: confirmed, confirmedAt: confirmed ? row.confirmedAt : null }, ctx, currency));
  }
  return out;
}

function bySwitchOn(a: PlanView, b: PlanView) {
  const ta = a.switchOnAt ? Date.parse(a.switchOnAt) : Date.parse(a.departAt);
  const tb = b.switchOnAt ? Date.parse(b.switchOnAt) : Date.parse(b.departAt);
  return ta - tb || Date.parse(a.departAt) - Date.parse(b.departAt);
}

/** The window of "the next morning": from half an hour ago to 36 hours ahead (covers tomorrow morning at any hour of today). */
export function nextMorningWindow(now: Date) {
  return { fromMs: now.getTime() - 30 * 60_000, toMs: now.getTime() + 36 * 3_600_000 };
}

/** The Morning board: the next morning's departures, in switch-on order, with totals. */
export async function morningBoard({ orgId, now = new Date(), airfieldId, refresh = 'if-old' }: { orgId: number; now?: Date; airfieldId?: number; refresh?: 'never' | 'if-old' }) {
  const w = nextMorningWindow(now);
  const deps = await listDepartures({ orgId, fromMs: w.fromMs, toMs: w.toMs, airfieldId });
  const plans = (await plansFor(orgId, deps, now, refresh)).sort(bySwitchOn);
  const totals = plans.reduce(
    (t, p) => ({ energyKWh: t.energyKWh + p.energyKWh, cost: t.cost + (p.cost ?? 0) }),
    { energyKWh: 0, cost: 0 },
  );
  const counts = { 'no-heat': 0, ready: 0, warming: 0, short: 0, unplanned: 0 } as Record<Readiness, number>;
  for (const p of plans) counts[p.status]++;
  return { generatedAt: now.toISOString(), window: { from: iso(w.fromMs)!, to: iso(w.toMs)! }, plans, totals, counts };
}

/** A pilot's upcoming departures with their plans. */
export async function pilotPlans({ orgId, pilotId, now = new Date(), days = 8 }: { orgId: number; pilotId: number; now?: Date; days?: number }) {
  const deps = await listDepartures({ orgId, fromMs: now.getTime() - 30 * 60_000, toMs: now.getTime() + days * 86_400_000, pilotId });
  return plansFor(orgId, deps, now, 'if-old');
}

/** Plans for any departures in a window (alerts, calendar, map). */
export async function plansBetween({ orgId, fromMs, toMs, now = new Date(), refresh = 'never' }: { orgId: number; fromMs: number; toMs: number; now?: Date; refresh?: 'never' | 'if-old' }) {
  const deps = await listDepartures({ orgId, fromMs, toMs });
  return plansFor(orgId, deps, now, refresh);
}

/** One departure's plan and its Soak forecast curve (with the plan's heater bands). */
export async function planDetail({ orgId, departureId, actor, now = new Date() }: { orgId: number; departureId: number; actor: Actor; now?: Date }) {
  const d = await getDeparture({ orgId, departureId, actor });
  // One read of the forecast and tariff serves both the plan and its curve.
  const ctx = await contextFor(orgId, [d], now, 'if-old');
  const [view] = await plansFor(orgId, [d], now, 'if-old', ctx);
  const rec = recordsFor(d, ctx);
  let series: { at: string; outsideC: number; shelterC: number; oilC: number; engineC: number | null }[] = [];
  if (rec) {
    const model = soakModelFor(rec);
    const heater = plannedHeaterFor(rec, model);
    const on = view.heaterOn.map((i) => ({ fromMs: Date.parse(i.from), toMs: Date.parse(i.to) }));
    const m = heater && on.length ? withHeater(model, heater, on) : model;
    const s = simulate(m, { outputEveryMinutes: 10 });
    series = Array.from(s.atMs, (t, i) => ({
      at: iso(t)!,
      outsideC: round2(s.outsideC[i]),
      shelterC: round2(s.shelterC[i]),
      oilC: round2(s.oilC[i]),
      engineC: s.engineC ? round2(s.engineC[i]) : null,
    }));
  }
  return { plan: view, series };
}

const round2 = (v: number) => Math.round(v * 100) / 100;

/** An operator confirms the plan as computed now; a later change of inputs needs a new confirmation. */
export async function confirmPlan({ orgId, departureId, userId, now = new Date() }: { orgId: number; departureId: number; userId: number; now?: Date }) {
  const d = await getDeparture({ orgId, departureId });
  const [view] = await plansFor(orgId, [d], now, 'never');
  const { HeatPlan } = db();
  const row = await HeatPlan.findOne({ where: { organizationId: orgId, departureId } });
  if (!row) throw new NotFound('Heat plan');
  await row.update({ confirmedById: userId, confirmedAt: now, confirmedKey: row.inputsKey });
  return { ...view, confirmed: { by: 'you', at: now.toISOString() } };
}

/** For the Site map: the worst readiness of each airfield's next-morning departures, and how many there are. */
export async function readinessByAirfield({ orgId, now = new Date(), refresh = 'never' }: { orgId: number; now?: Date; refresh?: 'never' | 'if-old' }) {
  const board = await morningBoard({ orgId, now, refresh });
  const out = new Map<number, { readiness: Readiness; departures: number; counts: Record<Readiness, number> }>();
  for (const p of board.plans) {
    if (!p.airfield) continue;
    const cur = out.get(p.airfield.id) ?? { readiness: p.status, departures: 0, counts: { 'no-heat': 0, ready: 0, warming: 0, short: 0, unplanned: 0 } };
    cur.readiness = worstReadiness([cur.readiness, p.status])!;
    cur.departures++;
    cur.counts[p.status]++;
    out.set(p.airfield.id, cur);
  }
  return out;
}

/** Plans for departures already loaded (the departures page), computed or read as usual. */
export async function plansForDepartures({ orgId, departures, now = new Date() }: { orgId: number; departures: DepartureRecord[]; now?: Date }) {
  const upcoming = departures.filter((d) => !d.cancelled && d.departAtMs > now.getTime() - 30 * 60_000);
  return plansFor(orgId, upcoming, now, 'if-old');
}
