// A seeded fuzz of every write route: thousands of bodies (control characters, wrong types, deep and
// oversized values, near-valid bodies with one field spoiled, raw text that is not JSON, other content
// types) against real and made-up record ids. No answer may be a 5xx; afterwards every job runs green.
import fs from 'node:fs';
import path from 'node:path';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { DEMO, freshDatabase, signInAs } from './helpers';

type Handler = (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;
interface Target {
  file: string;
  method: 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  handler: Handler;
  params: string[];
}

const SEED = 15_2026;
const RUNS_PER_TARGET = 60;
const API = path.resolve(__dirname, '../../app/api');

let models: Awaited<ReturnType<typeof freshDatabase>>;
let targets: Target[] = [];
const logged: string[] = [];

function routeFiles(dir: string): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const p = path.join(dir, e.name);
    if (e.isDirectory()) return routeFiles(p);
    return e.name === 'route.ts' ? [p] : [];
  });
}

beforeAll(async () => {
  models = await freshDatabase();
  for (const file of routeFiles(API)) {
    const rel = path.relative(API, file);
    if (rel.startsWith('auth') || rel.startsWith('fake-weather')) continue; // next-auth's own handler; the local fake service
    const mod = (await import(file)) as Record<string, unknown>;
    const params = [...rel.matchAll(/\[(\w+)\]/g)].map((m) => m[1]);
    for (const method of ['POST', 'PATCH', 'PUT', 'DELETE'] as const) {
      if (typeof mod[method] === 'function') targets.push({ file: rel, method, handler: mod[method] as Handler, params });
    }
  }
  targets = targets.sort((a, b) => `${a.file}${a.method}`.localeCompare(`${b.file}${b.method}`));
  // Unknown errors are logged by the error mapper; keep them to show which route failed.
  vi.spyOn(console, 'error').mockImplementation((...a: unknown[]) => void logged.push(a.map(String).join(' ')));
  vi.spyOn(console, 'warn').mockImplementation(() => {});
}, 120_000);
afterAll(() => vi.restoreAllMocks());

const CONTROL = fc.constantFrom('\u0000', '\u0001', '\u0007', '\b', '\t', '\n', '\r', '\u000b', '\u001b', '\u001f', '\u007f');
const nastyString = fc.oneof(
  fc.string({ maxLength: 40 }),
  fc.string({ unit: 'binary', maxLength: 40 }),
  fc.tuple(fc.string({ maxLength: 10 }), CONTROL, fc.string({ maxLength: 10 })).map(([a, c, b]) => `${a}${c}${b}`),
  fc.constantFrom('', ' ', 'A\u0000B', '\u0000', "'; DROP TABLE users; --", '<script>alert(1)</script>', '2026-12-03T07:30', '2026-12-03T05:30:00Z', 'not-a-date', 'NaN', '1e309', '-0', 'Q-KAPA', 'pilot', 'manager', 'email', 'app', 'off', 'a@b.test', 'pilot@frostvale.test', '22:00', '25:99', 'Europe/Helsinki', 'Mars/Olympus', 'EUR', 'oil', 'engine', 'C', 'F', 'L', 'qt', 'x'.repeat(5000)),
);
const scalar = fc.oneof(nastyString, fc.integer(), fc.integer({ min: -2, max: 40 }), fc.double({ noNaN: true }), fc.boolean(), fc.constant(null), fc.constantFrom(0, -1, 1, 2 ** 31, 1e12, -40, 20, 90));
const KEYS = [
  'name', 'email', 'role', 'temporaryPassword', 'password', 'confirm', 'token', 'currentPassword', 'newPassword', 'tempUnit', 'volumeUnit',
  'aircraftId', 'pilotId', 'departAt', 'readyC', 'floorC', 'notes', 'registration', 'typeLabel', 'engineClass', 'shelterId', 'airfieldId',
  'heaters', 'kind', 'powerW', 'node', 'control', 'slotMinutes', 'thermal', 'coverOnByDefault', 'ident', 'latitude', 'longitude', 'elevationM',
  'timeZone', 'currency', 'periods', 'from', 'to', 'pricePerKWh', 'quietStart', 'quietEnd', 'oilTooCold', 'switchOn', 'coldNight',
  'emailEnabled', 'reminderLeadMinutes', 'acknowledged', 'active', 'archived', 'checkedAt', 'level', 'quantity', 'oilGrade', 'changedAt',
  'engineHours', 'note', 'fileName', 'csv', 'content', 'revisionId', 'pilotIds', 'lastShutdownAt', 'lastShutdownOilC', 'shelter', 'aircraft',
  '__proto__', 'constructor', 'id', 'organizationId',
];
const { value } = fc.letrec((tie) => ({
  value: fc.oneof({ depthSize: 'small', withCrossShrink: true }, scalar, scalar, fc.array(tie('value'), { maxLength: 4 }), fc.dictionary(fc.constantFrom(...KEYS), tie('value'), { maxKeys: 4 })),
}));
const bodyArb = fc.oneof(
  { weight: 5, arbitrary: fc.dictionary(fc.constantFrom(...KEYS), value, { maxKeys: 8 }) },
  { weight: 1, arbitrary: value },
);

/** A valid body for the main forms (`n` keeps unique values unique), to be spoiled in one field. */
function validBody(t: Target, ids: Ids, n: number): Record<string, unknown> | null {
  const day = new Date(Date.now() + (8 + (n % 50)) * 86_400_000).toISOString().slice(0, 10);
  const key = `${t.method} ${t.file}`;
  const now = new Date(Date.now() - 3_600_000).toISOString();
  const bodies: Record<string, Record<string, unknown>> = {
    'POST departures/route.ts': { aircraftId: ids.aircraft[n % ids.aircraft.length], departAt: `${day}T07:30`, notes: 'Navigation exercise' },
    'PATCH departures/[id]/route.ts': { notes: 'Changed' },
    'POST users/route.ts': { name: 'New Member', email: `fuzz${n}@frostvale.test`, role: 'pilot' },
    'PATCH users/[id]/route.ts': { role: 'pilot' },
    'PATCH me/route.ts': { name: 'Tove Rask', tempUnit: 'C' },
    'PUT me/preferences/route.ts': { timeZone: 'Europe/Helsinki', quietStart: '22:00', quietEnd: '06:00' },
    'PATCH me/preferences/route.ts': { reminderLeadMinutes: 30 },
    'POST aircraft/route.ts': { registration: `Q-F${n}`, typeLabel: 'Two-seat trainer', engineClass: 'lc-drysump-4', shelterId: ids.shelter[0] },
    'PATCH aircraft/[id]/route.ts': { typeLabel: 'Two-seat trainer' },
    'POST airfields/route.ts': { name: `Fuzz field ${n}`, ident: `FZ${n % 1000}`, latitude: 61, longitude: 25, elevationM: 100, timeZone: 'Europe/Helsinki' },
    'PATCH airfields/[id]/route.ts': { name: `Renamed ${n}` },
    'POST airfields/[id]/shelters/route.ts': { name: `Shed ${n}`, kind: 'tie-down' },
    'PUT airfields/[id]/tariff/route.ts': { currency: 'EUR', periods: [{ name: 'Flat', pricePerKWh: 0.2 }] },
    'POST aircraft/[id]/oil/checks/route.ts': { checkedAt: now, level: 5, oilTemp: 10, outsideTemp: -5, notes: 'ok' },
    'POST aircraft/[id]/oil/changes/route.ts': { changedAt: now, engineHours: 100, oilGrade: '15W-50', notes: 'ok' },
    'POST tokens/reset-request/route.ts': { email: DEMO.pilot },
  };
  return bodies[key] ?? null;
}

/** Near-valid bodies: one of the body's own fields carries a control character, or any field any value. */
function nearValid(t: Target, ids: Ids, seed: number): unknown[] {
  const withControl = fc.tuple(fc.string({ maxLength: 8 }), CONTROL, fc.string({ maxLength: 8 })).map(([a, c, b]) => `${a || 'A'}${c}${b || 'B'}`);
  const cases = fc.sample(fc.tuple(fc.nat(), fc.boolean(), withControl, fc.constantFrom(...KEYS), value), { seed, numRuns: RUNS_PER_TARGET / 2 });
  return cases.flatMap(([n, own, ctl, anyKey, anyValue]) => {
    const b = validBody(t, ids, n);
    if (!b) return [];
    const keys = Object.keys(b).filter((k) => typeof b[k] === 'string');
    return [own && keys.length ? { ...b, [keys[n % keys.length]]: ctl } : { ...b, [anyKey]: anyValue }];
  });
}

interface Ids {
  aircraft: number[];
  shelter: number[];
  any: Record<string, string[]>;
}

async function idPool(): Promise<Ids> {
  const pick = async (model: { findAll: (o: object) => Promise<unknown[]> }) => ((await model.findAll({ attributes: ['id'], limit: 3 })) as { id: number }[]).map((r) => r.id);
  const aircraft = await pick(models.Aircraft);
  const shelter = await pick(models.Shelter);
  const made = ['0', '-1', '999999', 'abc', '1e3', '1.5', 'A\u0000B', ''];
  const s = (xs: number[]) => [...xs.map(String), ...made];
  return {
    aircraft,
    shelter,
    any: {
      id: s([...aircraft, ...(await pick(models.Airfield)), ...(await pick(models.Departure)), ...(await pick(models.User)), ...(await pick(models.Alert))]),
      logId: s(await pick(models.TempLog)),
      changeId: s(await pick(models.OilChange)),
      checkId: s(await pick(models.OilCheck)),
      shelterId: s(shelter),
    },
  };
}

async function send(t: Target, params: Record<string, string>, body: { json?: unknown; raw?: string; type?: string }) {
  const headers: Record<string, string> = { 'content-type': body.type ?? 'application/json' };
  const init: RequestInit = { method: t.method, headers };
  if (t.method !== 'DELETE' || body.json !== undefined || body.raw !== undefined) init.body = body.raw ?? JSON.stringify(body.json);
  const res = await t.handler(new Request('http://localhost/api/fuzz', init), { params: Promise.resolve(params) });
  await res.text();
  return res.status;
}

describe('fuzz of every write route', () => {
  it('answers no 5xx to thousands of bad bodies, then every job runs green', async () => {
    expect(targets.length).toBeGreaterThan(40);
    const ids = await idPool();
    const statuses: Record<string, number> = {};
    const failures: string[] = [];
    let calls = 0;
    const people = [DEMO.manager, DEMO.operator, DEMO.pilot];
    for (const [ti, t] of targets.entries()) {
      const paramArb = fc.record(Object.fromEntries(t.params.map((p) => [p, fc.constantFrom(...(ids.any[p] ?? ids.any.id))])) as Record<string, fc.Arbitrary<string>>);
      const cases: [Record<string, string>, unknown, string][] = fc.sample(fc.tuple(paramArb, bodyArb, fc.constantFrom(...people)), { seed: SEED + ti, numRuns: RUNS_PER_TARGET });
      // Near-valid bodies go as the manager (who may use every route), to real records.
      const real = Object.fromEntries(t.params.map((p) => [p, (ids.any[p] ?? ids.any.id)[0]]));
      for (const json of nearValid(t, ids, SEED + 1000 + ti)) cases.push([real, json, DEMO.manager]);
      const raws: { raw: string; type?: string }[] = [
        { raw: '{"name": "A' },
        { raw: 'name=A%00B', type: 'application/x-www-form-urlencoded' },
        { raw: '{"name":"A\\u0000B"}', type: 'text/plain' },
        { raw: '\u0000\u0000' },
        { raw: JSON.stringify({ notes: 'x'.repeat(200_000), name: 'y'.repeat(200_000) }) },
      ];
      for (const [i, [params, json, who]] of cases.entries()) {
        await signInAs(who);
        const status = await send(t, params, { json });
        calls++;
        statuses[status] = (statuses[status] ?? 0) + 1;
        if (status >= 500) failures.push(`${t.method} ${t.file} #${i} ${JSON.stringify(params)} ${JSON.stringify(json).slice(0, 300)}`);
      }
      await signInAs(DEMO.manager);
      for (const r of raws) {
        const params = Object.fromEntries(t.params.map((p) => [p, (ids.any[p] ?? ids.any.id)[0]]));
        const status = await send(t, params, r);
        calls++;
        statuses[status] = (statuses[status] ?? 0) + 1;
        if (status >= 500) failures.push(`${t.method} ${t.file} raw ${JSON.stringify(r).slice(0, 120)}`);
      }
    }
    console.info(`fuzz: ${calls} calls over ${targets.length} routes`, statuses);
    expect(failures, `${failures.slice(0, 10).join('\n')}\n${logged.slice(0, 5).join('\n')}`).toEqual([]);
    expect(calls).toBeGreaterThan(2000);

    // Then every job runs green, in data-flow order.
    const { JOBS } = await import('@/lib/jobs/definitions');
    for (const name of ['forecast-refresh', 'plan-recompute', 'alert-evaluation', 'cold-night-notice', 'mail-delivery'] as const) {
      const job = JOBS.find((j) => j.name === name)!;
      const result = (await job.run({ now: new Date(), holder: 'fuzz' })) as { skipped?: number | string };
      expect(typeof result.skipped === 'number' ? result.skipped : 0, name).toBe(0);
    }
  }, 600_000);
});
