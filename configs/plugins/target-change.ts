// An example objective plug-in: predict how the target channels will change over the next
// step, from the input at this step and the action about to be taken.
//
// A learner that only predicts the sound it hears now can use whatever in view tells it
// where it stands; predicting the *change* in sound after a step asks what in view tells it
// how sources lie relative to its path. The action enters the linear head, not the encoder
// (like the built-in forecast), so the representation the probes read stays a function of
// the input alone.
//
// Use: `objective: ./target-change.ts` with `input` and `target` channels (configs/plugins/
// target-change.yaml). The default export has the shape of every objective, built in or not
// (src/learn/objective-definition.ts); the type import below is erased when crosswise
// bundles the file.
import type { ObjectiveDefinition } from '../../src/learn/objective-definition.js';

const targetChange: ObjectiveDefinition = {
  type: 'objective',
  name: 'target-change',
  description: 'predict the change of the target channels over the next step from the input and the action',
  target: 'required',
  setup({ tf, learner, channelSize }) {
    const width = learner.target.reduce((sum, channel) => sum + channelSize[channel], 0);
    return {
      // One encoder reading the input; its head sees the representation and the action.
      towers: [{ channels: learner.input, outputs: width, extra: channelSize.motor }],
      signal: {
        examples(source, steps) {
          const rows = source.withNext(steps); // steps t whose t + 1 is in the same episode
          const next = rows.map((t) => t + 1);
          const now = source.standardised(learner.target, rows);
          const later = source.standardised(learner.target, next);
          // The change in units of each entry's training std: [n, width].
          const change = later.data.map((value, i) => value - now.data[i]);
          return {
            n: rows.length,
            inputs: [source.standardised(learner.input, rows)],
            extra: source.raw(['motor'], next), // the action taken between t and t + 1 (motor row t + 1)
            target: { rows: rows.length, cols: width, data: change },
          };
        },
        // Mean squared error, written with the tf crosswise passes in.
        loss: ([output], target) => tf.mean(tf.squaredDifference(output, target!)),
      },
    };
  },
};

export default targetChange;
