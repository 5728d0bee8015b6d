import { execFile } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';
import { describe, expect, it } from 'vitest';
import { parseCellRecord } from '../../src/results/cell-record.js';
import { parseResultsCsv, type ResultRow } from '../../src/results/results-table.js';
import { AUTOENCODER, FA_RULE, IDENTITY_NOISE, NAN_OBJECTIVE, pluginFolder, THROWING_RULE, UNIFORM_POLICY, WIDTH_HELPER } from './plugin-files.js';

// Plug-ins through the real collect–train–probe pipeline, run by the built CLI: a sweep on
// two worker threads, and single cells as a cluster array task runs them. The reference is
// the built-ins themselves: a plug-in file that spells out a built-in must give its numbers
// bit for bit (same streams, same kernels), which shows the two share one interface.

const ROOT = fileURLToPath(new URL('../../', import.meta.url));
const crosswise = async (...args: string[]): Promise<{ code: number; stdout: string; stderr: string }> => {
  try {
    const { stdout, stderr } = await promisify(execFile)(process.execPath, [join(ROOT, 'bin/crosswise.js'), ...args], { cwd: ROOT });
    return { code: 0, stdout, stderr };
  } catch (error) {
    const { code, stdout, stderr } = error as { code: number; stdout: string; stderr: string };
    return { code, stdout, stderr };
  }
};

const tiny = (learners: string, extra = '') => `name: plugins
world: ${join(ROOT, 'worlds/greenhouse.yaml')}
seeds: [3]
collect: { steps: 800, episode_steps: 50${extra} }
learners:
${learners}probe: { targets: [wall_ahead, nearest_distance_m] }
noise:
  - { channel: sight, kind: gaussian, severities: [0, 3] }
  - { channel: sight, kind: ./unchanged.cjs, severities: [0, 3] }
`;
const learner = (name: string, parts: string) => `  - { name: ${name}, input: [sight], encoder: { hidden: [8] }, train: { epochs: 2, batch: 64 }, ${parts} }\n`;

/** The measured part of each row (what a plug-in copy must reproduce): target, noise, severity, metric, value. */
function measured(rows: readonly ResultRow[]): string[] {
  return rows.map((r) => [r.target, r.channel, r.kind, r.severity, r.parameter, r.measure, r.metric, r.value].join(','));
}

function rowsOf(out: string, learnerName: string): ResultRow[] {
  return parseResultsCsv(readFileSync(join(out, 'results.csv'), 'utf8')).rows.filter((r) => r.learner === learnerName);
}

describe('plug-ins in cells', () => {
  it('that spell out built-ins give the built-ins\' scores bit for bit, on worker threads and in a single-cell task', async () => {
    const config = tiny(
      learner('fa-built-in', 'objective: predict, target: [sound], rule: feedback-alignment')
      + learner('fa-file', 'objective: predict, target: [sound], rule: ./fa.js')
      + learner('ae-built-in', 'objective: reconstruct')
      + learner('ae-file', 'objective: ./ae.ts'),
    );
    const dir = pluginFolder(config, { 'fa.js': FA_RULE, 'ae.ts': AUTOENCODER, 'width.ts': WIDTH_HELPER, 'unchanged.cjs': IDENTITY_NOISE });
    const out = join(dir, 'sweep');
    const [sweep, task] = await Promise.all([
      crosswise('run', join(dir, 'config.yaml'), '--out', out, '--jobs', '2', '--plain'),
      crosswise('cell', join(dir, 'config.yaml'), '--index', '1', '--out', join(dir, 'task')),
    ]);
    expect(sweep.stdout).toContain('sweep done: 4 done, 0 failed');
    expect(task.code).toBe(0);
    expect(measured(rowsOf(out, 'fa-file'))).toEqual(measured(rowsOf(out, 'fa-built-in')));
    expect(measured(rowsOf(out, 'ae-file'))).toEqual(measured(rowsOf(out, 'ae-built-in')));
    const faFile = rowsOf(out, 'fa-file');
    expect(faFile[0]).toMatchObject({ objective: 'predict', rule: 'fa-file' }); // results show the plug-in's name
    // The noise kind that changes nothing scores every severity as clean.
    const unchanged = faFile.filter((r) => r.kind === 'unchanged');
    expect(unchanged.filter((r) => r.severity === 3).map((r) => r.value)).toEqual(unchanged.filter((r) => r.severity === 0).map((r) => r.value));
    // The single-cell task stores the same scores, and both record the plug-ins they ran.
    const id = faFile[0].cell;
    expect(readFileSync(join(dir, 'task', 'cells', id, 'scores.csv'), 'utf8')).toBe(readFileSync(join(out, 'cells', id, 'scores.csv'), 'utf8'));
    const record = parseCellRecord(readFileSync(join(out, 'cells', id, 'cell.json'), 'utf8'), 'cell.json');
    expect(record.plugins?.map((p) => [p.type, p.name, p.path])).toEqual([['noise', 'unchanged', join(dir, 'unchanged.cjs')], ['rule', 'fa-file', join(dir, 'fa.js')]]);
    expect(record.identity.plugins?.rule).toBe(record.plugins?.[1].sha256);
  }, 600_000); // CLI sweeps on a busy machine

  it('take a policy from a file: a copy of uniform collects the same experience', async () => {
    const learners = learner('ae', 'objective: reconstruct');
    const files = { 'uniform.js': UNIFORM_POLICY, 'unchanged.cjs': IDENTITY_NOISE };
    const built = pluginFolder(tiny(learners, ', policy: uniform'), files);
    const file = pluginFolder(tiny(learners, ', policy: ./uniform.js'), files);
    await Promise.all([built, file].map((dir) => crosswise('run', join(dir, 'config.yaml'), '--out', join(dir, 'out'), '--plain')));
    expect(measured(rowsOf(join(file, 'out'), 'ae'))).toEqual(measured(rowsOf(join(built, 'out'), 'ae')));
  }, 600_000);

  it('fail only their own cells, with a reason naming the plug-in file, when they throw or give a non-finite loss', async () => {
    const config = tiny(learner('fine', 'objective: reconstruct') + learner('throws', 'objective: reconstruct, rule: ./unfinished.js') + learner('nan', 'objective: ./nan.js'));
    const dir = pluginFolder(config, { 'unfinished.js': THROWING_RULE, 'nan.js': NAN_OBJECTIVE, 'unchanged.cjs': IDENTITY_NOISE });
    const run = await crosswise('run', join(dir, 'config.yaml'), '--out', join(dir, 'out'), '--jobs', '2', '--plain');
    expect(run.code).toBe(3);
    expect(run.stdout).toContain('sweep done: 1 done, 2 failed');
    const reasons = readFileSync(join(dir, 'out', 'plan.csv'), 'utf8').trim().split('\n').slice(1).map((line) => {
      const id = line.split(',')[1];
      return parseCellRecord(readFileSync(join(dir, 'out', 'cells', id, 'cell.json'), 'utf8'), 'cell.json').reason;
    });
    expect(reasons).toEqual([
      '',
      `rule plug-in ${join(dir, 'unfinished.js')}: deltas are not written yet`,
      `LearnerDivergedError: learner 'nan': train loss became NaN at epoch 1 (objective plug-in ${join(dir, 'nan.js')})`,
    ]);
  }, 600_000);
});

