// Background work of one server process: the local mail capture (unless SMTP_URL is set) and the
// scheduler. Started once per process from instrumentation.ts (Node runtime, THAWLINE_JOBS=on).
// The two parts start independently: a capture that cannot listen (its port taken, say by another
// instance's capture on the same machine) is reported by /api/health and leaves the jobs running; mail
// then goes to whatever answers on SMTP_CAPTURE_PORT.
import { env } from '@/lib/env';
import { ensureCapture } from '@/lib/mail/capture';
import { describeError } from '@/lib/log';
import { Scheduler } from './scheduler';

export { Scheduler } from './scheduler';
export { JOBS, type JobName } from './definitions';

/** What one part of the background work is doing in this process. */
export interface PartStatus {
  state: 'off' | 'starting' | 'running' | 'failed';
  /** Why it failed: 'port-in-use', 'permission-denied', or the error's name. */
  reason?: string;
  port?: number;
}

interface Background {
  scheduler: Scheduler | null;
  capture: PartStatus;
  jobs: PartStatus;
  /** The embedded MQTT broker for relays and probes ('off' with MQTT_URL set). */
  broker: PartStatus;
}

const g = globalThis as unknown as { __thawlineBackground?: Promise<Background>; __thawlineBackgroundNow?: Background };

function reasonOf(err: unknown): string {
  const code = (err as { code?: unknown } | null)?.code;
  if (code === 'EADDRINUSE') return 'port-in-use';
  if (code === 'EACCES') return 'permission-denied';
  return describeError(err).split(/[\s:(]/)[0] || 'error';
}

async function start(opts: { runNow: boolean }): Promise<Background> {
  const e = env();
  const b: Background = { scheduler: null, capture: { state: e.SMTP_URL ? 'off' : 'starting' }, jobs: { state: 'starting' }, broker: { state: e.MQTT_URL ? 'off' : 'starting' } };
  g.__thawlineBackgroundNow = b;
  if (!e.SMTP_URL) {
    try {
      const c = await ensureCapture(e.SMTP_CAPTURE_PORT);
      b.capture = { state: 'running', port: c.port };
      console.log(`[thawline] local mail capture listening on 127.0.0.1:${c.port}`);
    } catch (err) {
      b.capture = { state: 'failed', reason: reasonOf(err), port: e.SMTP_CAPTURE_PORT };
      console.error(
        `[thawline] local mail capture did not start on 127.0.0.1:${e.SMTP_CAPTURE_PORT} (${b.capture.reason}); the jobs run, and mail goes to whatever listens there`,
      );
    }
  }
  if (!e.MQTT_URL) {
    // Like the capture: a broker that cannot listen is reported and the jobs still run.
    try {
      const { ensureBroker } = await import('@/lib/devices/service');
      const broker = await ensureBroker(e.MQTT_BROKER_PORT);
      b.broker = { state: 'running', port: broker.port };
      console.log(`[thawline] embedded MQTT broker listening on 127.0.0.1:${broker.port}`);
    } catch (err) {
      b.broker = { state: 'failed', reason: reasonOf(err), port: e.MQTT_BROKER_PORT };
      console.error(`[thawline] embedded MQTT broker did not start on 127.0.0.1:${e.MQTT_BROKER_PORT} (${b.broker.reason}); the jobs run without it`);
    }
  }
  try {
    const scheduler = new Scheduler();
    scheduler.start({ runNow: opts.runNow });
    b.scheduler = scheduler;
    b.jobs = { state: 'running' };
    console.log(`[thawline] scheduler started (${scheduler.holder})`);
  } catch (err) {
    b.jobs = { state: 'failed', reason: reasonOf(err) };
    console.error('[thawline] scheduler did not start:', describeError(err));
  }
  return b;
}

/** Starts the background work once per process (`runNow`: run every job once at start, the default). */
export function startBackground(opts: { runNow?: boolean } = {}) {
  if (env().THAWLINE_JOBS === 'off') return Promise.resolve(null);
  g.__thawlineBackground ??= start({ runNow: opts.runNow ?? true });
  return g.__thawlineBackground;
}

/** Stops the scheduler and the capture of this process (tests; a clean shutdown). */
export async function stopBackground() {
  const b = await g.__thawlineBackground?.catch(() => null);
  g.__thawlineBackground = undefined;
  g.__thawlineBackgroundNow = undefined;
  await b?.scheduler?.stop();
  const { stopCapture } = await import('@/lib/mail/capture');
  await stopCapture();
  const { stopBroker } = await import('@/lib/devices/service');
  await stopBroker();
}

/** What this process's background work is doing, for /api/health. */
export function backgroundStatus(): { jobs: PartStatus; capture: PartStatus; broker: PartStatus; holder: string | null; scheduler: Scheduler | null } {
  const e = env();
  const b = g.__thawlineBackgroundNow;
  if (!b) {
    const off: PartStatus = { state: 'off' };
    return { jobs: off, capture: e.SMTP_URL ? off : { state: 'off', port: e.SMTP_CAPTURE_PORT }, broker: e.MQTT_URL ? off : { state: 'off', port: e.MQTT_BROKER_PORT }, holder: null, scheduler: null };
  }
  return { jobs: b.jobs, capture: b.capture, broker: b.broker, holder: b.scheduler?.holder ?? null, scheduler: b.scheduler };
}

/** The running scheduler of this process, if any (route handlers use it to deliver at once). */
export async function runningScheduler(): Promise<Scheduler | null> {
  const b = await g.__thawlineBackground?.catch(() => null);
  return b?.scheduler ?? null;
}

/** Asks this process's scheduler to deliver now (after an invitation or a reset); no-op without one. */
export function deliverSoon(): void {
  void runningScheduler()
    .then((s) => s?.run('mail-delivery'))
    .catch(() => {});
}
