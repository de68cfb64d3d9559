import 'server-only';
import type { Transaction } from 'sequelize';
import { db } from '@/models';
import type { ThermalParams } from '@/lib/views/aircraft';
import type { TempLog } from '@/models/TempLog';
import type { ProfileRevision, RevisionKind } from '@/models/ProfileRevision';
import { Conflict, Invalid, NotFound, TooLarge } from '@/lib/api/errors';
import { getAircraft, type AircraftRecord } from '@/lib/data/aircraft';
import { engineFromPreset, ENGINE_CLASSES, type EngineClassId } from '@/lib/thermal/presets';
import { readLog, LogRefused, MAX_LOG_BYTES, type ReadResult } from '@/lib/fit/csv';
import { packSeries, unpackSeries } from '@/lib/fit/pack';
import { suggestWindow, } from '@/lib/fit/window';
import { fitCooldown, FitRefused, type FitReport } from '@/lib/fit/cooldown';
import type { LogSeries, UnitChoice } from '@/lib/fit/types';
import type { FitRequest } from '@/lib/validation/logs';
import { writeTransaction } from '@/models/transaction';
import type { LogPreview, LogRecord, RevisionRecord, SeriesForChart, StoredFit } from '@/lib/views/logs';

export type { LogPreview, LogRecord, RevisionRecord, SeriesForChart, StoredFit };

// Fit from log: uploaded temperature logs of one aircraft, their fits, and the history of the aircraft's
// thermal profile (apply a fit, go back to any earlier profile). Always scoped to one organization:
// another organization's aircraft, log or revision is "not found".

const PREVIEW_POINTS = 600;


/** The aircraft's airfield zone (UTC when it has no home shelter). */
export function zoneOf(a: AircraftRecord): string {
  return a.airfield?.timeZone ?? 'UTC';
}

function thinSeries(s: LogSeries, max = PREVIEW_POINTS): SeriesForChart {
  const n = s.t.length;
  const idx = n <= max ? Array.from({ length: n }, (_, i) => i) : Array.from({ length: max }, (_, j) => Math.round((j * (n - 1)) / (max - 1)));
  const r2 = (v: number) => (Number.isNaN(v) ? NaN : Math.round(v * 100) / 100);
  return {
    tMs: idx.map((i) => s.t[i]),
    oilC: idx.map((i) => r2(s.oil[i])),
    ambientC: s.ambient ? idx.map((i) => r2(s.ambient![i])) : null,
  };
}

/** Reads an upload; a file refused as a whole becomes 413 (size) or 422 naming the file field. */
async function read(source: AsyncIterable<Uint8Array>, zone: string, unit: UnitChoice): Promise<ReadResult> {
  try {
    return await readLog(source, { timeZone: zone, unit, maxBytes: MAX_LOG_BYTES });
  } catch (e) {
    if (e instanceof LogRefused) {
      if (e.code === 'too_large') throw new TooLarge(e.message);
      throw new Invalid([{ field: 'file', message: e.message }], e.message);
    }
    throw e;
  }
}

function previewOf(fileName: string, r: ReadResult): LogPreview {
  const n = r.series.t.length;
  return {
    fileName,
    sizeBytes: r.sizeBytes,
    rowCount: r.rowCount,
    ok: r.ok,
    layout: r.layout,
    problems: r.problems,
    problemCount: r.problemCount,
    warnings: r.warnings,
    sample: r.sample,
    span: n ? { startMs: r.series.t[0], endMs: r.series.t[n - 1] } : null,
    suggestion: r.ok ? suggestWindow(r.series) : null,
    series: thinSeries(r.series),
  };
}

/** Parses an upload without storing it: what was found, the problems by row, the suggested cool-down. */
export async function previewLog({ orgId, aircraftId, source, fileName, unit }: { orgId: number; aircraftId: number; source: AsyncIterable<Uint8Array>; fileName: string; unit: UnitChoice }) {
  const aircraft = await getAircraft({ orgId, aircraftId });
  const r = await read(source, zoneOf(aircraft), unit);
  return previewOf(fileName, r);
}

function logRecord(l: TempLog & { uploader?: { id: number; name: string } | null }): LogRecord {
  return {
    id: l.id,
    aircraftId: l.aircraftId,
    fileName: l.fileName,
    sizeBytes: l.sizeBytes,
    rowCount: l.rowCount,
    startAt: new Date(l.startAt).toISOString(),
    endAt: new Date(l.endAt).toISOString(),
    hasAmbient: l.hasAmbient,
    layout: l.layout,
    warnings: l.warnings ?? [],
    uploadedBy: l.uploader ? { id: l.uploader.id, name: l.uploader.name } : null,
    uploadedAt: new Date(l.createdAt).toISOString(),
    window: l.windowStartAt && l.windowEndAt ? { startMs: new Date(l.windowStartAt).getTime(), endMs: new Date(l.windowEndAt).getTime() } : null,
    coverOn: l.coverOn,
    fitted: l.fit != null,
  };
}

/**
 * Parses and stores an upload in one transaction, with who uploaded it and when. A file with any problem
 * is refused (422, every problem listed under the field "file") and nothing is stored.
 */
export async function storeLog({
  orgId,
  aircraftId,
  userId,
  source,
  fileName,
  unit,
}: {
  orgId: number;
  aircraftId: number;
  userId: number;
  source: AsyncIterable<Uint8Array>;
  fileName: string;
  unit: UnitChoice;
}): Promise<{ log: LogRecord; preview: LogPreview }> {
  const aircraft = await getAircraft({ orgId, aircraftId });
  if (aircraft.archived) throw new Conflict('This aircraft is archived: restore it before adding logs.');
  const r = await read(source, zoneOf(aircraft), unit);
  if (!r.ok) {
    const n = r.problemCount;
    throw new Invalid(
      r.problems.map((p) => ({ field: 'file', message: p.message })),
      `The file has ${n} problem${n === 1 ? '' : 's'}; nothing was stored. First: ${r.problems[0]?.message ?? ''}`,
    );
  }
  const { TempLog } = db();
  const s = r.series;
  const preview = previewOf(fileName, r);
  const log = await writeTransaction(async (transaction) => {
    const row = await TempLog.create(
      {
        organizationId: orgId,
        aircraftId,
        uploadedById: userId,
        fileName,
        sizeBytes: r.sizeBytes,
        rowCount: s.t.length,
        startAt: new Date(s.t[0]),
        endAt: new Date(s.t[s.t.length - 1]),
        hasAmbient: s.ambient !== null,
        layout: {
          columns: r.layout.columns,
          unit: r.layout.unit,
          unitSource: r.layout.unitSource,
          timeFormat: r.layout.timeFormat,
          timeZone: r.layout.timeZone,
          delimiter: r.layout.delimiter,
          headerRow: r.layout.headerRow,
        },
        warnings: r.warnings,
        points: packSeries(s),
      },
      { transaction },
    );
    return row;
  });
  return { log: await getLogRecord({ orgId, aircraftId, logId: log.id }), preview };
}

async function findLog({ orgId, aircraftId, logId, transaction }: { orgId: number; aircraftId: number; logId: number; transaction?: Transaction }) {
  const { TempLog, User } = db();
  const l = await TempLog.findOne({
    where: { id: logId, organizationId: orgId, aircraftId },
    include: [{ model: User, as: 'uploader', attributes: ['id', 'name'] }],
    transaction,
  });
  if (!l) throw new NotFound('Log');
  return l as TempLog & { uploader?: { id: number; name: string } | null };
}

async function getLogRecord(p: { orgId: number; aircraftId: number; logId: number }) {
  return logRecord(await findLog(p));
}

export async function listLogs({ orgId, aircraftId }: { orgId: number; aircraftId: number }): Promise<LogRecord[]> {
  await getAircraft({ orgId, aircraftId });
  const { TempLog, User } = db();
  const rows = await TempLog.findAll({
    where: { organizationId: orgId, aircraftId },
    attributes: { exclude: ['points', 'fit'] },
    include: [{ model: User, as: 'uploader', attributes: ['id', 'name'] }],
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
  });
  return rows.map((r) => logRecord(r as TempLog & { uploader?: { id: number; name: string } | null }));
}

/** A stored log with its series for the chart, the suggested window and its last fit. */
export async function getLog({ orgId, aircraftId, logId }: { orgId: number; aircraftId: number; logId: number }) {
  await getAircraft({ orgId, aircraftId });
  const l = await findLog({ orgId, aircraftId, logId });
  const s = unpackSeries(l.points);
  return { log: logRecord(l), series: thinSeries(s), suggestion: suggestWindow(s), fit: (l.fit as FitReport | null) ?? null };
}

export async function deleteLog({ orgId, aircraftId, logId }: { orgId: number; aircraftId: number; logId: number }) {
  await getAircraft({ orgId, aircraftId });
  const l = await findLog({ orgId, aircraftId, logId });
  await l.destroy();
  return { ok: true };
}

/**
 * The heat capacities a fit assumes. A cool-down tells the time constants, not the heat capacity, so the
 * total comes from the profile (or the person); the oil's share of it — which shapes the two-node curve —
 * follows from the oil quantity and the engine class's masses (the soak model's preset), or the profile's
 * own split when the class is unknown.
 */
export function capacitiesFor(a: Pick<AircraftRecord, 'thermal' | 'engineClass' | 'oilQuantityL'>, totalOverride?: number) {
  const nodes = a.thermal.nodes;
  const profileTotal = nodes.reduce((s, n) => s + n.heatCapacityJPerK, 0);
  const total = totalOverride ?? profileTotal;
  let share: number;
  if (a.engineClass in ENGINE_CLASSES) {
    const p = engineFromPreset(a.engineClass as EngineClassId, { oilL: a.oilQuantityL });
    share = p.nodes[0].heatCapacityJPerK / (p.nodes[0].heatCapacityJPerK + p.nodes[1].heatCapacityJPerK);
  } else share = nodes.length === 2 ? nodes[0].heatCapacityJPerK / profileTotal : 0.1;
  return { total, oil: total * share, engine: total * (1 - share), oilShare: share };
}


/** Fits the log's cool-down (the given window or the suggested one) and keeps the window and the fit on the log. */
export async function fitLog({ orgId, aircraftId, logId, input }: { orgId: number; aircraftId: number; logId: number; input: FitRequest }): Promise<{ fit: StoredFit; log: LogRecord }> {
  const aircraft = await getAircraft({ orgId, aircraftId });
  const l = await findLog({ orgId, aircraftId, logId });
  const s = unpackSeries(l.points);
  let window = input.window ? { startMs: input.window.start.getTime(), endMs: input.window.end.getTime() } : null;
  if (!window) {
    const w = suggestWindow(s);
    if (!w) throw new Invalid([{ field: 'window', message: 'No cool-down found in this log (no fall of at least 3 K): choose the window by hand.' }]);
    window = { startMs: w.startMs, endMs: w.endMs };
  }
  const first = s.t[0];
  const last = s.t[s.t.length - 1];
  if (window.endMs < first || window.startMs > last) {
    throw new Invalid([{ field: 'window.start', message: 'The window lies outside the log.' }]);
  }
  const caps = capacitiesFor(aircraft, input.heatCapacityJPerK);
  let report: FitReport;
  try {
    report = fitCooldown(s, window, { heatCapacityJPerK: caps.total, oilHeatCapacityJPerK: caps.oil, engineHeatCapacityJPerK: caps.engine, twoNode: input.twoNode });
  } catch (e) {
    if (e instanceof FitRefused) throw new Invalid([{ field: 'window', message: e.message }], e.message);
    throw e;
  }
  const fit: StoredFit = { ...report, coverOn: input.coverOn, coverFactor: aircraft.thermal.coverFactor };
  l.windowStartAt = new Date(window.startMs);
  l.windowEndAt = new Date(window.endMs);
  l.coverOn = input.coverOn;
  l.fit = fit;
  await l.save();
  return { fit, log: logRecord(l) };
}

// ---------------------------------------------------------------------------------------------
// Profile history

const r3 = (v: number) => Math.round(v * 1000) / 1000;

/** The thermal parameters a stored fit gives, with the losses scaled back to the uncovered engine. */
export function thermalFromFit(fit: StoredFit, model: 'one-node' | 'two-node', coverFactor: number): ThermalParams {
  const scale = fit.coverOn ? 1 / coverFactor : 1;
  if (model === 'two-node') {
    const t = fit.twoNode;
    if (!t?.supported || !t.oilLossWPerK || !t.engineLossWPerK || !t.couplingWPerK) {
      throw new Conflict(t?.reason ? `The two-node fit cannot be applied: ${t.reason}` : 'This fit has no two-node result.');
    }
    return {
      nodes: [
        { name: 'oil', heatCapacityJPerK: Math.round(t.oilHeatCapacityJPerK!), lossWPerK: r3(t.oilLossWPerK.value * scale) },
        { name: 'engine', heatCapacityJPerK: Math.round(t.engineHeatCapacityJPerK!), lossWPerK: r3(t.engineLossWPerK.value * scale) },
      ],
      couplingWPerK: r3(t.couplingWPerK.value),
      coverFactor,
      source: 'fitted',
    };
  }
  return {
    nodes: [{ name: 'oil', heatCapacityJPerK: Math.round(fit.heatCapacityJPerK), lossWPerK: r3(fit.oneNode.lossWPerK.value * scale) }],
    coverFactor,
    source: 'fitted',
  };
}

function revisionRecord(r: ProfileRevision & { author?: { id: number; name: string } | null }, currentId: number | null): RevisionRecord {
  return {
    id: r.id,
    kind: r.kind,
    thermal: r.thermal,
    tempLogId: r.tempLogId ?? null,
    restoredFromId: r.restoredFromId ?? null,
    summary: r.summary ?? null,
    note: r.note ?? '',
    author: r.author ? { id: r.author.id, name: r.author.name } : null,
    createdAt: new Date(r.createdAt).toISOString(),
    current: r.id === currentId,
  };
}

/**
 * Records a change of an aircraft's thermal profile and applies it, in the caller's transaction: the
 * profile as it was is kept first as the "initial" revision when the history is empty, so the way back
 * always exists. Also for manual edits of the profile elsewhere (kind "manual").
 */
export async function recordThermalChange({
  orgId,
  aircraftId,
  userId,
  thermal,
  kind,
  tempLogId = null,
  restoredFromId = null,
  summary = null,
  note = '',
  transaction,
}: {
  orgId: number;
  aircraftId: number;
  userId: number | null;
  thermal: ThermalParams;
  kind: Exclude<RevisionKind, 'initial'>;
  tempLogId?: number | null;
  restoredFromId?: number | null;
  summary?: Record<string, unknown> | null;
  note?: string;
  transaction: Transaction;
}) {
  const { Aircraft, ProfileRevision } = db();
  const a = await Aircraft.findOne({ where: { id: aircraftId, organizationId: orgId }, transaction });
  if (!a) throw new NotFound('Aircraft');
  const count = await ProfileRevision.count({ where: { organizationId: orgId, aircraftId }, transaction });
  if (count === 0) {
    await ProfileRevision.create(
      { organizationId: orgId, aircraftId, kind: 'initial', thermal: a.thermal, tempLogId: null, createdById: null, note: 'The profile before its first recorded change.' },
      { transaction },
    );
  }
  const rev = await ProfileRevision.create(
    { organizationId: orgId, aircraftId, kind, thermal, tempLogId, restoredFromId, summary, note, createdById: userId },
    { transaction },
  );
  a.thermal = thermal;
  a.changed('thermal', true);
  await a.save({ transaction });
  return rev;
}

/** Applies a log's stored fit (one or two nodes) to the aircraft's profile, keeping the history. */
export async function applyFit({ orgId, aircraftId, userId, logId, model, note }: { orgId: number; aircraftId: number; userId: number; logId: number; model: 'one-node' | 'two-node'; note: string }) {
  const aircraft = await getAircraft({ orgId, aircraftId });
  if (aircraft.archived) throw new Conflict('This aircraft is archived: restore it before changing its profile.');
  db();
  const rev = await writeTransaction(async (transaction) => {
    const l = await findLog({ orgId, aircraftId, logId, transaction });
    const fit = l.fit as StoredFit | null;
    if (!fit) throw new Conflict('Fit this log before applying it.');
    const thermal = thermalFromFit(fit, model, aircraft.thermal.coverFactor);
    const summary =
      model === 'two-node'
        ? { model, tauFastH: fit.twoNode!.tauFastH, tauSlowH: fit.twoNode!.tauSlowH, rmseK: fit.twoNode!.rmseK, r2: fit.twoNode!.r2, coverOn: fit.coverOn, fileName: l.fileName }
        : { model, tauH: fit.oneNode.tauH.value, tauSigmaH: fit.oneNode.tauH.sigma, rmseK: fit.oneNode.rmseK, r2: fit.oneNode.r2, coverOn: fit.coverOn, fileName: l.fileName };
    return recordThermalChange({ orgId, aircraftId, userId, thermal, kind: 'fitted', tempLogId: l.id, summary, note, transaction });
  });
  return getProfile({ orgId, aircraftId, highlight: rev.id });
}

/** Goes back to an earlier profile: it becomes current again, recorded as a new "revert" revision. */
export async function revertProfile({ orgId, aircraftId, userId, revisionId, note }: { orgId: number; aircraftId: number; userId: number; revisionId: number; note: string }) {
  const aircraft = await getAircraft({ orgId, aircraftId });
  if (aircraft.archived) throw new Conflict('This aircraft is archived: restore it before changing its profile.');
  const { ProfileRevision } = db();
  const rev = await writeTransaction(async (transaction) => {
    const target = await ProfileRevision.findOne({ where: { id: revisionId, organizationId: orgId, aircraftId }, transaction });
    if (!target) throw new Invalid([{ field: 'revisionId', message: 'No such revision of this aircraft’s profile.' }]);
    return recordThermalChange({ orgId, aircraftId, userId, thermal: target.thermal, kind: 'revert', restoredFromId: target.id, summary: target.summary ?? null, note, transaction });
  });
  return getProfile({ orgId, aircraftId, highlight: rev.id });
}

/** The aircraft's current thermal profile and its history, newest first. */
export async function getProfile({ orgId, aircraftId, highlight }: { orgId: number; aircraftId: number; highlight?: number }) {
  const aircraft = await getAircraft({ orgId, aircraftId });
  const { ProfileRevision, User } = db();
  const rows = await ProfileRevision.findAll({
    where: { organizationId: orgId, aircraftId },
    include: [{ model: User, as: 'author', attributes: ['id', 'name'] }],
    order: [['id', 'DESC']],
  });
  // The newest revision is the current profile unless it was changed elsewhere since.
  const newest = rows[0];
  const same = newest && JSON.stringify(newest.thermal) === JSON.stringify(aircraft.thermal);
  const currentId = same ? newest.id : null;
  return {
    thermal: aircraft.thermal,
    revisions: rows.map((r) => revisionRecord(r as ProfileRevision & { author?: { id: number; name: string } | null }, currentId)),
    ...(highlight ? { revisionId: highlight } : {}),
  };
}
