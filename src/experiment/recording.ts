import { latentRows, type Dataset, type DatasetSplit } from '../collect/dataset.js';
import { corruptTestRows, trainingReference } from '../noise/test-rows.js';
import type { NoiseKind } from '../noise/spec.js';
import { takeRows } from '../probe/rows.js';
import { fileEntries, RECORDING_FORMAT_VERSION, sensesBlock, SPLIT_NAMES, type Recording, type RecordingManifest } from '../results/recording.js';
import type { ChannelName } from '../senses/channel.js';
import { ACTIONS } from '../world/types.js';
import { cellData } from './cell-data.js';
import type { PlannedCell } from './plan.js';
import { crosswiseVersion } from './store.js';

/** One corruption of a recording's test steps: a channel, a kind, a severity and the parameter it stands for. */
export interface RecordedNoise {
  readonly channel: ChannelName;
  readonly kind: NoiseKind;
  readonly severity: number;
  readonly parameter: number;
}

/** What to record: the experience of a cell (or of a world walked as a cell would), where it came from, and the noise to apply. */
export interface RecordingRequest {
  readonly cell: Pick<PlannedCell, 'world' | 'collect' | 'senses' | 'seed'>;
  readonly source: RecordingManifest['source'];
  readonly noise: readonly RecordedNoise[];
}

/**
 * Records a cell's experience: exactly the data and split the cell trains and probes on
 * (cellData), with each noise entry applied to its channel's test steps the way the probes
 * corrupt them (same training reference, same rows in the same order, same stream), and the
 * other steps left clean.
 */
export function makeRecording({ cell, source, noise }: RecordingRequest): Recording {
  const { world, data, split } = cellData(cell);
  const channels: Record<ChannelName, Float32Array> = { ...data.channels };
  for (const { channel, kind, severity, parameter } of noise) {
    const size = data.channelSize[channel];
    const noisy = corruptTestRows(takeRows(data.channels[channel], size, split.test), trainingReference(data, split, channel), kind, severity, parameter, cell.seed);
    const values = Float32Array.from(channels[channel]);
    split.test.forEach((t, i) => values.set(noisy.subarray(i * size, (i + 1) * size), t * size));
    channels[channel] = values;
  }
  const { policy, steps, episodeSteps, split: fractions } = cell.collect;
  const manifest: RecordingManifest = {
    format: 'crosswise recording',
    format_version: RECORDING_FORMAT_VERSION,
    crosswise_version: crosswiseVersion(),
    source,
    world: { name: world.name, file: cell.world.path, sha256: cell.world.sha256 },
    seed: cell.seed,
    steps,
    collect: { policy, episode_steps: episodeSteps, split: { ...fractions } },
    senses: sensesBlock(cell.senses),
    noise: noise.map((n) => ({ ...n, stream: `noise/${n.channel}/${n.kind}/${n.severity}`, rows: 'test' as const })),
    files: fileEntries(steps, cell.senses, data.classNames),
  };
  return {
    manifest,
    channels,
    latents: latentRows(data),
    actions: actionIndices(data),
    episodes: Int32Array.from(data.episode),
    split: splitIndices(data.steps, split),
  };
}

/** The action of each step as an index into ACTIONS, read from the clean motor channel (the one-hot efference copy of the action). */
function actionIndices(data: Dataset): Uint8Array {
  const width = ACTIONS.length;
  const motor = data.channels.motor;
  return Uint8Array.from({ length: data.steps }, (_, t) => {
    const row = motor.subarray(t * width, (t + 1) * width);
    const action = row.indexOf(1);
    if (action < 0 || row.some((v, i) => v !== (i === action ? 1 : 0))) throw new Error(`motor row ${t} is not one-hot`);
    return action;
  });
}

/** The split of each step as an index into SPLIT_NAMES. */
function splitIndices(steps: number, split: DatasetSplit): Uint8Array {
  const out = new Uint8Array(steps);
  SPLIT_NAMES.forEach((name, k) => split[name].forEach((t) => { out[t] = k; }));
  return out;
}
