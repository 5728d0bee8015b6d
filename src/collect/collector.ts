import { createRng, randomInt, type Rng } from '../random.js';
import { CHANNELS, type ChannelName, type SenseSettings } from '../senses/channel.js';
import { channelSize } from '../senses/registry.js';
import { createScene } from '../senses/scene.js';
import { senseInto } from '../senses/sense-all.js';
import { ACTIONS, HEADINGS, type Action, type Pose, type World } from '../world/types.js';
import { LATENT_NAMES, type Dataset, type LatentName } from './dataset.js';
import { PoseLatentTable, POSE_LATENTS } from './latents.js';
import { MoveTable, poseOf } from './moves.js';
import { POLICIES, POLICY_NAMES, type Observation, type PolicyDefinition, type PolicyName } from './policies.js';

/** How to collect: which policy, how many steps in all, and how many per episode. */
export interface CollectOptions {
  /** A built-in policy's name (POLICY_NAMES), or a policy definition (a plug-in's). */
  readonly policy: string | PolicyDefinition;
  readonly steps: number;
  readonly episodeSteps: number;
}

function checkOptions(options: CollectOptions): void {
  if (typeof options.policy === 'string' && !(POLICY_NAMES as readonly string[]).includes(options.policy)) {
    throw new Error(`unknown policy '${options.policy}'; expected one of ${POLICY_NAMES.join(', ')}`);
  }
  for (const key of ['steps', 'episodeSteps'] as const) {
    if (!Number.isInteger(options[key]) || options[key] < 1) throw new Error(`collect ${key} must be a whole number >= 1, got ${options[key]}`);
  }
}

const ACTION_SET: ReadonlySet<string> = new Set(ACTIONS);

/** The policy's act function; a plug-in's answers are checked, since an unknown action would corrupt the move table. */
function actOf(policy: string | PolicyDefinition): (observation: Observation, rng: Rng) => Action {
  if (typeof policy === 'string') return POLICIES[policy as PolicyName].act;
  return (observation, rng) => {
    const action = policy.act(observation, rng);
    if (!ACTION_SET.has(action)) throw new Error(`policy '${policy.name}' chose ${JSON.stringify(action)}; expected one of ${ACTIONS.join(', ')}`);
    return action;
  };
}

function freeCells(world: World): Int32Array {
  const cells: number[] = [];
  for (let i = 0; i < world.solid.length; i++) if (world.solid[i] === 0) cells.push(i);
  return Int32Array.from(cells);
}

function randomPose(world: World, free: Int32Array, rng: Rng): Pose {
  const cell = free[randomInt(rng, free.length)];
  return { x: cell % world.width, y: Math.floor(cell / world.width), heading: HEADINGS[randomInt(rng, 4)] };
}

/** Class names of the categorical latents, in index order. */
export function latentClassNames(world: World): Dataset['classNames'] {
  const materials = world.materials.map((m) => m.name);
  const yesNo = ['no', 'yes'];
  return {
    heading: HEADINGS, material_under: materials, material_ahead: materials, wall_ahead: yesNo,
    nearest_emitter: world.emitters.map((e) => e.name), emitter_in_view: yesNo, moved: yesNo, bumped: yesNo,
  };
}

function allocate(steps: number, settings: SenseSettings) {
  const size = Object.fromEntries(CHANNELS.map((c) => [c, channelSize(c, settings)])) as Record<ChannelName, number>;
  const channels = Object.fromEntries(CHANNELS.map((c) => [c, new Float32Array(steps * size[c])])) as Record<ChannelName, Float32Array>;
  const scratch = Object.fromEntries(CHANNELS.map((c) => [c, new Float32Array(size[c])])) as Record<ChannelName, Float32Array>;
  const latents = Object.fromEntries(LATENT_NAMES.map((n) => [n, new Float32Array(steps)])) as Record<LatentName, Float32Array>;
  return { size, channels, scratch, latents };
}

/**
 * Runs the agent for `steps` steps and records every channel and latent at each step.
 *
 * Episodes last `episodeSteps` steps (the last may be shorter). Each begins with the agent
 * placed on a random free cell with a random heading, drawn from createRng(seed, 'collect'),
 * except that the first episode starts at the world's `start` pose when it has one; the
 * first step of an episode records that placement with action `stay`. The policy draws
 * from the same stream. The world clock (emitter duty cycles) is the global step index.
 *
 * The world is static, so transitions and the pose-only latents are worked out once per
 * pose and reused. Each step is sensed into one row of scratch buffers, which the policy
 * reads through one observation object reused every step, and block-copied into the dataset.
 */
export function collect(world: World, options: CollectOptions, settings: SenseSettings, seed: number): Dataset {
  checkOptions(options);
  const { steps, episodeSteps } = options;
  const rng = createRng(seed, 'collect');
  const act = actOf(options.policy);
  const scene = createScene(world, settings);
  const moves = new MoveTable(world);
  const free = freeCells(world);
  const { size, channels, scratch, latents } = allocate(steps, settings);
  const poseRows = new PoseLatentTable(scene);
  const latentColumns = LATENT_NAMES.map((n) => latents[n]);
  const episode = new Int32Array(steps);
  const hasNext = new Uint8Array(steps);
  let k = moves.rest(world.start ?? randomPose(world, free, rng));
  const observation = { transition: moves.transition(k), sound: scratch.sound, touch: scratch.touch };
  const outputs = CHANNELS.map((c) => channels[c]);
  const rows = CHANNELS.map((c) => scratch[c]);
  for (let t = 0; t < steps; t++) {
    let action: Action = 'stay';
    if (t % episodeSteps === 0) {
      if (t > 0) k = moves.rest(randomPose(world, free, rng));
    } else {
      observation.transition = moves.transition(k);
      action = act(observation, rng);
      k = moves.take(k, action);
    }
    const transition = moves.transition(k);
    senseInto(scene, transition.pose, transition, action, t, scratch, 0);
    for (let c = 0; c < rows.length; c++) outputs[c].set(rows[c], t * rows[c].length);
    const row = poseRows.rowOf(poseOf(k), transition.pose);
    for (let j = 0; j < POSE_LATENTS; j++) latentColumns[j][t] = poseRows.rows[row + j];
    latentColumns[POSE_LATENTS][t] = transition.moved ? 1 : 0;
    latentColumns[POSE_LATENTS + 1][t] = transition.bumped ? 1 : 0;
    episode[t] = Math.floor(t / episodeSteps);
    hasNext[t] = t + 1 < steps && (t + 1) % episodeSteps !== 0 ? 1 : 0;
  }
  return { steps, channelSize: size, channels, latents, episode, hasNext, classNames: latentClassNames(world) };
}
