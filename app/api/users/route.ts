import { apiRoute } from '@/lib/api/route';
import { createUser, listUsers } from '@/lib/data/users';
import { createUserSchema } from '@/lib/validation/auth';

export const dynamic = 'force-dynamic';

export const GET = apiRoute({ permission: 'users:manage' }, async ({ user }) => ({ users: await listUsers({ orgId: user.orgId }) }));

export const POST = apiRoute({ permission: 'users:manage', body: createUserSchema, created: true }, async ({ user, body }) => ({
  user: await createUser({ orgId: user.orgId, ...body }),
}));
