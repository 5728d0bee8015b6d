import type * as tf from '@tensorflow/tfjs-core';
import { RULE_REGISTRY } from './learning-rules.js';
import type { Tower } from './network.js';
import { ruleGradients, type Batch, type LossOfOutputs, type RuleState, type TowerPass } from './rules.js';
import { lifLayerBackward } from './spiking-kernels.js';
import { readsHeldInput, spikingForward, type SpikingCache, type SpikingDynamics } from './spiking-network.js';
import { SPIKING_RULES, type RuleName } from './spec.js';

// The learning rules for spiking towers. Each hidden layer turns the signal it receives,
// ∂L/∂S per step or ∂L/∂rate, into ∂L/∂I by backpropagation through time with the surrogate
// derivative (lif.ts); the rules differ only in how that signal reaches the layer, exactly as
// for rate towers, so they are the same rule definitions (learning-rules.ts) run with a
// spiking pass: the chain's first matrix carries ∂L/∂rate of the last layer, each lower one
// ∂L/∂S per step; direct feedback alignment gives each layer ∂L/∂rate = e·D_l.

/** How a spiking tower runs for the rules: simulated in time, errors through time with the surrogate. */
export function spikingPass(d: SpikingDynamics): TowerPass<SpikingCache> {
  return {
    forward: (tower, x, extra) => spikingForward(tower, x, extra, d),
    layerInput: (cache, l) => cache.inputs[l],
    // ∂L/∂I of hidden layer l from the signal at its spikes; summed over time when its input is held.
    derivative: (_tower, cache, l, signal) => lifLayerBackward(signal, cache.layers[l], cache.batch, d.lif, readsHeldInput(l, d)),
  };
}

/** A built-in learning rule bound to spiking towers; throws for a rule that cannot train them. */
export function spikingRule(name: RuleName, d: SpikingDynamics): { gradients(towers: readonly Tower[], state: RuleState, batch: Batch, loss: LossOfOutputs): { loss: tf.Scalar; grads: tf.Tensor[] } } {
  if (!SPIKING_RULES.includes(name)) {
    throw new Error(`rule '${name}' cannot train a spiking encoder (rules that can: ${SPIKING_RULES.join(', ')})`);
  }
  const pass = spikingPass(d);
  return { gradients: (towers, state, batch, loss) => ruleGradients(RULE_REGISTRY[name], towers, state, batch, loss, pass) };
}
