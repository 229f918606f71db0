// The package's own allocator (src/wasm/runtime.rs: power-of-two size classes with free lists)
// under the call patterns of a long-running page or service tool: memory must stop growing once
// a pattern has run, results must stay intact when blocks are reused, and a result too large
// for WebAssembly memory must be an error, not an abort.
import test from 'node:test';
import assert from 'node:assert/strict';
import { qb, throwsCode } from './helpers.mjs';
import { initSync } from '../../pkg/quantaband.js';

// Already instantiated by pkg/node.js: initSync returns the module's exports (memory included).
const wasm = initSync({ module: new Uint8Array(0) });
const pages = () => wasm.memory.buffer.byteLength / 65536;

const um = { unit: 'um' };
// A made-up 9 µm instrument: signal ~5e6 at 800 K; counts 20 000…40 000 at gain 100 are
// 600…1000 K scenes.
const curve = { kind: 'sakumaHattori', aM: 9.1e-6, bMK: 2.2e-5, c: 3.0e7 };
const cond = { emissivity: 0.9, reflectedTemperatureK: 300 };
const reading = qb.measuredSignal(curve, 800, cond);

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
    check += qb.bandIntegralArray(um, 8, 14, temps)[n - 1];
    const xs = new Float64Array(Math.max(1, n >> 3)).map((_, i) => 1 + i * 1e-3);
    check += qb.spectralDensityArray(um, xs, 600)[0];
    check += qb.convertTemperatureArray(temps, 'K', 'degC')[0];
    const counts = new Uint16Array(Math.max(1, n >> 2)).fill(20_000 + Math.floor(20_000 * next()));
    check += qb.convertFrame(curve, counts, { gain: 100 }).temperaturesK[0];
    check += qb.its90Temperature(10, 650, 'nm', 'gold').t90K;
    check += qb.uncertaintyBudget(curve, reading, cond, { signal: 1e-3 * reading, emissivity: 0.01 })
      .combinedStandardUncertaintyK;
    // errors allocate their messages; one in a bulk call stops it half-way
    temps[n >> 1] = -1;
    throwsCode(() => qb.bandIntegralArray(um, 8, 14, temps), 'NON_POSITIVE_TEMPERATURE', n >> 1);
    throwsCode(() => qb.spectralDensity({ unit: 'um', colour: 'blue' }, 10, 300), 'UNSUPPORTED');
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
  const want = qb.bandIntegralArray(um, 8, 14, temps);
  const after = pages();
  for (let r = 0; r < 8; r++) {
    const got = qb.bandIntegralArray(um, 8, 14, temps);
    assert.equal(got.length, want.length);
    assert.equal(got[0], want[0]);
    assert.equal(got[999_999], want[999_999]);
  }
  assert.equal(pages(), after, 'memory grew on repeating a 1e6-element call');
});

test('reused blocks hold the right values (no overlap between live results)', () => {
  // Several results of different sizes alive at once inside one call (the grid keeps its
  // converted points while it fills the output), checked element by element against scalar
  // calls that run in between and reuse freed blocks.
  const xs = new Float64Array(777).map((_, i) => 0.5 + i * 0.02);
  const ts = new Float64Array([300, 600, 1200, 2400]);
  const grid = qb.spectralDensityGrid(um, xs, ts);
  assert.equal(grid.length, xs.length * ts.length);
  for (let i = 0; i < ts.length; i++) {
    for (let j = 0; j < xs.length; j += 37) {
      assert.equal(grid[i * xs.length + j], qb.spectralDensity(um, xs[j], ts[i]), `grid[${i}, ${j}]`);
    }
  }
});

test('a result too large for WebAssembly memory is OUT_OF_RANGE, and the module keeps working', () => {
  // 1e5 points x 1e5 temperatures = 1e10 values (80 GB): refused before any allocation.
  const xs = new Float64Array(100_000).fill(10);
  const ts = new Float64Array(100_000).fill(300);
  throwsCode(() => qb.spectralDensityGrid(um, xs, ts), 'OUT_OF_RANGE');
  assert.ok(Math.abs(qb.bandIntegral(um, 8, 14, 300) - 54.93346137683969) < 1e-10);
});
