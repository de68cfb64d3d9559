import { apiRoute } from '@/lib/api/route';
import { Invalid } from '@/lib/api/errors';
import { runPlan } from '@/lib/planner/contract';
import { PlanInputError } from '@/lib/planner/types';
import { planInputSchema } from '@/lib/validation/plan';

export const dynamic = 'force-dynamic';

/**
 * A heat plan for one departure: the same contract as `npm run -s plan` (the simulate contract
 * without heaters, plus "plan"). Nothing is stored: the Morning board keeps its own plans.
 */
export const POST = apiRoute({ permission: 'simulate', body: planInputSchema, maxBodyBytes: 64 * 1024 * 1024 }, async ({ body }) => {
  try {
    return runPlan(body);
  } catch (e) {
    if (e instanceof PlanInputError) throw new Invalid([{ field: e.field, message: e.message }]);
    throw e;
  }
});
