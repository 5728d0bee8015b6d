import { mkdtemp, readdir, readFile, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { writeFileAtomic } from '../../src/results/atomic-file.js';
import { decodeNpy, encodeNpy, readNpy } from '../../src/results/npy.js';

const ascii = (bytes: Uint8Array): string => String.fromCharCode(...bytes);
const hex = (bytes: Uint8Array): string => Buffer.from(bytes).toString('hex');

describe('encodeNpy', () => {
  it('writes the header bytes of the NumPy format spec v1.0, as numpy.save does', () => {
    // Expected bytes from numpy 2.4 `np.save` of np.array([[1,2,3],[4,5,6]], dtype='<f4'):
    // magic "\x93NUMPY", version 1 0, header length 0x0076 = 118 (little-endian), the dict
    // padded with spaces to end in '\n' at byte 127, data from byte 128 (NEP 1; 64-byte alignment).
    const bytes = encodeNpy(new Float32Array([1, 2, 3, 4, 5, 6]), [2, 3]);
    expect(Array.from(bytes.subarray(0, 10))).toEqual([0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59, 1, 0, 0x76, 0x00]);
    const header = ascii(bytes.subarray(10, 128));
    expect(header.startsWith("{'descr': '<f4', 'fortran_order': False, 'shape': (2, 3), }")).toBe(true);
    expect(header.endsWith(' \n')).toBe(true);
    expect(hex(bytes.subarray(128))).toBe('0000803f0000004000004040000080400000a0400000c040');
  });

  it("writes a 1-D shape as a one-element tuple '(2,)' like numpy.save", () => {
    // numpy 2.4 `np.save` of np.array([0.5, -2], dtype='<f4'): 136 bytes, data 0000003f000000c0.
    const bytes = encodeNpy(new Float32Array([0.5, -2]), [2]);
    expect(bytes.length).toBe(136);
    expect(ascii(bytes.subarray(10, 80))).toContain("'shape': (2,), }");
    expect(hex(bytes.subarray(128))).toBe('0000003f000000c0');
  });

  it("writes Int32Array as '<i4' with the bytes numpy.save gives", () => {
    // numpy 1.24 `np.save` of np.array([[1, -2, 3], [70000, 0, -1]], dtype='<i4'): 152 bytes,
    // the same 128-byte header layout, then two's-complement little-endian words.
    const bytes = encodeNpy(new Int32Array([1, -2, 3, 70000, 0, -1]), [2, 3]);
    expect(bytes.length).toBe(152);
    expect(ascii(bytes.subarray(10, 80))).toContain("{'descr': '<i4', 'fortran_order': False, 'shape': (2, 3), }");
    expect(hex(bytes.subarray(128))).toBe('01000000feffffff030000007011010000000000ffffffff');
  });

  it("writes Uint8Array as '|u1' with the bytes numpy.save gives", () => {
    // numpy 1.24 `np.save` of np.array([0, 2, 255], dtype='u1'): 131 bytes, data 0002ff.
    const bytes = encodeNpy(Uint8Array.from([0, 2, 255]), [3]);
    expect(bytes.length).toBe(131);
    expect(ascii(bytes.subarray(10, 80))).toContain("{'descr': '|u1', 'fortran_order': False, 'shape': (3,), }");
    expect(hex(bytes.subarray(128))).toBe('0002ff');
  });

  it('rejects a shape that does not match the data', () => {
    expect(() => encodeNpy(new Float32Array(5), [2, 3])).toThrow('encodeNpy: shape (2, 3) does not hold 5 values');
  });
});

describe('decodeNpy', () => {
  it('round-trips values and shape', () => {
    const data = new Float32Array([0.1, -3.5, 1e-7, 42, NaN, 7]);
    const back = decodeNpy(encodeNpy(data, [3, 2]));
    expect(back.shape).toEqual([3, 2]);
    expect(Array.from(back.data)).toEqual(Array.from(data));
  });

  it('round-trips int32 and uint8 arrays when asked for their type', () => {
    expect(Array.from(decodeNpy(encodeNpy(Int32Array.from([-7, 0, 2 ** 31 - 1]), [3]), 'a.npy', '<i4').data)).toEqual([-7, 0, 2 ** 31 - 1]);
    expect(Array.from(decodeNpy(encodeNpy(Uint8Array.from([3, 4]), [1, 2]), 'b.npy', '|u1').data)).toEqual([3, 4]);
    expect(() => decodeNpy(encodeNpy(Uint8Array.from([3]), [1]), 'c.npy', '<i4')).toThrow("c.npy: descr: expected '<i4' (little-endian int32), got '|u1'");
  });

  it('rejects other dtypes and bad magic with a message naming the file', () => {
    const bytes = encodeNpy(new Float32Array([1]), [1]);
    const f8 = Uint8Array.from(bytes);
    f8.set(Array.from("'<f8'", (c) => c.charCodeAt(0)), 19);
    expect(() => decodeNpy(f8, 'x.npy')).toThrow("x.npy: descr: expected '<f4' (little-endian float32), got '<f8'");
    expect(() => decodeNpy(new Uint8Array(12), 'y.npy')).toThrow('y.npy: not a .npy file (bad magic string)');
  });
});

describe('writeFileAtomic + readNpy', () => {
  let dir = '';
  afterEach(async () => { if (dir !== '') await rm(dir, { recursive: true, force: true }); });

  it('writes a file that reads back identically and leaves no temporary file', async () => {
    dir = await mkdtemp(join(tmpdir(), 'npy-'));
    const path = join(dir, 'features.npy');
    writeFileAtomic(path, encodeNpy(new Float32Array([1, 2, 3, 4]), [2, 2]));
    expect((await readNpy(path)).shape).toEqual([2, 2]);
    expect((await readFile(path)).length).toBe(128 + 16);
    expect(await readdir(dir)).toEqual(['features.npy']);
  });
});
