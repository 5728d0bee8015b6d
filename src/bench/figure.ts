/** A measured figure: the median of repeated measurements, with the smallest and largest beside it. */
export interface Figure {
  readonly median: number;
  readonly min: number;
  readonly max: number;
  readonly repeats: number;
}

/** The figure of a list of measurements (the mean of the middle two for an even count). */
export function figureOf(values: readonly number[]): Figure {
  if (values.length === 0) throw new Error('a figure needs at least one measurement');
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  const median = sorted.length % 2 === 1 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
  return { median, min: sorted[0], max: sorted[sorted.length - 1], repeats: values.length };
}

/** Runs `once` for a warm-up whose result is dropped, then `repeats` times; the figure of those. */
export async function measure(repeats: number, once: () => number | Promise<number>): Promise<Figure> {
  await once();
  const values: number[] = [];
  for (let r = 0; r < repeats; r++) values.push(await once());
  return figureOf(values);
}

/** Seconds of wall time `run` takes. */
export async function wallSeconds(run: () => unknown): Promise<number> {
  const started = performance.now();
  await run();
  return (performance.now() - started) / 1000;
}
