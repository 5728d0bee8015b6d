import { blockSize, compressIndices, type ArrayBlock } from './cluster-arrays.js';
import { requestLines, type ClusterRequest } from './cluster-request.js';

/** Paths the job-array script needs, all absolute. */
export interface ClusterPaths {
  readonly node: string;
  readonly crosswise: string;
  readonly config: string;
  readonly out: string;
}

/** Everything a job-array script is written from. */
export interface ClusterJob {
  readonly name: string;
  /** Cells in the sweep's plan. */
  readonly cellCount: number;
  /** The arrays to submit, covering exactly the cells to run (see arrayBlocks). */
  readonly blocks: readonly ArrayBlock[];
  readonly maxArraySize: number;
  readonly request: ClusterRequest;
  /** Tasks recompute cells that failed before. */
  readonly retryFailed: boolean;
  readonly paths: ClusterPaths;
}

/** The script's name in the output folder. */
export const SCRIPT_NAME = 'array-job.sh';

/** Slurm's default MaxArraySize (slurm.conf(5)): array task indices run from 0 to 1000. */
export const DEFAULT_MAX_ARRAY_SIZE = 1001;

const REWRITE_PREFIX = '# Rewrite for the cells still missing: ';

/**
 * A bash script for Slurm. Run with bash on a login node, it submits one job array per
 * block of cells (each task runs one cell with `crosswise cell`) and a report job that
 * starts once every array task has ended, whatever its outcome (afterany). Inside a job
 * it is called back with `cells OFFSET` or `report`.
 */
export function clusterScript(job: ClusterJob): string {
  const cells = job.blocks.flatMap((block) => block.tasks.map((task) => block.offset + task));
  const jobName = `crosswise-${job.name}`;
  const serial = job.request.maxParallel != null && job.blocks.length > 1;
  const submissions = job.blocks.map((block, i) => {
    const cap = job.request.maxParallel == null ? '' : `%${job.request.maxParallel}`;
    // With a cap on running tasks, each array waits for the one before, so the cap holds for the whole sweep.
    const after = serial && i > 0 ? ` --dependency=afterany:"$array${i - 1}"` : '';
    return `  array${i}=$(submit --array=${compressIndices(block.tasks)}${cap}${after} --output="$OUT/logs/${logPattern(block.offset, job.maxArraySize)}" "$0" cells ${block.offset})`;
  });
  const arrays = job.blocks.map((_, i) => `$array${i}`).join(':');
  return `#!/usr/bin/env bash
# Sweep '${job.name}' on a Slurm cluster: ${cells.length} of its ${job.cellCount} cells (${compressIndices(cells)}),
# one array task per cell in ${job.blocks.length === 1 ? 'one array' : `${job.blocks.length} arrays`}, then the report once every task has ended.
# Submit with bash (not sbatch): bash ${quote(`${job.paths.out}/${SCRIPT_NAME}`)}
# Task logs: logs/cell-<index>.out; the report's: logs/report.out.
${REWRITE_PREFIX}${clusterCommandLine(job.paths.config, job.paths.out, job.request, job.maxArraySize)}
#SBATCH --job-name=${jobName}
#SBATCH --cpus-per-task=1
${requestLines(job.request).map((line) => `${line}\n`).join('')}set -euo pipefail
NODE=${quote(job.paths.node)}
CROSSWISE=${quote(job.paths.crosswise)}
CONFIG=${quote(job.paths.config)}
OUT=${quote(job.paths.out)}

# sbatch --parsable prints "jobid" or "jobid;cluster".
submit() { local id; id=$(sbatch --parsable "$@"); echo "\${id%%;*}"; }

case "\${1:-submit}" in
submit)
  if [ -n "\${SLURM_JOB_ID:-}" ]; then echo "run this script with bash, not sbatch" >&2; exit 1; fi
  mkdir -p "$OUT/logs"
${submissions.join('\n')}
  report=$(submit --dependency=afterany:${arrays} --job-name=${jobName}-report --output="$OUT/logs/report.out" "$0" report)
  echo "submitted ${cells.length} cells as job array${job.blocks.length === 1 ? '' : 's'} ${arrays.replaceAll(':', ' ')}; the report (job $report) runs once they have all ended"
  ;;
cells)
  exec "$NODE" "$CROSSWISE" cell "$CONFIG" --index "$(($2 + SLURM_ARRAY_TASK_ID))" --out "$OUT"${job.retryFailed ? ' --retry-failed' : ''}
  ;;
report)
  exec "$NODE" "$CROSSWISE" report "$OUT"
  ;;
esac
`;
}

/**
 * Slurm's --output pattern that names a task's log after its cell: the block's prefix, then
 * the task id zero-padded to the block's digits (`%3a`, sbatch(1) "filename pattern").
 */
function logPattern(offset: number, maxArraySize: number): string {
  const size = blockSize(maxArraySize);
  if (offset === 0) return 'cell-%a.out';
  const digits = String(size).length - 1;
  return digits === 0 ? `cell-${offset}.out` : `cell-${offset / size}%${digits}a.out`;
}

/** The `crosswise cluster` command line that writes the script again for whatever is still missing. */
export function clusterCommandLine(config: string, out: string, request: ClusterRequest, maxArraySize: number): string {
  const words = ['crosswise', 'cluster', quote(config), '--out', quote(out)];
  for (const setting of ['time', 'mem', 'partition', 'account'] as const) {
    if (request[setting] != null) words.push(`--${setting}`, request[setting]);
  }
  if (request.maxParallel != null) words.push('--max-parallel', String(request.maxParallel));
  if (maxArraySize !== DEFAULT_MAX_ARRAY_SIZE) words.push('--max-array-size', String(maxArraySize));
  return words.join(' ');
}

/** The command line recorded in a script's text by clusterScript, or null when it holds none. */
export function recordedCommandLine(script: string): string | null {
  const line = script.split('\n').find((l) => l.startsWith(REWRITE_PREFIX));
  return line == null ? null : line.slice(REWRITE_PREFIX.length);
}

/** A single-quoted shell word: safe for any text, including spaces and quotes. */
export function quote(text: string): string {
  return `'${text.replace(/'/g, `'\\''`)}'`;
}
