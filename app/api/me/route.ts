import { apiRoute } from '@/lib/api/route';
import { PERMISSIONS } from '@/lib/auth/permissions';
import { getOrganization, updatePreferences } from '@/lib/data/users';
import { preferencesSchema } from '@/lib/validation/auth';

export const dynamic = 'force-dynamic';

export const GET = apiRoute({}, async ({ user }) => {
  const org = await getOrganization({ orgId: user.orgId });
  return {
    id: user.id,
    name: user.name,
    email: user.email,
    role: user.role,
    permissions: PERMISSIONS[user.role],
    organization: { id: org.id, name: org.name },
    units: { temperature: user.tempUnit, volume: user.volumeUnit },
    mustChangePassword: user.mustChangePassword,
  };
});

export const PATCH = apiRoute({ body: preferencesSchema }, async ({ user, body }) => updatePreferences({ userId: user.id, ...body }));
