// The npm package (pkg/) against the full build the other suites test (target/pkg-full/): the
// package is built without the `spectral-js` feature (the spectral-table bindings do not fit its
// size ceiling), so its public API must be exactly the full API minus the spectral area
// (src/wasm/js/spectral.js) — no other export lost (the workflows from an indicated temperature
// of reading.js included), and nothing of the spectral area half-present.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import { qb as full } from './helpers.mjs';
import * as pkg from '../../pkg/node.js';

/** The public names of src/wasm/js/spectral.js (the area the package leaves out). */
const SPECTRAL = [...readFileSync(new URL('../../src/wasm/js/spectral.js', import.meta.url), 'utf8').matchAll(/^export\s+(?:function|class|const)\s+([A-Za-z$][\w$]*)/gm)].map((m) => m[1]);

test('pkg/ exports the full API minus the spectral area', () => {
  assert.ok(SPECTRAL.includes('SpectralInstrument'), `spectral names: ${SPECTRAL}`);
  // The workflows from an indicated temperature ship in the package (with Instrument).
  for (const k of ['correctReading', 'reflectedTemperature', 'emissivityByContact', 'emissivityByReference']) {
    assert.ok(!SPECTRAL.includes(k) && typeof pkg[k] === 'function', `pkg/ exports ${k}`);
  }
  const want = Object.keys(full).filter((k) => !SPECTRAL.includes(k)).sort();
  assert.deepEqual(Object.keys(pkg).sort(), want);
  for (const k of SPECTRAL) assert.ok(k in full, `the full build exports ${k}`);
  const dts = readFileSync(new URL('../../pkg/quantaband.d.ts', import.meta.url), 'utf8');
  assert.ok(!/SpectralInstrument/.test(dts), 'pkg/quantaband.d.ts declares no spectral-table class');
});

test('pkg/ computes what the full build computes', () => {
  // L_λ(10 µm, 300 K) = 9.924033330070695 W·m⁻²·sr⁻¹·µm⁻¹ (mpmath, tests/data/gen_core.py; as in
  // radiometry.test.mjs)
  for (const m of [pkg, full]) {
    const s = new m.Spectrum({ unit: 'um' });
    assert.ok(Math.abs(s.point(10, 300) / 9.924033330070695 - 1) < 1e-12);
    s.free();
  }
  const frame = Uint16Array.from([1000, 2000, 3000, 4000]);
  const convert = (m) => {
    const c = new m.CalibrationCurve({ aM: 1.05e-5, bMK: 1.5e-4, c: 2e4 });
    const r = c.convertFrame(frame, { gain: 0.01, pixelGain: [1, 1.01, 0.99, 1], badPixels: Uint8Array.of(0, 0, 1, 0) });
    c.free();
    return Array.from(r.temperaturesK);
  };
  assert.deepEqual(convert(pkg), convert(full));
  // A reading workflow with a grey Instrument: the same number in both builds, and the
  // package's message names only the class it has.
  const workflow = (m) => {
    const inst = new m.Instrument({ model: { kind: 'spectralPoint', wavelength: 10, unit: 'um' }, conditions: { emissivity: 0.8, reflectedTemperatureK: 295 } });
    const r = [
      m.correctReading(inst, 350, { emissivity: 0.95, reflectedTemperatureK: 293 }),
      m.emissivityByContact(inst, 350, { emissivity: 1 }, 360, 293),
      m.emissivityByReference(inst, 355, 350, { emissivity: 1 }, 0.95, 293).emissivity,
    ];
    inst.free();
    return r;
  };
  const [a, b] = [workflow(pkg), workflow(full)];
  assert.deepEqual(a, b);
  assert.ok(a.every((x) => Number.isFinite(x) && x > 0), `workflow results ${a}`);
  assert.throws(() => pkg.correctReading({}, 350, { emissivity: 1 }), (e) => e.code === 'WRONG_TYPE' && /instrument must be an Instrument \(got/.test(e.message));
});
