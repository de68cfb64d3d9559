// The simulate contract: schema errors name their field; the CLI prints JSON or fails with exit 1.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { runSimulation } from '@/lib/thermal';
import { simulationInputSchema } from '@/lib/validation/simulation';

const example = JSON.parse(readFileSync(path.join(__dirname, '../../../data/examples/simulate-t-hangar.json'), 'utf8'));
const minimal = {
  start: '2025-01-21T16:00:00Z',
  end: '2025-01-22T08:00:00Z',
  outputEveryMinutes: 60,
  outside: [
    { at: '2025-01-21T16:00:00Z', tempC: -5 },
    { at: '2025-01-22T08:00:00Z', tempC: -12 },
  ],
  shelter: { kind: 'tie-down' },
  engine: { nodes: [{ name: 'oil', heatCapacityJPerK: 99_000, lossWPerK: 10, initialTempC: 75 }] },
};

const fieldsOf = (body: unknown) => {
  const r = simulationInputSchema.safeParse(body);
  return r.success ? [] : r.error.issues.map((i) => ({ field: i.path.join('.'), message: i.message }));
};

describe('simulationInputSchema', () => {
  it('accepts the contract and the example files', () => {
    expect(fieldsOf(minimal)).toEqual([]);
    expect(fieldsOf(example)).toEqual([]);
  });

  it.each([
    { name: 'missing nodes', body: { ...minimal, engine: {} }, field: 'engine.nodes' },
    { name: 'empty nodes', body: { ...minimal, engine: { nodes: [] } }, field: 'engine.nodes' },
    { name: 'end before start', body: { ...minimal, end: '2025-01-21T15:00:00Z' }, field: 'end' },
    { name: 'end equal to start', body: { ...minimal, end: minimal.start }, field: 'end' },
    { name: 'NaN', body: { ...minimal, outside: [{ at: minimal.start, tempC: NaN }] }, field: 'outside.0.tempC' },
    { name: 'Infinity', body: { ...minimal, outputEveryMinutes: Infinity }, field: 'outputEveryMinutes' },
    { name: 'unknown node', body: { ...minimal, engine: { nodes: [{ ...minimal.engine.nodes[0], name: 'cylinder' }] } }, field: 'engine.nodes.0.name' },
    { name: 'duplicate node', body: { ...minimal, engine: { nodes: [minimal.engine.nodes[0], minimal.engine.nodes[0]] } }, field: 'engine.nodes.1.name' },
    { name: 'no oil node', body: { ...minimal, engine: { nodes: [{ ...minimal.engine.nodes[0], name: 'engine' }] } }, field: 'engine.nodes' },
    { name: 'heater on a missing node', body: { ...minimal, heaters: [{ node: 'engine', powerW: 100, from: minimal.start, to: minimal.end }] }, field: 'heaters.0.node' },
    { name: 'heater ending before it starts', body: { ...minimal, heaters: [{ node: 'oil', powerW: 100, from: minimal.end, to: minimal.start }] }, field: 'heaters.0.to' },
    { name: 'date without a zone', body: { ...minimal, start: '2025-01-21T16:00:00' }, field: 'start' },
    { name: 'outside out of order', body: { ...minimal, outside: [...minimal.outside].reverse() }, field: 'outside.1.at' },
    { name: 'too many output points', body: { ...minimal, outputEveryMinutes: 0.001 }, field: 'outputEveryMinutes' },
    { name: 'heated hangar without power', body: { ...minimal, shelter: { kind: 'hangar', heatCapacityJPerK: 1e6, lossWPerK: 100, setpointC: 10 } }, field: 'shelter.heatingPowerW' },
    { name: 'unknown shelter kind', body: { ...minimal, shelter: { kind: 'igloo' } }, field: 'shelter.kind' },
  ])('$name → an error at $field', ({ body, field }) => {
    const f = fieldsOf(body);
    expect(f.map((x) => x.field)).toContain(field);
    expect(f.find((x) => x.field === field)!.message.length).toBeGreaterThan(5);
  });

  it('rejects 10⁶ outside points quickly, saying how many are allowed', () => {
    const outside = Array.from({ length: 1_000_000 }, (_, i) => ({ at: minimal.start, tempC: i }));
    const t0 = performance.now();
    const f = fieldsOf({ ...minimal, outside });
    expect(performance.now() - t0).toBeLessThan(500);
    expect(f).toEqual([{ field: 'outside', message: 'At most 10,000 outside points (got 1,000,000).' }]);
  });
});

describe('runSimulation', () => {
  it('returns the series from start to end inclusive, every outputEveryMinutes, and the energy', () => {
    const out = runSimulation(simulationInputSchema.parse({ ...minimal, heaters: [{ node: 'oil', powerW: 250, from: '2025-01-22T05:00:00Z', to: '2025-01-22T09:00:00Z' }] }));
    expect(out.series).toHaveLength(17);
    expect(out.series[0]).toEqual({ at: '2025-01-21T16:00:00.000Z', outsideC: -5, shelterC: -5, oilC: 75, engineC: null });
    expect(out.series[16].at).toBe('2025-01-22T08:00:00.000Z');
    expect(out.energyWh).toBe(750); // 250 W × 3 h inside the run
  });

  it('includes the end even off the output grid', () => {
    const out = runSimulation(simulationInputSchema.parse({ ...minimal, outputEveryMinutes: 25 }));
    expect(out.series.at(-1)!.at).toBe('2025-01-22T08:00:00.000Z');
    expect(out.series.at(-2)!.at).toBe('2025-01-22T07:50:00.000Z');
  });
});

describe('scripts/simulate.ts', () => {
  const dir = mkdtempSync(path.join(tmpdir(), 'thawline-simulate-'));
  const root = path.join(__dirname, '../../..');
  const run = (name: string, text: string) => {
    const file = path.join(dir, name);
    writeFileSync(file, text);
    return spawnSync('npx', ['tsx', 'scripts/simulate.ts', file], { cwd: root, encoding: 'utf8', timeout: 60_000, maxBuffer: 64 << 20 });
  };

  it('prints the result JSON for a good file', () => {
    const r = run('good.json', JSON.stringify(example));
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.series.length).toBeGreaterThan(10);
    expect(typeof out.energyWh).toBe('number');
  });

  it.each([
    { name: 'missing nodes', text: JSON.stringify({ ...minimal, engine: {} }), field: 'engine.nodes' },
    { name: 'end before start', text: JSON.stringify({ ...minimal, end: '2025-01-20T00:00:00Z' }), field: 'end' },
    { name: 'NaN', text: JSON.stringify(minimal).replace('"tempC":-5', '"tempC":NaN'), field: 'outside[0].tempC' },
    { name: 'unknown node', text: JSON.stringify({ ...minimal, engine: { nodes: [{ ...minimal.engine.nodes[0], name: 'gearbox' }] } }), field: 'engine.nodes[0].name' },
  ])('$name → exit 1, stderr names $field', ({ text, field }) => {
    const r = run('bad.json', text);
    expect(r.status).toBe(1);
    expect(r.stdout).toBe('');
    expect(r.stderr).toContain(field);
  });

  it('10⁶ outside points → exit 1, naming outside, without simulating', () => {
    const pt = `{"at":"2025-01-21T16:00:00Z","tempC":1}`;
    const text = JSON.stringify({ ...minimal, outside: [] }).replace('"outside":[]', `"outside":[${Array(1_000_000).fill(pt).join(',')}]`);
    const r = run('huge.json', text);
    expect(r.status).toBe(1);
    expect(r.stderr).toContain('outside: At most 10,000 outside points');
  });
});
