// SpectralInstrument: a detector response (energy or photon units) with spectral measurement
// conditions — target emissivity or reflectance, path transmittance, window transmittance and
// reflectance, each a number or a table — prepared once, then evaluated with plain numbers.
// Also: two-column text tables. Wraps QbSpectral (src/wasm/spectral.rs); the workflows from an
// indicated temperature (reading.js) accept a SpectralInstrument through the resolver this
// module registers there.

import { QuantabandError, disposed, wrongType } from './errors.js';
import { _registerReadingInstrument } from './reading.js';
import { _spectralBudget } from './uncertainty_results.js';
import { F64, MAX_LENGTH, bulk, config, fill, glue, named, num, readBack, ready, reserve, result, some, str } from './runtime.js';

// Bulk operation numbers of QbSpectral.bulk.
const MEASURED_SIGNALS = 0;
const OBJECT_TEMPERATURES = 1;

/** The `kind` argument of tableFromText and its number in the module. */
const TEXT_KINDS = { emissivity: 0, reflectance: 1, transmittance: 2, response: 3 };

/**
 * A token Rust's `f64::from_str` accepts (the grammar the core's text reader is written for):
 * a decimal number with an optional sign and exponent, or inf / infinity / nan in any case.
 */
const NUMBER_TOKEN = /[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?|[+-]?(?:infinity|inf|nan)/gi;

/** The value of a NUMBER_TOKEN match. */
function tokenValue(tok) {
  const t = tok.toLowerCase();
  if (t.endsWith('nan')) return NaN;
  if (t.endsWith('inf') || t.endsWith('infinity')) return t.startsWith('-') ? -Infinity : Infinity;
  return Number(tok);
}

/** Bytes of text[from, to) in UTF-8 (as the module receives it; a lone surrogate is 3). */
function utf8Length(text, from, to) {
  let n = 0;
  for (let i = from; i < to; i++) {
    const c = text.charCodeAt(i);
    if (c < 0x80) n += 1;
    else if (c < 0x800) n += 2;
    else if (c >= 0xd800 && c <= 0xdbff && i + 1 < to) {
      const d = text.charCodeAt(i + 1);
      if (d >= 0xdc00 && d <= 0xdfff) {
        n += 4;
        i++;
      } else n += 3;
    } else n += 3;
  }
  return n;
}

// The result objects: the module writes their numbers to f64 scratch buffer 0 in this order.
const TERMS = ['signal', 'object', 'reflected', 'path', 'windowReflected', 'windowEmitted'];
const EFFECTIVE = ['temperatureK', 'emissivity', 'reflectance', 'pathTransmittance', 'windowTransmittance', 'windowReflectance', 'objectGain'];
const SENSITIVITIES = [
  'temperatureK',
  'signal',
  'emissivityScale',
  'reflectanceScale',
  'pathTransmittanceScale',
  'windowTransmittanceScale',
  'windowReflectanceScale',
  'responseScale',
  'reflectedTemperature',
  'pathTemperature',
  'windowTemperature',
  'windowReflectedTemperature',
];

let handleOf;

/**
 * A spectral instrument: `new SpectralInstrument({ response, conditions, c2 })`, with the
 * response a table `{ wavelengths, values, unit, quantity }` and each optical input of the
 * conditions a number (grey) or a table `{ wavelengths, values, unit, ends }`.
 */
export class SpectralInstrument {
  #h = null;

  static {
    handleOf = (x) => (x !== null && typeof x === 'object' && #h in x ? x.#h : undefined);
  }

  constructor(definition) {
    ready();
    this.#h = some(glue.QbSpectral.create(config(definition, 'definition')));
  }

  /**
   * A table read from two-column text or CSV (wavelength, value; the spectral coordinate in
   * `unit`), as `{ wavelengths, values, unit: "m" }` ready for a definition.
   */
  static tableFromText(text, unit, kind) {
    ready();
    if (typeof text !== 'string') throw wrongType('text', 'a string', text);
    if (text.length > MAX_LENGTH) {
      throw new QuantabandError('TOO_LARGE', `text has ${text.length} characters; at most ${MAX_LENGTH} are accepted`);
    }
    str(unit, 'unit', 'UNKNOWN_UNIT');
    str(kind, 'kind', 'UNSUPPORTED');
    const k = Object.prototype.hasOwnProperty.call(TEXT_KINDS, kind) ? TEXT_KINDS[kind] : undefined;
    if (k === undefined) {
      throw new QuantabandError(
        'UNSUPPORTED',
        `kind must be one of "emissivity", "reflectance", "transmittance", "response" (got "${kind}")`,
      );
    }
    // Every number-like token, converted here (Number rounds correctly); the module's reader
    // takes a field as a number when a token starts where it starts and is exactly as long.
    const values = [];
    const offsets = [];
    const lengths = [];
    let bytes = 0;
    let last = 0;
    for (const m of text.matchAll(NUMBER_TOKEN)) {
      bytes += utf8Length(text, last, m.index);
      const tok = m[0];
      values.push(tokenValue(tok));
      offsets.push(bytes);
      lengths.push(tok.length);
      bytes += tok.length;
      last = m.index + tok.length;
    }
    const count = values.length;
    const pv = reserve(F64, 0, count);
    const po = reserve(F64, 1, count);
    const pl = reserve(F64, 2, count);
    fill(F64, pv, count, values, 'text');
    fill(F64, po, count, offsets, 'text');
    fill(F64, pl, count, lengths, 'text');
    const n = result(glue.spectralTableFromText(text, unit, k));
    const pw = reserve(F64, 0, n);
    const pr = reserve(F64, 1, n);
    return { wavelengths: readBack(F64, pw, n, null), values: readBack(F64, pr, n, null), unit: 'm' };
  }

  #live() {
    const h = this.#h;
    if (h === null) throw disposed('SpectralInstrument');
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
    return result(h.number(0, temperatureK));
  }

  measuredSignal(objectTemperatureK) {
    const h = this.#live();
    num(objectTemperatureK, 'objectTemperatureK');
    return result(h.number(1, objectTemperatureK));
  }

  objectTemperature(signal) {
    const h = this.#live();
    num(signal, 'signal');
    return result(h.number(2, signal));
  }

  measuredSignals(objectTemperaturesK, out) {
    const h = this.#live();
    return bulk(objectTemperaturesK, 'objectTemperaturesK', out, () => h.bulk(MEASURED_SIGNALS));
  }

  objectTemperatures(signals, out) {
    const h = this.#live();
    return bulk(signals, 'signals', out, () => h.bulk(OBJECT_TEMPERATURES));
  }

  signalTerms(objectTemperatureK) {
    const h = this.#live();
    num(objectTemperatureK, 'objectTemperatureK');
    return named(TERMS, h.number(3, objectTemperatureK));
  }

  bandEffective(temperatureK) {
    const h = this.#live();
    num(temperatureK, 'temperatureK');
    return named(EFFECTIVE, h.number(4, temperatureK));
  }

  sensitivities(signal) {
    const h = this.#live();
    num(signal, 'signal');
    return named(SENSITIVITIES, h.number(5, signal));
  }

  /**
   * The GUM budget of the object temperature at a reading (JCGM 100 eq. 10/16, G.2b): the
   * sensitivities above with the inputs' uncertainties (see spectral.d.ts).
   */
  uncertaintyBudget(signal, uncertainties, options) {
    this.#live();
    num(signal, 'signal');
    return _spectralBudget(SENSITIVITIES.slice(1), () => this.sensitivities(signal), uncertainties, options);
  }
}

if (typeof Symbol.dispose === 'symbol') {
  SpectralInstrument.prototype[Symbol.dispose] = SpectralInstrument.prototype.free;
}

_registerReadingInstrument('SpectralInstrument', (x) => {
  const h = handleOf(x);
  if (h === null) throw disposed('SpectralInstrument');
  return h;
});
