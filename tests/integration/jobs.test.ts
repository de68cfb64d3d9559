import { beforeAll, describe, expect, it } from 'vitest';
import { freshDatabase } from './helpers';

// The scheduler's leases: two scheduler instances on one database run each job once; a lease that
// lapses (its holder died) is taken over; a clean stop hands it over at once.

let models: Awaited<ReturnType<typeof freshDatabase>>;
beforeAll(async () => {
  models = await freshDatabase();
});

async function counted() {
  const { JOBS } = await import('@/lib/jobs/definitions');
  const calls: Record<string, number> = {};
  const jobs = JOBS.map((j) => ({
    ...j,
    run: async () => {
      calls[j.name] = (calls[j.name] ?? 0) + 1;
      await new Promise((r) => setTimeout(r, 20));
      return 'ok';
    },
  }));
  return { jobs, calls };
}

describe('job leases', () => {
  it('two scheduler instances on one database run each job once', async () => {
    const { Scheduler } = await import('@/lib/jobs/scheduler');
    const { jobs, calls } = await counted();
    const a = new Scheduler({ holder: 'instance-a', jobs, log: () => {} });
    const b = new Scheduler({ holder: 'instance-b', jobs, log: () => {} });
    const now = new Date();
    const outcomes = await Promise.all(jobs.flatMap((j) => [a.run(j.name, now), b.run(j.name, now)]));
    for (const j of jobs) expect(calls[j.name]).toBe(1);
    expect(outcomes.filter((o) => o.ran)).toHaveLength(jobs.length);
    expect(outcomes.filter((o) => !o.ran && o.reason === 'lease-held')).toHaveLength(jobs.length);
    const leases = await models.Lease.findAll();
    expect(leases.map((l) => l.runs)).toEqual(jobs.map(() => 1));
    // The holder of each job keeps it on its next tick; the other instance still skips.
    const holderOf = new Map(leases.map((l) => [l.name, l.holder]));
    const later = new Date(now.getTime() + 60_000);
    for (const j of jobs) {
      const [first, second] = holderOf.get(j.name) === 'instance-a' ? [a, b] : [b, a];
      expect((await second.run(j.name, later)).ran).toBe(false);
      expect((await first.run(j.name, later)).ran).toBe(true);
      expect(calls[j.name]).toBe(2);
    }
  });

  it("takes over a job whose holder's lease lapsed, and at once after a clean stop", async () => {
    const { Scheduler } = await import('@/lib/jobs/scheduler');
    const { jobs, calls } = await counted();
    const delivery = jobs.find((j) => j.name === 'mail-delivery')!;
    await models.Lease.update({ holder: 'crashed', expiresAt: new Date(Date.now() + delivery.ttlMs) }, { where: { name: 'mail-delivery' } });
    const c = new Scheduler({ holder: 'instance-c', jobs, log: () => {} });
    expect((await c.run('mail-delivery')).ran).toBe(false);
    expect((await c.run('mail-delivery', new Date(Date.now() + delivery.ttlMs + 1000))).ran).toBe(true);
    expect(calls['mail-delivery']).toBe(1);
    await c.stop();
    const d = new Scheduler({ holder: 'instance-d', jobs, log: () => {} });
    expect((await d.run('mail-delivery')).ran).toBe(true);
  });

  it('runs the real jobs in data-flow order once per instance pair: forecasts, plans, alerts, notices, delivery', async () => {
    const { Scheduler } = await import('@/lib/jobs/scheduler');
    await models.Lease.destroy({ where: {} });
    const a = new Scheduler({ holder: 'real-a', log: () => {} });
    const b = new Scheduler({ holder: 'real-b', log: () => {} });
    const [ra, rb] = await Promise.all([a.runAll(), b.runAll()]);
    const ran = (r: typeof ra) => Object.entries(r).filter(([, o]) => o?.ran).map(([n]) => n);
    expect([...ran(ra), ...ran(rb)].sort()).toEqual(['alert-evaluation', 'cold-night-notice', 'forecast-refresh', 'mail-delivery', 'plan-recompute']);
    // The evaluation wrote the demo's oil-too-cold warnings and queued their e-mails.
    expect(await models.Alert.count({ where: { kind: 'oil-too-cold' } })).toBeGreaterThan(0);
    expect(await models.OutboxMessage.count({ where: { kind: 'oil-too-cold' } })).toBeGreaterThan(0);
    await a.stop();
    await b.stop();
  });
});
