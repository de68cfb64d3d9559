// The embedded local SMTP capture: an smtp-server on 127.0.0.1 (no auth, no STARTTLS) that keeps
// every message it receives in the database for the mail viewer. Port 0 picks a free port; the bound
// port is remembered for this process's transport.
import { SMTPServer, type SMTPServerDataStream, type SMTPServerSession } from 'smtp-server';
import type { AddressInfo } from 'node:net';
import { Op } from 'sequelize';
import { db } from '@/models';
import { readMime } from './mime';
import { describeError } from '@/lib/log';

/** Largest message kept (the viewer is for Thawline's own mail; bigger ones are refused with 552). */
export const CAPTURE_MAX_BYTES = 5 * 1024 * 1024;

export interface Capture {
  port: number;
  close(): Promise<void>;
}

function addressOnly(header: string): string {
  const m = /<([^>]+)>/.exec(header);
  return (m ? m[1] : header).trim().toLowerCase();
}

/** Stores one received message; a second copy of the same Message-ID is kept once. */
export async function storeCaptured(raw: Buffer, envelope: { from: string; to: string[] }, receivedAt = new Date()) {
  const { CapturedMail, OutboxMessage, User } = db();
  const msg = readMime(raw.toString('latin1'));
  let organizationId: number | null = null;
  if (msg.messageId) {
    const o = await OutboxMessage.findOne({ where: { messageId: msg.messageId }, attributes: ['organizationId'] });
    organizationId = o?.organizationId ?? null;
  }
  if (organizationId === null) {
    const addresses = [...envelope.to, addressOnly(msg.to)].map((a) => a.toLowerCase());
    const u = await User.findOne({ where: { email: { [Op.in]: addresses } }, attributes: ['organizationId'] });
    organizationId = u?.organizationId ?? null;
  }
  const keep = ['from', 'to', 'subject', 'date', 'message-id', 'list-unsubscribe', 'list-unsubscribe-post', 'content-type', 'mime-version'];
  // One copy per Message-ID (unique index); inserted with bound parameters, whatever the message holds.
  if (msg.messageId && (await CapturedMail.findOne({ where: { messageId: msg.messageId.slice(0, 250) }, attributes: ['id'] }))) return;
  try {
    await CapturedMail.create({
      organizationId,
      messageId: msg.messageId?.slice(0, 250) ?? null,
      envelopeFrom: envelope.from.slice(0, 254),
      recipients: envelope.to,
      fromHeader: msg.from.slice(0, 500),
      toHeader: msg.to.slice(0, 500),
      subject: msg.subject.slice(0, 500),
      text: msg.text,
      html: msg.html,
      headers: Object.fromEntries(keep.filter((k) => msg.headers[k] !== undefined).map((k) => [k, msg.headers[k]])),
      raw: raw.toString('utf8'),
      sizeBytes: raw.length,
      receivedAt,
    });
  } catch (err) {
    if ((err as { name?: string }).name !== 'SequelizeUniqueConstraintError') throw err;
  }
}

function collect(stream: SMTPServerDataStream): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    stream.on('data', (c: Buffer) => chunks.push(c));
    stream.on('end', () => resolve(Buffer.concat(chunks)));
    stream.on('error', reject);
  });
}

export async function startCapture({ port, host = '127.0.0.1' }: { port: number; host?: string }): Promise<Capture> {
  const server = new SMTPServer({
    name: 'thawline-capture',
    banner: 'Thawline local mail capture',
    disabledCommands: ['STARTTLS', 'AUTH'],
    authOptional: true,
    logger: false,
    size: CAPTURE_MAX_BYTES,
    onData(stream: SMTPServerDataStream, session: SMTPServerSession, callback: (err?: Error | null) => void) {
      collect(stream)
        .then(async (raw) => {
          if (stream.sizeExceeded) {
            const err = new Error('Message too large for the local capture') as Error & { responseCode: number };
            err.responseCode = 552;
            return callback(err);
          }
          const from = session.envelope.mailFrom ? session.envelope.mailFrom.address : '';
          await storeCaptured(raw, { from, to: session.envelope.rcptTo.map((r) => r.address) });
          callback();
        })
        .catch((e) => {
          console.error(`[thawline] mail capture could not store a message: ${describeError(e)}`);
          const err = new Error('The local capture could not store the message; try again') as Error & { responseCode: number };
          err.responseCode = 451;
          callback(err);
        });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => {
      server.off('error', reject);
      resolve();
    });
  });
  server.on('error', (e) => console.error(`[thawline] mail capture error: ${describeError(e)}`));
  const bound = (server.server.address() as AddressInfo).port;
  return { port: bound, close: () => new Promise<void>((r) => server.close(() => r())) };
}

const g = globalThis as unknown as { __thawlineCapture?: Capture; __thawlineCaptureStarting?: Promise<Capture> };

/** Starts the capture once per process and remembers its port for the default transport. */
export function ensureCapture(port: number): Promise<Capture> {
  if (g.__thawlineCapture) return Promise.resolve(g.__thawlineCapture);
  g.__thawlineCaptureStarting ??= startCapture({ port }).then((c) => (g.__thawlineCapture = c));
  return g.__thawlineCaptureStarting;
}

export async function stopCapture() {
  const c = g.__thawlineCapture;
  g.__thawlineCapture = undefined;
  g.__thawlineCaptureStarting = undefined;
  await c?.close();
}
