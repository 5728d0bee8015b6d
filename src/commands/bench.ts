import { benchJson } from '../bench/bench-json.js';
import { benchText } from '../bench/bench-text.js';
import { runBench } from '../bench/run-bench.js';
import type { BackendName } from '../learn/spec.js';
import { benchUsage } from './bench-usage.js';
import { runAction } from './command-line.js';
import { EXIT } from './exit-codes.js';

/** `crosswise bench`: speed figures, medians of --repeats runs after a warm-up (see bench-usage.ts). */
export async function benchCommand(args: readonly string[]): Promise<number> {
  return runAction(benchUsage, args, async ({ values }) => bench(values));
}

async function bench({ json, quick, backend, repeats }: { json: boolean; quick: boolean; backend: BackendName; repeats: number }): Promise<number> {
  const figures = await runBench({ repeats, quick, backend, progress: (section) => console.error(`bench: ${section}...`) });
  if (json) console.log(JSON.stringify(benchJson(figures, { quick, repeats }), null, 2));
  else console.log(benchText(figures).join('\n'));
  return EXIT.success;
}
