// The boundary between callers and the WebAssembly module: initialisation, argument checks,
// array copies, configuration copies and the scratch buffers of bulk calls. Every area module
// (spectrum.js, instrument.js, …) goes through these helpers; none touches wasm memory itself.
//
// The rules this file enforces (issue 12):
// - no JavaScript exception ever unwinds through a wasm frame: everything a caller passes is
//   read here, inside try/catch, into fresh plain data before any export is called;
// - arrays are copied with the engine's typed-array operations, which use the true internal
//   length; a `length` property is read once, checked, and only used to read elements here;
// - no view into wasm memory is kept across anything that can grow the memory;
// - scalars must be numbers (`typeof x === 'number'`): no coercion of "10", true, null, [10].

import * as glue from '../quantaband_glue.js';
import {
  QuantabandError,
  fromPending,
  notInitialized,
  typedArrayTag,
  unreadable,
  wrongType,
} from './errors.js';

/** The module's exports once initialised (null before). */
let wasm = null;

/** Records the instance the glue created (its exports). */
function attach(exports) {
  wasm = exports;
}

/**
 * Initialises the module synchronously from its bytes (or a compiled `WebAssembly.Module`):
 * `initSync({ module: bytes })`. Safe to call more than once.
 */
export function initSync(options) {
  attach(glue.initSync(options));
}

/**
 * Initialises the module: fetches `quantaband_bg.wasm` next to this package (or takes
 * `{ module_or_path }`: a URL, a Response, bytes or a `WebAssembly.Module`). Call once and
 * await it before anything else in a browser or worker.
 */
export async function init(options) {
  attach(await glue.default(options));
}

/** Throws NOT_INITIALIZED before initialisation. */
export function ready() {
  if (wasm === null) throw notInitialized();
}

/** The glue's exports (internal). */
export { glue };

/** The error a failing export stored, as a QuantabandError. */
export function takeError() {
  return fromPending(glue.qbTakeError());
}

/** `value` unless it is the NaN an export returns on failure. */
export function result(value) {
  if (value !== value) throw takeError();
  return value;
}

/** `value` unless it is the undefined an export returns on failure. */
export function some(value) {
  if (value === undefined) throw takeError();
  return value;
}

/** Checks that `value` (parameter `name`) is a number: NaN and ±∞ are numbers (the core
 * reports them as NON_FINITE); anything else is WRONG_TYPE. */
export function num(value, name) {
  if (typeof value !== 'number') throw wrongType(name, 'a number', value);
}

/** Longest string argument accepted (unit and option names are short). */
const MAX_STRING = 64;

/** Checks that `value` (parameter `name`) is a string of at most 64 characters; a longer one
 * is refused with `code` (the code an unknown name of that kind gets). */
export function str(value, name, code) {
  if (typeof value !== 'string') throw wrongType(name, 'a string', value);
  if (value.length > MAX_STRING) {
    throw new QuantabandError(code, `${name} is not a known name (a string of ${value.length} characters)`);
  }
}

// ---------------------------------------------------------------------------------------------
// Arrays
// ---------------------------------------------------------------------------------------------

/**
 * The most elements an array argument may have (2^25 = 33 554 432: a 4K frame is 8.3 million
 * pixels). Larger arrays are refused with TOO_LARGE before anything is allocated.
 */
export const MAX_LENGTH = 2 ** 25;

const TypedArray = Object.getPrototypeOf(Uint8Array);
const TA_LENGTH = Object.getOwnPropertyDescriptor(TypedArray.prototype, 'length').get;
const TA_BUFFER = Object.getOwnPropertyDescriptor(TypedArray.prototype, 'buffer').get;
const TA_SET = TypedArray.prototype.set;
const TA_SLICE = TypedArray.prototype.slice;
const NUMERIC_TAGS = new Set([
  'Float64Array',
  'Float32Array',
  'Int8Array',
  'Uint8Array',
  'Uint8ClampedArray',
  'Int16Array',
  'Uint16Array',
  'Int32Array',
  'Uint32Array',
]);
const AB_DETACHED = (() => {
  const d = Object.getOwnPropertyDescriptor(ArrayBuffer.prototype, 'detached');
  return d && typeof d.get === 'function' ? d.get : null;
})();

/** True when typed array `a` (known to be one) views a detached buffer. */
function isDetached(a) {
  if (TA_LENGTH.call(a) !== 0) return false;
  const buf = TA_BUFFER.call(a);
  if (AB_DETACHED !== null && Object.prototype.toString.call(buf) === '[object ArrayBuffer]') {
    return AB_DETACHED.call(buf);
  }
  try {
    // constructing a view on a detached buffer throws
    new Uint8Array(buf, 0, 0);
    return false;
  } catch {
    return true;
  }
}

/** The true element count of typed array `a` of type `tag`, checked (detached, limit). */
function typedLength(a, tag, name, limit) {
  if (isDetached(a)) {
    throw new QuantabandError('DETACHED_BUFFER', `${name} (a ${tag}) views a detached or transferred buffer`);
  }
  const n = TA_LENGTH.call(a);
  if (n > limit) throw tooLarge(name, n, limit);
  return n;
}

function tooLarge(name, n, limit) {
  return new QuantabandError('TOO_LARGE', `${name} has ${n} elements; at most ${limit} are accepted`);
}

/**
 * The numbers of array argument `name`: a numeric typed array is returned as it is (with its
 * true length checked); an Array or array-like object is read element by element into a new
 * Float64Array (every element must be a number). Anything else is WRONG_TYPE.
 * Returns [array, length].
 */
export function numbers(x, name, limit = MAX_LENGTH) {
  const tag = typedArrayTag(x);
  if (tag !== undefined) {
    if (!NUMERIC_TAGS.has(tag)) throw wrongType(name, 'an array of numbers', x);
    return [x, typedLength(x, tag, name, limit)];
  }
  if (x === null || typeof x !== 'object') throw wrongType(name, 'an array of numbers', x);
  let out;
  try {
    const len = x.length;
    if (typeof len !== 'number' || !(len >= 0) || len !== Math.floor(len)) {
      throw new QuantabandError(
        'WRONG_TYPE',
        `${name} must be an array of numbers (its length is ${typeof len === 'number' ? len : typeof len})`,
      );
    }
    if (len > limit) throw tooLarge(name, len, limit);
    out = new Float64Array(len);
    for (let i = 0; i < len; i++) {
      const v = x[i];
      if (typeof v !== 'number') throw wrongType(`${name}[${i}]`, 'a number', v, i);
      out[i] = v;
    }
  } catch (e) {
    throw unreadable(name, e);
  }
  return [out, out.length];
}

/**
 * The caller's output array `out` for `n` results of type `tag` (a typed array of that type
 * and length), or null when `out` is undefined.
 */
export function output(out, n, tag, name) {
  if (out === undefined) return null;
  const t = typedArrayTag(out);
  if (t !== tag) throw wrongType(name, `a ${tag}`, out);
  const m = typedLength(out, t, name, MAX_LENGTH);
  if (m !== n) {
    throw new QuantabandError('LENGTH_MISMATCH', `${name} must have ${n} elements (got ${m})`);
  }
  return out;
}

// Scratch buffers (src/wasm/scratch.rs): element kinds.
export const F64 = 0;
export const F32 = 1;
export const U16 = 2;
export const U8 = 3;
const VIEW = [Float64Array, Float32Array, Uint16Array, Uint8Array];

/** The address of scratch buffer (kind, slot) with n elements. */
export function reserve(kind, slot, n) {
  const p = glue.qbScratch(kind, slot, n);
  if (p === 0 && n > 0) {
    throw new QuantabandError(
      'OUT_OF_RANGE',
      `array length must lie in lengths the WebAssembly memory can hold (got ${n})`,
    );
  }
  return p;
}

/** A fresh view of n elements of `kind` at address p (take it after the last reserve()). */
export function view(kind, p, n) {
  return new VIEW[kind](wasm.memory.buffer, p, n);
}

/**
 * Copies typed array `src` (parameter `name`, true length n) into scratch at p. Take every
 * address with reserve() first: a later reserve() may move the memory.
 */
export function fill(kind, p, n, src, name) {
  try {
    TA_SET.call(view(kind, p, n), src);
  } catch {
    // only a buffer detached since it was checked (by code the caller ran meanwhile)
    throw new QuantabandError('DETACHED_BUFFER', `${name} views a detached or transferred buffer`);
  }
}

/** Writes typed array `src` (true length n) into scratch (kind, slot). */
export function write(kind, slot, src, n, name) {
  const p = reserve(kind, slot, n);
  fill(kind, p, n, src, name);
  return p;
}

/** Copies n results of `kind` at p into `out`, or into a new array when out is null. */
export function readBack(kind, p, n, out) {
  const v = view(kind, p, n);
  if (out === null) return TA_SLICE.call(v);
  TA_SET.call(out, v);
  return out;
}

/**
 * The numbers an export just wrote to f64 scratch buffer 0 (instead of a result object), as a
 * new Float64Array; `n`, the export's result, is their count (NaN: throws its error).
 */
export function figures(n) {
  const len = result(n);
  return readBack(F64, reserve(F64, 0, len), len, null);
}

/** As `figures`, as an object with `keys` in the order the export wrote the numbers. */
export function named(keys, n) {
  const v = figures(n);
  const o = {};
  keys.forEach((k, i) => {
    o[k] = v[i];
  });
  return o;
}

/**
 * A bulk call over f64 scratch buffer 0: copies `input` (parameter `name`) in, runs `run()`
 * (an export working in place, returning 0 or NaN), and returns the results as a new
 * Float64Array or in `out` (a Float64Array of the same length).
 */
export function bulk(input, name, out, run) {
  const [src, n] = numbers(input, name);
  const target = output(out, n, 'Float64Array', 'out');
  const p = write(F64, 0, src, n, name);
  result(run());
  return readBack(F64, p, n, target);
}

// ---------------------------------------------------------------------------------------------
// Configuration objects
// ---------------------------------------------------------------------------------------------

const MAX_DEPTH = 8;

/**
 * A fresh plain-data copy of configuration object `value` (parameter `name`): plain objects
 * (own enumerable string keys), arrays, numbers, strings, booleans, null; numeric arrays and
 * typed arrays become Float64Arrays. Getters and Proxy traps run here only, inside try/catch;
 * what they throw becomes WRONG_TYPE naming the field.
 */
export function config(value, name) {
  try {
    return copy(value, name, 0, null);
  } catch (e) {
    throw unreadable(name, e);
  }
}

/**
 * As config(), but the top-level fields named in `keep` (arrays the caller reads itself, such
 * as a frame's output buffer) are not copied: their values are returned in `kept` as given, and
 * the copy holds `true` in their place (so the module still checks the key is known).
 * Returns [copy, kept].
 */
export function configKeeping(value, name, keep) {
  const kept = {};
  try {
    return [copy(value, name, 0, { keep, kept }), kept];
  } catch (e) {
    throw unreadable(name, e);
  }
}

function copy(v, path, depth, top) {
  switch (typeof v) {
    case 'number':
    case 'string':
    case 'boolean':
    case 'undefined':
      return v;
    case 'object':
      break;
    default:
      throw wrongType(path, 'plain data', v);
  }
  if (v === null) return null;
  if (depth > MAX_DEPTH) throw new QuantabandError('WRONG_TYPE', `${path} is nested too deeply`);
  const tag = typedArrayTag(v);
  if (tag !== undefined) {
    if (!NUMERIC_TAGS.has(tag)) throw wrongType(path, 'an array of numbers', v);
    const n = typedLength(v, tag, path, MAX_LENGTH);
    const out = new Float64Array(n);
    TA_SET.call(out, v);
    return out;
  }
  if (Array.isArray(v)) {
    const len = v.length;
    if (!(len <= MAX_LENGTH)) throw tooLarge(path, len, MAX_LENGTH);
    const items = new Array(len);
    let allNumbers = true;
    for (let i = 0; i < len; i++) {
      const x = v[i];
      if (typeof x !== 'number') allNumbers = false;
      items[i] = x;
    }
    if (allNumbers) return Float64Array.from(items);
    for (let i = 0; i < len; i++) items[i] = copy(items[i], `${path}[${i}]`, depth + 1, null);
    return items;
  }
  const proto = Object.getPrototypeOf(v);
  if (proto !== Object.prototype && proto !== null) {
    throw wrongType(path, 'a plain object', v);
  }
  const out = {};
  for (const key of Object.keys(v)) {
    if (top !== null && top.keep.includes(key)) {
      const x = v[key];
      if (x !== undefined) {
        top.kept[key] = x;
        out[key] = true;
      }
      continue;
    }
    const x = copy(v[key], `${path}.${key}`, depth + 1, null);
    if (x !== undefined) out[key] = x;
  }
  return out;
}

/** The configuration copy of an optional object argument (`undefined` → an empty object). */
export function optionalConfig(value, name) {
  return value === undefined ? {} : config(value, name);
}

/** Test-only access (not part of the typed API): memory and table sizes, live objects. */
export const testing = Object.freeze({
  memoryBytes: () => (wasm === null ? 0 : wasm.memory.buffer.byteLength),
  tableSize: () => (wasm === null ? 0 : wasm.__wbindgen_externrefs.length),
  liveObjects: () => (wasm === null ? 0 : glue.qbLiveObjects()),
  coreCodes: () => glue.qbCoreCodes().split(','),
});
