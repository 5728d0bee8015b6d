// An example learning-rule plug-in: random-magnitude sign-concordant feedback (Liao, Leibo &
// Poggio 2016, from memory). The error travels down through matrices with the signs of the
// current forward weights and fixed random magnitudes: M_l = sign(W_l) ⊙ |R_l|. It sits
// between the built-in sign-symmetry (magnitudes all 1) and feedback-alignment (signs random
// too), so it asks how much of sign symmetry's advantage survives unstructured magnitudes.
//
// Use: `rule: ./sign-concordant.ts` (configs/plugins/sign-concordant.yaml). The default
// export has the shape of every learning rule, built in or not (src/learn/rule-definition.ts);
// the type import below is erased when crosswise bundles the file.
import type { RuleDefinition } from '../../src/learn/rule-definition.js';

const signConcordant: RuleDefinition = {
  type: 'rule',
  name: 'sign-concordant',
  description: 'error sent down through the forward weights\' signs with fixed random magnitudes',
  // |R_l|: one fixed random magnitude per forward weight above the first layer, drawn once
  // from the seed (the same draws feedback alignment's B_l start from).
  init: ({ tf, weights, random }) => weights.slice(1).map((W) => tf.abs(random(W.shape[0], W.shape[1]))),
  // chain() sends the output error down through one matrix per weight above the first layer.
  deltas: ({ tf, weights, state, chain }) => chain(weights.slice(1).map((W, l) => tf.mul(tf.sign(W), state[l]))),
};

export default signConcordant;
