import { describe, expect, it } from 'vitest';
import { initialRunState, reduceRun, type RunState } from '../../src/tui/dashboard/run-state.js';
import { summariseScores } from '../../src/tui/dashboard/render-dashboard.js';
import { etaSeconds, progressText, queuedCells, tableText, workerTexts } from '../../src/tui/dashboard/run-view.js';
import { SWEEP, cell } from './run-events.js';

/** Folds the events, all stamped at `atMs`. */
function fold(atMs: number): RunState {
  return SWEEP.reduce((s, e) => reduceRun(s, e, atMs), initialRunState('?', 0, 0));
}

describe('run state', () => {
  it('counts done, failed, running and queued cells', () => {
    const s = fold(0);
    expect([s.done, s.failed, s.workers.length, queuedCells(s)]).toEqual([2, 1, 2, 1]);
  });

  it('keeps each running worker\'s epoch and loss history', () => {
    const s = fold(0);
    expect(s.workers.map((w) => [w.worker, w.cell.id, w.epoch, w.losses])).toEqual([
      [1, 'c2', 3, [0.5, 0.3, 0.1]],
      [2, 'c4', null, []],
    ]);
  });

  it('ignores an epoch of a cell that is not running on that worker', () => {
    const s = reduceRun(fold(0), { type: 'epoch', cell: cell(9, 'x', 1), worker: 1, log: { epoch: 7, trainLoss: 1, validationLoss: 1, seconds: 1, alignmentDeg: [] } }, 0);
    expect(s.workers[0].epoch).toBe(3);
  });

  it('estimates the time left from the mean cell time shared over the workers', () => {
    // Mean cell 15 s; both running cells started 5 s ago (10 s left each); one queued (15 s); 2 workers.
    const s = fold(0);
    expect(etaSeconds(s, 5000)).toBeCloseTo((15 + 10 + 10) / 2, 12);
  });

  it('has no ETA before any cell has finished', () => {
    expect(etaSeconds(reduceRun(initialRunState('x', 3, 0), SWEEP[0], 0), 1000)).toBeNull();
  });

  it('formats the progress header', () => {
    const p = progressText(fold(0), 5000, false);
    expect(p.title).toBe('crosswise run · demo · writing to runs/demo');
    expect(p.counts).toBe('cells 2/6 done · 1 failed · 2 running · 1 queued');
    expect(p.timing).toBe('elapsed 5s · eta 18s · 2 workers');
    expect(p.notes).toEqual(['last failure: autoencoder seed 2 [c3]: loss became NaN']);
  });

  it('counts cells stored by an earlier run as done and says so', () => {
    const s = reduceRun(initialRunState('x', 0, 0), { type: 'sweep-start', name: 'x', out: 'o', total: 10, skipped: 4, jobs: 1 }, 0);
    expect(progressText(s, 0, false).counts).toBe('cells 4/10 done (4 stored earlier) · 0 failed · 0 running · 6 queued');
  });

  it('formats a worker line with its latest loss and a loss trend', () => {
    expect(workerTexts(fold(0))[0]).toEqual({
      worker: 'worker 1', cell: 'sound-from-sight seed 2 [c2]', epoch: 'epoch 3', loss: 'loss 0.1000', trend: '█▄▁', firing: '',
    });
  });

  it('shows a spiking learner\'s latest firing rate and silent share per hidden layer', () => {
    const firing = { rateHz: [152.4, 97.6], silentFraction: [0, 0.0625] };
    const s = reduceRun(fold(0), { type: 'epoch', cell: cell(2, 'sound-from-sight', 2), worker: 1, log: { epoch: 4, trainLoss: 0.1, validationLoss: 0.2, seconds: 1, alignmentDeg: [], firing } }, 0);
    expect(s.workers[0].firing).toEqual(firing);
    expect(workerTexts(s)[0].firing).toBe('firing 152 · 98 Hz · silent 0% · 6%');
  });

  it('shows a single seed\'s score without an interval', () => {
    const t = tableText(fold(0), 'wall_ahead (accuracy)', 'sight gaussian', (v) => ({ mean: v[0], halfWidth: 99 }));
    expect(t.columns).toEqual(['sev 0', 'sev 3']);
    expect(t.rows).toEqual([
      { label: 'sound-from-sight', cells: ['0.90', '0.70'] },
      { label: 'autoencoder', cells: ['0.80', '0.40'] },
    ]);
  });
});

describe('score summary', () => {
  it('gives mean ± t(0.975, n − 1)·sd/√n, e.g. 12.706 for two seeds (Student t table, df = 1)', () => {
    // 0.5 and 0.7: mean 0.6, sd 0.1414, half-width 12.706 · 0.1414 / √2 = 1.2706.
    const s = summariseScores([0.5, 0.7]);
    expect(s.mean).toBeCloseTo(0.6, 12);
    expect(s.halfWidth).toBeCloseTo(1.2706, 3);
  });

  it('gives no half-width for a single seed', () => {
    expect(summariseScores([0.5])).toEqual({ mean: 0.5, halfWidth: null });
  });
});

describe('progress timing', () => {
  it('shows 0s elapsed when the clock reading is older than the sweep start (first frame)', () => {
    const s = reduceRun(initialRunState('x', 1, 0), SWEEP[0], 2000);
    expect(progressText(s, 1500, false).timing).toBe('elapsed 0s · eta -- · 2 workers');
  });
});
