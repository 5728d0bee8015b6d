import { formatHz, halfBar } from '../format.js';

/** Half-cells per bar: 12 steps of 5 dB over the 60 dB a bar spans. */
const BAR_WIDTH = 6;
/** dB from an empty bar to a full one. */
const BAR_SPAN_DB = 60;

/** One part of the sound panel: a title that heads the columns, and one line per band. */
export interface SoundPart {
  readonly title: string;
  readonly lines: readonly string[];
}

/** The dB range an ear's bar spans: the 60 dB above the ambient floor rounded down to 10 dB. */
export function soundBarRange(ambientDb: number): { readonly floorDb: number; readonly ceilingDb: number } {
  const floorDb = Math.floor(ambientDb / 10) * 10;
  return { floorDb, ceilingDb: floorDb + BAR_SPAN_DB };
}

const level = (db: number) => (Number.isFinite(db) ? String(Math.round(db)) : '--').padStart(3);

/**
 * Both ears' band levels as rows `Hz  dB  left-bar│right-bar  dB`, low band on top: the
 * left ear's bar grows leftwards from the middle line and the right ear's rightwards, so
 * each ear sits on its own side (bars over soundBarRange). Bands that do not fit in
 * `maxRows` rows go on in further parts.
 */
export function soundParts(sound: Float32Array, bandsHz: Float64Array, ambientDb: number, maxRows: number): SoundPart[] {
  const bands = bandsHz.length;
  const { floorDb } = soundBarRange(ambientDb);
  const fraction = (db: number) => (db - floorDb) / BAR_SPAN_DB;
  const rows = Array.from({ length: bands }, (_, b) => {
    const [left, right] = [sound[b], sound[bands + b]];
    return `${formatHz(bandsHz[b]).padStart(4)} ${level(left)} ${halfBar(fraction(left), BAR_WIDTH, 'left')}│${halfBar(fraction(right), BAR_WIDTH, 'right')} ${level(right)}`;
  });
  const perPart = Math.max(1, maxRows - 1);
  const parts: SoundPart[] = [];
  for (let start = 0; start < bands; start += perPart) {
    parts.push({ title: `sound dB ${'left'.padStart(BAR_WIDTH)}│${'right'.padEnd(BAR_WIDTH)}  dB`, lines: rows.slice(start, start + perPart) });
  }
  return parts;
}
