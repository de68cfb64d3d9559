import { apiRoute } from '@/lib/api/route';
import { getAlertPreferences, saveAlertPreferences } from '@/lib/data/alerts';
import { alertPreferencesSchema } from '@/lib/validation/alerts';

export const dynamic = 'force-dynamic';

/** Your alert preferences: which alerts, e-mail on or off, quiet hours (local), reminder lead, units. */
export const GET = apiRoute({ permission: 'org:read' }, async ({ user }) => getAlertPreferences({ orgId: user.orgId, userId: user.id, role: user.role }));

const save = apiRoute({ permission: 'org:read', body: alertPreferencesSchema }, async ({ user, body }) =>
  saveAlertPreferences({ orgId: user.orgId, userId: user.id, role: user.role, input: body }),
);
export const PATCH = save;
export const PUT = save;
