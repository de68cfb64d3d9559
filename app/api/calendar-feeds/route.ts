import { z } from 'zod';
import { apiRoute } from '@/lib/api/route';
import { createFeed, listFeeds, publicBaseUrl } from '@/lib/data/calendar';

export const dynamic = 'force-dynamic';

const body = z.strictObject({ airfieldId: z.number().int().positive().optional() });

export const GET = apiRoute({ permission: 'plans:manage' }, async ({ user }) => ({ feeds: await listFeeds({ orgId: user.orgId, userId: user.id }) }));

export const POST = apiRoute({ permission: 'plans:manage', body, created: true }, async ({ user, body, req }) =>
  createFeed({ orgId: user.orgId, userId: user.id, airfieldId: body.airfieldId, baseUrl: publicBaseUrl(req) }),
);
