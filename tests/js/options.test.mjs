// Options objects: the one-call reader (qbReadOptions in src/wasm/error.js) and the
// field-by-field reader it falls back to must give the same values and the same errors.
// These are consistency checks of the binding layer (the two paths against each other and
// against the documented messages); the physics is checked against outside references in
// radiometry.test.mjs and thermometry.test.mjs.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { qb, throwsCode } from './helpers.mjs';

function message(fn) {
  try {
    fn();
  } catch (e) {
    return `${e.code}: ${e.message}`;
  }
  return 'nothing thrown';
}

test('options: unit aliases (field-by-field path) equal canonical names (one-call path)', () => {
  const canonical = qb.spectralDensity({ unit: 'um' }, 10, 300);
  for (const alias of ['\u00b5m', '\u03bcm', 'micron']) {
    assert.equal(qb.spectralDensity({ unit: alias }, 10, 300), canonical, alias);
  }
  const wn = qb.bandIntegral({ unit: 'cm-1' }, 700, 1250, 300);
  for (const alias of ['cm^-1', '1/cm', 'cm\u207b\u00b9']) {
    assert.equal(qb.bandIntegral({ unit: alias }, 700, 1250, 300), wn, alias);
  }
});

test('options: every field read the same way by both paths', () => {
  const o = { unit: 'um', quantity: 'photon', geometry: 'exitance', emissivity: 0.8, refractiveIndex: 1.0003, c2: 'its90', variable: 'wavelength' };
  const fast = qb.bandIntegral(o, 3, 5, 700);
  // 'µm' is not a canonical name, so this object takes the field-by-field path
  const slow = qb.bandIntegral({ ...o, unit: '\u00b5m' }, 3, 5, 700);
  assert.equal(fast, slow);
  // each option changes the result (a field silently dropped would not)
  const base = qb.bandIntegral({ unit: 'um' }, 3, 5, 700);
  for (const [k, v] of [['quantity', 'photon'], ['geometry', 'exitance'], ['emissivity', 0.8], ['refractiveIndex', 1.5], ['c2', 'its90']]) {
    assert.notEqual(qb.bandIntegral({ unit: 'um', [k]: v }, 3, 5, 700), base, k);
  }
  // explicit undefined is the same as absent
  assert.equal(qb.bandIntegral({ unit: 'um', emissivity: undefined, c2: undefined }, 3, 5, 700), base);
  // inherited fields are read (as Reflect.get does)
  assert.equal(qb.bandIntegral(Object.create({ unit: 'um', emissivity: 0.8 }), 3, 5, 700), qb.bandIntegral({ unit: 'um', emissivity: 0.8 }, 3, 5, 700));
});

test('options: errors keep their codes and messages', () => {
  throwsCode(() => qb.bandIntegral({ unit: 'um', emisivity: 0.9 }, 8, 14, 300), 'UNSUPPORTED');
  assert.equal(
    message(() => qb.bandIntegral({ unit: 'um', emisivity: 0.9 }, 8, 14, 300)),
    'UNSUPPORTED: SpectrumOptions: unknown field "emisivity" (accepted fields: unit, variable, quantity, geometry, emissivity, refractiveIndex, c2)',
  );
  throwsCode(() => qb.bandIntegral(null, 8, 14, 300), 'UNSUPPORTED');
  throwsCode(() => qb.bandIntegral([], 8, 14, 300), 'UNSUPPORTED');
  throwsCode(() => qb.bandIntegral(() => 0, 8, 14, 300), 'UNSUPPORTED');
  throwsCode(() => qb.bandIntegral('um', 8, 14, 300), 'UNSUPPORTED');
  throwsCode(() => qb.bandIntegral({}, 8, 14, 300), 'UNKNOWN_UNIT');
  throwsCode(() => qb.bandIntegral({ unit: 7 }, 8, 14, 300), 'UNKNOWN_UNIT');
  throwsCode(() => qb.bandIntegral({ unit: 'furlong' }, 8, 14, 300), 'UNKNOWN_UNIT');
  throwsCode(() => qb.bandIntegral({ unit: 'um', emissivity: '0.9' }, 8, 14, 300), 'NON_FINITE');
  assert.equal(
    message(() => qb.bandIntegral({ unit: 'um', emissivity: '0.9' }, 8, 14, 300)),
    'NON_FINITE: SpectrumOptions.emissivity must be a finite number (got a string)',
  );
  throwsCode(() => qb.bandIntegral({ unit: 'um', emissivity: NaN }, 8, 14, 300), 'NON_FINITE');
  throwsCode(() => qb.bandIntegral({ unit: 'um', emissivity: 1.5 }, 8, 14, 300), 'OUT_OF_RANGE');
  throwsCode(() => qb.bandIntegral({ unit: 'um', quantity: 'photons' }, 8, 14, 300), 'UNSUPPORTED');
  assert.equal(
    message(() => qb.bandIntegral({ unit: 'um', quantity: 'photons' }, 8, 14, 300)),
    'UNSUPPORTED: SpectrumOptions.quantity must be one of energy, photon (got "photons")',
  );
  throwsCode(() => qb.bandIntegral({ unit: 'um', c2: 1 }, 8, 14, 300), 'UNSUPPORTED');
  throwsCode(() => qb.bandIntegral({ unit: 'eV' }, 0.1, 0.2, 300), 'UNSUPPORTED'); // variable required
  // the module keeps working, and a good object after bad ones still takes the quick path
  assert.ok(qb.bandIntegral({ unit: 'um' }, 8, 14, 300) > 0);
});

test('options: instrument models by both paths', () => {
  const curve = { kind: 'sakumaHattori', aM: 1.0e-5, bMK: 1.8e-4, c: 1.0e6 };
  const s = qb.modelSignal(curve, 500);
  assert.equal(qb.modelTemperature(curve, s), qb.modelTemperature(Object.create(curve), s));
  const point = { kind: 'spectralPoint', wavelength: 0.65, unit: 'um' };
  const sp = qb.modelSignal(point, 1200);
  // 'micron' is outside the quick path's unit choices: field-by-field path
  assert.equal(qb.modelSignal({ ...point, unit: 'micron' }, 1200), sp);
  assert.equal(qb.modelTemperature(point, sp), qb.modelTemperature({ ...point, unit: 'micron' }, sp));
  throwsCode(() => qb.modelTemperature({ ...curve, extra: 1 }, s), 'UNSUPPORTED');
  assert.equal(
    message(() => qb.modelTemperature({ ...curve, extra: 1 }, s)),
    'UNSUPPORTED: SakumaHattoriModel: unknown field "extra" (accepted fields: kind, aM, bMK, c, c2)',
  );
  throwsCode(() => qb.modelTemperature({ ...curve, aM: '1e-5' }, s), 'NON_FINITE');
  throwsCode(() => qb.modelTemperature({ aM: 1e-5, bMK: 1.8e-4, c: 1e6 }, s), 'UNSUPPORTED');
  throwsCode(() => qb.modelTemperature({ kind: 'sakumaHattori', aM: 1e-5, c: 1e6 }, s), 'NON_FINITE');
  throwsCode(() => qb.modelTemperature({ ...point, unit: 'cm-1' }, sp), 'UNSUPPORTED');
  throwsCode(() => qb.modelTemperature({ ...point, c2: 'its-90' }, sp), 'UNSUPPORTED');
});

test('options: a throwing getter surfaces its own error and the module keeps working', () => {
  const boom = new Error('getter failed');
  const o = { unit: 'um' };
  Object.defineProperty(o, 'emissivity', { enumerable: true, get() { throw boom; } });
  assert.throws(() => qb.bandIntegral(o, 8, 14, 300), (e) => e === boom);
  const p = new Proxy({ unit: 'um' }, { get(t, k) { if (k === 'c2') throw boom; return t[k]; } });
  assert.throws(() => qb.spectralDensity(p, 10, 300), (e) => e === boom);
  assert.ok(qb.bandIntegral({ unit: 'um' }, 8, 14, 300) > 0);
  assert.ok(qb.spectralDensity({ unit: 'um' }, 10, 300) > 0);
});
