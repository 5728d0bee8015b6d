import { readFile } from 'node:fs/promises';

/** A float32 array with its shape, as stored in a .npy file. */
export interface NpyArray {
  readonly data: Float32Array;
  readonly shape: readonly number[];
}

const MAGIC = [0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59]; // "\x93NUMPY"
const ALIGN = 64; // NumPy pads the header so the data starts at a multiple of 64 bytes.

/**
 * Encodes a C-order little-endian float32 array in the NumPy .npy format, version 1.0
 * (NumPy Enhancement Proposal 1, "A Simple File Format for NumPy Arrays"): the magic
 * string, version bytes 1 0, a little-endian uint16 header length, an ASCII Python dict
 * literal padded with spaces and ended by '\n', then the raw data.
 */
export function encodeNpy(data: Float32Array, shape: readonly number[]): Uint8Array {
  const count = shape.reduce((a, b) => a * b, 1);
  if (shape.some((d) => !Number.isInteger(d) || d < 0) || count !== data.length) {
    throw new Error(`encodeNpy: shape (${shape.join(', ')}) does not hold ${data.length} values`);
  }
  const shapeText = shape.length === 1 ? `(${shape[0]},)` : `(${shape.join(', ')})`;
  const dict = `{'descr': '<f4', 'fortran_order': False, 'shape': ${shapeText}, }`;
  const unpadded = MAGIC.length + 2 + 2 + dict.length + 1;
  const headerLen = dict.length + 1 + (ALIGN - (unpadded % ALIGN)) % ALIGN;
  if (headerLen > 0xffff) throw new Error('encodeNpy: header longer than version 1.0 allows');
  const out = new Uint8Array(10 + headerLen + data.length * 4);
  out.set(MAGIC, 0);
  out[6] = 1;
  out[7] = 0;
  new DataView(out.buffer).setUint16(8, headerLen, true);
  const header = dict.padEnd(headerLen - 1, ' ') + '\n';
  for (let i = 0; i < header.length; i++) out[10 + i] = header.charCodeAt(i);
  const view = new DataView(out.buffer, 10 + headerLen);
  for (let i = 0; i < data.length; i++) view.setFloat32(i * 4, data[i], true);
  return out;
}

/** Decodes a .npy file (version 1.0 or 2.0) holding a C-order '<f4' array; anything else is a clear error. */
export function decodeNpy(bytes: Uint8Array, fileName = 'array.npy'): NpyArray {
  if (bytes.length < 10 || MAGIC.some((b, i) => bytes[i] !== b)) throw new Error(`${fileName}: not a .npy file (bad magic string)`);
  const major = bytes[6];
  if (major !== 1 && major !== 2) throw new Error(`${fileName}: unsupported .npy version ${major}.${bytes[7]}`);
  const dv = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const headerLen = major === 1 ? dv.getUint16(8, true) : dv.getUint32(8, true);
  const start = major === 1 ? 10 : 12;
  const header = String.fromCharCode(...bytes.subarray(start, start + headerLen));
  const descr = /'descr':\s*'([^']*)'/.exec(header)?.[1];
  if (descr !== '<f4') throw new Error(`${fileName}: descr: expected '<f4' (little-endian float32), got '${descr ?? ''}'`);
  if (!/'fortran_order':\s*False/.test(header)) throw new Error(`${fileName}: fortran_order: expected False`);
  const shapeText = /'shape':\s*\(([^)]*)\)/.exec(header)?.[1];
  if (shapeText == null) throw new Error(`${fileName}: shape: missing from header`);
  const shape = shapeText.split(',').map((s) => s.trim()).filter((s) => s !== '').map(Number);
  const count = shape.reduce((a, b) => a * b, 1);
  const dataStart = start + headerLen;
  if (bytes.length - dataStart !== count * 4) {
    throw new Error(`${fileName}: shape (${shape.join(', ')}) needs ${count * 4} data bytes, file has ${bytes.length - dataStart}`);
  }
  const data = new Float32Array(count);
  for (let i = 0; i < count; i++) data[i] = dv.getFloat32(dataStart + i * 4, true);
  return { data, shape };
}

/** Reads a float32 .npy file. */
export async function readNpy(path: string): Promise<NpyArray> {
  return decodeNpy(new Uint8Array(await readFile(path)), path);
}
