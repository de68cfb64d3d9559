// The whole engine: engine-mass thresholds per class (estimates in lib/thermal/presets.ts), the
// dry-sump class judged on the engine-side oil, and the tank-pad-only warning. The thresholds are
// the presets' estimates, not outside check values; the checks are on how readiness uses them.
import { describe, expect, it } from 'vitest';
import { ENGINE_CLASSES, engineFromPreset, engineThresholdFor, heaterWarnings, type SoakModel } from '@/lib/thermal';
import { planDeparture } from '@/lib/planner';

const H = 3_600_000;
const START = Date.parse('2025-01-15T16:00:00Z');

function dryModel(): SoakModel {
  const e = engineFromPreset('lc-drysump-4');
  const [oil, engine] = e.nodes;
  return {
    startMs: START,
    endMs: START + 18 * H,
    outside: [{ atMs: START, tempC: -20 }, { atMs: START + 18 * H, tempC: -20 }],
    shelter: { kind: 'tie-down' },
    oil: { heatCapacityJPerK: oil.heatCapacityJPerK, lossWPerK: oil.lossWPerK, initialTempC: oil.initialTempC },
    engine: { heatCapacityJPerK: engine.heatCapacityJPerK, lossWPerK: engine.lossWPerK, initialTempC: engine.initialTempC },
    couplingWPerK: e.couplingWPerK,
    cover: true,
    coverFactor: e.coverFactor,
  };
}

describe('whole engine', () => {
  it('every class carries an engine-mass threshold; the dry sump is judged on the engine-side oil', () => {
    for (const p of Object.values(ENGINE_CLASSES)) expect(Number.isFinite(p.engineReadyC)).toBe(true);
    expect(ENGINE_CLASSES['lc-drysump-4'].readinessOil).toBe('engine');
    expect(engineThresholdFor('lc-drysump-4', 20, null)).toBe(20);
    expect(engineThresholdFor('ac-wetsump-4', 15, null)).toBe(ENGINE_CLASSES['ac-wetsump-4'].engineReadyC);
    expect(engineThresholdFor('ac-wetsump-4', 15, 8)).toBe(8);
  });

  it('a tank pad alone on the dry sump warns and suggests; with engine heat, or on a wet sump, it does not', () => {
    expect(heaterWarnings('lc-drysump-4', [{ kind: 'oil-pad' }])).toHaveLength(1);
    expect(heaterWarnings('lc-drysump-4', [{ kind: 'oil-pad' }])[0].suggestion).toMatch(/manufacturer/);
    expect(heaterWarnings('lc-drysump-4', [{ kind: 'oil-pad' }, { kind: 'cylinder-bands' }])).toHaveLength(0);
    expect(heaterWarnings('ac-wetsump-4', [{ kind: 'oil-pad' }])).toHaveLength(0);
  });

  it('a 100 W tank pad brings the tank to ready but not the engine side: the plan is short, not ready', () => {
    const model = dryModel();
    const departureMs = START + 15 * H;
    const base = { model, departureMs, readyC: 20, heater: { node: 'oil' as const, powerW: 100 }, mode: 'single-start' as const };
    const tankOnly = planDeparture(base);
    expect(tankOnly.status).not.toBe('short');
    const whole = planDeparture({ ...base, engineReadyC: engineThresholdFor('lc-drysump-4', 20, null) });
    expect(whole.status).toBe('short');
    expect(whole.hold!.minEngineC!).toBeLessThan(20);
  });
});
