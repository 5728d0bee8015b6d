import { OutputBusyError } from '../results/experiment-record.js';
import { writeFailure } from '../results/write-failure.js';
import { runAction } from './command-line.js';
import { EXIT } from './exit-codes.js';
import { printProblem } from './messages.js';
import { reportUsage } from './report-usage.js';

/** `crosswise report`: rebuilds results.csv, summary.md, comparisons.csv and plots from the stored cells (see report-usage.ts). */
export async function reportCommand(args: readonly string[]): Promise<number> {
  return runAction(reportUsage, args, async ({ operands: [dir] }) => {
    // Imported here so other commands do not pay for loading the plotting library.
    const { buildReport } = await import('../report/build-report.js');
    const files = await buildReport(dir).catch((error: unknown) => error as Error);
    // Stored results that cannot be read are invalid input; a write that failed is exit code 5,
    // a folder of another results format exit code 4 (runAction).
    if (files instanceof Error && (writeFailure(files) != null || files instanceof OutputBusyError)) throw files;
    if (files instanceof Error) {
      printProblem('report', files.message);
      return EXIT.invalidInput;
    }
    for (const warning of files.warnings) printProblem('report', `warning: ${warning}`);
    console.log(`results: ${files.resultsPath}`);
    console.log(`summary: ${files.summaryPath}`);
    console.log(`comparisons: ${files.comparisonsPath}`);
    console.log(`plots: ${files.plots.length} in ${dir.replace(/\/+$/, '')}/plots`);
    return EXIT.success;
  });
}
