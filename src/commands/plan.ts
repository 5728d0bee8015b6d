import { planCells } from '../experiment/plan.js';
import type { ResolvedSettings } from '../experiment/resolved-config.js';
import { powerLine, type PrimaryFamilyPlan } from '../report/power-line.js';
import { loadSweepFrom, runAction } from './command-line.js';
import { EXIT } from './exit-codes.js';
import { count, printProblem } from './messages.js';
import { planUsage } from './plan-usage.js';
import { formatTable } from './table.js';

/** `crosswise plan`: lists the sweep's cells; runs and writes nothing (see plan-usage.ts). */
export async function planCommand(args: readonly string[]): Promise<number> {
  return runAction(planUsage, args, async ({ operands: [config], values }) => {
    const sweep = loadSweepFrom(config, values.out);
    for (const warning of sweep.warnings) printProblem('plan', warning);
    const cells = planCells(sweep);
    const header = ['index', 'id', 'learner', 'seed', ...sweep.varyKeys];
    const rows = cells.map((cell) => [String(cell.index), cell.id, cell.learner.name, String(cell.seed), ...sweep.varyKeys.map((key) => cell.vary[key])]);
    console.log(formatTable(header, rows));
    const learners = sweep.filled.learners.length; // vary changes learners' settings, never their number
    const factors = [count(sweep.combinations.length, 'combination'), count(sweep.seeds.length, 'seed'), count(learners, 'learner')];
    console.log(`${count(cells.length, 'cell')} (${factors.join(' × ')}); out ${sweep.out}`);
    const lines = sweep.combinations.map(({ settings }) => powerLine(primaryFamily(settings), sweep.seeds.length));
    if (lines.every((line) => line === lines[0])) console.log(lines[0]);
    else lines.forEach((line, i) => console.log(`Combination ${i + 1}: ${line}`));
    return EXIT.success;
  });
}

/** The primary family a combination plans: learners that are neither the baseline nor a control × targets × noises. */
function primaryFamily(settings: ResolvedSettings): PrimaryFamilyPlan {
  const learners = settings.learners.filter((l) => !l.control && l.spec.name !== settings.probe.baseline).length;
  return { learners, targets: settings.probe.targets.length, noises: settings.noise.length };
}
