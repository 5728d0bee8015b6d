/**
 * One line reporting a problem on stderr: `crosswise <command>: <message>`, or
 * `crosswise: <message>` before a command is known. A problem located in a file keeps its
 * `file:line:col:` right after the prefix (GNU Coding Standards, "Formatting Error Messages").
 */
export function printProblem(command: string | null, message: string): void {
  console.error(`${command == null ? 'crosswise' : `crosswise ${command}`}: ${message}`);
}

/** `1 seed`, `3 seeds`: a count with its noun in the right number (nouns taking a plain -s). */
export function count(n: number, noun: string): string {
  return `${n} ${noun}${n === 1 ? '' : 's'}`;
}
