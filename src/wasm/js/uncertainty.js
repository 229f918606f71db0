// Uncertainty evaluation: Student's t, Type A evaluations, the GUM law of propagation for any
// model, the Monte Carlo method (JCGM 101) as a prepared object run in chunks, and the ITS-90
// ratio sensitivities. Wraps src/wasm/uncertainty.rs. The GUM budget of an instrument's
// measurement equation is Instrument.uncertaintyBudget; the calibration transfer and the
// fixed-point curves are methods of CalibrationCurve (helpers in uncertainty_results.js).

import { QuantabandError, disposed } from './errors.js';
import { _instrumentHandle as instrumentHandle } from './instrument.js';
import { F64, fill, glue, num, numbers, ready, reserve, result, some, str } from './runtime.js';
import {
  _mcLinear,
  _mcMeasurement,
  _monteCarloResult,
  _progress,
  _propagate,
  _scratchNumbers,
  _whole,
} from './uncertainty_results.js';

/** P(T ≤ t) of Student's t with degreesOfFreedom ν > 0 (Infinity: the normal distribution). */
export function studentTCdf(t, degreesOfFreedom) {
  ready();
  num(t, 't');
  num(degreesOfFreedom, 'degreesOfFreedom');
  return result(glue.qbUncertaintyNumber(0, t, degreesOfFreedom));
}

/** The t with P(T ≤ t) = probability ∈ (0, 1), ν > 0 (Infinity: the normal quantile). */
export function studentTQuantile(probability, degreesOfFreedom) {
  ready();
  num(probability, 'probability');
  num(degreesOfFreedom, 'degreesOfFreedom');
  return result(glue.qbUncertaintyNumber(1, probability, degreesOfFreedom));
}

/** k = t_{(1+p)/2}(ν) of a symmetric interval with coverage probability p (JCGM 100 G.3.4). */
export function coverageFactor(coverageProbability, degreesOfFreedom) {
  ready();
  num(coverageProbability, 'coverageProbability');
  num(degreesOfFreedom, 'degreesOfFreedom');
  return result(glue.qbUncertaintyNumber(2, coverageProbability, degreesOfFreedom));
}

/** Type A evaluation of repeated observations (JCGM 100 §4.2): mean, s, s/√n, ν = n − 1. */
export function typeA(observations) {
  ready();
  const [x, n] = numbers(observations, 'observations');
  fill(F64, reserve(F64, 0, n), n, x, 'observations');
  const v = _scratchNumbers(glue.qbUncertaintyNumber(3, 0, 0));
  return { mean: v[0], standardDeviation: v[1], standardUncertainty: v[2], degreesOfFreedom: v[3] };
}

/** Correlation coefficient of the means of two series observed together (JCGM 100 eq. 17). */
export function typeACorrelation(x, y) {
  ready();
  const [a, na] = numbers(x, 'x');
  const [b, nb] = numbers(y, 'y');
  const pa = reserve(F64, 0, na);
  const pb = reserve(F64, 1, nb);
  fill(F64, pa, na, a, 'x');
  fill(F64, pb, nb, b, 'y');
  return result(glue.qbUncertaintyNumber(4, 0, 0));
}

/**
 * The GUM law of propagation for any model: sensitivity coefficients, the inputs' uncertainties
 * and options { correlation, coverageProbability | coverageFactor }.
 */
export function propagateUncertainty(sensitivities, inputs, options) {
  ready();
  return _propagate(sensitivities, inputs, options);
}

/** ∂T/∂r, ∂T/∂T_X and ∂T/∂λ (K per `unit`) of a radiance-ratio temperature. */
export function ratioTemperatureSensitivities(ratio, wavelength, unit, referenceTemperatureK, c2) {
  ready();
  num(ratio, 'ratio');
  num(wavelength, 'wavelength');
  str(unit, 'unit', 'UNKNOWN_UNIT');
  num(referenceTemperatureK, 'referenceTemperatureK');
  let c2Name = '';
  if (c2 !== undefined) {
    str(c2, 'c2', 'UNSUPPORTED');
    if (c2 === '') throw new QuantabandError('UNSUPPORTED', 'c2 must be one of "codata2018", "its90" (got "")');
    c2Name = c2;
  }
  const v = _scratchNumbers(glue.qbRatio(3, ratio, wavelength, referenceTemperatureK, 0, unit, c2Name));
  return { temperatureK: v[0], dTdRatio: v[1], dTdReferenceTemperature: v[2], dTdWavelength: v[3] };
}

/** Marks the private construction. */
const FROM_HANDLE = Symbol('handle');

/**
 * A Monte Carlo propagation of distributions (JCGM 101), prepared once and run in chunks:
 * `MonteCarlo.measurement(instrument, signal, uncertainties, options)` or
 * `MonteCarlo.linear(sensitivities, inputs, options)`, then `step(n)` until `done`, then
 * `result()`.
 */
export class MonteCarlo {
  #h = null;
  /** The GUM result of the same inputs (or undefined), and [y, u_c, U, p] of it. */
  #gum;
  #gumNumbers;

  constructor(token, made) {
    if (token !== FROM_HANDLE) {
      throw new QuantabandError(
        'UNSUPPORTED',
        'create a MonteCarlo with MonteCarlo.measurement(instrument, signal, uncertainties, options) ' +
          'or MonteCarlo.linear(sensitivities, inputs, options)',
      );
    }
    [this.#h, this.#gum, this.#gumNumbers] = made;
  }

  /** The measurement equation of `instrument` at a reading, inputs as for its GUM budget. */
  static measurement(instrument, signal, uncertainties, options) {
    ready();
    const h = instrumentHandle(instrument, 'instrument');
    num(signal, 'signal');
    return new MonteCarlo(FROM_HANDLE, _mcMeasurement(h, signal, uncertainties, options));
  }

  /** The linear model Y = Σ c_i X_i (estimates x_i in options.estimates, default 0). */
  static linear(sensitivities, inputs, options) {
    ready();
    return new MonteCarlo(FROM_HANDLE, _mcLinear(sensitivities, inputs, options));
  }

  #live() {
    const h = this.#h;
    if (h === null) throw disposed('MonteCarlo');
    return h;
  }

  /** Releases the run's WebAssembly memory (its output values) now. */
  free() {
    const h = this.#h;
    if (h !== null) {
      this.#h = null;
      h.free();
    }
  }

  /** Runs up to `trials` more trials (default 10 000) and returns the progress. */
  step(trials = 10_000) {
    const h = this.#live();
    num(trials, 'trials');
    _whole(trials, 'trials', 0, 1e9, 'integers in [0, 1000000000]');
    return _progress(_scratchNumbers(h.step(trials)));
  }

  /** The progress so far, without running. */
  progress() {
    return _progress(_scratchNumbers(this.#live().step(0)));
  }

  /**
   * Ends the run (no more trials) and returns its result: estimate, standard uncertainty,
   * coverage intervals, numerical tolerance, the GUM result and the JCGM 101 §8 validation,
   * and a histogram with `bins` bins (default: Freedman–Diaconis).
   */
  result(bins) {
    const h = this.#live();
    let b = 0;
    if (bins !== undefined) {
      num(bins, 'bins');
      b = _whole(bins, 'bins', 1, 10_000, 'integers in [1, 10000]');
    }
    return _monteCarloResult(_scratchNumbers(h.finish(b, this.#gumNumbers)), this.#gum);
  }
}

if (typeof Symbol.dispose === 'symbol') MonteCarlo.prototype[Symbol.dispose] = MonteCarlo.prototype.free;
