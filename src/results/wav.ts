import { closeSync, openSync, renameSync, rmSync, writeSync } from 'node:fs';

/** A 16-bit PCM WAV file's layout: samples per second and channels. */
export interface WavFormat {
  readonly sampleRateHz: number;
  readonly channels: number;
}

const BYTES_PER_SAMPLE = 2;
const HEADER_BYTES = 44;

/**
 * The 44-byte header of a canonical RIFF/WAVE file with one PCM `fmt ` chunk (format 1,
 * 16 bits) and one `data` chunk holding `frames` frames (Microsoft & IBM, Multimedia
 * Programming Interface and Data Specifications 1.0, 1991). Little-endian throughout.
 */
export function wavHeader(format: WavFormat, frames: number): Buffer {
  const blockAlign = format.channels * BYTES_PER_SAMPLE;
  const dataBytes = frames * blockAlign;
  if (!Number.isInteger(frames) || frames < 0 || HEADER_BYTES - 8 + dataBytes > 0xffff_ffff) {
    throw new Error(`a WAV file holds at most 4 GiB; ${frames} frames of ${format.channels} channels do not fit`);
  }
  const header = Buffer.alloc(HEADER_BYTES);
  header.write('RIFF', 0, 'ascii');
  header.writeUInt32LE(HEADER_BYTES - 8 + dataBytes, 4);
  header.write('WAVE', 8, 'ascii');
  header.write('fmt ', 12, 'ascii');
  header.writeUInt32LE(16, 16); // fmt chunk size
  header.writeUInt16LE(1, 20); // PCM
  header.writeUInt16LE(format.channels, 22);
  header.writeUInt32LE(format.sampleRateHz, 24);
  header.writeUInt32LE(format.sampleRateHz * blockAlign, 28); // bytes per second
  header.writeUInt16LE(blockAlign, 32);
  header.writeUInt16LE(8 * BYTES_PER_SAMPLE, 34);
  header.write('data', 36, 'ascii');
  header.writeUInt32LE(dataBytes, 40);
  return header;
}

/**
 * Channels of samples in −1..1 (full scale) as interleaved 16-bit little-endian PCM:
 * round(x · 32767), values beyond full scale clipped and counted.
 */
export function pcm16(channels: readonly Float32Array[]): { readonly bytes: Buffer; readonly clipped: number } {
  const frames = channels[0].length;
  if (channels.some((c) => c.length !== frames)) throw new Error('pcm16: every channel needs the same number of samples');
  const bytes = Buffer.alloc(frames * channels.length * BYTES_PER_SAMPLE);
  let clipped = 0;
  for (let t = 0; t < frames; t++) {
    for (let c = 0; c < channels.length; c++) {
      const x = channels[c][t];
      if (!(Math.abs(x) <= 1)) clipped++;
      const v = Number.isNaN(x) ? 0 : Math.max(-1, Math.min(1, x));
      bytes.writeInt16LE(Math.round(v * 32767), (t * channels.length + c) * BYTES_PER_SAMPLE);
    }
  }
  return { bytes, clipped };
}

/**
 * Writes a 16-bit PCM WAV file of `frames` frames from blocks of channels, one block at a
 * time, to a temporary name renamed into place at the end, so an interrupted write never
 * leaves a partial file under `path`. Returns how many samples were clipped.
 */
export function writeWavFile(path: string, format: WavFormat, frames: number, blocks: Iterable<readonly Float32Array[]>): { readonly clipped: number } {
  const temporary = `${path}.tmp-${process.pid}`;
  const fd = openSync(temporary, 'w');
  try {
    writeSync(fd, wavHeader(format, frames));
    let written = 0;
    let clipped = 0;
    for (const block of blocks) {
      if (block.length !== format.channels) throw new Error(`writeWavFile: a block has ${block.length} channels, the format ${format.channels}`);
      const pcm = pcm16(block);
      writeSync(fd, pcm.bytes);
      written += block[0].length;
      clipped += pcm.clipped;
    }
    if (written !== frames) throw new Error(`writeWavFile: the header promised ${frames} frames, the blocks held ${written}`);
    closeSync(fd);
    renameSync(temporary, path);
    return { clipped };
  } catch (error) {
    try { closeSync(fd); } catch { /* already closed after a failed rename */ }
    rmSync(temporary, { force: true });
    throw error;
  }
}
