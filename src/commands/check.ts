import { readFileSync } from 'node:fs';
import { inspectConfigFile } from '../experiment/config.js';
import { fileKind, worldFileProblems, yamlSyntaxProblems, type FileKind } from '../experiment/file-kind.js';
import { fileSizeProblem, INPUT_LIMITS, yamlNestingProblem } from '../input-limits.js';
import { checkUsage } from './check-usage.js';
import { runAction } from './command-line.js';
import { EXIT } from './exit-codes.js';
import { count, printProblem } from './messages.js';

/** What checking one file found. */
interface Checked {
  readonly kind: FileKind | null;
  readonly problems: readonly string[];
  /** Lines about things that are valid but probably not meant; they do not fail the check. */
  readonly warnings: readonly string[];
}

/** The validator of each kind of file. */
const CHECKERS: Readonly<Record<FileKind, (path: string) => Omit<Checked, 'kind'>>> = {
  world: (path) => ({ problems: worldFileProblems(path), warnings: [] }),
  config: inspectConfigFile,
};

/** The problems and warnings of one file, checked as what its content says it is (see fileKind). */
export function checkFile(path: string): Checked {
  // The largest file crosswise reads is a world file; anything larger is refused unread.
  const tooLarge = fileSizeProblem(path, INPUT_LIMITS.worldBytes, 'file');
  if (tooLarge != null) return { kind: null, problems: [tooLarge], warnings: [] };
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (error) {
    return { kind: null, problems: [`${path}:1:1: cannot read the file (${(error as NodeJS.ErrnoException).code ?? String(error)})`], warnings: [] };
  }
  const tooDeep = yamlNestingProblem(text, path);
  if (tooDeep != null) return { kind: null, problems: [tooDeep], warnings: [] };
  const kind = fileKind(text);
  if (kind != null) return { kind, ...CHECKERS[kind](path) };
  const syntax = yamlSyntaxProblems(text, path);
  return {
    kind: null,
    warnings: [],
    problems: syntax.length > 0
      ? syntax
      : [`${path}:1:1: not a world or config file (a world has 'map', 'materials' and 'emitters'; a config has 'learners' and 'world')`],
  };
}

/** `crosswise check`: prints every problem, one per line; exit 1 if any (see check-usage.ts). */
export async function checkCommand(args: readonly string[]): Promise<number> {
  return runAction(checkUsage, args, async ({ operands: paths }) => {
    let failed = false;
    for (const path of paths) {
      const { kind, problems, warnings } = checkFile(path);
      for (const line of [...problems, ...warnings]) printProblem('check', line);
      if (problems.length > 0) failed = true;
      else console.log(`${path}: ok (${kind}${warnings.length > 0 ? `, ${count(warnings.length, 'warning')}` : ''})`);
    }
    return failed ? EXIT.invalidInput : EXIT.success;
  });
}
