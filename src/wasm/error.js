// The one error class thrown by the quantaband WebAssembly package (re-exported from the package
// entry by wasm-bindgen). Kept to plain ES2015 so the page build can inline it unchanged.

/** Thrown for every invalid input; `code` is stable, `message` states the violated bound. */
export class QuantabandError extends Error {
  constructor(code, message, index) {
    super(message);
    this.name = 'QuantabandError';
    this.code = code;
    if (index !== undefined) this.index = index;
  }
}

/**
 * Called from Rust: builds the error object that the binding then throws. Each U+0001 in
 * `template` is replaced by the next of `numbers`, formatted by String(number).
 */
export function qbMakeError(code, template, numbers, index) {
  let i = 0;
  const message = template.replace(/\u0001/g, () => String(numbers[i++]));
  return new QuantabandError(code, message, index);
}

/** Every stable error code, in the order of the Rust `Error::ALL_CODES`. */
export const ERROR_CODES = Object.freeze([
  'NON_FINITE',
  'NON_POSITIVE_TEMPERATURE',
  'NON_POSITIVE_SPECTRAL',
  'NON_POSITIVE',
  'OUT_OF_RANGE',
  'INVALID_BAND',
  'NO_SOLUTION',
  'NO_PHYSICAL_SOLUTION',
  'DIVERGENT_OCCUPATION',
  'LENGTH_MISMATCH',
  'TOO_FEW_POINTS',
  'NOT_INCREASING',
  'DEGENERATE_FIT',
  'NOT_CONVERGED',
  'UNKNOWN_UNIT',
  'UNSUPPORTED',
]);
