import { apiRoute, idParam } from '@/lib/api/route';
import { updateUser } from '@/lib/data/users';
import { updateUserSchema } from '@/lib/validation/auth';

export const PATCH = apiRoute({ permission: 'users:manage', body: updateUserSchema }, async ({ user, body, params }) => ({
  user: await updateUser({ orgId: user.orgId, actorId: user.id, userId: idParam(params), ...body }),
}));
