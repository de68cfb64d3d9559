// A real SMTP server for tests (smtp-server on 127.0.0.1), which can refuse mail or go down and come back.
import { SMTPServer } from 'smtp-server';
import type { AddressInfo } from 'node:net';
import { readMime, type ReadMessage } from '@/lib/mail/mime';

export interface Received extends ReadMessage {
  raw: string;
  envelopeTo: string[];
}

export async function testSmtp(opts: { dataDelayMs?: number } = {}) {
  const received: Received[] = [];
  let refuse = false;
  let server: SMTPServer | null = null;
  let port = 0;

  async function start(p: number) {
    const s = new SMTPServer({
      disabledCommands: ['STARTTLS', 'AUTH'],
      authOptional: true,
      logger: false,
      onRcptTo(_address, _session, cb) {
        if (!refuse) return cb();
        const err = new Error('Mailbox busy, try again later') as Error & { responseCode: number };
        err.responseCode = 451;
        cb(err);
      },
      onData(stream, session, cb) {
        const chunks: Buffer[] = [];
        stream.on('data', (c: Buffer) => chunks.push(c));
        stream.on('end', () => {
          const raw = Buffer.concat(chunks);
          setTimeout(() => {
            received.push({ ...readMime(raw.toString('latin1')), raw: raw.toString('utf8'), envelopeTo: session.envelope.rcptTo.map((r) => r.address) });
            cb();
          }, opts.dataDelayMs ?? 0);
        });
      },
    });
    await new Promise<void>((resolve, reject) => {
      s.once('error', reject);
      s.listen(p, '127.0.0.1', () => resolve());
    });
    server = s;
    port = (s.server.address() as AddressInfo).port;
  }

  await start(0);
  return {
    received,
    get port() {
      return port;
    },
    get url() {
      return `smtp://127.0.0.1:${port}`;
    },
    refuseMail(on: boolean) {
      refuse = on;
    },
    async stop() {
      const s = server;
      server = null;
      if (s) await new Promise<void>((r) => s.close(() => r()));
    },
    async restart() {
      await start(port);
    },
  };
}

export type TestSmtp = Awaited<ReturnType<typeof testSmtp>>;

/** A test server that the app reaches through SMTP_URL (the configured-server path). */
export async function startSmtpUrl(opts: { dataDelayMs?: number } = {}): Promise<TestSmtp> {
  const smtp = await testSmtp(opts);
  process.env.SMTP_URL = smtp.url;
  (await import('@/lib/env')).resetEnvCache();
  return smtp;
}

export async function stopSmtpUrl(smtp: TestSmtp | undefined) {
  delete process.env.SMTP_URL;
  (await import('@/lib/env')).resetEnvCache();
  await smtp?.stop();
}
