import type { Sweep } from './resolved-config.js';

/** Paths the job-array script needs, all absolute. */
export interface ClusterPaths {
  readonly crosswise: string;
  readonly config: string;
  readonly out: string;
}

/**
 * A bash script for a Slurm-style scheduler: run outside a job, it submits itself as a
 * job array with one task per cell and then a report step that waits for every task;
 * inside an array task it runs the cell numbered by SLURM_ARRAY_TASK_ID.
 */
export function clusterScript(sweep: Sweep, cellCount: number, paths: ClusterPaths): string {
  const job = `crosswise-${sweep.name}`;
  return `#!/usr/bin/env bash
# Sweep '${sweep.name}' as a cluster job array: ${cellCount} cells, one array task each, then the report.
# Submit with: bash ${quote(`${paths.out}/array-job.sh`)}
# Each task stores one finished cell under cells/; rerunning skips finished cells.
#SBATCH --job-name=${job}
#SBATCH --array=0-${cellCount - 1}
#SBATCH --cpus-per-task=1
#SBATCH --output=${paths.out}/logs/cell-%a.out
set -euo pipefail
CROSSWISE=${quote(paths.crosswise)}
CONFIG=${quote(paths.config)}
OUT=${quote(paths.out)}

if [ -z "\${SLURM_ARRAY_TASK_ID:-}" ]; then
  mkdir -p "$OUT/logs"
  cells_job=$(sbatch --parsable "$0")
  sbatch --dependency=afterany:"$cells_job" --job-name=${job}-report --output="$OUT/logs/report.out" \\
    --wrap "node \\"$CROSSWISE\\" report \\"$OUT\\""
  echo "submitted ${cellCount} cells as job $cells_job; the report runs once they have all ended"
  exit 0
fi

node "$CROSSWISE" cell "$CONFIG" --index "$SLURM_ARRAY_TASK_ID" --out "$OUT"
`;
}

/** A single-quoted shell word. */
function quote(text: string): string {
  return `'${text.replace(/'/g, `'\\''`)}'`;
}
