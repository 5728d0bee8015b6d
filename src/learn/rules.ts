import * as tf from '@tensorflow/tfjs-core';
import type { Rng } from '../random.js';
import { columnSums, matMulT } from './dense-kernels.js';
import { glorotUniform } from './init.js';
import { ACTIVATION_REGISTRY, activationOf, forward, layerWidth, forwardCached, towerVariables, type ForwardCache, type Tower } from './network.js';
import type { RuleName } from './spec.js';

/** One mini-batch as tensors: an input per tower, the action for tower 0's head, the target. */
export interface Batch {
  readonly inputs: readonly tf.Tensor2D[];
  readonly extra: tf.Tensor2D | null;
  readonly target: tf.Tensor2D | null;
}

/** The loss of a batch given the towers' head outputs. */
export type LossOfOutputs = (outputs: readonly tf.Tensor2D[]) => tf.Scalar;

/** A learning rule: the weight-update signal it sends each variable. */
export interface Rule {
  /** [rows, cols] of each fixed random feedback matrix a tower needs, in the order `gradients` reads them (none for backprop). */
  feedbackShapes(tower: Tower): [number, number][];
  /** Loss and one update signal per variable, in `allVariables` order. */
  gradients(towers: readonly Tower[], feedback: readonly tf.Tensor2D[][], batch: Batch, loss: LossOfOutputs): { loss: tf.Scalar; grads: tf.Tensor[] };
}

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

/**
 * A rule's fixed feedback matrices, tower by tower, each Glorot-uniform from the stream that
 * `streamOf` gives for its tower, its position and its shape.
 */
export function createFeedback(rule: Rule, towers: readonly Tower[], streamOf: (tower: number, matrix: number, shape: [number, number]) => Rng): tf.Tensor2D[][] {
  return towers.map((t, i) => rule.feedbackShapes(t).map(([rows, cols], j) => tf.tensor2d(glorotUniform(streamOf(i, j, [rows, cols]), rows, cols), [rows, cols])));
}

/** Output error e = ∂L/∂output of each tower (for contrast: the gradient w.r.t. each embedding). */
export function outputErrors(caches: readonly Pick<ForwardCache, 'output'>[], loss: LossOfOutputs): { loss: tf.Scalar; errors: tf.Tensor2D[] } {
  const { value, grads } = tf.valueAndGrads((...outputs: tf.Tensor[]) => loss(outputs as tf.Tensor2D[]))(caches.map((c) => c.output));
  return { loss: value, errors: grads as tf.Tensor2D[] };
}

/** ∂L/∂W = inputᵀ·δ and ∂L/∂b = Σ_rows δ for a layer with input x and error δ at its pre-activation. */
export function layerGrads(x: tf.Tensor2D, delta: tf.Tensor2D): tf.Tensor[] {
  return [matMulT(x, delta, true, false), columnSums(delta)];
}

/** δ_l = g ⊙ f′(a_l) for hidden layer l (1-based), given the signal g arriving at its output. */
function hiddenDelta(tower: Tower, cache: ForwardCache, l: number, g: tf.Tensor2D): tf.Tensor2D {
  return tf.mul(g, ACTIVATION_REGISTRY[activationOf(tower)].derivative(cache.pre[l - 1], cache.post[l]));
}

/**
 * Feedback alignment (Lillicrap et al. 2016, Nat. Commun. 7:13276): the error travels
 * down through fixed random matrices B_l in place of W_lᵀ. Feedback per tower:
 * [B_2, …, B_k, B_head], each shaped like the forward weight it replaces (the head's
 * only over its representation rows, since nothing flows back into the action).
 */
function feedbackAlignmentBackward(tower: Tower, cache: ForwardCache, e: tf.Tensor2D, B: readonly tf.Tensor2D[]): tf.Tensor[] {
  const k = tower.encoder.length;
  const grads: tf.Tensor[][] = [layerGrads(cache.headInput, e)];
  let g = matMulT(e, B[k - 1], false, true); // [batch, hidden_k]
  for (let l = k; l >= 1; l--) {
    const delta = hiddenDelta(tower, cache, l, g);
    grads.unshift(layerGrads(cache.post[l - 1], delta));
    if (l > 1) g = matMulT(delta, B[l - 2], false, true);
  }
  return grads.flat();
}

/**
 * Direct feedback alignment (Nøkland 2016, NIPS, eq. 3): hidden layer l receives the
 * output error through its own fixed random matrix, δ_l = (e·D_l) ⊙ f′(a_l). Feedback
 * per tower: [D_1, …, D_k], D_l of shape [outputs, hidden_l].
 */
function directFeedbackBackward(tower: Tower, cache: ForwardCache, e: tf.Tensor2D, D: readonly tf.Tensor2D[]): tf.Tensor[] {
  const hidden = tower.encoder.flatMap((_, i) => layerGrads(cache.post[i], hiddenDelta(tower, cache, i + 1, tf.matMul(e, D[i]))));
  return [...hidden, ...layerGrads(cache.headInput, e)];
}

/**
 * A rule that runs the forward pass once, takes the output error of each tower from the
 * loss, and sends it down that tower with `backward`.
 */
function errorRule(
  feedbackShapes: (tower: Tower) => [number, number][],
  backward: (tower: Tower, cache: ForwardCache, e: tf.Tensor2D, feedback: readonly tf.Tensor2D[]) => tf.Tensor[],
): Rule {
  return {
    feedbackShapes,
    gradients(towers, feedback, batch, loss) {
      const caches = towers.map((t, i) => forwardCached(t, batch.inputs[i], i === 0 ? batch.extra : null));
      const { loss: value, errors } = outputErrors(caches, loss);
      return { loss: value, grads: towers.flatMap((t, i) => backward(t, caches[i], errors[i], feedback[i])) };
    },
  };
}

/**
 * The forward weights in feedback-alignment order, [W_2, …, W_k, W_head over its
 * representation rows]: sending the error back through their transposes is exact backprop.
 */
export function forwardWeights(tower: Tower): tf.Tensor2D[] {
  const { hidden } = widths(tower);
  const head = tower.head!.W as tf.Tensor2D;
  const representation = hidden[hidden.length - 1];
  const headRows = head.shape[0] === representation ? head : tf.slice(head, [0, 0], [representation, -1]);
  return [...tower.encoder.slice(1).map((l) => l.W as tf.Tensor2D), headRows];
}

function widths(tower: Tower): { hidden: number[]; out: number } {
  if (tower.head == null) throw new Error('a rule needs a tower with a head');
  return { hidden: tower.encoder.map(layerWidth), out: layerWidth(tower.head) };
}

/** Every learning rule by its config name. */
export const RULE_REGISTRY: Record<RuleName, Rule> = {
  // The same kernels reverse-mode autodiff would run, without the tape's copy of every saved tensor.
  backprop: errorRule(() => [], (tower, cache, e) => feedbackAlignmentBackward(tower, cache, e, forwardWeights(tower))),
  'feedback-alignment': errorRule((tower) => {
    const { hidden, out } = widths(tower);
    return [...hidden.slice(1).map((h, i): [number, number] => [hidden[i], h]), [hidden[hidden.length - 1], out]];
  }, feedbackAlignmentBackward),
  'direct-feedback-alignment': errorRule((tower) => {
    const { hidden, out } = widths(tower);
    return hidden.map((h): [number, number] => [out, h]);
  }, directFeedbackBackward),
};
