/** Experience collection: policies, the collector, latents and the episode split. */
export * from './dataset.js';
export { collect, latentClassNames, type CollectOptions } from './collector.js';
export { latentRow, latentsAt } from './latents.js';
export { POLICIES, POLICY_NAMES, type Observation, type Policy, type PolicyName } from './policies.js';
export { splitByEpisode, type SplitFractions } from './split.js';
