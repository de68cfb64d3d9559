// The durable outbox: every e-mail is first a row. Enqueueing the same de-duplication key twice
// writes one row (unique index; the insert ignores a duplicate on every dialect Sequelize speaks).
import crypto from 'node:crypto';
import type { Transaction } from 'sequelize';
import { db } from '@/models';
import type { MailKind } from '@/models/OutboxMessage';
import type { RenderedMail } from './templates';

export interface EnqueueInput {
  organizationId: number | null;
  userId: number | null;
  alertId?: number | null;
  kind: MailKind;
  to: string;
  mail: RenderedMail;
  dedupeKey: string;
  /** Not before this instant (quiet hours). */
  notBefore?: Date;
  /** Not after this instant: a message that could not go out by then is dropped as pointless. */
  expiresAt?: Date | null;
  now?: Date;
  transaction?: Transaction;
}

/** A Message-ID fixed by the key, so a re-sent message can be recognised as the same one. */
export function messageIdFor(dedupeKey: string): string {
  return `<${crypto.createHash('sha256').update(dedupeKey).digest('hex').slice(0, 32)}@thawline.mail>`;
}

export async function enqueueMail(m: EnqueueInput): Promise<{ id: number; created: boolean }> {
  const { OutboxMessage } = db();
  const now = m.now ?? new Date();
  const values = {
    organizationId: m.organizationId,
    userId: m.userId,
    alertId: m.alertId ?? null,
    kind: m.kind,
    toAddress: m.to,
    subject: m.mail.subject.slice(0, 250),
    text: m.mail.text,
    html: m.mail.html,
    headers: m.mail.headers ?? null,
    dedupeKey: m.dedupeKey.slice(0, 200),
    messageId: messageIdFor(m.dedupeKey),
    status: 'pending' as const,
    attempts: 0,
    nextAttemptAt: m.notBefore && m.notBefore > now ? m.notBefore : now,
    expiresAt: m.expiresAt ?? null,
  };
  const before = await OutboxMessage.count({ where: { dedupeKey: values.dedupeKey }, transaction: m.transaction });
  if (!before) await OutboxMessage.bulkCreate([values], { ignoreDuplicates: true, transaction: m.transaction });
  const row = await OutboxMessage.findOne({ where: { dedupeKey: values.dedupeKey }, transaction: m.transaction });
  if (!row) throw new Error('outbox: the message was neither written nor found');
  return { id: row.id, created: !before };
}
