import { describe, expect, it } from 'vitest';
import { lifBackward, lifForward, lifParameters, type LifArrays, type LifParameters } from '../../src/learn/lif.js';
import { SURROGATE_REGISTRY } from '../../src/learn/surrogates.js';

/** A single unit held at input current `current` (R·I, in the threshold's units) for `steps` steps; returns its spike times in ms. */
function spikeTimes(current: number, p: LifParameters, dtMs: number): number[] {
  const out: LifArrays = {
    spikes: new Float32Array(p.steps), surrogate: new Float32Array(p.steps), carry: new Float32Array(p.steps), rate: new Float32Array(1),
  };
  lifForward(Float32Array.of(current), 1, 1, p, SURROGATE_REGISTRY['fast-sigmoid'], 5, out);
  const times: number[] = [];
  out.spikes.forEach((s, t) => { if (s === 1) times.push((t + 1) * dtMs); });
  return times;
}

/**
 * The interspike interval of a leaky integrate-and-fire neuron under constant current I from
 * reset potential 0: T = t_ref + τ·ln(RI / (RI − θ)), so r = 1/T (Gerstner et al. 2014,
 * Neuronal Dynamics, §1.3).
 */
function closedFormIntervalMs(RI: number, tauMs: number, threshold: number, refractoryMs: number): number {
  return refractoryMs + tauMs * Math.log(RI / (RI - threshold));
}

function parameters(over: { dtMs: number; tauMs: number; threshold: number; refractoryMs: number; reset: 'zero' | 'subtract'; durationMs: number }): LifParameters {
  return lifParameters({
    kind: 'spiking', hidden: [1], steps: Math.round(over.durationMs / over.dtMs), dtMs: over.dtMs, tauMs: over.tauMs, threshold: over.threshold,
    reset: over.reset, refractoryMs: over.refractoryMs, inputCoding: 'current', surrogate: 'fast-sigmoid', surrogateSlope: 5,
  });
}

describe('a leaky integrate-and-fire unit under constant current', () => {
  const cases = [
    { RI: 1.5, tauMs: 10, threshold: 1, refractoryMs: 2, dtMs: 0.1 },
    { RI: 1.05, tauMs: 20, threshold: 1, refractoryMs: 0, dtMs: 0.5 },
    { RI: 3, tauMs: 5, threshold: 0.8, refractoryMs: 1, dtMs: 1 },
    { RI: 12, tauMs: 10, threshold: 1, refractoryMs: 3, dtMs: 0.25 },
  ];

  it.each(cases)('fires with every interval within one time step of the closed form (RI $RI, τ $tauMs ms, Δt $dtMs ms, reset to zero)', ({ RI, tauMs, threshold, refractoryMs, dtMs }) => {
    const p = parameters({ dtMs, tauMs, threshold, refractoryMs, reset: 'zero', durationMs: 1000 });
    const times = spikeTimes(RI, p, dtMs);
    const expected = closedFormIntervalMs(RI, tauMs, threshold, refractoryMs);
    expect(times.length).toBeGreaterThan(10);
    // A discrete unit fires at the first step whose end lies past the crossing: the interval
    // can only round up, by less than one step (exact integration, so no other error). The
    // first spike comes from rest, with no refractory period before it.
    const within = (interval: number, closed: number) => {
      expect(interval).toBeGreaterThanOrEqual(closed - 1e-6 * closed);
      expect(interval).toBeLessThan(closed + dtMs + 1e-6);
    };
    within(times[0], expected - refractoryMs);
    times.slice(1).forEach((t, i) => within(t - times[i], expected));
  });

  it.each(cases)('fires at the closed-form mean rate within one time step per interval with reset by subtraction (RI $RI, Δt $dtMs ms)', ({ RI, tauMs, threshold, refractoryMs, dtMs }) => {
    const p = parameters({ dtMs, tauMs, threshold, refractoryMs, reset: 'subtract', durationMs: 2000 });
    const times = spikeTimes(RI, p, dtMs);
    const meanInterval = (times[times.length - 1] - times[0]) / (times.length - 1);
    // Subtraction keeps the overshoot above θ, so an interval may also end early; either way by less than a step.
    expect(Math.abs(meanInterval - closedFormIntervalMs(RI, tauMs, threshold, refractoryMs))).toBeLessThan(dtMs);
  });

  it('converges on the closed-form rate as the time step shrinks (RI 1.5, τ 10 ms, t_ref 2 ms: 77.0 Hz)', () => {
    const rateHz = 1000 / closedFormIntervalMs(1.5, 10, 1, 2); // 1000 / (2 + 10·ln 3) = 77.0 Hz
    expect(rateHz).toBeCloseTo(77.0, 1);
    for (const dtMs of [1, 0.5, 0.1, 0.01]) {
      const times = spikeTimes(1.5, parameters({ dtMs, tauMs: 10, threshold: 1, refractoryMs: 2, reset: 'zero', durationMs: 1000 }), dtMs);
      const simulatedHz = 1000 / (times[1] - times[0]);
      // An interval longer by at most Δt lowers the rate by at most r²·Δt (first order).
      expect(simulatedHz).toBeLessThanOrEqual(rateHz + 1e-9);
      expect(rateHz - simulatedHz).toBeLessThan(rateHz * rateHz * (dtMs / 1000));
    }
  });

  it.each([0, 0.5, 0.99, 0.999])('never fires below the rheobase RI = θ (RI %s θ, 100 000 steps)', (fraction) => {
    for (const reset of ['zero', 'subtract'] as const) {
      const p = parameters({ dtMs: 0.1, tauMs: 10, threshold: 1, refractoryMs: 0, reset, durationMs: 10_000 });
      expect(spikeTimes(fraction, p, 0.1)).toEqual([]);
    }
  });

  it('reports the spike count ÷ steps as its rate, and holds the membrane during the refractory period', () => {
    // Every step of a unit far above threshold would fire; 2 refractory steps leave 1 in 3.
    const p: LifParameters = { steps: 9, beta: 0.5, gain: 0.5, threshold: 1, reset: 'zero', refractorySteps: 2 };
    const out: LifArrays = { spikes: new Float32Array(9), surrogate: new Float32Array(9), carry: new Float32Array(9), rate: new Float32Array(1) };
    lifForward(Float32Array.of(100), 1, 1, p, SURROGATE_REGISTRY['fast-sigmoid'], 5, out);
    expect(Array.from(out.spikes)).toEqual([1, 0, 0, 1, 0, 0, 1, 0, 0]);
    expect(out.rate[0]).toBeCloseTo(3 / 9, 7);
    // Refractory steps pass no gradient: surrogate and carry are 0 there.
    expect(Array.from(out.carry)).toEqual([0, 0, 0, 0, 0, 0, 0, 0, 0]); // reset to zero after a spike, refractory otherwise
    expect(out.surrogate[1]).toBe(0);
  });
});

describe('backpropagation through time of one unit', () => {
  it('follows ε[t] = surrogate[t]·g[t] + carry[t]·β·ε[t + 1], worked by hand for three steps', () => {
    // With surrogate s = (0.1, 0.2, 0.3), carry c = (1, 1, 1), β = 0.5 and g = (1, 2, 3):
    // ε[2] = 0.9; ε[1] = 0.4 + 0.5·0.9 = 0.85; ε[0] = 0.1 + 0.5·0.85 = 0.525 (hand-computed).
    const out = new Float32Array(3);
    lifBackward(Float32Array.of(1, 2, 3), Float32Array.of(0.1, 0.2, 0.3), Float32Array.of(1, 1, 1), 1, 1, { steps: 3, beta: 0.5 }, false, out);
    expect(Array.from(out).map((v) => Number(v.toFixed(6)))).toEqual([0.525, 0.85, 0.9]);
    // A signal on the rate reaches every step divided by the steps; summed over time for a held input.
    const summed = new Float32Array(1);
    lifBackward(Float32Array.of(3), Float32Array.of(0.1, 0.2, 0.3), Float32Array.of(1, 0, 1), 1, 1, { steps: 3, beta: 0.5 }, true, summed);
    // g = 1 per step: ε[2] = 0.3; ε[1] = 0.2 + 0 = 0.2; ε[0] = 0.1 + 0.5·0.2 = 0.2; Σ = 0.7.
    expect(summed[0]).toBeCloseTo(0.7, 6);
  });
});
