import net from 'node:net';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { call, freshDatabase } from './helpers';

// /api/health: the database (reachable, migrations current), the jobs and the local fakes; 503 only when
// the database cannot serve; a taken capture port stops the capture and nothing else.

let models: Awaited<ReturnType<typeof freshDatabase>>;
let GET: () => Promise<Response>;
beforeAll(async () => {
  models = await freshDatabase();
  ({ GET } = await import('@/app/api/health/route'));
});

const get = () => call(GET);

describe('/api/health', () => {
  it('503 while a migration is pending, naming how many', async () => {
    const [last] = await models.sequelize.query<{ name: string }>('SELECT name FROM "SequelizeMeta" ORDER BY name DESC', { type: 'SELECT' as never });
    await models.sequelize.query('DELETE FROM "SequelizeMeta" WHERE name = ?', { replacements: [last.name] });
    try {
      const r = await get();
      expect(r.status).toBe(503);
      expect(r.body.status).toBe('unavailable');
      expect(r.body.database).toMatchObject({ reachable: true, migrations: { current: false, pending: 1 } });
    } finally {
      await models.sequelize.query('INSERT INTO "SequelizeMeta" (name) VALUES (?)', { replacements: [last.name] });
    }
  });

  it('200 with the database, the jobs of every instance and the local fakes', async () => {
    const r = await get();
    expect(r.status).toBe(200);
    expect(r.body.status).toBe('ok');
    expect(r.body.database).toMatchObject({ reachable: true, migrations: { current: true, pending: 0 } });
    expect(r.body.database.dialect).toBe(process.env.TEST_DATABASE_URL ? 'postgres' : 'sqlite');
    // Tests run with THAWLINE_JOBS=off: this instance runs no jobs, and every job is listed.
    expect(r.body.jobs).toMatchObject({ enabled: false, thisInstance: 'off' });
    const { JOBS } = await import('@/lib/jobs/definitions');
    expect(r.body.jobs.each.map((j: { name: string }) => j.name).sort()).toEqual(JOBS.map((j) => j.name).sort());
    expect(r.body.fakes.forecast).toMatchObject({ local: true });
    expect(r.body.fakes.mail).toMatchObject({ local: true, capture: { state: 'off' } });
    expect(r.body.fakes.mqtt).toMatchObject({ local: true, broker: { state: 'off' } });
    // Nothing in it names a host, a process or a statement.
    expect(r.text).not.toMatch(/SELECT|holder|pid|hostname/i);
  });

  it('503 when the database does not answer', async () => {
    const spy = vi.spyOn(models.sequelize, 'query').mockRejectedValueOnce(new Error('connection refused'));
    try {
      const r = await get();
      expect(r.status).toBe(503);
      expect(r.body).toMatchObject({ status: 'unavailable', database: { reachable: false } });
      expect(r.text).not.toContain('connection refused');
    } finally {
      spy.mockRestore();
    }
  });

  describe('a taken capture port', () => {
    let blocker: net.Server;
    let port: number;
    const saved = { jobs: process.env.THAWLINE_JOBS, port: process.env.SMTP_CAPTURE_PORT };
    beforeAll(async () => {
      blocker = net.createServer();
      await new Promise<void>((r) => blocker.listen(0, '127.0.0.1', () => r()));
      port = (blocker.address() as net.AddressInfo).port;
    });
    afterAll(async () => {
      const { stopBackground } = await import('@/lib/jobs');
      await stopBackground();
      await new Promise((r) => blocker.close(r));
      process.env.THAWLINE_JOBS = saved.jobs;
      process.env.SMTP_CAPTURE_PORT = saved.port;
      delete process.env.MQTT_BROKER_PORT;
      const { resetEnvCache } = await import('@/lib/env');
      resetEnvCache();
    });

    it('stops only the capture: the scheduler starts, runs its jobs, and health says which part failed', async () => {
      process.env.THAWLINE_JOBS = 'on';
      process.env.SMTP_CAPTURE_PORT = String(port);
      process.env.MQTT_BROKER_PORT = '0';
      const { resetEnvCache } = await import('@/lib/env');
      resetEnvCache();
      const { startBackground } = await import('@/lib/jobs');
      const errors = vi.spyOn(console, 'error').mockImplementation(() => {});
      vi.spyOn(console, 'log').mockImplementation(() => {});
      const bg = await startBackground({ runNow: false });
      expect(bg?.capture).toMatchObject({ state: 'failed', reason: 'port-in-use', port });
      expect(bg?.jobs.state).toBe('running');
      expect(errors.mock.calls.flat().join(' ')).toContain('port-in-use');
      vi.restoreAllMocks();

      const outcome = await bg!.scheduler!.run('cold-night-notice');
      expect(outcome.ran).toBe(true);

      const r = await get();
      expect(r.status).toBe(200);
      expect(r.body.status).toBe('degraded');
      expect(r.body.jobs).toMatchObject({ enabled: true, thisInstance: 'running' });
      expect(r.body.fakes.mail.capture).toMatchObject({ state: 'failed', reason: 'port-in-use', port });
      const notice = r.body.jobs.each.find((j: { name: string }) => j.name === 'cold-night-notice');
      expect(notice).toMatchObject({ heldByThisInstance: true, runs: 1, lastAttemptHere: { outcome: 'ran' } });
      expect(Date.parse(notice.lastRunAt)).toBeGreaterThan(Date.now() - 60_000);
    });
  });

  describe('a taken MQTT broker port', () => {
    let blocker: net.Server;
    let port: number;
    beforeAll(async () => {
      blocker = net.createServer();
      await new Promise<void>((r) => blocker.listen(0, '127.0.0.1', () => r()));
      port = (blocker.address() as net.AddressInfo).port;
    });
    afterAll(async () => {
      const { stopBackground } = await import('@/lib/jobs');
      await stopBackground();
      await new Promise((r) => blocker.close(r));
      process.env.THAWLINE_JOBS = 'off';
      delete process.env.MQTT_BROKER_PORT;
      delete process.env.SMTP_CAPTURE_PORT;
      const { resetEnvCache } = await import('@/lib/env');
      resetEnvCache();
    });

    it('stops only the broker: the capture and the scheduler start, health says degraded', async () => {
      const { stopBackground, startBackground } = await import('@/lib/jobs');
      await stopBackground();
      process.env.THAWLINE_JOBS = 'on';
      process.env.SMTP_CAPTURE_PORT = '0';
      process.env.MQTT_BROKER_PORT = String(port);
      const { resetEnvCache } = await import('@/lib/env');
      resetEnvCache();
      vi.spyOn(console, 'error').mockImplementation(() => {});
      vi.spyOn(console, 'log').mockImplementation(() => {});
      const bg = await startBackground({ runNow: false });
      vi.restoreAllMocks();
      expect(bg?.broker).toMatchObject({ state: 'failed', reason: 'port-in-use', port });
      expect(bg?.capture.state).toBe('running');
      expect(bg?.jobs.state).toBe('running');
      const r = await get();
      expect(r.body.status).toBe('degraded');
      expect(r.body.fakes.mqtt).toMatchObject({ local: true, broker: { state: 'failed', reason: 'port-in-use' } });
    });
  });
});
