// The error contract, one reachable trigger per stable code, each followed by a good call (the
// instance is not poisoned). NOT_CONVERGED is the one code without a trigger: the core's
// iterations report it only as a guard that its tests never observed (see its rustdoc).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { qb, throwsCode } from './helpers.mjs';

const um = { unit: 'um' };
const curve = { kind: 'sakumaHattori', aM: 1e-5, bMK: 1.8e-4, c: 1e6 };

const TRIGGERS = {
  NON_FINITE: () => qb.spectralDensity(um, NaN, 300),
  NON_POSITIVE_TEMPERATURE: () => qb.spectralDensity(um, 10, -1),
  NON_POSITIVE_SPECTRAL: () => qb.spectralDensity(um, 0, 300),
  NON_POSITIVE: () => qb.brightnessTemperature(um, 10, -5),
  OUT_OF_RANGE: () => qb.spectralDensity({ unit: 'um', emissivity: 2 }, 10, 300),
  INVALID_BAND: () => qb.bandIntegral(um, 14, 8, 300),
  // a curve whose B is so large that T = (c2/ln(1 + C/S) − B)/A is negative
  NO_SOLUTION: () => qb.modelTemperature({ ...curve, bMK: 1 }, 1),
  NO_PHYSICAL_SOLUTION: () => qb.objectTemperature(curve, 1, { emissivity: 0.5, reflectedTemperatureK: 400 }),
  DIVERGENT_OCCUPATION: () => qb.boseEinstein(-0.1),
  LENGTH_MISMATCH: () => qb.sakumaHattoriFit(new Float64Array([300, 400, 500]), new Float64Array([1, 2])),
  TOO_FEW_POINTS: () => qb.modelSignal({ kind: 'response', wavelengths: [8], values: [1], unit: 'um' }, 300),
  NOT_INCREASING: () => qb.modelSignal({ kind: 'response', wavelengths: [9, 8], values: [1, 1], unit: 'um' }, 300),
  DEGENERATE_FIT: () => qb.sakumaHattoriFit(new Float64Array([300, 300, 500]), new Float64Array([1, 2, 3])),
  UNKNOWN_UNIT: () => qb.convertTemperature(300, 'kelvin', 'K'),
  UNSUPPORTED: () => qb.fermiDiracIntegral(2, 0),
};

test('every stable code except NOT_CONVERGED is reachable from JS', () => {
  const reached = new Set();
  for (const [code, fn] of Object.entries(TRIGGERS)) {
    const e = throwsCode(fn, code);
    reached.add(e.code);
  }
  const missing = qb.ERROR_CODES.filter((c) => !reached.has(c));
  assert.deepEqual(missing, ['NOT_CONVERGED']);
});

test('ERROR_CODES is the README table, in order', async () => {
  const { readFileSync } = await import('node:fs');
  const readme = readFileSync(new URL('../../README.md', import.meta.url), 'utf8');
  const table = [...readme.matchAll(/^\| `([A-Z_]+)` \|/gm)].map((m) => m[1]);
  assert.deepEqual([...qb.ERROR_CODES], table);
});

test('error objects: class, name, code, message with the bound, index only for bulk calls', () => {
  const e = throwsCode(() => qb.spectralDensity(um, 10, -3), 'NON_POSITIVE_TEMPERATURE');
  assert.match(e.message, /must be > 0 K \(got -3 K\)/);
  assert.equal('index' in e, false);
  const b = throwsCode(() => qb.spectralDensityArray(um, new Float64Array([1, 2, Infinity]), 300), 'NON_FINITE', 2);
  assert.match(b.message, /got Infinity\) \(at index 2\)/);
  // the class is constructible and catchable like any Error subclass
  const mine = new qb.QuantabandError('UNSUPPORTED', 'made here');
  assert.ok(mine instanceof Error && mine.name === 'QuantabandError' && mine.code === 'UNSUPPORTED');
  // a thrown error survives a round trip through structured cloning as a plain Error
  const cloned = structuredClone(b);
  assert.equal(cloned.message, b.message);
});

test('a thousand errors in a row leave the module healthy', () => {
  for (let i = 0; i < 1000; i++) {
    assert.throws(() => qb.spectralDensityArray(um, new Float64Array([1, -1]), 300), qb.QuantabandError);
  }
  const big = qb.spectralDensityArray(um, new Float64Array(200_000).fill(10), 300);
  assert.equal(big[199_999], qb.spectralDensity(um, 10, 300));
});

test('results too large for WebAssembly memory are an error, not an abort', () => {
  const xs = new Float64Array(200_000).fill(10);
  const ts = new Float64Array(200_000).fill(300); // a 4e10-element grid (320 GB)
  throwsCode(() => qb.spectralDensityGrid(um, xs, ts), 'OUT_OF_RANGE');
  // a sparse JS array claiming 2^31 elements
  throwsCode(() => qb.modelSignal({ kind: 'response', wavelengths: new Array(2 ** 31), values: [1, 1], unit: 'um' }, 300), 'OUT_OF_RANGE');
});

test('arguments of the wrong JavaScript type throw, they never trap the module', () => {
  throwsCode(() => qb.convertSpectral(1, { unit: 'nm' }, 'um'), 'UNKNOWN_UNIT');
  throwsCode(() => qb.convertTemperature(300, 'K', 42), 'UNKNOWN_UNIT');
  throwsCode(() => qb.its90Temperature(10, 650, ['nm'], 'gold'), 'UNKNOWN_UNIT');
  throwsCode(() => qb.its90Temperature(10, 650, 'nm', {}), 'UNSUPPORTED');
  throwsCode(() => qb.sakumaHattoriFit(new Float64Array([300, 400, 500]), new Float64Array([1, 2, 3]), 7), 'UNSUPPORTED');
  throwsCode(() => qb.spectralDensity('um', 10, 300), 'UNSUPPORTED');
  throwsCode(() => qb.objectTemperature({ kind: 'sakumaHattori', aM: 1e-5, bMK: 1.8e-4, c: 1e6 }, 1e4, 'blackbody'), 'UNSUPPORTED');
});

test('binding messages name the index of a bad element of a plain array (0, 7, 10, 123)', () => {
  // The binding layer writes these messages without Rust's formatter (src/wasm/error.rs,
  // `decimal`); check single- and multi-digit indices, and 0.
  for (const bad of [0, 7, 10, 123]) {
    const wavelengths = Array.from({ length: 130 }, (_, i) => 8 + i * 0.05);
    wavelengths[bad] = 'x';
    const model = { kind: 'response', wavelengths, values: wavelengths.map(() => 1), unit: 'um' };
    const e = throwsCode(() => qb.modelSignal(model, 300), 'NON_FINITE');
    assert.match(e.message, new RegExp(`wavelengths\\[${bad}\\] must be a finite number \\(at index ${bad}\\)$`));
  }
});
