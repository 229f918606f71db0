// Shared helpers for the node --test suites (not a test file itself).
import assert from 'node:assert/strict';
import { readFileSync, existsSync } from 'node:fs';
import { resolve } from 'node:path';
import { pathToFileURL } from 'node:url';

/**
 * The module under test: the full build (target/pkg-full/: the npm package's API plus the
 * spectral-table bindings, which the package leaves out for its size ceiling) — or the directory
 * in QB_PKG_DIR (e.g. `QB_PKG_DIR=pkg` runs a suite against the npm package itself).
 * tests/js/package.test.mjs checks that pkg/ is exactly this API minus the spectral area.
 */
export const ENTRY = process.env.QB_PKG_DIR
  ? pathToFileURL(resolve(process.env.QB_PKG_DIR, 'node.js')).href
  : new URL('../../target/pkg-full/node.js', import.meta.url).href;
const qb = await import(ENTRY);

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
