// The crosswise command line with the test double cell work plugged in (run, cell), and a
// file-system fault installed first when CROSSWISE_FAULT asks for one.
import '../faults/inject-from-env.js';
import { cellCommand } from '../../src/commands/cell.js';
import { runCommand } from '../../src/commands/run.js';
import { FAKE_WORK } from './helpers.js';

const [command, ...args] = process.argv.slice(2);
process.exitCode = command === 'cell' ? await cellCommand(args, FAKE_WORK) : await runCommand(args, { workModule: FAKE_WORK });
