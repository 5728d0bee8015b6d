import { describe, expect, it } from 'vitest';
import { benchJson } from '../../src/bench/bench-json.js';
import { figureOf } from '../../src/bench/figure.js';
import type { BenchFigures } from '../../src/bench/run-bench.js';

// The JSON contract of `crosswise bench --json` (its keys and their meaning), checked on
// figures made from fixed numbers: no timing happens in a test.

const fig = (...values: number[]) => figureOf(values);

function figures(overrides: Partial<BenchFigures> = {}): BenchFigures {
  return {
    collectStepsPerS: fig(300_000, 200_000, 250_000),
    trainSamplesPerS: { wasm: fig(60_000, 70_000, 65_000), cpu: fig(3_000, 2_000, 2_500) },
    trainStackedSamplesPerS: fig(5_000, 6_000, 7_000),
    torch: { samplesPerS: fig(240_000, 250_000, 260_000), torch: '1.13.0', blas: 'openblas', blasLibrary: '/usr/lib/libopenblasp.so', warning: null },
    probeSPerCell: fig(0.5, 0.4, 0.6),
    quickstartWallS: { jobs1: fig(40, 41, 42), jobs2: fig(25, 26, 24) },
    startupS: fig(0.3, 0.2, 0.4),
    peerQuickstartWallS: fig(13, 14, 15),
    trainObjectivesSamplesPerS: { 'reconstruct sight': fig(1, 2, 3) },
    trainSpikingSamplesPerS: { 'T=8 predict sight→sound, backprop': fig(4, 5, 6) },
    machine: { cores: 2, cpu_model: 'test CPU', node: 'v20.0.0', load_1min: 0.5 },
    notes: [],
    ...overrides,
  };
}

describe('figureOf', () => {
  it('gives the median with min and max (odd count: the middle value; even: the mean of the middle two)', () => {
    expect(figureOf([3, 1, 2])).toEqual({ median: 2, min: 1, max: 3, repeats: 3 });
    expect(figureOf([4, 1, 3, 2])).toEqual({ median: 2.5, min: 1, max: 4, repeats: 4 });
    expect(() => figureOf([])).toThrow('a figure needs at least one measurement');
  });
});

describe('bench --json', () => {
  it('puts medians at the top level and [min, max] under spread, key for key', () => {
    const json = benchJson(figures(), { quick: false, repeats: 3 });
    expect(json.collect_steps_per_s).toBe(250_000);
    expect(json.train_samples_per_s).toEqual({ wasm: 65_000, cpu: 2_500 });
    expect(json.quickstart_wall_s).toEqual({ jobs1: 41, jobs2: 25 });
    const spread = json.spread as Record<string, unknown>;
    expect(spread.collect_steps_per_s).toEqual([200_000, 300_000]);
    expect(spread.train_samples_per_s).toEqual({ wasm: [60_000, 70_000], cpu: [2_000, 3_000] });
    expect(spread.quickstart_wall_s).toEqual({ jobs1: [40, 42], jobs2: [24, 26] });
    for (const key of Object.keys(spread)) expect(json).toHaveProperty(key);
  });

  it('has every key the bench promises', () => {
    const json = benchJson(figures(), { quick: false, repeats: 3 });
    for (const key of ['collect_steps_per_s', 'train_samples_per_s', 'torch_samples_per_s', 'torch_blas', 'ratio_to_torch',
      'train_stacked_samples_per_s', 'probe_s_per_cell', 'quickstart_wall_s', 'startup_s', 'peer_quickstart_wall_s', 'train_spiking_samples_per_s', 'machine', 'spread']) {
      expect(json).toHaveProperty(key);
    }
    expect(json.machine).toEqual({ cores: 2, cpu_model: 'test CPU', node: 'v20.0.0', load_1min: 0.5 });
    expect(json.torch_blas).toBe('openblas');
    expect(json.train_spiking_samples_per_s).toEqual({ 'T=8 predict sight→sound, backprop': 5 });
  });

  it('divides the best backend by PyTorch: 65 000 / 250 000 = 0.26, spread 60 000 / 260 000 to 70 000 / 240 000', () => {
    const json = benchJson(figures(), { quick: false, repeats: 3 });
    expect(json.ratio_to_torch).toBeCloseTo(0.26, 12);
    const [low, high] = (json.spread as Record<string, [number, number]>).ratio_to_torch;
    expect(low).toBeCloseTo(60_000 / 260_000, 12);
    expect(high).toBeCloseTo(70_000 / 240_000, 12);
  });

  it('writes null for what was not measured: no PyTorch, and the sweep timings under --quick', () => {
    const json = benchJson(figures({ torch: null, quickstartWallS: null, peerQuickstartWallS: null }), { quick: true, repeats: 3 });
    for (const key of ['torch_samples_per_s', 'torch_blas', 'ratio_to_torch', 'quickstart_wall_s', 'peer_quickstart_wall_s']) expect(json[key]).toBeNull();
    expect((json.spread as Record<string, unknown>).quickstart_wall_s).toBeNull();
    expect(json.quick).toBe(true);
  });
});
