import * as tf from '@tensorflow/tfjs-core';
import type { Rng } from '../random.js';
import type { ChannelName } from '../senses/channel.js';
import { glorotUniform, hiddenInit } from './init.js';
import { biasRelu, reluBackward } from './relu-kernels.js';
import type { ActivationName } from './spec.js';

/** One fully connected layer: y = x·W + b. */
export interface Dense {
  readonly W: tf.Variable; // [in, out]
  readonly b: tf.Variable; // [out]
}

/** An encoder with a linear head on its last hidden layer (plus optional extra head inputs). */
export interface Tower {
  readonly encoder: readonly Dense[];
  readonly head: Dense | null;
  /** The hidden layers' activation; null in a spiking tower, whose units are leaky integrate-and-fire neurons (spiking-network.ts). */
  readonly activation: ActivationName | null;
}

/** What one tower reads and its sizes. */
export interface TowerShape {
  /** Channels its encoder reads, in CHANNELS order. */
  readonly channels: readonly ChannelName[];
  readonly inputWidth: number;
  readonly hidden: readonly number[];
  /** Head output width; 0 means no head (an encoder only). */
  readonly outputWidth: number;
  /** Columns appended to the representation before the head (e.g. the action for forecast). */
  readonly extraWidth: number;
}

/**
 * An activation and its derivative written from the pre- and post-activation values, with
 * optional one-kernel forms of a layer's element-wise work for the hand-written passes
 * (rules.ts): each gives the bits of the tfjs ops it stands for, but has no gradient, so
 * autodiff runs the ops themselves.
 */
interface Activation {
  readonly f: (a: tf.Tensor2D) => tf.Tensor2D;
  readonly derivative: (pre: tf.Tensor2D, post: tf.Tensor2D) => tf.Tensor2D;
  /** [a + b, f(a + b)] for a product a [rows, cols] and a bias b [cols]. */
  readonly biasActivation?: (a: tf.Tensor2D, b: tf.Tensor1D) => [tf.Tensor2D, tf.Tensor2D];
  /** g ⊙ f′(pre), the error at the pre-activation from the signal g at the output. */
  readonly backward?: (g: tf.Tensor2D, pre: tf.Tensor2D, post: tf.Tensor2D) => tf.Tensor2D;
}

/** Every activation by its config name (the names are ACTIVATIONS in spec.ts). */
export const ACTIVATION_REGISTRY: Record<ActivationName, Activation> = {
  relu: { f: (a) => tf.relu(a), derivative: (pre) => tf.step(pre), biasActivation: biasRelu, backward: (g, pre) => reluBackward(g, pre) },
  tanh: { f: (a) => tf.tanh(a), derivative: (_pre, h) => tf.sub(1, tf.square(h)) },
  sigmoid: { f: (a) => tf.sigmoid(a), derivative: (_pre, h) => tf.mul(h, tf.sub(1, h)) },
};

/** δ = g ⊙ f′(pre) of a layer, in one kernel where the activation has one. */
export function activationBackward(name: ActivationName, g: tf.Tensor2D, pre: tf.Tensor2D, post: tf.Tensor2D): tf.Tensor2D {
  const activation = ACTIVATION_REGISTRY[name];
  return activation.backward?.(g, pre, post) ?? tf.mul(g, activation.derivative(pre, post));
}

/** The activation of a rate tower's hidden layers; a spiking tower has none. */
export function activationOf(tower: Pick<Tower, 'activation'>): ActivationName {
  if (tower.activation == null) throw new Error('a spiking tower has no activation function: run it with spiking-network.ts');
  return tower.activation;
}

function dense(W: Float32Array, fanIn: number, fanOut: number): Dense {
  // tidy frees the initial-value tensors; the variables it returns stay alive.
  return tf.tidy(() => ({ W: tf.variable(tf.tensor2d(W, [fanIn, fanOut])), b: tf.variable(tf.zeros([fanOut])) }));
}

/** The generators a tower's weights are drawn from: the encoder's layers in order, and the head's. */
export interface TowerStreams {
  readonly encoder: Rng;
  readonly head: Rng;
}

/** Rows and columns of a tower's head: its representation plus the extra columns, to its outputs. */
export function headShape(shape: TowerShape): [number, number] {
  return [shape.hidden[shape.hidden.length - 1] + shape.extraWidth, shape.outputWidth];
}

/** Draws the initial weights of hidden layer `layer` (0-based), [fanIn, fanOut] row-major. */
export type LayerInit = (rng: Rng, fanIn: number, fanOut: number, layer: number) => Float32Array;

/**
 * Builds a tower; weights come from the streams only (biases start at zero). Hidden layers
 * start from `init`, by default the initialiser suited to the activation.
 */
export function createTower(shape: TowerShape, activation: ActivationName | null, streams: TowerStreams, init: LayerInit = hiddenInit(activationOf({ activation }))): Tower {
  const encoder: Dense[] = [];
  let fanIn = shape.inputWidth;
  for (const [layer, width] of shape.hidden.entries()) {
    encoder.push(dense(init(streams.encoder, fanIn, width, layer), fanIn, width));
    fanIn = width;
  }
  const [headIn, outputs] = headShape(shape);
  const head = outputs > 0 ? dense(glorotUniform(streams.head, headIn, outputs), headIn, outputs) : null;
  return { encoder, head, activation };
}

/** Values kept from a forward pass for hand-written backward passes. */
export interface ForwardCache {
  /** post[0] is the input, post[l] the activation of hidden layer l. */
  readonly post: tf.Tensor2D[];
  /** pre[l - 1] is the pre-activation of hidden layer l. */
  readonly pre: tf.Tensor2D[];
  readonly headInput: tf.Tensor2D;
  readonly output: tf.Tensor2D;
}

/** x·W + b for a layer. */
export function affine(x: tf.Tensor2D, layer: Dense): tf.Tensor2D {
  return tf.add(tf.matMul(x, layer.W as tf.Tensor2D), layer.b);
}

/** Representation (last hidden layer) for inputs x: [batch, in] → [batch, hidden_k]. */
export function encode(tower: Tower, x: tf.Tensor2D): tf.Tensor2D {
  const { f } = ACTIVATION_REGISTRY[activationOf(tower)];
  return tower.encoder.reduce((h, layer) => f(affine(h, layer)), x);
}

/** The head's input: the representation, with the extra columns appended when there are any. */
function headInputOf(representation: tf.Tensor2D, extra: tf.Tensor2D | null): tf.Tensor2D {
  return extra == null ? representation : tf.concat([representation, extra], 1);
}

/**
 * Full forward pass with every intermediate kept, for the hand-written backward passes: a
 * layer's bias and activation run as one kernel where the activation has one (no gradient;
 * the same bits as `forward`).
 */
export function forwardCached(tower: Tower, x: tf.Tensor2D, extra: tf.Tensor2D | null): ForwardCache {
  if (tower.head == null) throw new Error('this tower has no head to train');
  const { f, biasActivation } = ACTIVATION_REGISTRY[activationOf(tower)];
  const post = [x];
  const pre: tf.Tensor2D[] = [];
  for (const layer of tower.encoder) {
    const h = post[post.length - 1];
    const [a, out] = biasActivation?.(tf.matMul(h, layer.W as tf.Tensor2D), layer.b as tf.Tensor1D) ?? [affine(h, layer)];
    pre.push(a);
    post.push(out ?? f(a));
  }
  const headInput = headInputOf(post[post.length - 1], extra);
  return { post, pre, headInput, output: affine(headInput, tower.head) };
}

/** Head output only, by differentiable ops (the autodiff path). */
export function forward(tower: Tower, x: tf.Tensor2D, extra: tf.Tensor2D | null): tf.Tensor2D {
  if (tower.head == null) throw new Error('this tower has no head to train');
  return affine(headInputOf(encode(tower, x), extra), tower.head);
}

/** Output width of a layer. */
export function layerWidth(layer: Dense): number {
  return (layer.W as tf.Tensor2D).shape[1];
}

/** Weight layers in order: encoder layers, then the head. */
export function towerLayers(tower: Tower): Dense[] {
  return tower.head == null ? [...tower.encoder] : [...tower.encoder, tower.head];
}

/** Every trainable variable of a tower, layer by layer (W then b). */
export function towerVariables(tower: Tower): tf.Variable[] {
  return towerLayers(tower).flatMap((l) => [l.W, l.b]);
}

/** Frees a tower's variables. */
export function disposeTower(tower: Tower): void {
  for (const v of towerVariables(tower)) v.dispose();
}
