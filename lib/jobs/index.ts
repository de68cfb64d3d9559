// Background work of one server process: the local mail capture (unless SMTP_URL is set) and the
// scheduler. Started once per process from instrumentation.ts (Node runtime, THAWLINE_JOBS=on).
import { env } from '@/lib/env';
import { ensureCapture } from '@/lib/mail/capture';
import { Scheduler } from './scheduler';

export { Scheduler } from './scheduler';
export { JOBS, type JobName } from './definitions';

const g = globalThis as unknown as { __thawlineBackground?: Promise<{ scheduler: Scheduler; capturePort: number | null }> };

async function start() {
  const e = env();
  let capturePort: number | null = null;
  if (!e.SMTP_URL) {
    const c = await ensureCapture(e.SMTP_CAPTURE_PORT);
    capturePort = c.port;
    console.log(`[thawline] local mail capture listening on 127.0.0.1:${c.port}`);
  }
  const scheduler = new Scheduler();
  scheduler.start({ runNow: true });
  console.log(`[thawline] scheduler started (${scheduler.holder})`);
  return { scheduler, capturePort };
}

export function startBackground() {
  if (env().THAWLINE_JOBS === 'off') return Promise.resolve(null);
  g.__thawlineBackground ??= start().catch((err) => {
    g.__thawlineBackground = undefined;
    console.error('[thawline] background jobs did not start:', err instanceof Error ? err.message : err);
    throw err;
  });
  return g.__thawlineBackground;
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
