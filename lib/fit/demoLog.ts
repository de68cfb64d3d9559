// The demo's logged cool-down (data/demo/cooldown-q-kapa.csv): invented data generated from known
// parameters through the soak model, with logger noise and 0.1 K resolution. `npx tsx
// lib/fit/demoLog.ts` rewrites the file; a unit test checks the file still matches this generator.
import { simulate } from '@/lib/thermal';
import { engineFromPreset } from '@/lib/thermal/presets';
import { offsetSecondsAt } from '@/lib/weather/tz';
import { zonedTimeToUtc } from '@/lib/time';
import { rng } from './synthetic';

export const DEMO_LOG_FILE = 'data/demo/cooldown-q-kapa.csv';
export const DEMO_LOG_ZONE = 'Europe/Helsinki';

/** The parameters the demo log was generated with (two nodes, cover off, still air in a T-hangar). */
export const DEMO_LOG_TRUTH = (() => {
  const e = engineFromPreset('lc-drysump-4');
  return {
    oilJPerK: Math.round(e.nodes[0].heatCapacityJPerK),
    engineJPerK: Math.round(e.nodes[1].heatCapacityJPerK),
    oilLossWPerK: 1.6,
    engineLossWPerK: 5.5,
    couplingWPerK: 2.2,
    shutdownLocal: '2026-11-24 17:38',
    shutdownOilC: 91,
    heaterOnLocal: '2026-11-25 06:50',
    heaterW: 100,
    noiseK: 0.15,
  };
})();

const MIN = 60_000;

function localMs(zone: string, s: string): number {
  const [y, mo, d, h, mi] = s.split(/[- :]/).map(Number);
  return zonedTimeToUtc(zone, y, mo, d, h, mi);
}

function stamp(ms: number, zone: string): string {
  return new Date(ms + offsetSecondsAt(zone, ms) * 1000).toISOString().slice(0, 19).replace('T', ' ');
}

export function demoCooldownCsv(): string {
  const T = DEMO_LOG_TRUTH;
  const zone = DEMO_LOG_ZONE;
  const shutdown = localMs(zone, T.shutdownLocal);
  const heaterOn = localMs(zone, T.heaterOnLocal);
  const first = shutdown - 28 * MIN;
  const last = heaterOn + 40 * MIN;
  const r = rng(20261124);
  // Hangar air: −1.5 °C at the first row, easing to −9.5 °C by five in the morning.
  const air = (ms: number) => {
    const h = (ms - first) / 3_600_000;
    return -1.5 - 8 * (1 - Math.exp(-h / 4.5)) / (1 - Math.exp(-12 / 4.5));
  };
  const times: number[] = [];
  for (let t = first; t <= last; t += MIN) times.push(t);
  const after = times.filter((t) => t >= shutdown);
  const sim = simulate(
    {
      startMs: shutdown,
      endMs: last,
      outside: after.map((t) => ({ atMs: t, tempC: air(t) })),
      shelter: { kind: 'tie-down' },
      oil: { heatCapacityJPerK: T.oilJPerK, lossWPerK: T.oilLossWPerK, initialTempC: T.shutdownOilC },
      engine: { heatCapacityJPerK: T.engineJPerK, lossWPerK: T.engineLossWPerK, initialTempC: T.shutdownOilC },
      couplingWPerK: T.couplingWPerK,
      heaters: [{ node: 'oil', powerW: T.heaterW, fromMs: heaterOn, toMs: last + MIN }],
    },
    { atMs: after },
  );
  const lines = [
    '# Thawline demo log (invented data): Q-KAPA in T-hangar row A at Kettle Lake, cover off.',
    '# Two-probe logger, one reading a minute; local time (Europe/Helsinki).',
    'Time,Oil temp (°C),Hangar air (°C)',
  ];
  let j = 0;
  for (const t of times) {
    let oil: number;
    if (t < shutdown) {
      // Taxi in: the oil still rising towards its running temperature.
      const m = (t - first) / MIN;
      oil = T.shutdownOilC - 7 * Math.exp(-m / 9) + 7 * Math.exp(-28 / 9) * (m / 28);
    } else oil = sim.oilC[j++];
    const o = (oil + T.noiseK * r.normal()).toFixed(1);
    const a = (air(t) + 0.08 * r.normal()).toFixed(1);
    lines.push(`${stamp(t, zone)},${o},${a}`);
  }
  return lines.join('\n') + '\n';
}

// Run directly: rewrite the demo file.
if (typeof require !== 'undefined' && require.main === module) {
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  require('node:fs').writeFileSync(DEMO_LOG_FILE, demoCooldownCsv());
  console.log(`wrote ${DEMO_LOG_FILE}`);
}
