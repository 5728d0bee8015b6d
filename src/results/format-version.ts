/**
 * The version of the layout of a cell folder (cell.json, scores.csv, train.csv). It is
 * written into every cell.json and hashed into every cell id, so cells of another
 * format are never taken for finished cells of this one. Raise it whenever a reader
 * could no longer read what an older writer wrote.
 */
export const RESULTS_FORMAT_VERSION = 2; // 2: scores.csv holds the per-seed noisy, drop and area rows; chance is the training share
