import { benchCollection } from '../bench/collection.js';
import { probeSecondsPerCell } from '../bench/probe.js';
import type { BenchResult } from '../bench/result.js';
import { benchSweep } from '../bench/sweep.js';
import { benchTorchReference } from '../bench/torch-reference.js';
import { benchTraining } from '../bench/training.js';
import type { BackendName } from '../learn/spec.js';
import { benchUsage } from './bench-usage.js';
import { runAction } from './command-line.js';
import { EXIT } from './exit-codes.js';

function formatValue(value: number): string {
  if (Number.isNaN(value)) return '–';
  return value >= 100 ? Math.round(value).toLocaleString('en-US') : value.toFixed(2);
}

/** `crosswise bench`: collection, training and sweep figures (see bench-usage.ts). */
export async function benchCommand(args: readonly string[]): Promise<number> {
  return runAction(benchUsage, args, async ({ values }) => bench(values));
}

async function bench({ json, quick, backend }: { json: boolean; quick: boolean; backend: BackendName }): Promise<number> {
  const sections: [string, () => Promise<BenchResult[]>][] = [
    ['collection', () => benchCollection({ quick })],
    ['training', () => benchTraining({ quick, backend })],
    ['probe', async () => [{
      name: 'probe_s_per_cell',
      value: await probeSecondsPerCell({ repeats: quick ? 1 : 3, backend }),
      unit: 's',
      detail: `one quickstart encoder: 5 targets × 6 sight gaussian severities, 20 000 steps, median of ${quick ? 1 : 3}`,
    }]],
    ['PyTorch reference', () => benchTorchReference({ quick })],
  ];
  // The sweep figure runs the whole quickstart; --quick leaves it out to stay under a minute.
  if (!quick) sections.push(['sweep', benchSweep]);
  const results: BenchResult[] = [];
  for (const [name, run] of sections) {
    if (!json) console.error(`bench: ${name}...`);
    for (const result of await run()) {
      results.push(result);
      if (!json) console.log(`${result.name.padEnd(48)} ${formatValue(result.value).padStart(10)} ${result.unit.padEnd(10)} ${result.detail}`);
    }
  }
  if (json) console.log(JSON.stringify({ quick, backend, node: process.version, results }, null, 2));
  return EXIT.success;
}
