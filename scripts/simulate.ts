// npm run -s simulate -- FILE.json
// Reads a simulate request (the contract of lib/validation/simulation.ts), prints the Soak forecast
// as JSON on stdout. Errors go to stderr, naming the field, with exit code 1. No database.
import { readFileSync } from 'node:fs';
import { runSimulation } from '@/lib/thermal';
import { simulationInputSchema } from '@/lib/validation/simulation';

function fail(message: string): never {
  process.stderr.write(`simulate: ${message}\n`);
  process.exit(1);
}

/** Field path as people write it: engine.nodes[0].name. */
function fieldOf(path: readonly PropertyKey[]): string {
  let s = '';
  for (const p of path) s += typeof p === 'number' ? `[${p}]` : `${s ? '.' : ''}${String(p)}`;
  return s || '(top level)';
}

/**
 * JSON has no NaN or Infinity, but hand-written files and some tools emit them. Quote those bare
 * tokens so validation can say which field holds them instead of a parse error at a byte offset.
 */
function quoteNonFinite(text: string): string {
  let out = '';
  let inString = false;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i];
    if (inString) {
      out += ch;
      if (ch === '\\') out += text[++i] ?? '';
      else if (ch === '"') inString = false;
      continue;
    }
    if (ch === '"') {
      inString = true;
      out += ch;
      continue;
    }
    const m = /^(-?Infinity|NaN)/.exec(text.slice(i, i + 9));
    if (m) {
      out += `"${m[1]}"`;
      i += m[1].length - 1;
      continue;
    }
    out += ch;
  }
  return out;
}

function main(): void {
  const file = process.argv[2];
  if (!file) fail('usage: npm run -s simulate -- FILE.json');
  let text: string;
  try {
    text = readFileSync(file, 'utf8');
  } catch (e) {
    fail(`cannot read ${file}: ${(e as Error).message}`);
  }
  let body: unknown;
  try {
    body = JSON.parse(text);
  } catch (e) {
    try {
      body = JSON.parse(quoteNonFinite(text));
    } catch {
      fail(`${file} is not valid JSON: ${(e as Error).message}`);
    }
  }
  const parsed = simulationInputSchema.safeParse(body);
  if (!parsed.success) {
    const lines = parsed.error.issues.slice(0, 20).map((i) => `  ${fieldOf(i.path)}: ${i.message}`);
    const more = parsed.error.issues.length > 20 ? `\n  … and ${parsed.error.issues.length - 20} more` : '';
    fail(`invalid input in ${file}:\n${lines.join('\n')}${more}`);
  }
  process.stdout.write(JSON.stringify(runSimulation(parsed.data)) + '\n');
}

main();
