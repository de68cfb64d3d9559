// The durable outbox: every e-mail is first a row. Enqueueing the same de-duplication key twice
// writes one row (unique index; a look-up first, and a writer that loses the race to the same key finds
// the other's row). Inserted with bound parameters (Model.create), never with values in the SQL text;
// control characters (from data stored before the text fields refused them) are taken out first.
import crypto from 'node:crypto';
import type { Transaction } from 'sequelize';
import { writeTransaction } from '@/models/transaction';
import { stripControlChars } from '@/lib/validation/text';
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
  const { OutboxMessage, sequelize } = db();
  const now = m.now ?? new Date();
  const line = (v: string) => stripControlChars(v);
  const body = (v: string) => stripControlChars(v, { multiline: true });
  const dedupeKey = line(m.dedupeKey).slice(0, 200);
  const values = {
    organizationId: m.organizationId,
    userId: m.userId,
    alertId: m.alertId ?? null,
    kind: m.kind,
    toAddress: line(m.to),
    subject: line(m.mail.subject).slice(0, 250),
    text: body(m.mail.text),
    html: body(m.mail.html),
    headers: m.mail.headers ? Object.fromEntries(Object.entries(m.mail.headers).map(([k, v]) => [line(k), line(String(v))])) : null,
    dedupeKey,
    messageId: messageIdFor(m.dedupeKey),
    status: 'pending' as const,
    attempts: 0,
    nextAttemptAt: m.notBefore && m.notBefore > now ? m.notBefore : now,
    expiresAt: m.expiresAt ?? null,
  };
  const once = async (transaction: Transaction) => {
    const found = await OutboxMessage.findOne({ where: { dedupeKey }, attributes: ['id'], transaction });
    if (found) return { id: found.id, created: false };
    const row = await OutboxMessage.create(values, { transaction });
    return { id: row.id, created: true };
  };
  if (!m.transaction) return writeTransaction(once, { retryOnUnique: true });
  try {
    // A savepoint: another writer's row with the same key must not abort the caller's transaction (PostgreSQL).
    return await sequelize.transaction({ transaction: m.transaction }, once);
  } catch (err) {
    if ((err as { name?: string }).name !== 'SequelizeUniqueConstraintError') throw err;
    const row = await OutboxMessage.findOne({ where: { dedupeKey }, attributes: ['id'], transaction: m.transaction });
    if (!row) throw err;
    return { id: row.id, created: false };
  }
}
