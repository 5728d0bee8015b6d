import type { RuleDefinition } from './rule-definition.js';
import type { RuleName } from './spec.js';

// The built-in learning rules, each in the shape a plug-in file default-exports
// (rule-definition.ts), so any of them could be copied out into a file and changed.

/** Exact gradients: the error travels down through the transposed forward weights (Rumelhart, Hinton & Williams 1986). */
export const backprop: RuleDefinition = {
  type: 'rule',
  name: 'backprop',
  description: 'backpropagation: each hidden layer learns from the exact gradient',
  deltas: ({ weights, chain }) => chain(weights.slice(1)),
};

/**
 * Feedback alignment (Lillicrap et al. 2016, Nat. Commun. 7:13276): the error travels down
 * through fixed random matrices B_l in place of W_lᵀ, one shaped like each weight above the
 * first layer (the head's only over its representation rows).
 */
export const feedbackAlignment: RuleDefinition = {
  type: 'rule',
  name: 'feedback-alignment',
  description: 'feedback alignment: the error travels down through fixed random matrices',
  init: ({ weights, random }) => weights.slice(1).map((w) => random(w.shape[0], w.shape[1])),
  deltas: ({ state, chain }) => chain(state),
};

/**
 * Direct feedback alignment (Nøkland 2016, NIPS, eq. 3): hidden layer l receives the output
 * error through its own fixed random matrix, δ_l = (e·D_l) ⊙ f′(a_l), D_l of shape [outputs, width_l].
 */
export const directFeedbackAlignment: RuleDefinition = {
  type: 'rule',
  name: 'direct-feedback-alignment',
  description: 'direct feedback alignment: each hidden layer gets the output error through its own fixed random matrix',
  init: ({ weights, random }) => {
    const outputs = weights[weights.length - 1].shape[1];
    return weights.slice(0, -1).map((w) => random(outputs, w.shape[1]));
  },
  deltas: ({ tf, outputError, state, derivative }) => state.map((D, l) => derivative(l, tf.matMul(outputError, D))),
};

/**
 * Weight decay per step of the Kolen–Pollack rule, on forward and feedback weights alike.
 * The difference between the two shrinks by (1 − λ) each step whatever the optimiser does,
 * so λ = 1e-3 halves it in ~700 steps (about 13 epochs of the default 14 000 training rows
 * in batches of 256).
 * Akrout et al. (2019) tie the decay to their SGD schedule; this value is ours (common practice
 * for decoupled decay, Loshchilov & Hutter 2019), chosen so that the feedback aligns within one
 * short run while the decay stays a small fraction of an Adam step.
 */
export const KOLEN_POLLACK_DECAY = 1e-3;

/**
 * Kolen–Pollack (Kolen & Pollack 1994; Akrout et al. 2019, from memory): the error travels down
 * through feedback matrices B_l that receive the same update as the forward weights W_l,
 * plus weight decay on both: W ← (1 − λ)(W + ΔW), B ← (1 − λ)(B + ΔW). Then
 * B − W ← (1 − λ)(B − W), so the feedback converges to the forward weights (the transpose,
 * in the B·e convention of the paper) from any start. B starts as feedback alignment's.
 */
export const kolenPollack: RuleDefinition = {
  type: 'rule',
  name: 'kolen-pollack',
  description: 'Kolen–Pollack: feedback weights get the forward weights\' updates, with weight decay on both, and converge to them',
  init: feedbackAlignment.init,
  deltas: ({ state, chain }) => chain(state),
  update: ({ tf, weights, updates, state }) => ({
    weights: weights.map((W) => tf.mul(W, 1 - KOLEN_POLLACK_DECAY)),
    state: state.map((B, l) => tf.mul(tf.add(B, updates[l + 1]), 1 - KOLEN_POLLACK_DECAY)),
  }),
};

/**
 * Sign symmetry (Liao, Leibo & Poggio 2016, "sign-concordant feedback"): the error travels
 * down through sign(W_l)ᵀ, the forward weights' signs without their magnitudes, taken afresh
 * at every step. Adam scales each weight's update by its own history, so the ±1 magnitudes
 * of the feedback do not set the step size.
 */
export const signSymmetry: RuleDefinition = {
  type: 'rule',
  name: 'sign-symmetry',
  description: 'sign symmetry: the error travels down through the signs of the forward weights',
  deltas: ({ tf, weights, chain }) => chain(weights.slice(1).map((W) => tf.sign(W))),
};

/** Every built-in learning rule by its config name. */
export const RULE_REGISTRY: Record<RuleName, RuleDefinition> = {
  backprop,
  'feedback-alignment': feedbackAlignment,
  'direct-feedback-alignment': directFeedbackAlignment,
  'kolen-pollack': kolenPollack,
  'sign-symmetry': signSymmetry,
};
