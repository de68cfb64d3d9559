import { z } from 'zod';
import { apiRoute } from '@/lib/api/route';
import { morningBoard } from '@/lib/data/plans';

export const dynamic = 'force-dynamic';

const query = z.object({ airfield: z.coerce.number().int().positive().optional() });

/** The Morning board: next morning's departures in switch-on order, with their heat plans. */
export const GET = apiRoute({ permission: 'plans:manage', query }, async ({ user, query }) => morningBoard({ orgId: user.orgId, airfieldId: query.airfield }));
