import { closest, distance } from 'fastest-levenshtein';

/**
 * ` (did you mean 'x'?)` for the nearest of `options`, or nothing when none is close.
 * Every message about a misspelt name uses it: world files here, and configs and
 * command lines above.
 */
export function suggestion(word: string, options: readonly string[]): string {
  if (options.length === 0) return '';
  const nearest = closest(word, [...options]);
  const limit = Math.max(2, Math.floor(word.length / 3));
  // Only suggest a word that is plausibly a misspelling of the nearest option.
  const edits = distance(word, nearest);
  return edits <= limit && edits < word.length ? ` (did you mean '${nearest}'?)` : '';
}
