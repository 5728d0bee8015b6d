import type { Figure } from './figure.js';
import type { BenchFigures } from './run-bench.js';

function number(value: number): string {
  return value >= 100 ? Math.round(value).toLocaleString('en-US') : value.toPrecision(3);
}

function line(name: string, figure: Figure | null, unit: string, detail = ''): string {
  if (figure == null) return `${name.padEnd(44)} ${'–'.padStart(10)} ${unit.padEnd(10)} ${detail}`;
  const spread = `[${number(figure.min)} – ${number(figure.max)}]`;
  return `${name.padEnd(44)} ${number(figure.median).padStart(10)} ${unit.padEnd(10)} ${spread.padEnd(24)} ${detail}`.trimEnd();
}

/** The bench as aligned lines for a terminal: median, unit, [min – max], what was measured. */
export function benchText(f: BenchFigures): string[] {
  const torch = f.torch;
  const best = Math.max(...Object.values(f.trainSamplesPerS).map((r) => r.median));
  return [
    `machine: ${f.machine.cores} cores, ${f.machine.cpu_model}, Node ${f.machine.node}, load ${f.machine.load_1min}; medians of ${f.startupS.repeats} after a warm-up`,
    line('start-up (node bin/crosswise.js --help)', f.startupS, 's'),
    line('collection', f.collectStepsPerS, 'steps/s'),
    ...Object.entries(f.trainSamplesPerS).map(([backend, r]) => line(`train reference MLP, one model (${backend})`, r, 'samples/s', '160→128→128→48 relu, MSE, Adam, batch 256')),
    line('train reference MLP, stacked (wasm)', f.trainStackedSamplesPerS, 'samples/s', 'summed over the stacked models'),
    line(`train reference MLP (PyTorch ${torch?.torch ?? 'absent'})`, torch?.samplesPerS ?? null, 'samples/s', torch == null ? '' : `one thread, BLAS: ${torch.blas} ${torch.blasLibrary}`),
    ...(torch == null ? [] : [`  best crosswise backend ÷ PyTorch: ${(best / torch.samplesPerS.median).toFixed(2)}`]),
    ...Object.entries(f.trainObjectivesSamplesPerS).map(([label, r]) => line(`  train ${label}`, r, 'samples/s')),
    ...Object.entries(f.trainSpikingSamplesPerS).map(([label, r]) => line(`  train spiking ${label}`, r, 'samples/s')),
    line('probe one quickstart cell', f.probeSPerCell, 's', '5 targets × 6 sight gaussian severities'),
    line('quickstart sweep, --jobs 1', f.quickstartWallS?.jobs1 ?? null, 's wall', 'fixed 15-cell copy (src/bench/quickstart-15.yaml)'),
    line('quickstart sweep, --jobs 2', f.quickstartWallS?.jobs2 ?? null, 's wall'),
    line('peer script (PyTorch + scikit-learn, 2 workers)', f.peerQuickstartWallS, 's wall', 'the same 15 cells'),
    ...f.notes.map((n) => `note: ${n}`),
  ];
}
