import { apiRoute } from '@/lib/api/route';
import { unreadAlertCount } from '@/lib/data/alerts';

export const dynamic = 'force-dynamic';

/** The unread count for the navigation badge. */
export const GET = apiRoute({ permission: 'org:read' }, async ({ user }) => ({ unread: await unreadAlertCount({ orgId: user.orgId, userId: user.id }) }));
