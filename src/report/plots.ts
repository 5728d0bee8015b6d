import * as vega from 'vega';
import { compile, type TopLevelSpec } from 'vega-lite';

/**
 * Line colours: the colour-blind-safe set of Okabe & Ito (2008, "Color Universal
 * Design"), in our own order, with yellow last because it reads poorly on white.
 */
export const PALETTE = ['#0072B2', '#D55E00', '#009E73', '#CC79A7', '#E69F00', '#56B4E9', '#000000', '#F0E442'];

/** One point of a curve with its 95% CI band. */
export interface BandPoint {
  readonly learner: string;
  readonly x: number;
  readonly mean: number;
  readonly low: number;
  readonly high: number;
}

/** Axis titles and the plot title, and the range the plotted quantity can take. */
export interface PlotLabels {
  readonly title: string;
  readonly x: string;
  readonly y: string;
  /** Lowest and highest possible value (accuracy [0, 1], R² [−∞, 1]): CI bands are clamped to it. */
  readonly range?: readonly [number, number];
}

/**
 * A line per learner (mean) over a shaded band (95% CI), rendered to SVG through
 * vega-lite → vega with no renderer (offline, no canvas). Learners keep their colour
 * across plots because the colour domain is the full learner list.
 */
export async function bandPlotSvg(
  points: readonly BandPoint[], learners: readonly string[], labels: PlotLabels, baseline: string | null = null,
): Promise<string> {
  const [min, max] = labels.range ?? [-Infinity, Infinity];
  const clamp = (v: number) => Math.min(max, Math.max(min, v));
  const values = points.filter((p) => Number.isFinite(p.mean)).map((p) => ({
    ...p, low: clamp(Number.isFinite(p.low) ? p.low : p.mean), high: clamp(Number.isFinite(p.high) ? p.high : p.mean),
  }));
  const scale = { domain: [...learners], range: learners.map((_, i) => PALETTE[i % PALETTE.length]) };
  // One merged legend (fill and stroke share the field), drawn as solid line swatches.
  const legend = { symbolType: 'stroke', symbolStrokeWidth: 3, symbolOpacity: 1, symbolFillColor: 'transparent' } as const;
  // Whole-number severities and epochs; y ticks with at most 3 significant digits (d3-format), never '1.000000'.
  const x = { field: 'x', type: 'quantitative', title: labels.x, axis: { tickMinStep: 1, format: 'd' } } as const;
  const dashed = baseline == null ? 'false' : `datum.learner === ${JSON.stringify(baseline)}`;
  const spec: TopLevelSpec = {
    title: baseline == null ? labels.title : { text: labels.title, subtitle: `dashed: baseline ${baseline}` },
    width: 420,
    height: 260,
    data: { values },
    layer: [
      {
        mark: { type: 'area', opacity: 0.18 },
        encoding: { x, y: { field: 'low', type: 'quantitative' }, y2: { field: 'high' }, fill: { field: 'learner', type: 'nominal', title: 'learner', scale, legend } },
      },
      {
        mark: { type: 'line', strokeWidth: 2, point: { filled: true, size: 28 } },
        encoding: {
          x,
          y: { field: 'mean', type: 'quantitative', title: labels.y, scale: { zero: false }, axis: { format: '.3~g' } },
          color: { field: 'learner', type: 'nominal', title: 'learner', scale, legend },
          strokeDash: { condition: { test: dashed, value: [6, 3] }, value: [1, 0] },
        },
      },
    ],
    config: { font: 'sans-serif', view: { stroke: '#999999' }, axis: { gridColor: '#e4e4e4' } },
  };
  const view = new vega.View(vega.parse(compile(spec).spec), { renderer: 'none' });
  try {
    return await view.toSVG();
  } finally {
    view.finalize();
  }
}

/** A file-name-safe slug: letters, digits, dot, dash and underscore only. */
export function slug(text: string): string {
  return text.replace(/[^A-Za-z0-9._-]+/g, '_').replace(/^_+|_+$/g, '') || 'x';
}

/** Where the robustness plot of a target and noise goes, relative to the output directory. */
export function robustnessPlotPath(target: string, channel: string, kind: string, combination: number | null): string {
  return `plots/robustness_${slug(target)}_${slug(channel)}_${slug(kind)}${combination == null ? '' : `_c${combination}`}.svg`;
}

/** Where the training-curve plot goes, relative to the output directory. */
export function trainingPlotPath(combination: number | null): string {
  return `plots/training${combination == null ? '' : `_c${combination}`}.svg`;
}
