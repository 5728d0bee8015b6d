import * as tf from '@tensorflow/tfjs-core';
import { describe, expect, it } from 'vitest';
import { initBackend } from '../../src/learn/backend.js';
import { glorotUniform } from '../../src/learn/init.js';
import type { LifParameters } from '../../src/learn/lif.js';
import { meanSquaredError } from '../../src/learn/losses.js';
import { createTower, towerVariables, type Tower } from '../../src/learn/network.js';
import type { Batch, LossOfOutputs } from '../../src/learn/rules.js';
import { spikingRule } from '../../src/learn/spiking-rules.js';
import type { SpikingDynamics } from '../../src/learn/spiking-network.js';
import { RULES, SPIKING_RULES, type RuleName, type SurrogateName } from '../../src/learn/spec.js';
import { createRng, normal } from '../../src/random.js';

/** A spiking tower with Glorot weights and random biases (so bias gradients are exercised). */
function tower(inputWidth: number, hidden: number[], outputWidth: number, seed: number, scale = 1): Tower {
  const rng = createRng(seed, 'test');
  const t = createTower({ channels: ['sight'], inputWidth, hidden, outputWidth, extraWidth: 0 }, null, { encoder: rng, head: rng },
    (r, fanIn, fanOut) => glorotUniform(r, fanIn, fanOut).map((w) => w * scale));
  for (const v of towerVariables(t)) v.assign(tf.tidy(() => tf.add(v, tf.tensor(Float32Array.from({ length: v.size }, () => 0.3 * normal(rng)), v.shape))));
  return t;
}

function matrix(rows: number, cols: number, seed: number, draw: (rng: () => number) => number): tf.Tensor2D {
  const rng = createRng(seed, 'test', 'matrix');
  return tf.tensor2d(Float32Array.from({ length: rows * cols }, () => draw(rng)), [rows, cols]);
}

function grads(t: Tower, d: SpikingDynamics, batch: Batch, loss: LossOfOutputs, rule: (typeof RULES)[number] = 'backprop', feedback: tf.Tensor2D[] = []): number[][] {
  return tf.tidy(() => spikingRule(rule, d).gradients([t], [feedback], batch, loss).grads.map((g) => Array.from(g.dataSync())));
}

function relativeError(a: readonly number[], b: readonly number[]): number {
  const diff = Math.sqrt(a.reduce((s, v, i) => s + (v - b[i]) ** 2, 0));
  return diff / Math.sqrt(b.reduce((s, v) => s + v * v, 0));
}

/** The smooth functions whose derivatives the surrogates are (their antiderivatives, hand-integrated). */
const SMOOTHED: Record<'fast-sigmoid' | 'arctan', (u: number, k: number) => number> = {
  // ∫ (1 + k|u|)⁻² du = u / (1 + k|u|) (Zenke & Ganguli 2018: the fast sigmoid).
  'fast-sigmoid': (u, k) => u / (1 + k * Math.abs(u)),
  // ∫ (1 + (πku/2)²)⁻¹ du = (2/(πk))·arctan(πku/2) (Fang et al. 2021, scaled).
  arctan: (u, k) => (2 / (Math.PI * k)) * Math.atan((Math.PI * k * u) / 2),
};

describe.each(['cpu', 'wasm'] as const)('spiking gradients on %s', (backend) => {
  it.each(['fast-sigmoid', 'arctan'] as const)('of a one-layer, one-step network equal finite differences on the %s-smoothed network (relative error < 1e-3)', async (surrogate) => {
    await initBackend(backend);
    const lif: LifParameters = { steps: 1, beta: Math.exp(-1 / 5), gain: 1 - Math.exp(-1 / 5), threshold: 0.4, reset: 'subtract', refractorySteps: 0 };
    const d: SpikingDynamics = { lif, surrogate: { name: surrogate, slope: 2 }, coding: 'current', dtMs: 1 };
    const t = tower(3, [4], 2, 11);
    const x = matrix(6, 3, 12, (r) => 4 * normal(r));
    const c = matrix(6, 2, 13, (r) => normal(r));
    // A loss linear in the head output, so its gradient at the hard and the smoothed forward pass agree.
    const loss: LossOfOutputs = (o) => tf.sum(tf.mul(o[0], c));
    const rule = grads(t, d, { inputs: [x], extra: null, target: null }, loss);
    // Float64 reference: one step from rest, U = gain·(x·W + b); the spike H(U − θ) replaced by the smooth Φ.
    const [W, b, Wh] = towerVariables(t).map((v) => Array.from(v.dataSync()));
    const xs = Array.from(x.dataSync());
    const cs = Array.from(c.dataSync());
    const smoothLoss = (Wp: number[], bp: number[]) => {
      let sum = 0;
      for (let r = 0; r < 6; r++) {
        for (let j = 0; j < 4; j++) {
          const I = bp[j] + [0, 1, 2].reduce((s, i) => s + xs[r * 3 + i] * Wp[i * 4 + j], 0);
          const rate = SMOOTHED[surrogate](lif.gain * I - lif.threshold, 2);
          for (let o = 0; o < 2; o++) sum += rate * Wh[j * 2 + o] * cs[r * 2 + o];
        }
      }
      return sum;
    };
    const h = 1e-6; // central differences (Press et al. 2007, §5.7)
    const fd = (p: number[], other: number[], first: boolean) => p.map((_, i) => {
      const plus = [...p];
      const minus = [...p];
      plus[i] += h;
      minus[i] -= h;
      return (first ? smoothLoss(plus, other) - smoothLoss(minus, other) : smoothLoss(other, plus) - smoothLoss(other, minus)) / (2 * h);
    });
    expect(relativeError(rule[0], fd(W, b, true))).toBeLessThan(1e-3);
    expect(relativeError(rule[1], fd(b, W, false))).toBeLessThan(1e-3);
    tf.dispose([...towerVariables(t), x, c]);
  });

  it('with T = 1, no leak and the straight-through surrogate equal an MLP with a step activation and its straight-through estimate', async () => {
    await initBackend(backend);
    // Perfect integrator (β = 1, gain 1): one step from rest is U = x·W + b, S = H(U − θ),
    // rate = S. Reference: tfjs autodiff through a step whose gradient is passed straight
    // through (Bengio et al. 2013), layer by layer; every layer and the head compared.
    const lif: LifParameters = { steps: 1, beta: 1, gain: 1, threshold: 0.25, reset: 'subtract', refractorySteps: 0 };
    const d: SpikingDynamics = { lif, surrogate: { name: 'straight-through', slope: 1 }, coding: 'current', dtMs: 1 };
    const t = tower(5, [4, 3], 2, 21);
    const x = matrix(7, 5, 22, (r) => normal(r));
    const y = matrix(7, 2, 23, (r) => normal(r));
    const loss: LossOfOutputs = (o) => meanSquaredError(o[0], y);
    const rule = grads(t, d, { inputs: [x], extra: null, target: y }, loss);
    const step = tf.customGrad(((a: tf.Tensor) => ({ value: tf.cast(tf.greaterEqual(a, 0.25), 'float32'), gradFunc: (dy: tf.Tensor) => dy })) as CustomGrad);
    const mlp = tf.tidy(() => {
      const vars = towerVariables(t);
      const { grads: g } = tf.variableGrads(() => {
        const h = t.encoder.reduce((input, layer) => step(tf.add(tf.matMul(input, layer.W), layer.b)) as tf.Tensor2D, x);
        return loss([tf.add(tf.matMul(h, t.head!.W), t.head!.b)]);
      }, vars);
      return vars.map((v) => Array.from(g[v.name].dataSync()));
    });
    rule.forEach((g, i) => expect(relativeError(g, mlp[i])).toBeLessThan(1e-5));
    tf.dispose([...towerVariables(t), x, y]);
  });

  // Backpropagation through time by hand (lif.ts) against tfjs's reverse-mode autodiff through the
  // unrolled steps: the spike as a custom gradient with the surrogate, the reset detached.
  const unrolled = [
    { label: 'current input, reset by subtraction', coding: 'current', reset: 'subtract', refractorySteps: 0, surrogate: 'fast-sigmoid' },
    { label: 'current input, reset to zero, 2 refractory steps', coding: 'current', reset: 'zero', refractorySteps: 2, surrogate: 'arctan' },
    { label: 'spike-train input, reset by subtraction, 1 refractory step', coding: 'poisson', reset: 'subtract', refractorySteps: 1, surrogate: 'fast-sigmoid' },
  ] as const;
  it.each(unrolled)('through 6 steps equal autodiff through the unrolled network ($label)', async ({ coding, reset, refractorySteps, surrogate }) => {
    await initBackend(backend);
    const steps = 6;
    const lif: LifParameters = { steps, beta: Math.exp(-1 / 4), gain: 1 - Math.exp(-1 / 4), threshold: 0.2, reset, refractorySteps };
    const d: SpikingDynamics = { lif, surrogate: { name: surrogate, slope: 3 }, coding, dtMs: 1 };
    const t = tower(5, [6, 4], 3, 31, 3);
    const batch = 4;
    const x = coding === 'current' ? matrix(batch, 5, 32, (r) => 2 * normal(r)) : matrix(steps * batch, 5, 32, (r) => (r() < 0.5 ? 1 : 0));
    const y = matrix(batch, 3, 33, (r) => normal(r));
    const loss: LossOfOutputs = (o) => meanSquaredError(o[0], y);
    const rule = grads(t, d, { inputs: [x], extra: null, target: y }, loss);
    const autodiff = tf.tidy(() => {
      const vars = towerVariables(t);
      const { grads: g } = tf.variableGrads(() => loss([unrolledForward(t, x, d, batch)]), vars);
      return vars.map((v) => Array.from(g[v.name].dataSync()));
    });
    expect(autodiff.every((g) => g.some((v) => v !== 0))).toBe(true); // both layers fire and every variable gets a gradient
    rule.forEach((g, i) => expect(relativeError(g, autodiff[i])).toBeLessThan(1e-5));
    tf.dispose([...towerVariables(t), x, y]);
  });

  it('from feedback alignment with B = W equal backprop through time (Lillicrap et al. 2016: FA only swaps Wᵀ for B)', async () => {
    await initBackend(backend);
    const d = dynamics(5, 'poisson');
    const t = tower(4, [5, 3], 2, 41, 3);
    const x = matrix(5 * 3, 4, 42, (r) => (r() < 0.4 ? 1 : 0));
    const y = matrix(3, 2, 43, (r) => normal(r));
    const batch: Batch = { inputs: [x], extra: null, target: y };
    const loss: LossOfOutputs = (o) => meanSquaredError(o[0], y);
    const fa = grads(t, d, batch, loss, 'feedback-alignment', [t.encoder[1].W, t.head!.W] as tf.Tensor2D[]);
    expect(fa).toEqual(grads(t, d, batch, loss));
    tf.dispose([...towerVariables(t), x, y]);
  });

  it("from direct feedback alignment equal backprop through time in the last hidden layer when its D is the head's Wᵀ (Nøkland 2016, eq. 3)", async () => {
    await initBackend(backend);
    const d = dynamics(5, 'current');
    const t = tower(4, [5, 3], 2, 51, 3);
    const x = matrix(3, 4, 52, (r) => 2 * normal(r));
    const y = matrix(3, 2, 53, (r) => normal(r));
    const batch: Batch = { inputs: [x], extra: null, target: y };
    const loss: LossOfOutputs = (o) => meanSquaredError(o[0], y);
    const D1 = matrix(2, 5, 54, (r) => normal(r));
    const headT = tf.transpose(t.head!.W) as tf.Tensor2D;
    const dfa = grads(t, d, batch, loss, 'direct-feedback-alignment', [D1, headT]);
    const bptt = grads(t, d, batch, loss);
    for (const i of [2, 3, 4, 5]) expect(relativeError(dfa[i], bptt[i])).toBeLessThan(1e-6); // W_2, b_2, W_head, b_head
    expect(relativeError(dfa[0], bptt[0])).toBeGreaterThan(0.1); // layer 1's random D_1 is not backprop
    tf.dispose([...towerVariables(t), x, y, D1, headT]);
  });
});

describe('rules for spiking encoders', () => {
  it.each(RULES)('%s either trains spiking towers or refuses them by name', (rule) => {
    const make = () => spikingRule(rule, dynamics(2, 'current'));
    if (SPIKING_RULES.includes(rule)) expect(make).not.toThrow();
    else expect(make).toThrow(`rule '${rule}' cannot train a spiking encoder`);
  });

  it('refuses a rule without a spiking version, naming it and the rules that have one', () => {
    expect(() => spikingRule('sign-symmetry' as RuleName, dynamics(2, 'current')))
      .toThrow("rule 'sign-symmetry' cannot train a spiking encoder (rules that can: backprop, feedback-alignment, direct-feedback-alignment)");
  });
});

function dynamics(steps: number, coding: 'current' | 'poisson', surrogate: SurrogateName = 'fast-sigmoid'): SpikingDynamics {
  const beta = Math.exp(-1 / 4);
  return { lif: { steps, beta, gain: 1 - beta, threshold: 0.2, reset: 'subtract', refractorySteps: 0 }, surrogate: { name: surrogate, slope: 3 }, coding, dtMs: 1 };
}

/** tfjs types a custom gradient's arguments loosely (a tensor or the save function). */
type CustomGrad = Parameters<typeof tf.customGrad>[0];

/** The surrogate as a tfjs expression, written independently of src/learn/surrogates.ts. */
function surrogateOf(name: SurrogateName, k: number, u: tf.Tensor): tf.Tensor {
  if (name === 'fast-sigmoid') return tf.div(1, tf.square(tf.add(1, tf.mul(k, tf.abs(u)))));
  if (name === 'arctan') return tf.div(1, tf.add(1, tf.square(tf.mul((Math.PI * k) / 2, u))));
  return tf.onesLike(u);
}

/**
 * The spiking tower unrolled step by step in tfjs ops (a reference, not the product code):
 * U = a·(β·V + gain·I), S = a·spike(U − θ), V = U − θ·stop(S) or U·(1 − stop(S)), with the
 * refractory mask a worked out from the spikes on the host. Returns the head output.
 */
function unrolledForward(t: Tower, x: tf.Tensor2D, d: SpikingDynamics, batch: number): tf.Tensor2D {
  const { steps, beta, gain, threshold, reset, refractorySteps } = d.lif;
  const spike = tf.customGrad(((u: tf.Tensor, save: tf.GradSaveFunc) => {
    save([u]);
    return { value: tf.cast(tf.greaterEqual(u, 0), 'float32'), gradFunc: (dy: tf.Tensor, [saved]: tf.Tensor[]) => tf.mul(dy, surrogateOf(d.surrogate.name, d.surrogate.slope, saved)) };
  }) as CustomGrad);
  const stop = tf.customGrad(((v: tf.Tensor) => ({ value: tf.add(v, 0), gradFunc: (dy: tf.Tensor) => tf.zerosLike(dy) })) as CustomGrad);
  let inputs: tf.Tensor2D[] = Array.from({ length: steps }, (_, s) => (d.coding === 'current' ? x : tf.slice(x, [s * batch, 0], [batch, -1])));
  for (const layer of t.encoder) {
    const units = (layer.W as tf.Tensor2D).shape[1];
    let V: tf.Tensor = tf.zeros([batch, units]);
    const left = new Int32Array(batch * units);
    const out: tf.Tensor2D[] = [];
    for (const input of inputs) {
      const active = tf.tensor2d(Float32Array.from(left, (l) => (l > 0 ? 0 : 1)), [batch, units]);
      const U = tf.mul(active, tf.add(tf.mul(beta, V), tf.mul(gain, tf.add(tf.matMul(input, layer.W), layer.b))));
      const S = tf.mul(active, spike(tf.sub(U, threshold))) as tf.Tensor2D;
      V = reset === 'subtract' ? tf.sub(U, tf.mul(threshold, stop(S))) : tf.mul(U, tf.sub(1, stop(S)));
      const fired = S.dataSync();
      left.forEach((l, k) => { left[k] = fired[k] === 1 ? refractorySteps : Math.max(0, l - 1); });
      out.push(S);
    }
    inputs = out;
  }
  const rate = tf.div(tf.addN(inputs), steps);
  return tf.add(tf.matMul(rate, t.head!.W), t.head!.b) as tf.Tensor2D;
}
