// ---- errors (src/wasm/js/errors.js) ----------------------------------------------------------

/**
 * Stable machine-readable error codes (never renamed once released). Branch on these, never on
 * the message text. The core's codes come first (README "Errors"); then the codes of the
 * JavaScript boundary: WRONG_TYPE (a value of the wrong JavaScript type, a missing required
 * field, or an object whose getter/Proxy trap threw), DETACHED_BUFFER (a typed array whose
 * buffer was transferred), DISPOSED (an object used after `free()`), NOT_INITIALIZED (called
 * before `init()`/`initSync()`). Generated from the package's one list of codes.
 */
export type ErrorCode = /*@ERROR_CODES@*/;

/** Every {@link ErrorCode}, core codes first (frozen). */
export const ERROR_CODES: readonly ErrorCode[];

/**
 * The one error class every function and method of this package throws for invalid input.
 *
 * - `name` is `"QuantabandError"`;
 * - `code` is a stable {@link ErrorCode};
 * - `message` states the violated bound and the value received, with the JavaScript parameter
 *   or field path the caller used (e.g. `definition.conditions.window.transmittance`);
 * - `index` (bulk methods and arrays) is the index of the first bad element.
 *
 * The module stays usable after any number of errors.
 */
export class QuantabandError extends Error {
  constructor(code: ErrorCode, message: string, index?: number, options?: ErrorOptions);
  readonly name: "QuantabandError";
  readonly code: ErrorCode;
  readonly index?: number;
}
