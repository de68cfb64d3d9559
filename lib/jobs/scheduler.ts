// The scheduler: croner timers for the recurring jobs, each run guarded by its database lease. Several
// app instances can each run a scheduler; per job only the lease holder does the work.
import os from 'node:os';
import crypto from 'node:crypto';
import { Cron } from 'croner';
import { acquireLease, recordRun, releaseLease } from './lease';
import { JOBS, type JobDefinition, type JobName } from './definitions';
import { describeError } from '@/lib/log';

export type RunOutcome = { ran: true; result: unknown } | { ran: false; reason: 'lease-held' | 'busy' } | { ran: false; reason: 'error'; error: string };

export class Scheduler {
  readonly holder: string;
  private readonly jobs: Map<JobName, JobDefinition>;
  private timers: Cron[] = [];
  private running = new Set<JobName>();
  /** The last attempt of each job in this process: when, and whether it ran here. */
  readonly lastAttempts = new Map<JobName, { at: Date; outcome: 'ran' | 'lease-held' | 'error' }>();
  private readonly log: (msg: string) => void;

  constructor(opts: { holder?: string; jobs?: JobDefinition[]; log?: (msg: string) => void } = {}) {
    this.holder = opts.holder ?? `${os.hostname()}:${process.pid}:${crypto.randomBytes(4).toString('hex')}`;
    this.jobs = new Map((opts.jobs ?? JOBS).map((j) => [j.name, j]));
    this.log = opts.log ?? ((m) => console.log(`[thawline] ${m}`));
  }

  /** Runs one job now if this instance holds (or can take) its lease and it is not already running here. */
  async run(name: JobName, now = new Date()): Promise<RunOutcome> {
    const job = this.jobs.get(name);
    if (!job) throw new Error(`unknown job ${name}`);
    if (this.running.has(name)) return { ran: false, reason: 'busy' };
    this.running.add(name);
    try {
      if (!(await acquireLease({ name, holder: this.holder, ttlMs: job.ttlMs, now }))) {
        this.lastAttempts.set(name, { at: now, outcome: 'lease-held' });
        return { ran: false, reason: 'lease-held' };
      }
      const result = await job.run({ now, holder: this.holder });
      await recordRun({ name, holder: this.holder, now: new Date() });
      this.lastAttempts.set(name, { at: now, outcome: 'ran' });
      return { ran: true, result };
    } catch (err) {
      this.lastAttempts.set(name, { at: now, outcome: 'error' });
      this.log(`job ${name} failed: ${describeError(err)}`);
      return { ran: false, reason: 'error', error: describeError(err) };
    } finally {
      this.running.delete(name);
    }
  }

  /** Starts the timers; with `runNow`, runs every job once at start in data-flow order. */
  start({ runNow = true }: { runNow?: boolean } = {}) {
    if (this.timers.length) return;
    for (const job of this.jobs.values()) {
      this.timers.push(new Cron(job.pattern, { protect: true, catch: true }, () => void this.run(job.name)));
    }
    if (runNow) void this.runAll();
  }

  /** Forecasts, then plans, then alerts and notices, then delivery. */
  async runAll(now?: Date) {
    const order: JobName[] = ['forecast-refresh', 'plan-recompute', 'alert-evaluation', 'cold-night-notice', 'mail-delivery'];
    const out: Partial<Record<JobName, RunOutcome>> = {};
    for (const name of order) if (this.jobs.has(name)) out[name] = await this.run(name, now ?? new Date());
    return out;
  }

  async stop() {
    for (const t of this.timers) t.stop();
    this.timers = [];
    for (const name of this.jobs.keys()) await releaseLease({ name, holder: this.holder }).catch(() => {});
  }
}
