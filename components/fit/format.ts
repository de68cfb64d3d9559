// Display helpers for fits and profiles (client and server).
import type { ThermalParams } from '@/lib/views/aircraft';
import type { Estimate } from '@/lib/fit/cooldown';

const MINUS = '\u2212';

/** "1.879 ± 0.010": the uncertainty to two significant figures when it starts with 1 or 2, else one (value to match). */
export function fmtEstimate(e: Estimate, digits?: number): string {
  let d = digits;
  if (d === undefined) {
    if (Number.isFinite(e.sigma) && e.sigma > 0) {
      const mag = Math.floor(Math.log10(e.sigma));
      const sig = e.sigma / Math.pow(10, mag) < 3 ? 2 : 1;
      d = Math.min(5, Math.max(0, sig - 1 - mag));
    } else d = 2;
  }
  const v = e.value.toFixed(d).replace('-', MINUS);
  return Number.isFinite(e.sigma) ? `${v} ± ${e.sigma.toFixed(d)}` : `${v} (uncertainty unknown)`;
}

/** The relative uncertainty as "0.5 %". */
export function fmtRelative(e: Estimate): string {
  if (!Number.isFinite(e.sigma) || e.value === 0) return '—';
  const r = (100 * e.sigma) / Math.abs(e.value);
  return `${r < 0.1 ? r.toFixed(2) : r < 10 ? r.toFixed(1) : r.toFixed(0)} %`;
}

export function fmtKJ(jPerK: number): string {
  return `${(jPerK / 1000).toLocaleString('en-GB', { maximumFractionDigits: 1 })} kJ/K`;
}

export function fmtW(wPerK: number): string {
  return `${wPerK.toLocaleString('en-GB', { maximumFractionDigits: wPerK < 10 ? 2 : 1 })} W/K`;
}

/** The one-node time constant a profile amounts to (total C over total loss, uncovered), hours. */
export function profileTauH(t: ThermalParams): number {
  const C = t.nodes.reduce((s, n) => s + n.heatCapacityJPerK, 0);
  const G = t.nodes.reduce((s, n) => s + n.lossWPerK, 0);
  return G > 0 ? C / G / 3600 : NaN;
}

/** "Oil 6.1 kJ/K · 1.6 W/K; engine 52.1 kJ/K · 5.5 W/K; coupling 2.2 W/K". */
export function thermalLine(t: ThermalParams): string {
  const nodes = t.nodes.map((n) => `${n.name === 'oil' ? (t.nodes.length === 1 ? 'Engine and oil' : 'Oil') : 'Engine'} ${fmtKJ(n.heatCapacityJPerK)} · ${fmtW(n.lossWPerK)}`);
  return nodes.join('; ') + (t.nodes.length === 2 && t.couplingWPerK !== undefined ? `; coupling ${fmtW(t.couplingWPerK)}` : '');
}

export const SOURCE_LABEL: Record<ThermalParams['source'], string> = {
  preset: 'engine class preset',
  manual: 'entered by hand',
  fitted: 'fitted from a log',
};
