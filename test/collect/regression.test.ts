import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { collect } from '../../src/collect/collector.js';
import { LATENT_NAMES } from '../../src/collect/dataset.js';
import { CHANNELS, DEFAULT_SENSE_SETTINGS } from '../../src/senses/channel.js';
import { loadWorld } from '../../src/world/parse.js';

/** SHA-256 of every channel (CHANNELS order), then every latent (LATENT_NAMES order), as raw float32 bytes. */
function datasetHash(policy: 'wander' | 'seek'): string {
  const data = collect(loadWorld('worlds/workshop.yaml'), { policy, steps: 3000, episodeSteps: 200 }, DEFAULT_SENSE_SETTINGS, 7);
  const hash = createHash('sha256');
  for (const array of [...CHANNELS.map((c) => data.channels[c]), ...LATENT_NAMES.map((n) => data.latents[n])]) {
    hash.update(new Uint8Array(array.buffer, array.byteOffset, array.byteLength));
  }
  return hash.digest('hex');
}

// Regression anchor: these hashes were computed from the collector before its per-step work
// was reorganised for speed (precomputed per-pose tables, buffers written in place), and that
// reorganisation had to leave every byte of collected experience unchanged. The physics
// itself is checked against its published laws in test/senses/; this only pins the bytes.
// A deliberate change to the senses, the world or the policies changes these values: then
// recompute them and say why in the commit.
describe('collected experience on the workshop world, seed 7', () => {
  it('is byte-identical to the anchor for the wander policy', () => {
    expect(datasetHash('wander')).toBe('dd0d5e1d02d2f67d19acfeb9359a416ddc90ce209ea8b4500dd01cfd4c80bc60');
  });

  it('is byte-identical to the anchor for the seek policy (which listens to sound)', () => {
    expect(datasetHash('seek')).toBe('7faddcc939858fdb05f5420b6394d04b3a740d3996f4fa2e4ba9cfa2e0e7b8c8');
  });
});
