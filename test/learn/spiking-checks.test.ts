import { describe, expect, it } from 'vitest';
import { SPIKING_DEFAULTS } from '../../src/experiment/defaults.js';
import { spikingProblems } from '../../src/learn/spiking-checks.js';

describe('spiking settings checks', () => {
  it('pass the documented defaults under every rule that has a spiking version', () => {
    for (const rule of ['backprop', 'feedback-alignment', 'direct-feedback-alignment']) expect(spikingProblems(SPIKING_DEFAULTS, rule)).toEqual([]);
  });

  it('refuse a rule without a spiking version at the rule key, naming it and the rules that can', () => {
    expect(spikingProblems(SPIKING_DEFAULTS, 'kolen-pollack')).toEqual([{
      key: ['rule'], message: "rule 'kolen-pollack' cannot train a spiking encoder; expected one of backprop | feedback-alignment | direct-feedback-alignment",
    }]);
  });

  it('refuse settings outside the model, each at its own key', () => {
    const problems = spikingProblems({ ...SPIKING_DEFAULTS, steps: 2.5, tauMs: 0, dtMs: 0.5, refractoryMs: 0.75, surrogateSlope: Number.POSITIVE_INFINITY }, 'backprop');
    expect(problems.map((p) => p.key.join('.'))).toEqual(['encoder.steps', 'encoder.tau_ms', 'encoder.surrogate_slope', 'encoder.refractory_ms']);
    // 0.75 ms is 1.5 steps of 0.5 ms; 1 ms would be exactly 2.
    expect(spikingProblems({ ...SPIKING_DEFAULTS, dtMs: 0.5, refractoryMs: 1 }, 'backprop')).toEqual([]);
  });
});
