// Hostile JavaScript input (issue 12), one test per class of problem found at the old boundary:
// exceptions thrown by the caller's code while an argument is read (must never unwind through a
// WebAssembly frame), traps, lying lengths, stale reads, re-entrancy, leaks, coercion, the fit's
// size limit, budgets that must stay finite. After every class the instance must still give the
// exact known value.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { qb, throwsCode } from './helpers.mjs';

const um = new qb.Spectrum({ unit: 'um' });
const KNOWN = um.point(10, 300); // 9.924033330070694 W·m⁻²·sr⁻¹·µm⁻¹ (mpmath: …0695, 1 ulp)
const healthy = () => assert.equal(um.point(10, 300), KNOWN);
const curve = new qb.CalibrationCurve({ aM: 1.0e-5, bMK: 1.8e-4, c: 1.0e6 });

/** Calls `fn` n times; each must throw a QuantabandError with `code`. */
function manyThrows(n, fn, code) {
  for (let i = 0; i < n; i++) {
    let caught;
    try {
      fn();
    } catch (e) {
      caught = e;
    }
    if (!(caught instanceof qb.QuantabandError) || caught.code !== code) {
      assert.fail(`call ${i}: expected ${code}, got ${caught && caught.code} ${caught}`);
    }
  }
}

function throwingGetterSettings() {
  const o = { unit: 'um' };
  Object.defineProperty(o, 'emissivity', { enumerable: true, get() { throw new Error('getter failed'); } });
  return o;
}
const throwingProxy = new Proxy({ unit: 'um' }, { ownKeys() { throw new Error('trap failed'); } });
const { proxy: revoked, revoke } = Proxy.revocable({ unit: 'um' }, {});
revoke();
function transferred(n, Type = Float64Array) {
  const a = new Type(n);
  structuredClone(a.buffer, { transfer: [a.buffer] });
  return a;
}
const throwingElement = { length: 3, 0: 1, get 1() { throw new Error('element getter failed'); }, 2: 3 };

test('10 000 calls of each throwing kind, then a valid call: the instance lives on', () => {
  const N = 10_000;
  const before = { memory: qb.__testing.memoryBytes(), table: qb.__testing.tableSize() };
  manyThrows(N, () => new qb.Spectrum(throwingGetterSettings()), 'WRONG_TYPE');
  manyThrows(N, () => new qb.Spectrum(throwingProxy), 'WRONG_TYPE');
  manyThrows(N, () => new qb.Spectrum(revoked), 'WRONG_TYPE');
  manyThrows(N, () => um.points(transferred(4), 300), 'DETACHED_BUFFER');
  manyThrows(N, () => um.points(throwingElement, 300), 'WRONG_TYPE');
  manyThrows(N, () => curve.convertFrame(transferred(2, Uint16Array)), 'DETACHED_BUFFER');
  manyThrows(N, () => qb.CalibrationCurve.fit(throwingElement, [1, 2, 3]), 'WRONG_TYPE');
  healthy();
  assert.equal(qb.__testing.memoryBytes(), before.memory, 'memory grew');
  assert.equal(qb.__testing.tableSize(), before.table, 'externref table grew');
  // a demanding valid call after all of them
  assert.equal(um.points(new Float64Array(100_000).fill(10), 300)[99_999], KNOWN);
});

test('memory and the externref table stay flat over 100 000 error calls of every kind', () => {
  const kinds = [
    () => um.point(10, -1), // core error, scalar
    () => um.points(new Float64Array([1, -1]), 300), // core error, bulk, index
    () => new qb.Spectrum({ unit: 'um', colour: 1 }), // configuration error (Rust side)
    () => new qb.Instrument({ model: { kind: 'spectralPoint', wavelength: 'x', unit: 'um' } }),
    () => um.point('10', 300), // boundary type error
    () => new qb.Spectrum(throwingGetterSettings()),
    () => qb.its90Temperature(-1, 650, 'nm', 'gold'),
    () => curve.convertFrame(new Uint16Array(4), { gain: -1 }),
  ];
  for (const k of kinds) for (let i = 0; i < 200; i++) assert.throws(k, qb.QuantabandError); // warm-up
  const before = { memory: qb.__testing.memoryBytes(), table: qb.__testing.tableSize(), live: qb.__testing.liveObjects() };
  for (let i = 0; i < 100_000; i++) {
    try {
      kinds[i % kinds.length]();
      assert.fail('no error');
    } catch (e) {
      if (!(e instanceof qb.QuantabandError)) throw e;
    }
  }
  healthy();
  const after = { memory: qb.__testing.memoryBytes(), table: qb.__testing.tableSize(), live: qb.__testing.liveObjects() };
  assert.deepEqual(after, before);
});

test('lying lengths: the true length is used, nothing past it is read or written', () => {
  // a Float64Array whose `length` property under- or over-reports
  const under = new Float64Array([8, 9, 10, 11]);
  Object.defineProperty(under, 'length', { value: 1 });
  assert.deepEqual(Array.from(um.points(under, 300)), [8, 9, 10, 11].map((x) => um.point(x, 300)));
  const over = new Float64Array([10, 10]);
  Object.defineProperty(over, 'length', { value: 1e9 });
  assert.equal(um.points(over, 300).length, 2);
  class Lying extends Float64Array {
    get length() {
      return 7;
    }
  }
  assert.equal(um.points(new Lying([10, 11]), 300).length, 2);
  // a frame whose length over-reports returns its own pixels, not pixels of an earlier call
  const earlier = curve.convertFrame(new Float32Array(8).fill(5e5));
  assert.equal(earlier.valid, 8);
  const short = new Float32Array([4e5, 4e5]);
  Object.defineProperty(short, 'length', { value: 8 });
  const r = curve.convertFrame(short);
  assert.equal(r.temperaturesK.length, 2);
  assert.equal(r.valid, 2);
  // an array-like is read exactly up to its length (checked once)
  assert.equal(um.points({ length: 2, 0: 10, 1: 10, 2: 'never read' }, 300).length, 2);
  healthy();
});

test('absurd lengths and sizes are refused before any allocation', () => {
  throwsCode(() => um.points({ length: 2 ** 53 }, 300), 'TOO_LARGE');
  throwsCode(() => um.points({ length: Infinity }, 300), 'TOO_LARGE');
  throwsCode(() => um.points({ length: NaN }, 300), 'WRONG_TYPE');
  throwsCode(() => um.points({ length: -5 }, 300), 'WRONG_TYPE');
  throwsCode(() => new qb.Instrument({ model: { kind: 'response', wavelengths: { length: 2 ** 28 }, values: [1], unit: 'um' } }), 'WRONG_TYPE');
  throwsCode(() => new qb.Instrument({ model: { kind: 'response', wavelengths: new Array(2 ** 28), values: [1], unit: 'um' } }), 'TOO_LARGE');
  healthy();
});

test('re-entrancy: getters that call back into the package and grow its memory', () => {
  const grow = () => um.points(new Float64Array(400_000).fill(10), 300)[0];
  const settings = { unit: 'um' };
  Object.defineProperty(settings, 'emissivity', { enumerable: true, get() { grow(); return 0.5; } });
  const s = new qb.Spectrum(settings);
  assert.equal(s.settings.emissivity, 0.5);
  assert.equal(s.point(10, 300), 0.5 * KNOWN);
  // array elements read by a getter that grows memory in between
  const xs = { length: 3, 0: 10, get 1() { grow(); return 10; }, 2: 10 };
  assert.deepEqual(Array.from(um.points(xs, 300)), [KNOWN, KNOWN, KNOWN]);
  // a getter on a frame option, and an emissivity map that is an array-like with a growing getter
  const opts = { get gain() { grow(); return 1; } };
  const ref = curve.convertFrame(new Float32Array([5e5, 6e5]));
  assert.deepEqual(curve.convertFrame(new Float32Array([5e5, 6e5]), opts).temperaturesK, ref.temperaturesK);
  const eps = { length: 2, 0: 1, get 1() { grow(); return 1; } };
  assert.deepEqual(curve.convertFrame(new Float32Array([5e5, 6e5]), { emissivity: eps }).temperaturesK, ref.temperaturesK);
  // a getter that detaches the frame's buffer after it was checked
  const raw = new Float32Array([5e5, 6e5]);
  const sneaky = { length: 2, 0: 1, get 1() { structuredClone(raw.buffer, { transfer: [raw.buffer] }); return 1; } };
  throwsCode(() => curve.convertFrame(raw, { emissivity: sneaky }), 'DETACHED_BUFFER');
  healthy();
});

test('no coercion: strings, booleans, null, arrays and objects are not numbers', () => {
  for (const bad of ['10', true, false, null, undefined, [10], {}, 10n, Symbol('t'), () => 10, new Number(10)]) {
    throwsCode(() => um.point(bad, 300), 'WRONG_TYPE');
    throwsCode(() => qb.fermiDirac(bad), 'WRONG_TYPE');
    throwsCode(() => curve.temperature(bad), 'WRONG_TYPE');
  }
  for (const bad of [5, 'abc', true, null, undefined, Symbol('a'), new Map()]) {
    throwsCode(() => um.points(bad, 300), 'WRONG_TYPE');
  }
  throwsCode(() => um.points(['10', 11], 300), 'WRONG_TYPE');
  throwsCode(() => um.points([null], 300), 'WRONG_TYPE');
  throwsCode(() => curve.convertFrame([1, 2]), 'WRONG_TYPE');
  throwsCode(() => curve.convertFrame(new Uint8Array(4)), 'WRONG_TYPE');
  throwsCode(() => qb.convertTemperature(1, 'K', new String('degC')), 'WRONG_TYPE');
  healthy();
});

test('the fit accepts up to 10 000 points in any order and returns; more are TOO_LARGE', () => {
  const n = 10_000;
  const t = Float64Array.from({ length: n }, (_, i) => 300 + (900 * ((i * 7919) % n)) / n); // unordered
  const s = curve.signals(t);
  const fit = qb.CalibrationCurve.fit(t, s);
  assert.ok(Math.abs(fit.coefficients.aM / 1.0e-5 - 1) < 1e-8, `A = ${fit.coefficients.aM}`);
  assert.equal(fit.fitReport.residualsK.length, n);
  const e = throwsCode(() => qb.CalibrationCurve.fit(new Float64Array(n + 1).fill(300), new Float64Array(n + 1).fill(1)), 'TOO_LARGE');
  assert.equal(e.message, `temperaturesK has ${n + 1} elements; at most ${n} are accepted`);
  healthy();
});

test('uncertainty budgets stay finite, or fail with a typed error, when an input that does not matter overflows', () => {
  const point = { kind: 'spectralPoint', wavelength: 10, unit: 'um' };
  // τ = 1: the path temperature has no weight; a huge one leaves every number finite
  const inst = new qb.Instrument({ model: point, conditions: { pathTransmittance: 1, pathTemperatureK: 1e5 } });
  const b = inst.uncertaintyBudget(inst.signal(400), { signal: 1, pathTemperatureK: 10 });
  assert.ok(Number.isFinite(b.combinedStandardUncertaintyK));
  for (const e of b.entries) assert.ok(Number.isFinite(e.sensitivity) && Number.isFinite(e.contributionK), JSON.stringify(e));
  assert.equal(b.entries[4].sensitivity, 0);
  // one whose model signal overflows: the path transmittance's sensitivity would be infinite
  const absurd = new qb.Instrument({ model: point, conditions: { pathTransmittance: 1, pathTemperatureK: 1e307 } });
  const err = throwsCode(() => absurd.uncertaintyBudget(absurd.signal(400), { signal: 1 }), 'OUT_OF_RANGE');
  assert.match(err.message, /^pathTemperatureK must lie in temperatures whose model signal is finite \(got 1e\+307\)$/);
  throwsCode(() => absurd.sensitivities(absurd.signal(400)), 'OUT_OF_RANGE');
  healthy();
});
