import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { SHED_WORLD } from './helpers.js';

// Plug-in files for the tests: copies of built-ins written as files (which must behave
// exactly like the built-ins), and broken files of every kind `crosswise check` reports.

/** Feedback alignment (Lillicrap et al. 2016) as a file: the built-in's definition, spelled out. */
export const FA_RULE = `export default {
  type: 'rule', name: 'fa-file', description: 'feedback alignment, as a file',
  init: ({ weights, random }) => weights.slice(1).map((w) => random(w.shape[0], w.shape[1])),
  deltas: ({ state, chain }) => chain(state),
};
`;

/** The built-in reconstruct objective as a TypeScript file with a helper module. */
export const AUTOENCODER = `import { widthOf } from './width.js';
interface Shape { channels: readonly string[]; outputs: number }
export default {
  type: 'objective', name: 'ae-file', description: 'an autoencoder, as a file', target: 'unused',
  setup: ({ tf, learner, channelSize }: any) => ({
    towers: [{ channels: learner.input, outputs: widthOf(learner.input, channelSize) } satisfies Shape],
    signal: {
      examples(source: any, steps: Int32Array) {
        const x = source.standardised(learner.input, steps);
        return { n: steps.length, inputs: [x], target: x };
      },
      loss: ([output]: any[], target: any) => tf.mean(tf.squaredDifference(output, target)),
    },
  }),
};
`;
export const WIDTH_HELPER = `export const widthOf = (channels: readonly string[], size: Record<string, number>): number =>
  channels.reduce((sum, c) => sum + size[c], 0);
`;

/** The built-in uniform policy as an ES module file. */
export const UNIFORM_POLICY = `const ACTIONS = ['forward', 'back', 'turn-left', 'turn-right', 'stay'];
export default {
  type: 'policy', name: 'uniform-file', description: 'each action with equal probability, as a file',
  act: (_observation, rng) => ACTIONS[Math.floor(rng() * ACTIONS.length)],
};
`;

/** A noise kind that changes nothing at any severity (a CommonJS file). */
export const IDENTITY_NOISE = `module.exports = {
  type: 'noise', name: 'unchanged', description: 'returns the input as it is',
  clean: 0, severities: [1, 2, 3, 4, 5], parameter: 'any number', valid: (p) => Number.isFinite(p),
  corrupt: (values) => Float32Array.from(values),
};
`;

/** A rule whose every step throws. */
export const THROWING_RULE = `export default {
  type: 'rule', name: 'unfinished', description: 'throws',
  deltas: () => { throw new Error('deltas are not written yet'); },
};
`;

/** An objective whose loss is NaN. */
export const NAN_OBJECTIVE = `export default {
  type: 'objective', name: 'nan-loss', description: 'a loss that is not a number', target: 'unused',
  setup: ({ tf, learner, channelSize }) => ({
    towers: [{ channels: learner.input, outputs: 3 }],
    signal: {
      examples: (source, steps) => ({ n: steps.length, inputs: [source.standardised(learner.input, steps)] }),
      loss: ([output]) => tf.mul(tf.mean(output), NaN),
    },
  }),
};
`;

/** A fresh folder holding world.yaml, config.yaml and the given plug-in files; returns the folder. */
export function pluginFolder(config: string, files: Readonly<Record<string, string>>): string {
  const dir = mkdtempSync(join(tmpdir(), 'crosswise-plugins-'));
  writeFileSync(join(dir, 'world.yaml'), SHED_WORLD);
  writeFileSync(join(dir, 'config.yaml'), config);
  for (const [name, text] of Object.entries(files)) writeFileSync(join(dir, name), text);
  return dir;
}
