// ---- initialisation and arrays (src/wasm/js/runtime.js) ------------------------------------

/** What `init()` can load the module from. */
export type InitInput = RequestInfo | URL | Response | BufferSource | WebAssembly.Module;

/**
 * Loads and instantiates the WebAssembly module (browsers, workers, bundlers): call once and
 * await it before anything else. Without an argument it fetches `quantaband_bg.wasm` next to
 * the package's JavaScript. The Node entry initialises itself; calling this again is harmless.
 */
export function init(options?: { module_or_path: InitInput | Promise<InitInput> }): Promise<void>;
export default init;

/** Instantiates the module synchronously from its bytes or a compiled module. */
export function initSync(options: { module: BufferSource | WebAssembly.Module }): void;

/**
 * The most elements any array argument may have (2^25 = 33 554 432); a longer array is refused
 * with `TOO_LARGE` before anything is allocated.
 */
export const MAX_ARRAY_LENGTH: number;

/**
 * An array of numbers: a plain array (also `readonly number[]`), any numeric typed array
 * (Float64Array, Float32Array, Uint16Array, …) or another array-like object whose elements are
 * numbers. It is copied before use (its true length; elements must be numbers, no coercion).
 */
export type NumberArray = ArrayLike<number>;
