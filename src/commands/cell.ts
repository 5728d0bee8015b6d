import { failureReason, PIPELINE_MODULE, type CellWorkModule } from '../experiment/cell-work.js';
import { loadSweepFrom, parseCommand, UsageError, withInputErrors } from '../experiment/command-line.js';
import type { EpochLog } from '../learn/spec.js';
import { cellLabel } from '../experiment/plan.js';
import { plainLine } from '../experiment/plain-log.js';
import { cellEndEvent, prepareOutput } from '../experiment/runner.js';
import { storeCell, type CellResult } from '../experiment/store.js';
import { isFinished } from '../results/cell-folder.js';

/** `crosswise cell <config> --index I [--out DIR]`: runs exactly one cell (one task of a cluster job array). */
export async function cellCommand(args: readonly string[], workModule: string = PIPELINE_MODULE): Promise<number> {
  return withInputErrors(async () => {
    const { config, values } = parseCommand('cell', args, { index: { type: 'string' }, out: { type: 'string' } });
    const sweep = loadSweepFrom(config, values.out);
    const cells = prepareOutput(sweep);
    const index = Number(values.index);
    if (values.index == null || !Number.isInteger(index) || index < 0 || index >= cells.length) {
      throw new UsageError(`crosswise cell: --index: expected an integer from 0 to ${cells.length - 1}, got '${values.index ?? ''}'`);
    }
    const cell = cells[index];
    const print = (event: Parameters<typeof plainLine>[0]) => console.log(plainLine(event, cells.length));
    if (isFinished(sweep.out, cell.id)) {
      console.log(`cell ${index} (${cell.id}) is already finished in ${sweep.out}`);
      return 0;
    }
    print({ type: 'cell-start', cell: cellLabel(cell), worker: 1 });
    const result = await runInProcess(workModule, cell, (log) => print({ type: 'epoch', cell: cellLabel(cell), worker: 1, log }));
    const record = storeCell(sweep.out, cell, result, sweep.varyKeys);
    print(cellEndEvent(cell, 1, result));
    return record.status === 'done' ? 0 : 3;
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
