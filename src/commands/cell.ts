import { failureReason, PIPELINE_MODULE, type CellWorkModule } from '../experiment/cell-work.js';
import type { EpochLog } from '../learn/spec.js';
import { cellLabel, planCells } from '../experiment/plan.js';
import { plainLine } from '../experiment/plain-log.js';
import { cellEndEvent, prepareOutput, storedCells } from '../experiment/runner.js';
import { storeCell, type CellResult } from '../experiment/store.js';
import { writeFailure } from '../results/write-failure.js';
import { cellUsage } from './cell-usage.js';
import { loadSweepFrom, runAction } from './command-line.js';
import { EXIT } from './exit-codes.js';
import { printProblem } from './messages.js';
import { UsageError } from './usage.js';

/** `crosswise cell`: runs exactly one cell, one task of a cluster job array (see cell-usage.ts). */
export async function cellCommand(args: readonly string[], workModule: string = PIPELINE_MODULE): Promise<number> {
  return runAction(cellUsage, args, async ({ operands: [config], values }) => {
    const sweep = loadSweepFrom(config, values.out);
    const { index } = values;
    // Checked before prepareOutput writes anything: an invalid command line leaves no trace.
    const planned = planCells(sweep).length;
    if (index >= planned) throw new UsageError(`--index: expected a whole number from 0 to ${planned - 1}, got '${index}'`);
    const warn = (line: string) => printProblem('cell', `warning: ${line}`);
    const cells = prepareOutput(sweep, false, warn);
    const cell = cells[index];
    const print = (event: Parameters<typeof plainLine>[0]) => console.log(plainLine(event, cells.length));
    const stored = storedCells(sweep.out, [cell], warn).get(cell.id);
    if (stored?.status === 'done') {
      console.log(`cell ${index} (${cell.id}) is already done in ${sweep.out}`);
      return EXIT.success;
    }
    if (stored?.status === 'failed' && !values['retry-failed']) {
      console.log(`cell ${index} (${cell.id}) failed before (${stored.reason}); add --retry-failed to run it again`);
      return EXIT.cellsFailed;
    }
    print({ type: 'cell-start', cell: cellLabel(cell), worker: 1 });
    const result = await runInProcess(workModule, cell, (log) => print({ type: 'epoch', cell: cellLabel(cell), worker: 1, log }));
    try {
      // A failed cell being retried keeps its record until the new one is stored in its place.
      storeCell(sweep.out, cell, result, sweep.varyKeys, stored?.status === 'failed');
    } catch (error) {
      const failure = writeFailure(error);
      if (failure == null) throw error;
      printProblem('cell', `cell ${index} (${cell.id}): ${failure}`);
      return EXIT.writeFailed;
    }
    print(cellEndEvent(cell, 1, result));
    return result.status === 'done' ? EXIT.success : EXIT.cellsFailed;
  });
}

async function runInProcess(workModule: string, cell: Parameters<CellWorkModule['cellWork']>[0], onEpoch: (log: EpochLog) => void): Promise<CellResult> {
  const started = performance.now();
  const log: EpochLog[] = [];
  const { cellWork } = (await import(workModule)) as CellWorkModule;
  try {
    const outcome = await cellWork(cell, (entry) => {
      log.push(entry);
      onEpoch(entry);
    });
    return { status: 'done', outcome, totalSeconds: (performance.now() - started) / 1000 };
  } catch (error) {
    return { status: 'failed', reason: failureReason(error), log, totalSeconds: (performance.now() - started) / 1000 };
  }
}
