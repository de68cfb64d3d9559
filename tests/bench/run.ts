// npm run bench: prints each benchmark's lines (ratios against baselines measured in the same run).
import { benchThermal } from './thermal';
import { benchPlanner } from './planner';

async function main(): Promise<void> {
  for (const bench of [benchThermal, benchPlanner]) {
    for (const line of await bench()) console.log(line);
    console.log('');
  }
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
