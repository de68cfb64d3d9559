import { apiRoute } from '@/lib/api/route';
import { mailViewerData } from '@/lib/data/mail';

export const dynamic = 'force-dynamic';

/** The local mail capture's messages for your organization, and the outbox's state (managers). */
export const GET = apiRoute({ permission: 'mail:view' }, async ({ user }) => mailViewerData({ orgId: user.orgId }));
