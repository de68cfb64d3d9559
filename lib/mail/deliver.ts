// Delivery from the outbox: claim a due message with one conditional UPDATE (so two workers never send
// the same row), send it, then mark it sent — or count the failure and try again later with backoff.
// A worker that dies between sending and marking leaves a claim that expires; the message then goes
// again with the same Message-ID (at-least-once; the capture keeps one copy per Message-ID).
import { Op, literal, type WhereOptions } from 'sequelize';
import { db } from '@/models';
import type { OutboxMessage } from '@/models/OutboxMessage';
import { env } from '@/lib/env';
import { channelFor, preferencesFor } from '@/lib/alerts/preferences';
import type { AlertKind } from '@/models/Alert';
import { defaultTransport, type MailTransport } from './transport';
import { describeError, logSkipped } from '@/lib/log';
import { stripControlChars } from '@/lib/validation/text';

export const MAX_ATTEMPTS = 20;
/** How long a claim holds: longer than any one SMTP conversation (nodemailer's timeouts add to < 1 min). */
export const CLAIM_MS = 5 * 60_000;

/** Minutes to wait after the n-th failed attempt: 1, 2, 4 … capped at an hour (20 tries span ≈ 14 h). */
export function backoffMinutes(attempts: number): number {
  return Math.min(60, 2 ** Math.max(0, attempts - 1));
}

function dueWhere(now: Date): WhereOptions<OutboxMessage> {
  return {
    [Op.or]: [
      { status: 'pending', nextAttemptAt: { [Op.lte]: now } },
      { status: 'sending', claimedUntil: { [Op.lt]: now } },
    ],
  } as WhereOptions<OutboxMessage>;
}

export interface DeliveryReport {
  sent: number;
  retried: number;
  failed: number;
  expired: number;
  cancelled: number;
  skipped?: 'no-transport';
}

const ALERT_KINDS: readonly string[] = ['oil-too-cold', 'switch-on', 'cold-night'];

/** Whether the message should still go: its reader is active, still wants this kind by e-mail, and no newer revision replaced it. */
async function stillWanted(m: OutboxMessage): Promise<boolean> {
  const { User, Alert } = db();
  if (m.userId) {
    const u = await User.findByPk(m.userId, { attributes: ['id', 'active', 'organizationId'] });
    if (!u || !u.active) return false;
    if (ALERT_KINDS.includes(m.kind)) {
      const prefs = (await preferencesFor(u.organizationId, [u.id])).get(u.id)!;
      if (channelFor(prefs, m.kind as AlertKind) !== 'email') return false;
    }
  }
  if (m.alertId) {
    const a = await Alert.findByPk(m.alertId, { attributes: ['id', 'supersededAt', 'resolvedAt'] });
    if (a?.supersededAt) return false;
  }
  return true;
}

function shortError(err: unknown): string {
  const e = err as { code?: string; responseCode?: number; response?: string; message?: string };
  const parts = [e.responseCode ? String(e.responseCode) : '', e.code ?? '', (e.response ?? e.message ?? 'send failed').replace(/\s+/g, ' ')];
  return parts.filter(Boolean).join(' ').slice(0, 480);
}

/**
 * Sends what is due. `holder` names this worker in the claim. `transport` defaults to the configured
 * one; with none (no SMTP_URL and no capture running) nothing is attempted.
 */
export async function deliverDue({
  now = new Date(),
  holder,
  transport,
  limit = 25,
  ids,
}: {
  now?: Date;
  holder: string;
  transport?: MailTransport | null;
  limit?: number;
  ids?: number[];
}): Promise<DeliveryReport> {
  const report: DeliveryReport = { sent: 0, retried: 0, failed: 0, expired: 0, cancelled: 0 };
  const { OutboxMessage } = db();
  const own = transport === undefined;
  const t = own ? defaultTransport() : transport;
  if (!t) return { ...report, skipped: 'no-transport' };
  const from = env().MAIL_FROM;
  try {
    const where = ids ? { [Op.and]: [dueWhere(now), { id: { [Op.in]: ids } }] } : dueWhere(now);
    const due = await OutboxMessage.findAll({ where, order: [['nextAttemptAt', 'ASC'], ['id', 'ASC']], limit, attributes: ['id'] });
    for (const { id } of due) {
      try {
        const [claimed] = await OutboxMessage.update(
          { status: 'sending', claimedBy: holder, claimedUntil: new Date(now.getTime() + CLAIM_MS), attempts: literal('attempts + 1') as unknown as number },
          { where: { [Op.and]: [{ id }, dueWhere(now)] } },
        );
        if (claimed !== 1) continue; // another worker took it
        const m = (await OutboxMessage.findByPk(id))!;
        const mine = { id, claimedBy: holder, status: 'sending' };
        if (m.expiresAt && m.expiresAt.getTime() <= now.getTime()) {
          await OutboxMessage.update({ status: 'expired', claimedBy: null, claimedUntil: null }, { where: mine });
          report.expired++;
          continue;
        }
        if (!(await stillWanted(m))) {
          await OutboxMessage.update({ status: 'cancelled', claimedBy: null, claimedUntil: null }, { where: mine });
          report.cancelled++;
          continue;
        }
        try {
          // Rows stored before the outbox took control characters out are cleaned on the way.
          await t.send({
            from,
            to: stripControlChars(m.toAddress),
            subject: stripControlChars(m.subject),
            text: stripControlChars(m.text, { multiline: true }),
            html: stripControlChars(m.html, { multiline: true }),
            messageId: m.messageId,
            headers: m.headers ?? undefined,
          });
          await OutboxMessage.update({ status: 'sent', sentAt: new Date(), lastError: null, claimedUntil: null }, { where: mine });
          report.sent++;
        } catch (err) {
          const last = m.attempts >= MAX_ATTEMPTS;
          await OutboxMessage.update(
            {
              status: last ? 'failed' : 'pending',
              lastError: shortError(err),
              claimedBy: null,
              claimedUntil: null,
              nextAttemptAt: new Date(now.getTime() + backoffMinutes(m.attempts) * 60_000),
            },
            { where: mine },
          );
          if (last) report.failed++;
          else report.retried++;
        }
      } catch (err) {
        // One message that cannot be handled (a bad stored value, a database refusal) is put back with
        // backoff and, after the last attempt, marked failed; the others still go.
        report.retried++;
        logSkipped('mail delivery', { message: id }, err);
        await markBroken(id, holder, now, err).catch((e) => logSkipped('mail delivery bookkeeping', { message: id }, e));
      }
    }
  } finally {
    if (own) t.close();
  }
  return report;
}

/** Gives a claimed message whose handling failed back to the queue (or marks it failed after the last attempt). */
async function markBroken(id: number, holder: string, now: Date, err: unknown) {
  const { OutboxMessage } = db();
  const m = await OutboxMessage.findByPk(id, { attributes: ['id', 'attempts'] });
  if (!m) return;
  const last = m.attempts >= MAX_ATTEMPTS;
  await OutboxMessage.update(
    {
      status: last ? 'failed' : 'pending',
      lastError: describeError(err).slice(0, 480),
      claimedBy: null,
      claimedUntil: null,
      nextAttemptAt: new Date(now.getTime() + backoffMinutes(m.attempts) * 60_000),
    },
    { where: { id, claimedBy: holder, status: 'sending' } },
  );
}

/** Puts failed messages of an organization back in the queue (the mail viewer's "Try again"). */
export async function retryFailed({ orgId, now = new Date() }: { orgId: number; now?: Date }): Promise<number> {
  const { OutboxMessage } = db();
  const [n] = await OutboxMessage.update({ status: 'pending', attempts: 0, nextAttemptAt: now }, { where: { organizationId: orgId, status: 'failed' } });
  return n;
}
