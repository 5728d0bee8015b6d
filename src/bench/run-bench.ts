import type { BackendName } from '../learn/index.js';
import { startupSeconds } from './cli-process.js';
import { benchCollection } from './collection.js';
import { figureOf, measure, type Figure } from './figure.js';
import { describeMachine, type Machine } from './machine.js';
import { benchPeer } from './peer.js';
import { probeSecondsPerCell } from './probe.js';
import { benchQuickstart } from './sweep.js';
import { benchTorchReference, type TorchReference } from './torch-reference.js';
import { benchObjectives, benchReference, benchSpiking, benchStacked, STACKED_MODELS } from './training.js';

/** Everything `crosswise bench` measures. */
export interface BenchFigures {
  readonly collectStepsPerS: Figure;
  readonly trainSamplesPerS: Record<BackendName, Figure>;
  readonly trainStackedSamplesPerS: Figure;
  readonly torch: TorchReference | null;
  readonly probeSPerCell: Figure;
  /** Null with --quick. */
  readonly quickstartWallS: { readonly jobs1: Figure; readonly jobs2: Figure } | null;
  readonly startupS: Figure;
  /** Null with --quick or without torch and scikit-learn. */
  readonly peerQuickstartWallS: Figure | null;
  readonly trainObjectivesSamplesPerS: Record<string, Figure>;
  /** The quickstart's sound-from-sight learner with a spiking encoder, by time steps and rule. */
  readonly trainSpikingSamplesPerS: Record<string, Figure>;
  readonly machine: Machine;
  readonly notes: string[];
}

/** How much to measure. */
export interface BenchOptions {
  readonly repeats: number;
  readonly quick: boolean;
  /** The backend of the per-objective table and the probe figure. */
  readonly backend: BackendName;
  /** Hears the name of each section as it starts. */
  readonly progress: (section: string) => void;
}

/** Probe seconds per cell: each call of probeSecondsPerCell trains its encoder, warms up, then times one probe. */
async function probeFigure(options: BenchOptions): Promise<Figure> {
  const values: number[] = [];
  for (let r = 0; r < options.repeats; r++) values.push(await probeSecondsPerCell({ repeats: 1, backend: options.backend }));
  return figureOf(values);
}

/** Runs every measurement in turn; the sweep timings only without `quick`. */
export async function runBench(options: BenchOptions): Promise<BenchFigures> {
  const { repeats, quick, progress } = options;
  const machine = describeMachine();
  progress('start-up');
  const startupS = await measure(repeats, startupSeconds);
  progress('collection');
  const collection = await benchCollection(repeats, quick);
  progress('training, reference MLP');
  const trainSamplesPerS = await benchReference(repeats, quick);
  progress(`training, ${STACKED_MODELS} stacked models`);
  const trainStackedSamplesPerS = await benchStacked(repeats, quick);
  progress('training, every objective');
  const trainObjectivesSamplesPerS = await benchObjectives(repeats, quick, options.backend);
  progress('training, spiking encoders');
  const trainSpikingSamplesPerS = await benchSpiking(repeats, quick, options.backend);
  progress('probe');
  const probeSPerCell = await probeFigure(options);
  progress('PyTorch reference');
  const torch = benchTorchReference(repeats, quick);
  const quickstartWallS = quick ? null : benchQuickstart(repeats, (run) => progress(`quickstart sweep (${run})`));
  if (!quick) progress('peer script');
  const peerQuickstartWallS = quick ? null : await benchPeer(repeats);
  const notes = [collection.detail];
  if (torch?.warning != null) notes.push(torch.warning);
  if (torch == null) notes.push('PyTorch figures are absent: no python3 on this machine imports torch (Debian: python3-torch with libopenblas0-pthread)');
  return {
    collectStepsPerS: collection.figure, trainSamplesPerS, trainStackedSamplesPerS, torch, probeSPerCell,
    quickstartWallS, startupS, peerQuickstartWallS, trainObjectivesSamplesPerS, trainSpikingSamplesPerS, machine, notes,
  };
}
