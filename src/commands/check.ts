import { readFileSync } from 'node:fs';
import { checkConfigFile } from '../experiment/config.js';
import { fileKind, worldFileProblems, yamlSyntaxProblems, type FileKind } from '../experiment/file-kind.js';
import { checkUsage } from './check-usage.js';
import { runAction } from './command-line.js';
import { EXIT } from './exit-codes.js';
import { printProblem } from './messages.js';

/** The validator of each kind of file. */
const CHECKERS: Readonly<Record<FileKind, (path: string) => string[]>> = {
  world: worldFileProblems,
  config: checkConfigFile,
};

/** The problems of one file, checked as what its content says it is (see fileKind). */
export function checkFile(path: string): { kind: FileKind | null; problems: string[] } {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (error) {
    return { kind: null, problems: [`${path}:1:1: cannot read the file (${(error as NodeJS.ErrnoException).code ?? String(error)})`] };
  }
  const kind = fileKind(text);
  if (kind != null) return { kind, problems: CHECKERS[kind](path) };
  const syntax = yamlSyntaxProblems(text, path);
  return {
    kind: null,
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
      const { kind, problems } = checkFile(path);
      for (const problem of problems) printProblem('check', problem);
      if (problems.length > 0) failed = true;
      else console.log(`${path}: ok (${kind})`);
    }
    return failed ? EXIT.invalidInput : EXIT.success;
  });
}
