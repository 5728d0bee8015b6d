import { readFileSync } from 'node:fs';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { COMMANDS, main } from '../../src/cli.js';

let out: string[];
let err: string[];

beforeEach(() => {
  out = [];
  err = [];
  vi.spyOn(console, 'log').mockImplementation((text: string) => { out.push(...String(text).split('\n')); });
  vi.spyOn(console, 'error').mockImplementation((text: string) => { err.push(...String(text).split('\n')); });
});

afterEach(() => vi.restoreAllMocks());

const VERSION = (JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version: string }).version;

// The exit codes of the command-line contract, in the words every help page uses.
const EXIT_CODE_LINES = [
  '  0    success',
  '  1    invalid input (config, world, arguments); nothing written',
  '  2    some cells are missing: not run yet, still running, or lost (status)',
  '  3    some cells failed; the rest completed and are stored',
  '  4    the output folder is busy or belongs to another experiment',
  '  5    a write failed',
  '  130  interrupted; finished cells are kept',
];

describe('crosswise --help', () => {
  it('lists every command with what it does, how to get more help, and the exit codes', async () => {
    expect(await main(['--help'])).toBe(0);
    expect(out).toEqual([
      `crosswise ${VERSION}: a gridworld lab for cross-modal self-supervised learning`,
      '',
      'usage: crosswise <command> [arguments] [options]',
      '',
      'commands:',
      '  run      run every cell of a sweep, then build the report; resumable',
      "  plan     list a sweep's cells; runs and writes nothing",
      '  cell     run one cell of a sweep (one task of a cluster job array)',
      '  cluster  write a Slurm job-array script for the cells still missing',
      '  status   list finished, failed and missing cells, and how to resubmit',
      '  report   rebuild summary.md, comparisons.csv and the plots from stored results',
      '  check    validate config and world files',
      '  sense    every channel and latent at one pose of a world',
      '  explore  walk a world with every sense drawn live (an interactive terminal',
      '           app)',
      '  listen   what the agent hears along a walk, as a stereo WAV file',
      "  record   the agent's experience as NumPy arrays, for use outside crosswise",
      '  bench    speed of collection, training and a whole sweep, beside PyTorch when',
      '           present',
      '  schema   print the config JSON Schema, for editors',
      '',
      "  crosswise <command> --help  a command's arguments, options, an example and its",
      '                              exit codes',
      '  crosswise --version         the version',
      '',
      'exit codes:',
      ...EXIT_CODE_LINES,
    ]);
    expect(err).toEqual([]);
  });

  it('is also what a bare crosswise and crosswise help print', async () => {
    await main(['--help']);
    const help = [...out];
    out.length = 0;
    expect(await main([])).toBe(0);
    expect(await main(['help'])).toBe(0);
    expect(out).toEqual([...help, ...help]);
  });

  it('prints the version with --version', async () => {
    expect(await main(['--version'])).toBe(0);
    expect(out).toEqual([`crosswise ${VERSION}`]);
  });

  it('names an unknown command and the nearest one in one line, exit 1', async () => {
    expect(await main(['rn', 'configs/quickstart.yaml'])).toBe(1);
    expect(await main(['--verison'])).toBe(1);
    expect(await main(['launch'])).toBe(1);
    expect(err).toEqual([
      "crosswise: unknown command 'rn' (did you mean 'run'?); see crosswise --help",
      "crosswise: unknown option '--verison' (did you mean '--version'?); see crosswise --help",
      "crosswise: unknown command 'launch'; see crosswise --help",
    ]);
    expect(out).toEqual([]);
  });
});

describe('crosswise <command> --help', () => {
  it('shows run: what it does, each option with its default, an example and the exit codes', async () => {
    expect(await main(['run', '--help'])).toBe(0);
    expect(out).toEqual([
      'crosswise run: run every cell of a sweep, then build the report; resumable',
      '',
      'usage: crosswise run <config> [--out DIR] [--jobs N] [--plain] [--backend wasm|cpu]',
      '',
      'Finished cells in the output folder are skipped, so the same command resumes an',
      'interrupted sweep. The numbers do not depend on --jobs. Ctrl-C lets running',
      'cells finish; a second Ctrl-C abandons them.',
      '',
      'arguments:',
      '  <config>  the sweep config (YAML)',
      '',
      'options:',
      "  --out DIR           output folder (default: the config's out, else runs/<name>",
      '                      beside the config)',
      '  --jobs N            cells run at once, each on its own worker thread (default:',
      '                      the number of cores)',
      '  --plain             one line per event instead of the live dashboard (default:',
      '                      on when stdout is not a terminal)',
      "  --backend wasm|cpu  TensorFlow.js backend for training (default: the config's",
      '                      backend)',
      '  -h, --help          this help',
      '',
      'example:',
      '  crosswise run configs/quickstart.yaml --jobs 2',
      '',
      'exit codes:',
      ...EXIT_CODE_LINES.filter((line) => !line.startsWith('  2 ') && !line.startsWith('  4 ')),
    ]);
  });

  it('shows sense: an option standing in for the operand, a required option, a long choice list behind a placeholder, literal defaults', async () => {
    expect(await main(['sense', '-h'])).toBe(0);
    expect(out.slice(2, 3)).toEqual(['usage: crosswise sense (<world> | --config FILE) --at X,Y,HEADING [--action A] [--step N] [--json]']);
    expect(out.slice(out.indexOf('options:'), out.indexOf('examples:'))).toEqual([
      'options:',
      '  --config FILE     a sweep config, for its world and sense settings',
      "  --at X,Y,HEADING  the agent's cell (from 0, x to the right, y down) and",
      '                    heading, e.g. 2,3,north (required)',
      '  --action A        the action that brought the agent there; touch, motor and',
      '                    footsteps depend on it (one of forward, back, turn-left,',
      '                    turn-right, stay; default: stay)',
      "  --step N          the step number, which sets the emitters' on/off phase",
      '                    (default: 0)',
      '  --json            one JSON object instead of tables',
      '  -h, --help        this help',
      '',
    ]);
    expect(out.slice(out.indexOf('exit codes:'))).toEqual(['exit codes:', ...EXIT_CODE_LINES.slice(0, 2).map((l) => l.replace('    ', '  '))]);
  });

  it('shows help for every command, even after other arguments, without running it (report --help once demanded a folder)', async () => {
    for (const usage of COMMANDS) {
      out.length = 0;
      expect(await main([usage.name, 'some.yaml', '--help'])).toBe(0);
      expect(out[0]).toBe(`crosswise ${usage.name}: ${usage.summary}`);
      for (const option of Object.keys(usage.options)) expect(out.some((line) => line.startsWith(`  --${option}`))).toBe(true);
      expect(out).toContain('exit codes:');
    }
    expect(err).toEqual([]);
  });

  it('is also what crosswise help <command> prints', async () => {
    await main(['plan', '--help']);
    const help = [...out];
    out.length = 0;
    expect(await main(['help', 'plan'])).toBe(0);
    expect(out).toEqual(help);
  });

  it('treats --help after -- as an operand, not a request for help', async () => {
    expect(await main(['check', '--', '--help'])).toBe(1);
    expect(err).toEqual(['crosswise check: --help:1:1: cannot read the file (ENOENT)']);
  });
});
