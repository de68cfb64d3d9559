import { apiRoute } from '@/lib/api/route';
import { listCapturedMail, outboxSummary } from '@/lib/data/mail';
import { env } from '@/lib/env';

export const dynamic = 'force-dynamic';

/** The local mail capture's messages for your organization, and the outbox's state (managers). */
export const GET = apiRoute({ permission: 'mail:view' }, async ({ user }) => ({
  transport: env().SMTP_URL ? 'smtp' : 'capture',
  messages: await listCapturedMail({ orgId: user.orgId }),
  outbox: await outboxSummary({ orgId: user.orgId }),
}));
