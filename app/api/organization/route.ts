import { apiRoute } from '@/lib/api/route';
import { getPlanningSettings, updatePlanningSettings } from '@/lib/data/organization';
import { organizationPlanningSchema } from '@/lib/validation/organization';

/** The organization's planning settings: any member reads them; managers change them. */
export const GET = apiRoute({ permission: 'org:read' }, async ({ user }) => ({ planning: await getPlanningSettings({ orgId: user.orgId }) }));

export const PATCH = apiRoute({ permission: 'users:manage', body: organizationPlanningSchema }, async ({ user, body }) => ({
  planning: await updatePlanningSettings({ orgId: user.orgId, patch: body }),
}));
