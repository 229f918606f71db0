// The error contract, one reachable trigger per stable code, each followed by a good call (the
// instance is not poisoned). NOT_CONVERGED is reached through the multi-wavelength fit (channels
// far too close together for a quadratic emissivity: the least-squares iteration stalls);
// NOT_INITIALIZED is triggered in a fresh module (tests/js/init.test.mjs). INVALID_TABLE_ENTRY,
// OUTSIDE_TABLE and INVALID_LINE come from the spectral tables (SpectralInstrument).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { qb, throwsCode } from './helpers.mjs';

const um = new qb.Spectrum({ unit: 'um' });
const curveModel = { kind: 'sakumaHattori', aM: 1e-5, bMK: 1.8e-4, c: 1e6 };
const curve = new qb.Instrument({ model: curveModel });
const greyCurve = curve.withConditions({ emissivity: 0.5, reflectedTemperatureK: 400 });
const freed = new qb.Spectrum({ unit: 'nm' });
freed.free();
const flat = { wavelengths: [8, 14], values: [1, 1], unit: 'um' };
const detached = new Float64Array(4);
structuredClone(detached.buffer, { transfer: [detached.buffer] });

const TRIGGERS = {
  NON_FINITE: () => um.point(NaN, 300),
  NON_POSITIVE_TEMPERATURE: () => um.point(10, -1),
  NON_POSITIVE_SPECTRAL: () => um.point(0, 300),
  NON_POSITIVE: () => um.brightnessTemperature(10, -5),
  OUT_OF_RANGE: () => new qb.Spectrum({ unit: 'um', emissivity: 2 }),
  INVALID_BAND: () => um.band(14, 8, 300),
  // a curve whose B is so large that T = (c2/ln(1 + C/S) − B)/A is negative
  NO_SOLUTION: () => new qb.Instrument({ model: { ...curveModel, bMK: 1 } }).temperature(1),
  NO_PHYSICAL_SOLUTION: () => greyCurve.objectTemperature(1),
  DIVERGENT_OCCUPATION: () => qb.boseEinstein(-0.1),
  LENGTH_MISMATCH: () => qb.CalibrationCurve.fit(new Float64Array([300, 400, 500]), new Float64Array([1, 2])),
  TOO_FEW_POINTS: () => new qb.Instrument({ model: { kind: 'response', wavelengths: [8], values: [1], unit: 'um' } }),
  NOT_INCREASING: () => new qb.Instrument({ model: { kind: 'response', wavelengths: [9, 8], values: [1, 1], unit: 'um' } }),
  DEGENERATE_FIT: () => qb.CalibrationCurve.fit(new Float64Array([300, 300, 500]), new Float64Array([1, 2, 3])),
  NOT_CONVERGED: () =>
    qb.fitMultiwavelength(
      { wavelengths: [1000, 1000.01, 1000.02, 1000.03], unit: 'nm', radiances: [1, 1, 1, 1], uncertainties: [1e-3, 1e-3, 1e-3, 1e-3] },
      { model: { kind: 'polynomial', order: 2 } },
    ),
  UNKNOWN_UNIT: () => qb.convertTemperature(300, 'kelvin', 'K'),
  UNSUPPORTED: () => qb.fermiDiracIntegral(2, 0),
  TOO_LARGE: () => qb.CalibrationCurve.fit(new Float64Array(10_001), new Float64Array(10_001)),
  // three quantities cannot be pairwise −0.9 correlated (not positive semi-definite)
  INVALID_CORRELATION: () =>
    qb.propagateUncertainty([1, 1, 1], [1, 1, 1], { correlation: [[1, -0.9, -0.9], [-0.9, 1, -0.9], [-0.9, -0.9, 1]] }),
  WRONG_TYPE: () => um.point('10', 300),
  DETACHED_BUFFER: () => um.points(detached, 300),
  DISPOSED: () => freed.point(500, 300),
  // an emissivity table with a value above 1, one that does not cover the band, a text line
  // that is not two numbers
  INVALID_TABLE_ENTRY: () =>
    new qb.SpectralInstrument({ response: flat, conditions: { emissivity: { wavelengths: [8, 14], values: [0.9, 1.2], unit: 'um' }, reflectedTemperatureK: 300 } }),
  OUTSIDE_TABLE: () =>
    new qb.SpectralInstrument({ response: flat, conditions: { emissivity: { wavelengths: [9, 14], values: [0.9, 0.9], unit: 'um' }, reflectedTemperatureK: 300 } }),
  INVALID_LINE: () => qb.SpectralInstrument.tableFromText('8, 0.9\n9; 0.8; 0.7\n', 'um', 'emissivity'),
};

test('every stable code except NOT_INITIALIZED is reachable here', () => {
  const reached = new Set();
  for (const [code, fn] of Object.entries(TRIGGERS)) {
    const e = throwsCode(fn, code);
    reached.add(e.code);
  }
  const missing = qb.ERROR_CODES.filter((c) => !reached.has(c));
  assert.deepEqual(missing, ['NOT_INITIALIZED']);
});

test('ERROR_CODES is the Rust core list followed by the boundary codes, and the README table', async () => {
  const { readFileSync } = await import('node:fs');
  // The core part comes from the module itself (Error::ALL_CODES, exported for the tests).
  assert.deepEqual(qb.ERROR_CODES.slice(0, qb.__testing.coreCodes().length), qb.__testing.coreCodes());
  const readme = readFileSync(new URL('../../README.md', import.meta.url), 'utf8');
  const table = [...readme.matchAll(/^\| `([A-Z_]+)` \|/gm)].map((m) => m[1]);
  assert.deepEqual([...qb.ERROR_CODES], table);
  // and the TypeScript union of the package is generated from the same list
  const dts = readFileSync(new URL('../../pkg/quantaband.d.ts', import.meta.url), 'utf8');
  const union = dts.match(/export type ErrorCode =([^;]*);/)[1];
  assert.deepEqual([...union.matchAll(/"([A-Z_]+)"/g)].map((m) => m[1]), [...qb.ERROR_CODES]);
});

test('error objects: class, name, code, message with the bound, index only for bulk calls', () => {
  const e = throwsCode(() => um.point(10, -3), 'NON_POSITIVE_TEMPERATURE');
  assert.equal(e.message, 'temperatureK must be > 0 K (got -3 K)');
  assert.equal('index' in e, false);
  const b = throwsCode(() => um.points(new Float64Array([1, 2, Infinity]), 300), 'NON_FINITE', 2);
  assert.equal(b.message, 'xs must be a finite number (got Infinity) (at index 2)');
  // the class is constructible and catchable like any Error subclass
  const mine = new qb.QuantabandError('UNSUPPORTED', 'made here');
  assert.ok(mine instanceof Error && mine.name === 'QuantabandError' && mine.code === 'UNSUPPORTED');
  // a thrown error survives a round trip through structured cloning as a plain Error
  const cloned = structuredClone(b);
  assert.equal(cloned.message, b.message);
});

test('messages use the JavaScript names and say what was given', () => {
  const msg = (fn, code) => throwsCode(fn, code).message;
  assert.equal(msg(() => qb.fermiDiracEnergy(1, 0, -1), 'NON_POSITIVE_TEMPERATURE'), 'temperatureK must be > 0 K (got -1 K)');
  assert.equal(msg(() => qb.boseEinsteinEnergy(1, NaN, 300), 'NON_FINITE'), 'chemicalPotentialJ must be a finite number (got NaN)');
  assert.equal(msg(() => qb.thermalPhotonNumber(0, 300), 'NON_POSITIVE_SPECTRAL'), 'frequencyHz must be > 0 (got 0)');
  assert.equal(msg(() => qb.fractionBelow(NaN), 'NON_FINITE'), 'lambdaTMK must be a finite number (got NaN)');
  assert.equal(msg(() => um.point(10, '300'), 'WRONG_TYPE'), 'temperatureK must be a number (got a string)');
  assert.equal(msg(() => um.point({}, 300), 'WRONG_TYPE'), 'x must be a number (got an object)');
  assert.equal(msg(() => um.point(10n, 300), 'WRONG_TYPE'), 'x must be a number (got a bigint)');
  assert.equal(msg(() => um.point(Symbol('x'), 300), 'WRONG_TYPE'), 'x must be a number (got a symbol)');
  assert.equal(msg(() => um.point(null, 300), 'WRONG_TYPE'), 'x must be a number (got null)');
  assert.equal(msg(() => um.point(undefined, 300), 'WRONG_TYPE'), 'x must be a number (got undefined)');
  assert.equal(msg(() => um.point([10], 300), 'WRONG_TYPE'), 'x must be a number (got an array)');
  assert.equal(msg(() => um.point(true, 300), 'WRONG_TYPE'), 'x must be a number (got the boolean true)');
  assert.equal(msg(() => um.points(undefined, 300), 'WRONG_TYPE'), 'xs must be an array of numbers (got undefined)');
  assert.equal(msg(() => um.points('1,2', 300), 'WRONG_TYPE'), 'xs must be an array of numbers (got a string)');
  assert.equal(msg(() => um.points(new BigInt64Array(2), 300), 'WRONG_TYPE'), 'xs must be an array of numbers (got a BigInt64Array)');
  assert.equal(
    msg(() => new qb.Instrument({ model: curveModel, conditions: { window: { transmittance: '0.9', temperatureK: 300 } } }), 'WRONG_TYPE'),
    'definition.conditions.window.transmittance must be a number (got a string)',
  );
  assert.equal(
    msg(() => new qb.Instrument({ model: curveModel, conditions: { window: { transmittance: 1.2, temperatureK: 300 } } }), 'OUT_OF_RANGE'),
    'definition.conditions.window.transmittance must lie in (0, 1] (got 1.2)',
  );
  assert.equal(
    msg(() => curve.uncertaintyBudget(1e4, { pathTemperatureK: -1 }), 'OUT_OF_RANGE'),
    'uncertainties.pathTemperatureK must lie in [0, inf) (got -1)',
  );
  assert.match(msg(() => new qb.Spectrum({ unit: 'um', emisivity: 1 }), 'UNSUPPORTED'), /^settings: unknown field "emisivity" \(accepted fields: "unit", .*"emissivity"/);
  assert.equal(msg(() => new qb.CalibrationCurve({ aM: -1, bMK: 0, c: 1 }), 'NON_POSITIVE'), 'coefficients.aM must be > 0 (got -1)');
  assert.equal(msg(() => qb.CalibrationCurve.fit([300, -1, 500], [1, 2, 3]), 'NON_POSITIVE_TEMPERATURE'), 'temperaturesK must be > 0 K (got -1 K)');
});

test('a thousand errors in a row leave the module healthy', () => {
  for (let i = 0; i < 1000; i++) {
    assert.throws(() => um.points(new Float64Array([1, -1]), 300), qb.QuantabandError);
  }
  const big = um.points(new Float64Array(200_000).fill(10), 300);
  assert.equal(big[199_999], um.point(10, 300));
});

test('arrays over the documented limit are refused before anything is allocated', () => {
  assert.equal(qb.MAX_ARRAY_LENGTH, 2 ** 25);
  // an array-like claiming 2^31 elements (nothing is read)
  const e = throwsCode(() => um.points({ length: 2 ** 31 }, 300), 'TOO_LARGE');
  assert.equal(e.message, `xs has ${2 ** 31} elements; at most ${2 ** 25} are accepted`);
  throwsCode(() => new qb.Instrument({ model: { kind: 'response', wavelengths: new Array(2 ** 31), values: [1, 1], unit: 'um' } }), 'TOO_LARGE');
  throwsCode(() => um.points({ length: -1 }, 300), 'WRONG_TYPE');
  throwsCode(() => um.points({ length: 1.5 }, 300), 'WRONG_TYPE');
  throwsCode(() => um.points({ length: '3' }, 300), 'WRONG_TYPE');
});

test('arguments of the wrong JavaScript type throw, they never trap the module', () => {
  throwsCode(() => qb.convertSpectral(1, { unit: 'nm' }, 'um'), 'WRONG_TYPE');
  throwsCode(() => qb.convertTemperature(300, 'K', 42), 'WRONG_TYPE');
  throwsCode(() => qb.convertTemperature(300, 'K', 'x'.repeat(10_000)), 'UNKNOWN_UNIT');
  throwsCode(() => qb.its90Temperature(10, 650, ['nm'], 'gold'), 'WRONG_TYPE');
  throwsCode(() => qb.its90Temperature(10, 650, 'nm', {}), 'WRONG_TYPE');
  throwsCode(() => qb.CalibrationCurve.fit(new Float64Array([300, 400, 500]), new Float64Array([1, 2, 3]), 7), 'WRONG_TYPE');
  throwsCode(() => new qb.Spectrum('um'), 'WRONG_TYPE');
  throwsCode(() => curve.withConditions('blackbody'), 'WRONG_TYPE');
  throwsCode(() => new qb.Spectrum({ unit: 'um', emissivity: () => 1 }), 'WRONG_TYPE');
  throwsCode(() => new qb.Spectrum(new Map([['unit', 'um']])), 'WRONG_TYPE');
  throwsCode(() => curve.ratioTemperature({}, 1), 'WRONG_TYPE');
  throwsCode(() => curve.ratioTemperature(freed, 1), 'WRONG_TYPE');
});

test('messages name the index of a bad element of a plain array (0, 7, 10, 123)', () => {
  for (const bad of [0, 7, 10, 123]) {
    const wavelengths = Array.from({ length: 130 }, (_, i) => 8 + i * 0.05);
    wavelengths[bad] = 'x';
    const model = { kind: 'response', wavelengths, values: wavelengths.map(() => 1), unit: 'um' };
    const e = throwsCode(() => new qb.Instrument({ model }), 'WRONG_TYPE');
    assert.equal(e.message, `definition.model.wavelengths[${bad}] must be a number (got a string)`);
    const xs = Array.from({ length: 130 }, () => 10);
    xs[bad] = 'x';
    const f = throwsCode(() => um.points(xs, 300), 'WRONG_TYPE');
    assert.equal(f.message, `xs[${bad}] must be a number (got a string)`);
    assert.equal(f.index, bad);
  }
});
