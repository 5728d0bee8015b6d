// The scheduler settings of crosswise cluster, checked against the forms the sbatch manual
// gives (SchedMD, sbatch(1): --time, --mem, --partition, --account).
import { describe, expect, it } from 'vitest';
import { requestLines, requestProblem } from '../../src/experiment/cluster-request.js';

describe('requestProblem', () => {
  it('accepts every --time form of sbatch(1): minutes, minutes:seconds, hours:minutes:seconds, days-hours, days-hours:minutes, days-hours:minutes:seconds', () => {
    expect(['30', '30:00', '2:00:00', '1-12', '1-12:30', '1-12:30:00'].map((v) => requestProblem('time', v))).toEqual(Array(6).fill(null));
  });

  it('refuses other --time text', () => {
    for (const value of ['2h', '1:2:3:4', '', '-5', '1-', '1.5']) expect(requestProblem('time', value)).toMatch(/^--time: expected /);
  });

  it('accepts --mem as a whole number with an optional unit K, M, G or T, and refuses the rest', () => {
    expect(['4000', '4G', '512M', '1T', '800K', '16g'].map((v) => requestProblem('mem', v))).toEqual(Array(6).fill(null));
    for (const value of ['4 GB', '4.5G', 'G', '4GB', '']) expect(requestProblem('mem', value)).toMatch(/^--mem: expected /);
  });

  it('accepts a comma-separated list of partitions but one account, names without spaces or quotes', () => {
    expect([requestProblem('partition', 'short'), requestProblem('partition', 'short,long.v2'), requestProblem('account', 'lab_7')]).toEqual([null, null, null]);
    expect(requestProblem('partition', 'a b')).toBe("--partition: expected partition names of letters, digits, '.', '_' or '-', separated by commas; got 'a b'");
    expect(requestProblem('account', 'a,b')).toBe("--account: expected an account name of letters, digits, '.', '_' or '-'; got 'a,b'");
    expect(requestProblem('partition', "x'y")).not.toBeNull();
  });
});

describe('requestLines', () => {
  it('writes the given settings as #SBATCH lines in a fixed order and leaves the others to the cluster', () => {
    expect(requestLines({ account: 'lab', time: '10', maxParallel: 4 })).toEqual(['#SBATCH --time=10', '#SBATCH --account=lab']);
    expect(requestLines({})).toEqual([]);
  });
});
