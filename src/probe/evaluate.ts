import type { Dataset, DatasetSplit } from '../collect/dataset.js';
import type { FeatureExtractor } from '../learn/spec.js';
import { corruptChannel, noiseRng } from '../noise/corrupt.js';
import { checkNoiseEntries } from '../noise/validate.js';
import { channelReference } from '../noise/reference.js';
import { noiseParameter } from '../noise/severity.js';
import type { NoiseSpec } from '../noise/spec.js';
import type { ChannelName } from '../senses/channel.js';
import { featureBasis, toBasis } from './basis.js';
import { preparedCka, prepareCka } from './cka.js';
import { chanceLevel, fitProbe, scoreProbe, takeRows, testLabels, type SplitFeatures, type TestLabels } from './probe.js';
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
 * channel, kind and severity. Severity 0 is computed once. A channel the encoder does
 * not read leaves its features unchanged, so its rows repeat the clean scores: a real
 * result (immunity), not a skipped one.
 */
export function evaluateEncoder(args: EvaluationArgs): EvaluationResult {
  const { encoder, data, split, seed } = args;
  const targets = args.targets.map(probeTarget);
  checkNoiseEntries(args.noise);
  for (const name of ['train', 'validation', 'test'] as const) {
    if (split[name].length === 0) throw new Error(`evaluateEncoder: the ${name} split has no rows`);
  }
  const d = encoder.featureSize;
  const extract = (rows: Int32Array, replaced?: { channel: ChannelName; values: Float32Array }): Float32Array => {
    const inputs: Partial<Record<ChannelName, Float32Array>> = {};
    for (const channel of encoder.input) {
      inputs[channel] = replaced?.channel === channel ? replaced.values : takeRows(data.channels[channel], data.channelSize[channel], rows);
    }
    return encoder.features(inputs, rows.length);
  };
  const trainFeatures = extract(split.train);
  const basis = featureBasis(trainFeatures, split.train.length, d);
  const inBasis = (rows: Int32Array, features: Float32Array): SplitFeatures => ({ rows, features, z: toBasis(basis, features, rows.length), basis });
  const train = inBasis(split.train, trainFeatures);
  const validation = inBasis(split.validation, extract(split.validation));
  const test = inBasis(split.test, extract(split.test));

  const labels = targets.map((target) => testLabels(fitProbe(target, data, train, validation), data, split.test));
  const chance = targets.map((target) => (target.kind === 'categorical' ? chanceLevel(target, data, split.train, split.test) : NaN));
  const nTest = split.test.length;
  const cleanCka = prepareCka(test.features, nTest, d);
  const measure = (features: Float32Array, z: Float64Array): Condition => ({
    scores: labels.map((l) => scoreProbe(l, features, z, basis)),
    cka: preparedCka(cleanCka, prepareCka(features, nTest, d)),
  });
  const clean = measure(test.features, test.z);

  const rows: EvaluationRow[] = [];
  for (const spec of args.noise) {
    const size = data.channelSize[spec.channel];
    const reference = channelReference(data.channels[spec.channel], size, split.train, spec.channel);
    const testValues = takeRows(data.channels[spec.channel], size, split.test);
    const reads = encoder.input.includes(spec.channel);
    spec.severities.forEach((severity, i) => {
      const parameter = noiseParameter(spec, i);
      let condition = clean;
      if (severity > 0 && reads) {
        const rng = noiseRng(seed, spec.channel, spec.kind, severity);
        const values = corruptChannel(testValues, size, spec.kind, parameter, reference, rng);
        const features = extract(split.test, { channel: spec.channel, values });
        condition = measure(features, toBasis(basis, features, nTest));
      }
      rows.push(...conditionRows({ channel: spec.channel, kind: spec.kind, severity, parameter }, condition, labels, chance));
    });
  }
  const testFeatureRows = Math.min(nTest, TEST_FEATURE_ROWS);
  return {
    rows,
    testFeatures: test.features.slice(0, testFeatureRows * d),
    testFeatureRows,
    featureSize: d,
    probes: labels.map(({ probe }) => ({
      target: probe.target.name, metric: probe.target.metric, alpha: probe.readout.alpha, validationScore: probe.readout.validationScore,
    })),
  };
}

type NoiseLevel = Pick<EvaluationRow, 'channel' | 'kind' | 'severity' | 'parameter'>;

function conditionRows(at: NoiseLevel, condition: Condition, labels: readonly TestLabels[], chance: readonly number[]): EvaluationRow[] {
  const rows: EvaluationRow[] = [];
  labels.forEach(({ probe }, t) => {
    rows.push({ target: probe.target.name, ...at, metric: probe.target.metric, value: condition.scores[t] });
    if (probe.target.kind === 'categorical') rows.push({ target: probe.target.name, ...at, metric: 'chance', value: chance[t] });
  });
  rows.push({ target: '-', ...at, metric: 'cka', value: condition.cka });
  return rows;
}
