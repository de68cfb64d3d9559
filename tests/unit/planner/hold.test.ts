// The start window (lib/planner/hold.ts) on random physical nights (tests/unit/planner/cases.ts):
// re-simulated through lib/thermal independently of the planner's own check, the oil and the engine
// mass stay at or above their thresholds at every instant of [departure, departure + hold], and the
// heater is on through the hold. The thresholds are inputs, not check values.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { simulate } from '@/lib/thermal';
import { planDeparture, runPlan, withHeater, type PlanRequest } from '@/lib/planner';
import { planInputSchema } from '@/lib/validation/plan';
import { readFileSync } from 'node:fs';
import { caseArb } from './cases';

const TOL = 1e-4;

describe('start window', () => {
  it('re-simulated plans keep oil and engine mass at or above their thresholds at every instant of the window, heater on through the hold', () => {
    let exercised = 0;
    let withEngine = 0;
    fc.assert(
      fc.property(
        caseArb({ hours: [10, 15] }),
        fc.integer({ min: 0, max: 120 }),
        fc.constantFrom<PlanRequest['mode']>('least-cost', 'single-start'),
        fc.double({ min: -5, max: 10, noNaN: true }),
        (c, holdMinutes, mode, engineReadyC) => {
          const req: PlanRequest = {
            model: c.model,
            departureMs: c.departureMs,
            readyC: c.readyC,
            heater: { ...c.heater, powerW: c.heater.powerW + 400 },
            tariff: c.tariff,
            mode,
            holdMinutes,
            ...(c.model.engine ? { engineReadyC } : {}),
          };
          const plan = planDeparture(req);
          expect(plan.hold).toBeDefined();
          if (plan.status === 'short') return;
          const until = c.departureMs + holdMinutes * 60_000;
          const m = withHeater({ ...c.model, endMs: Math.max(c.model.endMs, until) }, req.heater, plan.heaterOn);
          const times: number[] = [];
          for (let t = c.departureMs; t <= until; t += 15_000) times.push(t);
          const s = simulate(m, { atMs: times });
          for (const v of s.oilC) expect(v).toBeGreaterThanOrEqual(c.readyC - TOL);
          if (s.engineC) {
            withEngine++;
            for (const v of s.engineC) expect(v).toBeGreaterThanOrEqual(engineReadyC - TOL);
          }
          if (plan.status === 'warming' && holdMinutes > 0) {
            expect(plan.hold!.heaterOn).toBe(true);
            expect(plan.heaterOn.some((i) => i.fromMs <= c.departureMs && i.toMs >= until)).toBe(true);
          }
          exercised++;
        },
      ),
      { numRuns: 40, seed: 10 },
    );
    expect(exercised).toBeGreaterThanOrEqual(25);
    expect(withEngine).toBeGreaterThanOrEqual(5);
  });

  it('holdMinutes 0 (the default) answers as before: no hold in the output', () => {
    const input = planInputSchema.parse(JSON.parse(readFileSync('data/examples/plan-least-cost.json', 'utf8')));
    const out = runPlan(input);
    expect(out.hold).toBeUndefined();
    const held = runPlan({ ...input, plan: { ...input.plan, holdMinutes: 30 } });
    expect(held.hold?.until).toBe('2025-01-16T08:00:00.000Z');
    expect(held.hold!.minOilC).toBeGreaterThanOrEqual(input.plan.readyC - TOL);
    expect(held.heaterOn.at(-1)!.to).toBe('2025-01-16T08:00:00.000Z');
  });

  it('refuses an engine threshold without an engine node, naming the field', () => {
    const raw = JSON.parse(readFileSync('data/examples/plan-least-cost.json', 'utf8'));
    raw.engine.nodes = raw.engine.nodes.filter((n: { name: string }) => n.name === 'oil');
    delete raw.engine.couplingWPerK;
    raw.plan.engineReadyC = 5;
    const r = planInputSchema.safeParse(raw);
    expect(r.success).toBe(false);
    expect(r.error!.issues.map((i) => i.path.join('.'))).toContain('plan.engineReadyC');
  });
});
