import { loadSweepFrom, parseCommand, withInputErrors } from '../experiment/command-line.js';
import { planCells } from '../experiment/plan.js';
import { formatTable } from '../experiment/table.js';

/** `crosswise plan <config> [--out DIR]`: lists the sweep's cells; runs and writes nothing. */
export async function planCommand(args: readonly string[]): Promise<number> {
  return withInputErrors(async () => {
    const { config, values } = parseCommand('plan', args, { out: { type: 'string' } });
    const sweep = loadSweepFrom(config, values.out);
    const cells = planCells(sweep);
    const header = ['index', 'id', 'learner', 'seed', ...sweep.varyKeys];
    const rows = cells.map((cell) => [String(cell.index), cell.id, cell.learner.name, String(cell.seed), ...sweep.varyKeys.map((key) => cell.vary[key])]);
    console.log(formatTable(header, rows));
    console.log(`${cells.length} cells (${sweep.combinations.length} combinations × ${sweep.seeds.length} seeds × learners); out ${sweep.out}`);
    return 0;
  });
}
