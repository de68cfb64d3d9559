import { apiRoute, idParam } from '@/lib/api/route';
import { getTariff, putTariff } from '@/lib/data/tariffs';
import { tariffSchema } from '@/lib/validation/tariffs';

export const dynamic = 'force-dynamic';

/** The airfield's time-of-use tariff, or the flat default (source "default") when none is stored. */
export const GET = apiRoute({ permission: 'org:read' }, async ({ user, params }) => ({
  tariff: await getTariff({ orgId: user.orgId, airfieldId: idParam(params) }),
}));

/** Stores or replaces the airfield's tariff (periods and 12×24 weekday/weekend schedules). */
export const PUT = apiRoute({ permission: 'airfields:edit', body: tariffSchema }, async ({ user, body, params }) => ({
  tariff: await putTariff({ orgId: user.orgId, airfieldId: idParam(params), input: body }),
}));
