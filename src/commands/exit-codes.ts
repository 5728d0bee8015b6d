/** The exit codes of every crosswise command and what each means. */
export const EXIT_CODES = {
  0: 'success',
  1: 'invalid input (config, world, arguments); nothing written',
  2: 'some cells are missing: not run yet, still running, or lost (status)',
  3: 'some cells failed; the rest completed and are stored (run --retry-failed computes them again)',
  4: 'the output folder is busy (another run holds it) or belongs to another experiment or results format; nothing written',
  5: 'a write failed (a full disk, no permission); what was stored is kept',
  130: 'interrupted; finished cells are kept',
} as const;

/** One of the exit codes in `EXIT_CODES`. */
export type ExitCode = keyof typeof EXIT_CODES;

/** The exit codes by what happened, for `return` statements that read as words. */
export const EXIT = {
  success: 0,
  invalidInput: 1,
  cellsMissing: 2,
  cellsFailed: 3,
  outputBusy: 4,
  writeFailed: 5,
  interrupted: 130,
} as const satisfies Record<string, ExitCode>;
