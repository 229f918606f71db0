// The package's spectral point and bulk paths (the prepared constants' loop of Spectrum.points
// runs only in the wasm build) against mpmath: tests/data/fast_path_reference.json, written by
// tests/data/gen_fast_path.py (mpmath 1.3.0, 40 digits, closed-form Planck's law at the exact
// f64 inputs, SI defining constants h, c, k; c2 = hc/k). Values are stored as hi + lo so the
// error is measured below one ulp.
//
// Bound (DEVELOPERS.md "Radiometric core"): for ln 2 <= x < 700 the direct path is within
// 1.5e-15 + 4.5e-16·x relative; other paths 5e-15 + 2.5e-16·x (as tests/core_reference.rs).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { qb, loadReference } from './helpers.mjs';

const ref = loadReference('fast_path_reference.json');
const C2 = 1.4387768775039338e-2; // CODATA 2018 hc/k in f64, as src/constants.rs

const relErr = (y, hi, lo) => Math.abs(y - hi - lo) / hi;
const bound = (x) => (x > 0.6932 ? 1.5e-15 + 4.5e-16 * x : 5e-15 + 2.5e-16 * x);

test('Spectrum.points over the 10 000-point bench grid (1–20 µm, 1000 K) against mpmath', { skip: !ref }, () => {
  const n = ref.bench_count;
  const step = (ref.bench_last_m - ref.bench_first_m) / (n - 1);
  const t = ref.bench_temperature_k;
  const xs = Float64Array.from({ length: n }, (_, i) => ref.bench_first_m + i * step);
  const s = new qb.Spectrum({ unit: 'm' });
  const out = new Float64Array(n);
  s.points(xs, t, out);
  let worst = 0;
  for (let i = 0; i < n; i++) {
    const [hi, lo] = ref.bench[i];
    const e = relErr(out[i], hi, lo);
    assert.ok(e <= bound(C2 / (xs[i] * t)), `lambda ${xs[i]} m: ${out[i]}, relative error ${e}`);
    // the point method takes the same path
    if (i % 97 === 0) assert.equal(s.point(xs[i], t), out[i]);
    worst = Math.max(worst, e);
  }
  assert.ok(worst > 0 && worst < 3e-15, `max relative error ${worst}`);
  s.free();
});

test('Spectrum.points and .point over 3 000 seeded points of every variable and quantity', { skip: !ref }, () => {
  const unit = { l: 'm', n: 'm-1', f: 'Hz' };
  const variable = { l: 'wavelength', n: 'wavenumber', f: 'frequency' };
  const quantity = { e: 'energy', p: 'photon' };
  const groups = new Map();
  for (const r of ref.spread) {
    const key = r[0] + r[1];
    if (!groups.has(key)) groups.set(key, []);
    groups.get(key).push(r);
  }
  assert.equal(groups.size, 6);
  for (const [key, rows] of groups) {
    const s = new qb.Spectrum({ unit: unit[key[0]], variable: variable[key[0]], quantity: quantity[key[1]] });
    const xs = Float64Array.from(rows, (r) => r[2]);
    // one temperature per bulk call: evaluate each row's point in its own one-element call too
    for (let i = 0; i < rows.length; i++) {
      const [, , v, t, x, hi, lo] = rows[i];
      const one = new Float64Array(1);
      s.points(xs.subarray(i, i + 1), t, one);
      const p = s.point(v, t);
      assert.equal(one[0], p, `${key} v ${v}, T ${t}: bulk and point differ`);
      const e = relErr(p, hi, lo);
      assert.ok(e <= bound(x), `${key} v ${v}, T ${t} K (x ${x}): ${p}, relative error ${e} > ${bound(x)}`);
    }
    s.free();
  }
});
