import { parseArgs } from 'node:util';
import { benchCollection } from '../bench/collection.js';
import { probeSecondsPerCell } from '../bench/probe.js';
import type { BenchResult } from '../bench/result.js';
import { benchSweep } from '../bench/sweep.js';
import { benchTorchReference } from '../bench/torch-reference.js';
import { benchTraining } from '../bench/training.js';
import { BACKENDS, type BackendName } from '../learn/spec.js';

const OPTIONS = { json: { type: 'boolean' }, quick: { type: 'boolean' }, backend: { type: 'string' } } as const;

function formatValue(value: number): string {
  if (Number.isNaN(value)) return '–';
  return value >= 100 ? Math.round(value).toLocaleString('en-US') : value.toFixed(2);
}

/** `crosswise bench [--json] [--quick] [--backend wasm|cpu]`: collection, training and sweep figures. */
export async function benchCommand(args: readonly string[]): Promise<number> {
  let values;
  try {
    ({ values } = parseArgs({ args: [...args], options: OPTIONS, strict: true }));
  } catch (error) {
    console.error(`crosswise bench: ${(error as Error).message}`);
    return 1;
  }
  const backend = (values.backend ?? 'wasm') as BackendName;
  if (!BACKENDS.includes(backend)) {
    console.error(`crosswise bench: --backend: expected one of ${BACKENDS.join(', ')}, got '${values.backend}'`);
    return 1;
  }
  const quick = values.quick === true;
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
    if (values.json !== true) console.error(`bench: ${name}...`);
    for (const result of await run()) {
      results.push(result);
      if (values.json !== true) console.log(`${result.name.padEnd(48)} ${formatValue(result.value).padStart(10)} ${result.unit.padEnd(10)} ${result.detail}`);
    }
  }
  if (values.json === true) console.log(JSON.stringify({ quick, backend, node: process.version, results }, null, 2));
  return 0;
}
