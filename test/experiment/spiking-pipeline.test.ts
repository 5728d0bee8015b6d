import { execFile } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';
import { describe, expect, it } from 'vitest';
import { parseTrainCsv } from '../../src/results/train-table.js';

const ROOT = fileURLToPath(new URL('../../', import.meta.url));
const crosswise = (...args: string[]) => promisify(execFile)(process.execPath, [join(ROOT, 'bin/crosswise.js'), ...args], { cwd: ROOT });

// A spiking learner with rate-coded input (the one random draw in a feature) through the real pipeline.
const CONFIG = `name: tiny-spiking
world: ${join(ROOT, 'worlds/greenhouse.yaml')}
seeds: [7]
collect: { steps: 800, episode_steps: 50 }
learners:
  - { name: spiking-sound-from-sight, objective: predict, input: [sight], target: [sound], rule: feedback-alignment,
      encoder: { kind: spiking, hidden: [8], steps: 4, input_coding: poisson }, train: { epochs: 2, batch: 64 } }
probe: { targets: [wall_ahead, nearest_distance_m] }
noise:
  - { channel: sight, kind: gaussian, severities: [0, 3] }
`;

describe('a spiking learner in the production cell pipeline', () => {
  it('stores bit-identical scores and test features when its cell runs twice in separate processes, and its firing in train.csv', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'crosswise-spiking-'));
    writeFileSync(join(dir, 'config.yaml'), CONFIG);
    const [first] = await Promise.all(['a', 'b'].map((out) => crosswise('cell', join(dir, 'config.yaml'), '--index', '0', '--out', join(dir, out))));
    const id = /\(([0-9a-f]{10})\)/.exec(first.stdout)?.[1] ?? '';
    const read = (out: string, file: string) => readFileSync(join(dir, out, 'cells', id, file));
    expect(read('a', 'scores.csv').equals(read('b', 'scores.csv'))).toBe(true);
    expect(read('a', 'test_features.npy').equals(read('b', 'test_features.npy'))).toBe(true);
    const log = parseTrainCsv(read('a', 'train.csv').toString('utf8'), 'train.csv');
    expect(log).toHaveLength(2);
    expect(log[1].firing?.rateHz).toHaveLength(1);
    expect(log[1].alignmentDeg).toHaveLength(2); // W_1 and the head, against backprop through time
  });
});
