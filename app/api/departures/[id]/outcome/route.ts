import { apiRoute, idParam } from '@/lib/api/route';
import { can } from '@/lib/auth/permissions';
import type { CurrentUser } from '@/lib/auth/guards';
import { deleteOutcome, getOutcome, recordOutcome } from '@/lib/data/outcomes';
import { outcomeSchema } from '@/lib/validation/outcomes';

export const dynamic = 'force-dynamic';

// The Morning outcome of a departure: a pilot's own departures, any in the organization for roles that
// book for anyone (another pilot's departure and another organization's are 404).
const actorOf = (user: CurrentUser) => ({ id: user.id, bookAny: can(user.role, 'departures:book-any') });

export const GET = apiRoute({ permission: 'departures:book-own' }, async ({ user, params }) => ({
  outcome: await getOutcome({ orgId: user.orgId, actor: actorOf(user), departureId: idParam(params) }),
}));

/** Records the outcome; recording again changes it. */
export const PUT = apiRoute({ permission: 'departures:book-own', body: outcomeSchema }, async ({ user, body, params }) => ({
  outcome: await recordOutcome({ orgId: user.orgId, actor: actorOf(user), departureId: idParam(params), input: body }),
}));

/** Removes the outcome (undo). */
export const DELETE = apiRoute({ permission: 'departures:book-own' }, async ({ user, params }) => ({
  ...(await deleteOutcome({ orgId: user.orgId, actor: actorOf(user), departureId: idParam(params) })),
  outcome: null,
}));
