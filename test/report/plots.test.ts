import { describe, expect, it } from 'vitest';
import { bandPlotSvg, type BandPoint } from '../../src/report/plots.js';

/** The text of every tick label and title in an SVG. */
const texts = (svg: string): string[] => [...svg.matchAll(/<text[^>]*>([^<]*)<\/text>/g)].map((m) => m[1]);

describe('bandPlotSvg', () => {
  it('clamps a CI band to the metric\'s range: an accuracy axis never runs past 1 (accuracy lies in [0, 1] by definition)', async () => {
    // A three-seed CI of 0.9 ± 0.7 would reach 1.6 (test data).
    const points: BandPoint[] = [0, 1].map((x) => ({ learner: 'a', x, mean: 0.9 - 0.1 * x, low: 0.2, high: 1.6 }));
    const svg = await bandPlotSvg(points, ['a'], { title: 't', x: 'severity', y: 'accuracy', range: [0, 1] });
    const ticks = texts(svg).map(Number).filter(Number.isFinite);
    expect(Math.max(...ticks)).toBeLessThanOrEqual(1);
  });

  it('labels ticks with at most three significant digits, never 1.000000, and epochs as whole numbers', async () => {
    // Validation losses that differ only in the seventh decimal (test data).
    const points: BandPoint[] = [1, 2, 3].map((x) => ({ learner: 'a', x, mean: 1 + x * 1e-7, low: 1 + x * 1e-7, high: 1 + x * 1e-7 }));
    const labels = texts(await bandPlotSvg(points, ['a'], { title: 't', x: 'epoch', y: 'loss' }));
    expect(labels.filter((t) => /^-?\d+(\.\d+)?$/.test(t)).every((t) => t.replace(/^-?0?\.?/, '').replace('.', '').length <= 3)).toBe(true);
    expect(labels).toEqual(expect.arrayContaining(['1', '2', '3']));
  });
});
