// The configuration reader (src/wasm/config.rs reads the facade's plain-data copy straight from
// the JavaScript value): the order in which keys are checked (by name), the description of the
// value of a wrong type for every kind of value, paths through arrays and nested objects, and an
// array refused where an object is expected (serde's derived structs would read it field by field).
// Binding-layer checks; the messages are the ones the package gave before the reader was
// rewritten (compared case by case with the build of main 61010c1).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { qb, throwsCode } from './helpers.mjs';

const msg = (fn, code) => throwsCode(fn, code).message;
const point = { kind: 'spectralPoint', wavelength: 10, unit: 'um' };

test('keys are checked in the order of their names', () => {
  const accepted = '(accepted fields: "unit", "variable", "quantity", "geometry", "emissivity", "refractiveIndex", "c2", "densityUnit")';
  assert.equal(msg(() => new qb.Spectrum({ zeta: 1, alpha: 2, unit: 'um' }), 'UNSUPPORTED'), `settings: unknown field "alpha" ${accepted}`);
  assert.equal(msg(() => new qb.Spectrum({ unit: 'bad', aaa: 1 }), 'UNSUPPORTED'), `settings: unknown field "aaa" ${accepted}`);
  assert.match(msg(() => new qb.Spectrum({ unit: 'bad', zzz: 1 }), 'UNKNOWN_UNIT'), /^settings\.unit: unknown unit "bad"/);
});

test('a value of the wrong type is described by its kind', () => {
  const s = (v) => msg(() => new qb.Spectrum({ unit: 'um', emissivity: v }), 'WRONG_TYPE');
  assert.equal(s(true), 'settings.emissivity must be a number (got the boolean true)');
  assert.equal(s({}), 'settings.emissivity must be a number (got an object)');
  assert.equal(s(['x']), 'settings.emissivity must be a number (got an array)');
  assert.equal(s(null), 'settings.emissivity must be a number (got null)');
  const unit = 'settings.unit must be a spectral unit name (a string such as "um")';
  assert.equal(msg(() => new qb.Spectrum({ unit: [1] }), 'WRONG_TYPE'), `${unit} (got an array)`);
  assert.equal(msg(() => new qb.Spectrum({ unit: null }), 'WRONG_TYPE'), `${unit} (got null)`);
  assert.equal(msg(() => new qb.Spectrum({ unit: 'um', quantity: 1 }), 'WRONG_TYPE'), 'settings.quantity must be a string (got a number)');
  assert.equal(msg(() => new qb.Instrument({ model: 'x' }), 'WRONG_TYPE'), 'definition.model must be an object (got a string)');
  assert.equal(msg(() => new qb.Instrument({ model: { kind: 3 } }), 'WRONG_TYPE'), 'definition.model.kind must be a model kind (got a number)');
});

test('paths run through arrays and nested objects', () => {
  const table = (w) => new qb.Instrument({ model: { kind: 'response', wavelengths: w, values: [1, 1, 1], unit: 'um' } });
  assert.equal(msg(() => table([8, 'x', 14]), 'WRONG_TYPE'), 'definition.model.wavelengths[1] must be a number (got a string)');
  assert.equal(msg(() => table([8, {}, 14]), 'WRONG_TYPE'), 'definition.model.wavelengths[1] must be a number (got an object)');
  const cond = (c) => new qb.Instrument({ model: point, conditions: c });
  assert.equal(
    msg(() => cond({ window: { transmittance: 'a', temperatureK: 300 } }), 'WRONG_TYPE'),
    'definition.conditions.window.transmittance must be a number (got a string)',
  );
  assert.equal(msg(() => cond({ window: { transmittance: 0.9 } }), 'WRONG_TYPE'), 'definition.conditions.window.temperatureK is required (got undefined)');
  assert.equal(msg(() => cond({ window: 'w' }), 'WRONG_TYPE'), 'definition.conditions.window must be an object (got a string)');
});

test('an array where an object is expected is refused, not read field by field', () => {
  // issue 12: no silent coercion — serde's derived structs would read [0.9] as { emissivity: 0.9 }
  assert.equal(
    msg(() => new qb.Instrument({ model: point, conditions: [0.9] }), 'WRONG_TYPE'),
    'definition.conditions must be an object (got an array)',
  );
  assert.equal(msg(() => new qb.CalibrationCurve([1e-5, 1e-8, 1]), 'WRONG_TYPE'), 'coefficients must be an object (got an array)');
  const c = new qb.CalibrationCurve({ aM: 1e-5, bMK: 1e-8, c: 1 });
  assert.deepEqual(c.coefficients, { aM: 1e-5, bMK: 1e-8, c: 1, c2: 'codata2018' });
  c.free();
});
