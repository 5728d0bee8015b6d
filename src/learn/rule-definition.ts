import type * as tfCore from '@tensorflow/tfjs-core';

/** The TensorFlow.js instance crosswise runs on, as every plug-in receives it. */
export type Tf = typeof tfCore;
type Tensor2D = tfCore.Tensor2D;

// A learning rule decides the error δ_l that each hidden layer l of an MLP learns from;
// the trainer turns δ into updates (∂W_l = h_{l−1}ᵀ·δ_l, ∂b_l = Σ_rows δ_l) and the optimiser
// applies them. Layers are numbered from 0 in the arrays below: hidden layers 0..k−1, then
// the linear head k. The head always learns from the true output error e = ∂L/∂output.

/** What a rule sees when it makes its own matrices, once per tower before training. */
export interface RuleInit {
  readonly tf: Tf;
  /** Forward weights [W_0, …, W_{k−1}, W_head], each [in, out]; the head's rows over the representation only. */
  readonly weights: readonly Tensor2D[];
  /** A [rows, cols] Glorot-uniform matrix from the seed, the same for every rule that asks in the same order. */
  random(rows: number, cols: number): Tensor2D;
}

/** What a rule sees at each training step, for one tower and one batch (inside a tf.tidy). */
export interface RuleStep {
  readonly tf: Tf;
  /** Forward weights as in RuleInit, at this step. */
  readonly weights: readonly Tensor2D[];
  /** What each layer reads: activations[0] the batch input, activations[l] hidden layer l − 1's output, activations[k] the head's input (the representation, then any extra columns). */
  readonly activations: readonly Tensor2D[];
  /** e = ∂L/∂output of the head, [batch, outputs]. */
  readonly outputError: Tensor2D;
  /** The rule's own matrices (from init, as changed by update). */
  readonly state: readonly Tensor2D[];
  /** δ_l = g ⊙ f′(a_l): the error at hidden layer l's pre-activation given the signal g arriving at its output. */
  derivative(layer: number, signal: Tensor2D): Tensor2D;
  /**
   * The errors of every hidden layer when e travels down the network through `matrices[l]`
   * in place of weights[l + 1] (so k matrices, each shaped like the weight it replaces):
   * g_{k−1} = e·M_{k−1}ᵀ, δ_l = derivative(l, g_l), g_{l−1} = δ_l·M_{l−1}ᵀ. With the
   * forward weights themselves this is backpropagation.
   */
  chain(matrices: readonly Tensor2D[]): Tensor2D[];
}

/** What a rule sees after each optimiser step (inside a tf.tidy). */
export interface RuleUpdate {
  readonly tf: Tf;
  /** Forward weights as in RuleInit, after the step. */
  readonly weights: readonly Tensor2D[];
  /** What the step added to each of them: weights after minus weights before. */
  readonly updates: readonly Tensor2D[];
  readonly state: readonly Tensor2D[];
}

/**
 * A learning rule, built in or default-exported by a plug-in file (`rule: ./my-rule.ts`).
 * Tensors it returns are owned by the trainer; it never imports TensorFlow.js itself.
 */
export interface RuleDefinition {
  readonly type: 'rule';
  /** The name results and the summary show; letters, digits, '.', '_' or '-'. */
  readonly name: string;
  /** One line on what the rule does and where it comes from. */
  readonly description: string;
  /** The rule's own matrices for one tower (fixed or learned feedback); none when left out. */
  init?(context: RuleInit): Tensor2D[];
  /** δ_0, …, δ_{k−1}: the error each hidden layer learns from, each [batch, width of layer l]. */
  deltas(context: RuleStep): Tensor2D[];
  /** After each step: the rule's matrices and, when given, the forward weights replace the old ones. */
  update?(context: RuleUpdate): { readonly state?: Tensor2D[]; readonly weights?: Tensor2D[] };
}
