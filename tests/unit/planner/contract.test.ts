// The plan contract: the zod schema (field paths on bad input), the JSON it answers, and the CLI
// `npm run -s plan` (JSON on stdout; errors on stderr naming the field, exit 1).
import { execFileSync, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { runPlan } from '@/lib/planner';
import { planInputSchema } from '@/lib/validation/plan';

const example = JSON.parse(fs.readFileSync(path.resolve('data/examples/plan-least-cost.json'), 'utf8'));
const clone = () => structuredClone(example);

function fieldsOf(body: unknown): string[] {
  const r = planInputSchema.safeParse(body);
  return r.success ? [] : r.error.issues.map((i) => i.path.join('.'));
}

describe('planInputSchema', () => {
  it('accepts the example request', () => {
    expect(planInputSchema.safeParse(example).success).toBe(true);
  });

  const bad: [string, (b: any) => void, string][] = [
    ['plan missing', (b) => delete b.plan, 'plan'],
    ['departure before start', (b) => (b.plan.departure = '2025-01-15T15:00:00Z'), 'plan.departure'],
    ['departure after end', (b) => (b.plan.departure = '2025-01-17T15:00:00Z'), 'plan.departure'],
    ['unknown node', (b) => (b.plan.heater.node = 'gearbox'), 'plan.heater.node'],
    ['engine heater on a one-node engine', (b) => {
      b.engine.nodes = [b.engine.nodes[0]];
      b.plan.heater.node = 'engine';
    }, 'plan.heater.node'],
    ['zero power', (b) => (b.plan.heater.powerW = 0), 'plan.heater.powerW'],
    ['NaN ready temperature', (b) => (b.plan.readyC = 'NaN'), 'plan.readyC'],
    ['unknown mode', (b) => (b.plan.mode = 'cheapest'), 'plan.mode'],
    ['heaters given', (b) => (b.heaters = [{ node: 'oil', powerW: 100, from: b.start, to: b.end }]), 'heaters'],
    ['tariff gap', (b) => (b.plan.tariff = [b.plan.tariff[0], b.plan.tariff[2]]), 'plan.tariff'],
    ['tariff overlap', (b) => (b.plan.tariff[1].from = '2025-01-15T21:00:00Z'), 'plan.tariff.1.from'],
    ['tariff period backwards', (b) => (b.plan.tariff[0].to = '2025-01-15T11:00:00Z'), 'plan.tariff.0.to'],
    ['earliest switch-on after departure', (b) => (b.plan.earliestSwitchOn = '2025-01-16T08:00:00Z'), 'plan.earliestSwitchOn'],
    ['now after departure', (b) => (b.plan.now = '2025-01-16T08:00:00Z'), 'plan.now'],
    ['too many slots', (b) => (b.plan.slotMinutes = 1) && (b.end = '2025-01-18T10:00:00Z') && (b.plan.departure = '2025-01-18T07:30:00Z'), 'plan.slotMinutes'],
    ['unknown plan field', (b) => (b.plan.colour = 'red'), 'plan'],
    ['bad simulate part (end before start)', (b) => (b.end = '2025-01-15T10:00:00Z'), 'end'],
  ];
  for (const [name, mutate, field] of bad) {
    it(`names the field: ${name} → ${field}`, () => {
      const b = clone();
      mutate(b);
      expect(fieldsOf(b)).toContain(field);
    });
  }
});

describe('runPlan (the JSON both the CLI and the API answer)', () => {
  it('answers ISO times, the plan, the baselines and the chance of being ready', () => {
    const out = runPlan(planInputSchema.parse(example));
    expect(out.status).toBe('warming');
    expect(out.heaterOn.length).toBeGreaterThan(0);
    for (const i of out.heaterOn) {
      expect(i.from).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z$/);
      expect(Date.parse(i.to)).toBeGreaterThan(Date.parse(i.from));
    }
    expect(out.switchOnAt).toBe(out.heaterOn[0].from);
    expect(out.heaterOn.at(-1)!.to).toBe('2025-01-16T07:30:00.000Z');
    expect(out.oilAtDepartureC).toBeGreaterThanOrEqual(15);
    expect(out.cost).toBeGreaterThan(0);
    expect(out.baselines.allNight.rule).toBe('all-night');
    expect(out.baselines.allNight.from).toBe(example.plan.now.replace('Z', '.000Z'));
    expect(out.baselines.hoursBefore).toHaveLength(4);
    expect(out.probabilityReady).toBeGreaterThan(0.4);
    expect(out.probabilityReady).toBeLessThan(1);
  });
});

const tsx = path.resolve('node_modules/.bin/tsx');
function cli(body: unknown | string) {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'thawline-plan-'));
  const file = path.join(dir, 'req.json');
  fs.writeFileSync(file, typeof body === 'string' ? body : JSON.stringify(body));
  return spawnSync(tsx, ['scripts/plan.ts', file], { encoding: 'utf8', timeout: 60_000 });
}

describe('npm run -s plan', () => {
  it('prints the plan as JSON on stdout', () => {
    const out = JSON.parse(execFileSync(tsx, ['scripts/plan.ts', 'data/examples/plan-single-start.json'], { encoding: 'utf8' }));
    expect(out.mode).toBe('single-start');
    expect(out.heaterOn).toHaveLength(1);
    expect(out.latestSwitchOnAt >= out.switchOnAt).toBe(true);
  }, 60_000);

  it('bad input: exit 1, the field on stderr, nothing on stdout', () => {
    const b = clone();
    b.plan.heater.node = 'gearbox';
    b.plan.readyC = NaN;
    const r = cli(JSON.stringify(b).replace('null', 'NaN'));
    expect(r.status).toBe(1);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(/plan\.heater\.node: Unknown node "gearbox"/);
    expect(r.stderr).toMatch(/plan\.readyC: Must be a finite number, not NaN/);
  }, 60_000);

  it('not JSON: exit 1 with a message', () => {
    const r = cli('{ "start": ');
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(/not valid JSON/);
  }, 60_000);
});
