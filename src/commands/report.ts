/** `crosswise report <DIR>`: rebuilds results.csv, summary.md, comparisons.csv and plots from the stored cells. */
export async function reportCommand(args: readonly string[]): Promise<number> {
  if (args.length !== 1 || args[0].startsWith('-')) {
    console.error('crosswise report: expected exactly one argument, the output directory (crosswise report <DIR>)');
    return 1;
  }
  try {
    // Imported here so other commands do not pay for loading the plotting library.
    const { buildReport } = await import('../report/build-report.js');
    const files = await buildReport(args[0]);
    for (const warning of files.warnings) console.error(`warning: ${warning}`);
    console.log(`results: ${files.resultsPath}`);
    console.log(`summary: ${files.summaryPath}`);
    console.log(`comparisons: ${files.comparisonsPath}`);
    console.log(`plots: ${files.plots.length} in ${args[0].replace(/\/+$/, '')}/plots`);
    return 0;
  } catch (error) {
    console.error(`crosswise report: ${(error as Error).message}`);
    return 1;
  }
}
