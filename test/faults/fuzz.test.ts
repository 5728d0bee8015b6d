// Property-based fuzzing (fast-check) of the three readers of user input: the world
// parser, the config loader and vary expansion. Each input starts as a shipped file and is
// mutated (characters inserted, deleted, duplicated or swapped for YAML tokens that
// hurt: anchors and aliases, brackets, merge keys, tabs, `.nan`, `1e400`, emoji, control
// characters). The property: the input loads, or every problem is one `file:line:col:`
// line; never any other exception. Run counts are modest so the suite stays fast; the
// fixed seed makes a failure reproducible (fast-check prints the counterexample).
import { cpSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import fc from 'fast-check';
import { beforeAll, describe, expect, it } from 'vitest';
import { ConfigError } from '../../src/experiment/config-errors.js';
import { POLICY_NAMES } from '../../src/collect/policies.js';
import { loadSweep } from '../../src/experiment/config.js';
import { planCells } from '../../src/experiment/plan.js';
import { ACTIVATIONS, RULES } from '../../src/learn/spec.js';
import { checkWorldText, parseWorld } from '../../src/world/parse.js';
import { WorldFileError } from '../../src/world/problems.js';

const ROOT = new URL('../../', import.meta.url).pathname;
const SEED = Number(process.env.FUZZ_SEED ?? 14);

/** Text fragments that have broken YAML readers: structure, aliases, odd numbers, odd characters. */
const HOSTILE = [
  '&a ', '*a', '<<: *a', '[', ']', '{', '}', ': ', '- ', '? ', '|', '>', '#', '"', "'", '\t', '\n', '\n  ', '\r\n',
  '.nan', '.inf', '-.inf', '1e400', '-0', '0x1F', '~', 'null', 'true', '!!binary', '%YAML 1.1\n---\n', '---\n', '...\n',
  '🌱', '木', '\u0000', '\u200b', '\ufeff', ','.repeat(3), '['.repeat(200),
];

/** One edit of a text at a relative position (0 start, 1 end): insert a fragment, delete or duplicate a span. */
interface Edit {
  readonly at: number;
  readonly kind: 'insert' | 'delete' | 'duplicate';
  readonly fragment: string;
  readonly span: number;
}

const edit: fc.Arbitrary<Edit> = fc.record({
  at: fc.double({ min: 0, max: 1, noNaN: true }),
  kind: fc.constantFrom('insert', 'delete', 'duplicate'),
  fragment: fc.oneof(fc.constantFrom(...HOSTILE), fc.string({ unit: 'binary', maxLength: 6 })),
  span: fc.integer({ min: 1, max: 40 }),
});

function mutate(text: string, edits: readonly Edit[]): string {
  return edits.reduce((t, { at, kind, fragment, span }) => {
    const i = Math.floor(at * t.length);
    if (kind === 'insert') return t.slice(0, i) + fragment + t.slice(i);
    if (kind === 'delete') return t.slice(0, i) + t.slice(i + span);
    return t.slice(0, i + span) + t.slice(i, i + span) + t.slice(i + span);
  }, text);
}

/** Whether every line of a problem list is `file:line:col: reason`, one line each. */
function located(problems: readonly string[], file: string): boolean {
  const prefix = new RegExp(`^${file.replace(/[.*+?^${}()|[\]\\/]/g, '\\$&')}:\\d+:\\d+: \\S`);
  return problems.length > 0 && problems.every((p) => prefix.test(p) && !p.includes('\n'));
}

describe('fuzzing the world parser from the shipped worlds', () => {
  const worlds = readdirSync(join(ROOT, 'worlds')).filter((name) => name.endsWith('.yaml'));

  it('loads every mutated world or reports each problem as one located line', () => {
    const seen = { loaded: 0, refused: 0 };
    fc.assert(fc.property(fc.constantFrom(...worlds), fc.array(edit, { minLength: 1, maxLength: 4 }), (name, edits) => {
      const text = mutate(readFileSync(join(ROOT, 'worlds', name), 'utf8'), edits);
      const problems = checkWorldText(text, name);
      if (problems.length === 0) expect(parseWorld(text, name).width).toBeGreaterThan(0);
      else expect(located(problems, name)).toBe(true);
      seen[problems.length === 0 ? 'loaded' : 'refused']++;
    }), { seed: SEED, numRuns: Number(process.env.FUZZ_RUNS ?? 150) });
    // The mutations must reach both sides of the property.
    expect(Math.min(seen.loaded, seen.refused)).toBeGreaterThan(0);
  });
});

describe('fuzzing the config loader and vary expansion from the shipped configs', () => {
  let dir: string;
  beforeAll(() => {
    // Configs name their worlds as ../worlds/<name>.yaml: keep that layout in a scratch folder.
    dir = mkdtempSync(join(tmpdir(), 'crosswise-fuzz-'));
    cpSync(join(ROOT, 'configs'), join(dir, 'configs'), { recursive: true });
    cpSync(join(ROOT, 'worlds'), join(dir, 'worlds'), { recursive: true });
  });
  const configs = readdirSync(join(ROOT, 'configs')).filter((name) => name.endsWith('.yaml'));

  /** Loads config text written beside the shipped ones; returns the cell count, or the problem lines. */
  function load(text: string): { cells: number } | { problems: readonly string[] } {
    const path = join(dir, 'configs', 'fuzzed.yaml');
    writeFileSync(path, text);
    try {
      return { cells: planCells(loadSweep(path)).length };
    } catch (error) {
      if (error instanceof ConfigError) return { problems: error.lines };
      if (error instanceof WorldFileError) return { problems: error.problems };
      throw error;
    }
  }

  it('loads every mutated config or reports each problem as one located line', () => {
    const seen = { loaded: 0, refused: 0 };
    fc.assert(fc.property(fc.constantFrom(...configs), fc.array(edit, { minLength: 1, maxLength: 4 }), (name, edits) => {
      const outcome = load(mutate(readFileSync(join(ROOT, 'configs', name), 'utf8'), edits));
      if ('problems' in outcome) expect(located(outcome.problems, join(dir, 'configs', 'fuzzed.yaml'))).toBe(true);
      else expect(outcome.cells).toBeGreaterThan(0);
      seen['problems' in outcome ? 'refused' : 'loaded']++;
    }), { seed: SEED, numRuns: Number(process.env.FUZZ_RUNS ?? 60) });
    // The mutations must reach both sides of the property.
    expect(Math.min(seen.loaded, seen.refused)).toBeGreaterThan(0);
  });

  /** Vary values a user might write by mistake: wrong kinds, out of range, odd characters. */
  const junk = fc.oneof(
    fc.integer({ min: -5, max: 50_000 }), fc.double({ noNaN: false }), fc.constantFrom('wander', 'relu', 'backprop', '', '🌱'),
    fc.array(fc.integer({ min: -2, max: 300 }), { maxLength: 3 }), fc.constant(null), fc.boolean(),
  );
  /** Vary paths with values that are valid for them (most draws), so that many sweeps load and expand. */
  const SETTINGS: Readonly<Record<string, fc.Arbitrary<unknown>>> = {
    'collect.steps': fc.integer({ min: 2000, max: 30_000 }),
    'collect.policy': fc.constantFrom(...POLICY_NAMES),
    'collect.episode_steps': fc.integer({ min: 20, max: 400 }),
    'senses.sight.width': fc.integer({ min: 1, max: 9 }),
    'learners.*.encoder.hidden': fc.array(fc.integer({ min: 2, max: 128 }), { minLength: 1, maxLength: 3 }),
    'learners.*.encoder.activation': fc.constantFrom(...ACTIVATIONS),
    'learners.*.rule': fc.constantFrom(...RULES),
    'learners.0.train.learning_rate': fc.double({ min: 1e-5, max: 0.1, noNaN: true }),
    // Paths that name no setting, or a setting vary may not change: always a problem.
    'learners.nobody.rule': fc.constantFrom(...RULES),
    'seeds': fc.integer({ min: 1, max: 9 }),
    'out': fc.constant('elsewhere'),
  };
  const varyKey = fc.constantFrom(...Object.keys(SETTINGS)).chain((key) => fc.tuple(
    fc.constant(key),
    fc.array(fc.oneof({ arbitrary: SETTINGS[key], weight: 4 }, { arbitrary: junk, weight: 1 }), { minLength: 1, maxLength: 4 }),
  ));

  it('expands every vary map into the product of its lists, or reports one located line per problem', () => {
    const base = readFileSync(join(ROOT, 'configs', 'quickstart.yaml'), 'utf8');
    const unvaried = load(base);
    if (!('cells' in unvaried)) throw new Error(`configs/quickstart.yaml does not load: ${unvaried.problems[0]}`);
    let expanded = 0;
    fc.assert(fc.property(fc.uniqueArray(varyKey, { selector: ([key]) => key, minLength: 1, maxLength: 2 }), (vary) => {
      const lines = vary.map(([key, values]) => `  ${key}: ${JSON.stringify(values)}`);
      const outcome = load(`${base}vary:\n${lines.join('\n')}\n`);
      if ('problems' in outcome) {
        expect(located(outcome.problems, join(dir, 'configs', 'fuzzed.yaml'))).toBe(true);
      } else {
        expanded++;
        const combinations = vary.reduce((n, [, values]) => n * values.length, 1);
        expect(outcome.cells).toBe(combinations * unvaried.cells);
      }
    }), { seed: SEED, numRuns: Number(process.env.FUZZ_RUNS ?? 60) });
    // The property must see sweeps that load, not only problems.
    expect(expanded).toBeGreaterThan(0);
  });
});
