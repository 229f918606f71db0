// Configuration objects (constructor arguments) are read through the core's serde types
// (src/definition.rs and the serde derives; src/wasm/config.rs): unit aliases, defaults, every
// field used, arrays of every accepted kind, strictness (unknown keys with the accepted keys,
// wrong types with the field path), and objects that are not plain data. These are checks of the
// binding layer; the physics is checked against outside references in radiometry.test.mjs and
// thermometry.test.mjs.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { qb, throwsCode } from './helpers.mjs';

const band = (settings) => {
  const s = new qb.Spectrum(settings);
  try {
    return s.band(3, 5, 700);
  } finally {
    s.free();
  }
};

test('unit aliases give the same spectrum as the canonical names', () => {
  const canonical = band({ unit: 'um' });
  for (const alias of ['\u00b5m', '\u03bcm', 'micron']) assert.equal(band({ unit: alias }), canonical, alias);
  const wn = new qb.Spectrum({ unit: 'cm-1' }).band(700, 1250, 300);
  for (const alias of ['cm^-1', '1/cm', 'cm\u207b\u00b9']) {
    assert.equal(new qb.Spectrum({ unit: alias }).band(700, 1250, 300), wn, alias);
  }
});

test('every field is read (each changes the result) and defaults are documented values', () => {
  const base = band({ unit: 'um' });
  for (const [k, v] of [['quantity', 'photon'], ['geometry', 'exitance'], ['emissivity', 0.8], ['refractiveIndex', 1.5], ['c2', 'its90']]) {
    assert.notEqual(band({ unit: 'um', [k]: v }), base, k);
  }
  assert.equal(band({ unit: 'um', quantity: 'energy', geometry: 'radiance', emissivity: 1, refractiveIndex: 1, c2: 'codata2018', variable: 'wavelength' }), base);
  // explicit undefined is the same as absent; null too for a field without a default value
  // (serde's reading of a missing Option), but not for a number with a default
  assert.equal(band({ unit: 'um', emissivity: undefined, c2: undefined }), base);
  assert.equal(band({ unit: 'um', variable: null, densityUnit: null }), base);
  throwsCode(() => band({ unit: 'um', emissivity: null }), 'WRONG_TYPE');
  // a null-prototype object is plain data
  assert.equal(band(Object.assign(Object.create(null), { unit: 'um' })), base);
});

test('tables accept plain arrays, readonly arrays and typed arrays alike', () => {
  const model = (wavelengths, values) => new qb.Instrument({ model: { kind: 'response', wavelengths, values, unit: 'um' } });
  const want = model([8, 11, 14], [1, 0.5, 1]).signal(300);
  assert.equal(model(new Float64Array([8, 11, 14]), new Float32Array([1, 0.5, 1])).signal(300), want);
  assert.equal(model(Object.freeze([8, 11, 14]), new Uint8Array([2, 1, 2])).signal(300), 2 * want);
  assert.equal(model(new Int16Array([8, 11, 14]), [1, 0.5, 1]).signal(300), want);
});

test('errors name the key, the accepted keys and the field path', () => {
  const msg = (fn, code) => throwsCode(fn, code).message;
  assert.equal(
    msg(() => new qb.Spectrum({ unit: 'um', emisivity: 0.9 }), 'UNSUPPORTED'),
    'settings: unknown field "emisivity" (accepted fields: "unit", "variable", "quantity", "geometry", "emissivity", "refractiveIndex", "c2", "densityUnit")',
  );
  assert.equal(msg(() => new qb.Spectrum({ unit: 'um', emissivity: '0.9' }), 'WRONG_TYPE'), 'settings.emissivity must be a number (got a string)');
  assert.equal(msg(() => new qb.Spectrum({ unit: 'um', quantity: 'photons' }), 'UNSUPPORTED'), 'settings.quantity must be one of "energy", "photon" (got "photons")');
  assert.equal(msg(() => new qb.Spectrum({}), 'WRONG_TYPE'), 'settings.unit is required (got undefined)');
  assert.match(msg(() => new qb.Spectrum({ unit: 'furlong' }), 'UNKNOWN_UNIT'), /^settings\.unit: unknown unit "furlong"; expected a spectral unit: m, mm, um/);
  assert.equal(msg(() => new qb.Spectrum({ unit: 7 }), 'WRONG_TYPE'), 'settings.unit must be a spectral unit name (a string such as "um") (got a number)');
  throwsCode(() => new qb.Spectrum({ unit: 'um', emissivity: NaN }), 'NON_FINITE');
  throwsCode(() => new qb.Spectrum({ unit: 'um', c2: 1 }), 'WRONG_TYPE');
  throwsCode(() => new qb.Spectrum({ unit: 'eV' }), 'UNSUPPORTED'); // variable required
  const curve = { kind: 'sakumaHattori', aM: 1.0e-5, bMK: 1.8e-4, c: 1.0e6 };
  assert.equal(
    msg(() => new qb.Instrument({ model: { ...curve, extra: 1 } }), 'UNSUPPORTED'),
    'definition.model: unknown field "extra" (accepted fields: "kind", "aM", "bMK", "c", "c2")',
  );
  assert.equal(
    msg(() => new qb.Instrument({ model: { ...curve, wavelength: 1 } }), 'UNSUPPORTED'),
    'definition.model: unknown field "wavelength" (accepted fields: "kind", "aM", "bMK", "c", "c2")',
  );
  assert.equal(msg(() => new qb.Instrument({ model: { ...curve, aM: '1e-5' } }), 'WRONG_TYPE'), 'definition.model.aM must be a number (got a string)');
  assert.equal(msg(() => new qb.Instrument({ model: { aM: 1e-5, bMK: 1.8e-4, c: 1e6 } }), 'WRONG_TYPE'), 'definition.model.kind is required (got undefined)');
  assert.equal(
    msg(() => new qb.Instrument({ model: { kind: 'lens' } }), 'UNSUPPORTED'),
    'definition.model.kind must be one of "spectralPoint", "response", "sakumaHattori" (got "lens")',
  );
  assert.equal(msg(() => new qb.Instrument({ model: { kind: 'sakumaHattori', aM: 1e-5, c: 1e6 } }), 'WRONG_TYPE'), 'definition.model.bMK is required (got undefined)');
  assert.equal(
    msg(() => new qb.Instrument({ model: curve, conditions: { emissivity: 0.9, reflectedTemperatureK: 300, window: { transmittance: 0.9 } } }), 'WRONG_TYPE'),
    'definition.conditions.window.temperatureK is required (got undefined)',
  );
  assert.equal(
    msg(() => new qb.Instrument({ model: curve, conditions: { emisivity: 0.9 } }), 'UNSUPPORTED'),
    'definition.conditions: unknown field "emisivity" (accepted fields: "emissivity", "reflectedTemperatureK", "pathTransmittance", "pathTemperatureK", "window")',
  );
  throwsCode(() => new qb.Instrument({ model: { kind: 'spectralPoint', wavelength: 0.65, unit: 'cm-1' } }), 'UNSUPPORTED');
  throwsCode(() => new qb.Instrument({ model: { kind: 'spectralPoint', wavelength: 0.65, unit: 'um', c2: 'its-90' } }), 'UNSUPPORTED');
  throwsCode(() => new qb.Instrument({ model: curve, extra: true }), 'UNSUPPORTED');
});

test('objects that are not plain data are refused with WRONG_TYPE', () => {
  throwsCode(() => new qb.Spectrum(Object.create({ unit: 'um' })), 'WRONG_TYPE'); // inherited fields are not read
  throwsCode(() => new qb.Spectrum(new Date()), 'WRONG_TYPE');
  throwsCode(() => new qb.Spectrum([]), 'WRONG_TYPE');
  throwsCode(() => new qb.Spectrum(() => 0), 'WRONG_TYPE');
  throwsCode(() => new qb.Spectrum({ unit: 'um', emissivity: 1n }), 'WRONG_TYPE');
  throwsCode(() => new qb.Spectrum({ unit: Symbol('um') }), 'WRONG_TYPE');
  const deep = {};
  let o = deep;
  for (let i = 0; i < 20; i++) o = o.window = {};
  throwsCode(() => new qb.Instrument({ model: { kind: 'spectralPoint', wavelength: 1, unit: 'um' }, conditions: deep }), 'WRONG_TYPE');
  const cyclic = { unit: 'um' };
  cyclic.self = cyclic;
  throwsCode(() => new qb.Spectrum(cyclic), 'WRONG_TYPE');
});

test('what the caller gets back is what was read: canonical names, defaults filled in', () => {
  const s = new qb.Spectrum({ unit: '\u00b5m', emissivity: 0.9 });
  assert.deepEqual({ ...s.settings }, {
    unit: 'um',
    variable: 'wavelength',
    quantity: 'energy',
    geometry: 'radiance',
    emissivity: 0.9,
    refractiveIndex: 1,
    c2: 'codata2018',
    densityUnit: 'um',
  });
  assert.ok(Object.isFrozen(s.settings));
  const i = new qb.Instrument({ model: { kind: 'response', wavelengths: new Float32Array([8, 14]), values: [1, 1], unit: 'micron' } });
  assert.deepEqual(JSON.parse(JSON.stringify(i.definition)), {
    model: { kind: 'response', wavelengths: [8, 14], values: [1, 1], unit: 'um', c2: 'codata2018' },
    conditions: {},
  });
  // the definition read back builds the same instrument (store and load as JSON)
  const again = new qb.Instrument(JSON.parse(JSON.stringify(i.definition)));
  assert.equal(again.signal(300), i.signal(300));
  assert.deepEqual(i.conditions(), { emissivity: 1, reflectedTemperatureK: 293.15, pathTransmittance: 1, pathTemperatureK: 293.15, window: undefined });
});
