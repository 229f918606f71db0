// The one error class of the package, the one list of error codes, and the messages.
//
// ERROR_CODES is THE list: the build generates the TypeScript `ErrorCode` union from it, and
// tests/js/errors.test.mjs checks its first part against the Rust core's `Error::ALL_CODES`
// (exported by the module as `qbCoreCodes`). Codes are stable: never renamed once released.

/** Codes of the Rust core's `Error` variants, in the order of `Error::ALL_CODES`. */
const CORE_CODES = [
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
  'TOO_LARGE',
  'INVALID_CORRELATION',
  'INVALID_TABLE_ENTRY',
  'OUTSIDE_TABLE',
  'INVALID_LINE',
];

/** Codes raised only at the JavaScript boundary. */
const BOUNDARY_CODES = [
  // a value of the wrong JavaScript type (a string for a number, a missing required field,
  // an object whose getter or Proxy trap throws)
  'WRONG_TYPE',
  // a typed array whose buffer was transferred or detached
  'DETACHED_BUFFER',
  // a method called on an object after free() / Symbol.dispose
  'DISPOSED',
  // called before init() / initSync() in a browser or worker
  'NOT_INITIALIZED',
];

/** Every stable error code, core codes first (frozen). */
export const ERROR_CODES = Object.freeze(CORE_CODES.concat(BOUNDARY_CODES));

/** The number of ERROR_CODES that come from the Rust core (the rest are boundary codes). */
export const CORE_CODE_COUNT = CORE_CODES.length;

/** Thrown for every invalid input; `code` is stable, `message` states the violated bound. */
export class QuantabandError extends Error {
  constructor(code, message, index, options) {
    super(message, options);
    this.name = 'QuantabandError';
    this.code = code;
    if (index !== undefined) this.index = index;
  }
}

/**
 * The message of each core code, in the wording of the Rust core's `Display` (src/error.rs);
 * `s` are the variant's text fields and `n` its numbers, in declaration order. Numbers are
 * formatted by JavaScript, as the caller wrote them.
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
  TOO_LARGE: (s, n) => `${s[0]} has ${n[1]} elements; at most ${n[0]} are accepted`,
  INVALID_CORRELATION: (s, n) => `invalid correlation matrix: ${s[0]} (entry ${s[1]} = ${n[0]})`,
  INVALID_TABLE_ENTRY: (s, n) => `${s[0]}[${n[1]}] must lie in ${s[1]} (got ${n[0]})`,
  OUTSIDE_TABLE: (s, n) =>
    `${s[0]} is needed at ${n[0]} m, outside its wavelength grid [${n[1]}, ${n[2]}] m (give the table constant end values to extend it)`,
  INVALID_LINE: (s, n) => `line ${n[0]} of the table text: ${s[0]}`,
};

/** Core argument names whose JavaScript name is not their camelCase form. */
const RENAMED = {
  mu_j: 'chemicalPotentialJ',
  wavelength_m: 'wavelength',
  wavelengths_m: 'wavelengths',
  b_mk: 'bMK',
  u: 'uncertainties',
};

/** The JavaScript name of a core argument name (`temperature_k` → `temperatureK`). */
function jsName(arg) {
  return arg
    .split('.')
    .map((seg) => (Object.prototype.hasOwnProperty.call(RENAMED, seg)
      ? RENAMED[seg]
      : seg.replace(/_([a-z0-9])/g, (_, c) => c.toUpperCase())))
    .join('.');
}

/** Codes whose first text field is an argument name. */
const ARG_CODES = new Set([
  'NON_FINITE',
  'NON_POSITIVE_TEMPERATURE',
  'NON_POSITIVE_SPECTRAL',
  'NON_POSITIVE',
  'OUT_OF_RANGE',
  'NOT_INCREASING',
  'TOO_LARGE',
  'INVALID_TABLE_ENTRY',
  'OUTSIDE_TABLE',
]);

/** The error of a stored failure `p` ({ code, texts, numbers, index?, message? }). */
export function fromPending(p) {
  if (p === undefined || p === null) {
    return new QuantabandError('UNSUPPORTED', 'internal: a call failed without an error');
  }
  if (typeof p.message === 'string') return new QuantabandError(p.code, p.message, p.index);
  const texts = ARG_CODES.has(p.code) ? [jsName(p.texts[0]), p.texts[1]] : p.texts;
  const template = MESSAGES[p.code];
  let message = template ? template(texts, p.numbers) : p.code;
  if (p.index !== undefined) message += ` (at index ${p.index})`;
  return new QuantabandError(p.code, message, p.index);
}

/** "a string", "an object", "undefined", … for messages. */
export function describe(v) {
  if (v === null) return 'null';
  switch (typeof v) {
    case 'undefined':
      return 'undefined';
    case 'string':
      return 'a string';
    case 'boolean':
      return `the boolean ${v}`;
    case 'number':
      return `the number ${v}`;
    case 'bigint':
      return 'a bigint';
    case 'symbol':
      return 'a symbol';
    case 'function':
      return 'a function';
    default:
      break;
  }
  try {
    if (Array.isArray(v)) return 'an array';
  } catch {
    return 'a revoked Proxy';
  }
  const tag = typedArrayTag(v);
  if (tag !== undefined) return `a ${tag}`;
  return 'an object';
}

const TYPED_ARRAY_TAG = Object.getOwnPropertyDescriptor(
  Object.getPrototypeOf(Uint8Array.prototype),
  Symbol.toStringTag,
).get;

/** The internal type name of a typed array ("Float64Array"…), or undefined. Never throws. */
export function typedArrayTag(v) {
  return TYPED_ARRAY_TAG.call(v);
}

/** `name` is not of the expected type `what`. */
export function wrongType(name, what, value, index) {
  return new QuantabandError('WRONG_TYPE', `${name} must be ${what} (got ${describe(value)})`, index);
}

/** Reading `name` ran the caller's code (a getter, a Proxy trap), which threw `cause`. */
export function unreadable(name, cause) {
  if (cause instanceof QuantabandError) return cause;
  const why = cause && typeof cause === 'object' && typeof cause.message === 'string' ? cause.message : String(cause);
  return new QuantabandError('WRONG_TYPE', `${name} could not be read: ${why}`, undefined, { cause });
}

/** A method called on an object after free(). */
export function disposed(what) {
  return new QuantabandError('DISPOSED', `this ${what} was freed (free() or Symbol.dispose) and cannot be used`);
}

/** Called before the module was initialised. */
export function notInitialized() {
  return new QuantabandError(
    'NOT_INITIALIZED',
    'quantaband is not initialised: call `await init()` (or `initSync({ module })`) once before ' +
      'using it (the Node entry does this itself)',
  );
}
