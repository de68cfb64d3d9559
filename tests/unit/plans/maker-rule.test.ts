// The maker's rule (lib/plans/maker-rule.ts) as a table: "preheat required when soaked below X °C
// for Y hours" and "minimum oil temperature for start", on the unheated Soak forecast. The rule's
// figures here are inputs (the class presets' are estimates), not outside check values; the nights
// are steady outside temperatures so the soak is plain to read.
import { describe, expect, it } from 'vitest';
import { engineFromPreset, type SoakModel } from '@/lib/thermal';
import { makerVerdict } from '@/lib/plans/maker-rule';
import { READINESS_STYLE } from '@/lib/plans/state';

const H = 3_600_000;
const START = Date.parse('2025-01-15T16:00:00Z');

function night(outsideC: number, shutdownOilC = 80): SoakModel {
  const e = engineFromPreset('ac-wetsump-4', { shutdownOilC, shutdownEngineC: shutdownOilC });
  const [oil, engine] = e.nodes;
  return {
    startMs: START,
    endMs: START + 16 * H,
    outside: [{ atMs: START, tempC: outsideC }, { atMs: START + 16 * H, tempC: outsideC }],
    shelter: { kind: 'tie-down' },
    oil: { heatCapacityJPerK: oil.heatCapacityJPerK, lossWPerK: oil.lossWPerK, initialTempC: oil.initialTempC },
    engine: { heatCapacityJPerK: engine.heatCapacityJPerK, lossWPerK: engine.lossWPerK, initialTempC: engine.initialTempC },
    couplingWPerK: e.couplingWPerK,
    cover: false,
    coverFactor: e.coverFactor,
  };
}

const RULE = { preheatBelowC: -6, soakHours: 2, minStartOilC: -6 };
const DEP = START + 14 * H;

describe("the maker's rule", () => {
  const table: { name: string; outsideC: number; rule?: typeof RULE; hold?: number; noHeat: boolean; why: RegExp }[] = [
    { name: '+3 °C night: no heat needed', outsideC: 3, noHeat: true, why: /no preheat required/ },
    { name: '−2 °C night: above the rule, no heat needed', outsideC: -2, noHeat: true, why: /no preheat required/ },
    { name: '−15 °C night: soaked below −6 °C for hours, needs heat', outsideC: -15, noHeat: false, why: /Soaked below/ },
    { name: '−5 °C night with a manual minimum start oil of 0 °C: needs heat', outsideC: -5, rule: { ...RULE, minStartOilC: 0 }, noHeat: false, why: /below the rule's minimum/ },
    { name: '−10 °C night, a manual allowing 20 h of soak: no heat needed', outsideC: -10, rule: { preheatBelowC: -6, soakHours: 20, minStartOilC: -20 }, noHeat: true, why: /no preheat/ },
    { name: '+1 °C night, 2 h start window, start minimum +2 °C: needs heat', outsideC: 1, rule: { ...RULE, minStartOilC: 2 }, hold: 120, noHeat: false, why: /below the rule's minimum/ },
  ];
  for (const row of table) {
    it(row.name, () => {
      const v = makerVerdict(night(row.outsideC), row.rule ?? RULE, { departureMs: DEP, holdMinutes: row.hold ?? 30 });
      expect(v.noHeatNeeded).toBe(row.noHeat);
      expect(v.reason).toMatch(row.why);
    });
  }

  it('"no heat needed" is its own readiness state, worded with the caution to follow the manual', () => {
    expect(READINESS_STYLE['no-heat'].label).toBe('No heat needed');
    expect(READINESS_STYLE['no-heat'].hint).toMatch(/manual/);
  });
});
