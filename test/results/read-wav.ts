import { readFileSync } from 'node:fs';
import { WaveFile } from 'wavefile';

/** A WAV file as the `wavefile` library reads it: format fields and each channel's samples in full-scale units. */
export interface ReadWav {
  readonly audioFormat: number;
  readonly sampleRate: number;
  readonly channels: number;
  readonly bitsPerSample: number;
  /** One array per channel, each sample divided by 32768. */
  readonly samples: readonly Float64Array[];
}

/** Reads a WAV file with `wavefile` (an independent, maintained reader) rather than our own code. */
export function readWav(path: string): ReadWav {
  const wav = new WaveFile(readFileSync(path));
  const fmt = wav.fmt as { audioFormat: number; sampleRate: number; numChannels: number; bitsPerSample: number };
  const raw = wav.getSamples(false, Float64Array) as unknown as Float64Array | Float64Array[];
  const channels = Array.isArray(raw) ? raw : [raw];
  return {
    audioFormat: fmt.audioFormat,
    sampleRate: fmt.sampleRate,
    channels: fmt.numChannels,
    bitsPerSample: fmt.bitsPerSample,
    samples: channels.map((c) => c.map((v) => v / 32768)),
  };
}
