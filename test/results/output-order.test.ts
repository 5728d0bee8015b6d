import { describe, expect, it } from 'vitest';
import { orderCellRows, outputOrder } from '../../src/results/output-order.js';
import { formatPlanCsv, parsePlanCsv, type PlanEntry } from '../../src/results/plan-table.js';
import type { Measurement } from '../../src/results/results-table.js';

const STEPS = 'collect.steps';

// Test data: a plan of 2 step counts × seeds [3, 1] × learners [zeta, alpha], in plan
// order (vary values slowest, then seeds, then learners, each in config order).
const plan: PlanEntry[] = [];
for (const steps of ['2000', '1000']) {
  for (const seed of [3, 1]) {
    for (const learner of ['zeta', 'alpha']) plan.push({ index: plan.length, cell: `c${plan.length}`, learner, seed, vary: { [STEPS]: steps } });
  }
}

describe('plan.csv', () => {
  it('reads back the plan it was written from', () => {
    const text = formatPlanCsv({ varyKeys: [STEPS], entries: plan });
    expect(text.split('\n').slice(0, 2)).toEqual(['index,cell,learner,seed,collect.steps', '0,c0,zeta,3,2000']);
    expect(parsePlanCsv(text, 'plan.csv')).toEqual({ varyKeys: [STEPS], entries: plan });
  });

  it('names the line of an index out of order', () => {
    expect(() => parsePlanCsv('index,cell,learner,seed\n1,c0,a,1\n', 'o/plan.csv')).toThrow("o/plan.csv:2: index: expected 0, got '1'");
  });
});

describe('output order', () => {
  it('lists cells by vary combination, then learner, then seed, each in config order', () => {
    expect(outputOrder([...plan].reverse(), [STEPS]).map((e) => `${e.vary[STEPS]} ${e.learner} ${e.seed}`)).toEqual([
      '1000 alpha 1', '1000 alpha 3', '1000 zeta 1', '1000 zeta 3', '2000 alpha 1', '2000 alpha 3', '2000 zeta 1', '2000 zeta 3',
    ]);
    expect(outputOrder(plan, [STEPS]).map((e) => e.index)).toEqual([0, 2, 1, 3, 4, 6, 5, 7]);
  });

  it("orders a cell's rows by target, then noise, then severity, in config order, CKA rows after the targets", () => {
    const row = (target: string, channel: string, severity: number, metric: Measurement['metric'] = 'r2'): Measurement =>
      ({ target, channel, kind: 'gaussian', severity, parameter: severity, measure: 'score', metric, value: 0 });
    const rows = [row('-', 'sight', 0, 'cka'), row('y', 'sound', 2), row('x', 'sight', 2), row('y', 'sight', 0),
      row('x', 'sight', 0, 'accuracy'), row('x', 'sight', 0, 'chance'), row('y', 'sight', 2)];
    const noise = [{ channel: 'sight' as const, kind: 'gaussian' as const, severities: [0, 2] }, { channel: 'sound' as const, kind: 'gaussian' as const, severities: [2] }];
    const ordered = orderCellRows(rows, ['y', 'x'], noise).map((r) => `${r.target} ${r.channel} ${r.severity} ${r.metric}`);
    expect(ordered).toEqual(['y sight 0 r2', 'y sight 2 r2', 'y sound 2 r2', 'x sight 0 accuracy', 'x sight 0 chance', 'x sight 2 r2', '- sight 0 cka']);
  });
});
