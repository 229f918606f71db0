// Memory under the call patterns of a long-running page or service tool: once a pattern has
// run, repeating it must not grow the WebAssembly memory; scratch buffers reused from call to
// call must hold the right values; a frame converted into the caller's buffer allocates nothing.
import test from 'node:test';
import assert from 'node:assert/strict';
import { qb, throwsCode } from './helpers.mjs';

const pages = () => qb.__testing.memoryBytes() / 65536;

const um = new qb.Spectrum({ unit: 'um' });
// A made-up 9 µm instrument: signal ~5e6 at 800 K; counts 20 000…40 000 at gain 100 are
// 600…1000 K scenes.
const coefficients = { aM: 9.1e-6, bMK: 2.2e-5, c: 3.0e7 };
const curve = new qb.CalibrationCurve(coefficients);
const cond = { emissivity: 0.9, reflectedTemperatureK: 300 };
const instrument = new qb.Instrument({ model: { kind: 'sakumaHattori', ...coefficients }, conditions: cond });
const reading = instrument.measuredSignal(800);

/** A deterministic mix of calls: arrays of many sizes, objects, strings and thrown errors. */
function round(seed) {
  let x = seed;
  const next = () => {
    x = (x * 1103515245 + 12345) % 2147483648;
    return x / 2147483648;
  };
  let check = 0;
  for (let k = 0; k < 60; k++) {
    const n = 1 + Math.floor(next() ** 3 * 200_000);
    const temps = new Float64Array(n).fill(250 + 1000 * next());
    check += um.bands(8, 14, temps)[n - 1];
    const xs = new Float64Array(Math.max(1, n >> 3)).map((_, i) => 1 + i * 1e-3);
    check += um.points(xs, 600)[0];
    check += qb.convertTemperatureArray(temps, 'K', 'degC')[0];
    const counts = new Uint16Array(Math.max(1, n >> 2)).fill(20_000 + Math.floor(20_000 * next()));
    check += curve.convertFrame(counts, { gain: 100 }).temperaturesK[0];
    check += qb.its90Temperature(10, 650, 'nm', 'gold').t90K;
    check += instrument.uncertaintyBudget(reading, { signal: 1e-3 * reading, emissivity: 0.01 }).combinedStandardUncertaintyK;
    // a short-lived prepared object per round, freed
    const s = new qb.Spectrum({ unit: 'nm', emissivity: 0.5 + next() / 2 });
    check += s.point(10_000, 500);
    s.free();
    // errors; one in a bulk call stops it half-way
    temps[n >> 1] = -1;
    throwsCode(() => um.bands(8, 14, temps), 'NON_POSITIVE_TEMPERATURE', n >> 1);
    throwsCode(() => new qb.Spectrum({ unit: 'um', colour: 'blue' }), 'UNSUPPORTED');
  }
  assert.ok(Number.isFinite(check), `finite results (${check})`);
  return check;
}

test('memory stops growing once a call pattern has run', () => {
  const first = round(7);
  const after = pages();
  for (let r = 0; r < 4; r++) {
    assert.equal(round(7), first, `round ${r + 2}: same results as the first round`);
  }
  assert.equal(pages(), after, `memory grew from ${after} to ${pages()} pages on repeating the pattern`);
});

test('a million-element call repeated does not grow memory after the first', () => {
  const temps = new Float64Array(1_000_000).map((_, i) => 300 + (i % 1000));
  const want = um.bands(8, 14, temps);
  const after = pages();
  for (let r = 0; r < 8; r++) {
    const got = um.bands(8, 14, temps);
    assert.equal(got.length, want.length);
    assert.equal(got[0], want[0]);
    assert.equal(got[999_999], want[999_999]);
  }
  assert.equal(pages(), after, 'memory grew on repeating a 1e6-element call');
});

test('a frame converted into the caller\'s buffer: same values, same buffer, no growth', () => {
  const n = 640 * 512;
  const counts = new Uint16Array(n).map((_, i) => 20_000 + (i % 20_000));
  const first = curve.convertFrame(counts, { gain: 100, conditions: cond });
  curve.convertFrame(counts, { gain: 100, conditions: cond, output: 'float64' }); // sizes its buffer
  const out = new Float32Array(n);
  const before = pages();
  for (let r = 0; r < 20; r++) {
    const res = curve.convertFrame(counts, { gain: 100, conditions: cond, out });
    assert.equal(res.temperaturesK, out, 'the caller\'s buffer is returned');
    assert.equal(res.valid, first.valid);
  }
  assert.deepEqual(out, first.temperaturesK);
  const out64 = new Float64Array(n);
  assert.equal(curve.convertFrame(counts, { gain: 100, conditions: cond, output: 'float64', out: out64 }).temperaturesK, out64);
  assert.equal(pages(), before, 'frames into a caller buffer grew the memory');
  throwsCode(() => curve.convertFrame(counts, { out: new Float32Array(3) }), 'LENGTH_MISMATCH');
  throwsCode(() => curve.convertFrame(counts, { out: new Float64Array(n) }), 'WRONG_TYPE'); // output is float32
});

test('scratch reuse: interleaved bulk calls of different sizes keep their values', () => {
  const xs = new Float64Array(777).map((_, i) => 0.5 + i * 0.02);
  const ts = new Float64Array([300, 600, 1200, 2400]);
  const rows = Array.from(ts, (t) => um.points(xs, t));
  const small = um.points(new Float64Array([10]), 300);
  for (let i = 0; i < ts.length; i++) {
    for (let j = 0; j < xs.length; j += 37) assert.equal(rows[i][j], um.point(xs[j], ts[i]), `row ${i}, ${j}`);
  }
  assert.equal(small[0], um.point(10, 300));
});
