// npm run -s simulate -- FILE.json
// Reads a simulate request (the contract of lib/validation/simulation.ts), prints the Soak forecast
// as JSON on stdout. Errors go to stderr, naming the field, with exit code 1. No database.
import { runJsonFileCli } from '@/lib/cli/json-file';
import { runSimulation } from '@/lib/thermal';
import { simulationInputSchema } from '@/lib/validation/simulation';

runJsonFileCli({ name: 'simulate', schema: simulationInputSchema, run: runSimulation });
