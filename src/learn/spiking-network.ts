import * as tf from '@tensorflow/tfjs-core';
import { lifParameters, type LifParameters, type SurrogateSetting } from './lif.js';
import { affine, type Tower } from './network.js';
import { lifLayer, type LifTensors } from './spiking-kernels.js';
import type { InputCodingName, SpikingEncoderSpec } from './spec.js';

/** How a spiking tower runs: its neurons, the surrogate of its backward pass, the coding of its input. */
export interface SpikingDynamics {
  readonly lif: LifParameters;
  readonly surrogate: SurrogateSetting;
  readonly coding: InputCodingName;
  /** Length of a time step, ms (for rates in Hz). */
  readonly dtMs: number;
}

/** The dynamics a spiking encoder's settings describe. */
export function spikingDynamics(spec: SpikingEncoderSpec): SpikingDynamics {
  return { lif: lifParameters(spec), surrogate: { name: spec.surrogate, slope: spec.surrogateSlope }, coding: spec.inputCoding, dtMs: spec.dtMs };
}

/**
 * Samples in a tower input: current coding holds each sample's row over the steps
 * ([batch, in]); rate coding gives a spike train per sample ([steps·batch, in], time-major).
 */
export function samplesIn(x: tf.Tensor2D, d: SpikingDynamics): number {
  return d.coding === 'current' ? x.shape[0] : x.shape[0] / d.lif.steps;
}

/** Whether hidden layer `layer` (0-based) reads an input held over the steps rather than a spike train. */
export function readsHeldInput(layer: number, d: SpikingDynamics): boolean {
  return layer === 0 && d.coding === 'current';
}

/** The hidden layers simulated in time: what each layer read, and what it did. */
export interface SpikingLayers {
  readonly batch: number;
  /** inputs[l] is what hidden layer l + 1 read: the tower input, then each layer's spikes [steps·batch, width]. */
  readonly inputs: tf.Tensor2D[];
  readonly layers: LifTensors[];
}

/** What a forward pass keeps for the backward pass. */
export interface SpikingCache extends SpikingLayers {
  /** The last layer's rates (spike count ÷ steps), with the extra head columns appended. [batch, hidden_k + extra] */
  readonly headInput: tf.Tensor2D;
  readonly output: tf.Tensor2D;
}

/**
 * Runs the hidden layers one after the other, each over every time step: a layer's input
 * current I[t] = x[t]·W + b comes from the layer below's spikes at the same step (or the
 * held input), so the whole of layer l is simulated before layer l + 1.
 */
export function simulate(tower: Tower, x: tf.Tensor2D, d: SpikingDynamics): SpikingLayers {
  const batch = samplesIn(x, d);
  const inputs = [x];
  const layers: LifTensors[] = [];
  for (const layer of tower.encoder) {
    const simulated = lifLayer(affine(inputs[inputs.length - 1], layer), batch, d.lif, d.surrogate);
    layers.push(simulated);
    inputs.push(simulated.spikes);
  }
  inputs.pop(); // the last layer's spikes feed no layer; the head reads its rates
  return { batch, inputs, layers };
}

/** Full forward pass of a spiking tower with its head: the head reads the last layer's rates. */
export function spikingForward(tower: Tower, x: tf.Tensor2D, extra: tf.Tensor2D | null, d: SpikingDynamics): SpikingCache {
  if (tower.head == null) throw new Error('this tower has no head to train');
  const simulated = simulate(tower, x, d);
  const rates = simulated.layers[simulated.layers.length - 1].rate;
  const headInput = extra == null ? rates : tf.concat([rates, extra], 1);
  return { ...simulated, headInput, output: affine(headInput, tower.head) };
}

/** The representation: each last-layer unit's spike count ÷ steps. [batch, hidden_k] */
export function spikingRates(tower: Tower, x: tf.Tensor2D, d: SpikingDynamics): tf.Tensor2D {
  const { layers } = simulate(tower, x, d);
  return layers[layers.length - 1].rate;
}
