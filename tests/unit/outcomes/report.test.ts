import { describe, expect, it } from 'vitest';
import { buildSeasonReport, type ReportOutcome } from '@/lib/outcomes/report';
import { estimateBias } from '@/lib/outcomes/stats';

const o = (aircraftId: number, flown: boolean, recorded: number | null, predicted: number | null, p: number | null, energy: [number, number] | null = null): ReportOutcome => ({
  aircraftId,
  departAt: '2026-11-20T06:00:00.000Z',
  flown,
  oilAtStartC: recorded,
  predictedOilC: predicted,
  probabilityReady: p,
  readyC: 15,
  energyKWh: energy ? energy[0] : null,
  usualEnergyKWh: energy ? energy[1] : null,
  thermalSource: 'preset',
});

describe('Season report', () => {
  const outs = [
    o(1, true, 17, 16, 0.95, [2, 6]),
    o(1, true, 13, 16, 0.92, [3, 6]),
    o(1, false, null, 16, 0.9, [2, 6]),
    o(2, true, 20, 18, 0.6),
    o(2, true, 16, null, 0.6),
  ];
  const r = buildSeasonReport(outs, [
    { id: 1, registration: 'A', thermalSource: 'preset' },
    { id: 2, registration: 'B', thermalSource: 'fitted' },
    { id: 3, registration: 'C', thermalSource: 'preset' },
  ]);

  it('counts flown and not-flown mornings; aircraft without outcomes are left out', () => {
    expect(r.organization.recorded).toBe(5);
    expect(r.organization.notFlown).toBe(1);
    expect(r.aircraft.map((a) => a.registration)).toEqual(['A', 'B']);
  });

  it('errors only where both a recorded and a predicted temperature exist', () => {
    const a = r.aircraft[0];
    expect(a.points).toHaveLength(2);
    expect(a.errors.meanK).toBeCloseTo(-1, 12);
    expect(a.bias).toEqual(estimateBias([1, -3], 'preset'));
    expect(r.aircraft[1].bias).toEqual(estimateBias([2], 'fitted'));
  });

  it('ready share and reliability count every flown morning with a temperature; energy only flown mornings with both figures', () => {
    expect(r.organization.readyShare).toBeCloseTo(3 / 4, 12); // 17, 20, 16 ready; 13 not
    const top = r.organization.reliability.find((x) => x.label === '90–100 %')!;
    expect([top.n, top.ready]).toEqual([2, 1]);
    const mid = r.organization.reliability.find((x) => x.label === '50–70 %')!;
    expect([mid.n, mid.ready]).toEqual([2, 2]);
    expect(r.aircraft[0].energy).toEqual({ mornings: 2, plannedKWh: 5, usualKWh: 12 });
  });
});
