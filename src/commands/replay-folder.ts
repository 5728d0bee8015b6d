import { resolve } from 'node:path';
import { readRecording, type Recording } from '../results/recording.js';
import { UsageError } from './usage.js';

/** The recording `--replay DIR` names; a folder that is not a readable recording is a usage error naming the file at fault. */
export function readReplayFolder(dir: string): Recording {
  try {
    return readRecording(resolve(dir));
  } catch (error) {
    throw new UsageError(`--replay: ${(error as Error).message}`);
  }
}
