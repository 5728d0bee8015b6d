import * as tf from '@tensorflow/tfjs-core';
import type { Dataset, DatasetSplit } from '../collect/dataset.js';
import { permutation, type Rng } from '../random.js';
import { BatchLosses } from './batch-losses.js';
import { ExampleTensors } from './batches.js';
import { AngleAverage, weightAngles } from './alignment.js';
import { LearnerDivergedError } from './errors.js';
import { batchLoss, bindObjective, splitExamples, type BoundObjective } from './bound-objective.js';
import { TrainingStatistics } from './examples.js';
import { encoderKind, type EncoderKind } from './encoder-kinds.js';
import { createExtractor } from './extractor.js';
import { disposeTower, type Tower } from './network.js';
import { createOptimizer, type Optimizer } from './optimizers.js';
import type { ObjectiveDefinition } from './objective-definition.js';
import { checkSpec, OBJECTIVE_REGISTRY } from './objectives.js';
import { RULE_REGISTRY } from './learning-rules.js';
import type { RuleDefinition } from './rule-definition.js';
import { allVariables, applyRuleUpdate, createRuleState, weightSnapshot, type RuleState } from './rules.js';
import type { EpochLog, FeatureExtractor, LearnerSpec } from './spec.js';
import { batchOrderStream, feedbackStream } from './streams.js';

/** Options of one training run. */
export interface TrainOptions {
  /** The cell seed: initialisation, feedback matrices and batch order derive from it and the learner's settings (streams.ts). */
  readonly seed: number;
  readonly onEpoch?: (log: EpochLog) => void;
  /**
   * Non-backprop rules: measure the update/gradient angle every this many steps (and at
   * an epoch's last step when no step of it was measured). Left out, only that last step
   * is measured. Measuring reads the weights and never changes them.
   */
  readonly alignEvery?: number;
  /** The objective when it is not a built-in one (a plug-in's); left out, `spec.objective` names a built-in. */
  readonly objective?: ObjectiveDefinition;
  /** The learning rule when it is not a built-in one (a plug-in's); left out, `spec.rule` names a built-in. */
  readonly rule?: RuleDefinition;
}

/** A frozen encoder and its training log. */
export interface TrainedLearner {
  readonly encoder: FeatureExtractor;
  readonly log: EpochLog[];
  /** The epoch whose weights the encoder holds (lowest validation loss); 0 if never trained. */
  readonly bestEpoch: number;
}

/** Every tower with its heads, for callers that need the objective's outputs (the caller disposes). */
export interface TrainedNetwork {
  readonly towers: Tower[];
  /** How the towers run (rate or spiking units). */
  readonly kind: EncoderKind;
  readonly objective: BoundObjective;
  readonly stats: TrainingStatistics;
  readonly log: EpochLog[];
  readonly bestEpoch: number;
}

interface EpochContext {
  readonly spec: LearnerSpec;
  readonly towers: Tower[];
  readonly kind: EncoderKind;
  readonly rule: RuleDefinition;
  readonly state: RuleState;
  readonly objective: BoundObjective;
  readonly optimizer: Optimizer;
  readonly shuffle: Rng;
  readonly alignEvery: number | undefined;
  step: number;
}

/**
 * One pass over the training split; returns the example-weighted mean loss and the angles.
 * Batch losses are read once, at the end: a loss that became NaN or infinite in any batch
 * fails the epoch with that value (the steps after it only move weights that are lost anyway).
 */
function trainEpoch(ctx: EpochContext, train: ExampleTensors, epoch: number): { loss: number; angles: number[] } {
  const { spec, towers, kind, rule, state, objective, optimizer } = ctx;
  const vars = allVariables(towers);
  const { n } = train.examples;
  const order = permutation(n, ctx.shuffle);
  const angles = new AngleAverage();
  const losses = new BatchLosses();
  try {
    for (let start = 0; start < n; start += spec.train.batch) {
      const rows = order.subarray(start, Math.min(start + spec.train.batch, n));
      if (rows.length < objective.minBatch) continue;
      const last = start + spec.train.batch >= n;
      const due = ctx.alignEvery != null && ctx.step % ctx.alignEvery === 0;
      const record = rule.name !== 'backprop' && (due || (last && !angles.recorded));
      losses.add(tf.tidy(() => {
        const batch = kind.batch(train, rows, 'train');
        const lossOf = (outputs: readonly tf.Tensor2D[]) => batchLoss(objective, outputs, batch.target);
        const { loss, grads } = kind.gradients(rule, towers, state, batch, lossOf);
        if (record) angles.add(weightAngles(grads, kind.reference(towers, batch, lossOf).grads));
        const before = rule.update == null ? [] : weightSnapshot(towers);
        optimizer.applyGradients(vars, grads);
        applyRuleUpdate(rule, towers, state, before);
        return loss;
      }), rows.length);
      ctx.step += 1;
    }
    const { mean, firstNonFinite } = losses.read();
    if (firstNonFinite != null) throw new LearnerDivergedError(spec.name, 'train', epoch, firstNonFinite);
    return { loss: mean, angles: angles.means() };
  } finally {
    losses.dispose();
  }
}

/**
 * Example-weighted mean loss over a split, in batches of the training batch size taken
 * in a fixed shuffled order: consecutive steps are near-duplicates, and contrast batches
 * of them would be far harder than the shuffled training batches.
 */
function evaluate(spec: LearnerSpec, kind: EncoderKind, towers: Tower[], objective: BoundObjective, split: ExampleTensors, order: Int32Array): number {
  const losses = new BatchLosses();
  try {
    const { n } = split.examples;
    for (let start = 0; start < n; start += spec.train.batch) {
      const end = Math.min(start + spec.train.batch, n);
      if (end - start < objective.minBatch && losses.count > 0) continue;
      const rows = order.subarray(start, end);
      losses.add(tf.tidy(() => {
        const batch = kind.batch(split, rows, 'evaluate');
        return batchLoss(objective, kind.outputs(towers, batch), batch.target);
      }), end - start);
    }
    return losses.read().mean;
  } finally {
    losses.dispose();
  }
}

/** Lets timers and UI events run between epochs. */
const yieldToEventLoop = (): Promise<void> => new Promise((resolve) => setImmediate(resolve));

/**
 * Epochs with early stopping on the validation loss: training stops once `patience` (≥ 1)
 * epochs in a row bring no lower validation loss. When training ends the weights of the
 * epoch with the lowest validation loss are restored, and that epoch is returned.
 */
async function runEpochs(ctx: EpochContext, train: ExampleTensors, validation: ExampleTensors, options: TrainOptions, log: EpochLog[]): Promise<number> {
  const { spec, towers, kind, objective } = ctx;
  const vars = allVariables(towers);
  const validationOrder = permutation(validation.examples.n, batchOrderStream(options.seed, 'validation'));
  let best: tf.Tensor[] = [];
  let bestLoss = Infinity;
  let bestEpoch = 0;
  let sinceBest = 0;
  try {
    for (let epoch = 1; epoch <= spec.train.epochs; epoch++) {
      const started = performance.now();
      const { loss, angles } = trainEpoch(ctx, train, epoch);
      const validationLoss = evaluate(spec, kind, towers, objective, validation, validationOrder);
      if (!Number.isFinite(validationLoss)) throw new LearnerDivergedError(spec.name, 'validation', epoch, validationLoss);
      const seconds = (performance.now() - started) / 1000; // the firing measurement is not training time
      const firing = kind.firing?.(towers[0], validation.examples);
      const entry: EpochLog = { epoch, trainLoss: loss, validationLoss, seconds, alignmentDeg: angles, ...(firing == null ? {} : { firing }) };
      log.push(entry);
      options.onEpoch?.(entry);
      if (validationLoss < bestLoss) {
        bestLoss = validationLoss;
        bestEpoch = epoch;
        sinceBest = 0;
        tf.dispose(best);
        best = vars.map((v) => tf.clone(v));
      } else if (++sinceBest >= spec.train.patience) {
        break;
      }
      await yieldToEventLoop();
    }
    if (best.length > 0) vars.forEach((v, i) => v.assign(best[i]));
    return bestEpoch;
  } finally {
    tf.dispose(best);
  }
}

/**
 * Trains every tower of a learner's objective with its rule (see runEpochs for early
 * stopping). A non-finite loss throws LearnerDivergedError after freeing every tensor of
 * the run; so does any other failure.
 */
export async function trainNetwork(spec: LearnerSpec, data: Dataset, split: DatasetSplit, options: TrainOptions): Promise<TrainedNetwork> {
  const definition = options.objective ?? OBJECTIVE_REGISTRY[spec.objective as keyof typeof OBJECTIVE_REGISTRY];
  if (definition == null) throw new Error(`learner '${spec.name}': unknown objective '${spec.objective}'`);
  const rule = options.rule ?? RULE_REGISTRY[spec.rule as keyof typeof RULE_REGISTRY];
  if (rule == null) throw new Error(`learner '${spec.name}': unknown rule '${spec.rule}'`);
  checkSpec(spec, definition);
  if (options.alignEvery != null && !(Number.isInteger(options.alignEvery) && options.alignEvery >= 1)) {
    throw new Error(`learner '${spec.name}': alignEvery must be a positive integer, got ${options.alignEvery}`);
  }
  const objective = bindObjective(definition, spec, data);
  const stats = new TrainingStatistics(data, split.train);
  const examples = objective.signal == null ? null : [splitExamples(objective, stats, split.train), splitExamples(objective, stats, split.validation)];
  for (const [i, which] of ['training', 'validation'].entries()) {
    const n = examples?.[i].n ?? Infinity;
    if (n < objective.minBatch) throw new Error(`learner '${spec.name}': the ${which} split has ${n} usable rows`);
  }
  const kind = encoderKind(spec, options.seed);
  const towers = objective.towers.map((shape, i) => kind.createTower(shape, i));
  const log: EpochLog[] = [];
  if (examples == null) return { towers, kind, objective, stats, log, bestEpoch: 0 };
  const [train, validation] = examples.map((e) => new ExampleTensors(e));
  const optimizer = createOptimizer(spec.train);
  let state: RuleState = [];
  let bestEpoch = 0;
  try {
    state = createRuleState(rule, towers, (tower, matrix, shape) => feedbackStream(options.seed, tower, matrix, shape));
    const ctx: EpochContext = { spec, towers, kind, rule, state, objective, optimizer, shuffle: batchOrderStream(options.seed, 'train'), alignEvery: options.alignEvery, step: 0 };
    bestEpoch = await runEpochs(ctx, train, validation, options, log);
  } catch (error) {
    towers.forEach(disposeTower);
    throw error;
  } finally {
    tf.dispose(state.flat());
    optimizer.dispose();
    train.dispose();
    validation.dispose();
  }
  return { towers, kind, objective, stats, log, bestEpoch };
}

/** Trains a learner and keeps only its frozen encoder (input tower without head). */
export async function trainLearner(spec: LearnerSpec, data: Dataset, split: DatasetSplit, options: TrainOptions): Promise<TrainedLearner> {
  const { towers, kind, stats, log, bestEpoch } = await trainNetwork(spec, data, split, options);
  const [first, ...others] = towers;
  others.forEach(disposeTower);
  if (first.head != null) tf.dispose([first.head.W, first.head.b]);
  const encoder = createExtractor(spec.input, data.channelSize, kind.representation({ ...first, head: null }), stats.channels(spec.input));
  return { encoder, log, bestEpoch };
}
