import * as tf from '@tensorflow/tfjs-core';
import type { Dataset, DatasetSplit } from '../collect/dataset.js';
import { createRng, randomInt, type Rng } from '../random.js';
import { AngleAverage, weightAngles } from './alignment.js';
import { LearnerDivergedError } from './errors.js';
import { TrainingStatistics, type ExampleSet } from './examples.js';
import { createExtractor } from './extractor.js';
import type { Matrix } from './matrix.js';
import { createTower, disposeTower, type Tower } from './network.js';
import { checkSpec, OBJECTIVE_REGISTRY, type Objective, type TrainingSignal } from './objectives.js';
import { allVariables, RULE_REGISTRY, towerOutputs, trueGradients, type Batch, type Rule } from './rules.js';
import type { EpochLog, FeatureExtractor, LearnerSpec } from './spec.js';

/** Options of one training run. */
export interface TrainOptions {
  /** The cell seed: initialisation and shuffling derive from it alone. */
  readonly seed: number;
  readonly onEpoch?: (log: EpochLog) => void;
}

/** A frozen encoder and its training log. */
export interface TrainedLearner {
  readonly encoder: FeatureExtractor;
  readonly log: EpochLog[];
}

/** Every tower with its heads, for callers that need the objective's outputs (the caller disposes). */
export interface TrainedNetwork {
  readonly towers: Tower[];
  readonly objective: Objective;
  readonly stats: TrainingStatistics;
  readonly log: EpochLog[];
}

/** Examples of one split uploaded once; batches are gathered from them by row index. */
interface SplitTensors {
  readonly n: number;
  readonly inputs: tf.Tensor2D[];
  readonly extra: tf.Tensor2D | null;
  readonly target: tf.Tensor2D | null;
}

const upload = (m: Matrix): tf.Tensor2D => tf.tensor2d(m.data, [m.rows, m.cols]);

function uploadExamples(e: ExampleSet): SplitTensors {
  return {
    n: e.n,
    inputs: e.inputs.map(upload),
    extra: e.extra == null ? null : upload(e.extra),
    target: e.target == null ? null : upload(e.target),
  };
}

function disposeSplit(s: SplitTensors): void {
  tf.dispose([...s.inputs, ...(s.extra == null ? [] : [s.extra]), ...(s.target == null ? [] : [s.target])]);
}

function gatherBatch(s: SplitTensors, rows: Int32Array): Batch {
  const index = tf.tensor1d(rows, 'int32');
  const pick = (t: tf.Tensor2D): tf.Tensor2D => tf.gather(t, index);
  return { inputs: s.inputs.map(pick), extra: s.extra == null ? null : pick(s.extra), target: s.target == null ? null : pick(s.target) };
}

/** A Fisher–Yates permutation of 0..n−1 (Knuth 1997, Algorithm P). */
function permutation(n: number, rng: Rng): Int32Array {
  const order = Int32Array.from({ length: n }, (_, i) => i);
  for (let i = n - 1; i > 0; i--) {
    const j = randomInt(rng, i + 1);
    [order[i], order[j]] = [order[j], order[i]];
  }
  return order;
}

/** InfoNCE needs at least one negative, so a contrast batch needs two rows. */
function minBatch(spec: LearnerSpec): number {
  return spec.objective === 'contrast' ? 2 : 1;
}

interface EpochContext {
  readonly spec: LearnerSpec;
  readonly towers: Tower[];
  readonly rule: Rule;
  readonly feedback: tf.Tensor2D[][];
  readonly signal: TrainingSignal;
  readonly optimizer: tf.Optimizer;
  readonly shuffle: Rng;
  step: number;
}

/** One pass over the training split; returns the example-weighted mean loss and the angles. */
function trainEpoch(ctx: EpochContext, train: SplitTensors, epoch: number): { loss: number; angles: number[] } {
  const { spec, towers, rule, feedback, signal, optimizer } = ctx;
  const vars = allVariables(towers);
  const order = permutation(train.n, ctx.shuffle);
  const angles = new AngleAverage();
  let sum = 0;
  let count = 0;
  for (let start = 0; start < train.n; start += spec.train.batch) {
    const rows = order.subarray(start, Math.min(start + spec.train.batch, train.n));
    if (rows.length < minBatch(spec)) continue;
    const last = start + spec.train.batch >= train.n;
    const record = spec.rule !== 'backprop' && (ctx.step % spec.train.alignEvery === 0 || (last && !angles.recorded));
    const value = tf.tidy(() => {
      const batch = gatherBatch(train, rows);
      const lossOf = (outputs: readonly tf.Tensor2D[]) => signal.loss(outputs, batch.target);
      const { loss, grads } = rule.gradients(towers, feedback, batch, lossOf);
      if (record) angles.add(weightAngles(grads, trueGradients(towers, batch, lossOf).grads));
      optimizer.applyGradients(Object.fromEntries(vars.map((v, i) => [v.name, grads[i]])));
      return loss.dataSync()[0];
    });
    if (!Number.isFinite(value)) throw new LearnerDivergedError(spec.name, 'train', epoch, value);
    sum += value * rows.length;
    count += rows.length;
    ctx.step += 1;
  }
  return { loss: sum / count, angles: angles.means() };
}

/**
 * Example-weighted mean loss over a split, in batches of the training batch size taken
 * in a fixed shuffled order: consecutive steps are near-duplicates, and contrast batches
 * of them would be far harder than the shuffled training batches.
 */
function evaluate(spec: LearnerSpec, towers: Tower[], signal: TrainingSignal, split: SplitTensors, order: Int32Array): number {
  let sum = 0;
  let count = 0;
  for (let start = 0; start < split.n; start += spec.train.batch) {
    const end = Math.min(start + spec.train.batch, split.n);
    if (end - start < minBatch(spec) && count > 0) continue;
    const rows = order.subarray(start, end);
    sum += (end - start) * tf.tidy(() => {
      const batch = gatherBatch(split, rows);
      const outputs = towerOutputs(towers, batch);
      return signal.loss(outputs, batch.target).dataSync()[0];
    });
    count += end - start;
  }
  return sum / count;
}

function makeOptimizer(spec: LearnerSpec): tf.Optimizer {
  return spec.train.optimizer === 'adam' ? tf.train.adam(spec.train.learningRate) : tf.train.sgd(spec.train.learningRate);
}

/** Lets timers and UI events run between epochs. */
const yieldToEventLoop = (): Promise<void> => new Promise((resolve) => setImmediate(resolve));

/**
 * Trains every tower of a learner's objective with its rule.
 *
 * Early stopping watches the validation loss; when training ends (patience exhausted or
 * the last epoch) the weights of the epoch with the lowest validation loss are restored,
 * so the representation is the one the log marks as best. A non-finite loss throws
 * LearnerDivergedError after freeing every tensor of the run.
 */
export async function trainNetwork(spec: LearnerSpec, data: Dataset, split: DatasetSplit, options: TrainOptions): Promise<TrainedNetwork> {
  checkSpec(spec);
  const objective = OBJECTIVE_REGISTRY[spec.objective](spec, data);
  const stats = new TrainingStatistics(data, split.train);
  const initRng = createRng(options.seed, 'init', spec.name);
  const towers = objective.towers.map((shape) => createTower(shape, spec.encoder.activation, initRng));
  const log: EpochLog[] = [];
  if (objective.signal == null) return { towers, objective, stats, log };
  const signal = objective.signal;
  const rule = RULE_REGISTRY[spec.rule];
  const feedback = rule.createFeedback(towers, createRng(options.seed, 'init', spec.name, 'feedback'));
  const train = uploadExamples(signal.examples(stats, split.train));
  const validation = uploadExamples(signal.examples(stats, split.validation));
  const optimizer = makeOptimizer(spec);
  const vars = allVariables(towers);
  let best: tf.Tensor[] = [];
  try {
    if (train.n < minBatch(spec)) throw new Error(`learner '${spec.name}': the training split has ${train.n} usable rows`);
    if (validation.n < minBatch(spec)) throw new Error(`learner '${spec.name}': the validation split has ${validation.n} usable rows`);
    const ctx: EpochContext = { spec, towers, rule, feedback, signal, optimizer, shuffle: createRng(options.seed, 'shuffle', spec.name), step: 0 };
    const validationOrder = permutation(validation.n, createRng(options.seed, 'shuffle', spec.name, 'validation'));
    let bestLoss = Infinity;
    let sinceBest = 0;
    for (let epoch = 1; epoch <= spec.train.epochs; epoch++) {
      const started = performance.now();
      const { loss, angles } = trainEpoch(ctx, train, epoch);
      const validationLoss = evaluate(spec, towers, signal, validation, validationOrder);
      if (!Number.isFinite(validationLoss)) throw new LearnerDivergedError(spec.name, 'validation', epoch, validationLoss);
      const entry: EpochLog = { epoch, trainLoss: loss, validationLoss, seconds: (performance.now() - started) / 1000, alignmentDeg: angles };
      log.push(entry);
      options.onEpoch?.(entry);
      if (validationLoss < bestLoss) {
        bestLoss = validationLoss;
        sinceBest = 0;
        tf.dispose(best);
        best = vars.map((v) => tf.clone(v));
      } else if (++sinceBest >= spec.train.patience) {
        break;
      }
      await yieldToEventLoop();
    }
    if (best.length > 0) vars.forEach((v, i) => v.assign(best[i]));
  } catch (error) {
    towers.forEach(disposeTower);
    throw error;
  } finally {
    tf.dispose([...best, ...feedback.flat()]);
    optimizer.dispose();
    disposeSplit(train);
    disposeSplit(validation);
  }
  return { towers, objective, stats, log };
}

/** Trains a learner and keeps only its frozen encoder (input tower without head). */
export async function trainLearner(spec: LearnerSpec, data: Dataset, split: DatasetSplit, options: TrainOptions): Promise<TrainedLearner> {
  const { towers, stats, log } = await trainNetwork(spec, data, split, options);
  const [first, ...others] = towers;
  others.forEach(disposeTower);
  if (first.head != null) tf.dispose([first.head.W, first.head.b]);
  const encoder = createExtractor(spec.input, data.channelSize, { ...first, head: null }, stats.channels(spec.input));
  return { encoder, log };
}
