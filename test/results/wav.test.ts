import { mkdtempSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { pcm16, wavHeader, writeWavFile } from '../../src/results/wav.js';
import { readWav } from './read-wav.js';

const folder = () => mkdtempSync(join(tmpdir(), 'crosswise-wav-'));

describe('WAV files, read back with the wavefile library', () => {
  it('holds PCM format 1, the sample rate, two channels and 16 bits', () => {
    const path = join(folder(), 'a.wav');
    writeWavFile(path, { sampleRateHz: 44_100, channels: 2 }, 3, [[Float32Array.of(0, 0.5, -0.5), Float32Array.of(1, -1, 0.25)]]);
    const wav = readWav(path);
    expect([wav.audioFormat, wav.sampleRate, wav.channels, wav.bitsPerSample]).toEqual([1, 44_100, 2, 16]);
    // round(x · 32767), halves rounded up: 0.5 → 16383.5 → 16384; −0.5 → −16383.5 → −16383; 1 → 32767.
    expect([...wav.samples[0]]).toEqual([0, 16384 / 32768, -16383 / 32768]);
    expect([...wav.samples[1]]).toEqual([32767 / 32768, -32767 / 32768, 8192 / 32768]);
  });

  it('writes the blocks one after another', () => {
    const path = join(folder(), 'b.wav');
    writeWavFile(path, { sampleRateHz: 8000, channels: 1 }, 4, [[Float32Array.of(0.25, 0.25)], [Float32Array.of(-0.25, -0.25)]]);
    expect([...readWav(path).samples[0]]).toEqual([0.25, 0.25, -0.25, -0.25].map((v) => Math.round(v * 32767) / 32768));
  });

  it('clips beyond full scale and counts the clipped samples', () => {
    const { bytes, clipped } = pcm16([Float32Array.of(1.5, -2, 0.1)]);
    expect(clipped).toBe(2);
    expect([bytes.readInt16LE(0), bytes.readInt16LE(2), bytes.readInt16LE(4)]).toEqual([32767, -32767, 3277]);
  });

  it('leaves no file, and no temporary file, when the blocks do not match the header', () => {
    const dir = folder();
    expect(() => writeWavFile(join(dir, 'c.wav'), { sampleRateHz: 8000, channels: 1 }, 5, [[Float32Array.of(0, 0)]]))
      .toThrow('writeWavFile: the header promised 5 frames, the blocks held 2');
    expect(readdirSync(dir)).toEqual([]);
  });

  it('states the RIFF and data sizes: 36 + data bytes, and frames × channels × 2', () => {
    const header = wavHeader({ sampleRateHz: 44_100, channels: 2 }, 10);
    expect([header.toString('ascii', 0, 4), header.readUInt32LE(4), header.readUInt32LE(28), header.readUInt32LE(40)]).toEqual(['RIFF', 76, 176_400, 40]);
  });
});
