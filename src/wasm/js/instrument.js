// Instrument: an instrument's signal model and measurement conditions, prepared once (the
// definition is read and checked in the constructor), then evaluated with plain numbers.
// Wraps QbInstrument (src/wasm/instrument.rs).

import { disposed, wrongType } from './errors.js';
import { bulk, config, glue, num, ready, result, some } from './runtime.js';
import { _measurementBudget } from './uncertainty_results.js';

// Bulk operation numbers of QbInstrument.bulk.
const SIGNALS = 0;
const SIGNAL_DERIVATIVES = 1;
const TEMPERATURES = 2;
const MEASURED_SIGNALS = 3;
const OBJECT_TEMPERATURES = 4;

/** Marks the private construction from an existing handle. */
const FROM_HANDLE = Symbol('handle');

let handleOf;

/**
 * An instrument: `new Instrument({ model, conditions })`, with `model` a spectral point, a
 * response table or a Sakuma–Hattori curve (tag `kind`) and optional measurement conditions.
 */
export class Instrument {
  #h = null;
  #definition;

  static {
    handleOf = (x) => (x !== null && typeof x === 'object' && #h in x ? x.#h : undefined);
  }

  constructor(definition, handle) {
    let h;
    if (definition === FROM_HANDLE) {
      h = handle;
    } else {
      ready();
      h = some(glue.QbInstrument.create(config(definition, 'definition')));
    }
    this.#h = h;
    this.#definition = Object.freeze(h.definition());
  }

  /** The definition as read (canonical unit names), frozen. */
  get definition() {
    return this.#definition;
  }

  #live() {
    const h = this.#h;
    if (h === null) throw disposed('Instrument');
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

  /** The same model under other measurement conditions (a new Instrument). */
  withConditions(conditions) {
    const h = this.#live();
    const c = conditions === undefined ? {} : config(conditions, 'conditions');
    return new Instrument(FROM_HANDLE, some(h.withConditions(c)));
  }

  /** The conditions in use, in SI with every default filled in. */
  conditions() {
    return this.#live().conditions();
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

  measuredSignal(objectTemperatureK) {
    const h = this.#live();
    num(objectTemperatureK, 'objectTemperatureK');
    return result(h.measuredSignal(objectTemperatureK));
  }

  objectTemperature(signal) {
    const h = this.#live();
    num(signal, 'signal');
    return result(h.objectTemperature(signal));
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

  measuredSignals(objectTemperaturesK, out) {
    const h = this.#live();
    return bulk(objectTemperaturesK, 'objectTemperaturesK', out, () => h.bulk(MEASURED_SIGNALS));
  }

  objectTemperatures(signals, out) {
    const h = this.#live();
    return bulk(signals, 'signals', out, () => h.bulk(OBJECT_TEMPERATURES));
  }

  sensitivities(signal) {
    const h = this.#live();
    num(signal, 'signal');
    return some(h.sensitivities(signal));
  }

  /** The GUM budget of the object temperature at a reading (see uncertainty.d.ts). */
  uncertaintyBudget(signal, uncertainties, options) {
    const h = this.#live();
    num(signal, 'signal');
    return _measurementBudget(h, signal, uncertainties, options);
  }

  measurementAffine() {
    return some(this.#live().measurementAffine());
  }

  responseMoments() {
    return some(this.#live().responseMoments());
  }

  signalMoments(temperatureK) {
    const h = this.#live();
    num(temperatureK, 'temperatureK');
    return some(h.signalMoments(temperatureK));
  }

  limitingEffectiveWavelength(temperatureK) {
    const h = this.#live();
    num(temperatureK, 'temperatureK');
    return result(h.limitingEffectiveWavelength(temperatureK));
  }

  effectiveWavelength(t1K, t2K) {
    const h = this.#live();
    num(t1K, 't1K');
    num(t2K, 't2K');
    return result(h.effectiveWavelength(t1K, t2K));
  }

  responseAt(wavelength) {
    const h = this.#live();
    num(wavelength, 'wavelength');
    return result(h.responseAt(wavelength));
  }

  ratioTemperature(channel2, ratio, emissivityRatio = 1, guessK = 1000) {
    const h = this.#live();
    const other = _instrumentHandle(channel2, 'channel2');
    num(ratio, 'ratio');
    num(emissivityRatio, 'emissivityRatio');
    num(guessK, 'guessK');
    return some(h.ratioTemperature(other, ratio, emissivityRatio, guessK));
  }
}

if (typeof Symbol.dispose === 'symbol') Instrument.prototype[Symbol.dispose] = Instrument.prototype.free;

/** The live handle of Instrument argument `name` (for other areas' methods). */
export function _instrumentHandle(x, name) {
  const h = handleOf(x);
  if (h === undefined) throw wrongType(name, 'an Instrument', x);
  if (h === null) throw disposed('Instrument');
  return h;
}
