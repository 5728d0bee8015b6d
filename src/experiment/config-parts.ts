import type { z } from 'zod';
import { configSchema, learnerSchema, noiseEntrySchema, type FilledConfig } from './schema.js';

type Learner = FilledConfig['learners'][number];
type NoiseEntry = FilledConfig['noise'][number];

/**
 * A config read part by part: each top-level section, each learner and each noise entry
 * that passes the schema on its own, defaults filled; undefined where it does not. The
 * checks of one part then run whatever is wrong in another, so independent problems are
 * reported together.
 */
export interface ConfigParts {
  readonly seeds?: FilledConfig['seeds'];
  readonly collect?: FilledConfig['collect'];
  readonly senses?: FilledConfig['senses'];
  /** Empty when `learners` is not a list. */
  readonly learners: readonly (Learner | undefined)[];
  /** Each learner's name when it is text, whether or not the rest of the learner is valid. */
  readonly learnerNames: readonly (string | undefined)[];
  readonly probe?: FilledConfig['probe'];
  /** Empty when `noise` is not a list. */
  readonly noise: readonly (NoiseEntry | undefined)[];
  /**
   * The config as written with every part that parsed replaced by its parsed value
   * (defaults filled): where vary paths are matched and vary values tried.
   */
  readonly merged: Readonly<Record<string, unknown>>;
  /** Whether every part a top-level key holds is valid (every learner, for `learners`). */
  readonly valid: (section: string) => boolean;
}

function parsedOr<T>(schema: z.ZodType<T>, value: unknown): T | undefined {
  const parsed = schema.safeParse(value);
  return parsed.success ? parsed.data : undefined;
}

function items<T>(schema: z.ZodType<T>, value: unknown): (T | undefined)[] {
  return Array.isArray(value) ? value.map((item) => parsedOr(schema, item)) : [];
}

/** The parts of a config document (the plain data of its YAML). */
export function configParts(raw: unknown): ConfigParts {
  const doc = (raw != null && typeof raw === 'object' && !Array.isArray(raw) ? raw : {}) as Record<string, unknown>;
  const shape = configSchema.shape;
  const seeds = parsedOr(shape.seeds, doc.seeds);
  const collect = parsedOr(shape.collect, doc.collect);
  const senses = parsedOr(shape.senses, doc.senses);
  const probe = parsedOr(shape.probe, doc.probe);
  const learners = items(learnerSchema, doc.learners);
  const noise = doc.noise === undefined ? [] : items(noiseEntrySchema, doc.noise);
  const rawLearners: unknown[] = Array.isArray(doc.learners) ? doc.learners : [];
  const learnerNames = rawLearners.map((item) => {
    const name = (item as { name?: unknown } | null)?.name;
    return typeof name === 'string' ? name : undefined;
  });
  const allValid = (list: readonly unknown[], value: unknown) => (value === undefined || Array.isArray(value)) && list.every((item) => item !== undefined);
  const validity: Record<string, boolean> = {
    seeds: seeds !== undefined, collect: collect !== undefined, senses: senses !== undefined, probe: probe !== undefined,
    learners: Array.isArray(doc.learners) && allValid(learners, doc.learners), noise: allValid(noise, doc.noise),
  };
  const merged = {
    ...doc,
    ...(seeds === undefined ? {} : { seeds }),
    ...(collect === undefined ? {} : { collect }),
    ...(senses === undefined ? {} : { senses }),
    ...(probe === undefined ? {} : { probe }),
    ...(Array.isArray(doc.learners) ? { learners: learners.map((learner, i) => learner ?? rawLearners[i]) } : {}),
    noise: Array.isArray(doc.noise) ? noise.map((entry, i) => entry ?? (doc.noise as unknown[])[i]) : doc.noise ?? [],
  };
  return { seeds, collect, senses, learners, learnerNames, probe, noise, merged, valid: (section) => validity[section] ?? true };
}
