/** Exit codes of the `couplet` command (design.md): 0 success, 1 measurement failed, 2 bad input or usage. */
export const EXIT_OK = 0;
export const EXIT_MEASURE_FAILED = 1;
export const EXIT_BAD_INPUT = 2;

/** Bad input or usage: the message names the file (and line, where the parser knows it). */
export class InputError extends Error {
  override name = 'InputError';
}

/** The input was fine but no trustworthy number could be produced. */
export class MeasureFailed extends Error {
  override name = 'MeasureFailed';
}
