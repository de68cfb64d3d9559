// The slot grid and what a slot costs.
//
// Slots end at departure and step back by the control's granularity to the earliest switch-on; the
// first slot is shorter when the span is not a whole number of slots. A slot's price is the
// energy-weighted mean of the tariff periods it overlaps, so the cost of any on/off schedule on the
// grid is exact, tariff edges inside slots included.
import { PlanInputError, type Interval, type TariffPeriod } from './types';

/** Slots in time order: [earliest, …, departure − Δ, departure]. Empty when earliest ≥ departure. */
export function slotGrid(earliestMs: number, departureMs: number, slotMs: number): Interval[] {
  const out: Interval[] = [];
  for (let to = departureMs; to > earliestMs; to -= slotMs) out.push({ fromMs: Math.max(earliestMs, to - slotMs), toMs: to });
  return out.reverse();
}

export interface Pricing {
  /** Price per kWh over [fromMs, toMs): Σ overlap × price / duration; throws on a gap. */
  energyCost(fromMs: number, toMs: number, kWh: number): number;
  /** True when prices come from the request (tariff or flat); otherwise cost is reported as undefined. */
  priced: boolean;
}

const sorted = (t: readonly TariffPeriod[]) => [...t].sort((a, b) => a.fromMs - b.fromMs);

/** The pricing of a request: its tariff periods, else its flat price, else 1 per kWh (least energy). */
export function pricingOf(tariff: readonly TariffPeriod[] | undefined, flatPricePerKWh: number | undefined): Pricing {
  if (!tariff || tariff.length === 0) {
    const p = flatPricePerKWh ?? 1;
    return { priced: flatPricePerKWh !== undefined, energyCost: (_f, _t, kWh) => kWh * p };
  }
  const periods = sorted(tariff);
  return {
    priced: true,
    energyCost(fromMs, toMs, kWh) {
      if (!(toMs > fromMs)) return 0;
      let covered = 0;
      let weighted = 0;
      for (const p of periods) {
        const a = Math.max(fromMs, p.fromMs);
        const b = Math.min(toMs, p.toMs);
        if (b > a) {
          covered += b - a;
          weighted += (b - a) * p.pricePerKWh;
        }
      }
      if (toMs - fromMs - covered > 1e-6) {
        throw new PlanInputError('plan.tariff', `The tariff does not cover ${new Date(fromMs).toISOString()} – ${new Date(toMs).toISOString()}.`);
      }
      return (kWh * weighted) / (toMs - fromMs);
    },
  };
}

/** Energy, kWh, of `powerW` over an interval. */
export function kWhOf(powerW: number, fromMs: number, toMs: number): number {
  return (powerW * Math.max(0, toMs - fromMs)) / 3.6e9;
}

/** Merges touching or overlapping intervals (sorted by start). */
export function mergeIntervals(xs: readonly Interval[]): Interval[] {
  const out: Interval[] = [];
  for (const x of [...xs].sort((a, b) => a.fromMs - b.fromMs)) {
    const last = out[out.length - 1];
    if (last && x.fromMs <= last.toMs) last.toMs = Math.max(last.toMs, x.toMs);
    else out.push({ ...x });
  }
  return out;
}
