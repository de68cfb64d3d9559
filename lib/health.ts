import 'server-only';
// What /api/health reports: the database (reachable, migrations current), this process's background
// work (does it run the jobs, the last run of each job across all instances, which of them this
// instance holds) and the local fakes (forecast, mail capture). Public: no host names, no error
// messages, no SQL; only states, times and reason codes.
import { QueryTypes } from 'sequelize';
import { db } from '@/models';
import { migrations } from '@/models/migrations';
import { env } from '@/lib/env';
import { JOBS, type JobName } from '@/lib/jobs/definitions';
import { backgroundStatus, type PartStatus } from '@/lib/jobs';

export interface Health {
  status: 'ok' | 'degraded' | 'unavailable';
  database: { reachable: boolean; dialect: string; migrations: { current: boolean; pending: number } | null };
  jobs: {
    /** THAWLINE_JOBS. */
    enabled: boolean;
    /** Whether this instance's scheduler is running ('off' with THAWLINE_JOBS=off). */
    thisInstance: PartStatus['state'];
    reason?: string;
    each: { name: JobName; lastRunAt: string | null; runs: number; heldByThisInstance: boolean; lastAttemptHere: { at: string; outcome: string } | null }[];
  };
  fakes: {
    forecast: { local: boolean; scenario?: string; fault?: string };
    mail: { local: boolean; capture: PartStatus };
    /** The embedded MQTT broker for relays and probes (local: MQTT_URL not set). */
    mqtt: { local: boolean; broker: PartStatus };
  };
}

const g = globalThis as unknown as { __thawlineMigrationsCurrent?: boolean };

async function migrationState(): Promise<{ current: boolean; pending: number }> {
  // Migrations are applied before a server starts and never undone under it: once current, stay current.
  if (g.__thawlineMigrationsCurrent) return { current: true, pending: 0 };
  const { sequelize } = db();
  let applied = new Set<string>();
  try {
    const rows = await sequelize.query<{ name: string }>('SELECT name FROM "SequelizeMeta"', { type: QueryTypes.SELECT });
    applied = new Set(rows.map((r) => r.name));
  } catch {
    // No table yet: nothing applied.
  }
  const pending = migrations.filter((m) => !applied.has(m.name)).length;
  if (pending === 0) g.__thawlineMigrationsCurrent = true;
  return { current: pending === 0, pending };
}

export async function health(): Promise<{ httpStatus: number; body: Health }> {
  const e = env();
  const { sequelize, Lease } = db();
  const bg = backgroundStatus();
  const body: Health = {
    status: 'ok',
    database: { reachable: false, dialect: sequelize.getDialect(), migrations: null },
    jobs: { enabled: e.THAWLINE_JOBS === 'on', thisInstance: bg.jobs.state, ...(bg.jobs.reason ? { reason: bg.jobs.reason } : {}), each: [] },
    fakes: {
      forecast: e.FORECAST_BASE_URL ? { local: false } : { local: true, scenario: e.FAKE_FORECAST_SCENARIO, fault: e.FAKE_FORECAST_FAULT },
      mail: { local: !e.SMTP_URL, capture: bg.capture },
      mqtt: { local: !e.MQTT_URL, broker: bg.broker },
    },
  };
  try {
    await sequelize.query('SELECT 1', { type: QueryTypes.SELECT });
    body.database.reachable = true;
    body.database.migrations = await migrationState();
  } catch {
    body.status = 'unavailable';
    return { httpStatus: 503, body };
  }
  if (!body.database.migrations.current) {
    body.status = 'unavailable';
    return { httpStatus: 503, body };
  }
  const leases = await Lease.findAll({ attributes: ['name', 'holder', 'expiresAt', 'lastRunAt', 'runs'] }).catch(() => []);
  const byName = new Map(leases.map((l) => [l.name, l]));
  const now = Date.now();
  body.jobs.each = JOBS.map((j) => {
    const l = byName.get(j.name);
    const attempt = bg.scheduler?.lastAttempts.get(j.name);
    return {
      name: j.name,
      lastRunAt: l?.lastRunAt ? new Date(l.lastRunAt).toISOString() : null,
      runs: l?.runs ?? 0,
      heldByThisInstance: !!(l && bg.holder && l.holder === bg.holder && new Date(l.expiresAt).getTime() > now),
      lastAttemptHere: attempt ? { at: attempt.at.toISOString(), outcome: attempt.outcome } : null,
    };
  });
  if (bg.jobs.state === 'failed' || bg.capture.state === 'failed' || bg.broker.state === 'failed') body.status = 'degraded';
  return { httpStatus: 200, body };
}
