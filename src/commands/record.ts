import { createHash, randomUUID } from 'node:crypto';
import { existsSync, readFileSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { loadSweep } from '../experiment/config.js';
import { readWorldFile } from '../experiment/file-kind.js';
import { DEFAULTS } from '../experiment/defaults.js';
import { planCells } from '../experiment/plan.js';
import { sweepPolicy } from '../experiment/plugin-catalog.js';
import { makeRecording, type RecordedNoise, type RecordingRequest } from '../experiment/recording.js';
import { noiseProblems } from '../noise/validate.js';
import { noiseParameter, severityParameter } from '../noise/severity.js';
import type { NoiseKind, NoiseSpec } from '../noise/spec.js';
import { writeFolderAtomic } from '../results/atomic-file.js';
import { recordingFiles, SPLIT_NAMES, type Recording } from '../results/recording.js';
import { DEFAULT_SENSE_SETTINGS, type ChannelName } from '../senses/channel.js';
import { runAction } from './command-line.js';
import { EXIT } from './exit-codes.js';
import { recordUsage } from './record-usage.js';
import { UsageError, type ParsedArguments } from './usage.js';

type RecordValues = ParsedArguments<typeof recordUsage.options>['values'];

/** What to record without its noise: a world walked with default collect settings, or one cell of a config. */
function chooseSource(world: string | undefined, args: RecordValues): Omit<RecordingRequest, 'noise'> & { readonly configNoise: readonly NoiseSpec[] } {
  if (args.index != null && args.config == null) throw new UsageError('--index names a cell of a config; give --config too');
  if (args.config == null) {
    const path = resolve(world as string);
    readWorldFile(path, 'record a cell of a config with --config FILE --index I'); // a WorldFileError names the file, line and column before anything is written
    const sha256 = createHash('sha256').update(readFileSync(path)).digest('hex');
    const collect = {
      ...DEFAULTS.collect, policy: args.policy ?? DEFAULTS.collect.policy, steps: args.steps ?? DEFAULTS.collect.steps,
    };
    return { cell: { world: { path, sha256 }, collect, senses: DEFAULT_SENSE_SETTINGS, seed: args.seed ?? 1 }, source: { kind: 'world' }, configNoise: [] };
  }
  if (args.index == null) throw new UsageError('--config records one cell: give --index I (crosswise plan lists the cells)');
  const given = (['seed', 'steps', 'policy'] as const).filter((name) => args[name] != null);
  if (given.length > 0) throw new UsageError(`--index records the cell's own data: drop ${given.map((name) => `--${name}`).join(', ')}`);
  const config = resolve(args.config);
  const sweep = loadSweep(config);
  const cells = planCells(sweep);
  if (args.index >= cells.length) throw new UsageError(`--index: expected a whole number from 0 to ${cells.length - 1}, got '${args.index}'`);
  const cell = cells[args.index];
  const policy = sweepPolicy(sweep.plugins, cell.collect.policy);
  return { cell, policy, source: { kind: 'cell', config, index: cell.index, cell: cell.id, learner: cell.learner.name }, configNoise: cell.noise };
}

/**
 * The corruptions `--noise` asks for, each checked by the one validation of noise
 * settings. A severity takes the parameter the cell's own noise entry gives it (explicit
 * parameters included), else the severity table's.
 */
function parseNoise(text: string | undefined, configNoise: readonly NoiseSpec[]): RecordedNoise[] {
  if (text == null) return [];
  return text.split(',').map((item, i, items) => {
    const parts = item.trim().split(':');
    const severity = Number(parts[2]);
    if (parts.length !== 3 || !/^\d+$/.test(parts[2])) throw new UsageError(`--noise: expected CHANNEL:KIND:SEVERITY (e.g. sight:gaussian:3), got '${item}'`);
    if (severity === 0) throw new UsageError(`--noise '${item}': severity 0 is the clean input; give 1 or more`);
    const [channel, kind] = parts;
    const own = configNoise.find((spec) => spec.channel === channel && spec.kind === kind && spec.severities.includes(severity));
    const problems = noiseProblems([own ?? { channel, kind, severities: [severity] }]);
    if (problems.length > 0) {
      const key = problems[0].path[2]; // noise.0.<key>...
      throw new UsageError(`--noise '${item}': ${key === 'severities' ? 'severity' : String(key)}: ${problems[0].message}`);
    }
    if (items.findIndex((other) => other.trim().split(':')[0] === channel) < i) throw new UsageError(`--noise: ${channel} is listed twice; a channel takes one corruption`);
    const parameter = own == null ? severityParameter(kind as NoiseKind, severity) : noiseParameter(own, own.severities.indexOf(severity));
    return { channel: channel as ChannelName, kind: kind as NoiseKind, severity, parameter };
  });
}

function checkOut(out: string): void {
  if (!existsSync(dirname(out))) throw new UsageError(`--out: the folder ${dirname(out)} does not exist`);
  if (existsSync(out)) throw new UsageError(`--out: ${out} already exists; give a new folder`);
}

/** `crosswise record`: experience as .npy arrays and a manifest (see record-usage.ts). */
export async function recordCommand(args: readonly string[]): Promise<number> {
  return runAction(recordUsage, args, async ({ operands: [world], values }) => {
    const { cell, source, configNoise } = chooseSource(world, values);
    const noise = parseNoise(values.noise, configNoise);
    const out = resolve(values.out);
    checkOut(out);
    const recording = makeRecording({ cell, source, noise });
    if (noise.length > 0 && !recording.split.includes(SPLIT_NAMES.indexOf('test'))) {
      throw new UsageError(`--noise: the recording has no test steps to corrupt (${cell.collect.steps} steps make too few episodes of ${cell.collect.episodeSteps})`);
    }
    const files = recordingFiles(recording);
    writeFolderAtomic(out, join(dirname(out), `.${basename(out)}.partial-${process.pid}-${randomUUID()}`), files);
    console.log(summary(out, recording, files));
    return EXIT.success;
  });
}

function summary(out: string, recording: Recording, files: Readonly<Record<string, string | Uint8Array>>): string {
  const { manifest } = recording;
  const bytes = Object.values(files).reduce((sum, f) => sum + (typeof f === 'string' ? Buffer.byteLength(f) : f.length), 0);
  const counts = SPLIT_NAMES.map((name, k) => `${name} ${recording.split.filter((s) => s === k).length}`).join(', ');
  const from = manifest.source.kind === 'cell' ? `cell ${manifest.source.index} [${manifest.source.cell}]: ` : '';
  const noise = manifest.noise.map((n) => `${n.channel} ${n.kind} ${n.severity}`).join(', ');
  return `wrote ${out}: ${manifest.steps} steps of ${manifest.world.name} (${from}${manifest.collect.policy}, seed ${manifest.seed}), `
    + `${Object.keys(files).length} files, ${(bytes / 1e6).toFixed(1)} MB; steps per split: ${counts}`
    + (noise === '' ? '' : `; test steps corrupted: ${noise}`);
}
