// Shared helpers for the node --test suites (not a test file itself).
import assert from 'node:assert/strict';
import { readFileSync, existsSync } from 'node:fs';
import * as qb from '../../pkg/node.js';

export { qb };

/** Relative difference |a - b| / |b| (absolute when b = 0). */
export function rel(a, b) {
  return b === 0 ? Math.abs(a) : Math.abs((a - b) / b);
}

/** Asserts |got/want - 1| <= tol, with a message naming the source of `want`. */
export function close(got, want, tol, what) {
  assert.ok(Number.isFinite(got), `${what}: got non-finite ${got}`);
  assert.ok(rel(got, want) <= tol, `${what}: got ${got}, want ${want} (rel ${rel(got, want)} > ${tol})`);
}

/**
 * Calls `fn`, expects a QuantabandError with `code` (and `index` when given), then checks the
 * module still works by calling a good function.
 */
export function throwsCode(fn, code, index) {
  let caught;
  try {
    fn();
  } catch (e) {
    caught = e;
  }
  assert.ok(caught !== undefined, `expected ${code}, nothing thrown`);
  assert.ok(caught instanceof qb.QuantabandError, `expected QuantabandError, got ${caught}`);
  assert.ok(caught instanceof Error);
  assert.equal(caught.name, 'QuantabandError');
  assert.equal(caught.code, code, `message: ${caught.message}`);
  assert.equal(typeof caught.message, 'string');
  assert.ok(caught.message.length > 0);
  if (index !== undefined) {
    assert.equal(caught.index, index);
    assert.match(caught.message, new RegExp(`index ${index}\\b`));
  }
  // recovery: the instance is not poisoned
  assert.equal(qb.convertSpectral(10, 'um', 'cm-1'), 1000);
  return caught;
}

/**
 * Loads a reference JSON from tests/data (written by the physics helpers' generator scripts), or
 * from the directory in QB_REFERENCE_DIR when set (to try a freshly generated table).
 */
export function loadReference(name) {
  const dir = process.env.QB_REFERENCE_DIR;
  const url = dir ? new URL(`file://${dir}/${name}`) : new URL(`../data/${name}`, import.meta.url);
  if (!existsSync(url)) return undefined;
  return JSON.parse(readFileSync(url, 'utf8'));
}

/** A JSON input of tests/data/spectral_reference.json (constant or table in metres) as a definition input. */
const spectralInput = (x) =>
  x.constant !== undefined ? x.constant : { wavelengths: x.wavelengths_m, values: x.values, unit: 'm', ...(x.constant_ends ? { ends: 'constant' } : {}) };

/** A scene of tests/data/spectral_reference.json as a SpectralInstrument definition (`window`: keep its window). */
export function spectralDefinition(sc, window = true) {
  const conditions = {
    emissivity: spectralInput(sc.emissivity),
    reflectedTemperatureK: sc.reflected_temperature_k,
    pathTransmittance: spectralInput(sc.path_transmittance),
    pathTemperatureK: sc.path_temperature_k,
  };
  if (window) {
    conditions.window = {
      transmittance: spectralInput(sc.window_transmittance),
      reflectance: spectralInput(sc.window_reflectance),
      temperatureK: sc.window_temperature_k,
      reflectedTemperatureK: sc.window_reflected_temperature_k,
    };
  }
  if (sc.reflectance) conditions.reflectance = spectralInput(sc.reflectance);
  return {
    response: { wavelengths: sc.response.wavelengths_m, values: sc.response.values, unit: 'm', quantity: sc.photon ? 'photon' : 'energy' },
    conditions,
  };
}
