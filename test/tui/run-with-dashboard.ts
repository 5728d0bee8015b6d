// `crosswise run` with the dashboard and the experiment tests' double for the cell work.
import { runCommand } from '../../src/commands/run.js';
import { renderDashboard } from '../../src/tui/dashboard/render-dashboard.js';
import { FAKE_WORK } from '../experiment/helpers.js';

process.exitCode = await runCommand(process.argv.slice(2), { workModule: FAKE_WORK, dashboard: renderDashboard });
