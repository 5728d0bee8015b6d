import { ConfigError } from '../experiment/config-errors.js';
import { loadSweep } from '../experiment/config.js';
import type { Sweep } from '../experiment/resolved-config.js';
import { OutputBusyError } from '../results/experiment-record.js';
import { writeFailure } from '../results/write-failure.js';
import { WorldFileError } from '../world/problems.js';
import { EXIT } from './exit-codes.js';
import { commandHelp, wantsHelp } from './help.js';
import { printProblem } from './messages.js';
import { parseArguments } from './parse-arguments.js';
import { UsageError, type CommandUsage, type OptionDeclaration, type ParsedArguments } from './usage.js';

/** The lines to print for an input problem (a config, a world or the command line), or null for any other error. */
function inputProblems(error: unknown): readonly string[] | null {
  if (error instanceof ConfigError) return error.lines;
  if (error instanceof WorldFileError) return error.problems;
  if (error instanceof UsageError) return [error.message];
  return null;
}

/**
 * Runs a command's body on its parsed command line. `-h`/`--help` prints the command's help
 * instead; an invalid command line, config or world prints each problem as one
 * `crosswise <command>: ...` line and returns exit code 1 (the body must not have written
 * anything by then); an output folder that is busy or belongs to another experiment is one
 * line and exit code 4; a failed write to the file system is one line and exit code 5.
 */
export async function runAction<Os extends Record<string, OptionDeclaration>>(
  usage: CommandUsage<Os>,
  args: readonly string[],
  body: (parsed: ParsedArguments<Os>) => Promise<number>,
): Promise<number> {
  if (wantsHelp(args)) {
    console.log(commandHelp(usage));
    return EXIT.success;
  }
  try {
    return await body(parseArguments(usage, args));
  } catch (error) {
    const problems = inputProblems(error);
    if (problems != null) {
      for (const problem of problems) printProblem(usage.name, problem);
      return EXIT.invalidInput;
    }
    if (error instanceof OutputBusyError) {
      printProblem(usage.name, error.message);
      return EXIT.outputBusy;
    }
    const failedWrite = writeFailure(error);
    if (failedWrite == null) throw error;
    printProblem(usage.name, failedWrite);
    return EXIT.writeFailed;
  }
}

/** Loads a config, with `--out` overriding its output folder. */
export function loadSweepFrom(config: string, out: string | undefined): Sweep {
  return loadSweep(config, out == null ? {} : { out });
}
