import 'server-only';
import { Op, fn, col } from 'sequelize';
import { db } from '@/models';
import { NotFound } from '@/lib/api/errors';
import type { OutboxStatus } from '@/lib/views/mail';
import type { CapturedMail } from '@/models/CapturedMail';
import { env } from '@/lib/env';
import { organizationZone } from '@/lib/alerts/preferences';
import type { CapturedDetail, CapturedSummary, MailViewerData, OutboxRow, OutboxSummary } from '@/lib/views/mail';

export type { CapturedDetail, CapturedSummary, MailViewerData, OutboxRow, OutboxSummary };

// The local mail capture's messages and the outbox's state, for managers of one organization.

// Single-use links (invitation, password reset) are the recipient's alone: anyone else who read one
// could take the account. The viewer shows them only to the recipient; for everyone else the token is
// replaced and the source (where encodings could carry it in any shape) is withheld.
const TOKEN_LINK = /(\/(?:invite|reset)\/)[A-Za-z0-9_-]{16,}/g;
const SECRET_KINDS = new Set(['invite', 'reset']);
export const REDACTED_LINK = 'link-only-for-the-recipient';
const WITHHELD_SOURCE = 'The source of this message is withheld: it carries a single-use link that only its recipient may see.';

function isRecipient(viewerEmail: string, r: CapturedMail): boolean {
  const me = viewerEmail.trim().toLowerCase();
  return r.recipients.some((x) => x.trim().toLowerCase() === me);
}

async function kindsByMessageId(ids: (string | null)[]) {
  const { OutboxMessage } = db();
  const list = ids.filter((x): x is string => !!x);
  if (!list.length) return new Map<string, string>();
  const rows = await OutboxMessage.findAll({ where: { messageId: { [Op.in]: list } }, attributes: ['messageId', 'kind'] });
  return new Map(rows.map((r) => [r.messageId, r.kind as string]));
}

function summaryOf(r: CapturedMail, kinds: Map<string, string>): CapturedSummary {
  return {
    id: r.id,
    subject: r.subject,
    from: r.fromHeader,
    to: r.toHeader,
    kind: (r.messageId && kinds.get(r.messageId)) || null,
    receivedAt: r.receivedAt.toISOString(),
    sizeBytes: r.sizeBytes,
  };
}

export async function listCapturedMail({ orgId, limit = 100 }: { orgId: number; limit?: number }): Promise<CapturedSummary[]> {
  const { CapturedMail } = db();
  const rows = await CapturedMail.findAll({
    where: { organizationId: orgId },
    order: [['receivedAt', 'DESC'], ['id', 'DESC']],
    limit,
    attributes: ['id', 'subject', 'fromHeader', 'toHeader', 'receivedAt', 'sizeBytes', 'messageId'],
  });
  const kinds = await kindsByMessageId(rows.map((r) => r.messageId));
  return rows.map((r) => summaryOf(r, kinds));
}

/** One captured message of the organization; single-use links are hidden unless the viewer is its recipient. */
export async function getCapturedMail({ orgId, id, viewerEmail }: { orgId: number; id: number; viewerEmail: string }): Promise<CapturedDetail> {
  const { CapturedMail } = db();
  const r = await CapturedMail.findOne({ where: { id, organizationId: orgId } });
  if (!r) throw new NotFound('Message');
  const kinds = await kindsByMessageId([r.messageId]);
  const summary = summaryOf(r, kinds);
  const hasLink = (v: string) => new RegExp(TOKEN_LINK.source).test(v);
  const carriesToken = SECRET_KINDS.has(summary.kind ?? '') || hasLink(r.text) || hasLink(r.html) || hasLink(r.raw);
  const redact = carriesToken && !isRecipient(viewerEmail, r);
  const hide = (v: string) => (redact ? v.replace(TOKEN_LINK, `$1${REDACTED_LINK}`) : v);
  return {
    ...summary,
    messageId: r.messageId,
    recipients: r.recipients,
    headers: r.headers,
    text: hide(r.text),
    html: hide(r.html),
    raw: redact ? WITHHELD_SOURCE : r.raw,
    redacted: redact,
  };
}

/** Counts by status and the latest messages of the organization's outbox. */
export async function outboxSummary({ orgId, limit = 20 }: { orgId: number; limit?: number }): Promise<OutboxSummary> {
  const { OutboxMessage } = db();
  const counts = (await OutboxMessage.findAll({
    where: { organizationId: orgId },
    attributes: ['status', [fn('COUNT', col('id')), 'n']],
    group: ['status'],
    raw: true,
  })) as unknown as { status: OutboxStatus; n: number | string }[];
  const byStatus: Record<OutboxStatus, number> = { pending: 0, sending: 0, sent: 0, failed: 0, expired: 0, cancelled: 0 };
  for (const c of counts) byStatus[c.status] = Number(c.n);
  const rows = await OutboxMessage.findAll({ where: { organizationId: orgId }, order: [['createdAt', 'DESC'], ['id', 'DESC']], limit });
  const recent: OutboxRow[] = rows.map((m) => ({
    id: m.id,
    kind: m.kind,
    to: m.toAddress,
    subject: m.subject,
    status: m.status,
    attempts: m.attempts,
    lastError: m.lastError ?? null,
    nextAttemptAt: m.nextAttemptAt.toISOString(),
    sentAt: m.sentAt ? m.sentAt.toISOString() : null,
    createdAt: m.createdAt.toISOString(),
  }));
  return { counts: byStatus, recent };
}


/** Everything the mail viewer lists: captured messages, the outbox's state, where mail goes. */
export async function mailViewerData({ orgId }: { orgId: number }): Promise<MailViewerData> {
  return {
    transport: env().SMTP_URL ? 'smtp' : 'capture',
    timeZone: await organizationZone(orgId),
    messages: await listCapturedMail({ orgId }),
    outbox: await outboxSummary({ orgId }),
  };
}
