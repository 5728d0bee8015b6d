/** Dispatch for the `crosswise` command: help and version from the usages, then the chosen command's code. */
import { readFileSync } from 'node:fs';
import { benchUsage } from './commands/bench-usage.js';
import { cellUsage } from './commands/cell-usage.js';
import { checkUsage } from './commands/check-usage.js';
import { clusterUsage } from './commands/cluster-usage.js';
import { EXIT } from './commands/exit-codes.js';
import { exploreUsage } from './commands/explore-usage.js';
import { commandHelp, programHelp, wantsHelp } from './commands/help.js';
import { listenUsage } from './commands/listen-usage.js';
import { printProblem } from './commands/messages.js';
import { planUsage } from './commands/plan-usage.js';
import { recordUsage } from './commands/record-usage.js';
import { reportUsage } from './commands/report-usage.js';
import { runUsage } from './commands/run-usage.js';
import { schemaUsage } from './commands/schema-usage.js';
import { senseUsage } from './commands/sense-usage.js';
import { statusUsage } from './commands/status-usage.js';
import type { CommandUsage } from './commands/usage.js';

/** Every command, in the order `crosswise --help` lists them. */
export const COMMANDS: readonly CommandUsage[] = [
  runUsage, planUsage, cellUsage, clusterUsage, statusUsage, reportUsage, checkUsage, senseUsage, exploreUsage, listenUsage, recordUsage, benchUsage, schemaUsage,
];

/** The package version (src/ and dist/ both sit one folder below package.json). */
export function version(): string {
  return (JSON.parse(readFileSync(new URL('../package.json', import.meta.url), 'utf8')) as { version: string }).version;
}

/** Runs one command line and returns the process exit code. */
export async function main(argv: readonly string[]): Promise<number> {
  const [name, ...rest] = argv;
  if (name == null || name === '--help' || name === '-h' || name === 'help') {
    const usage = COMMANDS.find((c) => c.name === rest[0]);
    console.log(name === 'help' && usage != null ? commandHelp(usage) : programHelp(COMMANDS, version()));
    return EXIT.success;
  }
  if (name === '--version') {
    console.log(`crosswise ${version()}`);
    return EXIT.success;
  }
  const usage = COMMANDS.find((c) => c.name === name);
  if (usage == null) {
    // Loaded only on this path: the did-you-mean rule lives with the config messages.
    const { suggestion } = await import('./experiment/config-errors.js');
    const what = name.startsWith('-') ? 'option' : 'command';
    printProblem(null, `unknown ${what} '${name}'${suggestion(name, what === 'option' ? ['--help', '--version'] : COMMANDS.map((c) => c.name))}; see crosswise --help`);
    return EXIT.invalidInput;
  }
  if (wantsHelp(rest)) {
    console.log(commandHelp(usage));
    return EXIT.success;
  }
  const action = await usage.load();
  return action(rest);
}
