// The recurring jobs: what each does, how often (croner patterns, server-local clock) and how long its
// lease holds (longer than the interval, so the holder keeps the job; a dead holder's lease lapses).
import { db } from '@/models';
import { forecastFor } from '@/lib/data/forecasts';
import { plansBetween } from '@/lib/data/plans';
import { evaluateAlerts, evaluateColdNight } from '@/lib/alerts/evaluate';
import { deliverDue } from '@/lib/mail/deliver';

export type JobName = 'forecast-refresh' | 'plan-recompute' | 'alert-evaluation' | 'cold-night-notice' | 'mail-delivery';

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
      for (const a of airfields) {
        await forecastFor({ airfield: a, now, refresh: 'if-old' });
        refreshed++;
      }
      return { airfields: refreshed };
    },
  },
  {
    name: 'plan-recompute',
    pattern: '*/15 * * * *',
    ttlMs: 40 * MIN,
    async run({ now }) {
      const { Organization } = db();
      let plans = 0;
      for (const org of await Organization.findAll({ attributes: ['id'] })) {
        plans += (await plansBetween({ orgId: org.id, fromMs: now.getTime() - 30 * MIN, toMs: now.getTime() + PLAN_HORIZON_MS, now, refresh: 'if-old' })).length;
      }
      return { plans };
    },
  },
  { name: 'alert-evaluation', pattern: '*/10 * * * *', ttlMs: 25 * MIN, run: ({ now }) => evaluateAlerts({ now }) },
  { name: 'cold-night-notice', pattern: '*/5 * * * *', ttlMs: 12 * MIN, run: ({ now }) => evaluateColdNight({ now }) },
  { name: 'mail-delivery', pattern: '* * * * *', ttlMs: 3 * MIN, run: ({ now, holder }) => deliverDue({ now, holder }) },
];
