import fs from 'node:fs';
import { beforeAll, describe, expect, it } from 'vitest';
import { call, DEMO, freshDatabase, signInAs, signOut } from './helpers';
import { DEMO_LOG_FILE } from '@/lib/fit/demoLog';

type Handler = (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;

let logs: typeof import('@/app/api/aircraft/[id]/logs/route');
let preview: typeof import('@/app/api/aircraft/[id]/logs/preview/route');
let oneLog: typeof import('@/app/api/aircraft/[id]/logs/[logId]/route');
let fit: typeof import('@/app/api/aircraft/[id]/logs/[logId]/fit/route');
let profile: typeof import('@/app/api/aircraft/[id]/profile/route');
let apply: typeof import('@/app/api/aircraft/[id]/profile/apply/route');
let revert: typeof import('@/app/api/aircraft/[id]/profile/revert/route');
let models: ReturnType<Awaited<typeof import('@/models')>['db']>;

const DEMO_CSV = fs.readFileSync(DEMO_LOG_FILE);

beforeAll(async () => {
  models = await freshDatabase();
  logs = await import('@/app/api/aircraft/[id]/logs/route');
  preview = await import('@/app/api/aircraft/[id]/logs/preview/route');
  oneLog = await import('@/app/api/aircraft/[id]/logs/[logId]/route');
  fit = await import('@/app/api/aircraft/[id]/logs/[logId]/fit/route');
  profile = await import('@/app/api/aircraft/[id]/profile/route');
  apply = await import('@/app/api/aircraft/[id]/profile/apply/route');
  revert = await import('@/app/api/aircraft/[id]/profile/revert/route');
});

async function idOf(registration: string) {
  return String((await models.Aircraft.findOne({ where: { registration } }))!.id);
}

/** Sends file bytes as the request body, as the upload form does. */
async function upload(handler: Handler, id: string, bytes: Uint8Array | string, query = 'fileName=cooldown.csv', headers: Record<string, string> = {}) {
  const body = typeof bytes === 'string' ? new TextEncoder().encode(bytes) : bytes;
  const req = new Request(`http://localhost/api/aircraft/${id}/logs?${query}`, { method: 'POST', body: body as unknown as BodyInit, headers: { 'content-type': 'text/csv', ...headers } });
  const res = await handler(req, { params: Promise.resolve({ id }) });
  const text = await res.text();
  return { status: res.status, body: JSON.parse(text), text };
}

const noTrace = (text: string) => expect(text).not.toMatch(/at .*\.(ts|js):\d|SELECT|Sequelize|node_modules/);

describe('uploading a logger CSV', () => {
  it('needs a session and the aircraft:edit permission (pilots are refused)', async () => {
    const id = await idOf('Q-KAPA');
    signOut();
    expect((await upload(preview.POST as Handler, id, DEMO_CSV)).status).toBe(401);
    await signInAs(DEMO.pilot);
    expect((await upload(preview.POST as Handler, id, DEMO_CSV)).status).toBe(403);
    expect((await upload(logs.POST as Handler, id, DEMO_CSV)).status).toBe(403);
    expect((await call(logs.GET, { params: { id } })).status).toBe(403);
  });

  it('previews the demo log: columns, unit, zone, no problems and the suggested cool-down from the shutdown', async () => {
    await signInAs(DEMO.operator);
    const r = await upload(preview.POST as Handler, await idOf('Q-KAPA'), DEMO_CSV);
    expect(r.status).toBe(200);
    const p = r.body.preview;
    expect(p.ok).toBe(true);
    expect(p.layout.columns).toEqual({ time: 'Time', oil: 'Oil temp (°C)', ambient: 'Hangar air (°C)', heater: null });
    expect(p.layout.timeZone).toBe('Europe/Helsinki');
    expect(p.rowCount).toBe(861);
    expect(p.series.tMs.length).toBeLessThanOrEqual(600);
    // Shutdown at 17:38 local (15:38 UTC) on 24 November.
    expect(Math.abs(p.suggestion.startMs - Date.UTC(2026, 10, 24, 15, 38))).toBeLessThanOrEqual(5 * 60_000);
    expect(await models.TempLog.count()).toBe(0);
  });

  it('lists parse problems by row in the preview and refuses to store the file (422 on "file"), storing nothing', async () => {
    await signInAs(DEMO.operator);
    const id = await idOf('Q-KAPA');
    const bad = DEMO_CSV.toString('utf8').replace('2026-11-24 18:00:00,', '2026-11-24 18:00:00,probe lost').replace(/\n2026-11-24 18:10:00,[^\n]*/, '');
    const p = await upload(preview.POST as Handler, id, bad);
    expect(p.status).toBe(200);
    expect(p.body.preview.ok).toBe(false);
    expect(p.body.preview.problems[0]).toMatchObject({ row: 54, column: 'Oil temp (°C)' });
    const s = await upload(logs.POST as Handler, id, bad);
    expect(s.status).toBe(422);
    expect(s.body.fields[0].field).toBe('file');
    expect(s.body.fields[0].message).toMatch(/^Row 54, column "Oil temp \(°C\)": "probe lost/);
    expect(s.body.message).toMatch(/nothing was stored/);
    noTrace(s.text);
    expect(await models.TempLog.count()).toBe(0);
  });

  it('refuses empty, binary and oversized files with a clear message', async () => {
    await signInAs(DEMO.operator);
    const id = await idOf('Q-KAPA');
    const empty = await upload(logs.POST as Handler, id, '');
    expect(empty.status).toBe(422);
    expect(empty.body.fields).toEqual([{ field: 'file', message: 'The file is empty.' }]);
    const bin = await upload(logs.POST as Handler, id, new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]));
    expect(bin.status).toBe(422);
    expect(bin.body.fields[0].message).toMatch(/not UTF-8|binary/);
    const big = await upload(logs.POST as Handler, id, 'x', 'fileName=big.csv', { 'content-length': String(6 * 1024 * 1024) });
    expect(big.status).toBe(413);
    expect(big.body.message).toMatch(/5 MB limit/);
    const noTime = await upload(logs.POST as Handler, id, 'Oil,Air\n80,-5\n79,-5\n');
    expect(noTime.status).toBe(422);
    expect(noTime.body.fields[0].message).toMatch(/No time column/);
    const unit = await upload(logs.POST as Handler, id, DEMO_CSV, 'unit=kelvin');
    expect(unit.status).toBe(422);
    expect(unit.body.fields[0].field).toBe('unit');
    expect(await models.TempLog.count()).toBe(0);
  });

  it('stores the log with who uploaded it and when, compactly, and lists it', async () => {
    await signInAs(DEMO.operator);
    const id = await idOf('Q-KAPA');
    const r = await upload(logs.POST as Handler, id, DEMO_CSV, 'fileName=C%3A%5Clogs%5Ccooldown-q-kapa.csv');
    expect(r.status).toBe(201);
    expect(r.body.log.fileName).toBe('cooldown-q-kapa.csv');
    expect(r.body.log.uploadedBy.name).toBe('Ilkka Brand');
    expect(Date.now() - Date.parse(r.body.log.uploadedAt)).toBeLessThan(60_000);
    expect(r.body.log.rowCount).toBe(861);
    const row = await models.TempLog.findByPk(r.body.log.id);
    expect(row!.points.byteLength).toBeLessThan(DEMO_CSV.byteLength);
    const list = await call(logs.GET, { params: { id } });
    expect(list.body.logs.map((l: { id: number }) => l.id)).toContain(r.body.log.id);
    expect(list.body.logs[0].points).toBeUndefined();
  });

  it("another organization's aircraft is not found (404) for every log route", async () => {
    await signInAs(DEMO.otherManager);
    const id = await idOf('Q-KAPA');
    const logId = String((await models.TempLog.findOne())!.id);
    expect((await upload(preview.POST as Handler, id, DEMO_CSV)).status).toBe(404);
    expect((await upload(logs.POST as Handler, id, DEMO_CSV)).status).toBe(404);
    expect((await call(logs.GET, { params: { id } })).status).toBe(404);
    expect((await call(oneLog.GET, { params: { id, logId } })).status).toBe(404);
    expect((await call(fit.POST, { method: 'POST', body: {}, params: { id, logId } })).status).toBe(404);
    expect((await call(profile.GET, { params: { id } })).status).toBe(404);
    expect((await call(apply.POST, { method: 'POST', body: { logId: Number(logId), model: 'one-node' }, params: { id } })).status).toBe(404);
    // Their own aircraft with this organization's log id: still not found.
    const own = await idOf('Q-RIDGE');
    expect((await call(oneLog.GET, { params: { id: own, logId } })).status).toBe(404);
    expect(await models.TempLog.count()).toBe(1);
  });
});

describe('fitting and applying', () => {
  let id: string;
  let logId: string;
  let original: unknown;
  beforeAll(async () => {
    id = await idOf('Q-KAPA');
    logId = String((await models.TempLog.findOne())!.id);
    original = (await models.Aircraft.findByPk(Number(id)))!.thermal;
  });

  it('refuses to apply a log that was never fitted (409)', async () => {
    await signInAs(DEMO.operator);
    const r = await call(apply.POST, { method: 'POST', body: { logId: Number(logId), model: 'one-node' }, params: { id } });
    expect(r.status).toBe(409);
  });

  it('validates the fit request: 422 naming the field', async () => {
    await signInAs(DEMO.operator);
    const back = await call(fit.POST, { method: 'POST', body: { window: { start: '2026-11-25T04:00:00Z', end: '2026-11-24T16:00:00Z' } }, params: { id, logId } });
    expect(back.status).toBe(422);
    expect(back.body.fields[0].field).toBe('window.end');
    const junk = await call(fit.POST, { method: 'POST', body: { heatCapacityJPerK: 'lots', extra: 1 }, params: { id, logId } });
    expect(junk.status).toBe(422);
    expect(junk.body.fields.map((f: { field: string }) => f.field)).toEqual(expect.arrayContaining(['heatCapacityJPerK']));
    const outside = await call(fit.POST, { method: 'POST', body: { window: { start: '2025-01-01T00:00:00Z', end: '2025-01-02T00:00:00Z' } }, params: { id, logId } });
    expect(outside.status).toBe(422);
    expect(outside.body.fields[0].field).toBe('window.start');
    const short = await call(fit.POST, { method: 'POST', body: { window: { start: '2026-11-24T15:40:00Z', end: '2026-11-24T15:50:00Z' } }, params: { id, logId } });
    expect(short.status).toBe(422);
    expect(short.body.fields[0].field).toBe('window');
    noTrace(short.text);
  });

  it('fits the suggested window: one node and two nodes with RMSE, R² and uncertainties, kept on the log', async () => {
    await signInAs(DEMO.operator);
    const r = await call(fit.POST, { method: 'POST', body: {}, params: { id, logId } });
    expect(r.status).toBe(200);
    const f = r.body.fit;
    expect(f.oneNode.tauH.value).toBeGreaterThan(1);
    expect(f.oneNode.tauH.sigma).toBeGreaterThan(0);
    expect(f.oneNode.r2).toBeGreaterThan(0.99);
    expect(f.twoNode.supported).toBe(true);
    expect(f.recommended).toBe('two-node');
    expect(f.chart.tMs.length).toBe(f.chart.oilC.length);
    const g = await call(oneLog.GET, { params: { id, logId } });
    expect(g.body.log.fitted).toBe(true);
    expect(g.body.log.window.startMs).toBe(f.window.startMs);
    expect(g.body.fit.oneNode.tauH.value).toBe(f.oneNode.tauH.value);
  });

  it('applies the two-node fit, keeping the profile before it; then the one-node fit; then goes back', async () => {
    await signInAs(DEMO.operator);
    const two = await call(apply.POST, { method: 'POST', body: { logId: Number(logId), model: 'two-node', note: 'First calibration' }, params: { id } });
    expect(two.status).toBe(201);
    expect(two.body.thermal.source).toBe('fitted');
    expect(two.body.thermal.nodes.length).toBe(2);
    expect(two.body.revisions.map((r: { kind: string }) => r.kind)).toEqual(['fitted', 'initial']);
    expect(two.body.revisions[1].thermal).toEqual(original);
    expect(two.body.revisions[0].current).toBe(true);
    expect(two.body.revisions[0].author.name).toBe('Ilkka Brand');
    expect(two.body.revisions[0].summary.model).toBe('two-node');

    const one = await call(apply.POST, { method: 'POST', body: { logId: Number(logId), model: 'one-node' }, params: { id } });
    expect(one.status).toBe(201);
    expect(one.body.thermal.nodes.length).toBe(1);
    const stored = (await models.Aircraft.findByPk(Number(id)))!.thermal;
    expect(stored.nodes[0].lossWPerK).toBe(one.body.thermal.nodes[0].lossWPerK);

    const initial = one.body.revisions.find((r: { kind: string }) => r.kind === 'initial');
    const back = await call(revert.POST, { method: 'POST', body: { revisionId: initial.id }, params: { id } });
    expect(back.status).toBe(201);
    expect(back.body.thermal).toEqual(original);
    expect(back.body.revisions[0]).toMatchObject({ kind: 'revert', restoredFromId: initial.id, current: true });
    expect((await models.Aircraft.findByPk(Number(id)))!.thermal).toEqual(original);
    const p = await call(profile.GET, { params: { id } });
    expect(p.body.revisions.length).toBe(4);
  });

  it('a fit logged with the cover on is applied as the uncovered loss (divided by the cover factor)', async () => {
    await signInAs(DEMO.operator);
    const r = await call(fit.POST, { method: 'POST', body: { coverOn: true, twoNode: false }, params: { id, logId } });
    expect(r.status).toBe(200);
    const a = await call(apply.POST, { method: 'POST', body: { logId: Number(logId), model: 'one-node' }, params: { id } });
    const cf = (original as { coverFactor: number }).coverFactor;
    expect(a.body.thermal.nodes[0].lossWPerK).toBeCloseTo(r.body.fit.oneNode.lossWPerK.value / cf, 2);
    // This fit did not try two nodes, so the two-node model cannot be applied.
    const two = await call(apply.POST, { method: 'POST', body: { logId: Number(logId), model: 'two-node' }, params: { id } });
    expect(two.status).toBe(409);
  });

  it('refuses a revision of another aircraft, and bad bodies, naming the field', async () => {
    await signInAs(DEMO.operator);
    const other = await idOf('Q-LUMI');
    const rev = (await models.ProfileRevision.findOne({ where: { aircraftId: Number(id) } }))!;
    const r = await call(revert.POST, { method: 'POST', body: { revisionId: rev.id }, params: { id: other } });
    expect(r.status).toBe(422);
    expect(r.body.fields[0].field).toBe('revisionId');
    const m = await call(apply.POST, { method: 'POST', body: { logId: 'x', model: 'three-node' }, params: { id } });
    expect(m.status).toBe(422);
    expect(m.body.fields.map((f: { field: string }) => f.field).sort()).toEqual(['logId', 'model']);
  });

  it('deletes a log; the revisions applied from it stay', async () => {
    await signInAs(DEMO.manager);
    const before = await models.ProfileRevision.count({ where: { aircraftId: Number(id) } });
    const d = await call(oneLog.DELETE, { method: 'DELETE', params: { id, logId } });
    expect(d.status).toBe(200);
    expect(await models.TempLog.count()).toBe(0);
    expect(await models.ProfileRevision.count({ where: { aircraftId: Number(id) } })).toBe(before);
  });
});
