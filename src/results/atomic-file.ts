import { mkdirSync, renameSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';
import { partialName, removeQuietly } from './partial-files.js';

/**
 * Writes a file so readers see either the old content or the whole new content: write a
 * temporary file in the same folder (same file system), then rename over the target.
 */
export function writeFileAtomic(path: string, content: string | Uint8Array): void {
  mkdirSync(dirname(path), { recursive: true });
  const temporary = partialName(path);
  try {
    writeFileSync(temporary, content);
    renameSync(temporary, path);
  } catch (error) {
    removeQuietly(temporary);
    throw error;
  }
}
