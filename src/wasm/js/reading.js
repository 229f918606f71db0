// The workflows from an indicated temperature: correcting a reading made at one emissivity
// setting (and reflected temperature, path, window) to the instrument's conditions, the
// reflected temperature from a reflector reading, and the emissivity by the contact and
// reference-coating methods. They take an Instrument, or a SpectralInstrument where the build
// has the spectral-table bindings (spectral.js registers it). Wraps the readingWorkflow exports
// (src/wasm/reading.rs, src/wasm/spectral.rs).

import { wrongType } from './errors.js';
import { _instrumentHandle as instrumentHandle } from './instrument.js';
import { config, named, num, ready, result } from './runtime.js';

// Operation numbers of readingWorkflow (QbInstrument and QbSpectral).
const CORRECT = 0;
const REFLECTED = 1;
const CONTACT = 2;
const REFERENCE = 3;

/**
 * Instrument classes of other areas the workflows accept besides Instrument: [name, resolver],
 * the resolver giving the live handle of its class's objects (throwing DISPOSED for a freed
 * one) and undefined for anything else. spectral.js registers SpectralInstrument, where the
 * build has it.
 */
const others = [];

/** Registers another instrument class for the workflows (see `others`). */
export function _registerReadingInstrument(name, resolve) {
  others.push([name, resolve]);
}

/** The live handle of the `instrument` argument. */
function readingHandle(x) {
  for (const [, resolve] of others) {
    const h = resolve(x);
    if (h !== undefined) return h;
  }
  try {
    return instrumentHandle(x, 'instrument');
  } catch (e) {
    if (e.code === 'WRONG_TYPE') {
      const names = ['an Instrument', ...others.map(([n]) => `a ${n}`)];
      throw wrongType('instrument', names.join(' or '), x);
    }
    throw e;
  }
}

/** The copy of the `setting` argument (required). */
function settingOf(setting) {
  if (setting === undefined) {
    throw wrongType('setting', 'an object: the settings of the reading, e.g. { emissivity: 0.95, reflectedTemperatureK: 293.15 }', setting);
  }
  return config(setting, 'setting');
}

/** A workflow of readingWorkflow: `op`, the indicated temperature and two numbers b, c. */
function reading(op, instrument, indicatedTemperatureK, setting, b, bName, c, cName) {
  ready();
  const h = readingHandle(instrument);
  num(indicatedTemperatureK, 'indicatedTemperatureK');
  const s = settingOf(setting);
  num(b, bName);
  num(c, cName);
  return result(h.readingWorkflow(op, indicatedTemperatureK, b, c, 0, s));
}

export function correctReading(instrument, indicatedTemperatureK, setting) {
  return reading(CORRECT, instrument, indicatedTemperatureK, setting, 0, '', 0, '');
}

export function reflectedTemperature(instrument, indicatedTemperatureK, setting, reflectorEmissivity, reflectorTemperatureK) {
  return reading(
    REFLECTED,
    instrument,
    indicatedTemperatureK,
    setting,
    reflectorEmissivity,
    'reflectorEmissivity',
    reflectorTemperatureK,
    'reflectorTemperatureK',
  );
}

export function emissivityByContact(instrument, indicatedTemperatureK, setting, trueTemperatureK, reflectedTemperatureK) {
  return reading(
    CONTACT,
    instrument,
    indicatedTemperatureK,
    setting,
    trueTemperatureK,
    'trueTemperatureK',
    reflectedTemperatureK,
    'reflectedTemperatureK',
  );
}

export function emissivityByReference(
  instrument,
  referenceReadingK,
  surfaceReadingK,
  setting,
  referenceEmissivity,
  reflectedTemperatureK,
) {
  ready();
  const h = readingHandle(instrument);
  num(referenceReadingK, 'referenceReadingK');
  num(surfaceReadingK, 'surfaceReadingK');
  const s = settingOf(setting);
  num(referenceEmissivity, 'referenceEmissivity');
  num(reflectedTemperatureK, 'reflectedTemperatureK');
  return named(['emissivity', 'temperatureK'], h.readingWorkflow(REFERENCE, referenceReadingK, surfaceReadingK, referenceEmissivity, reflectedTemperatureK, s));
}
