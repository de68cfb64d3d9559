import { apiRoute } from '@/lib/api/route';
import { can } from '@/lib/auth/permissions';
import { bookDeparture, listDepartures } from '@/lib/data/departures';
import { departureCreateSchema, departureListQuery } from '@/lib/validation/departures';

export const dynamic = 'force-dynamic';

const HOUR_MS = 3_600_000;
/** Without bounds: from six hours ago to two weeks ahead. */
const DEFAULT_BACK_MS = 6 * HOUR_MS;
const DEFAULT_AHEAD_MS = 14 * 24 * HOUR_MS;

/** Pilots see the departures they fly; operators and managers everyone's (filter by pilotId). */
export const GET = apiRoute({ permission: 'departures:book-own', query: departureListQuery }, async ({ user, query }) => {
  const now = Date.now();
  const bookAny = can(user.role, 'departures:book-any');
  const fromMs = query.from ?? now - DEFAULT_BACK_MS;
  const toMs = query.to ?? Math.max(fromMs, now) + DEFAULT_AHEAD_MS;
  const departures = await listDepartures({
    orgId: user.orgId,
    fromMs,
    toMs,
    pilotId: bookAny ? query.pilotId : user.id,
    airfieldId: query.airfieldId,
    aircraftId: query.aircraftId,
    includeCancelled: query.cancelled === '1',
  });
  return { departures, fromMs, toMs };
});

/** Books a departure: a pilot for themself on an aircraft they may fly; operators and managers for anyone. */
export const POST = apiRoute({ permission: 'departures:book-own', body: departureCreateSchema, created: true }, async ({ user, body }) => ({
  departure: await bookDeparture({ orgId: user.orgId, actor: { id: user.id, bookAny: can(user.role, 'departures:book-any') }, input: body }),
}));
