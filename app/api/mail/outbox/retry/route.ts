import { apiRoute } from '@/lib/api/route';
import { retryFailed } from '@/lib/mail/deliver';
import { deliverSoon } from '@/lib/jobs';

/** Puts your organization's failed messages back in the queue and delivers at once. */
export const POST = apiRoute({ permission: 'mail:view' }, async ({ user }) => {
  const requeued = await retryFailed({ orgId: user.orgId });
  deliverSoon();
  return { requeued };
});
