import { randomUUID } from 'node:crypto';
import { mkdirSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';

/**
 * Writes a file so readers see either the old content or the whole new content: write a
 * temporary file in the same folder (same file system), then rename over the target.
 */
export function writeFileAtomic(path: string, content: string | Uint8Array): void {
  mkdirSync(dirname(path), { recursive: true });
  const temporary = `${path}.partial-${randomUUID()}`;
  try {
    writeFileSync(temporary, content);
    renameSync(temporary, path);
  } catch (error) {
    rmSync(temporary, { force: true });
    throw error;
  }
}

/**
 * Writes a folder of files so it appears whole or not at all: the files go into
 * `temporary` (a sibling of `target` on the same file system), which is then renamed to
 * `target`. The rename fails when `target` already exists with files in it; the
 * temporary folder is removed on any failure, and the error is rethrown.
 */
export function writeFolderAtomic(target: string, temporary: string, files: Readonly<Record<string, string | Uint8Array>>): void {
  try {
    mkdirSync(temporary, { recursive: true });
    for (const [name, content] of Object.entries(files)) writeFileSync(join(temporary, name), content);
    renameSync(temporary, target);
  } catch (error) {
    rmSync(temporary, { recursive: true, force: true });
    throw error;
  }
}
