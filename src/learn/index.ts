/** The learning module's public surface: backend, training, errors and spec types. */
export { initBackend, softwareVersions } from './backend.js';
export { LearnerDivergedError } from './errors.js';
export { trainLearner, type TrainedLearner, type TrainOptions } from './trainer.js';
export * from './spec.js';
