// Rewrites anchor-scores.json from the current src/probe/: run `npx tsx test/probe/write-anchor.ts`
// only when a change is meant to move probe scores, and say so in the commit.
import { writeFileSync } from 'node:fs';
import { evaluateEncoder } from '../../src/probe/evaluate.js';
import { ANCHOR_CASES } from './anchor-cases.js';
import { fixtureDataset, linearEncoder } from './fixture.js';

const entries = ANCHOR_CASES.map((c) => {
  const { data, split } = fixtureDataset(c.steps, c.seed, c.poses);
  const { encoder } = linearEncoder(data, c.input, c.featureSize, c.encoderSeed);
  const result = evaluateEncoder({ encoder, data, split, targets: c.targets, noise: c.noise, seed: c.noiseSeed });
  const lines = (items: readonly unknown[]) => items.map((item) => `      ${JSON.stringify(item)}`).join(',\n');
  const probes = lines(result.probes.map((p) => [p.target, p.alpha, p.validationScore]));
  const rows = lines(result.rows.map((r) => [r.target, r.channel, r.kind, r.severity, r.metric, r.value]));
  return `  ${JSON.stringify(c.name)}: {\n    "probes": [\n${probes}\n    ],\n    "rows": [\n${rows}\n    ]\n  }`;
});
writeFileSync(new URL('./anchor-scores.json', import.meta.url), `{\n${entries.join(',\n')}\n}\n`);
