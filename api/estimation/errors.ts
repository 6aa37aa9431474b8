/**
 * The one error class of the estimation engine.
 *
 * Every failure the engine reports on purpose is an `EstimationInputError` with a stable
 * machine-readable `code` and plain-data `details` (row index, year, column, reason,
 * offending columns...), so that a caller (the API's error middleware, a run worker) can
 * turn it into a 400 response or a per-district `not_estimable` entry without parsing the
 * message.
 *
 * Codes:
 * - `non_finite_value`      a value is NaN, ±Infinity or not a number (details: row, year, column)
 * - `non_positive_under_log` a value ≤ 0 would have to be logged (details: row, year, column, value)
 * - `duplicate_year`        two rows share a year (details: row, year, firstRow)
 * - `duplicate_row`         two panel rows share district and year
 * - `missing_control`       a row lacks a control the model uses (details: row, year, column)
 * - `invalid_argument`      shapes or options are inconsistent (details: reason, ...)
 * - `rank_deficient`        the design matrix does not have full column rank
 *                           (details: rank, k, dependent column names, involved column names)
 * - `covariance_undefined`  a robust covariance cannot be formed (e.g. HC3 with leverage 1)
 * - `numerical_failure`     a result failed its own consistency check (e.g. a cubic
 *                           Fieller set that does not contain its turning point)
 *
 * Example:
 *   new EstimationInputError('duplicate_year', 'Row 4 repeats year 2001 (first seen in row 2)',
 *     { row: 4, year: 2001, firstRow: 2 }).code   // → 'duplicate_year'
 */
export class EstimationInputError extends Error {
  readonly code: EstimationErrorCode;
  readonly details: Record<string, unknown>;

  constructor(code: EstimationErrorCode, message: string, details: Record<string, unknown> = {}) {
    super(message);
    this.name = 'EstimationInputError';
    this.code = code;
    this.details = details;
  }

  /** Plain-data form for JSON responses: `{ code, message, details }`. */
  toJSON(): { code: EstimationErrorCode; message: string; details: Record<string, unknown> } {
    return { code: this.code, message: this.message, details: this.details };
  }
}

export type EstimationErrorCode =
  | 'non_finite_value'
  | 'non_positive_under_log'
  | 'duplicate_year'
  | 'duplicate_row'
  | 'missing_control'
  | 'invalid_argument'
  | 'rank_deficient'
  | 'covariance_undefined'
  | 'numerical_failure';
