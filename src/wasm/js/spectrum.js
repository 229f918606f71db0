// Spectrum: a Planck spectrum prepared once (settings read and checked in the constructor),
// then evaluated with plain numbers. Wraps QbSpectrum (src/wasm/spectrum.rs).

import { disposed } from './errors.js';
import { bulk, config, glue, num, ready, result, some } from './runtime.js';

// Bulk operation numbers of QbSpectrum.bulk.
const POINTS = 0;
const DERIVATIVES = 1;
const BANDS = 2;
const BAND_DERIVATIVES = 3;
const BAND_FRACTIONS = 4;
const BAND_TEMPERATURES = 5;
const TEMPERATURES = 6;
const BRIGHTNESS_TEMPERATURES = 7;

/**
 * A Planck spectrum in user units. `new Spectrum({ unit: "um" })` is blackbody spectral
 * radiance per µm of wavelength; see SpectrumSettings for every field.
 */
export class Spectrum {
  #h = null;
  #settings;
  #units;

  constructor(settings) {
    ready();
    const h = some(glue.QbSpectrum.create(config(settings, 'settings')));
    this.#h = h;
    this.#settings = Object.freeze(h.settings());
    this.#units = Object.freeze(h.units());
  }

  /** The settings in use, every default filled in (frozen). */
  get settings() {
    return this.#settings;
  }

  /** Plain-text labels of the result units (frozen). */
  get units() {
    return this.#units;
  }

  #live() {
    const h = this.#h;
    if (h === null) throw disposed('Spectrum');
    return h;
  }

  /** Releases the object's WebAssembly memory now (later calls throw DISPOSED). */
  free() {
    const h = this.#h;
    if (h !== null && h !== undefined) {
      this.#h = null;
      h.free();
    }
  }

  point(x, temperatureK) {
    const h = this.#live();
    num(x, 'x');
    num(temperatureK, 'temperatureK');
    return result(h.point(x, temperatureK));
  }

  derivative(x, temperatureK) {
    const h = this.#live();
    num(x, 'x');
    num(temperatureK, 'temperatureK');
    return result(h.derivative(x, temperatureK));
  }

  total(temperatureK) {
    const h = this.#live();
    num(temperatureK, 'temperatureK');
    return result(h.total(temperatureK));
  }

  totalDerivative(temperatureK) {
    const h = this.#live();
    num(temperatureK, 'temperatureK');
    return result(h.totalDerivative(temperatureK));
  }

  peak(temperatureK) {
    const h = this.#live();
    num(temperatureK, 'temperatureK');
    return result(h.peak(temperatureK));
  }

  band(lower, upper, temperatureK) {
    const h = this.#live();
    num(lower, 'lower');
    num(upper, 'upper');
    num(temperatureK, 'temperatureK');
    return result(h.band(lower, upper, temperatureK));
  }

  bandDerivative(lower, upper, temperatureK) {
    const h = this.#live();
    num(lower, 'lower');
    num(upper, 'upper');
    num(temperatureK, 'temperatureK');
    return result(h.bandDerivative(lower, upper, temperatureK));
  }

  bandFraction(lower, upper, temperatureK) {
    const h = this.#live();
    num(lower, 'lower');
    num(upper, 'upper');
    num(temperatureK, 'temperatureK');
    return result(h.bandFraction(lower, upper, temperatureK));
  }

  temperature(x, value) {
    const h = this.#live();
    num(x, 'x');
    num(value, 'value');
    return result(h.temperature(x, value));
  }

  brightnessTemperature(x, value) {
    const h = this.#live();
    num(x, 'x');
    num(value, 'value');
    return result(h.brightnessTemperature(x, value));
  }

  bandTemperature(lower, upper, value) {
    const h = this.#live();
    num(lower, 'lower');
    num(upper, 'upper');
    num(value, 'value');
    return result(h.bandTemperature(lower, upper, value));
  }

  bandRatioTemperature(lower1, upper1, lower2, upper2, ratio, emissivityRatio = 1) {
    const h = this.#live();
    num(lower1, 'lower1');
    num(upper1, 'upper1');
    num(lower2, 'lower2');
    num(upper2, 'upper2');
    num(ratio, 'ratio');
    num(emissivityRatio, 'emissivityRatio');
    return result(h.bandRatioTemperature(lower1, upper1, lower2, upper2, ratio, emissivityRatio));
  }

  points(xs, temperatureK, out) {
    const h = this.#live();
    num(temperatureK, 'temperatureK');
    return bulk(xs, 'xs', out, () => h.bulk(POINTS, temperatureK, 0));
  }

  derivatives(xs, temperatureK, out) {
    const h = this.#live();
    num(temperatureK, 'temperatureK');
    return bulk(xs, 'xs', out, () => h.bulk(DERIVATIVES, temperatureK, 0));
  }

  bands(lower, upper, temperaturesK, out) {
    const h = this.#live();
    num(lower, 'lower');
    num(upper, 'upper');
    return bulk(temperaturesK, 'temperaturesK', out, () => h.bulk(BANDS, lower, upper));
  }

  bandDerivatives(lower, upper, temperaturesK, out) {
    const h = this.#live();
    num(lower, 'lower');
    num(upper, 'upper');
    return bulk(temperaturesK, 'temperaturesK', out, () => h.bulk(BAND_DERIVATIVES, lower, upper));
  }

  bandFractions(lower, upper, temperaturesK, out) {
    const h = this.#live();
    num(lower, 'lower');
    num(upper, 'upper');
    return bulk(temperaturesK, 'temperaturesK', out, () => h.bulk(BAND_FRACTIONS, lower, upper));
  }

  bandTemperatures(lower, upper, values, out) {
    const h = this.#live();
    num(lower, 'lower');
    num(upper, 'upper');
    return bulk(values, 'values', out, () => h.bulk(BAND_TEMPERATURES, lower, upper));
  }

  temperatures(x, values, out) {
    const h = this.#live();
    num(x, 'x');
    return bulk(values, 'values', out, () => h.bulk(TEMPERATURES, x, 0));
  }

  brightnessTemperatures(x, values, out) {
    const h = this.#live();
    num(x, 'x');
    return bulk(values, 'values', out, () => h.bulk(BRIGHTNESS_TEMPERATURES, x, 0));
  }
}

if (typeof Symbol.dispose === 'symbol') Spectrum.prototype[Symbol.dispose] = Spectrum.prototype.free;
