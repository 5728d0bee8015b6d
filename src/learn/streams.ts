import { createRng, type Rng } from '../random.js';
import { headShape, type TowerShape, type TowerStreams } from './network.js';
import type { ActivationName } from './spec.js';

/** What a tower's hidden units are: a rate activation, or leaky integrate-and-fire neurons. */
export type UnitKind = ActivationName | 'spiking';

// The random streams of one training run. Each is keyed by the seed and the settings that shape
// what is drawn from it, never by the learner's name, so learners that share those settings share
// the draws (common random numbers) and renaming a learner changes none of its numbers. The keys
// are listed in src/random.ts.

/** The settings that shape an encoder's initial weights: channels, input width, hidden widths, unit kind. */
function encoderKey(shape: TowerShape, unit: UnitKind): string[] {
  return [shape.channels.join('+'), String(shape.inputWidth), shape.hidden.join('x'), unit];
}

/**
 * Streams for tower `index` (0 encodes the learner's input; 1 is the contrast target's
 * encoder): its encoder by the settings that shape it, its head by its position and shape.
 */
export function towerStreams(seed: number, shape: TowerShape, unit: UnitKind, index: number): TowerStreams {
  const [rows, cols] = headShape(shape);
  return {
    encoder: createRng(seed, 'init', 'encoder', ...encoderKey(shape, unit)),
    head: createRng(seed, 'init', 'head', index, `${rows}x${cols}`),
  };
}

/** The stream of a fixed feedback matrix: its tower, its position among the tower's matrices, its shape. */
export function feedbackStream(seed: number, tower: number, matrix: number, [rows, cols]: [number, number]): Rng {
  return createRng(seed, 'feedback', tower, matrix, `${rows}x${cols}`);
}

/** The stream that orders a split's rows into batches: the same for every learner of a seed. */
export function batchOrderStream(seed: number, split: 'train' | 'validation'): Rng {
  return createRng(seed, 'shuffle', split);
}

/** The stream of the input spikes of rate-coded training batches, drawn in training order. */
export function trainingSpikeStream(seed: number): Rng {
  return createRng(seed, 'spikes', 'train');
}
