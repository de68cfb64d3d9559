// The recurring jobs: what each does, how often (croner patterns, server-local clock) and how long its
// lease holds (longer than the interval, so the holder keeps the job; a dead holder's lease lapses).
// Each job takes its airfields, organizations and rows one at a time: one that fails is logged (ids and
// the error's name only) and skipped, and the rest still run.
import { db } from '@/models';
import { forecastFor } from '@/lib/data/forecasts';
import { plansBetween } from '@/lib/data/plans';
import { evaluateAlerts, evaluateColdNight } from '@/lib/alerts/evaluate';
import { deliverDue } from '@/lib/mail/deliver';
import { logSkipped } from '@/lib/log';

export type JobName = 'forecast-refresh' | 'plan-recompute' | 'alert-evaluation' | 'cold-night-notice' | 'mail-delivery' | 'relay-dispatch';

export interface JobContext {
  now: Date;
  holder: string;
}

export interface JobDefinition {
  name: JobName;
  pattern: string;
  ttlMs: number;
  run: (ctx: JobContext) => Promise<unknown>;
}

const MIN = 60_000;

/** Heat plans are kept fresh this far ahead (the Morning board and the warnings read them). */
const PLAN_HORIZON_MS = 48 * 60 * MIN;

export const JOBS: JobDefinition[] = [
  {
    name: 'forecast-refresh',
    pattern: '7,37 * * * *',
    ttlMs: 75 * MIN,
    async run({ now }) {
      const { Airfield } = db();
      const airfields = await Airfield.findAll({ where: { archivedAt: null } });
      let refreshed = 0;
      let skipped = 0;
      for (const a of airfields) {
        try {
          await forecastFor({ airfield: a, now, refresh: 'if-old' });
          refreshed++;
        } catch (err) {
          skipped++;
          logSkipped('forecast refresh', { org: a.organizationId, airfield: a.id }, err);
        }
      }
      return { airfields: refreshed, skipped };
    },
  },
  {
    name: 'plan-recompute',
    pattern: '*/15 * * * *',
    ttlMs: 40 * MIN,
    async run({ now }) {
      const { Organization } = db();
      let plans = 0;
      let skipped = 0;
      for (const org of await Organization.findAll({ attributes: ['id'] })) {
        try {
          plans += (await plansBetween({ orgId: org.id, fromMs: now.getTime() - 30 * MIN, toMs: now.getTime() + PLAN_HORIZON_MS, now, refresh: 'if-old' })).length;
        } catch (err) {
          skipped++;
          logSkipped('plan recompute of an organization', { org: org.id }, err);
        }
      }
      return { plans, skipped };
    },
  },
  { name: 'alert-evaluation', pattern: '*/10 * * * *', ttlMs: 25 * MIN, run: ({ now }) => evaluateAlerts({ now }) },
  { name: 'cold-night-notice', pattern: '*/5 * * * *', ttlMs: 12 * MIN, run: ({ now }) => evaluateColdNight({ now }) },
  { name: 'mail-delivery', pattern: '* * * * *', ttlMs: 3 * MIN, run: ({ now, holder }) => deliverDue({ now, holder }) },
  {
    // Relay commands from confirmed plans through the embedded broker of this process (lib/devices).
    name: 'relay-dispatch',
    pattern: '* * * * *',
    ttlMs: 3 * MIN,
    async run({ now }) {
      const { runningBroker } = await import('@/lib/devices/service');
      const broker = await runningBroker();
      if (!broker) return { broker: 'not running' };
      const { dispatchRelayCommands } = await import('@/lib/devices/dispatch');
      return dispatchRelayCommands({ now, publish: (topic, payload, opts) => broker.publish(topic, payload, opts) });
    },
  },
];
