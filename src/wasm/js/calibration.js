// CalibrationCurve: a Sakuma–Hattori calibration curve (from coefficients or a fit), its signal,
// inverse and derivative, and whole-frame conversion. Wraps QbCalibration
// (src/wasm/calibration.rs).

import { QuantabandError, disposed, typedArrayTag, wrongType } from './errors.js';
import { _instrumentHandle as instrumentHandle } from './instrument.js';
import {
  F32,
  F64,
  MAX_LENGTH,
  U16,
  U8,
  bulk,
  config,
  configKeeping,
  fill,
  glue,
  num,
  numbers,
  optionalConfig,
  output,
  readBack,
  ready,
  reserve,
  result,
  some,
} from './runtime.js';
import {
  _fitArgs,
  _fixedPointArgs,
  _fixedPointReport,
  _parameterCovariance,
  _readingUncertainty,
} from './uncertainty_results.js';

const SIGNALS = 0;
const SIGNAL_DERIVATIVES = 1;
const TEMPERATURES = 2;

const FROM_HANDLE = Symbol('handle');

/** Frame input types and their scratch kind. */
const FRAME_INPUT = { Uint16Array: U16, Float32Array: F32, Float64Array: F64 };

/**
 * A Sakuma–Hattori calibration curve S(T) = C / (exp(c2 / (A·T + B)) − 1):
 * `new CalibrationCurve({ aM, bMK, c, c2 })`, or a fit (`CalibrationCurve.fit`,
 * `.fitInstrument`, `.fromResponse`).
 */
export class CalibrationCurve {
  #h = null;
  #coefficients;
  #report;
  #fixedPoints;

  constructor(coefficients, handle) {
    let h;
    if (coefficients === FROM_HANDLE) {
      h = handle;
    } else {
      ready();
      h = some(glue.QbCalibration.create(config(coefficients, 'coefficients')));
    }
    this.#h = h;
    this.#coefficients = Object.freeze(h.coefficients());
    const r = h.fitReport();
    if (r !== undefined && r.residualsK !== undefined) r.residualsK = Float64Array.from(r.residualsK);
    this.#report = r === undefined ? undefined : Object.freeze(r);
    this.#fixedPoints = _fixedPointReport(h);
  }

  /**
   * Least-squares curve through calibration points (temperatures in K, signals increasing);
   * options { c2, uTemperaturesK, uSignals } (the points' standard uncertainties).
   */
  static fit(temperaturesK, signals, options) {
    ready();
    const [t, nt] = numbers(temperaturesK, 'temperaturesK');
    const [o, uT, uS, given] = _fitArgs(options, nt);
    const [s, ns] = numbers(signals, 'signals');
    const pt = reserve(F64, 0, nt);
    const ps = reserve(F64, 1, ns);
    fill(F64, pt, nt, t, 'temperaturesK');
    fill(F64, ps, ns, s, 'signals');
    return new CalibrationCurve(FROM_HANDLE, some(glue.QbCalibration.fit(o, uT, uS, given)));
  }

  /** Least-squares curve for an instrument's exact model over [tMinK, tMaxK]. */
  static fitInstrument(instrument, tMinK, tMaxK, options) {
    ready();
    const h = instrumentHandle(instrument, 'instrument');
    num(tMinK, 'tMinK');
    num(tMaxK, 'tMaxK');
    const o = optionalConfig(options, 'options');
    return new CalibrationCurve(FROM_HANDLE, some(glue.QbCalibration.fitInstrument(h, tMinK, tMaxK, o)));
  }

  /** Starting curve from a response instrument's moments, exact at referenceTemperatureK. */
  static fromResponse(instrument, referenceTemperatureK) {
    ready();
    const h = instrumentHandle(instrument, 'instrument');
    num(referenceTemperatureK, 'referenceTemperatureK');
    return new CalibrationCurve(FROM_HANDLE, some(glue.QbCalibration.fromResponse(h, referenceTemperatureK)));
  }

  /**
   * A curve exact through an instrument's signals at three ITS-90 fixed points, with its
   * interpolation errors; options { c2 = "its90", uTemperaturesK, uSignals, tMinK, tMaxK, nPoints }.
   */
  static throughFixedPoints(instrument, fixedPoints, options) {
    ready();
    const h = instrumentHandle(instrument, 'instrument');
    const args = _fixedPointArgs(fixedPoints, options);
    return new CalibrationCurve(FROM_HANDLE, some(glue.QbCalibration.throughFixedPoints(h, ...args)));
  }

  /** The fixed points and interpolation errors of a curve from throughFixedPoints (else undefined). */
  get fixedPointReport() {
    return this.#fixedPoints;
  }

  /** Covariance and correlation matrices of (aM, bMK, c) from the reference points' uncertainties. */
  parameterCovariance() {
    return _parameterCovariance(this.#live());
  }

  /** A reading's temperature, its calibration uncertainty and ∂T/∂T_i, ∂T/∂S_i of each point. */
  readingUncertainty(signal, uSignal = 0) {
    const h = this.#live();
    num(signal, 'signal');
    num(uSignal, 'uSignal');
    return _readingUncertainty(h, signal, uSignal);
  }

  /** `{ aM, bMK, c, c2 }` (frozen). */
  get coefficients() {
    return this.#coefficients;
  }

  /** The report of the fit that made this curve (undefined for a curve from coefficients). */
  get fitReport() {
    return this.#report;
  }

  #live() {
    const h = this.#h;
    if (h === null) throw disposed('CalibrationCurve');
    return h;
  }

  /** Releases the object's WebAssembly memory now (later calls throw DISPOSED). */
  free() {
    const h = this.#h;
    if (h !== null) {
      this.#h = null;
      h.free();
    }
  }

  signal(temperatureK) {
    const h = this.#live();
    num(temperatureK, 'temperatureK');
    return result(h.signal(temperatureK));
  }

  signalDerivative(temperatureK) {
    const h = this.#live();
    num(temperatureK, 'temperatureK');
    return result(h.signalDerivative(temperatureK));
  }

  temperature(signal) {
    const h = this.#live();
    num(signal, 'signal');
    return result(h.temperature(signal));
  }

  signals(temperaturesK, out) {
    const h = this.#live();
    return bulk(temperaturesK, 'temperaturesK', out, () => h.bulk(SIGNALS));
  }

  signalDerivatives(temperaturesK, out) {
    const h = this.#live();
    return bulk(temperaturesK, 'temperaturesK', out, () => h.bulk(SIGNAL_DERIVATIVES));
  }

  temperatures(signals, out) {
    const h = this.#live();
    return bulk(signals, 'signals', out, () => h.bulk(TEMPERATURES));
  }

  /** max |T_curve(S_exact(T)) − T| against an instrument's exact model. */
  maxInterpolationError(instrument, tMinK, tMaxK, nPoints) {
    const h = this.#live();
    const e = instrumentHandle(instrument, 'instrument');
    num(tMinK, 'tMinK');
    num(tMaxK, 'tMaxK');
    num(nPoints, 'nPoints');
    return some(h.maxInterpolationError(e, tMinK, tMaxK, nPoints));
  }

  /**
   * Converts a frame of raw values (Uint16Array counts or Float32Array/Float64Array signals)
   * to object temperatures. options: { gain, offset, conditions, emissivity, pixelGain,
   * pixelOffset, badPixels, output, out }.
   */
  convertFrame(raw, options) {
    const h = this.#live();
    const tag = typedArrayTag(raw);
    const kind = tag === undefined ? undefined : FRAME_INPUT[tag];
    if (kind === undefined) throw wrongType('raw', 'a Uint16Array, Float32Array or Float64Array', raw);
    const [src, n] = numbers(raw, 'raw');
    // Split the options: the arrays stay here (read once, not copied), the rest is read by the
    // module (which sees `true` in their place).
    let settings = {};
    let kept = {};
    if (options !== undefined) {
      const [copy, arrays] = configKeeping(options, 'options', FRAME_ARRAYS);
      if (copy === null || typeof copy !== 'object' || Array.isArray(copy) || ArrayBuffer.isView(copy)) {
        throw wrongType('options', 'an object', options);
      }
      settings = copy;
      kept = arrays;
    }
    const f64Out = settings.output === 'float64';
    const target = output(kept.out, n, f64Out ? 'Float64Array' : 'Float32Array', 'options.out');
    const eps = pixelMap(kept.emissivity, 'options.emissivity', n);
    const gains = pixelMap(kept.pixelGain, 'options.pixelGain', n);
    const offsets = pixelMap(kept.pixelOffset, 'options.pixelOffset', n);
    const mask = badPixelMask(kept.badPixels, n);
    // Per-pixel corrections take the frame as f64 (the module has one corrected loop per
    // output type); without them each input type keeps its own loop.
    const own = eps === null && gains === null && offsets === null && mask === null;
    // Reserve every buffer first, then write (no memory growth between the views).
    const inKind = own ? kind : F64;
    const pIn = reserve(inKind, 0, n);
    const outKind = f64Out ? F64 : F32;
    const pOut = reserve(outKind, 1, n);
    const pEps = eps === null ? 0 : reserve(F64, 2, n);
    const pGain = gains === null ? 0 : reserve(F64, 3, n);
    const pOffset = offsets === null ? 0 : reserve(F64, 4, n);
    const pMask = mask === null ? 0 : reserve(U8, 0, n);
    fill(inKind, pIn, n, src, 'raw');
    if (eps !== null) fill(F64, pEps, n, eps, 'options.emissivity');
    if (gains !== null) fill(F64, pGain, n, gains, 'options.pixelGain');
    if (offsets !== null) fill(F64, pOffset, n, offsets, 'options.pixelOffset');
    if (mask !== null) fill(U8, pMask, n, mask, 'options.badPixels');
    const summary = some(h.convertFrame(inKind, f64Out, eps !== null, settings));
    const temperaturesK = readBack(outKind, pOut, n, target);
    return {
      temperaturesK,
      valid: summary.valid,
      invalid: summary.invalid,
      minTemperatureK: summary.minTemperatureK,
      maxTemperatureK: summary.maxTemperatureK,
      backgroundSignal: summary.backgroundSignal,
    };
  }
}

/** The options of convertFrame that are arrays (read here, not copied into the settings). */
const FRAME_ARRAYS = ['emissivity', 'pixelGain', 'pixelOffset', 'badPixels', 'out'];

/** A per-pixel map (option `name`) of n numbers, or null when not given. */
function pixelMap(x, name, n) {
  if (x === undefined) return null;
  const [a, m] = numbers(x, name, MAX_LENGTH);
  if (m !== n) {
    throw new QuantabandError('LENGTH_MISMATCH', `${name} must have ${n} elements, one per pixel (got ${m})`);
  }
  return a;
}

/** The bad-pixel mask as a Uint8Array (nonzero or NaN: bad), or null when not given. */
function badPixelMask(x, n) {
  const a = pixelMap(x, 'options.badPixels', n);
  if (a === null || typedArrayTag(a) === 'Uint8Array') return a;
  const mask = new Uint8Array(n);
  for (let i = 0; i < n; i++) mask[i] = a[i] !== 0 ? 1 : 0;
  return mask;
}

if (typeof Symbol.dispose === 'symbol') CalibrationCurve.prototype[Symbol.dispose] = CalibrationCurve.prototype.free;
