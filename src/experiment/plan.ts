import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import type { BackendName, LearnerSpec } from '../learn/spec.js';
import type { NoiseSpec } from '../noise/spec.js';
import type { SenseSettings } from '../senses/channel.js';
import { cellId, cellIdentity, type CellSettings, type PluginHashes } from '../results/cell-identity.js';
import { pluginBundlePath } from '../results/layout.js';
import type { Plan } from '../results/plan-table.js';
import type { CollectSettings, OutputSettings, ProbeSettings } from './defaults.js';
import type { CellLabel } from './events.js';
import type { PluginRef } from './plugin-catalog.js';
import type { Sweep } from './resolved-config.js';

/** A plug-in as a planned cell carries it: where its source is and where its bundled script is kept. */
export interface PlannedPlugin extends PluginRef {
  /** Absolute path of the bundled script in the output folder (pluginBundlePath). */
  readonly bundle: string;
}

/** Everything one cell needs, self-contained so it can be sent to a worker or another machine. */
export interface PlannedCell {
  readonly index: number;
  /** The hash of what determines the cell's numbers (cellId in src/results/cell-identity.ts). */
  readonly id: string;
  readonly seed: number;
  readonly vary: Readonly<Record<string, string>>;
  readonly learner: LearnerSpec;
  /** What the cell records beside its numbers; not part of its id. */
  readonly output: OutputSettings;
  readonly world: { readonly path: string; readonly sha256: string };
  readonly backend: BackendName;
  readonly collect: CollectSettings;
  readonly senses: SenseSettings;
  readonly probe: ProbeSettings;
  readonly noise: readonly NoiseSpec[];
  /** The plug-ins the cell's objective, rule, policy and noise kinds come from; empty when all are built in. */
  readonly plugins: readonly PlannedPlugin[];
}

/**
 * The sweep's cells: combinations of vary values (first key slowest) × seeds × learners.
 * Learners of one seed sit next to each other, so they run close together in time.
 */
export function planCells(sweep: Sweep): PlannedCell[] {
  const worldHashes = new Map<string, string>();
  const hashWorld = (path: string) => {
    if (!worldHashes.has(path)) worldHashes.set(path, createHash('sha256').update(readFileSync(path)).digest('hex'));
    return worldHashes.get(path) as string;
  };
  const cells: PlannedCell[] = [];
  for (const { vary, settings } of sweep.combinations) {
    for (const seed of sweep.seeds) {
      for (const { spec, output, plugins } of settings.learners) {
        const cell = {
          seed,
          vary,
          learner: spec,
          output,
          world: { path: settings.worldPath, sha256: hashWorld(settings.worldPath) },
          backend: sweep.backend,
          collect: settings.collect,
          senses: settings.senses,
          probe: settings.probe,
          noise: settings.noise,
          plugins: [...settings.plugins, ...plugins].map((ref) => ({ ...ref, bundle: pluginBundlePath(sweep.out, ref.name, ref.sha256) })),
        };
        cells.push({ index: cells.length, id: cellId(cellIdentity(cellSettings(cell))), ...cell });
      }
    }
  }
  return cells;
}

/** The settings of a planned cell that determine its numbers (see cellIdentity). */
export function cellSettings(cell: Omit<PlannedCell, 'index' | 'id'>): CellSettings {
  return {
    learner: cell.learner,
    seed: cell.seed,
    worldSha256: cell.world.sha256,
    collect: cell.collect,
    senses: cell.senses,
    probeTargets: cell.probe.targets,
    noise: cell.noise,
    vary: cell.vary,
    ...(cell.plugins.length === 0 ? {} : { plugins: pluginHashes(cell.plugins) }),
  };
}

/** The content hash of each plug-in of a cell, by the part it plays. */
function pluginHashes(plugins: readonly PluginRef[]): PluginHashes {
  const of = (type: PluginRef['type']) => plugins.find((p) => p.type === type)?.sha256;
  const noise = plugins.filter((p) => p.type === 'noise');
  return {
    objective: of('objective'),
    rule: of('rule'),
    policy: of('policy'),
    noise: noise.length === 0 ? undefined : Object.fromEntries(noise.map((p) => [p.name, p.sha256])),
  };
}

/** The plan as plan.csv stores it. */
export function planTable(cells: readonly PlannedCell[], varyKeys: readonly string[]): Plan {
  return { varyKeys, entries: cells.map((cell) => ({ index: cell.index, cell: cell.id, learner: cell.learner.name, seed: cell.seed, vary: cell.vary })) };
}

/** The part of a cell the runner announces in its events. */
export function cellLabel(cell: PlannedCell): CellLabel {
  return { index: cell.index, id: cell.id, learner: cell.learner.name, seed: cell.seed, vary: cell.vary };
}
