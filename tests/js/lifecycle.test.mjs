// Prepared objects release their WebAssembly memory: now with free() or Symbol.dispose, or later
// through the FinalizationRegistry when the caller forgets. Counted with the module's own count
// of live objects (a test-only export, `__testing.liveObjects`). Garbage collection is forced
// with V8's gc() (enabled here with v8.setFlagsFromString, as `node --expose-gc` would).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import v8 from 'node:v8';
import vm from 'node:vm';
import { qb, throwsCode } from './helpers.mjs';

v8.setFlagsFromString('--expose-gc');
const gc = vm.runInNewContext('gc');

const live = () => qb.__testing.liveObjects();
const point = { kind: 'spectralPoint', wavelength: 10, unit: 'um' };

test('free() and Symbol.dispose release at once; a freed object throws DISPOSED', () => {
  const base = live();
  const s = new qb.Spectrum({ unit: 'um' });
  const i = new qb.Instrument({ model: point });
  const c = new qb.CalibrationCurve({ aM: 1e-5, bMK: 1.8e-4, c: 1e6 });
  const j = i.withConditions({ emissivity: 0.9, reflectedTemperatureK: 300 });
  const f = qb.CalibrationCurve.fitInstrument(i, 300, 400);
  assert.equal(live(), base + 5);
  s.free();
  i.free();
  assert.equal(typeof Symbol.dispose, 'symbol', 'Node 20 has Symbol.dispose');
  c[Symbol.dispose]();
  j[Symbol.dispose]();
  f.free();
  assert.equal(live(), base);
  throwsCode(() => s.point(10, 300), 'DISPOSED');
  throwsCode(() => i.signal(300), 'DISPOSED');
  throwsCode(() => c.temperature(1), 'DISPOSED');
  throwsCode(() => j.withConditions(), 'DISPOSED');
  throwsCode(() => i.measurementAffine(), 'DISPOSED');
  throwsCode(() => qb.CalibrationCurve.fromResponse(i, 300), 'DISPOSED');
  throwsCode(() => f.convertFrame(new Uint16Array(1)), 'DISPOSED');
  s.free(); // a second free is harmless
  assert.equal(live(), base);
  // what was read at construction stays readable
  assert.equal(s.settings.unit, 'um');
  assert.equal(c.coefficients.aM, 1e-5);
});

test('forgotten objects are freed by the FinalizationRegistry', async () => {
  const base = live();
  (() => {
    for (let k = 0; k < 2000; k++) {
      new qb.Spectrum({ unit: 'nm', emissivity: 0.5 });
      new qb.Instrument({ model: point });
    }
  })();
  assert.equal(live(), base + 4000);
  for (let round = 0; round < 50 && live() > base; round++) {
    gc();
    await new Promise((resolve) => setTimeout(resolve, 10)); // cleanup callbacks run between tasks
  }
  assert.equal(live(), base, 'objects left after garbage collection');
});

test('a kept object survives garbage collection', async () => {
  const kept = new qb.Spectrum({ unit: 'um' });
  const v = kept.point(10, 300);
  gc();
  await new Promise((resolve) => setTimeout(resolve, 10));
  gc();
  assert.equal(kept.point(10, 300), v);
  kept.free();
});
