import 'server-only';
import { db } from '@/models';
import { Tariff } from '@/models/Tariff';
import { NotFound } from '@/lib/api/errors';
import { offsetSecondsAt } from '@/lib/time';
import { DEFAULT_TARIFF, type TariffInput, type TariffShape } from '@/lib/validation/tariffs';
import { writeTransaction } from '@/models/transaction';

export { DEFAULT_TARIFF, type TariffShape };

// Time-of-use tariffs per airfield, scoped to one organization; an airfield with none stored uses
// DEFAULT_TARIFF (a flat price, marked "default").

const HOUR_MS = 3_600_000;
/** Longest span tariffPeriodsBetween expands (a guard against runaway loops). */
const MAX_SPAN_MS = 400 * 24 * HOUR_MS;

export interface TariffRecord extends TariffShape {
  airfieldId: number;
  airfieldName: string;
  /** The airfield's zone: the schedule's hours are local hours there. */
  timeZone: string;
  source: 'stored' | 'default';
  updatedAt: string | null;
}

export interface PricedInterval {
  fromMs: number;
  toMs: number;
  pricePerKWh: number;
  /** The period's name ("Night", "Peak" …). */
  period: string;
}

async function airfieldOf({ orgId, airfieldId }: { orgId: number; airfieldId: number }) {
  const { Airfield } = db();
  const af = await Airfield.findOne({ where: { id: airfieldId, organizationId: orgId } });
  if (!af) throw new NotFound('Airfield');
  return af;
}

function record(af: { id: number; name: string; timeZone: string }, t: Tariff | null): TariffRecord {
  const base = { airfieldId: af.id, airfieldName: af.name, timeZone: af.timeZone };
  if (!t) return { ...base, ...structuredClone(DEFAULT_TARIFF), source: 'default', updatedAt: null };
  return {
    ...base,
    currency: t.currency,
    periods: t.periods,
    weekdaySchedule: t.weekdaySchedule,
    weekendSchedule: t.weekendSchedule,
    source: 'stored',
    updatedAt: new Date(t.updatedAt).toISOString(),
  };
}

/** The airfield's tariff, or the flat default (source "default") when none is stored. */
export async function getTariff({ orgId, airfieldId }: { orgId: number; airfieldId: number }): Promise<TariffRecord> {
  const af = await airfieldOf({ orgId, airfieldId });
  const t = await Tariff.findOne({ where: { airfieldId: af.id, organizationId: orgId } });
  return record(af, t);
}

/** Tariffs of several airfields at once (default where none is stored), by airfield id. */
export async function tariffsFor({ orgId, airfieldIds }: { orgId: number; airfieldIds: number[] }): Promise<Map<number, TariffRecord>> {
  const { Airfield } = db();
  const ids = [...new Set(airfieldIds)];
  if (!ids.length) return new Map();
  const [fields, rows] = await Promise.all([
    Airfield.findAll({ where: { id: ids, organizationId: orgId } }),
    Tariff.findAll({ where: { airfieldId: ids, organizationId: orgId } }),
  ]);
  return new Map(fields.map((f) => [f.id, record(f, rows.find((r) => r.airfieldId === f.id) ?? null)]));
}

/** Stores (or replaces) the airfield's tariff. */
export async function putTariff({ orgId, airfieldId, input }: { orgId: number; airfieldId: number; input: TariffInput }): Promise<TariffRecord> {
  db();
  const af = await airfieldOf({ orgId, airfieldId });
  return writeTransaction(async (transaction) => {
    let t = await Tariff.findOne({ where: { airfieldId: af.id, organizationId: orgId }, transaction });
    if (!t) t = Tariff.build({ organizationId: orgId, airfieldId: af.id, ...input });
    else t.set({ ...input });
    t.changed('periods', true);
    t.changed('weekdaySchedule', true);
    t.changed('weekendSchedule', true);
    await t.save({ transaction });
    return record(af, t);
  });
}

/** Removes the stored tariff: the airfield goes back to the flat default. */
export async function clearTariff({ orgId, airfieldId }: { orgId: number; airfieldId: number }): Promise<TariffRecord> {
  const af = await airfieldOf({ orgId, airfieldId });
  await Tariff.destroy({ where: { airfieldId: af.id, organizationId: orgId } });
  return record(af, null);
}

/**
 * The price over [fromMs, toMs) as consecutive intervals, reading the month × hour schedule in the
 * airfield's local time (weekday or weekend by the local date). Local hours are found from the zone's
 * offset at each instant (Intl), so a daylight-saving change gives a 23- or 25-hour day with the
 * skipped hour absent and the repeated hour priced twice. Adjacent hours of the same period merge.
 * A null tariff is the flat default.
 */
export function tariffPeriodsBetween({ tariff, timeZone, fromMs, toMs }: { tariff: TariffShape | null; timeZone: string; fromMs: number; toMs: number }): PricedInterval[] {
  const t = tariff ?? DEFAULT_TARIFF;
  if (!Number.isFinite(fromMs) || !Number.isFinite(toMs)) throw new RangeError('tariffPeriodsBetween needs finite bounds');
  if (toMs - fromMs > MAX_SPAN_MS) throw new RangeError('tariffPeriodsBetween spans at most 400 days');
  const out: PricedInterval[] = [];
  let at = fromMs;
  while (at < toMs) {
    const offsetMs = offsetSecondsAt(timeZone, at) * 1000;
    const local = new Date(at + offsetMs);
    const weekend = local.getUTCDay() === 0 || local.getUTCDay() === 6;
    const idx = (weekend ? t.weekendSchedule : t.weekdaySchedule)[local.getUTCMonth()]?.[local.getUTCHours()] ?? 0;
    const period = t.periods[idx] ?? t.periods[0];
    // The next local hour boundary, at the offset in force now; a change of offset there is picked up next turn.
    let next = Math.floor((at + offsetMs) / HOUR_MS) * HOUR_MS + HOUR_MS - offsetMs;
    if (next <= at) next = at + HOUR_MS;
    const end = Math.min(next, toMs);
    const last = out[out.length - 1];
    if (last && last.toMs === at && last.pricePerKWh === period.pricePerKWh && last.period === period.name) last.toMs = end;
    else out.push({ fromMs: at, toMs: end, pricePerKWh: period.pricePerKWh, period: period.name });
    at = end;
  }
  return out;
}
