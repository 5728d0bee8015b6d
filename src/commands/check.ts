import { readFileSync } from 'node:fs';
import { isMap, parseDocument } from 'yaml';
import { checkConfigFile } from '../experiment/config.js';
import { fileSizeProblem, INPUT_LIMITS, yamlNestingProblem } from '../input-limits.js';
import { checkWorldFile } from '../world/parse.js';
import { checkUsage } from './check-usage.js';
import { runAction } from './command-line.js';
import { EXIT } from './exit-codes.js';
import { printProblem } from './messages.js';

/** A validator for one kind of file, chosen by what the file contains. */
export interface FileChecker {
  /** What the file is, for the "ok" line: "world", "config". */
  readonly kind: string;
  /** Whether this checker is for a file whose top-level keys are `keys`. */
  accepts(keys: ReadonlySet<string>): boolean;
  /** Every problem as `path:line:col: reason`; empty when valid. */
  check(path: string): string[];
}

/** The checkers `crosswise check` tries in order; the first that accepts a file checks it. */
export const CHECKERS: FileChecker[] = [
  { kind: 'world', accepts: (keys) => keys.has('map'), check: checkWorldFile },
  { kind: 'config', accepts: (keys) => keys.has('learners'), check: checkConfigFile },
];

function topLevelKeys(text: string): Set<string> | null {
  const doc = parseDocument(text);
  if (doc.errors.length > 0 || !isMap(doc.contents)) return null;
  return new Set(doc.contents.items.map((pair) => String((pair.key as { value?: unknown })?.value ?? '')));
}

/** The problems of one file, whatever kind it is. */
export function checkFile(path: string): { kind: string | null; problems: string[] } {
  // The largest file crosswise reads is a world file; anything larger is refused unread.
  const tooLarge = fileSizeProblem(path, INPUT_LIMITS.worldBytes, 'file');
  if (tooLarge != null) return { kind: null, problems: [tooLarge] };
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (error) {
    return { kind: null, problems: [`${path}:1:1: cannot read the file (${(error as NodeJS.ErrnoException).code ?? String(error)})`] };
  }
  const tooDeep = yamlNestingProblem(text, path);
  if (tooDeep != null) return { kind: null, problems: [tooDeep] };
  const keys = topLevelKeys(text);
  // A file that does not parse goes to the world checker, which reports YAML syntax errors with positions.
  const checker = keys == null ? CHECKERS[0] : CHECKERS.find((c) => c.accepts(keys));
  if (checker == null) {
    const known = CHECKERS.map((c) => c.kind).join(' or ');
    return { kind: null, problems: [`${path}:1:1: not a ${known} file (a world file has a 'map' key, a config a 'learners' key)`] };
  }
  return { kind: checker.kind, problems: checker.check(path) };
}

/** `crosswise check`: prints every problem, one per line; exit 1 if any (see check-usage.ts). */
export async function checkCommand(args: readonly string[]): Promise<number> {
  return runAction(checkUsage, args, async ({ operands: paths }) => {
    let failed = false;
    for (const path of paths) {
      const { kind, problems } = checkFile(path);
      for (const problem of problems) printProblem('check', problem);
      if (problems.length > 0) failed = true;
      else console.log(`${path}: ok (${kind})`);
    }
    return failed ? EXIT.invalidInput : EXIT.success;
  });
}
