import 'server-only';
import { db } from '@/models';
import { Tariff } from '@/models/Tariff';
import { NotFound } from '@/lib/api/errors';
import { tariffPeriodsBetween } from '@/lib/tariffs/expand';
import { DEFAULT_TARIFF, type TariffInput, type TariffShape } from '@/lib/validation/tariffs';
import { writeTransaction } from '@/models/transaction';
import type { PricedInterval, TariffRecord } from '@/lib/views/tariffs';

export type { PricedInterval, TariffRecord };
export { tariffPeriodsBetween };

export { DEFAULT_TARIFF, type TariffShape };

// Time-of-use tariffs per airfield, scoped to one organization; an airfield with none stored uses
// DEFAULT_TARIFF (a flat price, marked "default").

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

