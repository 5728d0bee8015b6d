import * as tf from '@tensorflow/tfjs-core';
import type { Rng } from '../random.js';
import { columnSums, matMulT } from './dense-kernels.js';
import { glorotUniform } from './init.js';
import { activationBackward, activationOf, forward, forwardCached, layerWidth, towerVariables, type ForwardCache, type Tower } from './network.js';
import type { RuleDefinition, RuleStep } from './rule-definition.js';

/** One mini-batch as tensors: an input per tower, the action for tower 0's head, the target. */
export interface Batch {
  readonly inputs: readonly tf.Tensor2D[];
  readonly extra: tf.Tensor2D | null;
  readonly target: tf.Tensor2D | null;
}

/** The loss of a batch given the towers' head outputs. */
export type LossOfOutputs = (outputs: readonly tf.Tensor2D[]) => tf.Scalar;

/** A rule's own matrices, tower by tower; replaced (old ones freed) when the rule updates them. */
export type RuleState = tf.Tensor2D[][];

/** Every trainable variable, tower by tower, layer by layer, W then b. */
export function allVariables(towers: readonly Tower[]): tf.Variable[] {
  return towers.flatMap(towerVariables);
}

/** Head output of every tower for a batch (the action goes to tower 0's head). */
export function towerOutputs(towers: readonly Tower[], batch: Batch): tf.Tensor2D[] {
  return towers.map((t, i) => forward(t, batch.inputs[i], i === 0 ? batch.extra : null));
}

/** Exact gradients of the loss by reverse-mode autodiff (the true gradient). */
export function trueGradients(towers: readonly Tower[], batch: Batch, loss: LossOfOutputs): { loss: tf.Scalar; grads: tf.Tensor[] } {
  const vars = allVariables(towers);
  const { value, grads } = tf.variableGrads(() => loss(towerOutputs(towers, batch)), vars);
  return { loss: value, grads: vars.map((v) => grads[v.name]) };
}

function headOf(tower: Tower) {
  if (tower.head == null) throw new Error('a rule needs a tower with a head');
  return tower.head;
}

/**
 * The forward weights a rule sees, [W_0, …, W_{k−1}, W_head over its representation rows]:
 * nothing flows back into the head's extra inputs (forecast's action), so those rows are left out.
 */
export function ruleWeights(tower: Tower): tf.Tensor2D[] {
  const head = headOf(tower).W as tf.Tensor2D;
  const representation = layerWidth(tower.encoder[tower.encoder.length - 1]);
  const headRows = head.shape[0] === representation ? head : tf.slice(head, [0, 0], [representation, -1]);
  return [...tower.encoder.map((l) => l.W as tf.Tensor2D), headRows];
}

/**
 * A rule's matrices for every tower, made once before training (in a tf.tidy, so only what
 * init returns stays). Its random matrices are Glorot-uniform from `streamOf(tower, matrix, shape)`.
 */
export function createRuleState(rule: RuleDefinition, towers: readonly Tower[], streamOf: (tower: number, matrix: number, shape: [number, number]) => Rng): RuleState {
  const state: RuleState = [];
  try {
    towers.forEach((tower, i) => {
      let matrix = 0;
      const random = (rows: number, cols: number) => tf.tensor2d(glorotUniform(streamOf(i, matrix++, [rows, cols]), rows, cols), [rows, cols]);
      state.push(rule.init == null ? [] : tf.tidy(() => {
        const weights = ruleWeights(tower);
        // A matrix that is one of the weights themselves is copied: the state is freed, the weights are not.
        return checkMatrices(rule.init!({ tf, weights, random }), 'init', rule).map((m) => (weights.includes(m) ? tf.clone(m) : m));
      }));
    });
    return state;
  } catch (error) {
    tf.dispose(state.flat());
    throw error;
  }
}

function checkMatrices(values: unknown, what: string, rule: RuleDefinition): tf.Tensor2D[] {
  if (!Array.isArray(values) || values.some((v) => !(v instanceof tf.Tensor) || v.rank !== 2)) {
    throw new Error(`rule '${rule.name}': ${what} must return an array of matrices (rank-2 tensors)`);
  }
  return values as tf.Tensor2D[];
}

/** Output error e = ∂L/∂output of each tower (for contrast: the gradient w.r.t. each embedding). */
function outputErrors(caches: readonly { readonly output: tf.Tensor2D }[], loss: LossOfOutputs): { loss: tf.Scalar; errors: tf.Tensor2D[] } {
  const { value, grads } = tf.valueAndGrads((...outputs: tf.Tensor[]) => loss(outputs as tf.Tensor2D[]))(caches.map((c) => c.output));
  return { loss: value, errors: grads as tf.Tensor2D[] };
}

/** ∂L/∂W = inputᵀ·δ and ∂L/∂b = Σ_rows δ for a layer with input x and error δ at its pre-activation. */
export function layerGrads(x: tf.Tensor2D, delta: tf.Tensor2D): tf.Tensor[] {
  return [matMulT(x, delta, true, false), columnSums(delta)];
}

/**
 * How one kind of tower runs forward and takes an error through one of its hidden layers:
 * what a rule's errors need besides the rule itself. A rule's chain multiplies by the
 * matrices it is given and leaves each layer's own dynamics to `derivative`, so towers whose
 * units are not rate units can be trained by the same rule definitions.
 */
export interface TowerPass<C extends { readonly output: tf.Tensor2D; readonly headInput: tf.Tensor2D }> {
  forward(tower: Tower, input: tf.Tensor2D, extra: tf.Tensor2D | null): C;
  /** What hidden layer l (0-based) reads: its weight update is inputᵀ·δ_l. */
  layerInput(cache: C, l: number): tf.Tensor2D;
  /** δ_l from the signal g arriving at hidden layer l's output. */
  derivative(tower: Tower, cache: C, l: number, g: tf.Tensor2D): tf.Tensor2D;
}

/** Rate units: a ForwardCache and δ_l = g ⊙ f′(a_l). */
export const RATE_PASS: TowerPass<ForwardCache> = {
  forward: forwardCached,
  layerInput: (cache, l) => cache.post[l],
  derivative: (tower, cache, l, g) => activationBackward(activationOf(tower), g, cache.pre[l], cache.post[l + 1]),
};

/** What a rule sees of one tower at one step. */
function stepContext<C extends { readonly output: tf.Tensor2D; readonly headInput: tf.Tensor2D }>(
  pass: TowerPass<C>, tower: Tower, cache: C, e: tf.Tensor2D, state: readonly tf.Tensor2D[],
): RuleStep {
  const k = tower.encoder.length;
  const derivative = (l: number, g: tf.Tensor2D): tf.Tensor2D => pass.derivative(tower, cache, l, g);
  return {
    tf,
    weights: ruleWeights(tower),
    activations: [...tower.encoder.map((_, l) => pass.layerInput(cache, l)), cache.headInput],
    outputError: e,
    state,
    derivative,
    chain(matrices) {
      if (matrices.length !== k) throw new Error(`chain needs ${k} matrices (one per weight above the first layer), got ${matrices.length}`);
      const deltas: tf.Tensor2D[] = [];
      let g = matMulT(e, matrices[k - 1], false, true); // [batch, hidden_{k−1}]
      for (let l = k - 1; l >= 0; l--) {
        deltas[l] = derivative(l, g);
        if (l > 0) g = matMulT(deltas[l], matrices[l - 1], false, true);
      }
      return deltas;
    },
  };
}

/** Checks a rule's deltas against the tower's hidden layers: k matrices with the rows and width of each layer's input and output. */
function checkDeltas(deltas: unknown, tower: Tower, rows: readonly number[], rule: RuleDefinition): tf.Tensor2D[] {
  const widths = tower.encoder.map(layerWidth);
  const expected = widths.map((w, l) => `[${rows[l]}, ${w}]`).join(', ');
  const ok = Array.isArray(deltas) && deltas.length === widths.length
    && deltas.every((d, l) => d instanceof tf.Tensor && d.rank === 2 && d.shape[0] === rows[l] && d.shape[1] === widths[l]);
  if (!ok) throw new Error(`rule '${rule.name}': deltas must return one error per hidden layer, shaped ${expected}`);
  return deltas as tf.Tensor2D[];
}

/**
 * Loss and one update signal per variable (allVariables order): one forward pass, the
 * output error of each tower from the loss, the rule's error for each hidden layer, and
 * ∂W = inputᵀ·δ, ∂b = Σ δ. The head learns from the output error itself.
 */
export function ruleGradients<C extends { readonly output: tf.Tensor2D; readonly headInput: tf.Tensor2D }>(
  rule: RuleDefinition, towers: readonly Tower[], state: RuleState, batch: Batch, loss: LossOfOutputs, pass: TowerPass<C> = RATE_PASS as unknown as TowerPass<C>,
): { loss: tf.Scalar; grads: tf.Tensor[] } {
  const caches = towers.map((t, i) => pass.forward(t, batch.inputs[i], i === 0 ? batch.extra : null));
  const { loss: value, errors } = outputErrors(caches, loss);
  const grads = towers.flatMap((tower, i) => {
    const inputs = tower.encoder.map((_, l) => pass.layerInput(caches[i], l));
    const deltas = checkDeltas(rule.deltas(stepContext(pass, tower, caches[i], errors[i], state[i])), tower, inputs.map((x) => x.shape[0]), rule);
    return [...deltas.flatMap((delta, l) => layerGrads(inputs[l], delta)), ...layerGrads(caches[i].headInput, errors[i])];
  });
  return { loss: value, grads };
}

/** Copies of the forward weights a rule sees (they keep their values when the variables are assigned). */
export function weightSnapshot(towers: readonly Tower[]): tf.Tensor2D[][] {
  return towers.map((tower) => ruleWeights(tower).map((w) => tf.clone(w)));
}

/**
 * Runs a rule's update after an optimiser step (call inside a tf.tidy): `before` holds the
 * weights from weightSnapshot. New state replaces the old (which is freed); new forward
 * weights are assigned to the variables (the head's extra rows are kept).
 */
export function applyRuleUpdate(rule: RuleDefinition, towers: readonly Tower[], state: RuleState, before: readonly tf.Tensor2D[][]): void {
  if (rule.update == null) return;
  towers.forEach((tower, i) => {
    const weights = ruleWeights(tower);
    const updates = weights.map((w, l): tf.Tensor2D => tf.sub(w, before[i][l]));
    const result = rule.update!({ tf, weights, updates, state: state[i] });
    if (result.weights != null) assignWeights(tower, checkShapes(result.weights, weights, 'weights', rule));
    if (result.state != null) {
      const next = checkShapes(result.state, state[i], 'state', rule).map((m) => (weights.includes(m) ? tf.clone(m) : m));
      tf.dispose(state[i].filter((old) => !next.includes(old)));
      state[i] = next.map((m) => tf.keep(m));
    }
  });
}

function checkShapes(values: unknown, like: readonly tf.Tensor2D[], what: string, rule: RuleDefinition): tf.Tensor2D[] {
  const matrices = checkMatrices(values, `update's ${what}`, rule);
  const ok = matrices.length === like.length && matrices.every((m, l) => m.shape[0] === like[l].shape[0] && m.shape[1] === like[l].shape[1]);
  if (!ok) throw new Error(`rule '${rule.name}': update's ${what} must keep the number and shapes of the matrices it replaces`);
  return matrices;
}

function assignWeights(tower: Tower, weights: readonly tf.Tensor2D[]): void {
  const k = tower.encoder.length;
  tower.encoder.forEach((layer, l) => layer.W.assign(weights[l]));
  const head = headOf(tower);
  const rows = weights[k].shape[0];
  const full = head.W.shape[0] === rows ? weights[k] : tf.concat([weights[k], tf.slice(head.W, [rows, 0], [-1, -1])], 0);
  head.W.assign(full);
}
