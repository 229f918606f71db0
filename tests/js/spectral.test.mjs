// Spectral (non-grey) thermometry from JavaScript: SpectralInstrument, text tables, the
// workflows from an indicated temperature (both instrument classes) and the per-pixel frame
// corrections of CalibrationCurve.convertFrame.
//
// Reference values: tests/data/spectral_reference.json, written by tests/data/gen_spectral.py
// (mpmath 1.3.0 at 30 digits: quadrature of the same piecewise-linear interpolants, root
// finding for the inverse and the workflows, finite differences for the sensitivities) — the
// data the Rust tests tests/thermometry_spectral.rs and tests/thermometry_indicated.rs read.
// Tolerances are those the core documents and those Rust tests use.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { qb, close, throwsCode, loadReference, spectralDefinition as definition } from './helpers.mjs';

const REF = loadReference('spectral_reference.json');

/** A JSON grey setting as MeasurementConditions. */
const setting = (s) => ({
  emissivity: s.emissivity,
  reflectedTemperatureK: s.reflected_temperature_k,
  pathTransmittance: s.path_transmittance,
  pathTemperatureK: s.path_temperature_k,
  ...(s.window
    ? { window: { transmittance: s.window.transmittance, reflectance: s.window.reflectance, temperatureK: s.window.temperature_k, reflectedTemperatureK: s.window.reflected_temperature_k } }
    : {}),
});

const FLAT = { wavelengths: [8, 14], values: [1, 1], unit: 'um' };

test('terms, signal and band-effective values against mpmath quadrature (1e-13)', () => {
  const KEYS = ['object', 'reflected', 'path', 'windowReflected', 'windowEmitted'];
  const EFF = { emissivity: 'emissivity', reflectance: 'reflectance', pathTransmittance: 'path_transmittance', windowTransmittance: 'window_transmittance', windowReflectance: 'window_reflectance', objectGain: 'object_gain' };
  for (const [name, c] of Object.entries(REF.spectral)) {
    const si = new qb.SpectralInstrument(definition(c.scene));
    const t = si.signalTerms(c.temperature_k);
    KEYS.forEach((k, i) => close(t[k], c.terms[i], 1e-13, `${name} ${k} (mpmath)`));
    close(t.signal, c.signal, 1e-13, `${name} signal (mpmath)`);
    close(si.measuredSignal(c.temperature_k), c.signal, 1e-13, `${name} measuredSignal (mpmath)`);
    const e = si.bandEffective(c.temperature_k);
    for (const [js, py] of Object.entries(EFF)) close(e[js], c.effective[py], 1e-13, `${name} effective ${js} (mpmath)`);
    // the inverse recovers the temperature from the mpmath signal (1e-12)
    close(si.objectTemperature(c.signal), c.temperature_k, 1e-12, `${name} objectTemperature`);
    const back = si.objectTemperatures([c.signal, c.signal]);
    close(back[1], c.temperature_k, 1e-12, `${name} objectTemperatures`);
    close(si.measuredSignals(new Float64Array([c.temperature_k]))[0], c.signal, 1e-13, `${name} measuredSignals`);
    si.free();
  }
});

test('the stepped emissivity is not grey: the band-mean grey solve is > 1 K off (mpmath)', () => {
  const c = REF.spectral.step_emissivity;
  const si = new qb.SpectralInstrument(definition(c.scene));
  close(si.objectTemperature(c.signal), c.temperature_k, 1e-12, 'spectral solve');
  assert.ok(Math.abs(c.grey_temperature_k - c.temperature_k) > 1);
  si.free();
});

test('sensitivities against mpmath finite differences (1e-9)', () => {
  const MAP = { signal: 'signal_coefficient', emissivityScale: 'emissivity_scale', pathTransmittanceScale: 'path_transmittance_scale', windowTransmittanceScale: 'window_transmittance_scale', windowReflectanceScale: 'window_reflectance_scale', responseScale: 'response_scale', reflectedTemperature: 'reflected_temperature', pathTemperature: 'path_temperature', windowTemperature: 'window_temperature', windowReflectedTemperature: 'window_reflected_temperature' };
  for (const c of REF.sensitivities) {
    const si = new qb.SpectralInstrument(definition(c.scene));
    const s = si.sensitivities(c.coefficients.signal);
    close(s.temperatureK, c.coefficients.temperature_k, 1e-13, 'temperature');
    for (const [js, py] of Object.entries(MAP)) close(s[js], c.coefficients[py], 1e-9, `sensitivity ${js} (mpmath)`);
    if (c.opaque) assert.equal(s.reflectanceScale, 0);
    else close(s.reflectanceScale, c.coefficients.reflectance_scale, 1e-9, 'reflectanceScale (mpmath)');
    si.free();
  }
});

test('grey inputs give the numbers of Instrument with the same response table', () => {
  const response = { wavelengths: [3, 4, 5], values: [0.5, 1, 0.8], unit: 'um' };
  const conditions = { emissivity: 0.8, reflectedTemperatureK: 300, pathTransmittance: 0.9, pathTemperatureK: 290 };
  const grey = new qb.Instrument({ model: { kind: 'response', ...response }, conditions });
  const si = new qb.SpectralInstrument({ response, conditions });
  close(si.signal(500), grey.signal(500), 1e-12, 'blackbody signal');
  close(si.measuredSignal(500), grey.measuredSignal(500), 1e-12, 'measured signal');
  close(si.objectTemperature(grey.measuredSignal(500)), 500, 1e-12, 'object temperature');
  grey.free();
  si.free();
});

/** An Instrument for a model of the workflow data. */
function workflowInstrument(model, conditions) {
  const m = {
    point_10um: { kind: 'spectralPoint', wavelength: 10, unit: 'um' },
    rect_8_14um: { kind: 'response', ...FLAT },
    sakuma_hattori: { kind: 'sakumaHattori', aM: REF.sakuma_hattori.a_m, bMK: REF.sakuma_hattori.b_mk, c: REF.sakuma_hattori.c },
    // tests/thermometry_indicated.rs RESPONSE_WL / RESPONSE_R
    response_3_5um: { kind: 'response', wavelengths: [3, 4, 5], values: [0.5, 1, 0.8], unit: 'um' },
  }[model];
  return new qb.Instrument({ model: m, conditions });
}

test('workflows from an indicated temperature on four models against mpmath (1e-12)', () => {
  let n = 0;
  for (const w of REF.workflows) {
    const what = `${w.kind} ${w.model} (mpmath)`;
    if (w.kind === 'correct') {
      const inst = workflowInstrument(w.model, setting(w.actual));
      close(qb.correctReading(inst, w.indicated_k, setting(w.setting)), w.expected, 1e-12, what);
      inst.free();
    } else {
      const inst = workflowInstrument(w.model);
      if (w.kind === 'reflected') {
        close(qb.reflectedTemperature(inst, w.indicated_k, setting(w.setting), w.reflector_emissivity, w.reflector_temperature_k), w.expected, 1e-12, what);
      } else if (w.kind === 'contact') {
        close(qb.emissivityByContact(inst, w.indicated_k, setting(w.setting), w.true_temperature_k, w.reflected_temperature_k), w.expected, 1e-12, what);
      } else {
        const r = qb.emissivityByReference(inst, w.reference_indicated_k, w.surface_indicated_k, setting(w.setting), w.reference_emissivity, w.reflected_temperature_k);
        close(r.emissivity, w.expected, 1e-12, what);
        close(r.temperatureK, w.expected_temperature_k, 1e-12, `${what} temperature`);
      }
      inst.free();
    }
    n++;
  }
  assert.equal(n, REF.workflows.length);
});

test('a spectral correction: non-grey target behind a window table, flat 8–14 µm (mpmath, 1e-12)', () => {
  const c = REF.spectral_correction;
  const sc = c.scene;
  const si = new qb.SpectralInstrument(definition(sc));
  close(qb.correctReading(si, c.indicated_k, setting(c.setting)), c.expected, 1e-12, 'spectral correction (mpmath)');
  // the other workflows accept a SpectralInstrument too (its blackbody signal): a reflector of
  // emissivity 0 reads the reflected temperature itself
  close(qb.reflectedTemperature(si, 301.5, { emissivity: 1 }, 0, 295), 301.5, 1e-12, 'reflector');
  si.free();
});

test('text tables: units, separators, headers, comments, order', () => {
  const t = qb.SpectralInstrument.tableFromText('wavenumber;tau\n# a comment\n1000; 0.5\n\n2000; 0.6 # end\n', 'cm-1', 'transmittance');
  assert.deepEqual(Array.from(t.wavelengths), [5e-6, 1e-5]);
  assert.deepEqual(Array.from(t.values), [0.6, 0.5]);
  assert.equal(t.unit, 'm');
  const csv = qb.SpectralInstrument.tableFromText('\ufefflambda_um,eps\r\n8,0.9\r\n10.5,0.8\r\n14,0.7\r\n', 'um', 'emissivity');
  assert.deepEqual(Array.from(csv.wavelengths), [8e-6, 10.5e-6, 14e-6]);
  // a text table drops into a definition (ends added by spreading)
  const si = new qb.SpectralInstrument({ response: FLAT, conditions: { emissivity: { ...csv, ends: 'reject' }, reflectedTemperatureK: 293.15 } });
  assert.ok(si.bandEffective(300).emissivity > 0.7 && si.bandEffective(300).emissivity < 0.9);
  si.free();
  const r = qb.SpectralInstrument.tableFromText('0.5\t0\n0.8\t1e0\n1.1\t.5', 'um', 'response');
  assert.deepEqual(Array.from(r.values), [0, 1, 0.5]);
});

test('errors name the JavaScript parameter, with the index, and the module recovers', () => {
  const mk = (conditions, response = FLAT) => () => new qb.SpectralInstrument({ response, conditions });
  let e = throwsCode(mk({ emissivity: { wavelengths: [8, 9, 14], values: [0.5, 1.5, 0.5], unit: 'um' }, reflectedTemperatureK: 300 }), 'INVALID_TABLE_ENTRY');
  assert.match(e.message, /definition\.conditions\.emissivity\.values\[1\]/);
  e = throwsCode(mk({ window: { transmittance: { wavelengths: [8, 14], values: [0.9, NaN], unit: 'um' }, temperatureK: 300 } }), 'INVALID_TABLE_ENTRY');
  assert.match(e.message, /definition\.conditions\.window\.transmittance\.values\[1\]/);
  e = throwsCode(mk({ window: { transmittance: 0.7, reflectance: { wavelengths: [8, 14], values: [0.2, 0.4], unit: 'um' }, temperatureK: 300, reflectedTemperatureK: 300 } }), 'INVALID_TABLE_ENTRY');
  assert.match(e.message, /window/);
  e = throwsCode(mk({ emissivity: { wavelengths: [9, 14], values: [0.5, 0.5], unit: 'um' }, reflectedTemperatureK: 300 }), 'OUTSIDE_TABLE');
  assert.match(e.message, /definition\.conditions\.emissivity/);
  // constant ends extend it
  new qb.SpectralInstrument({ response: FLAT, conditions: { emissivity: { wavelengths: [9, 14], values: [0.5, 0.5], unit: 'um', ends: 'constant' }, reflectedTemperatureK: 300 } }).free();
  e = throwsCode(mk({ pathTransmittance: { wavelengths: [8, 10, 9, 14], values: [1, 1, 1, 1], unit: 'um' }, pathTemperatureK: 290 }), 'NOT_INCREASING');
  assert.match(e.message, /definition\.conditions\.pathTransmittance\.wavelengths/);
  e = throwsCode(mk({ emissivity: { wavelengths: [8, 14], values: [0.5], unit: 'um' }, reflectedTemperatureK: 300 }), 'LENGTH_MISMATCH');
  assert.match(e.message, /definition\.conditions\.emissivity/);
  e = throwsCode(mk({}, { wavelengths: [8], values: [1], unit: 'um' }), 'TOO_FEW_POINTS');
  assert.match(e.message, /definition\.response/);
  e = throwsCode(mk({ emissivity: 0.5 }), 'UNSUPPORTED');
  assert.match(e.message, /reflectedTemperatureK/);
  e = throwsCode(mk({ emissivity: 1.5, reflectedTemperatureK: 300 }), 'OUT_OF_RANGE');
  e = throwsCode(mk({}, { wavelengths: [1000, 700], values: [1, 1], unit: 'cm-1' }), 'UNSUPPORTED');
  assert.match(e.message, /definition\.response\.unit/);
  e = throwsCode(mk({ colour: 1 }), 'UNSUPPORTED');
  e = throwsCode(() => new qb.SpectralInstrument({ response: { ...FLAT, unit: 'furlong' } }), 'UNKNOWN_UNIT');
  // text
  e = throwsCode(() => qb.SpectralInstrument.tableFromText('8, 0.9\n9, x\n14, 0.7', 'um', 'emissivity'), 'INVALID_LINE');
  assert.match(e.message, /line 2/);
  e = throwsCode(() => qb.SpectralInstrument.tableFromText('8, 0.9\n9, 1.2\n', 'um', 'emissivity'), 'INVALID_LINE');
  assert.match(e.message, /line 2/);
  throwsCode(() => qb.SpectralInstrument.tableFromText('8, 0.9\n', 'um', 'emissivity'), 'TOO_FEW_POINTS');
  throwsCode(() => qb.SpectralInstrument.tableFromText('8, 0.9\n9, 0.9', 'um', 'colour'), 'UNSUPPORTED');
  throwsCode(() => qb.SpectralInstrument.tableFromText('8, 0.9\n9, 0.9', 'parsec', 'emissivity'), 'UNKNOWN_UNIT');
  e = throwsCode(() => qb.SpectralInstrument.tableFromText(42, 'um', 'emissivity'), 'WRONG_TYPE');
  assert.match(e.message, /text/);
  // methods
  const si = new qb.SpectralInstrument({ response: FLAT, conditions: { emissivity: 0.5, reflectedTemperatureK: 400 } });
  e = throwsCode(() => si.measuredSignal(-1), 'NON_POSITIVE_TEMPERATURE');
  assert.match(e.message, /objectTemperatureK/);
  e = throwsCode(() => si.objectTemperature(NaN), 'NON_FINITE');
  assert.match(e.message, /signal/);
  throwsCode(() => si.objectTemperature(si.measuredSignal(300) * 0), 'NO_PHYSICAL_SOLUTION');
  e = throwsCode(() => si.objectTemperatures([si.measuredSignal(500), NaN]), 'NON_FINITE', 1);
  assert.match(e.message, /signals/);
  e = throwsCode(() => si.signal('300'), 'WRONG_TYPE');
  assert.match(e.message, /temperatureK/);
  e = throwsCode(() => qb.correctReading(si, 350, { emissivity: 2, reflectedTemperatureK: 300 }), 'OUT_OF_RANGE');
  assert.match(e.message, /setting\.emissivity/);
  e = throwsCode(() => qb.correctReading({}, 350, { emissivity: 1 }), 'WRONG_TYPE');
  assert.match(e.message, /instrument/);
  e = throwsCode(() => qb.emissivityByContact(si, 350, { emissivity: 1 }, 'hot', 293), 'WRONG_TYPE');
  assert.match(e.message, /trueTemperatureK/);
  e = throwsCode(() => qb.emissivityByReference(si, -1, 300, { emissivity: 1 }, 0.95, 293), 'NON_POSITIVE_TEMPERATURE');
  assert.match(e.message, /referenceReadingK/);
  // recovery: the same instance still answers
  close(si.objectTemperature(si.measuredSignal(500)), 500, 1e-12, 'after errors');
  si.free();
});

test('lifecycle: free and dispose', () => {
  const si = new qb.SpectralInstrument({ response: FLAT });
  assert.ok(si.signal(300) > 0);
  si.free();
  si.free();
  throwsCode(() => si.signal(300), 'DISPOSED');
  throwsCode(() => qb.correctReading(si, 300, { emissivity: 1 }), 'DISPOSED');
  if (typeof Symbol.dispose === 'symbol') {
    const s2 = new qb.SpectralInstrument({ response: FLAT });
    s2[Symbol.dispose]();
    throwsCode(() => s2.measuredSignal(300), 'DISPOSED');
  }
});

test('frame corrections: NUC gain/offset, emissivity map and bad-pixel mask', () => {
  const curve = new qb.CalibrationCurve({ aM: 1e-5, bMK: 1.8e-4, c: 1e6 });
  const raw = new Uint16Array([1000, 2000, 3000, 4000]);
  const gainMap = [1, 1.1, 0.9, 1];
  const offsetMap = [0, -5, 10, 2];
  const base = { gain: 10, offset: 5, conditions: { emissivity: 0.9, reflectedTemperatureK: 293.15 }, output: 'float64' };
  // the documented form: signal_i = gain·(g_i·raw_i + o_i) + offset, i.e. the same as a frame
  // of corrected raw values
  const corrected = Float64Array.from(raw, (r, i) => gainMap[i] * r + offsetMap[i]);
  const want = curve.convertFrame(corrected, base).temperaturesK;
  const got = curve.convertFrame(raw, { ...base, pixelGain: gainMap, pixelOffset: new Float64Array(offsetMap) });
  for (let i = 0; i < 4; i++) close(got.temperaturesK[i], want[i], 1e-14, `NUC pixel ${i}`);
  // a per-pixel emissivity map of the setting's value changes nothing
  const em = curve.convertFrame(raw, { ...base, emissivity: [0.9, 0.9, 0.9, 0.9] }).temperaturesK;
  const plain = curve.convertFrame(raw, base).temperaturesK;
  for (let i = 0; i < 4; i++) close(em[i], plain[i], 1e-14, `emissivity map pixel ${i}`);
  // the mask: marked pixels are NaN and counted invalid, in both loops
  for (const output of ['float64', 'float32']) {
    const m = curve.convertFrame(raw, { ...base, output, badPixels: new Uint8Array([0, 1, 0, 1]) });
    assert.ok(Number.isNaN(m.temperaturesK[1]) && Number.isNaN(m.temperaturesK[3]));
    assert.equal(m.temperaturesK[0], output === 'float64' ? plain[0] : Math.fround(plain[0]));
    assert.equal(m.invalid ?? m.invalidPixels ?? m.summary?.invalid, 2);
  }
  const m2 = curve.convertFrame(raw, { ...base, badPixels: [0, 0, 1, 0] });
  assert.ok(Number.isNaN(m2.temperaturesK[2]) && !Number.isNaN(m2.temperaturesK[1]));
  let e = throwsCode(() => curve.convertFrame(raw, { ...base, pixelGain: [1, 1] }), 'LENGTH_MISMATCH');
  assert.match(e.message, /options\.pixelGain/);
  e = throwsCode(() => curve.convertFrame(raw, { ...base, pixelOffset: 'x' }), 'WRONG_TYPE');
  assert.match(e.message, /options\.pixelOffset/);
  e = throwsCode(() => curve.convertFrame(raw, { ...base, badPixels: [0, 0, 0] }), 'LENGTH_MISMATCH');
  assert.match(e.message, /options\.badPixels/);
  // recovery
  assert.equal(curve.convertFrame(raw, base).temperaturesK[0], plain[0]);
  curve.free();
});
