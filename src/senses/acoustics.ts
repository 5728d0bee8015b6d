import type { SoundBand } from '../world/types.js';

/** The smallest source distance used in the inverse-square law, metres (avoids infinite level). */
export const MIN_DISTANCE_M = 0.25;

/**
 * Level change from 1 m to `distanceM` under the inverse-square law for a point source in
 * a free field: −20·log10(d / 1 m) dB, so −6.02 dB per doubling (e.g. Kinsler et al. 2000,
 * Fundamentals of Acoustics, §5.11). Distances below MIN_DISTANCE_M are floored.
 */
export function distanceLossDb(distanceM: number): number {
  return -20 * Math.log10(Math.max(distanceM, MIN_DISTANCE_M));
}

/**
 * Relative level in dB of a band-limited sound at frequency `hz`.
 *
 * The power spectrum is a Gaussian in log-frequency centred on `centreHz`, scaled so it is
 * 3 dB down (half power) at ±bandwidth/2 octaves, the usual definition of a filter's
 * bandwidth: −3·(2·log2(f / fc) / bandwidth)² dB.
 */
export function spectrumShapeDb(band: SoundBand, hz: number): number {
  const octaves = Math.log2(hz / band.centreHz);
  const halfWidths = (2 * octaves) / band.bandwidthOctaves;
  return -3 * halfWidths * halfWidths;
}

/** Largest head-shadow level difference at 90° azimuth, dB (high-frequency limit). */
export const ILD_MAX_DB = 20;
/** Frequency where the head shadow reaches half its maximum, Hz. */
export const ILD_CORNER_HZ = 1500;

/**
 * Interaural level difference (near ear minus far ear) in dB for a source at `azimuthDeg`.
 *
 * ILD = ILD_MAX_DB · |sin θ| · (f/fc)² / (1 + (f/fc)²): zero straight ahead and behind,
 * largest at the side, and growing with frequency because the head shadows only
 * wavelengths comparable to or shorter than itself (duplex theory, Rayleigh 1907).
 * The frequency curve is fitted by eye to the 90° measurements of Feddersen et al. 1957,
 * J. Acoust. Soc. Am. 29(9) (from memory: about 0 dB near 200 Hz, ~6 dB at 1 kHz,
 * ~20 dB near 6 kHz): it gives 0.35 dB at 200 Hz, 6.2 dB at 1 kHz, 18.8 dB at 6 kHz.
 */
export function ildDb(hz: number, azimuthDeg: number): number {
  const ratio = (hz / ILD_CORNER_HZ) ** 2;
  return ILD_MAX_DB * Math.abs(Math.sin((azimuthDeg * Math.PI) / 180)) * (ratio / (1 + ratio));
}

/** Sound power relative to the reference, from a level in dB: 10^(L/10). */
export function dbToPower(levelDb: number): number {
  return 10 ** (levelDb / 10);
}

/** The thud heard at both ears when the agent bumps: a low band, level chosen to stand clear of a quiet room (invented). */
export const THUD: SoundBand = { centreHz: 80, bandwidthOctaves: 1.5, levelDb: 60 };
