import { describe, expect, it } from 'vitest';
import { parseArguments } from '../../src/commands/parse-arguments.js';
import { runUsage } from '../../src/commands/run-usage.js';
import { listenUsage } from '../../src/commands/listen-usage.js';
import { senseUsage } from '../../src/commands/sense-usage.js';
import { checkUsage } from '../../src/commands/check-usage.js';

const RUN_SYNOPSIS = 'crosswise run <config> [--out DIR] [--jobs N] [--plain] [--backend wasm|cpu]';

/** The one-line message a command line is rejected with. */
function problem(args: readonly string[], usage: Parameters<typeof parseArguments>[0] = runUsage): string {
  try {
    parseArguments(usage, args);
  } catch (error) {
    return (error as Error).message;
  }
  throw new Error(`accepted: ${args.join(' ')}`);
}

describe('reading a command line against its usage', () => {
  it('reads operands and options in any order, as --name value or --name=value, with typed values', () => {
    expect(parseArguments(runUsage, ['--jobs', '2', 'sweep.yaml', '--out=runs/a', '--plain', '--backend', 'cpu'])).toEqual({
      operands: ['sweep.yaml'],
      values: { out: 'runs/a', jobs: 2, plain: true, backend: 'cpu' },
    });
  });

  it('leaves options out as their declared defaults, flags as false, the rest undefined', () => {
    expect(parseArguments(senseUsage, ['w.yaml', '--at', '1,1,east']).values).toEqual({ at: '1,1,east', action: 'stay', step: 0, json: false });
    expect(parseArguments(runUsage, ['sweep.yaml']).values).toEqual({ out: undefined, jobs: undefined, plain: false, backend: undefined });
  });

  it('takes every word after -- as an operand, and a negative number as a value', () => {
    expect(parseArguments(checkUsage, ['a.yaml', '--', '--odd-name.yaml']).operands).toEqual(['a.yaml', '--odd-name.yaml']);
    expect(parseArguments(senseUsage, ['w.yaml', '--at', '1,1,east', '--step', '7']).values.step).toBe(7);
  });

  it('names an unknown option and the nearest valid one', () => {
    expect(problem(['sweep.yaml', '--job', '2'])).toBe("unknown option '--job' (did you mean '--jobs'?); see crosswise run --help");
    expect(problem(['sweep.yaml', '-j', '2'])).toBe("unknown option '-j'; see crosswise run --help");
    expect(problem(['sweep.yaml', '--parallel', '2'])).toBe("unknown option '--parallel'; see crosswise run --help");
  });

  it('rejects malformed values, naming the option, what it expects and what it got', () => {
    expect(problem(['sweep.yaml', '--jobs', '0'])).toBe("--jobs: expected a whole number ≥ 1, got '0'");
    expect(problem(['sweep.yaml', '--jobs', '1.5'])).toBe("--jobs: expected a whole number ≥ 1, got '1.5'");
    expect(problem(['sweep.yaml', '--backend', 'gpu'])).toBe("--backend: expected one of wasm, cpu, got 'gpu' (did you mean 'cpu'?)");
    expect(problem(['sweep.yaml', '--plain=yes'])).toBe("--plain takes no value, got 'yes'");
    expect(problem(['sweep.yaml', '--out'])).toBe('--out needs a value (DIR)');
    expect(problem(['sweep.yaml', '--out', '--plain'])).toBe('--out needs a value (DIR)');
    expect(problem(['sweep.yaml', '--out', 'a', '--out', 'b'])).toBe('--out is given twice');
  });

  it('rejects a missing or extra operand with the usage line, and a missing required option with what it is for', () => {
    expect(problem([])).toBe(`missing <config> (usage: ${RUN_SYNOPSIS})`);
    expect(problem(['a.yaml', 'b.yaml'])).toBe(`unexpected argument 'b.yaml' (usage: ${RUN_SYNOPSIS})`);
    expect(problem(['w.yaml'], senseUsage)).toBe("--at X,Y,HEADING is required (the agent's cell (from 0, x to the right, y down) and heading, e.g. 2,3,north)");
  });

  it('takes an option in place of an operand declared with orOption, one or the other', () => {
    expect(parseArguments(senseUsage, ['--config', 'c.yaml', '--at', '1,1,east']).operands).toEqual([]);
    expect(parseArguments(senseUsage, ['w.yaml', '--at', '1,1,east']).values.config).toBeUndefined();
    const synopsis = 'crosswise sense (<world> | --config FILE) --at X,Y,HEADING [--action A] [--step N] [--json]';
    expect(problem(['w.yaml', '--config', 'c.yaml', '--at', '1,1,east'], senseUsage)).toBe(`give <world> or --config FILE, not both (usage: ${synopsis})`);
    expect(problem(['--at', '1,1,east'], senseUsage)).toBe(`missing <world> or --config FILE (usage: ${synopsis})`);
  });

  it('takes any one of several options in place of an operand', () => {
    const synopsis = 'crosswise listen (<world> | --config FILE | --replay DIR) [--index I] [--steps N] [--seed S] [--policy P] --out FILE.wav';
    expect(parseArguments(listenUsage, ['--replay', 'walk', '--out', 'a.wav']).operands).toEqual([]);
    expect(problem(['w.yaml', '--replay', 'walk', '--out', 'a.wav'], listenUsage)).toBe(`give only one of <world>, --config FILE, --replay DIR (usage: ${synopsis})`);
    expect(problem(['--out', 'a.wav'], listenUsage)).toBe(`missing <world>, --config FILE or --replay DIR (usage: ${synopsis})`);
  });

  it('does not mistake a name inherited by every object for an option', () => {
    expect(problem(['sweep.yaml', '--constructor', 'x'])).toBe("unknown option '--constructor'; see crosswise run --help");
  });
});
