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

/**
 * Options schemas for `qbReadOptions`, by id (defined once from Rust through `qbDefineOptions`):
 * `names` (a Set of the accepted keys) and `fields`, each `[key, choices]` with `choices` null for
 * a number field or the array of accepted strings of a string field.
 */
const OPTION_SCHEMAS = [];

/**
 * Defines options schema `id` from `spec`: fields separated by ";", each a key alone (a number
 * field) or "key=choice|choice|…" (a string field that must be one of the choices).
 */
export function qbDefineOptions(id, spec) {
  const fields = spec.split(';').map(function (f) {
    const eq = f.indexOf('=');
    return eq < 0 ? [f, null] : [f.slice(0, eq), f.slice(eq + 1).split('|')];
  });
  OPTION_SCHEMAS[id] = { names: new Set(fields.map(function (f) { return f[0]; })), fields: fields };
}

/**
 * Reads an options object against schema `id` in one call from WebAssembly (instead of one
 * call per field). Writes field i to `out[i]`: the number, or the index of the string among the
 * field's choices. Returns the bit mask of the fields present (bit i set when field i is not
 * undefined), or -1 when anything is unusual: not a plain object, an unknown key, a number
 * field holding a non-number, a string field holding a non-string or a string not among its
 * choices. Rust then reads the object field by field, which reports the exact error (or
 * accepts a spelling outside the choices, such as a unit alias).
 */
export function qbReadOptions(obj, id, out) {
  if (typeof obj !== 'object' || obj === null || Array.isArray(obj)) return -1;
  const schema = OPTION_SCHEMAS[id];
  const keys = Object.keys(obj);
  for (let i = 0; i < keys.length; i++) if (!schema.names.has(keys[i])) return -1;
  const fields = schema.fields;
  let mask = 0;
  for (let i = 0; i < fields.length; i++) {
    const v = obj[fields[i][0]];
    if (v === undefined) continue;
    const choices = fields[i][1];
    if (choices === null) {
      if (typeof v !== 'number') return -1;
      out[i] = v;
    } else {
      if (typeof v !== 'string') return -1;
      const j = choices.indexOf(v);
      if (j < 0) return -1;
      out[i] = j;
    }
    mask |= 1 << i;
  }
  return mask;
}

/**
 * Called from Rust for a result object: the numbers `values` (a Float64Array view) under the
 * ";"-separated `keys`, in one call instead of one per field.
 */
export function qbNumbers(keys, values) {
  const names = keys.split(';');
  const o = {};
  for (let i = 0; i < names.length; i++) o[names[i]] = values[i];
  return o;
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
