// npm run -s plan -- FILE.json
// Reads a plan request (the contract of lib/validation/plan.ts: the simulate contract without
// heaters, plus "plan"), prints the heat plan as JSON on stdout. Errors go to stderr naming the
// field, with exit code 1. No database.
import { runJsonFileCli } from '@/lib/cli/json-file';
import { runPlan } from '@/lib/planner/contract';
import { PlanInputError } from '@/lib/planner/types';
import { planInputSchema } from '@/lib/validation/plan';

runJsonFileCli({
  name: 'plan',
  schema: planInputSchema,
  run: runPlan,
  fieldError: (e) => (e instanceof PlanInputError ? { field: e.field, message: e.message } : null),
});
