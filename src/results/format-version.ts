/**
 * The version of the layout of an output folder (experiment.json, cell.json, scores.csv,
 * train.csv). It is written into experiment.json and every cell.json and hashed into
 * every cell id, so cells of another format are never taken for finished cells of this
 * one. Raise it whenever a reader could no longer read what an older writer wrote.
 * Version 2: scores.csv holds the per-seed noisy, drop and area rows; chance is the
 * training share. Version 3: cell.json lists every file of its cell with size and
 * SHA-256, and experiment.json records who owns the folder.
 */
export const RESULTS_FORMAT_VERSION = 3;
