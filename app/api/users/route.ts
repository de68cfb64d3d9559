import { apiRoute } from '@/lib/api/route';
import { createUser, inviteUser, listUsers } from '@/lib/data/users';
import { inviteUserSchema } from '@/lib/validation/tokens';
import { deliverSoon } from '@/lib/jobs';

export const dynamic = 'force-dynamic';

export const GET = apiRoute({ permission: 'users:manage' }, async ({ user }) => ({ users: await listUsers({ orgId: user.orgId }) }));

/**
 * Adds a user by e-mail invitation (a single-use link to choose a password). A temporary password, if
 * sent, is still accepted instead (older clients); then no invitation goes.
 */
export const POST = apiRoute({ permission: 'users:manage', body: inviteUserSchema, created: true }, async ({ user, body }) => {
  if (body.temporaryPassword) {
    return { user: await createUser({ orgId: user.orgId, name: body.name, email: body.email, role: body.role, temporaryPassword: body.temporaryPassword }) };
  }
  const invited = await inviteUser({ orgId: user.orgId, inviterId: user.id, name: body.name, email: body.email, role: body.role });
  deliverSoon();
  return { user: invited, invited: true };
});
