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
 * The message of each code, in the wording of the Rust core's `Display` (src/error.rs); `s` are
 * the variant's text fields and `n` its numbers, in declaration order. Numbers are formatted by
 * JavaScript, so the WebAssembly module carries no float formatter. tests/wasm_node.rs checks
 * every template against the core's `Display`.
 */
const MESSAGES = {
  NON_FINITE: (s, n) => `${s[0]} must be a finite number (got ${n[0]})`,
  NON_POSITIVE_TEMPERATURE: (s, n) => `${s[0]} must be > 0 K (got ${n[0]} K)`,
  NON_POSITIVE_SPECTRAL: (s, n) => `${s[0]} must be > 0 (got ${n[0]})`,
  NON_POSITIVE: (s, n) => `${s[0]} must be > 0 (got ${n[0]})`,
  OUT_OF_RANGE: (s, n) => `${s[0]} must lie in ${s[1]} (got ${n[0]})`,
  INVALID_BAND: (s, n) => `band limits must satisfy lower < upper (got lower = ${n[0]}, upper = ${n[1]})`,
  NO_SOLUTION: (s) => `no solution: ${s[0]}`,
  NO_PHYSICAL_SOLUTION: (s, n) =>
    `no physical solution: signal ${n[0]} must exceed the reflected and path contribution ${n[1]}`,
  DIVERGENT_OCCUPATION: (s, n) =>
    `Bose-Einstein occupancy needs E > mu, i.e. x = (E - mu)/kT > 0 (got x = ${n[0]})`,
  LENGTH_MISMATCH: (s, n) => `array lengths must match (expected ${n[0]}, got ${n[1]})`,
  TOO_FEW_POINTS: (s, n) => `at least ${n[0]} points are needed (got ${n[1]})`,
  NOT_INCREASING: (s, n) =>
    `${s[0]} must be strictly increasing (element ${n[0]} is not larger than the one before)`,
  DEGENERATE_FIT: (s) => `degenerate fit: ${s[0]}`,
  NOT_CONVERGED: (s) => `did not converge: ${s[0]}`,
  UNKNOWN_UNIT: (s) => `unknown unit; expected a ${s[0]}`,
  UNSUPPORTED: (s) => `unsupported: ${s[0]}`,
};

/**
 * Called from Rust for a core error: `s0`, `s1` its text fields, `numbers` its numbers, `index`
 * the first bad element of a bulk call (or undefined).
 */
export function qbCoreError(code, s0, s1, numbers, index) {
  let message = MESSAGES[code]([s0, s1], numbers);
  if (index !== undefined) message += ` (at index ${index})`;
  return new QuantabandError(code, message, index);
}

/** Called from Rust for an error found by the binding layer (malformed options). */
export function qbBindingError(code, message) {
  return new QuantabandError(code, message);
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
