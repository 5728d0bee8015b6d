// A sweep of 200 tiny cells (the test double does the work) must not grow in memory with
// the number of cells: the runner keeps one record per cell and streams the rest to disk.
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadSweep } from '../../src/experiment/config.js';
import { runSweep } from '../../src/experiment/runner.js';
import { FAKE_WORK, configFolder } from '../experiment/helpers.js';

const SEEDS = Array.from({ length: 100 }, (_, i) => i + 1);
const CONFIG = `name: many
world: world.yaml
seeds: [${SEEDS.join(', ')}]
learners:
  - { name: sound-from-sight, objective: predict, input: [sight], target: [sound], train: { epochs: 2 } }
  - { name: sight-autoencoder, objective: reconstruct, input: [sight], train: { epochs: 2 } }
noise:
  - { channel: sight, kind: gaussian, severities: [0, 2, 4] }
out: out
`;

const MB = 1024 * 1024;

describe('a sweep of 200 tiny cells', () => {
  it('finishes with flat memory: resident set after the last cell within 64 MB of that after the 20th', async () => {
    process.env.FAKE_EPOCH_MS = '1'; // read by the test double in each worker thread
    const dir = configFolder(CONFIG);
    const samples: number[] = [];
    let finished = 0;
    const outcome = await runSweep(loadSweep(join(dir, 'config.yaml')), {
      jobs: 2,
      workModule: FAKE_WORK,
      listeners: [(event) => {
        if (event.type !== 'cell-done') return;
        finished++;
        if (finished === 20 || finished === 200) samples.push(process.memoryUsage().rss, process.resourceUsage().maxRSS * 1024);
      }],
    });
    expect(outcome).toEqual({ done: 200, failed: 0, interrupted: false, writeFailures: [] });
    const [start, peakAtStart, end, peakAtEnd] = samples;
    const mb = (bytes: number) => `${(bytes / MB).toFixed(0)} MB`;
    console.log(`200-cell sweep: resident set ${mb(start)} after 20 cells (peak so far ${mb(peakAtStart)}), ${mb(end)} after 200 (peak ${mb(peakAtEnd)})`);
    // Memory that grew with the cells would add about 9× what 20 cells added; 64 MB is far above
    // what one record and one event per cell take (common practice: a generous bound against leaks).
    expect(end - start).toBeLessThan(64 * MB);
  });
});
