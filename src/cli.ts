/** Argument parsing and dispatch for the `crosswise` command. */
import { exploreCommand } from './commands/explore.js';
import { benchCommand } from './commands/bench.js';
import { cellCommand } from './commands/cell.js';
import { clusterCommand } from './commands/cluster.js';
import { planCommand } from './commands/plan.js';
import { runCommand } from './commands/run.js';
import { schemaCommand } from './commands/schema.js';
import { reportCommand } from './commands/report.js';
import { renderDashboard } from './tui/dashboard/render-dashboard.js';
import { checkCommand } from './commands/check.js';
import { senseCommand } from './commands/sense.js';
import { listenCommand } from './commands/listen.js';

const USAGE = `crosswise: a gridworld lab for cross-modal self-supervised learning

usage:
  crosswise run <config> [--out DIR] [--jobs N] [--plain] [--backend wasm|cpu]
  crosswise plan <config>
  crosswise cell <config> --index I [--out DIR]
  crosswise cluster <config> --out DIR
  crosswise report <DIR>
  crosswise check <file>...
  crosswise sense <world> --at X,Y,HEADING [--action A] [--step N] [--json]
  crosswise explore [world] [--seed N]
  crosswise listen (world | --config FILE [--index I]) [--steps N] [--seed S] [--policy P] --out FILE.wav
  crosswise bench [--json] [--quick]
  crosswise schema`;

type Command = (args: readonly string[]) => Promise<number>;

const COMMANDS: Record<string, Command> = {
  explore: exploreCommand,
  run: (args) => runCommand(args, { dashboard: renderDashboard }),
  plan: planCommand,
  cell: (args) => cellCommand(args),
  cluster: clusterCommand,
  schema: schemaCommand,
  report: reportCommand,
  check: checkCommand,
  sense: senseCommand,
  bench: benchCommand,
  listen: listenCommand,
};

/** Runs one command line and returns the process exit code. */
export async function main(argv: readonly string[]): Promise<number> {
  const [name, ...rest] = argv;
  if (name == null || name === '--help' || name === '-h' || name === 'help') {
    console.log(USAGE);
    return 0;
  }
  const command = COMMANDS[name];
  if (command == null) {
    console.error(`crosswise: unknown command '${name}'\n${USAGE}`);
    return 1;
  }
  return command(rest);
}
