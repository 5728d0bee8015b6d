import * as tf from '@tensorflow/tfjs-core';
import { matMulT } from './dense-kernels.js';
import type { Tower } from './network.js';
import { forwardWeights, layerGrads, outputErrors, RULE_REGISTRY, type Rule } from './rules.js';
import { lifLayerBackward } from './spiking-kernels.js';
import { readsHeldInput, spikingForward, type SpikingCache, type SpikingDynamics } from './spiking-network.js';
import { SPIKING_RULES, type RuleName } from './spec.js';

// The learning rules for spiking towers. Each hidden layer turns the signal it receives,
// ∂L/∂S per step or ∂L/∂rate, into ∂L/∂I by backpropagation through time with the surrogate
// derivative (lif.ts); the rules differ only in how that signal reaches the layer, exactly as
// for rate towers (rules.ts), and use the same feedback matrix shapes and streams.

type SpikingBackward = (tower: Tower, cache: SpikingCache, e: tf.Tensor2D, feedback: readonly tf.Tensor2D[], d: SpikingDynamics) => tf.Tensor[];

/** ∂L/∂I of hidden layer l (1-based) from the signal at its spikes; summed over time when its input is held. */
function layerError(cache: SpikingCache, l: number, signal: tf.Tensor2D, d: SpikingDynamics): tf.Tensor2D {
  return lifLayerBackward(signal, cache.layers[l - 1], cache.batch, d.lif, readsHeldInput(l - 1, d));
}

/**
 * The error sent down through a matrix per layer, Bᵀ in place of Wᵀ (feedback alignment,
 * Lillicrap et al. 2016), or the forward weights themselves (backprop through time). The
 * head's matrix carries ∂L/∂rate of the last layer; each lower one ∂L/∂S per step.
 */
const downward: SpikingBackward = (tower, cache, e, B, d) => {
  const k = tower.encoder.length;
  const grads: tf.Tensor[][] = [layerGrads(cache.headInput, e)];
  let signal = matMulT(e, B[k - 1], false, true); // ∂L/∂rate_k [batch, hidden_k]
  for (let l = k; l >= 1; l--) {
    const error = layerError(cache, l, signal, d);
    grads.unshift(layerGrads(cache.inputs[l - 1], error));
    if (l > 1) signal = matMulT(error, B[l - 2], false, true); // ∂L/∂S_{l−1} [steps·batch, hidden_{l−1}]
  }
  return grads.flat();
};

/**
 * Direct feedback alignment (Nøkland 2016): hidden layer l receives the output error through
 * its own fixed matrix as ∂L/∂rate_l = e·D_l, then through time with the surrogate.
 */
const direct: SpikingBackward = (tower, cache, e, D, d) => {
  const hidden = tower.encoder.flatMap((_, i) => layerGrads(cache.inputs[i], layerError(cache, i + 1, tf.matMul(e, D[i]), d)));
  return [...hidden, ...layerGrads(cache.headInput, e)];
};

const BACKWARD: Partial<Record<RuleName, SpikingBackward>> = {
  backprop: (tower, cache, e, _none, d) => downward(tower, cache, e, forwardWeights(tower), d),
  'feedback-alignment': downward,
  'direct-feedback-alignment': direct,
};

/** A learning rule for spiking towers; throws for a rule that cannot train them. */
export function spikingRule(name: RuleName, d: SpikingDynamics): Rule {
  const backward = BACKWARD[name];
  if (backward == null) {
    throw new Error(`rule '${name}' cannot train a spiking encoder (rules that can: ${SPIKING_RULES.join(', ')})`);
  }
  return {
    feedbackShapes: RULE_REGISTRY[name].feedbackShapes,
    gradients(towers, feedback, batch, loss) {
      const caches = towers.map((t, i) => spikingForward(t, batch.inputs[i], i === 0 ? batch.extra : null, d));
      const { loss: value, errors } = outputErrors(caches, loss);
      return { loss: value, grads: towers.flatMap((t, i) => backward(t, caches[i], errors[i], feedback[i], d)) };
    },
  };
}
