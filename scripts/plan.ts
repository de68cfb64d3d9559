// npm run -s plan -- FILE.json
// Reads a plan request (the contract of lib/validation/plan.ts: the simulate contract without
// heaters, plus "plan"), prints the heat plan as JSON on stdout. Errors go to stderr naming the
// field, with exit code 1. No database.
import { readFileSync } from 'node:fs';
import { runPlan } from '@/lib/planner/contract';
import { PlanInputError } from '@/lib/planner/types';
import { planInputSchema } from '@/lib/validation/plan';

function fail(message: string): never {
  process.stderr.write(`plan: ${message}\n`);
  process.exit(1);
}

/** Field path as people write it: plan.tariff[0].from. */
function fieldOf(path: readonly PropertyKey[]): string {
  return path.reduce<string>((s, p) => (typeof p === 'number' ? `${s}[${p}]` : s ? `${s}.${String(p)}` : String(p)), '') || '(top level)';
}

/** Bare NaN / Infinity (not valid JSON, but some tools write them) quoted, so validation can name their field. */
function parseLenient(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch (e) {
    try {
      return JSON.parse(text.replace(/"(?:[^"\\]|\\.)*"|(-?Infinity|NaN)/g, (m, bare: string | undefined) => (bare ? `"${bare}"` : m)));
    } catch {
      throw e;
    }
  }
}

function main(): void {
  const file = process.argv[2];
  if (!file) fail('usage: npm run -s plan -- FILE.json');
  let text: string;
  try {
    text = readFileSync(file, 'utf8');
  } catch (e) {
    fail(`cannot read ${file}: ${(e as Error).message}`);
  }
  let body: unknown;
  try {
    body = parseLenient(text);
  } catch (e) {
    fail(`${file} is not valid JSON: ${(e as Error).message}`);
  }
  const parsed = planInputSchema.safeParse(body);
  if (!parsed.success) {
    const lines = parsed.error.issues.slice(0, 20).map((i) => `  ${fieldOf(i.path)}: ${i.message}`);
    const more = parsed.error.issues.length > 20 ? `\n  … and ${parsed.error.issues.length - 20} more` : '';
    fail(`invalid input in ${file}:\n${lines.join('\n')}${more}`);
  }
  try {
    process.stdout.write(JSON.stringify(runPlan(parsed.data)) + '\n');
  } catch (e) {
    if (e instanceof PlanInputError) fail(`invalid input in ${file}:\n  ${e.field}: ${e.message}`);
    throw e;
  }
}

main();
