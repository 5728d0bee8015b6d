import type { Dataset, DatasetSplit } from '../collect/dataset.js';
import type { FeatureExtractor } from '../learn/spec.js';
import { checkNoiseEntries } from '../noise/validate.js';
import { noiseParameter } from '../noise/severity.js';
import { corruptTestRows, trainingReference } from '../noise/test-rows.js';
import type { NoiseSpec } from '../noise/spec.js';
import { preparedCka, prepareCka } from './cka.js';
import { encodeDistinct, type RowInputs } from './distinct.js';
import { correctedScore, seedRobustness, SEED_MEASURES, type SeedMeasure } from './robustness.js';
import { chanceLevel, evenSubsample, fitProbe, fitRows, scoreProbe, type FitRows, type FittedProbe } from './probe.js';
import { takeRows } from './rows.js';
import { probeTarget } from './targets.js';

/** At most this many clean test rows are returned for comparing learners of one seed (CKA). */
export const TEST_FEATURE_ROWS = 2000;

/** One measurement; `target` is '-' for CKA rows, which describe the representation itself. */
export interface EvaluationRow {
  readonly target: string;
  readonly channel: string;
  readonly kind: string;
  readonly severity: number;
  /** The corruption parameter used at this severity (noiseParameter: the clean value at severity 0). */
  readonly parameter: number;
  readonly metric: 'r2' | 'accuracy' | 'chance' | 'cka';
  readonly value: number;
}

/**
 * One per-seed robustness measure (seedRobustness) on the chance-corrected scale
 * (correctedScore); `metric` names the probe score it was computed from. NaN when
 * undefined (an area whose corrected clean score is below AREA_MIN_CLEAN).
 */
export interface SeedMeasureRow {
  readonly target: string;
  readonly channel: string;
  readonly kind: string;
  readonly measure: SeedMeasure;
  readonly metric: 'r2' | 'accuracy';
  readonly value: number;
}

/** The penalty each probe chose on validation, for the record. */
export interface ProbeChoice {
  readonly target: string;
  readonly metric: 'r2' | 'accuracy';
  readonly alpha: number;
  /** Validation score of the final read-out (fitted on all training rows at `alpha`). */
  readonly validationScore: number;
}

/** Everything one encoder's evaluation produces. */
export interface EvaluationResult {
  readonly rows: readonly EvaluationRow[];
  /** noisy, drop and area per target and noise setting with at least one noisy severity. */
  readonly measures: readonly SeedMeasureRow[];
  /** Clean features of the first min(n_test, TEST_FEATURE_ROWS) test rows. */
  readonly testFeatures: Float32Array; // [testFeatureRows, featureSize]
  readonly testFeatureRows: number;
  readonly featureSize: number;
  readonly probes: readonly ProbeChoice[];
}

/** Arguments of evaluateEncoder. */
export interface EvaluationArgs {
  readonly encoder: FeatureExtractor;
  readonly data: Dataset;
  readonly split: DatasetSplit;
  readonly targets: readonly string[];
  readonly noise: readonly NoiseSpec[];
  readonly seed: number;
}

/** Scores of every probe and the clean-vs-noisy CKA at one test condition. */
interface Condition {
  readonly scores: readonly number[];
  readonly cka: number;
}

/**
 * Probes a frozen encoder: fits one read-out per target on clean training features
 * (penalty chosen on validation), then scores it on test features at every noise
 * channel, kind and severity. The three clean splits go through the encoder in one
 * call, and all corrupted severities of a noise setting in one more, each distinct
 * input once. Severity 0 is computed once. A channel the encoder does not read leaves
 * its features unchanged, so its rows repeat the clean scores: a real result
 * (immunity), not a skipped one.
 */
export function evaluateEncoder(args: EvaluationArgs): EvaluationResult {
  const { encoder, data, split } = args;
  const targets = args.targets.map(probeTarget);
  checkNoiseEntries(args.noise);
  for (const name of ['train', 'validation', 'test'] as const) {
    if (split[name].length === 0) throw new Error(`evaluateEncoder: the ${name} split has no rows`);
  }
  const d = encoder.featureSize;
  const testInputs = inputsOf(encoder, data, split.test);
  const [train, validation, test] = encodeDistinct(encoder, data.channelSize, [inputsOf(encoder, data, split.train), inputsOf(encoder, data, split.validation), testInputs]);
  const trainSplit = { steps: split.train, encoded: train };
  const validationSplit = { steps: split.validation, encoded: validation };
  const all = fitRows(trainSplit, validationSplit, d);
  const subsamples = new Map<number, FitRows>(); // one per path size, shared by every target that needs it
  const pathRows = (limit: number): FitRows => {
    if (!subsamples.has(limit)) subsamples.set(limit, fitRows(evenSubsample(trainSplit, limit, d), validationSplit, d));
    return subsamples.get(limit) as FitRows;
  };
  const probes = targets.map((target) => fitProbe(target, data, all, pathRows));

  const labels = targets.map((target) => target.labels(data, split.test));
  const chance = targets.map((target) => (target.kind === 'categorical' ? chanceLevel(target, data, split.train) : NaN));
  const nTest = split.test.length;
  const cleanFeatures = takeRows(test.features, d, test.index); // [nTest, d]
  const cleanCka = prepareCka(cleanFeatures, nTest, d);
  const measure = (features: Float32Array): Condition => ({
    scores: probes.map((probe, t) => scoreProbe(probe, features, labels[t])),
    cka: preparedCka(cleanCka, prepareCka(features, nTest, d)),
  });
  const clean = measure(cleanFeatures);

  const rows: EvaluationRow[] = [];
  const measures: SeedMeasureRow[] = [];
  for (const spec of args.noise) {
    const corrupted = encoder.input.includes(spec.channel) ? corruptedFeatures(args, spec, testInputs) : [];
    const conditions = spec.severities.map((severity, i) => {
      const features = corrupted[i];
      const condition = features === undefined ? clean : measure(features);
      rows.push(...conditionRows({ channel: spec.channel, kind: spec.kind, severity, parameter: noiseParameter(spec, i) }, condition, probes, chance));
      return condition;
    });
    if (spec.severities.some((severity) => severity > 0)) {
      measures.push(...seedMeasureRows(spec, [clean, ...conditions], probes, chance));
    }
  }
  const testFeatureRows = Math.min(nTest, TEST_FEATURE_ROWS);
  return {
    rows,
    measures,
    testFeatures: cleanFeatures.slice(0, testFeatureRows * d),
    testFeatureRows,
    featureSize: d,
    probes: probes.map(({ target, readout }) => ({ target: target.name, metric: target.metric, alpha: readout.alpha, validationScore: readout.validationScore })),
  };
}

/** The encoder's input channels at the given steps. */
function inputsOf(encoder: FeatureExtractor, data: Dataset, steps: Int32Array): RowInputs {
  return { n: steps.length, channels: Object.fromEntries(encoder.input.map((c) => [c, takeRows(data.channels[c], data.channelSize[c], steps)])) };
}

/**
 * Test features [nTest, d] at each severity of one noise setting, from one encoder call
 * (undefined at severity 0, the clean features). The draws depend only on the seed,
 * channel, kind and severity, so every learner of a seed sees the same corrupted inputs.
 */
function corruptedFeatures(args: EvaluationArgs, spec: NoiseSpec, test: RowInputs): (Float32Array | undefined)[] {
  const { encoder, data, split, seed } = args;
  const reference = trainingReference(data, split, spec.channel);
  const clean = test.channels[spec.channel] as Float32Array;
  const noisy = spec.severities.filter((severity) => severity > 0); // severities never repeat (checkNoiseSpec)
  const encoded = encodeDistinct(encoder, data.channelSize, noisy.map((severity) => {
    const parameter = noiseParameter(spec, spec.severities.indexOf(severity));
    const values = corruptTestRows(clean, reference, spec.kind, severity, parameter, seed);
    return { n: test.n, channels: { ...test.channels, [spec.channel]: values } };
  }));
  return spec.severities.map((severity) => {
    const e = encoded[noisy.indexOf(severity)];
    return e === undefined ? undefined : takeRows(e.features, encoder.featureSize, e.index);
  });
}

/**
 * noisy, drop and area of every target under one noise setting, from the corrected
 * clean score and the corrected score at each severity above 0 (conditions[0] is clean,
 * conditions[1 + i] belongs to spec.severities[i]).
 */
function seedMeasureRows(spec: NoiseSpec, conditions: readonly Condition[], probes: readonly FittedProbe[], chance: readonly number[]): SeedMeasureRow[] {
  return probes.flatMap((probe, t) => {
    const metric = probe.target.metric;
    const corrected = (c: Condition) => correctedScore(metric, c.scores[t], chance[t]);
    const curve = [{ severity: 0, score: corrected(conditions[0]) },
      ...spec.severities.flatMap((severity, i) => (severity > 0 ? [{ severity, score: corrected(conditions[1 + i]) }] : []))];
    const figures = seedRobustness(curve);
    return SEED_MEASURES.map((measure) => ({ target: probe.target.name, channel: spec.channel, kind: spec.kind, measure, metric, value: figures[measure].value }));
  });
}

type NoiseLevel = Pick<EvaluationRow, 'channel' | 'kind' | 'severity' | 'parameter'>;

function conditionRows(at: NoiseLevel, condition: Condition, probes: readonly FittedProbe[], chance: readonly number[]): EvaluationRow[] {
  const rows: EvaluationRow[] = [];
  probes.forEach((probe, t) => {
    rows.push({ target: probe.target.name, ...at, metric: probe.target.metric, value: condition.scores[t] });
    if (probe.target.kind === 'categorical') rows.push({ target: probe.target.name, ...at, metric: 'chance', value: chance[t] });
  });
  rows.push({ target: '-', ...at, metric: 'cka', value: condition.cka });
  return rows;
}
