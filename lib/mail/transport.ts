// Where mail goes: SMTP_URL when set, else the embedded local capture on 127.0.0.1.
import nodemailer from 'nodemailer';
import { env } from '@/lib/env';

export interface OutgoingMail {
  from: string;
  to: string;
  subject: string;
  text: string;
  html: string;
  messageId: string;
  headers?: Record<string, string>;
}

export interface MailTransport {
  send(m: OutgoingMail): Promise<{ response: string }>;
  close(): void;
  describe: string;
}

const TIMEOUTS = { connectionTimeout: 10_000, greetingTimeout: 10_000, socketTimeout: 30_000 };

function wrap(t: nodemailer.Transporter, describe: string): MailTransport {
  return {
    describe,
    async send(m) {
      const info = await t.sendMail({ from: m.from, to: m.to, subject: m.subject, text: m.text, html: m.html, messageId: m.messageId, headers: m.headers });
      return { response: String(info.response ?? '') };
    },
    close: () => t.close(),
  };
}

/** A transport to an SMTP server on loopback with no TLS and no auth (the capture, or a test's server). */
export function loopbackTransport(port: number, host = '127.0.0.1'): MailTransport {
  return wrap(nodemailer.createTransport({ host, port, secure: false, ignoreTLS: true, ...TIMEOUTS }), `local capture ${host}:${port}`);
}

const g = globalThis as unknown as { __thawlineCapture?: { port: number } };

/** The configured transport, or null when there is none yet (no SMTP_URL and the capture is not running). */
export function defaultTransport(): MailTransport | null {
  const e = env();
  if (e.SMTP_URL) return wrap(nodemailer.createTransport(e.SMTP_URL, TIMEOUTS), 'SMTP_URL');
  const port = g.__thawlineCapture?.port ?? (e.SMTP_CAPTURE_PORT || null);
  return port ? loopbackTransport(port) : null;
}
