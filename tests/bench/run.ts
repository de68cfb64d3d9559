// npm run bench: prints each benchmark's lines.
import { benchThermal } from './thermal';

async function main(): Promise<void> {
  for (const line of await benchThermal()) console.log(line);
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
