import { apiRoute } from '@/lib/api/route';
import { runSimulation } from '@/lib/thermal';
import { simulationInputSchema } from '@/lib/validation/simulation';

export const dynamic = 'force-dynamic';

/**
 * The Soak forecast for one engine: the same contract as `npm run -s simulate`. The body limit is
 * generous so that an over-long series is answered 422 naming the field, not 413.
 */
export const POST = apiRoute({ permission: 'simulate', body: simulationInputSchema, maxBodyBytes: 64 * 1024 * 1024 }, async ({ body }) => runSimulation(body));
