import seedrandom from 'seedrandom';

/** A seeded uniform generator on [0, 1). */
export type Rng = () => number;

/**
 * A generator for one named sub-stream of a seed.
 *
 * Sub-streams are derived by name, not by offsets into one sequence, so adding a draw
 * in one place never shifts the draws of another. The names in use are:
 * - `collect` (start cells and policies), `split` (episode shuffle);
 * - `noise/<channel>/<kind>/<severity>` (corruption draws, shared by all learners of a seed and by its recordings);
 * - `init/encoder/<channels joined by +>/<input width>/<hidden widths joined by x>/<activation>`
 *   (a tower's encoder weights, layer by layer), `init/head/<tower>/<rows>x<cols>` (a tower's
 *   head weights), `feedback/<tower>/<matrix>/<rows>x<cols>` (fixed feedback matrices),
 *   `shuffle/train` (batch order, one permutation per epoch), `shuffle/validation` (evaluation
 *   order). Tower 0 encodes a learner's input, tower 1 the contrast target. A spiking
 *   encoder's `<activation>` is `spiking`. `spikes/train` (the input spikes of rate-coded
 *   training batches, in training order), `spikes/row/<hash of the row's bytes>` (those of one
 *   standardised row in validation and feature extraction). None holds the learner's name, so
 *   learners with the same settings draw the same numbers (learn/streams.ts);
 * - `bootstrap/<table>/<learner>/<severity>` under seed 0 (report IQM intervals);
 * - `explore/<world>/<step>/<channel>/<kind>/<severity>` (noise shown by `crosswise explore`);
 * - `listen` (the band noise of `crosswise listen`, under the walk's seed);
 * - `bench` under seed 0 (synthetic data for `crosswise bench`).
 */
export function createRng(seed: number, ...stream: readonly (string | number)[]): Rng {
  if (!Number.isInteger(seed)) throw new Error(`seed must be an integer, got ${seed}`);
  const key = [String(seed), ...stream.map(String)].join('/');
  return seedrandom.alea(key);
}

/** A standard normal draw (Box–Muller, Box & Muller 1958). */
export function normal(rng: Rng): number {
  let u = 0;
  while (u === 0) u = rng();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * rng());
}

/** A uniform integer in [0, n). */
export function randomInt(rng: Rng, n: number): number {
  return Math.floor(rng() * n);
}

/**
 * A uniformly random permutation of 0..n−1 by Fisher–Yates (Durstenfeld 1964; Knuth 1997,
 * Algorithm P): for i from n−1 down to 1, swap entry i with entry randomInt(i + 1). The
 * draws and their order are part of every stored result; do not change them.
 */
export function permutation(n: number, rng: Rng): Int32Array {
  const order = Int32Array.from({ length: n }, (_, i) => i);
  for (let i = n - 1; i > 0; i--) {
    const j = randomInt(rng, i + 1);
    const swap = order[i];
    order[i] = order[j];
    order[j] = swap;
  }
  return order;
}
