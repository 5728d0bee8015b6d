import * as tf from '@tensorflow/tfjs-core';
import { describe, expect, it } from 'vitest';
import { initBackend } from '../../src/learn/backend.js';
import { meanSquaredError } from '../../src/learn/losses.js';
import { createTower, towerVariables, type Tower } from '../../src/learn/network.js';
import { RULE_REGISTRY } from '../../src/learn/learning-rules.js';
import { ruleGradients, trueGradients, type Batch } from '../../src/learn/rules.js';
import { createRng, normal } from '../../src/random.js';

/** Plain float64 forward pass and MSE loss of a one-hidden-layer tanh tower (independent of tfjs). */
function referenceLoss(p: number[][], x: number[][], y: number[][], hidden: number): number {
  const [W1, b1, W2, b2] = p;
  const outputs = y[0].length;
  let sum = 0;
  x.forEach((row, r) => {
    const h = Array.from({ length: hidden }, (_, j) => Math.tanh(b1[j] + row.reduce((s, v, i) => s + v * W1[i * hidden + j], 0)));
    for (let k = 0; k < outputs; k++) {
      const o = b2[k] + h.reduce((s, v, j) => s + v * W2[j * outputs + k], 0);
      sum += (o - y[r][k]) ** 2;
    }
  });
  return sum / (x.length * outputs);
}

/** Central differences, (f(θ + h) − f(θ − h)) / 2h, in float64 (Press et al. 2007, §5.7). */
function centralDifferences(p: number[][], f: (p: number[][]) => number, h = 1e-6): number[][] {
  return p.map((values, a) => values.map((_, i) => {
    const plus = p.map((v) => [...v]);
    const minus = p.map((v) => [...v]);
    plus[a][i] += h;
    minus[a][i] -= h;
    return (f(plus) - f(minus)) / (2 * h);
  }));
}

function relativeError(a: number[], b: number[]): number {
  const diff = Math.sqrt(a.reduce((s, v, i) => s + (v - b[i]) ** 2, 0));
  return diff / Math.sqrt(b.reduce((s, v) => s + v * v, 0));
}

function setup(): { tower: Tower; x: number[][]; y: number[][]; batch: Batch } {
  const rng = createRng(3, 'test');
  const tower = createTower({ channels: ['sight'], inputWidth: 3, hidden: [4], outputWidth: 2, extraWidth: 0 }, 'tanh', { encoder: rng, head: rng });
  // Biases start at zero; give them values so their gradients are exercised too.
  for (const v of towerVariables(tower)) v.assign(tf.tidy(() => tf.add(v, tf.tensor(Float32Array.from({ length: v.size }, () => 0.3 * normal(rng)), v.shape))));
  const x = Array.from({ length: 5 }, () => Array.from({ length: 3 }, () => normal(rng)));
  const y = Array.from({ length: 5 }, () => Array.from({ length: 2 }, () => normal(rng)));
  return { tower, x, y, batch: { inputs: [tf.tensor2d(x)], extra: null, target: tf.tensor2d(y) } };
}

describe.each(['cpu', 'wasm'] as const)('backprop gradients on %s', (backend) => {
  it('match float64 central finite differences (relative error < 1e-3)', async () => {
    await initBackend(backend);
    const { tower, x, y, batch } = setup();
    const params = towerVariables(tower).map((v) => Array.from(v.dataSync()));
    const reference = centralDifferences(params, (p) => referenceLoss(p, x, y, 4));
    const loss = (o: readonly tf.Tensor2D[]) => meanSquaredError(o[0], batch.target!);
    const [autodiff, rule] = tf.tidy(() => [trueGradients([tower], batch, loss), ruleGradients(RULE_REGISTRY.backprop, [tower], [[]], batch, loss)]
      .map(({ grads }) => grads.map((g) => Array.from(g.dataSync()))));
    expect(relativeError(autodiff.flat(), reference.flat())).toBeLessThan(1e-3);
    expect(relativeError(rule.flat(), reference.flat())).toBeLessThan(1e-3); // the backprop rule's hand-written backward pass
    // The loss itself agrees with the float64 reference to float32 precision.
    const value = tf.tidy(() => trueGradients([tower], batch, loss).loss.dataSync()[0]);
    expect(value).toBeCloseTo(referenceLoss(params, x, y, 4), 5);
    tf.dispose([...towerVariables(tower), ...batch.inputs, batch.target!]);
  });

  it('come out of the backprop rule with the bits of reverse-mode autodiff, extra head inputs included', async () => {
    // The rule runs the kernels autodiff would run, in the same order, so the two agree
    // exactly; the head reads the representation plus 2 extra columns, as forecast's does.
    await initBackend(backend);
    const rng = createRng(6, 'test');
    const tower = createTower({ channels: ['sight'], inputWidth: 3, hidden: [4, 3], outputWidth: 2, extraWidth: 2 }, 'relu', { encoder: rng, head: rng });
    const matrix = (rows: number, cols: number) => tf.tensor2d(Float32Array.from({ length: rows * cols }, () => normal(rng)), [rows, cols]);
    const batch: Batch = { inputs: [matrix(6, 3)], extra: matrix(6, 2), target: matrix(6, 2) };
    const loss = (o: readonly tf.Tensor2D[]) => meanSquaredError(o[0], batch.target!);
    const [autodiff, rule] = tf.tidy(() => [trueGradients([tower], batch, loss), ruleGradients(RULE_REGISTRY.backprop, [tower], [[]], batch, loss)]
      .map(({ loss: value, grads }) => [Array.from(value.dataSync()), ...grads.map((g) => Array.from(g.dataSync()))]));
    expect(rule).toEqual(autodiff);
    tf.dispose([...towerVariables(tower), ...batch.inputs, batch.extra!, batch.target!]);
  });

  it('equal feedback alignment run with B = W (Lillicrap et al. 2016: FA only swaps Wᵀ for B)', async () => {
    await initBackend(backend);
    const { tower: unused, batch } = setup();
    tf.dispose(towerVariables(unused));
    const rng = createRng(4, 'test');
    const tower = createTower({ channels: ['sight'], inputWidth: 3, hidden: [4, 3], outputWidth: 2, extraWidth: 0 }, 'sigmoid', { encoder: rng, head: rng });
    const loss = (o: readonly tf.Tensor2D[]) => meanSquaredError(o[0], batch.target!);
    const feedback = [tower.encoder[1].W, tower.head!.W] as tf.Tensor2D[]; // [B_2, B_head] = [W_2, W_head]
    const [bp, fa] = tf.tidy(() => [
      trueGradients([tower], batch, loss).grads,
      ruleGradients(RULE_REGISTRY['feedback-alignment'], [tower], [feedback], batch, loss).grads,
    ].map((gs) => gs.flatMap((g) => Array.from(g.dataSync()))));
    expect(relativeError(fa, bp)).toBeLessThan(1e-6);
    tf.dispose([...towerVariables(tower), ...batch.inputs, batch.target!]);
  });

  // Direct feedback alignment (Nøkland 2016, eq. 3) sends the output error e to hidden layer l
  // as δ_l = (e·D_l) ⊙ f′(a_l). By the chain rule backprop gives the last hidden layer
  // δ_k = (e·W_headᵀ) ⊙ f′(a_k), so D_k = W_headᵀ must reproduce backprop's gradients there,
  // while every earlier layer still gets its error straight from the output.
  it('equal direct feedback alignment in the last hidden layer when its D is the head\'s Wᵀ', async () => {
    await initBackend(backend);
    const { tower: unused, batch } = setup();
    tf.dispose(towerVariables(unused));
    const rng = createRng(5, 'test');
    const tower = createTower({ channels: ['sight'], inputWidth: 3, hidden: [4, 3], outputWidth: 2, extraWidth: 0 }, 'tanh', { encoder: rng, head: rng });
    const loss = (o: readonly tf.Tensor2D[]) => meanSquaredError(o[0], batch.target!);
    const [bp, dfa] = tf.tidy(() => {
      const feedback = [tf.tensor2d(Float32Array.from({ length: 8 }, () => normal(rng)), [2, 4]), tf.transpose(tower.head!.W) as tf.Tensor2D]; // [D_1 random, D_2 = W_headᵀ]
      return [
        trueGradients([tower], batch, loss).grads,
        ruleGradients(RULE_REGISTRY['direct-feedback-alignment'], [tower], [feedback], batch, loss).grads,
      ].map((gs) => gs.map((g) => Array.from(g.dataSync())));
    });
    // Variables in order: W_1, b_1, W_2, b_2, W_head, b_head.
    for (const i of [2, 3, 4, 5]) expect(relativeError(dfa[i], bp[i])).toBeLessThan(1e-6);
    expect(relativeError(dfa[0], bp[0])).toBeGreaterThan(0.1); // layer 1's random D_1 is not backprop
    tf.dispose([...towerVariables(tower), ...batch.inputs, batch.target!]);
  });

  it('equal direct feedback alignment for every weight of a one-hidden-layer network when D = the head\'s Wᵀ', async () => {
    await initBackend(backend);
    const { tower, batch } = setup();
    const loss = (o: readonly tf.Tensor2D[]) => meanSquaredError(o[0], batch.target!);
    const [bp, dfa, random] = tf.tidy(() => {
      const D = tf.transpose(tower.head!.W) as tf.Tensor2D; // [outputs 2, hidden 4]
      const R = tf.tensor2d(Float32Array.from({ length: 8 }, (_, i) => Math.sin(i + 1)), [2, 4]); // any other D
      return [
        trueGradients([tower], batch, loss).grads,
        ruleGradients(RULE_REGISTRY['direct-feedback-alignment'], [tower], [[D]], batch, loss).grads,
        ruleGradients(RULE_REGISTRY['direct-feedback-alignment'], [tower], [[R]], batch, loss).grads,
      ].map((gs) => gs.flatMap((g) => Array.from(g.dataSync())));
    });
    expect(relativeError(dfa, bp)).toBeLessThan(1e-6);
    expect(relativeError(random, bp)).toBeGreaterThan(0.1); // the check tells the rule's wiring apart
    tf.dispose([...towerVariables(tower), ...batch.inputs, batch.target!]);
  });
});
