// Every heater of the aircraft. Heaters on one control are one schedule (PlannedHeater.parts: powers
// add, each on its own node). Heaters on different controls are planned jointly: each control alone
// and all of them on one schedule (each control can follow it), and the cheapest plan that meets the
// window wins — so a joint plan never costs more than any heater alone that meets it. (Independent
// schedules per control are not searched: a candidate set, not a proven joint optimum; docs/soak-model.md.)
import { planDeparture } from './hold';
import { partsOf } from './model';
import type { PlannedHeater, PlanMode, PlanRequest, PlanResult } from './types';

export interface ControlGroup {
  heater: PlannedHeater;
  mode: PlanMode;
  slotMinutes?: number;
}

/** The heaters of one control as one planned heater. */
export function oneControl(heaters: readonly { node: PlannedHeater['node']; powerW: number }[]): PlannedHeater {
  const parts = heaters.map((h) => ({ node: h.node, powerW: h.powerW }));
  const powerW = parts.reduce((s, h) => s + h.powerW, 0);
  return parts.length === 1 ? parts[0] : { node: parts[0].node, powerW, parts };
}

const costOf = (r: PlanResult) => r.cost ?? r.energyKWh;

/** The cheapest plan over the candidates (each control alone, and all together); `chosen` indexes `candidates`. */
export function planJointly(req: Omit<PlanRequest, 'heater' | 'mode' | 'slotMinutes'>, groups: readonly ControlGroup[]): { result: PlanResult; chosen: number; candidates: ControlGroup[] } {
  if (!groups.length) throw new Error('no heaters');
  const candidates: ControlGroup[] = [...groups];
  if (groups.length > 1) {
    const parts = groups.flatMap((g) => partsOf(g.heater));
    // All together follow one schedule: a timer or hand-switched control allows only one block.
    const mode: PlanMode = groups.every((g) => g.mode === 'least-cost') ? 'least-cost' : 'single-start';
    const slotMinutes = Math.max(...groups.map((g) => g.slotMinutes ?? 5));
    candidates.push({ heater: oneControl(parts), mode, slotMinutes });
  }
  const results = candidates.map((c) => planDeparture({ ...req, heater: c.heater, mode: c.mode, slotMinutes: c.slotMinutes }));
  let best = -1;
  results.forEach((r, i) => {
    if (r.status === 'short') return;
    if (best < 0 || costOf(r) < costOf(results[best]) - 1e-12) best = i;
  });
  if (best < 0) results.forEach((r, i) => (best < 0 || r.oilAtDepartureC > results[best].oilAtDepartureC ? (best = i) : null));
  return { result: results[best], chosen: best, candidates };
}
