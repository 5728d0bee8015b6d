import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import type { BackendName, LearnerSpec } from '../learn/spec.js';
import type { NoiseSpec } from '../noise/spec.js';
import type { SenseSettings } from '../senses/channel.js';
import type { CollectSettings, ProbeSettings } from './defaults.js';
import type { CellLabel } from './events.js';
import type { Sweep } from './resolved-config.js';

/** Everything one cell needs, self-contained so it can be sent to a worker or another machine. */
export interface PlannedCell {
  readonly index: number;
  /** First 10 hex digits of the SHA-256 of the cell's settings (see cellId). */
  readonly id: string;
  readonly seed: number;
  readonly vary: Readonly<Record<string, string>>;
  readonly learner: LearnerSpec;
  readonly world: { readonly path: string; readonly sha256: string };
  readonly backend: BackendName;
  readonly collect: CollectSettings;
  readonly senses: SenseSettings;
  readonly probe: ProbeSettings;
  readonly noise: readonly NoiseSpec[];
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
      for (const learner of settings.learners) {
        const cell = {
          seed,
          vary,
          learner,
          world: { path: settings.worldPath, sha256: hashWorld(settings.worldPath) },
          backend: sweep.backend,
          collect: settings.collect,
          senses: settings.senses,
          probe: settings.probe,
          noise: settings.noise,
        };
        cells.push({ index: cells.length, id: cellId(cell), ...cell });
      }
    }
  }
  return cells;
}

/**
 * Short hash of what determines a cell's numbers: learner, seed, world content, collection,
 * senses, probe targets, noise, and its vary values. The backend, the world's file path and
 * the probe baseline (a reporting choice) are left out, so moving files or changing the
 * baseline does not invalidate finished cells.
 */
export function cellId(cell: Omit<PlannedCell, 'index' | 'id'>): string {
  const identity = {
    learner: cell.learner,
    seed: cell.seed,
    world: cell.world.sha256,
    collect: cell.collect,
    senses: cell.senses,
    probeTargets: cell.probe.targets,
    noise: cell.noise,
    vary: cell.vary,
  };
  return createHash('sha256').update(canonicalJson(identity)).digest('hex').slice(0, 10);
}

/** JSON with object keys sorted at every level, so equal settings always hash equally. */
export function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  if (value != null && typeof value === 'object') {
    const entries = Object.entries(value).filter(([, item]) => item !== undefined).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([key, item]) => `${JSON.stringify(key)}:${canonicalJson(item)}`).join(',')}}`;
  }
  return JSON.stringify(value);
}

/** The part of a cell the runner announces in its events. */
export function cellLabel(cell: PlannedCell): CellLabel {
  return { index: cell.index, id: cell.id, learner: cell.learner.name, seed: cell.seed, vary: cell.vary };
}
