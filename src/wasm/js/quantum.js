// Multi-wavelength pyrometry (fitMultiwavelength → MultiwavelengthFit), Raman thermometry
// (RamanMode), noise-source Y-factor thermometry (YFactorLoads, decibel helpers) and
// semiconductor carrier statistics (Semiconductor, bandCarrierDensity). Wraps
// QbMultiwavelengthFit (src/wasm/quantum_fit.rs) and QbRamanMode, QbYFactorLoads,
// QbSemiconductor and the free functions of src/wasm/quantum.rs.

import { QuantabandError, disposed, typedArrayTag, unreadable, wrongType } from './errors.js';
import { _instrumentHandle as instrumentHandle } from './instrument.js';
import {
  F64,
  bulk,
  readBack,
  config,
  configKeeping,
  figures,
  fill,
  glue,
  num,
  numbers,
  ready,
  reserve,
  result,
  some,
  str,
} from './runtime.js';

/** Marks the private construction from a handle. */
const FROM_HANDLE = Symbol('handle');

// ---- configuration objects -----------------------------------------------------------------
//
// The configurations of this area are flat, so their fields are read here from the plain-data
// copy that `config` makes (no getter or Proxy of the caller's runs after it) and passed to the
// module as arguments: a serde reader per configuration costs 6–7 KB of WebAssembly (see
// src/wasm/quantum.rs). The messages are those of the module's reader (src/wasm/config.rs).

/** The fields of `c`, the copy of configuration object `value` (parameter `name`), checked
 * against the `accepted` keys. */
function fields(c, value, name, accepted) {
  if (c === null || typeof c !== 'object' || Array.isArray(c) || typedArrayTag(c) !== undefined) {
    throw wrongType(name, 'an object', value);
  }
  for (const k of Object.keys(c)) {
    if (!accepted.includes(k)) {
      const list = accepted.map((a) => `"${a}"`).join(', ');
      throw new QuantabandError('UNSUPPORTED', `${name}: unknown field "${k}" (accepted fields: ${list})`);
    }
  }
  return c;
}

/** True when field `key` of `c` is given (null counts as left out, as in the module's reader). */
function given(c, key) {
  return c[key] !== undefined && c[key] !== null;
}

/** The required number `key` of `c` (configuration `name`). */
function requiredNumber(c, key, name) {
  if (!given(c, key)) throw new QuantabandError('WRONG_TYPE', `${name}.${key} is required (got ${describeAbsent(c[key])})`);
  num(c[key], `${name}.${key}`);
  return c[key];
}

/** The optional number `key` of `c`, or undefined. */
function optionalNumber(c, key, name) {
  if (!given(c, key)) return undefined;
  num(c[key], `${name}.${key}`);
  return c[key];
}

/** The required unit name `key` of `c`. */
function requiredUnit(c, key, name) {
  if (!given(c, key)) throw new QuantabandError('WRONG_TYPE', `${name}.${key} is required (got ${describeAbsent(c[key])})`);
  str(c[key], `${name}.${key}`, 'UNKNOWN_UNIT');
  return c[key];
}

/** The position in `choices` of the optional choice `key` of `c` (0, the default, when left
 * out). */
function choice(c, key, name, choices) {
  if (!given(c, key)) return 0;
  const v = c[key];
  str(v, `${name}.${key}`, 'UNSUPPORTED');
  const i = choices.indexOf(v);
  if (i < 0) {
    const list = choices.map((a) => `"${a}"`).join(', ');
    throw new QuantabandError('UNSUPPORTED', `${name}.${key} must be one of ${list} (got "${v}")`);
  }
  return i;
}

function describeAbsent(v) {
  return v === null ? 'null' : 'undefined';
}

/** Frozen copies of the arrays (and arrays of arrays) of a result object, then the object. */
function frozen(o) {
  for (const k of Object.keys(o)) {
    const v = o[k];
    if (Array.isArray(v)) {
      for (const x of v) if (Array.isArray(x)) Object.freeze(x);
      Object.freeze(v);
    } else if (v !== null && typeof v === 'object') {
      Object.freeze(v);
    }
  }
  return Object.freeze(o);
}

/** Makes Symbol.dispose an alias of the class's free(). */
function disposable(cls) {
  if (typeof Symbol.dispose === 'symbol') cls.prototype[Symbol.dispose] = cls.prototype.free;
}

// ---- multi-wavelength pyrometry ------------------------------------------------------------

const MEASUREMENT_FIELDS = ['wavelengths', 'unit', 'radiances', 'channels', 'signals', 'uncertainties', 'c2'];
const OPTION_FIELDS = ['model', 'maxConditionNumber', 'maxAbsCorrelation'];
const C2_NAMES = ['codata2018', 'its90'];
const MODEL_KINDS = ['polynomial', 'logPolynomial'];

/** The numbers of the required array `key` of measurement copy `c`. */
function requiredArray(c, key) {
  if (!given(c, key)) throw new QuantabandError('WRONG_TYPE', `measurement.${key} is required (got ${describeAbsent(c[key])})`);
  return numbers(c[key], `measurement.${key}`);
}

/** The live handles of the Instruments in array `channels` (the caller's own array). */
function channelHandles(channels) {
  const name = 'measurement.channels';
  let items;
  try {
    if (!Array.isArray(channels)) throw wrongType(name, 'an array of Instruments', channels);
    items = Array.from(channels);
  } catch (e) {
    throw unreadable(name, e);
  }
  return items.map((x, i) => instrumentHandle(x, `${name}[${i}]`));
}

/**
 * Fits the temperature and an emissivity model to N channels by weighted least squares with
 * Planck's law. `measurement`: `{ wavelengths, unit, radiances, uncertainties, c2? }` (spectral
 * radiances per `unit` of wavelength) or `{ channels, wavelengths, unit, signals,
 * uncertainties }` (band signals of Instruments); `options`: `{ model, maxConditionNumber,
 * maxAbsCorrelation }`. Returns a MultiwavelengthFit.
 */
export function fitMultiwavelength(measurement, options) {
  ready();
  const [copy, kept] = configKeeping(measurement, 'measurement', ['channels']);
  const m = fields(copy, measurement, 'measurement', MEASUREMENT_FIELDS);
  const bands = kept.channels !== undefined && kept.channels !== null;
  if (bands) {
    if (given(m, 'radiances')) {
      throw new QuantabandError('UNSUPPORTED', 'measurement.radiances is for spectral radiances; band signals of measurement.channels go in measurement.signals');
    }
    if (given(m, 'c2')) {
      throw new QuantabandError('UNSUPPORTED', 'measurement.c2: with measurement.channels each channel model carries its own c2');
    }
  } else if (given(m, 'signals')) {
    throw new QuantabandError('UNSUPPORTED', 'measurement.signals goes with measurement.channels; spectral radiances go in measurement.radiances');
  }
  const unit = requiredUnit(m, 'unit', 'measurement');
  const c2 = choice(m, 'c2', 'measurement', C2_NAMES);
  const [wl, nw] = requiredArray(m, 'wavelengths');
  const [values, nv] = requiredArray(m, bands ? 'signals' : 'radiances');
  const [u, nu] = requiredArray(m, 'uncertainties');
  const ocopy = options === undefined ? {} : config(options, 'options');
  const o = fields(ocopy, options, 'options', OPTION_FIELDS);
  let kind = 0;
  let order = 0;
  if (given(o, 'model')) {
    const model = fields(o.model, o.model, 'options.model', ['kind', 'order']);
    if (!given(model, 'kind')) throw new QuantabandError('WRONG_TYPE', `options.model.kind is required (got ${describeAbsent(model.kind)})`);
    kind = choice(model, 'kind', 'options.model', MODEL_KINDS);
    order = requiredNumber(model, 'order', 'options.model');
  }
  const maxCond = optionalNumber(o, 'maxConditionNumber', 'options');
  const maxCorr = optionalNumber(o, 'maxAbsCorrelation', 'options');
  const handles = bands ? channelHandles(kept.channels) : [];
  // everything is read: now the module (channels first, then the scratch buffers)
  handles.forEach((h, i) => glue.qbMultiwavelengthChannel(h, i === 0));
  const pw = reserve(F64, 0, nw);
  const pv = reserve(F64, 1, nv);
  const pu = reserve(F64, 2, nu);
  fill(F64, pw, nw, wl, 'measurement.wavelengths');
  fill(F64, pv, nv, values, bands ? 'measurement.signals' : 'measurement.radiances');
  fill(F64, pu, nu, u, 'measurement.uncertainties');
  const h = some(glue.QbMultiwavelengthFit.create(unit, bands ? handles.length : -1, c2, kind, order, maxCond, maxCorr));
  return new MultiwavelengthFit(FROM_HANDLE, h, unit);
}

const WARNINGS = ['conditionNumber', 'correlation', 'localMinima', 'unphysicalEmissivity'];

/** The figures of fit handle `h` (written by QbMultiwavelengthFit.summary to f64 scratch
 * buffer 0: a header of 21 numbers, then the coefficients, the covariance row by row and the
 * brightness temperatures; NaN where the core has none). */
function fitSummary(h, unit) {
  const len = result(h.summary());
  const v = readBack(F64, reserve(F64, 0, len), len, null);
  const none = (x) => (x === x ? x : undefined);
  const order = v[5];
  const p = order + 2;
  const n = v[20];
  let at = 21;
  const take = (k) => Array.from(v.subarray(at, (at += k)));
  const coefficients = take(p - 1);
  const covariance = Array.from({ length: p }, () => take(p));
  return {
    temperatureK: v[0],
    uTemperatureK: v[1],
    illConditioned: v[2] === 1,
    warnings: WARNINGS.filter((_, k) => (v[3] & (1 << k)) !== 0),
    model: { kind: MODEL_KINDS[v[4]], order },
    coefficients,
    covariance,
    unit,
    centreWavelength: v[6],
    halfSpan: v[7],
    conditionNumber: v[8],
    correlationTemperatureSlope: none(v[9]),
    uncertaintyInflation: v[10],
    localMinima: v[11],
    emissivityPhysical: v[12] === 1,
    chiSquared: v[13],
    degreesOfFreedom: v[14],
    iterations: v[15],
    startTemperatureK: v[16],
    brightnessTemperaturesK: take(n),
    greyTwoColourTemperatureK: none(v[17]),
    maxConditionNumber: v[18],
    maxAbsCorrelation: v[19],
  };
}

/**
 * The result of fitMultiwavelength: every figure as an own read-only property (temperatureK,
 * uTemperatureK, illConditioned, warnings, coefficients, covariance, …) and the fitted
 * emissivity ε(λ). Holds WebAssembly memory for emissivity() until free().
 */
export class MultiwavelengthFit {
  #h = null;

  constructor(token, handle, unit) {
    if (token !== FROM_HANDLE) {
      throw new QuantabandError('UNSUPPORTED', 'a MultiwavelengthFit is made by fitMultiwavelength(measurement, options)');
    }
    let figures;
    try {
      figures = fitSummary(handle, unit);
    } catch (e) {
      handle.free();
      throw e;
    }
    this.#h = handle;
    Object.assign(this, figures);
    frozen(this);
  }

  #live() {
    const h = this.#h;
    if (h === null) throw disposed('MultiwavelengthFit');
    return h;
  }

  /** Releases the object's WebAssembly memory now (emissivity() then throws DISPOSED; the
   * figures stay readable). */
  free() {
    const h = this.#h;
    if (h !== null) {
      this.#h = null;
      h.free();
    }
  }

  /** The fitted emissivity at `wavelength` (in the measurement's unit). */
  emissivity(wavelength) {
    const h = this.#live();
    num(wavelength, 'wavelength');
    return result(h.emissivity(wavelength));
  }

  /** The fitted emissivity at each of `wavelengths` (bulk). */
  emissivities(wavelengths, out) {
    const h = this.#live();
    return bulk(wavelengths, 'wavelengths', out, () => h.bulk());
  }
}
disposable(MultiwavelengthFit);

// ---- Raman thermometry ---------------------------------------------------------------------

const RATIOS = 0;
const TEMPERATURES = 1;
// Operation numbers of QbRamanMode.number.
const RATIO = 0;
const READING = 1;
const FACTOR = 2;

/**
 * A Raman mode: `new RamanMode({ shiftPerCm, excitation, unit, detection })` (shift in cm⁻¹,
 * excitation in any spectral unit, detection "photonCounting" (default) or "energy").
 */
export class RamanMode {
  #h = null;
  #factor;

  constructor(mode) {
    ready();
    const c = fields(config(mode, 'mode'), mode, 'mode', ['shiftPerCm', 'excitation', 'unit', 'detection']);
    const shift = requiredNumber(c, 'shiftPerCm', 'mode');
    const excitation = requiredNumber(c, 'excitation', 'mode');
    const unit = requiredUnit(c, 'unit', 'mode');
    const detection = choice(c, 'detection', 'mode', ['photonCounting', 'energy']);
    const h = some(glue.QbRamanMode.create(shift, excitation, unit, detection));
    this.#h = h;
    this.#factor = h.number(FACTOR, 0);
  }

  /** The frequency factor F = (ν̃_aS/ν̃_S)^k (dimensionless, > 1). */
  get frequencyFactor() {
    return this.#factor;
  }

  #live() {
    const h = this.#h;
    if (h === null) throw disposed('RamanMode');
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

  ratio(temperatureK) {
    const h = this.#live();
    num(temperatureK, 'temperatureK');
    return result(h.number(RATIO, temperatureK));
  }

  ratios(temperaturesK, out) {
    const h = this.#live();
    return bulk(temperaturesK, 'temperaturesK', out, () => h.bulk(RATIOS));
  }

  temperature(ratio) {
    const h = this.#live();
    num(ratio, 'ratio');
    const v = figures(h.number(READING, ratio));
    return {
      temperatureK: v[0],
      dTdRatio: v[1],
      relativeSensitivityPerK: v[2],
      phononOccupancy: v[3],
      frequencyFactor: v[4],
      modeTemperatureK: v[5],
    };
  }

  temperatures(ratios, out) {
    const h = this.#live();
    return bulk(ratios, 'ratios', out, () => h.bulk(TEMPERATURES));
  }
}
disposable(RamanMode);

// ---- noise-source (Y-factor) thermometry ---------------------------------------------------

const LOAD_MODELS = ['callenWelton', 'planck', 'rayleighJeans'];

/**
 * The hot and cold loads of a Y-factor measurement: `new YFactorLoads({ hotLoadK, coldLoadK,
 * unit, loadModel })`, frequencies in `unit`, the loads' noise temperatures in the convention
 * `loadModel` ("callenWelton" (default), "planck" or "rayleighJeans").
 */
export class YFactorLoads {
  #h = null;

  constructor(loads) {
    ready();
    const c = fields(config(loads, 'loads'), loads, 'loads', ['hotLoadK', 'coldLoadK', 'unit', 'loadModel']);
    const hot = requiredNumber(c, 'hotLoadK', 'loads');
    const cold = requiredNumber(c, 'coldLoadK', 'loads');
    const unit = requiredUnit(c, 'unit', 'loads');
    const model = choice(c, 'loadModel', 'loads', LOAD_MODELS);
    this.#h = some(glue.QbYFactorLoads.create(hot, cold, unit, model));
  }

  #live() {
    const h = this.#h;
    if (h === null) throw disposed('YFactorLoads');
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

  /** Receiver noise temperature from a measured Y (linear power ratio hot/cold). */
  receiverTemperature(y, frequency) {
    const h = this.#live();
    num(y, 'y');
    num(frequency, 'frequency');
    const v = figures(h.number(1, y, frequency));
    return {
      model: LOAD_MODELS[v[0]],
      receiverNoiseTemperatureK: v[1],
      dTdY: v[2],
      hotLoadNoiseTemperatureK: v[3],
      coldLoadNoiseTemperatureK: v[4],
      rayleighJeansK: v[5],
      planckK: v[6],
      callenWeltonK: v[7],
      planckMinusRayleighJeansK: v[8],
      callenWeltonMinusRayleighJeansK: v[9],
    };
  }

  /** The Y factor a receiver of noise temperature receiverNoiseTemperatureK shows. */
  yFactor(receiverNoiseTemperatureK, frequency) {
    const h = this.#live();
    num(receiverNoiseTemperatureK, 'receiverNoiseTemperatureK');
    num(frequency, 'frequency');
    return result(h.number(0, receiverNoiseTemperatureK, frequency));
  }
}
disposable(YFactorLoads);

/** A power ratio (linear) from its value in dB: 10^(decibels/10). */
export function decibelsToPowerRatio(decibels) {
  ready();
  num(decibels, 'decibels');
  return result(glue.qbDecibels(true, decibels));
}

/** The value in dB of a power ratio (> 0): 10·log10(ratio). */
export function powerRatioToDecibels(ratio) {
  ready();
  num(ratio, 'ratio');
  return result(glue.qbDecibels(false, ratio));
}

// ---- semiconductor carrier statistics ------------------------------------------------------

// Operation numbers of QbSemiconductor.number.
const BAND_GAP = 0;
const N_C = 1;
const N_V = 2;
const FERMI_FROM_N = 3;
const FERMI_FROM_P = 4;
const ELECTRONS = 5;
const HOLES = 6;
const INTRINSIC = 7;

/** A carrier-density result from its figures. */
function carriers(n) {
  const v = figures(n);
  return {
    densityPerM3: v[0],
    boltzmannDensityPerM3: v[1],
    boltzmannRelativeError: v[2],
    reducedFermiLevel: v[3],
  };
}

const SEMICONDUCTOR_FIELDS = ['electronMassRatio', 'holeMassRatio', 'bandGap0K', 'varshniAlpha', 'varshniBetaK', 'energyUnit'];

/**
 * A semiconductor with parabolic bands: `new Semiconductor({ electronMassRatio, holeMassRatio,
 * bandGap0K, varshniAlpha, varshniBetaK, energyUnit })`; energies (band gap, Fermi levels,
 * measured from the valence-band maximum) in `energyUnit`, densities in m⁻³.
 */
export class Semiconductor {
  #h = null;

  constructor(material) {
    ready();
    const name = 'material';
    const c = fields(config(material, name), material, name, SEMICONDUCTOR_FIELDS);
    this.#h = some(
      glue.QbSemiconductor.create(
        requiredNumber(c, 'electronMassRatio', name),
        requiredNumber(c, 'holeMassRatio', name),
        requiredNumber(c, 'bandGap0K', name),
        optionalNumber(c, 'varshniAlpha', name),
        optionalNumber(c, 'varshniBetaK', name),
        requiredUnit(c, 'energyUnit', name),
      ),
    );
  }

  #live() {
    const h = this.#h;
    if (h === null) throw disposed('Semiconductor');
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

  bandGap(temperatureK) {
    const h = this.#live();
    num(temperatureK, 'temperatureK');
    return result(h.number(BAND_GAP, 0, temperatureK));
  }

  conductionBandDensityOfStates(temperatureK) {
    const h = this.#live();
    num(temperatureK, 'temperatureK');
    return result(h.number(N_C, 0, temperatureK));
  }

  valenceBandDensityOfStates(temperatureK) {
    const h = this.#live();
    num(temperatureK, 'temperatureK');
    return result(h.number(N_V, 0, temperatureK));
  }

  electronDensity(fermiLevel, temperatureK) {
    const h = this.#live();
    num(fermiLevel, 'fermiLevel');
    num(temperatureK, 'temperatureK');
    return carriers(h.number(ELECTRONS, fermiLevel, temperatureK));
  }

  holeDensity(fermiLevel, temperatureK) {
    const h = this.#live();
    num(fermiLevel, 'fermiLevel');
    num(temperatureK, 'temperatureK');
    return carriers(h.number(HOLES, fermiLevel, temperatureK));
  }

  fermiLevelFromElectronDensity(electronDensityPerM3, temperatureK) {
    const h = this.#live();
    num(electronDensityPerM3, 'electronDensityPerM3');
    num(temperatureK, 'temperatureK');
    return result(h.number(FERMI_FROM_N, electronDensityPerM3, temperatureK));
  }

  fermiLevelFromHoleDensity(holeDensityPerM3, temperatureK) {
    const h = this.#live();
    num(holeDensityPerM3, 'holeDensityPerM3');
    num(temperatureK, 'temperatureK');
    return result(h.number(FERMI_FROM_P, holeDensityPerM3, temperatureK));
  }

  intrinsic(temperatureK) {
    const h = this.#live();
    num(temperatureK, 'temperatureK');
    const v = figures(h.number(INTRINSIC, 0, temperatureK));
    return {
      densityPerM3: v[0],
      boltzmannDensityPerM3: v[1],
      fermiLevel: v[2],
      boltzmannFermiLevel: v[3],
      bandGap: v[4],
    };
  }

  intrinsicDensities(temperaturesK, out) {
    const h = this.#live();
    return bulk(temperaturesK, 'temperaturesK', out, () => h.intrinsicBulk());
  }
}
disposable(Semiconductor);

/** Carrier density of one parabolic band (Fermi–Dirac and Boltzmann) at reduced level η. */
export function bandCarrierDensity(effectiveDensityPerM3, reducedFermiLevel) {
  ready();
  num(effectiveDensityPerM3, 'effectiveDensityPerM3');
  num(reducedFermiLevel, 'reducedFermiLevel');
  return carriers(glue.qbBandCarrierDensity(effectiveDensityPerM3, reducedFermiLevel));
}
