import type { RunEvent, RunListener } from './events.js';

/** A listener that writes one plain line per event (no colour, no cursor movement). */
export function plainLogger(write: (line: string) => void): RunListener {
  let total = 0;
  return (event) => {
    if (event.type === 'sweep-start') total = event.total;
    write(plainLine(event, total));
  };
}

/** One line of text for an event; `total` is the sweep's number of cells. */
export function plainLine(event: RunEvent, total: number): string {
  const at = (index: number) => `[${String(index + 1).padStart(String(total).length)}/${total}]`;
  switch (event.type) {
    case 'sweep-start':
      return `sweep ${event.name}: writing to ${event.out}; ${plural(event.total, 'cell')}, ${event.skipped} already finished, ${plural(event.jobs, 'job')}`;
    case 'cell-start':
      return `${at(event.cell.index)} start ${describe(event.cell)} on worker ${event.worker}`;
    case 'epoch': {
      const { log } = event;
      const angles = log.alignmentDeg.length === 0 ? '' : ` alignment ${log.alignmentDeg.map((a) => `${a.toFixed(1)}°`).join(' ')}`;
      const firing = log.firing == null ? ''
        : ` firing ${log.firing.rateHz.map((r) => r.toFixed(0)).join('/')} Hz silent ${log.firing.silentFraction.map((f) => `${(100 * f).toFixed(0)}%`).join('/')}`;
      return `${at(event.cell.index)} ${describe(event.cell)} epoch ${log.epoch} train loss ${log.trainLoss.toPrecision(4)} validation loss ${log.validationLoss.toPrecision(4)}${angles}${firing}`;
    }
    case 'cell-done':
      return `${at(event.cell.index)} done ${describe(event.cell)} in ${event.seconds.toFixed(1)} s, ${event.scores.length} scores`;
    case 'cell-failed':
      return `${at(event.cell.index)} FAILED ${describe(event.cell)}: ${event.reason}`;
    case 'sweep-done':
      return `sweep ${event.interrupted ? 'interrupted' : 'done'}: ${event.done} done, ${event.failed} failed in ${event.seconds.toFixed(1)} s; ${event.summary}`;
  }
}

/** `1 job`, `2 jobs`. */
function plural(n: number, noun: string): string {
  return `${n} ${noun}${n === 1 ? '' : 's'}`;
}

function describe(cell: { readonly id: string; readonly learner: string; readonly seed: number; readonly vary: Readonly<Record<string, string>> }): string {
  const vary = Object.entries(cell.vary).map(([key, value]) => ` ${key}=${value}`).join('');
  return `${cell.learner} seed ${cell.seed}${vary} (${cell.id})`;
}
