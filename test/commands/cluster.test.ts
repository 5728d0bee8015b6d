// crosswise cluster: the job-array script is read as text and run with bash against a
// stand-in for sbatch that records its arguments. The forms of --array, --dependency,
// --output and #SBATCH lines follow the sbatch manual (SchedMD, sbatch(1)).
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { clusterCommand } from '../../src/commands/cluster.js';
import { SHED_WORLD, configFolder } from '../experiment/helpers.js';
import { capture, EIGHT_CELLS, fakeSbatch, storeCells } from './cluster-helpers.js';

/** Runs the script as a user would (bash, outside any job) with the fake sbatch first on PATH. */
function submit(script: string, bin: string): string {
  return execFileSync('bash', [script], { env: { ...process.env, PATH: `${bin}:${process.env.PATH}`, SLURM_JOB_ID: '' }, encoding: 'utf8' });
}

/** The `#SBATCH` lines of a script, in order. */
function sbatchLines(script: string): string[] {
  return readFileSync(script, 'utf8').split('\n').filter((line) => line.startsWith('#SBATCH'));
}

/** A config of `seeds` seeds × 2 learners in a fresh folder. */
function seedsConfig(seeds: number): string {
  const list = Array.from({ length: seeds }, (_, i) => i + 1).join(', ');
  return configFolder(EIGHT_CELLS.replace('seeds: [1, 2]', `seeds: [${list}]`).replace(/vary:\n.*\n/, ''));
}

describe('crosswise cluster', () => {
  afterEach(() => vi.restoreAllMocks());

  it('with nothing stored, submits one array over every cell, then a report job that waits for all of it', async () => {
    const dir = configFolder(EIGHT_CELLS);
    const out = join(dir, 'out');
    const { out: lines } = capture();
    expect(await clusterCommand([join(dir, 'config.yaml'), '--out', out])).toBe(0);
    const script = join(out, 'array-job.sh');
    expect(lines).toEqual([
      '8 cells: 0 done, 0 failed, 8 missing',
      `wrote ${script}: 8 cells to run (0-7) in 1 job array`,
      `submit with: bash '${script}'`,
    ]);
    execFileSync('bash', ['-n', script]); // throws on a syntax error
    expect(statSync(script).mode & 0o111).not.toBe(0);
    const sbatch = fakeSbatch(dir);
    expect(submit(script, sbatch.bin)).toBe('submitted 8 cells as job array 101; the report (job 102) runs once they have all ended\n');
    expect(sbatch.calls()).toEqual([
      ['--parsable', '--array=0-7', `--output=${out}/logs/cell-%a.out`, script, 'cells', '0'],
      ['--parsable', '--dependency=afterany:101', '--job-name=crosswise-cluster-test-report', `--output=${out}/logs/report.out`, script, 'report'],
    ]);
    expect(existsSync(join(out, 'logs'))).toBe(true);
  });

  it('covers only the missing cells, leaves failed ones out and says how many of each there are', async () => {
    const dir = configFolder(EIGHT_CELLS);
    const out = join(dir, 'out');
    await storeCells(join(dir, 'config.yaml'), out, { done: [0, 1, 5], failed: [4] });
    const { out: lines } = capture();
    expect(await clusterCommand([join(dir, 'config.yaml'), '--out', out])).toBe(0);
    const script = join(out, 'array-job.sh');
    expect(lines).toEqual([
      '8 cells: 3 done, 1 failed, 4 missing',
      'left out: 1 failed cell (4); add --retry-failed to include failed cells',
      `wrote ${script}: 4 cells to run (2-3,6-7) in 1 job array`,
      `submit with: bash '${script}'`,
    ]);
    const sbatch = fakeSbatch(dir);
    submit(script, sbatch.bin);
    expect(sbatch.calls()[0][1]).toBe('--array=2-3,6-7');
    expect(readFileSync(script, 'utf8')).toContain('cell "$CONFIG" --index "$(($2 + SLURM_ARRAY_TASK_ID))" --out "$OUT"\n');
  });

  it('with --retry-failed covers failed cells too, and its tasks run them again', async () => {
    const dir = configFolder(EIGHT_CELLS);
    const out = join(dir, 'out');
    await storeCells(join(dir, 'config.yaml'), out, { done: [0, 1, 5], failed: [4] });
    const { out: lines } = capture();
    expect(await clusterCommand([join(dir, 'config.yaml'), '--out', out, '--retry-failed'])).toBe(0);
    expect(lines[1]).toBe(`wrote ${join(out, 'array-job.sh')}: 5 cells to run (2-4,6-7) in 1 job array`);
    expect(readFileSync(join(out, 'array-job.sh'), 'utf8')).toContain('--out "$OUT" --retry-failed\n');
  });

  it('when no cell is missing, says so, writes no script and exits 0', async () => {
    const dir = configFolder(EIGHT_CELLS);
    const out = join(dir, 'out');
    await storeCells(join(dir, 'config.yaml'), out, { done: [0, 1, 2, 3, 5, 6, 7], failed: [4] });
    const { out: lines } = capture();
    expect(await clusterCommand([join(dir, 'config.yaml'), '--out', out])).toBe(0);
    expect(lines).toEqual([
      '8 cells: 7 done, 1 failed, 0 missing',
      'left out: 1 failed cell (4); add --retry-failed to include failed cells',
      'nothing to submit: no script written',
    ]);
    expect(existsSync(join(out, 'array-job.sh'))).toBe(false);
  });

  it('splits 2,000 cells into two arrays whose task indices stay below the default MaxArraySize of 1001', async () => {
    // Slurm's default MaxArraySize is 1001, so task indices run 0–1000 (slurm.conf(5)).
    const dir = seedsConfig(1000);
    const out = join(dir, 'out');
    const { out: lines } = capture();
    expect(await clusterCommand([join(dir, 'config.yaml'), '--out', out])).toBe(0);
    expect(lines[1]).toBe(`wrote ${join(out, 'array-job.sh')}: 2000 cells to run (0-1999) in 2 job arrays`);
    const sbatch = fakeSbatch(dir);
    expect(submit(join(out, 'array-job.sh'), sbatch.bin)).toBe('submitted 2000 cells as job arrays 101 102; the report (job 103) runs once they have all ended\n');
    const [first, second, report] = sbatch.calls();
    // The second array's task i runs cell 1000 + i and logs to cell-1%3a.out: cell-1000.out … cell-1999.out.
    expect(first.slice(1, 3)).toEqual(['--array=0-999', `--output=${out}/logs/cell-%a.out`]);
    expect(first.slice(-2)).toEqual(['cells', '0']);
    expect(second.slice(1, 3)).toEqual(['--array=0-999', `--output=${out}/logs/cell-1%3a.out`]);
    expect(second.slice(-2)).toEqual(['cells', '1000']);
    expect(report[1]).toBe('--dependency=afterany:101:102');
  });

  it('with --max-array-size 10, cuts the missing cells into blocks of ten; --max-parallel chains the arrays so the cap holds overall', async () => {
    const dir = seedsConfig(15);
    const out = join(dir, 'out');
    const missing = new Set([3, 11, 12, 27]);
    await storeCells(join(dir, 'config.yaml'), out, { done: Array.from({ length: 30 }, (_, i) => i).filter((i) => !missing.has(i)) });
    capture();
    expect(await clusterCommand([join(dir, 'config.yaml'), '--out', out, '--max-array-size', '10', '--max-parallel', '2'])).toBe(0);
    const sbatch = fakeSbatch(dir);
    submit(join(out, 'array-job.sh'), sbatch.bin);
    expect(sbatch.calls().map((call) => call.filter((arg) => /^--(array|dependency|output)=/.test(arg) || /^\d+$/.test(arg)))).toEqual([
      ['--array=3%2', `--output=${out}/logs/cell-%a.out`, '0'],
      ['--array=1-2%2', '--dependency=afterany:101', `--output=${out}/logs/cell-1%1a.out`, '10'],
      ['--array=7%2', '--dependency=afterany:102', `--output=${out}/logs/cell-2%1a.out`, '20'],
      ['--dependency=afterany:101:102:103', `--output=${out}/logs/report.out`],
    ]);
  });

  it('writes --time, --mem, --partition and --account as #SBATCH lines and --max-parallel as the %K of --array', async () => {
    const dir = configFolder(EIGHT_CELLS);
    const out = join(dir, 'out');
    capture();
    expect(await clusterCommand([join(dir, 'config.yaml'), '--out', out, '--time', '1-12:00:00', '--mem', '4G', '--partition', 'short,long', '--account', 'lab-7', '--max-parallel', '3'])).toBe(0);
    expect(sbatchLines(join(out, 'array-job.sh'))).toEqual([
      '#SBATCH --job-name=crosswise-cluster-test',
      '#SBATCH --cpus-per-task=1',
      '#SBATCH --time=1-12:00:00',
      '#SBATCH --mem=4G',
      '#SBATCH --partition=short,long',
      '#SBATCH --account=lab-7',
    ]);
    const sbatch = fakeSbatch(dir);
    submit(join(out, 'array-job.sh'), sbatch.bin);
    expect(sbatch.calls()[0][1]).toBe('--array=0-7%3');
  });

  it.each([
    ['--time', '2h', "crosswise cluster: --time: expected minutes, hours:minutes:seconds or days-hours[:minutes[:seconds]], e.g. 2:00:00; got '2h'"],
    ['--mem', '4 GB', "crosswise cluster: --mem: expected a whole number with an optional unit K, M, G or T (megabytes without one), e.g. 4G; got '4 GB'"],
    ['--partition', 'short long', "crosswise cluster: --partition: expected partition names of letters, digits, '.', '_' or '-', separated by commas; got 'short long'"],
    ['--account', "lab'7", "crosswise cluster: --account: expected an account name of letters, digits, '.', '_' or '-'; got 'lab'7'"],
    ['--max-parallel', '0', "crosswise cluster: --max-parallel: expected a whole number ≥ 1, got '0'"],
  ])('refuses %s %s in one line, exits 1 and writes nothing', async (option, value, message) => {
    const dir = configFolder(EIGHT_CELLS);
    const { err } = capture();
    expect(await clusterCommand([join(dir, 'config.yaml'), '--out', join(dir, 'out'), option, value])).toBe(1);
    expect(err).toEqual([message]);
    expect(existsSync(join(dir, 'out'))).toBe(false);
  });

  it('quotes every path: a folder named with a space and a quote reaches sbatch and each task intact', async () => {
    const dir = join(mkdtempSync(join(tmpdir(), 'crosswise-cluster-')), "it's a run");
    mkdirSync(dir);
    writeFileSync(join(dir, 'world.yaml'), SHED_WORLD);
    writeFileSync(join(dir, 'config.yaml'), EIGHT_CELLS);
    const out = join(dir, 'the "out" folder');
    capture();
    expect(await clusterCommand([join(dir, 'config.yaml'), '--out', out])).toBe(0);
    const script = join(out, 'array-job.sh');
    const sbatch = fakeSbatch(dir);
    submit(script, sbatch.bin);
    expect(sbatch.calls()[0].slice(2)).toEqual([`--output=${out}/logs/cell-%a.out`, script, 'cells', '0']);
    expect(sbatch.calls()[1].slice(3)).toEqual([`--output=${out}/logs/report.out`, script, 'report']);
    // Inside a task, crosswise gets the config and the folder as single arguments: a stand-in records them.
    const recorder = join(dir, 'record-args.cjs');
    writeFileSync(recorder, 'console.log(JSON.stringify(process.argv.slice(2)));\n');
    const taskScript = join(dir, 'task.sh');
    writeFileSync(taskScript, readFileSync(script, 'utf8').replace(/^CROSSWISE=.*$/m, `CROSSWISE='${recorder.replace(/'/g, `'\\''`)}'`));
    const task = (...args: string[]) => JSON.parse(execFileSync('bash', [taskScript, ...args], { env: { ...process.env, SLURM_ARRAY_TASK_ID: '4' }, encoding: 'utf8' })) as string[];
    expect(task('cells', '0')).toEqual(['cell', join(dir, 'config.yaml'), '--index', '4', '--out', out]);
    expect(task('cells', '1000')).toEqual(['cell', join(dir, 'config.yaml'), '--index', '1004', '--out', out]);
    expect(task('report')).toEqual(['report', out]);
  });

  it('refuses to submit from inside a job (the script given to sbatch instead of bash)', async () => {
    const dir = configFolder(EIGHT_CELLS);
    capture();
    expect(await clusterCommand([join(dir, 'config.yaml'), '--out', join(dir, 'out')])).toBe(0);
    const run = spawnSync('bash', [join(dir, 'out', 'array-job.sh')], { env: { ...process.env, SLURM_JOB_ID: '7' }, encoding: 'utf8' });
    expect([run.status, run.stderr]).toEqual([1, 'run this script with bash, not sbatch\n']);
  });
});
