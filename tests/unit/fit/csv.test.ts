import fs from 'node:fs';
import { describe, expect, it } from 'vitest';
import { readLog, chunksOf, LogRefused, MAX_LOG_BYTES, sniffDelimiter } from '@/lib/fit/csv';
import { packSeries, unpackSeries } from '@/lib/fit/pack';
import { demoCooldownCsv, DEMO_LOG_FILE, DEMO_LOG_TRUTH } from '@/lib/fit/demoLog';
import { suggestWindow } from '@/lib/fit/window';
import { fitCooldown } from '@/lib/fit/cooldown';

const ZONE = 'Europe/Helsinki';
const enc = new TextEncoder();
const read = (text: string | Uint8Array, o: { unit?: 'auto' | 'C' | 'F'; maxBytes?: number; zone?: string; chunk?: number } = {}) =>
  readLog(chunksOf(typeof text === 'string' ? enc.encode(text) : text, o.chunk ?? 64 * 1024), { timeZone: o.zone ?? ZONE, unit: o.unit, maxBytes: o.maxBytes });

async function refused(p: Promise<unknown>): Promise<LogRefused> {
  try {
    await p;
  } catch (e) {
    expect(e).toBeInstanceOf(LogRefused);
    return e as LogRefused;
  }
  throw new Error('expected the file to be refused');
}

const rows = (n: number, f: (i: number) => string) => Array.from({ length: n }, (_, i) => f(i)).join('\n');
const iso = (i: number) => `2026-11-30 ${String(17 + Math.floor((45 + i) / 60)).padStart(2, '0')}:${String((45 + i) % 60).padStart(2, '0')}`;
const GOOD = `Time,Oil (°C),Air (°C)\n${rows(20, (i) => `${iso(i)},${(80 - i).toFixed(1)},-5.0`)}\n`;

describe('reading a logger file', () => {
  it('reads time, oil and ambient from a header, in the airfield zone', async () => {
    const r = await read(GOOD);
    expect(r.ok).toBe(true);
    expect(r.rowCount).toBe(20);
    expect(r.layout.columns).toEqual({ time: 'Time', oil: 'Oil (°C)', ambient: 'Air (°C)', heater: null });
    expect(r.layout.unit).toBe('C');
    expect(r.layout.unitSource).toBe('header');
    // 17:45 in Helsinki in winter (UTC+2) is 15:45 UTC.
    expect(new Date(r.series.t[0]).toISOString()).toBe('2026-11-30T15:45:00.000Z');
    expect(r.series.oil[0]).toBe(80);
    expect(r.series.ambient![0]).toBe(-5);
    expect(r.sample[0]).toEqual(['2026-11-30 17:45', '80.0', '-5.0']);
  });

  it('reads the common date formats: dotted day first, US 12-hour, day-first slashes, unix seconds, ISO with a zone', async () => {
    const m = (i: number) => String(45 + i);
    const cases: ((i: number) => string)[] = [
      (i) => `30.11.2026 17:${m(i)}`,
      (i) => `11/30/2026 5:${m(i)} PM`,
      (i) => `30/11/2026 17:${m(i)}`,
      (i) => String(1796053500 + 60 * i),
      (i) => (i % 2 ? `2026-11-30T17:${m(i)}:00+02:00` : `2026-11-30T15:${m(i)}:00Z`),
      (i) => `2026-11-30T17:${m(i)}`,
    ];
    for (const time of cases) {
      const r = await read(`time,oil\n${rows(5, (i) => `${time(i)},${80 - i}`)}\n`);
      expect(r.problems).toEqual([]);
      expect(new Date(r.series.t[0]).toISOString()).toBe('2026-11-30T15:45:00.000Z');
      expect(r.series.t[1] - r.series.t[0]).toBe(60_000);
    }
  });

  it('honours daylight saving time in the zone (summer is UTC+3 in Helsinki)', async () => {
    const r = await read(`time,oil\n${rows(6, (i) => `2026-07-01 12:0${i},${60 - i}`)}\n`);
    expect(new Date(r.series.t[0]).toISOString()).toBe('2026-07-01T09:00:00.000Z');
  });

  it('takes a separate date and time column, a semicolon file with decimal commas, a preamble and comments', async () => {
    const text = ['# exported by a logger', 'Logger;demo', 'Serial;0000', 'Date;Time;Oil temp (°C);Ambient (°C)', ...Array.from({ length: 8 }, (_, i) => `30.11.2026;17:4${i};${80 - i},5;-3,2`)].join('\r\n');
    const r = await read(text);
    expect(r.problems).toEqual([]);
    expect(r.layout.delimiter).toBe(';');
    expect(r.layout.headerRow).toBe(4);
    expect(r.layout.columns.time).toBe('Date + Time');
    expect(r.series.oil[0]).toBe(80.5);
    expect(r.series.ambient![0]).toBe(-3.2);
  });

  it('converts °F read from the header (°F, degF, a trailing F) to °C', async () => {
    for (const h of ['Oil (°F)', 'oil_degF', 'Oil temp F']) {
      const r = await read(`Time,${h}\n${rows(6, (i) => `${iso(i)},${212 - i * 9}`)}\n`);
      expect(r.layout.unit).toBe('F');
      expect(r.series.oil[0]).toBeCloseTo(100, 6);
      expect(r.series.oil[1]).toBeCloseTo(95, 6);
    }
  });

  it('uses the form choice when the file states no unit, and says so when it assumes °C', async () => {
    const text = `time,oil\n${rows(6, (i) => `${iso(i)},${180 - i}`)}\n`;
    const f = await read(text, { unit: 'F' });
    expect(f.layout.unitSource).toBe('form');
    expect(f.series.oil[0]).toBeCloseTo(82.222, 3);
    const c = await read(text.replace(/,1(\d\d)/g, ',$1'));
    expect(c.layout.unitSource).toBe('default');
    expect(c.warnings.join(' ')).toMatch(/read as °C/);
  });

  it('refuses a form unit that contradicts the header', async () => {
    const r = await read(GOOD, { unit: 'F' });
    expect(r.ok).toBe(false);
    expect(r.problems[0].message).toMatch(/file says °C .* form says °F/);
  });

  it('takes a headerless file by position and says so', async () => {
    const r = await read(rows(6, (i) => `${iso(i)},${80 - i},-4`));
    expect(r.ok).toBe(true);
    expect(r.series.ambient).not.toBeNull();
    expect(r.warnings[0]).toMatch(/No header row/);
  });

  it('skips rows with a blank oil cell and notes it; a blank ambient cell is filled later', async () => {
    const r = await read(`Time,Oil,Air\n${iso(0)},80,-5\n${iso(1)},,-5\n${iso(2)},78,\n${rows(5, (i) => `${iso(i + 3)},${77 - i},-5`)}\n`);
    expect(r.ok).toBe(true);
    expect(r.series.t.length).toBe(7);
    expect(r.warnings.join(' ')).toMatch(/1 row without an oil temperature skipped \(first: row 3\)/);
    expect(Number.isNaN(r.series.ambient![1])).toBe(true);
  });

  it('reads a heater column as on/off', async () => {
    const r = await read(`Time,Oil,Heater\n${rows(6, (i) => `${iso(i)},${80 - i},${i > 3 ? 'on' : 'off'}`)}\n`);
    expect(Array.from(r.series.heater!)).toEqual([0, 0, 0, 0, 1, 1]);
  });

  it('sniffs the delimiter', () => {
    expect(sniffDelimiter('a,b,c\n1,2,3')).toBe(',');
    expect(sniffDelimiter('a;b;c\n1,5;2,5;3')).toBe(';');
    expect(sniffDelimiter('a\tb\n1\t2')).toBe('\t');
  });
});

describe('bad files: each refused with a message naming the row or column', () => {
  it('an empty file', async () => {
    expect((await refused(read(''))).message).toBe('The file is empty.');
    expect((await refused(read('\n\n  \n'))).code).toBe('empty');
  });

  it('a binary file (a zero byte), a zip spreadsheet and text that is not UTF-8', async () => {
    const bin = new Uint8Array([0x74, 0x69, 0x6d, 0x65, 0x2c, 0x00, 0x01, 0x02]);
    const e = await refused(read(bin));
    expect(e.code).toBe('binary');
    expect(e.message).toMatch(/binary data \(a zero byte at byte 6\)/);
    expect((await refused(read(new Uint8Array([0x50, 0x4b, 0x03, 0x04, 0x14, 0x00])))).message).toMatch(/spreadsheet or archive/);
    const latin1 = new Uint8Array([...enc.encode('Time,Oil\n2026-11-30 17:45,8'), 0xb0, 0x0a]);
    expect((await refused(read(latin1))).message).toMatch(/not UTF-8/);
    expect((await refused(read(new Uint8Array([0xff, 0xfe, 0x74, 0x00])))).message).toMatch(/UTF-16/);
  });

  it('no time column', async () => {
    const e = await refused(read(`Oil (°C),Air (°C)\n${rows(5, (i) => `${80 - i},-5`)}\n`));
    expect(e.code).toBe('no_time');
    expect(e.message).toMatch(/Row 1: No time column: none of the columns "Oil \(°C\)", "Air \(°C\)"/);
    const headerless = await refused(read(rows(5, (i) => `${80 - i},-5`)));
    expect(headerless.message).toMatch(/Row 1: no time column/);
  });

  it('text in the temperature column', async () => {
    const text = GOOD.replace('2026-11-30 17:48,77.0', '2026-11-30 17:48,sensor error');
    const r = await read(text);
    expect(r.ok).toBe(false);
    expect(r.problems).toEqual([{ row: 5, column: 'Oil (°C)', message: 'Row 5, column "Oil (°C)": "sensor error" is not a temperature (a number is expected).' }]);
  });

  it('time going backwards, and a repeated time', async () => {
    const lines = GOOD.trim().split('\n');
    [lines[6], lines[7]] = [lines[7], lines[6]];
    const r = await read(lines.join('\n'));
    expect(r.ok).toBe(false);
    expect(r.problems[0]).toMatchObject({ row: 8, column: 'Time' });
    expect(r.problems[0].message).toMatch(/^Row 8, column "Time": time goes backwards — 2026-11-30 17:50:00 is before 2026-11-30 17:51:00 in row 7\./);
    const rep = await read(GOOD.replace('2026-11-30 17:46', '2026-11-30 17:45'));
    expect(rep.problems[0].message).toMatch(/Row 3, column "Time": 2026-11-30 17:45:00 repeats the time of row 2/);
  });

  it('mixed units: between columns, within a column, and in a unit column', async () => {
    const cols = await read(GOOD.replace('Air (°C)', 'Air (°F)'));
    expect(cols.ok).toBe(false);
    expect(cols.problems[0].message).toBe('Mixed units: column "Oil (°C)" is in °C but column "Air (°F)" is in °F. Use one unit for the whole file.');
    const cells = await read(`Time,Oil\n${iso(0)},80 °C\n${iso(1)},79 °C\n${iso(2)},172 °F\n${iso(3)},77 °C\n${iso(4)},76 °C\n`);
    expect(cells.problems[0]).toMatchObject({ row: 4, column: 'Oil' });
    expect(cells.problems[0].message).toMatch(/°F, but row 2 is in °C \(mixed units\)/);
    const unitCol = await read(`Time,Oil,Unit\n${rows(5, (i) => `${iso(i)},${80 - i},${i === 3 ? 'F' : 'C'}`)}\n`);
    expect(unitCol.problems[0]).toMatchObject({ row: 5, column: 'Unit' });
  });

  it('a time cell in another format than the first row, and an impossible date', async () => {
    const r = await read(GOOD.replace('2026-11-30 17:50', '30.11.2026 17:50').replace('2026-11-30 17:52', '2026-02-30 17:52'));
    expect(r.problems.map((p) => p.row)).toEqual([7, 9]);
    expect(r.problems[0].message).toMatch(/not a valid time in the file's format \(YYYY-MM-DD hh:mm \(local\), as in the first row\)/);
  });

  it('an implausible oil temperature suggests °F', async () => {
    const r = await read(`time,oil\n${rows(6, (i) => `${iso(i)},${205 - i}`)}\n`);
    expect(r.ok).toBe(false);
    expect(r.problems[0].message).toMatch(/205 °C is not a plausible oil temperature; if the logger wrote °F, choose °F/);
  });

  it('a header with no data rows', async () => {
    expect((await refused(read('Time,Oil (°C)\n'))).message).toMatch(/header \(row 1\) but no data rows/);
  });

  it('a file over the size limit, refused while it streams in', async () => {
    const big = new Uint8Array(MAX_LOG_BYTES + 10).fill(0x31);
    const e = await refused(read(big));
    expect(e.code).toBe('too_large');
    expect(e.message).toMatch(/larger than the 5 MB limit/);
  });

  it('lists at most 50 problems but counts them all', async () => {
    const r = await read(`Time,Oil\n${rows(120, (i) => `${iso(i % 60)}${i >= 60 ? 'x' : ''},${80 - i / 10}`)}\n`);
    expect(r.problems.length).toBe(50);
    expect(r.problemCount).toBe(60);
  });
});

describe('large files', () => {
  it('takes a valid 200,000-row file under the size limit, quickly, and stores it compactly', async () => {
    const t0 = 1796053500;
    const lines = ['unix,oil (°C),ambient (°C)'];
    for (let i = 0; i < 200_000; i++) lines.push(`${t0 + i},${(20 + 60 * Math.exp(-i / 9000)).toFixed(2)},${(-5 - i / 100000).toFixed(2)}`);
    const bytes = enc.encode(lines.join('\n'));
    expect(bytes.byteLength).toBeLessThan(MAX_LOG_BYTES);
    const started = performance.now();
    const r = await read(bytes);
    const ms = performance.now() - started;
    expect(r.ok).toBe(true);
    expect(r.rowCount).toBe(200_000);
    expect(r.series.t.length).toBe(200_000);
    expect(ms).toBeLessThan(8000);
    const packed = packSeries(r.series);
    expect(packed.byteLength).toBeLessThan(bytes.byteLength);
    const back = unpackSeries(packed);
    expect(back.t[199_999]).toBe(r.series.t[199_999]);
    expect(back.oil[12345]).toBeCloseTo(r.series.oil[12345], 4);
    expect(suggestWindow(r.series)).not.toBeNull();
  }, 60_000);
});

describe('the demo log', () => {
  it('is what the generator writes (invented data from known parameters)', () => {
    expect(fs.readFileSync(DEMO_LOG_FILE, 'utf8')).toBe(demoCooldownCsv());
  });

  it('reads cleanly, its suggested window starts at the shutdown, and the fit finds its two nodes', async () => {
    const r = await read(fs.readFileSync(DEMO_LOG_FILE), { chunk: 1000 });
    expect(r.ok).toBe(true);
    expect(r.warnings).toEqual([]);
    const w = suggestWindow(r.series)!;
    const T = DEMO_LOG_TRUTH;
    const shutdown = Date.UTC(2026, 10, 24, 15, 38);
    expect(Math.abs(w.startMs - shutdown)).toBeLessThanOrEqual(5 * 60_000);
    expect(w.endMs).toBeLessThan(Date.UTC(2026, 10, 25, 4, 50));
    const f = fitCooldown(r.series, w, { heatCapacityJPerK: T.oilJPerK + T.engineJPerK, oilHeatCapacityJPerK: T.oilJPerK, engineHeatCapacityJPerK: T.engineJPerK });
    expect(f.recommended).toBe('two-node');
    expect(Math.abs(f.twoNode!.oilLossWPerK!.value - T.oilLossWPerK) / T.oilLossWPerK).toBeLessThan(0.1);
    expect(Math.abs(f.twoNode!.engineLossWPerK!.value - T.engineLossWPerK) / T.engineLossWPerK).toBeLessThan(0.1);
    expect(Math.abs(f.twoNode!.couplingWPerK!.value - T.couplingWPerK) / T.couplingWPerK).toBeLessThan(0.2);
  });
});

describe('packing', () => {
  it('round-trips a series with gaps and a heater column', () => {
    const s = { t: Float64Array.from([1e12, 1e12 + 1000, 1e12 + 2500]), oil: Float64Array.from([80.25, 79.5, 79]), ambient: Float64Array.from([-5, NaN, -5.5]), heater: Uint8Array.from([0, 1, 0]) };
    const b = unpackSeries(packSeries(s));
    expect(Array.from(b.t)).toEqual(Array.from(s.t));
    expect(Array.from(b.oil)).toEqual([80.25, 79.5, 79]);
    expect(Number.isNaN(b.ambient![1])).toBe(true);
    expect(Array.from(b.heater!)).toEqual([0, 1, 0]);
  });
});
