import type { Figure } from './figure.js';
import type { BenchFigures } from './run-bench.js';

type Spread = [number, number];
type Nested<T> = T | { [key: string]: Nested<T> } | null;

/** A figure (or an object of figures) as its median, and as its [min, max]. */
function split(value: Nested<Figure>): { median: Nested<number>; spread: Nested<Spread> } {
  if (value == null) return { median: null, spread: null };
  if ('median' in value && typeof value.median === 'number') {
    const f = value as Figure;
    return { median: f.median, spread: [f.min, f.max] };
  }
  const entries = Object.entries(value as Record<string, Nested<Figure>>).map(([k, v]) => [k, split(v)] as const);
  return {
    median: Object.fromEntries(entries.map(([k, v]) => [k, v.median])),
    spread: Object.fromEntries(entries.map(([k, v]) => [k, v.spread])),
  };
}

/** One model's best backend divided by PyTorch: median over median, spread from the extremes. */
function ratioToTorch(figures: BenchFigures): Figure | null {
  if (figures.torch == null) return null;
  const best = Object.values(figures.trainSamplesPerS).reduce((a, b) => (b.median > a.median ? b : a));
  const torch = figures.torch.samplesPerS;
  return { median: best.median / torch.median, min: best.min / torch.max, max: best.max / torch.min, repeats: Math.min(best.repeats, torch.repeats) };
}

/**
 * The bench as one JSON object: every top-level figure is a median, and `spread` maps the
 * same keys to [min, max]. Figures that were not measured (no PyTorch, --quick) are null.
 */
export function benchJson(figures: BenchFigures, options: { quick: boolean; repeats: number }): Record<string, unknown> {
  const measured: Record<string, Nested<Figure>> = {
    collect_steps_per_s: figures.collectStepsPerS,
    train_samples_per_s: figures.trainSamplesPerS,
    torch_samples_per_s: figures.torch?.samplesPerS ?? null,
    ratio_to_torch: ratioToTorch(figures),
    train_stacked_samples_per_s: figures.trainStackedSamplesPerS,
    probe_s_per_cell: figures.probeSPerCell,
    quickstart_wall_s: figures.quickstartWallS,
    startup_s: figures.startupS,
    peer_quickstart_wall_s: figures.peerQuickstartWallS,
    train_objectives_samples_per_s: figures.trainObjectivesSamplesPerS,
    train_spiking_samples_per_s: figures.trainSpikingSamplesPerS,
  };
  const parts = Object.entries(measured).map(([key, value]) => [key, split(value)] as const);
  return {
    ...Object.fromEntries(parts.map(([key, part]) => [key, part.median])),
    torch_blas: figures.torch?.blas ?? null,
    torch_blas_library: figures.torch?.blasLibrary ?? null,
    torch_version: figures.torch?.torch ?? null,
    machine: figures.machine,
    quick: options.quick,
    repeats: options.repeats,
    notes: figures.notes,
    spread: Object.fromEntries(parts.map(([key, part]) => [key, part.spread])),
  };
}
