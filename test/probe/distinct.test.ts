import { describe, expect, it } from 'vitest';
import { distinctRows, encodeDistinct } from '../../src/probe/distinct.js';
import { fixtureDataset, linearEncoder } from './fixture.js';

describe('distinctRows', () => {
  it('groups rows equal in every array and numbers the groups in order of first occurrence (worked by hand)', () => {
    const a = Float32Array.of(1, 2, 3, 4, 1, 2, 1, 2, 3, 4); // rows [1 2] [3 4] [1 2] [1 2] [3 4]
    const b = Float32Array.of(0, 0, 0, 5, 0); // splits the third [1 2] off from the first two
    const { first, index } = distinctRows([a, b], 5);
    expect(Array.from(first)).toEqual([0, 1, 3]);
    expect(Array.from(index)).toEqual([0, 1, 0, 2, 1]);
  });

  it('tells 0 from −0 and keeps NaN rows together, comparing bits', () => {
    const { index } = distinctRows([Float32Array.of(0, -0, NaN, NaN)], 4);
    expect(Array.from(index)).toEqual([0, 1, 2, 2]);
  });

  it('keeps every row of an empty set or of rows that all differ', () => {
    expect(distinctRows([new Float32Array(0)], 0).first).toHaveLength(0);
    expect(Array.from(distinctRows([Float32Array.of(3, 1, 2)], 3).index)).toEqual([0, 1, 2]);
  });

  it('rejects an array that is not n rows', () => {
    expect(() => distinctRows([new Float32Array(7)], 2)).toThrow('distinctRows: 7 values are not 2 rows');
  });
});

describe('encodeDistinct', () => {
  const { data } = fixtureDataset(40, 3, 5); // 40 steps over 5 poses
  const sight = data.channels.sight;

  it('gives every row the features the encoder gives it alone, from one call on the distinct rows', () => {
    const { encoder, calls } = linearEncoder(data, ['sight'], 6, 1);
    const [first, second] = encodeDistinct(encoder, data.channelSize, [{ n: 40, channels: { sight } }, { n: 2, channels: { sight: sight.subarray(0, 22) } }]);
    expect(calls).toHaveLength(1);
    expect(first.distinct).toBeLessThanOrEqual(5);
    expect(second.distinct).toBeLessThanOrEqual(2);
    const alone = linearEncoder(data, ['sight'], 6, 1).encoder;
    for (const [set, n] of [[first, 40], [second, 2]] as const) {
      for (let i = 0; i < n; i++) {
        const expected = alone.features({ sight: sight.subarray(i * 11, i * 11 + 11) }, 1);
        expect(Array.from(set.features.subarray(set.index[i] * 6, set.index[i] * 6 + 6))).toEqual(Array.from(expected));
      }
    }
  });

  it('names a channel the encoder reads but the rows lack', () => {
    const { encoder } = linearEncoder(data, ['sight', 'touch'], 6, 1);
    expect(() => encodeDistinct(encoder, data.channelSize, [{ n: 40, channels: { sight } }])).toThrow("encodeDistinct: input channel 'touch' is missing");
  });
});
