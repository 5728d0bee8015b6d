import { execFile, spawn } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';
import { describe, expect, it } from 'vitest';
import { decodeNpy } from '../../src/results/npy.js';
import { parseResultsCsv } from '../../src/results/results-table.js';

const ROOT = fileURLToPath(new URL('../../', import.meta.url));
const crosswise = (...args: string[]) => promisify(execFile)(process.execPath, [join(ROOT, 'bin/crosswise.js'), ...args], { cwd: ROOT });

// The real collect–train–probe pipeline on a tiny sweep: two learners, one seed.
const CONFIG = `name: tiny
world: ${join(ROOT, 'worlds/greenhouse.yaml')}
seeds: [7]
collect: { steps: 800, episode_steps: 50 }
learners:
  - { name: sound-from-sight, objective: predict, input: [sight], target: [sound], encoder: { hidden: [8] }, train: { epochs: 2, batch: 64 }, save_features: true }
  - { name: sight-autoencoder, objective: reconstruct, input: [sight], encoder: { hidden: [8] }, train: { epochs: 2, batch: 64 } }
probe: { targets: [wall_ahead, nearest_distance_m], baseline: sight-autoencoder }
noise:
  - { channel: sight, kind: gaussian, severities: [0, 3] }
`;

describe('the production cell pipeline', () => {
  it('runs a sweep end to end, and one cell alone in another process stores the same scores', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'crosswise-pipeline-'));
    writeFileSync(join(dir, 'config.yaml'), CONFIG);
    const [sweep, alone] = await Promise.all([
      crosswise('run', join(dir, 'config.yaml'), '--out', join(dir, 'sweep'), '--jobs', '2', '--plain'),
      crosswise('cell', join(dir, 'config.yaml'), '--index', '0', '--out', join(dir, 'alone')),
    ]);
    expect(sweep.stdout).toContain('sweep done: 2 done, 0 failed');
    expect(alone.stdout).toMatch(/done sound-from-sight seed 7/);
    const results = readFileSync(join(dir, 'sweep', 'results.csv'), 'utf8').trim().split('\n');
    // 2 learners × ((wall_ahead: accuracy + chance, nearest_distance_m: r2, cka) × 2 severities
    // + (noisy, drop, area) × 2 targets), plus the header.
    expect(results.length).toBe(1 + 2 * (4 * 2 + 3 * 2));
    expect(existsSync(join(dir, 'sweep', 'summary.md'))).toBe(true);
    // The parameter column holds σ of the severity table (src/noise/severity.ts): 0 clean, 1 at severity 3.
    const table = parseResultsCsv(results.join('\n'));
    expect([...new Set(table.rows.map((r) => `${r.severity}:${r.parameter}:${r.measure}`))]).toEqual(['0:0:score', '3:1:score', 'null:null:noisy', 'null:null:drop', 'null:null:area']);
    const id = results[1].split(',')[0];
    const scores = (out: string) => readFileSync(join(dir, out, 'cells', id, 'scores.csv'), 'utf8');
    expect(scores('alone')).toBe(scores('sweep'));
    const features = decodeNpy(readFileSync(join(dir, 'sweep', 'cells', id, 'features.npy')));
    expect(features.shape).toEqual([800, 8]);
    const latents = decodeNpy(readFileSync(join(dir, 'sweep', 'cells', id, 'latents.npy')));
    expect(latents.shape).toEqual([800, 12]);
    const record = JSON.parse(readFileSync(join(dir, 'sweep', 'cells', id, 'cell.json'), 'utf8')) as { versions: Record<string, string> };
    expect(record.versions.tfjs).toBe('4.22.0');
  });

  it('resumes a SIGKILLed sweep with --jobs 1 to the same results.csv as an uninterrupted --jobs 2 run', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'crosswise-resume-'));
    writeFileSync(join(dir, 'config.yaml'), CONFIG);
    const config = join(dir, 'config.yaml');
    const whole = crosswise('run', config, '--out', join(dir, 'whole'), '--jobs', '2', '--plain');
    const killed = await new Promise<string>((resolve) => {
      const child = spawn(process.execPath, [join(ROOT, 'bin/crosswise.js'), 'run', config, '--out', join(dir, 'killed'), '--jobs', '1', '--plain'], { cwd: ROOT });
      let stdout = '';
      child.stdout.on('data', (chunk: Buffer) => {
        stdout += chunk.toString();
        if (stdout.includes('] done ')) child.kill('SIGKILL');
      });
      child.on('close', () => resolve(stdout));
    });
    expect(killed).not.toContain('sweep done');
    const stored = readdirSync(join(dir, 'killed', 'cells')).filter((name) => !name.startsWith('.'));
    expect(stored).toHaveLength(1);
    const resumed = await crosswise('run', config, '--out', join(dir, 'killed'), '--jobs', '1', '--plain');
    expect(resumed.stdout).toContain('2 cells, 1 already finished');
    await whole;
    expect(readFileSync(join(dir, 'killed', 'results.csv'), 'utf8')).toBe(readFileSync(join(dir, 'whole', 'results.csv'), 'utf8'));
  });
});
