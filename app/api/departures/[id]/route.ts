import { apiRoute, idParam } from '@/lib/api/route';
import { can } from '@/lib/auth/permissions';
import type { CurrentUser } from '@/lib/auth/guards';
import { cancelDeparture, getDeparture, updateDeparture } from '@/lib/data/departures';
import { departureUpdateSchema } from '@/lib/validation/departures';

export const dynamic = 'force-dynamic';

const actorOf = (user: CurrentUser) => ({ id: user.id, bookAny: can(user.role, 'departures:book-any') });

export const GET = apiRoute({ permission: 'departures:book-own' }, async ({ user, params }) => ({
  departure: await getDeparture({ orgId: user.orgId, departureId: idParam(params), actor: actorOf(user) }),
}));

export const PATCH = apiRoute({ permission: 'departures:book-own', body: departureUpdateSchema }, async ({ user, body, params }) => ({
  departure: await updateDeparture({ orgId: user.orgId, actor: actorOf(user), departureId: idParam(params), patch: body }),
}));

/** Cancels the departure (the record stays, marked cancelled). */
export const DELETE = apiRoute({ permission: 'departures:book-own' }, async ({ user, params }) => ({
  departure: await cancelDeparture({ orgId: user.orgId, actor: actorOf(user), departureId: idParam(params) }),
}));
