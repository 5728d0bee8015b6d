/** A learner whose loss became NaN or infinite; it is reported as failed, never as a number. */
export class LearnerDivergedError extends Error {
  constructor(
    readonly learner: string,
    readonly which: 'train' | 'validation',
    readonly epoch: number,
    readonly value: number,
  ) {
    super(`learner '${learner}': ${which} loss became ${value} at epoch ${epoch}`);
    this.name = 'LearnerDivergedError';
  }
}
