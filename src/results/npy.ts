import { readFile } from 'node:fs/promises';

/** The element types crosswise stores, by their NumPy type strings (little-endian where it matters). */
const TYPES = {
  '<f4': { array: Float32Array, name: 'little-endian float32' },
  '<i4': { array: Int32Array, name: 'little-endian int32' },
  '|u1': { array: Uint8Array, name: 'uint8' },
} as const;

/** A NumPy type string crosswise writes: float32, int32 or uint8. */
export type NpyDescr = keyof typeof TYPES;

interface DataOf {
  '<f4': Float32Array;
  '<i4': Int32Array;
  '|u1': Uint8Array;
}

/** The typed array that holds one element type. */
export type NpyData<D extends NpyDescr = NpyDescr> = DataOf[D];

/** An array with its shape, as stored in a .npy file (float32 unless said otherwise). */
export interface NpyArray<D extends NpyDescr = '<f4'> {
  readonly data: NpyData<D>;
  readonly shape: readonly number[];
}

const MAGIC = [0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59]; // "\x93NUMPY"
const ALIGN = 64; // NumPy pads the header so the data starts at a multiple of 64 bytes.

/** The NumPy type string of a typed array. */
export function npyDescr(data: NpyData): NpyDescr {
  if (data instanceof Float32Array) return '<f4';
  if (data instanceof Int32Array) return '<i4';
  return '|u1';
}

/**
 * Encodes a C-order array in the NumPy .npy format, version 1.0 (NumPy Enhancement
 * Proposal 1, "A Simple File Format for NumPy Arrays"): the magic string, version bytes
 * 1 0, a little-endian uint16 header length, an ASCII Python dict literal padded with
 * spaces and ended by '\n', then the raw little-endian data. Float32Array is stored as
 * '<f4', Int32Array as '<i4', Uint8Array as '|u1'.
 */
export function encodeNpy(data: NpyData, shape: readonly number[]): Uint8Array {
  const count = shape.reduce((a, b) => a * b, 1);
  if (shape.some((d) => !Number.isInteger(d) || d < 0) || count !== data.length) {
    throw new Error(`encodeNpy: shape (${shape.join(', ')}) does not hold ${data.length} values`);
  }
  const shapeText = shape.length === 1 ? `(${shape[0]},)` : `(${shape.join(', ')})`;
  const dict = `{'descr': '${npyDescr(data)}', 'fortran_order': False, 'shape': ${shapeText}, }`;
  const unpadded = MAGIC.length + 2 + 2 + dict.length + 1;
  const headerLen = dict.length + 1 + (ALIGN - (unpadded % ALIGN)) % ALIGN;
  if (headerLen > 0xffff) throw new Error('encodeNpy: header longer than version 1.0 allows');
  const out = new Uint8Array(10 + headerLen + data.byteLength);
  out.set(MAGIC, 0);
  out[6] = 1;
  out[7] = 0;
  new DataView(out.buffer).setUint16(8, headerLen, true);
  const header = dict.padEnd(headerLen - 1, ' ') + '\n';
  for (let i = 0; i < header.length; i++) out[10 + i] = header.charCodeAt(i);
  const view = new DataView(out.buffer, 10 + headerLen);
  if (data instanceof Float32Array) for (let i = 0; i < data.length; i++) view.setFloat32(i * 4, data[i], true);
  else if (data instanceof Int32Array) for (let i = 0; i < data.length; i++) view.setInt32(i * 4, data[i], true);
  else out.set(data, 10 + headerLen);
  return out;
}

/**
 * Decodes a .npy file (version 1.0 or 2.0) holding a C-order array of the expected type
 * ('<f4' unless given); anything else is a clear error naming the file.
 */
export function decodeNpy<D extends NpyDescr = '<f4'>(bytes: Uint8Array, fileName = 'array.npy', expected: D = '<f4' as D): NpyArray<D> {
  if (bytes.length < 10 || MAGIC.some((b, i) => bytes[i] !== b)) throw new Error(`${fileName}: not a .npy file (bad magic string)`);
  const major = bytes[6];
  if (major !== 1 && major !== 2) throw new Error(`${fileName}: unsupported .npy version ${major}.${bytes[7]}`);
  const dv = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const headerLen = major === 1 ? dv.getUint16(8, true) : dv.getUint32(8, true);
  const start = major === 1 ? 10 : 12;
  const header = String.fromCharCode(...bytes.subarray(start, start + headerLen));
  const descr = /'descr':\s*'([^']*)'/.exec(header)?.[1];
  if (descr !== expected) throw new Error(`${fileName}: descr: expected '${expected}' (${TYPES[expected].name}), got '${descr ?? ''}'`);
  if (!/'fortran_order':\s*False/.test(header)) throw new Error(`${fileName}: fortran_order: expected False`);
  const shapeText = /'shape':\s*\(([^)]*)\)/.exec(header)?.[1];
  if (shapeText == null) throw new Error(`${fileName}: shape: missing from header`);
  const shape = shapeText.split(',').map((s) => s.trim()).filter((s) => s !== '').map(Number);
  const count = shape.reduce((a, b) => a * b, 1);
  const dataStart = start + headerLen;
  const width = TYPES[expected].array.BYTES_PER_ELEMENT;
  if (bytes.length - dataStart !== count * width) {
    throw new Error(`${fileName}: shape (${shape.join(', ')}) needs ${count * width} data bytes, file has ${bytes.length - dataStart}`);
  }
  return { data: readElements(dv, dataStart, count, expected) as NpyData<D>, shape };
}

function readElements(dv: DataView, from: number, count: number, descr: NpyDescr): NpyData {
  if (descr === '|u1') return new Uint8Array(dv.buffer.slice(dv.byteOffset + from, dv.byteOffset + from + count));
  if (descr === '<i4') return Int32Array.from({ length: count }, (_, i) => dv.getInt32(from + i * 4, true));
  const data = new Float32Array(count);
  for (let i = 0; i < count; i++) data[i] = dv.getFloat32(from + i * 4, true);
  return data;
}

/** Reads a .npy file of the expected type (float32 unless given). */
export async function readNpy<D extends NpyDescr = '<f4'>(path: string, expected: D = '<f4' as D): Promise<NpyArray<D>> {
  return decodeNpy(new Uint8Array(await readFile(path)), path, expected);
}
