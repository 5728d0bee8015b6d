import { writeFileAtomic } from '../results/atomic-file.js';
import { cellIdentity } from '../results/cell-identity.js';
import {
  armIdentity, armKey, experimentConflict, extendExperiment, formatExperimentRecord, otherFormatMessage, OutputBusyError, readFolderOwner,
  type ExperimentRecord,
} from '../results/experiment-record.js';
import { RESULTS_FORMAT_VERSION } from '../results/format-version.js';
import { outputPath } from '../results/layout.js';
import { cellSettings, type PlannedCell } from './plan.js';

/** The experiment a sweep's cells make up: its vary keys and one arm per learner and vary combination. */
export function sweepExperiment(cells: readonly PlannedCell[], varyKeys: readonly string[]): ExperimentRecord {
  const arms = new Map<string, ExperimentRecord['arms'][number]>();
  for (const cell of cells) {
    const arm = armIdentity(cellIdentity(cellSettings(cell)));
    if (!arms.has(armKey(arm))) arms.set(armKey(arm), arm);
  }
  return { format_version: RESULTS_FORMAT_VERSION, vary_keys: [...varyKeys], arms: [...arms.values()] };
}

/**
 * Checks that `out` may hold these cells, then records their experiment in experiment.json.
 * A folder of another experiment (an arm whose settings differ, other vary keys), of
 * another results format, or with an unreadable experiment.json is refused with an
 * OutputBusyError, unless `force`: then this experiment takes the folder over, and only
 * its own cells are ever read (the others' ids are not in its plan).
 */
export function claimOutput(out: string, cells: readonly PlannedCell[], varyKeys: readonly string[], force: boolean, warn: (line: string) => void): void {
  const current = sweepExperiment(cells, varyKeys);
  const owner = readFolderOwner(out);
  const refusal = owner.kind === 'other-format' ? `${otherFormatMessage(out, owner.version)} (or move this folder away, or --force to recompute into it)`
    : owner.kind === 'unreadable' ? `${out}: ${owner.reason}; use another --out, or --force to take the folder over`
      : owner.kind === 'experiment' ? conflict(out, owner.record, current)
        : null;
  if (refusal != null && !force) throw new OutputBusyError(refusal);
  if (refusal != null) warn(`${out}: taken over with --force; only this config's cells are read from now on`);
  const record = owner.kind === 'experiment' && refusal == null ? extendExperiment(owner.record, current) : current;
  writeFileAtomic(outputPath(out, 'experiment'), formatExperimentRecord(record));
}

function conflict(out: string, stored: ExperimentRecord, current: ExperimentRecord): string | null {
  const why = experimentConflict(stored, current);
  return why == null ? null : `${out} belongs to another experiment: ${why}. Adding seeds, learners or vary values extends a sweep; `
    + "changing the settings of existing ones is a new experiment: use another --out, or --force to take the folder over (only this config's cells are then read)";
}
