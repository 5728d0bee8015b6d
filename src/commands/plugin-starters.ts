// The starter files `crosswise new` writes: for each kind of part, a plug-in that runs as it
// is and does something worth comparing, and a config that runs it beside built-ins. `NAME`
// stands for the plug-in's name; `WORLD` and `SCHEMA` for the demo world's and the config
// schema's paths relative to the config.

import type { StarterKind } from './new-usage.js';

const OBJECTIVE = `// NAME: an objective plug-in for crosswise (written by \`crosswise new objective NAME\`).
//
// As written it predicts the learner's target channels from its input channels at the same
// step, like the built-in \`predict\`, but by mean absolute error instead of mean squared
// error: an L1 loss is less swayed by rare large errors (a loud moment, a bump). Change it
// into your own idea; \`crosswise check NAME.yaml\` tells you what is wrong before anything runs.
//
// The default export is the interface every objective implements, built in or not:
//   type         always 'objective'
//   name         what results and the summary call it
//   description  one line
//   target       'required', 'optional' or 'unused': whether learners list target channels
//   minBatch     (optional) fewest rows a batch needs, e.g. 2 for a contrastive loss
//   setup(context) → { towers, signal }
//     context.tf           crosswise's TensorFlow.js: never import your own
//     context.learner      the learner's settings: input, target, offset, encoder.hidden, train, ...
//     context.channelSize  entries per step of each channel (sight, sound, touch, motor)
//     context.classCount(latent)  classes of a categorical latent
//     towers   one { channels, outputs, extra? } per encoder; tower 0 reads the learner's
//              input and its last hidden layer is what the probes read
//     signal   { examples(source, steps), loss(outputs, target) }, or null to leave the
//              weights untrained
//       source.standardised(channels, steps), source.raw(channels, steps): [steps, width]
//         matrices { rows, cols, data: Float32Array }; source.withNext(steps): the steps
//         whose next step is in the same episode; source.latent(name, steps)
//       examples returns { n, inputs: [one matrix per tower], extra?, target? }
//       loss gets each tower's head output [batch, outputs] and the batch's target, and
//         returns a scalar tensor

export default {
  type: 'objective',
  name: 'NAME',
  description: 'predict the target channels from the input channels by mean absolute error',
  target: 'required',
  setup({ tf, learner, channelSize }) {
    const width = learner.target.reduce((sum, channel) => sum + channelSize[channel], 0);
    return {
      towers: [{ channels: learner.input, outputs: width }],
      signal: {
        examples: (source, steps) => ({
          n: steps.length,
          inputs: [source.standardised(learner.input, steps)],
          target: source.standardised(learner.target, steps),
        }),
        loss: ([output], target) => tf.mean(tf.abs(tf.sub(output, target))),
      },
    };
  },
};
`;

const RULE = `// NAME: a learning-rule plug-in for crosswise (written by \`crosswise new rule NAME\`).
//
// As written it is feedback alignment (Lillicrap et al. 2016): the output error travels down
// through fixed random matrices instead of the transposed forward weights, so its results
// match the built-in \`feedback-alignment\` bit for bit. Change deltas (or init, or add
// update) into your own rule; \`crosswise check NAME.yaml\` tells you what is wrong before
// anything runs, and train.csv records your rule's update/gradient angle per layer.
//
// The default export is the interface every learning rule implements, built in or not:
//   type, name, description
//   init(context) → matrices   (optional) the rule's own matrices for one encoder, made once
//     context.tf, context.weights: [W_0, ..., W_head] each [in, out] (the head's rows over
//     the representation), context.random(rows, cols): a fixed random matrix from the seed
//   deltas(context) → [δ_0, ..., δ_{k-1}]: the error each hidden layer learns from, each
//     [batch, width of that layer]; the head always learns from the true output error
//     context.outputError e [batch, outputs], context.activations (layer inputs),
//     context.weights, context.state (your matrices), context.derivative(l, g) = g ⊙ f'(a_l),
//     context.chain(M): the deltas when e travels down through M[l] in place of weights[l+1]
//     (chain(weights.slice(1)) is backprop)
//   update(context) → { state?, weights? }   (optional) after each optimiser step, with
//     context.updates: what the step added to each weight (Kolen–Pollack uses it)

export default {
  type: 'rule',
  name: 'NAME',
  description: 'feedback alignment: the error travels down through fixed random matrices',
  init: ({ weights, random }) => weights.slice(1).map((W) => random(W.shape[0], W.shape[1])),
  deltas: ({ state, chain }) => chain(state),
};
`;

const POLICY = `// NAME: a behaviour-policy plug-in for crosswise (written by \`crosswise new policy NAME\`).
//
// As written it walks straight ahead until its front whisker touches a wall, then turns
// left or right at random; one step in ten it turns anyway, so it does not retrace the
// same corridor forever. Change act into your own behaviour; \`crosswise check NAME.yaml\`
// tells you what is wrong before anything runs.
//
// The default export is the interface every policy implements, built in or not:
//   type, name, description
//   act(observation, rng) → 'forward' | 'back' | 'turn-left' | 'turn-right' | 'stay'
//     observation.transition  { pose: { x, y, heading }, moved, bumped } of the last step
//     observation.sound       [2 × bands] band levels in dB, left ear first
//     observation.touch       [whisker_left, whisker_front, whisker_right, bump_force, footfall...]
//     rng()                   the only source of randomness: uniform on [0, 1), seeded

export default {
  type: 'policy',
  name: 'NAME',
  description: 'straight ahead until a wall, then a random turn; one step in ten a turn anyway',
  act({ touch }, rng) {
    const turn = rng() < 0.5 ? 'turn-left' : 'turn-right';
    if (touch[1] > 0) return turn; // the front whisker touches a wall
    return rng() < 0.1 ? turn : 'forward';
  },
};
`;

const NOISE = `// NAME: a noise-kind plug-in for crosswise (written by \`crosswise new noise NAME\`).
//
// As written it is impulse noise: each entry is replaced, with probability p, by a spike
// three training standard deviations above or below its training mean (sign at random) —
// the salt-and-pepper corruption of images, here for any channel. Change corrupt and the
// severity scale into your own; \`crosswise check NAME.yaml\` tells you what is wrong before
// anything runs.
//
// The default export is the interface every noise kind implements, built in or not:
//   type, name, description
//   channels     (optional) the channels it may corrupt; all when left out
//   clean        the parameter that changes nothing (severity 0)
//   severities   the parameter at severities 1 to 5, mild to severe
//   parameter    what the parameter is, for messages
//   valid(p)     whether a parameter value is allowed (explicit parameters in configs)
//   corrupt(values, size, p, reference, rng) → a new Float32Array of the same length
//     values     [n × size] test rows of one channel, in its physical units; never change it
//     reference  { mean, std, silence }: per entry, over the training rows
//     rng()      the only source of randomness: uniform on [0, 1), seeded

export default {
  type: 'noise',
  name: 'NAME',
  description: 'replaces entries by spikes three training stds from the mean with probability p',
  clean: 0,
  severities: [0.01, 0.03, 0.1, 0.2, 0.3],
  parameter: 'a probability p in [0, 1]',
  valid: (p) => p >= 0 && p <= 1,
  corrupt(values, size, p, reference, rng) {
    const out = Float32Array.from(values);
    for (let i = 0; i < out.length; i++) {
      if (rng() >= p) continue;
      const j = i % size;
      out[i] = reference.mean[j] + (rng() < 0.5 ? -3 : 3) * reference.std[j];
    }
    return out;
  },
};
`;

const HEADER = `# yaml-language-server: $schema=SCHEMA
#
# Written by \`crosswise new KIND NAME\`: runs the plug-in ./NAME.ts beside built-ins on a
# small sweep (a minute or two on 2 cores). \`crosswise check NAME.yaml\` checks both files;
# \`crosswise run NAME.yaml\` runs the sweep into runs/NAME and ends by naming its summary.
name: NAME
world: WORLD
seeds: [1, 2, 3]
`;

const PROBE = `probe:
  targets: [wall_ahead, material_ahead, nearest_emitter, nearest_distance_m]
`;

/** The start of the policy and noise starters' configs: two learners that read sight, compared under noise. */
const TWO_LEARNERS = `${HEADER}collect:
  steps: 6000                    # 30 episodes: small, to keep the first run quick
learners:
  - name: sound-from-sight
    objective: predict
    input: [sight]
    target: [sound]
  - name: sight-autoencoder
    objective: reconstruct
    input: [sight]
${PROBE}  baseline: sight-autoencoder
`;

const CONFIGS: Readonly<Record<StarterKind, string>> = {
  objective: `${HEADER}collect:
  steps: 6000                    # 30 episodes: small, to keep the first run quick
learners:
  - name: NAME
    objective: ./NAME.ts         # the plug-in file, relative to this config
    input: [sight]
    target: [sound]
  - name: sound-from-sight       # the built-in it varies: mean squared error
    objective: predict
    input: [sight]
    target: [sound]
  - name: sight-autoencoder      # the single-sense baseline
    objective: reconstruct
    input: [sight]
${PROBE}  baseline: sight-autoencoder
noise:
  - { channel: sight, kind: gaussian, severities: [0, 2, 4] }
out: runs/NAME
`,
  rule: `${HEADER}collect:
  steps: 6000                    # 30 episodes: small, to keep the first run quick
learners:
  - name: NAME
    objective: predict
    input: [sight]
    target: [sound]
    rule: ./NAME.ts              # the plug-in file, relative to this config
  - name: backprop               # exact gradients
    objective: predict
    input: [sight]
    target: [sound]
    rule: backprop
  - name: feedback-alignment
    objective: predict
    input: [sight]
    target: [sound]
    rule: feedback-alignment
${PROBE}  baseline: backprop
noise:
  - { channel: sight, kind: gaussian, severities: [0, 2, 4] }
out: runs/NAME
`,
  policy: `${TWO_LEARNERS}noise:
  - { channel: sight, kind: gaussian, severities: [0, 2, 4] }
vary:
  collect.policy: [wander, ./NAME.ts]   # the built-in random walk, then the plug-in file
out: runs/NAME
`,
  noise: `${TWO_LEARNERS}noise:
  - { channel: sight, kind: gaussian, severities: [0, 2, 4] }   # a built-in, for comparison
  - { channel: sight, kind: ./NAME.ts, severities: [0, 2, 4] }  # the plug-in file
out: runs/NAME
`,
};

const PLUGINS: Readonly<Record<StarterKind, string>> = { objective: OBJECTIVE, rule: RULE, policy: POLICY, noise: NOISE };

/** The starter plug-in file and its config for a kind of part and a name; `paths` are the demo world's and the schema's, from the config. */
export function starterFiles(kind: StarterKind, name: string, paths: { readonly world: string; readonly schema: string }): { plugin: string; config: string } {
  const fill = (text: string) => text.replaceAll('NAME', name).replaceAll('KIND', kind).replaceAll('WORLD', paths.world).replaceAll('SCHEMA', paths.schema);
  return { plugin: fill(PLUGINS[kind]), config: fill(CONFIGS[kind]) };
}
