import { availableParallelism, cpus, loadavg } from 'node:os';

/** The machine a bench ran on. */
export interface Machine {
  readonly cores: number;
  readonly cpu_model: string;
  readonly node: string;
  /** The 1-minute load average when the bench started: figures from a busy machine are lower. */
  readonly load_1min: number;
}

/** Cores, CPU model, Node version and load of this machine. */
export function describeMachine(): Machine {
  return { cores: availableParallelism(), cpu_model: cpus()[0]?.model.trim() ?? 'unknown', node: process.version, load_1min: Math.round(loadavg()[0] * 100) / 100 };
}
