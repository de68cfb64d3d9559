// The maker's rule (pure): "preheat required when the engine has soaked below X °C for Y hours" and
// "minimum oil temperature for start", judged on the unheated Soak forecast. The figures are the
// engine class's (generic, estimate) unless the aircraft carries its own manual's. The engine's soak
// is the engine-mass node where the model has one, else the oil node; the oil for start is the oil
// node (for the dry-sump class, the engine node: the engine-side oil). Thawline's figures are estimates:
// the manufacturer's cold-weather instructions come first.
import { simulate, type SoakModel } from '@/lib/thermal';
import type { MakerRule } from '@/lib/thermal/presets';

export interface MakerVerdict {
  /** True: the departure meets the rule without heat ("no heat needed"). */
  noHeatNeeded: boolean;
  /** Longest time the engine stayed below preheatBelowC, ending at or before the window's end, hours. */
  soakedBelowHours: number;
  /** Lowest start oil over [departure, departure + hold] unheated, °C. */
  minStartOilC: number;
  reason: string;
}

const STEP_MS = 5 * 60_000;

/** The rule on the free run (no heaters in `model`) for a departure and its start window. */
export function makerVerdict(model: SoakModel, rule: MakerRule, o: { departureMs: number; holdMinutes?: number; startOil?: 'oil' | 'engine' }): MakerVerdict {
  const T = o.departureMs;
  const until = T + (o.holdMinutes ?? 0) * 60_000;
  const m: SoakModel = { ...model, heaters: [], endMs: Math.max(model.endMs, until) };
  const times: number[] = [];
  for (let t = m.startMs; t < until; t += STEP_MS) times.push(t);
  times.push(until);
  const s = simulate(m, { atMs: times });
  const soak = s.engineC ?? s.oilC;
  const start = o.startOil === 'engine' && s.engineC ? s.engineC : s.oilC;
  let run = 0;
  let longest = 0;
  let minStart = Infinity;
  for (let i = 0; i < times.length; i++) {
    const dt = i > 0 ? times[i] - times[i - 1] : 0;
    if (soak[i] < rule.preheatBelowC) {
      run += dt;
      longest = Math.max(longest, run);
    } else run = 0;
    if (times[i] >= T) minStart = Math.min(minStart, start[i]);
  }
  const hours = longest / 3_600_000;
  const soaked = hours >= rule.soakHours;
  const tooCold = minStart < rule.minStartOilC;
  const noHeatNeeded = !soaked && !tooCold;
  const reason = soaked
    ? `Soaked below ${rule.preheatBelowC} °C for ${hours.toFixed(1)} h (the rule: preheat after ${rule.soakHours} h).`
    : tooCold
      ? `Oil ${minStart.toFixed(1)} °C at start, below the rule's minimum of ${rule.minStartOilC} °C.`
      : `Not soaked below ${rule.preheatBelowC} °C for ${rule.soakHours} h and oil at least ${rule.minStartOilC} °C for start: no preheat required by the rule.`;
  return { noHeatNeeded, soakedBelowHours: hours, minStartOilC: minStart, reason };
}
