// Reading a temperature-logger CSV: streamed through csv-parse, with the checks a person needs to fix a
// bad file — each problem names the row (the file's line number) and the column.
//
// Steps: refuse binary and non-UTF-8 bytes as they arrive; sniff the delimiter from the first lines;
// skip a preamble (lines before the header, "#" comments); find the header (or take a headerless file
// by position: time, oil, ambient); read each row's time, oil, ambient and heater cells; at the end
// decide the units (header, cells, a unit column or the form) and the date order, place wall-clock
// times in the airfield's zone and check that time only moves forward.
import { parse, type Info } from 'csv-parse';
import { looksLikeHeader, parseHeaterCell, rolesFromHeader, type ColumnRoles } from './columns';
import { detectTimeFormat, parseTimeCell, TIME_FORMAT_LABEL, WallClock, type TimeFormat } from './dates';
import { parseTempCell, unitFromHeader } from './units';
import { fromDisplayTemp as toCelsius, tempLabel as unitLabel } from '@/lib/units';
import type { LogSeries, ParseProblem, TempUnit, UnitChoice } from './types';
import { offsetSecondsAt } from '@/lib/weather/tz';

export const MAX_LOG_BYTES = 5 * 1024 * 1024;
export const MAX_LISTED_PROBLEMS = 50;
const SEEK_LIMIT = 50;
const PLAUSIBLE_C: [number, number] = [-60, 200];

/** A file refused as a whole (empty, binary, too large, no time column …). */
export class LogRefused extends Error {
  constructor(
    message: string,
    public code: 'empty' | 'binary' | 'encoding' | 'too_large' | 'no_header' | 'no_time' | 'no_oil' | 'no_data' = 'no_data',
    public row?: number,
  ) {
    super(message);
  }
}

export interface ReadOptions {
  /** IANA zone for wall-clock times (the airfield's). */
  timeZone: string;
  unit?: UnitChoice;
  maxBytes?: number;
}

export interface LogLayout {
  header: string[] | null;
  headerRow: number | null;
  columns: { time: string; oil: string; ambient: string | null; heater: string | null };
  delimiter: string;
  decimalComma: boolean;
  unit: TempUnit;
  unitSource: 'header' | 'cells' | 'form' | 'default';
  timeFormat: string;
  timeZone: string;
}

export interface ReadResult {
  /** True when there is no problem: the series can be stored. */
  ok: boolean;
  /** The rows read without problems (for a preview even when not ok). */
  series: LogSeries;
  layout: LogLayout;
  rowCount: number;
  sizeBytes: number;
  /** Problems that stop the upload, the first MAX_LISTED_PROBLEMS; problemCount counts them all. */
  problems: ParseProblem[];
  problemCount: number;
  /** Notes that do not stop it (skipped blank rows, the unit assumed …). */
  warnings: string[];
  /** The first data rows as written, for the preview table. */
  sample: string[][];
}

const DELIMITERS = ['\t', ';', ',', '|'];

/** The delimiter used most consistently in the first lines (ties go to tab, then ';', before ','). */
export function sniffDelimiter(text: string): string {
  const lines = text.split(/\r?\n/).filter((l) => l.trim() !== '' && !l.startsWith('#')).slice(0, 30);
  let best = ',';
  let bestScore = -1;
  for (const d of DELIMITERS) {
    const counts = lines.map((l) => l.replace(/"[^"]*"/g, '').split(d).length - 1).filter((c) => c > 0);
    if (!counts.length) continue;
    const freq = new Map<number, number>();
    for (const c of counts) freq.set(c, (freq.get(c) ?? 0) + 1);
    let mode = 0;
    let modeN = 0;
    for (const [c, n] of freq) if (n > modeN || (n === modeN && c > mode)) [mode, modeN] = [c, n];
    const score = modeN * 1000 + mode;
    if (score > bestScore) [best, bestScore] = [d, score];
  }
  return best;
}

function localStamp(ms: number, zone: string): string {
  if (!Number.isFinite(ms)) return '?';
  return new Date(ms + offsetSecondsAt(zone, ms) * 1000).toISOString().slice(0, 19).replace('T', ' ');
}

const quote = (s: string) => `"${s.length > 40 ? s.slice(0, 37) + '…' : s}"`;

/** Bytes in, checked as they come: size, NUL bytes, UTF-8. Yields text. */
async function* checkedText(source: AsyncIterable<Uint8Array>, maxBytes: number, counter: { bytes: number }) {
  const decoder = new TextDecoder('utf-8', { fatal: true });
  let first = true;
  for await (const chunk of source) {
    const start = counter.bytes;
    counter.bytes += chunk.byteLength;
    if (counter.bytes > maxBytes) {
      throw new LogRefused(`The file is larger than the ${(maxBytes / 1024 / 1024).toFixed(0)} MB limit. Split the log or export only the cool-down.`, 'too_large');
    }
    if (first && chunk.byteLength >= 2) {
      if ((chunk[0] === 0xff && chunk[1] === 0xfe) || (chunk[0] === 0xfe && chunk[1] === 0xff)) {
        throw new LogRefused('The file is saved as UTF-16 text. Save or export it as UTF-8 CSV.', 'encoding');
      }
      if (chunk[0] === 0x50 && chunk[1] === 0x4b) {
        throw new LogRefused('This is a spreadsheet or archive (zip) file, not CSV text. Save it as CSV (comma- or semicolon-separated) first.', 'binary');
      }
    }
    first = false;
    const nul = chunk.indexOf(0);
    if (nul >= 0) {
      throw new LogRefused(`This is not a text file: it holds binary data (a zero byte at byte ${start + nul + 1}). Export the log as CSV text.`, 'binary');
    }
    let text: string;
    try {
      text = decoder.decode(chunk, { stream: true });
    } catch {
      throw new LogRefused(`The file is not UTF-8 text (an invalid byte sequence between bytes ${start + 1} and ${counter.bytes}). Export it as UTF-8 CSV.`, 'encoding');
    }
    if (text) yield text;
  }
  try {
    const rest = decoder.decode();
    if (rest) yield rest;
  } catch {
    throw new LogRefused('The file is not UTF-8 text (it ends in the middle of a character). Export it as UTF-8 CSV.', 'encoding');
  }
}

/** An async iterable of chunks of a byte array (for tests and in-memory uploads). */
export async function* chunksOf(bytes: Uint8Array, size = 64 * 1024): AsyncIterable<Uint8Array> {
  for (let i = 0; i < bytes.byteLength; i += size) yield bytes.subarray(i, Math.min(i + size, bytes.byteLength));
}

interface UnitTrack {
  unit: TempUnit | null;
  row: number;
}

/** Reads a logger CSV from a byte stream. Throws LogRefused for a file that cannot be read at all. */
export async function readLog(source: AsyncIterable<Uint8Array>, opts: ReadOptions): Promise<ReadResult> {
  const maxBytes = opts.maxBytes ?? MAX_LOG_BYTES;
  const choice = opts.unit ?? 'auto';
  const zone = opts.timeZone;
  const counter = { bytes: 0 };

  const problems: ParseProblem[] = [];
  let problemCount = 0;
  const problem = (p: ParseProblem) => {
    problemCount++;
    if (problems.length < MAX_LISTED_PROBLEMS) problems.push(p);
  };
  const warnings: string[] = [];
  let skippedBlank = 0;
  let firstSkipped = 0;

  // Parsed rows (only rows without problems are kept).
  const rowLine: number[] = [];
  const tA: number[] = [];
  const tB: number[] = [];
  const oilRaw: number[] = [];
  const ambRaw: number[] = [];
  const heat: number[] = [];
  let timeKind: 'utc' | 'wall' | 'slash' | null = null;
  let anyAmPm = false;

  let delimiter = ',';
  let header: string[] | null = null;
  let headerRow: number | null = null;
  let pendingHeader: { cells: string[]; line: number } | null = null;
  let roles: ColumnRoles | null = null;
  let format: TimeFormat | null = null;
  let seekCount = 0;
  let rowCount = 0;
  let decimalComma = false;
  const sample: string[][] = [];
  const cellUnit: Record<'oil' | 'ambient' | 'rows', UnitTrack> = { oil: { unit: null, row: 0 }, ambient: { unit: null, row: 0 }, rows: { unit: null, row: 0 } };
  let names = { time: 'column 1', oil: 'column 2', ambient: null as string | null, heater: null as string | null, unit: null as string | null };

  const colName = (cells: string[] | null, i: number) => (cells && cells[i] ? cells[i] : `column ${i + 1}`);

  const trackUnit = (key: 'oil' | 'ambient' | 'rows', unit: TempUnit, line: number, column: string) => {
    const t = cellUnit[key];
    if (t.unit === null) {
      t.unit = unit;
      t.row = line;
    } else if (t.unit !== unit) {
      problem({ row: line, column, message: `Row ${line}, column ${quote(column)}: ${unitLabel(unit)}, but row ${t.row} is in ${unitLabel(t.unit)} (mixed units). Use one unit for the whole file.` });
      return false;
    }
    return true;
  };

  const setRoles = (r: ColumnRoles, cells: string[] | null) => {
    roles = r;
    names = {
      time: r.timeOfDay !== null ? `${colName(cells, r.time)} + ${colName(cells, r.timeOfDay)}` : colName(cells, r.time),
      oil: colName(cells, r.oil),
      ambient: r.ambient !== null ? colName(cells, r.ambient) : null,
      heater: r.heater !== null ? colName(cells, r.heater) : null,
      unit: r.unit !== null ? colName(cells, r.unit) : null,
    };
  };

  const dataRow = (cells: string[], line: number) => {
    const r = roles!;
    rowCount++;
    if (sample.length < 6) sample.push(cells.slice(0, 8));
    const timeText = r.timeOfDay !== null ? `${cells[r.time] ?? ''} ${cells[r.timeOfDay] ?? ''}`.trim() : (cells[r.time] ?? '');
    if (timeText === '') {
      problem({ row: line, column: names.time, message: `Row ${line}, column ${quote(names.time)}: no time.` });
      return;
    }
    if (format === null) {
      format = detectTimeFormat(timeText);
      if (format === null) {
        problem({
          row: line,
          column: names.time,
          message: `Row ${line}, column ${quote(names.time)}: ${quote(timeText)} is not a date and time Thawline reads (e.g. 2026-11-30 17:45, 30.11.2026 17:45, 11/30/2026 5:45 PM or unix seconds).`,
        });
        return;
      }
    }
    const pt = parseTimeCell(timeText, format);
    if (!pt) {
      problem({ row: line, column: names.time, message: `Row ${line}, column ${quote(names.time)}: ${quote(timeText)} is not a valid time in the file's format (${TIME_FORMAT_LABEL[format]}, as in the first row).` });
      return;
    }
    const oilText = cells[r.oil] ?? '';
    if (oilText === '') {
      skippedBlank++;
      if (!firstSkipped) firstSkipped = line;
      return;
    }
    let bad = false;
    const oil = parseTempCell(oilText, decimalComma);
    if (!oil) {
      problem({ row: line, column: names.oil, message: `Row ${line}, column ${quote(names.oil)}: ${quote(oilText)} is not a temperature (a number is expected).` });
      bad = true;
    } else if (oil.unit && !trackUnit('oil', oil.unit, line, names.oil)) bad = true;
    let amb = NaN;
    if (r.ambient !== null) {
      const ambText = cells[r.ambient] ?? '';
      if (ambText !== '') {
        const a = parseTempCell(ambText, decimalComma);
        if (!a) {
          problem({ row: line, column: names.ambient!, message: `Row ${line}, column ${quote(names.ambient!)}: ${quote(ambText)} is not a temperature (a number is expected).` });
          bad = true;
        } else {
          amb = a.value;
          if (a.unit && !trackUnit('ambient', a.unit, line, names.ambient!)) bad = true;
        }
      }
    }
    let h = 0;
    if (r.heater !== null) {
      const hv = parseHeaterCell(cells[r.heater] ?? '');
      if (hv === null) {
        problem({ row: line, column: names.heater!, message: `Row ${line}, column ${quote(names.heater!)}: ${quote(cells[r.heater] ?? '')} is not on/off (use 1/0, on/off or a power in W).` });
        bad = true;
      } else h = hv;
    }
    if (r.unit !== null) {
      const u = unitFromHeader(`(${(cells[r.unit] ?? '').replace(/[()]/g, '')})`) ?? unitFromHeader(cells[r.unit] ?? '');
      if (!u) {
        problem({ row: line, column: names.unit!, message: `Row ${line}, column ${quote(names.unit!)}: ${quote(cells[r.unit] ?? '')} is not a temperature unit (C or F).` });
        bad = true;
      } else if (!trackUnit('rows', u, line, names.unit!)) bad = true;
    }
    if (bad) return;
    if (pt.kind === 'slash') {
      tA.push(pt.mdy);
      tB.push(pt.dmy);
      if (pt.ampm) anyAmPm = true;
    } else tA.push(pt.ms);
    timeKind = pt.kind;
    rowLine.push(line);
    oilRaw.push(oil!.value);
    ambRaw.push(amb);
    heat.push(h);
  };

  const onRecord = (cells: string[], line: number) => {
    if (roles) return dataRow(cells, line);
    const nonEmpty = cells.filter((c) => c !== '');
    if (pendingHeader) {
      if (nonEmpty.length === 0) return;
      const timeByContent = cells.findIndex((c) => c !== '' && detectTimeFormat(c) !== null);
      const found = rolesFromHeader(pendingHeader.cells, timeByContent >= 0 ? timeByContent : null);
      if ('missing' in found) {
        throw new LogRefused(`Row ${pendingHeader.line}: ${found.message}`, found.missing === 'time' ? 'no_time' : 'no_oil', pendingHeader.line);
      }
      header = pendingHeader.cells;
      headerRow = pendingHeader.line;
      setRoles(found.roles, header);
      pendingHeader = null;
      return dataRow(cells, line);
    }
    seekCount++;
    if (seekCount > SEEK_LIMIT) {
      throw new LogRefused(`No header and no data in the first ${SEEK_LIMIT} rows: Thawline needs a time column and an oil temperature column.`, 'no_header');
    }
    if (nonEmpty.length < 2) return; // preamble ("Logger export", "Serial: …")
    const firstTime = detectTimeFormat(cells[0] ?? '');
    const secondNum = parseTempCell(cells[1] ?? '', decimalComma);
    if (firstTime && secondNum) {
      // No header: time, oil, then ambient if the third column holds numbers.
      const third = cells.length > 2 ? parseTempCell(cells[2] ?? '', decimalComma) : null;
      setRoles({ time: 0, timeOfDay: null, oil: 1, ambient: third ? 2 : null, heater: null, unit: null }, null);
      names = { time: 'column 1', oil: 'column 2', ambient: third ? 'column 3' : null, heater: null, unit: null };
      warnings.push(third ? 'No header row: read column 1 as the time, column 2 as the oil and column 3 as the ambient temperature.' : 'No header row: read column 1 as the time and column 2 as the oil temperature.');
      return dataRow(cells, line);
    }
    if (looksLikeHeader(cells)) {
      pendingHeader = { cells, line };
      return;
    }
    // A numeric row that does not start with a time: the file has no time column.
    if (secondNum && parseTempCell(cells[0] ?? '', decimalComma)) {
      throw new LogRefused(`Row ${line}: no time column — the first column holds ${quote(cells[0])}, not a date and time.`, 'no_time', line);
    }
  };

  // Stream: sniff the delimiter from the first few kilobytes, then feed csv-parse.
  const text = checkedText(source, maxBytes, counter);
  let head = '';
  let parser: ReturnType<typeof parse> | null = null;
  let failure: unknown = null;
  let done: Promise<void> | null = null;

  const startParser = () => {
    const stripped = head.replace(/^\uFEFF/, '');
    if (stripped.trim() === '') return false;
    delimiter = sniffDelimiter(stripped);
    decimalComma = delimiter !== ',';
    parser = parse({
      delimiter,
      relax_column_count: true,
      relax_quotes: true,
      skip_empty_lines: true,
      trim: true,
      bom: true,
      comment: '#',
      comment_no_infix: true,
      info: true,
    });
    done = new Promise<void>((resolve, reject) => {
      parser!.on('data', (rec: { record: string[]; info: Info }) => {
        if (failure) return;
        try {
          onRecord(rec.record, rec.info.lines);
        } catch (e) {
          failure = e;
          parser!.destroy();
          resolve();
        }
      });
      parser!.on('error', (e) => {
        if (!failure) failure = new LogRefused(`The CSV could not be read: ${e.message.replace(/^Invalid\s+/i, '')}`, 'no_data');
        resolve();
      });
      parser!.on('end', () => resolve());
      parser!.on('close', () => resolve());
    });
    parser.write(head);
    return true;
  };

  for await (const piece of text) {
    if (failure) break;
    if (!parser) {
      head += piece;
      if (head.length >= 16 * 1024 || head.split('\n').length > 40) startParser();
      continue;
    }
    const p = parser as ReturnType<typeof parse>;
    if (!p.write(piece)) {
      await new Promise<void>((res) => {
        p.once('drain', () => res());
        p.once('close', () => res());
      });
    }
  }
  if (!parser && !startParser()) {
    throw new LogRefused(counter.bytes === 0 ? 'The file is empty.' : 'The file holds only blank lines.', 'empty');
  }
  (parser as unknown as ReturnType<typeof parse>).end();
  await done;
  if (failure) throw failure;

  if (!roles) {
    if (pendingHeader) throw new LogRefused(`The file has a header (row ${(pendingHeader as { line: number }).line}) but no data rows.`, 'no_data');
    throw new LogRefused('No data found: Thawline needs a time column and an oil temperature column.', 'no_header');
  }
  if (rowCount === 0) throw new LogRefused(`The file has a header (row ${headerRow}) but no data rows.`, 'no_data');

  if (skippedBlank) warnings.push(`${skippedBlank} row${skippedBlank > 1 ? 's' : ''} without an oil temperature skipped (first: row ${firstSkipped}).`);

  // Units.
  const hdr = header as string[] | null;
  const r = roles as ColumnRoles;
  const headUnits: { unit: TempUnit; column: string }[] = [];
  if (hdr) {
    const ho = unitFromHeader(hdr[r.oil] ?? '');
    if (ho) headUnits.push({ unit: ho, column: hdr[r.oil] });
    if (r.ambient !== null) {
      const ha = unitFromHeader(hdr[r.ambient] ?? '');
      if (ha) headUnits.push({ unit: ha, column: hdr[r.ambient] });
    }
  }
  const stated: { unit: TempUnit; where: string; source: 'header' | 'cells' }[] = [
    ...headUnits.map((h) => ({ unit: h.unit, where: `column ${quote(h.column)}`, source: 'header' as const })),
    ...(['oil', 'ambient', 'rows'] as const)
      .filter((k) => cellUnit[k].unit)
      .map((k) => ({ unit: cellUnit[k].unit!, where: `row ${cellUnit[k].row}`, source: 'cells' as const })),
  ];
  let unit: TempUnit = 'C';
  let unitSource: LogLayout['unitSource'] = 'default';
  if (stated.length) {
    const other = stated.find((s) => s.unit !== stated[0].unit);
    if (other) {
      problem({ message: `Mixed units: ${stated[0].where} is in ${unitLabel(stated[0].unit)} but ${other.where} is in ${unitLabel(other.unit)}. Use one unit for the whole file.` });
    }
    unit = stated[0].unit;
    unitSource = stated[0].source;
    if (choice !== 'auto' && choice !== unit) {
      problem({ message: `The file says ${unitLabel(unit)} (${stated[0].where}) but the form says ${unitLabel(choice)}. Choose "Detect" or the unit the file uses.` });
    }
  } else if (choice !== 'auto') {
    unit = choice;
    unitSource = 'form';
  } else {
    warnings.push('The file does not say which unit it uses: read as °C. Choose °F on the form if the logger wrote Fahrenheit.');
  }

  // Times: the date order for slashes, then the zone.
  let formatLabel = format ? TIME_FORMAT_LABEL[format as TimeFormat] : 'unknown';
  const n = rowLine.length;
  let times = Float64Array.from(tA);
  if (timeKind === 'slash') {
    const nanA = tA.filter((v) => Number.isNaN(v)).length;
    const nanB = tB.filter((v) => Number.isNaN(v)).length;
    const mono = (a: number[]) => a.every((v, i) => i === 0 || v > a[i - 1]);
    let useDmy: boolean;
    if (nanA === 0 && nanB > 0) useDmy = false;
    else if (nanB === 0 && nanA > 0) useDmy = true;
    else if (nanA === 0 && nanB === 0) {
      const ma = mono(tA);
      const mb = mono(tB);
      useDmy = ma === mb ? !anyAmPm : mb;
      if (ma === mb && n > 1 && tA.some((v, i) => v !== tB[i])) {
        warnings.push(`Dates with slashes could be read either way: read as ${useDmy ? 'day/month/year' : 'month/day/year'}.`);
      }
    } else useDmy = nanB < nanA;
    times = Float64Array.from(useDmy ? tB : tA);
    formatLabel = TIME_FORMAT_LABEL[useDmy ? 'dmy-slash' : 'mdy-slash'];
    for (let i = 0; i < n; i++) {
      if (Number.isNaN(times[i])) problem({ row: rowLine[i], column: names.time, message: `Row ${rowLine[i]}, column ${quote(names.time)}: not a valid date as ${useDmy ? 'day/month/year' : 'month/day/year'}, the order the rest of the file uses.` });
    }
  }
  if (timeKind === 'wall' || timeKind === 'slash') {
    const clock = new WallClock(zone);
    for (let i = 0; i < n; i++) times[i] = clock.toUtc(times[i]);
  }

  const t: number[] = [];
  const oil: number[] = [];
  const amb: number[] = [];
  const heater: number[] = [];
  let lastT = -Infinity;
  let lastLine = 0;
  for (let i = 0; i < n; i++) {
    const ti = times[i];
    if (Number.isNaN(ti)) continue;
    const line = rowLine[i];
    if (ti < lastT) {
      problem({ row: line, column: names.time, message: `Row ${line}, column ${quote(names.time)}: time goes backwards — ${localStamp(ti, zone)} is before ${localStamp(lastT, zone)} in row ${lastLine}.` });
      continue;
    }
    if (ti === lastT) {
      problem({ row: line, column: names.time, message: `Row ${line}, column ${quote(names.time)}: ${localStamp(ti, zone)} repeats the time of row ${lastLine}; each row needs a later time.` });
      continue;
    }
    const o = toCelsius(oilRaw[i], unit);
    const a = toCelsius(ambRaw[i], unit);
    if (o < PLAUSIBLE_C[0] || o > PLAUSIBLE_C[1]) {
      problem({
        row: line,
        column: names.oil,
        message: `Row ${line}, column ${quote(names.oil)}: ${oilRaw[i]} ${unitLabel(unit)} is not a plausible oil temperature${unit === 'C' && oilRaw[i] > 150 && oilRaw[i] < 450 ? '; if the logger wrote °F, choose °F' : ''}.`,
      });
      continue;
    }
    if (!Number.isNaN(a) && (a < -70 || a > 70)) {
      problem({ row: line, column: names.ambient ?? '', message: `Row ${line}, column ${quote(names.ambient ?? '')}: ${ambRaw[i]} ${unitLabel(unit)} is not a plausible air temperature.` });
      continue;
    }
    lastT = ti;
    lastLine = line;
    t.push(ti);
    oil.push(o);
    amb.push(a);
    heater.push(heat[i]);
  }

  const hasAmbient = r.ambient !== null && amb.some((v) => !Number.isNaN(v));
  if (r.ambient !== null && !hasAmbient) warnings.push(`Column ${quote(names.ambient!)} has no values: fitted with a constant surrounding temperature.`);
  const series: LogSeries = {
    t: Float64Array.from(t),
    oil: Float64Array.from(oil),
    ambient: hasAmbient ? Float64Array.from(amb) : null,
    heater: r.heater !== null ? Uint8Array.from(heater) : null,
  };
  if (problemCount === 0 && series.t.length < 5) {
    problem({ message: `Only ${series.t.length} row${series.t.length === 1 ? '' : 's'} with an oil temperature: a cool-down needs more.` });
  }

  return {
    ok: problemCount === 0,
    series,
    layout: {
      header: hdr,
      headerRow,
      columns: { time: names.time, oil: names.oil, ambient: hasAmbient ? names.ambient : null, heater: names.heater },
      delimiter,
      decimalComma,
      unit,
      unitSource,
      timeFormat: formatLabel,
      timeZone: zone,
    },
    rowCount,
    sizeBytes: counter.bytes,
    problems,
    problemCount,
    warnings,
    sample,
  };
}
