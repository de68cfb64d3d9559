// The shared shape of Thawline's JSON CLIs (simulate, plan): read FILE.json, validate it with a zod
// schema, print the result as JSON on stdout; errors go to stderr naming the field, exit code 1.
import { readFileSync } from 'node:fs';
import type { ZodType } from 'zod';

/** Field path as people write it: engine.nodes[0].name. */
export function fieldOf(path: readonly PropertyKey[]): string {
  return path.reduce<string>((s, p) => (typeof p === 'number' ? `${s}[${p}]` : s ? `${s}.${String(p)}` : String(p)), '') || '(top level)';
}

/**
 * JSON has no NaN or Infinity, but hand-written files and some tools emit them. Bare tokens are quoted
 * (strings left alone) so validation can say which field holds them instead of a parse error at a byte offset.
 */
export function parseLenientJson(text: string): unknown {
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

/** Runs the CLI; `fieldError` turns a domain error thrown by `run` into a field and message (else it is rethrown). */
export function runJsonFileCli<T>(o: {
  name: string;
  schema: ZodType<T>;
  run: (input: T) => unknown;
  fieldError?: (e: unknown) => { field: string; message: string } | null;
}): void {
  const fail = (message: string): never => {
    process.stderr.write(`${o.name}: ${message}\n`);
    process.exit(1);
  };
  const file = process.argv[2];
  if (!file) fail(`usage: npm run -s ${o.name} -- FILE.json`);
  let text = '';
  try {
    text = readFileSync(file, 'utf8');
  } catch (e) {
    fail(`cannot read ${file}: ${(e as Error).message}`);
  }
  let body: unknown;
  try {
    body = parseLenientJson(text);
  } catch (e) {
    fail(`${file} is not valid JSON: ${(e as Error).message}`);
  }
  const parsed = o.schema.safeParse(body);
  if (!parsed.success) {
    const lines = parsed.error.issues.slice(0, 20).map((i) => `  ${fieldOf(i.path)}: ${i.message}`);
    const more = parsed.error.issues.length > 20 ? `\n  … and ${parsed.error.issues.length - 20} more` : '';
    fail(`invalid input in ${file}:\n${lines.join('\n')}${more}`);
    return;
  }
  let out: unknown;
  try {
    out = o.run(parsed.data);
  } catch (e) {
    const f = o.fieldError?.(e);
    if (f) fail(`invalid input in ${file}:\n  ${f.field}: ${f.message}`);
    throw e;
  }
  process.stdout.write(JSON.stringify(out) + '\n');
}
