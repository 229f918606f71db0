// Multi-wavelength pyrometry, Raman and noise-source (Y-factor) thermometry and semiconductor
// carrier statistics through the package, against the same outside reference the Rust tests use:
// tests/data/quantum_reference.json, written by tests/data/gen_quantum.py with mpmath 1.3.0 at
// 40 digits (least squares by Newton's method on the stationarity conditions, covariance by
// mp.inverse, condition numbers by mp.svd_r, band signals and Fermi–Dirac integrals by mp.quad,
// inverses by mp.findroot). Tolerances are those of tests/quantum_reference.rs unless a check
// says why it differs. Decibel values: mpmath 1.3.0 at 30 digits (10**(x/10), 10*log10(r)).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { close, loadReference, qb, rel, throwsCode } from './helpers.mjs';

const REF = loadReference('quantum_reference.json');
const n = (s) => Number(s);
const ns = (a) => a.map(Number);
const EV = 1.602176634e-19; // J, exact (SI 2019)

/** Tracks the worst error of one kind (as the Rust tests do) and reports it. */
function worst(t, name, tol) {
  let max = 0;
  return {
    see(err, what) {
      assert.ok(err <= tol, `${name}: ${what}: error ${err} > ${tol}`);
      max = Math.max(max, err);
    },
    done() {
      t.diagnostic(`${name}: max error ${max.toExponential(2)} (tol ${tol})`);
    },
  };
}

// ---- multi-wavelength pyrometry ------------------------------------------------------------

/** The fit of reference case `c` (wavelengths in m, radiances per m). */
function fitCase(c, extraOptions = {}) {
  const options = { model: c.model, ...extraOptions };
  if (c.channels === 'spectral') {
    return qb.fitMultiwavelength(
      { wavelengths: ns(c.wavelengths_m), unit: 'm', radiances: ns(c.radiances), uncertainties: ns(c.uncertainties) },
      options,
    );
  }
  // rectangular bands: a response table of two equal values is the band [lower, upper]
  const channels = c.band_lower_m.map(
    (lo, i) => new qb.Instrument({ model: { kind: 'response', wavelengths: [n(lo), n(c.band_upper_m[i])], values: [1, 1], unit: 'm' } }),
  );
  try {
    return qb.fitMultiwavelength(
      { channels, wavelengths: ns(c.wavelengths_m), unit: 'm', signals: ns(c.radiances), uncertainties: ns(c.uncertainties) },
      options,
    );
  } finally {
    for (const ch of channels) ch.free();
  }
}

test('multi-wavelength fits match mpmath least squares (spectral points and bands)', (t) => {
  // The band case goes through the response-table model (R = 1 over the band: its signal is
  // ≤ 3e-13 from mpmath quadrature, tests/thermometry_reference.rs) instead of the Rust test's
  // rectangular band; the measured errors stay within the same tolerances.
  const same = (x) => ({ spectral: x, bands: x });
  const tol = {
    t: same(1e-12),
    a: same(1e-9),
    cov: same(1e-9),
    cond: same(1e-9),
    corr: same(1e-12),
    inf: same(1e-9),
    chi: same(1e-9),
    tb: same(1e-12),
  };
  const w = {};
  for (const form of ['spectral', 'bands']) {
    w[form] = {
      t: worst(t, `${form}: T (relative)`, tol.t[form]),
      a: worst(t, `${form}: coefficients (abs, /u(a))`, tol.a[form]),
      cov: worst(t, `${form}: covariance (relative to sqrt(Cii Cjj))`, tol.cov[form]),
      cond: worst(t, `${form}: condition number (relative)`, tol.cond[form]),
      corr: worst(t, `${form}: corr(T, a1) (absolute)`, tol.corr[form]),
      inf: worst(t, `${form}: inflation (relative)`, tol.inf[form]),
      chi: worst(t, `${form}: chi2 (relative, or abs below 1e-20)`, tol.chi[form]),
      tb: worst(t, `${form}: brightness and two-colour T (relative)`, tol.tb[form]),
    };
  }
  for (const c of REF.multiwavelength) {
    const v = w[c.channels];
    const f = fitCase(c);
    const p = c.model.order + 2;
    v.t.see(rel(f.temperatureK, n(c.temperature_k)), c.name);
    const cov = c.covariance.map(ns);
    assert.equal(f.coefficients.length, p - 1);
    assert.equal(f.covariance.length, p);
    for (const row of f.covariance) assert.equal(row.length, p);
    for (let k = 0; k < p - 1; k++) {
      const scale = Math.max(Math.sqrt(cov[k + 1][k + 1]), 1e-3);
      v.a.see(Math.abs(f.coefficients[k] - n(c.coefficients[k])) / scale, c.name);
    }
    for (let i = 0; i < p; i++) {
      for (let j = 0; j < p; j++) {
        v.cov.see(Math.abs(f.covariance[i][j] - cov[i][j]) / Math.sqrt(cov[i][i] * cov[j][j]), c.name);
      }
    }
    close(f.uTemperatureK ** 2, f.covariance[0][0], 1e-15, 'uTemperatureK² = covariance[0][0]');
    v.cond.see(rel(f.conditionNumber, n(c.condition_number)), c.name);
    if (c.correlation_temperature_slope === null) assert.equal(f.correlationTemperatureSlope, undefined, c.name);
    else v.corr.see(Math.abs(f.correlationTemperatureSlope - n(c.correlation_temperature_slope)), c.name);
    v.inf.see(rel(f.uncertaintyInflation, n(c.uncertainty_inflation)), c.name);
    const chi = n(c.chi_squared);
    v.chi.see(chi < 1e-20 ? f.chiSquared : rel(f.chiSquared, chi), c.name);
    assert.equal(f.brightnessTemperaturesK.length, c.brightness_k.length);
    f.brightnessTemperaturesK.forEach((x, i) => v.tb.see(rel(x, n(c.brightness_k[i])), c.name));
    v.tb.see(rel(f.greyTwoColourTemperatureK, n(c.two_colour_k)), c.name);
    assert.equal(f.degreesOfFreedom, c.wavelengths_m.length - p);
    assert.deepEqual(f.model, c.model);
    f.free();
  }
  for (const form of Object.values(w)) for (const x of Object.values(form)) x.done();
});

test('an ill-conditioned fit is flagged and says why; never silently precise', () => {
  for (const c of REF.multiwavelength) {
    const f = fitCase(c);
    const corr = Math.abs(f.correlationTemperatureSlope ?? 0);
    const expect = f.conditionNumber > 1e3 || corr > 0.999 || f.localMinima > 1;
    assert.equal(f.illConditioned, expect, c.name);
    const why = f.warnings.filter((x) => x !== 'unphysicalEmissivity');
    assert.equal(why.length > 0, f.illConditioned, `${c.name}: ${f.warnings}`);
    assert.equal(f.warnings.includes('conditionNumber'), f.conditionNumber > 1e3, c.name);
    assert.equal(f.warnings.includes('correlation'), corr > 0.999, c.name);
    assert.equal(f.warnings.includes('unphysicalEmissivity'), !f.emissivityPhysical, c.name);
    if (c.model.order >= 3) {
      assert.ok(f.illConditioned && f.uncertaintyInflation > 100, c.name);
    }
    assert.equal(f.maxConditionNumber, 1e3);
    assert.equal(f.maxAbsCorrelation, 0.999);
    f.free();
  }
  // The case named ill-conditioned in the reference: flagged, with its large uncertainty.
  const bad = REF.multiwavelength.find((c) => c.name.startsWith('ill-conditioned'));
  const f = fitCase(bad);
  assert.equal(f.illConditioned, true);
  assert.ok(f.warnings.includes('conditionNumber'));
  assert.ok(f.uTemperatureK > 1, `u(T) = ${f.uTemperatureK} K`);
  // Looser thresholds clear the flag on the same data (the figures themselves do not change).
  const g = fitCase(bad, { maxConditionNumber: 1e12, maxAbsCorrelation: 1 });
  assert.equal(g.conditionNumber, f.conditionNumber);
  assert.equal(g.illConditioned, g.localMinima > 1);
  f.free();
  g.free();
});

test('the fit is the same in µm with radiances per µm; emissivity(λ) evaluates the model', () => {
  for (const c of REF.multiwavelength.filter((x) => x.channels === 'spectral')) {
    const m = fitCase(c);
    // the same data with wavelengths in µm and radiances per µm (× 1e-6)
    const u = qb.fitMultiwavelength(
      {
        wavelengths: c.wavelengths_m.map((x) => n(x) * 1e6),
        unit: 'um',
        radiances: c.radiances.map((x) => n(x) * 1e-6),
        uncertainties: c.uncertainties.map((x) => n(x) * 1e-6),
      },
      { model: c.model },
    );
    close(u.temperatureK, m.temperatureK, 1e-12, `${c.name}: T in µm`);
    assert.equal(u.unit, 'um');
    close(u.centreWavelength, m.centreWavelength * 1e6, 1e-14, 'centre');
    close(u.halfSpan, m.halfSpan * 1e6, 1e-14, 'half span');
    // ε(λ) from mpmath's coefficients in the reduced wavelength (the model's definition)
    const a = ns(c.coefficients);
    const lc = (n(c.wavelengths_m[0]) + n(c.wavelengths_m.at(-1))) / 2;
    const h = (n(c.wavelengths_m.at(-1)) - n(c.wavelengths_m[0])) / 2;
    const cov = c.covariance.map(ns);
    for (const lm of ns(c.wavelengths_m)) {
      const x = (lm - lc) / h;
      const s = a.reduce((acc, ak, k) => acc + ak * x ** k, 0);
      const want = c.model.kind === 'logPolynomial' ? Math.exp(s) : s;
      // coefficient differences are ≤ 1e-9 of u(a): so is ε, relative to its spread
      const ua = Math.sqrt(cov[1][1]);
      const got = u.emissivity(lm * 1e6);
      assert.ok(Math.abs(got - want) <= 1e-8 * Math.max(ua, 1e-3) * Math.max(1, Math.abs(want)), `${c.name}: ε(${lm}) = ${got}, want ${want}`);
      assert.ok(Math.abs(m.emissivity(lm) - got) <= 1e-8 * Math.max(ua, 1e-3) * Math.max(1, Math.abs(want)), `${c.name}: ε in m and µm`);
    }
    const wl = Float64Array.from(c.wavelengths_m, (x) => n(x) * 1e6);
    const bulk = u.emissivities(wl);
    wl.forEach((x, i) => assert.equal(bulk[i], u.emissivity(x)));
    const out = new Float64Array(wl.length);
    assert.equal(u.emissivities(wl, out), out);
    m.free();
    u.free();
  }
});

test('limits: a grey model returns the grey two-colour answer; ITS-90 c2 changes the temperature', () => {
  const grey = REF.multiwavelength.find((c) => c.name.startsWith('exact grey'));
  const f = fitCase(grey);
  close(f.temperatureK, f.greyTwoColourTemperatureK, 1e-12, 'grey fit = grey two-colour');
  close(f.emissivity(1e-6), n(grey.coefficients[0]), 1e-12, 'ε');
  assert.deepEqual([...f.warnings], []);
  assert.ok(f.brightnessTemperaturesK.every((tb) => tb < f.temperatureK), 'brightness readings are low for ε < 1');
  // JSON: every figure is an own property
  const json = JSON.parse(JSON.stringify(f));
  assert.equal(json.temperatureK, f.temperatureK);
  assert.deepEqual(json.covariance, f.covariance.map((r) => [...r]));
  assert.ok(Object.isFrozen(f) && Object.isFrozen(f.covariance) && Object.isFrozen(f.covariance[0]));
  // c2 = 0.014388 m·K (ITS-90) vs hc/k: 16 ppm apart, and so are grey temperatures
  const its = qb.fitMultiwavelength(
    { wavelengths: ns(grey.wavelengths_m), unit: 'm', radiances: ns(grey.radiances), uncertainties: ns(grey.uncertainties), c2: 'its90' },
    { model: grey.model },
  );
  const c2Ratio = 0.014388 / 1.438776877503933802e-2; // hc/k from SI 2019 exact h, c, k (mpmath)
  close(its.temperatureK / f.temperatureK, c2Ratio, 1e-9, 'T scales with c2 for a grey fit (Wien-like ratio)');
  f.free();
  its.free();
});

test('band channels: Instruments as given, the same as spectral points for single wavelengths', () => {
  const c = REF.multiwavelength.find((x) => x.channels === 'spectral' && x.model.kind === 'logPolynomial' && x.model.order === 1);
  const spectral = fitCase(c);
  const channels = c.wavelengths_m.map((w) => new qb.Instrument({ model: { kind: 'spectralPoint', wavelength: n(w), unit: 'm' } }));
  const bands = qb.fitMultiwavelength(
    { channels, wavelengths: ns(c.wavelengths_m), unit: 'm', signals: ns(c.radiances), uncertainties: ns(c.uncertainties) },
    { model: c.model },
  );
  close(bands.temperatureK, spectral.temperatureK, 1e-12, 'T');
  close(bands.uTemperatureK, spectral.uTemperatureK, 1e-9, 'u(T)');
  assert.deepEqual(bands.brightnessTemperaturesK, spectral.brightnessTemperaturesK);
  // the channels are the caller's: still usable
  assert.ok(channels[0].signal(1000) > 0);
  for (const ch of channels) ch.free();
  bands.free();
  spectral.free();
});

test('multi-wavelength errors: typed, with the caller\'s names; the module stays usable', () => {
  const wl = [0.7, 0.8, 0.9];
  const l = [1e9, 2e9, 3e9];
  const u = [1e6, 1e6, 1e6];
  const meas = { wavelengths: wl, unit: 'um', radiances: l, uncertainties: u };
  const fit = (m, o) => qb.fitMultiwavelength(m, o);
  throwsCode(() => fit(meas, { model: { kind: 'polynomial', order: 2 } }), 'TOO_FEW_POINTS');
  throwsCode(() => fit({ ...meas, radiances: [1e9, 2e9] }), 'LENGTH_MISMATCH');
  let e = throwsCode(() => fit({ ...meas, wavelengths: [0.7, 0.9, 0.8] }), 'NOT_INCREASING');
  assert.equal(e.message, 'measurement.wavelengths must be strictly increasing (element 2 is not larger than the one before)');
  e = throwsCode(() => fit({ ...meas, radiances: [1e9, -2, 3e9] }), 'NON_POSITIVE', 1);
  assert.equal(e.message, 'measurement.radiances must be > 0 (got -2) (at index 1)');
  e = throwsCode(() => fit({ ...meas, uncertainties: [1, 1, NaN] }), 'NON_FINITE', 2);
  assert.equal(e.message, 'measurement.uncertainties must be a finite number (got NaN) (at index 2)');
  e = throwsCode(() => fit({ ...meas, wavelengths: [0.7, 0, 0.9] }), 'NON_POSITIVE_SPECTRAL', 1);
  assert.equal(e.message, 'measurement.wavelengths must be > 0 (got 0) (at index 1)');
  e = throwsCode(() => fit(meas, { model: { kind: 'polynomial', order: 5 } }), 'OUT_OF_RANGE');
  assert.equal(e.message, 'options.model.order must lie in the integers 0 to 4 (got 5)');
  throwsCode(() => fit(meas, { model: { kind: 'polynomial', order: 0.5 } }), 'OUT_OF_RANGE');
  e = throwsCode(() => fit(meas, { maxAbsCorrelation: 1.5 }), 'OUT_OF_RANGE');
  assert.equal(e.message, 'options.maxAbsCorrelation must lie in (0, 1] (got 1.5)');
  e = throwsCode(() => fit(meas, { maxConditionNumber: 0 }), 'NON_POSITIVE');
  assert.equal(e.message, 'options.maxConditionNumber must be > 0 (got 0)');
  e = throwsCode(() => fit(meas, { model: { kind: 'cubic', order: 1 } }), 'UNSUPPORTED');
  assert.equal(e.message, 'options.model.kind must be one of "polynomial", "logPolynomial" (got "cubic")');
  e = throwsCode(() => fit(meas, { model: { kind: 'polynomial' } }), 'WRONG_TYPE');
  assert.equal(e.message, 'options.model.order is required (got undefined)');
  e = throwsCode(() => fit(meas, { modle: 1 }), 'UNSUPPORTED');
  assert.match(e.message, /^options: unknown field "modle" \(accepted fields: "model", /);
  e = throwsCode(() => fit({ ...meas, radiance: l }), 'UNSUPPORTED');
  assert.match(e.message, /^measurement: unknown field "radiance"/);
  e = throwsCode(() => fit({ ...meas, unit: 'cm-1' }), 'UNSUPPORTED');
  assert.match(e.message, /measurement\.unit must be a wavelength unit/);
  e = throwsCode(() => fit({ ...meas, unit: 'furlong' }), 'UNKNOWN_UNIT');
  assert.match(e.message, /^measurement\.unit: unknown unit "furlong"; expected a spectral unit/);
  e = throwsCode(() => fit({ ...meas, radiances: undefined }), 'WRONG_TYPE');
  assert.equal(e.message, 'measurement.radiances is required (got undefined)');
  e = throwsCode(() => fit({ ...meas, radiances: [1, 'x', 3] }), 'WRONG_TYPE');
  assert.match(e.message, /measurement\.radiances\[1\] must be a number/);
  throwsCode(() => fit({ ...meas, signals: l }), 'UNSUPPORTED');
  throwsCode(() => fit({ ...meas, c2: 'its91' }), 'UNSUPPORTED');
  throwsCode(() => fit(42), 'WRONG_TYPE');
  throwsCode(() => fit(meas, 'grey'), 'WRONG_TYPE');
  // band form
  const inst = wl.map((w) => new qb.Instrument({ model: { kind: 'spectralPoint', wavelength: w, unit: 'um' } }));
  const bands = { channels: inst, wavelengths: wl, unit: 'um', signals: l, uncertainties: u };
  assert.ok(fit(bands).temperatureK > 0);
  throwsCode(() => fit({ ...bands, radiances: l }), 'UNSUPPORTED');
  throwsCode(() => fit({ ...bands, c2: 'its90' }), 'UNSUPPORTED');
  e = throwsCode(() => fit({ ...bands, signals: undefined }), 'WRONG_TYPE');
  assert.equal(e.message, 'measurement.signals is required (got undefined)');
  e = throwsCode(() => fit({ ...bands, channels: [inst[0], { kind: 'spectralPoint' }, inst[2]] }), 'WRONG_TYPE');
  assert.match(e.message, /^measurement\.channels\[1\] must be an Instrument/);
  throwsCode(() => fit({ ...bands, channels: inst.slice(0, 2) }), 'LENGTH_MISMATCH');
  throwsCode(() => fit({ ...bands, channels: 'abc' }), 'WRONG_TYPE');
  const gone = new qb.Instrument({ model: { kind: 'spectralPoint', wavelength: 1, unit: 'um' } });
  gone.free();
  throwsCode(() => fit({ ...bands, channels: [inst[0], inst[1], gone] }), 'DISPOSED');
  // a band fit after a failed one uses only its own channels
  close(fit(bands).temperatureK, fit(meas).temperatureK, 1e-12, 'recovery');
  for (const i of inst) i.free();
  // a fit cannot be made with `new`
  throwsCode(() => new qb.MultiwavelengthFit(), 'UNSUPPORTED');
});

test('a numerically singular fit is a typed error, not a precise number', () => {
  // Exact grey data (ε = 0.5, 1500 K) at channels far too close together for the model.
  const sp = new qb.Spectrum({ unit: 'nm' });
  const fit = (wl, order) => {
    const l = wl.map((w) => 0.5 * sp.point(w, 1500));
    return qb.fitMultiwavelength({ wavelengths: wl, unit: 'nm', radiances: l, uncertainties: l.map((x) => x * 1e-3) }, { model: { kind: 'polynomial', order } });
  };
  // 1e-6 nm apart with a slope: T and the slope cannot be separated (condition > 1e13)
  const e = throwsCode(() => fit([1000, 1000.000001, 1000.000002], 1), 'DEGENERATE_FIT');
  assert.match(e.message, /^degenerate fit: temperature and emissivity coefficients cannot be separated/);
  // 0.1 nm apart with a quadratic: the least-squares iteration stalls (reported, not returned)
  throwsCode(() => fit([1000, 1000.1, 1000.2, 1000.3], 2), 'NOT_CONVERGED');
  // 1 nm apart with a slope: a result, flagged, its uncertainty enormous
  const f = fit([1000, 1001, 1002], 1);
  assert.equal(f.illConditioned, true);
  assert.ok(f.uTemperatureK > 1e4, `u(T) = ${f.uTemperatureK}`);
  f.free();
  sp.free();
});

// ---- Raman thermometry ---------------------------------------------------------------------

const DETECTION = { energy: 'energy', photonCounting: 'photonCounting' };

test('Raman ratio and temperature match mpmath (ratio equation and findroot)', (t) => {
  const wr = worst(t, 'Raman ratio (relative / max(1, theta/T))', 2e-15);
  for (const r of REF.raman) {
    const mode = new qb.RamanMode({ shiftPerCm: n(r[0]) / 100, excitation: n(r[1]), unit: 'm', detection: DETECTION[r[3]] });
    wr.see(rel(mode.ratio(n(r[2])), n(r[4])) / Math.max(1, n(r[5])), JSON.stringify(r));
    mode.free();
  }
  wr.done();
  const wt = worst(t, 'Raman temperature (relative / max(1, T/theta))', 1e-15);
  const wd = worst(t, 'Raman dT/dR (relative)', 1e-13);
  for (const r of REF.raman_inverse) {
    const mode = new qb.RamanMode({ shiftPerCm: n(r[0]) / 100, excitation: n(r[1]) * 1e9, unit: 'nm', detection: DETECTION[r[3]] });
    const rd = mode.temperature(n(r[2]));
    const amp = Math.max(1, rd.temperatureK / rd.modeTemperatureK);
    wt.see(rel(rd.temperatureK, n(r[4])) / amp, JSON.stringify(r));
    wd.see(rel(rd.dTdRatio, n(r[5])), JSON.stringify(r));
    assert.equal(rd.frequencyFactor, mode.frequencyFactor);
    // bulk forms agree with single calls
    const ts = mode.temperatures([n(r[2])]);
    assert.equal(ts[0], rd.temperatureK);
    assert.equal(mode.ratios(ts)[0], mode.ratio(rd.temperatureK));
    mode.free();
  }
  wt.done();
  wd.done();
});

test('Raman: detection factors, the excitation in any spectral unit, limits and errors', () => {
  // silicon's 520.7 cm⁻¹ phonon at 532 nm (Hart, Aggarwal & Lax 1970, from memory)
  const pc = new qb.RamanMode({ shiftPerCm: 520.7, excitation: 532, unit: 'nm' });
  const en = new qb.RamanMode({ shiftPerCm: 520.7, excitation: 532, unit: 'nm', detection: 'energy' });
  const nl = 1e7 / 532; // excitation wavenumber, cm⁻¹
  const q = (nl + 520.7) / (nl - 520.7);
  close(pc.frequencyFactor, q ** 3, 1e-15, 'photon counting: cube');
  close(en.frequencyFactor, q ** 4, 1e-15, 'energy: fourth power');
  close(en.ratio(300) / pc.ratio(300), q, 1e-15, 'the two differ by one factor ν_aS/ν_S');
  // the same laser line as a wavenumber and as a photon energy
  const wn = new qb.RamanMode({ shiftPerCm: 520.7, excitation: nl, unit: 'cm-1' });
  close(wn.ratio(300), pc.ratio(300), 1e-15, 'excitation in cm-1');
  // R → F as T → ∞ (and stays below it)
  assert.ok(pc.ratio(1e7) < pc.frequencyFactor && rel(pc.ratio(1e7), pc.frequencyFactor) < 1e-4);
  assert.equal(pc.ratio(1e-3), 0); // below the f64 range, returned as 0
  let e = throwsCode(() => new qb.RamanMode({ shiftPerCm: 20000, excitation: 532, unit: 'nm' }), 'OUT_OF_RANGE');
  assert.equal(e.message, 'mode.shiftPerCm must lie in (0, the excitation wavenumber in cm-1) (got 20000)');
  e = throwsCode(() => new qb.RamanMode({ shiftPerCm: -5, excitation: 532, unit: 'nm' }), 'NON_POSITIVE_SPECTRAL');
  assert.equal(e.message, 'mode.shiftPerCm must be > 0 (got -5)');
  e = throwsCode(() => new qb.RamanMode({ shiftPerCm: 520.7, excitation: 532, unit: 'nm', detection: 'ccd' }), 'UNSUPPORTED');
  assert.equal(e.message, 'mode.detection must be one of "photonCounting", "energy" (got "ccd")');
  e = throwsCode(() => new qb.RamanMode({ shiftPerCm: 520.7, unit: 'nm' }), 'WRONG_TYPE');
  assert.equal(e.message, 'mode.excitation is required (got undefined)');
  throwsCode(() => new qb.RamanMode({ shiftPerCm: 520.7, excitation: 532, unit: 'nm', laser: 1 }), 'UNSUPPORTED');
  e = throwsCode(() => pc.temperature(0), 'NON_POSITIVE');
  assert.equal(e.message, 'ratio must be > 0 (got 0)');
  throwsCode(() => pc.temperature(pc.frequencyFactor), 'OUT_OF_RANGE');
  e = throwsCode(() => pc.ratio(-1), 'NON_POSITIVE_TEMPERATURE');
  assert.equal(e.message, 'temperatureK must be > 0 K (got -1 K)');
  e = throwsCode(() => pc.ratios([300, 0, 400]), 'NON_POSITIVE_TEMPERATURE', 1);
  assert.equal(e.message, 'temperaturesK must be > 0 K (got 0 K) (at index 1)');
  throwsCode(() => pc.temperatures([0.1, -1]), 'NON_POSITIVE', 1);
  for (const m of [pc, en, wn]) m.free();
});

// ---- noise-source (Y-factor) thermometry -----------------------------------------------------

test('Y-factor receiver temperatures match the mpmath noise balance in all three conventions', (t) => {
  const w = worst(t, 'Y-factor receiver temperature (relative)', 1e-13);
  const wd = worst(t, 'Y-factor differences between conventions (relative)', 1e-12);
  const models = ['rayleighJeans', 'planck', 'callenWelton'];
  for (const r of REF.y_factor) {
    const [y, th, tc, f] = ns(r.slice(0, 4));
    const want = ns(r.slice(4, 7));
    models.forEach((loadModel, k) => {
      const loads = new qb.YFactorLoads({ hotLoadK: th, coldLoadK: tc, unit: 'Hz', loadModel });
      const rd = loads.receiverTemperature(y, f);
      const what = `${r} ${loadModel}`;
      assert.equal(rd.model, loadModel);
      w.see(rel(rd.receiverNoiseTemperatureK, want[k]), what);
      w.see(rel(rd.rayleighJeansK, want[0]), what);
      w.see(rel(rd.planckK, want[1]), what);
      w.see(rel(rd.callenWeltonK, want[2]), what);
      wd.see(rel(rd.planckMinusRayleighJeansK, n(r[7])), what);
      wd.see(rel(rd.callenWeltonMinusRayleighJeansK, n(r[8])), what);
      // and back: the Y factor this receiver shows
      close(loads.yFactor(rd.receiverNoiseTemperatureK, f), y, 1e-14, `${what}: Y`);
      loads.free();
    });
  }
  w.done();
  wd.done();
});

test('Y factor: units, the hf/2k identity, decibels, errors', () => {
  // Planck − Callen–Welton receiver temperature = hf/2k exactly (Kerr 1999); h/k from SI 2019
  // exact values: 4.799243073366221e-11 K/Hz.
  const ghz = new qb.YFactorLoads({ hotLoadK: 295, coldLoadK: 77, unit: 'GHz', loadModel: 'planck' });
  const hz = new qb.YFactorLoads({ hotLoadK: 295, coldLoadK: 77, unit: 'Hz', loadModel: 'planck' });
  const a = ghz.receiverTemperature(2.2, 230);
  const b = hz.receiverTemperature(2.2, 230e9);
  close(a.receiverNoiseTemperatureK, b.receiverNoiseTemperatureK, 1e-15, 'GHz = Hz');
  close(a.planckK - a.callenWeltonK, 0.5 * 4.799243073366221e-11 * 230e9, 1e-12, 'hf/2k');
  // the wavelength of 230 GHz (c/f) names the same frequency
  const mm = new qb.YFactorLoads({ hotLoadK: 295, coldLoadK: 77, unit: 'mm', loadModel: 'planck' });
  close(mm.receiverTemperature(2.2, 299792458 / 230e9 * 1e3).receiverNoiseTemperatureK, a.receiverNoiseTemperatureK, 1e-13, 'mm');
  // default convention: Callen–Welton
  const d = new qb.YFactorLoads({ hotLoadK: 295, coldLoadK: 77, unit: 'GHz' });
  assert.equal(d.receiverTemperature(2.2, 230).model, 'callenWelton');
  // Rayleigh–Jeans limit: hf/kT → 0 at 1 kHz, all three agree to ~1e-9 K
  const lo = new qb.YFactorLoads({ hotLoadK: 295, coldLoadK: 77, unit: 'kHz' });
  const r = lo.receiverTemperature(2.2, 1);
  assert.ok(Math.abs(r.planckK - r.rayleighJeansK) < 1e-7 && Math.abs(r.callenWeltonK - r.rayleighJeansK) < 1e-7);
  // decibels (mpmath 1.3.0, 30 digits)
  close(qb.decibelsToPowerRatio(3), 1.9952623149688796014, 1e-15, '3 dB');
  close(qb.decibelsToPowerRatio(1.76), 1.4996848355023734981, 1e-15, '1.76 dB');
  close(qb.decibelsToPowerRatio(-3), 0.501187233627272285, 1e-15, '-3 dB');
  close(qb.powerRatioToDecibels(2), 3.0102999566398119521, 1e-15, '2 in dB');
  close(qb.decibelsToPowerRatio(20), 100, 1e-15, '20 dB');
  close(qb.powerRatioToDecibels(1000), 30, 1e-15, '1000 in dB');
  close(d.receiverTemperature(qb.decibelsToPowerRatio(3.5), 230).receiverNoiseTemperatureK, d.receiverTemperature(10 ** 0.35, 230).receiverNoiseTemperatureK, 1e-14, 'Y from dB');
  let e = throwsCode(() => qb.decibelsToPowerRatio(NaN), 'NON_FINITE');
  assert.equal(e.message, 'decibels must be a finite number (got NaN)');
  throwsCode(() => qb.decibelsToPowerRatio(4000), 'OUT_OF_RANGE');
  e = throwsCode(() => qb.powerRatioToDecibels(0), 'NON_POSITIVE');
  assert.equal(e.message, 'ratio must be > 0 (got 0)');
  // errors
  e = throwsCode(() => d.receiverTemperature(1, 230), 'OUT_OF_RANGE');
  assert.equal(e.message, 'y must lie in (1, inf) (got 1)');
  throwsCode(() => d.receiverTemperature(10, 230), 'OUT_OF_RANGE'); // Y ≥ T_hot/T_cold
  e = throwsCode(() => d.receiverTemperature(2, 0), 'NON_POSITIVE_SPECTRAL');
  assert.equal(e.message, 'frequency must be > 0 (got 0)');
  e = throwsCode(() => d.yFactor(-1, 230), 'OUT_OF_RANGE');
  assert.match(e.message, /^receiverNoiseTemperatureK must lie in \[0, inf\)/);
  e = throwsCode(() => new qb.YFactorLoads({ hotLoadK: 77, coldLoadK: 295, unit: 'GHz' }), 'OUT_OF_RANGE');
  assert.equal(e.message, 'loads.hotLoadK must lie in (coldLoadK, inf) (got 77)');
  e = throwsCode(() => new qb.YFactorLoads({ hotLoadK: 295, coldLoadK: -4, unit: 'GHz' }), 'NON_POSITIVE_TEMPERATURE');
  assert.equal(e.message, 'loads.coldLoadK must be > 0 K (got -4 K)');
  e = throwsCode(() => new qb.YFactorLoads({ hotLoadK: 295, coldLoadK: 77, unit: 'GHz', loadModel: 'quantum' }), 'UNSUPPORTED');
  assert.equal(e.message, 'loads.loadModel must be one of "callenWelton", "planck", "rayleighJeans" (got "quantum")');
  throwsCode(() => new qb.YFactorLoads({ hotLoadK: 295, coldLoadK: 77 }), 'WRONG_TYPE');
  throwsCode(() => new qb.YFactorLoads({ hotLoadK: '295', coldLoadK: 77, unit: 'GHz' }), 'WRONG_TYPE');
  for (const x of [ghz, hz, mm, d, lo]) x.free();
});

// ---- semiconductor carrier statistics ------------------------------------------------------

test('semiconductor: N(T), Varshni gap, densities, intrinsic carriers and inverses match mpmath', (t) => {
  const wdos = worst(t, 'N_c(T) (relative)', 1e-15);
  for (const r of REF.dos) {
    const s = new qb.Semiconductor({ electronMassRatio: n(r[0]), holeMassRatio: n(r[0]), bandGap0K: 1, energyUnit: 'eV' });
    wdos.see(rel(s.conductionBandDensityOfStates(n(r[1])), n(r[2])), JSON.stringify(r));
    wdos.see(rel(s.valenceBandDensityOfStates(n(r[1])), n(r[2])), JSON.stringify(r));
    s.free();
  }
  wdos.done();
  // The Varshni table is in eV: here the conversions eV → J → eV add a few roundings.
  const wv = worst(t, 'Varshni E_g(T) in eV (relative)', 2e-15);
  for (const r of REF.varshni) {
    const s = new qb.Semiconductor({ electronMassRatio: 1, holeMassRatio: 1, bandGap0K: n(r[0]), varshniAlpha: n(r[1]), varshniBetaK: n(r[2]), energyUnit: 'eV' });
    wv.see(rel(s.bandGap(n(r[3])), n(r[4]) / EV), JSON.stringify(r));
    s.free();
  }
  wv.done();
  const wc = worst(t, 'N F_1/2(eta) vs mp.quad (relative)', 1e-14);
  const we = worst(t, 'Boltzmann relative error (relative)', 1e-13);
  for (const r of REF.carrier) {
    const c = qb.bandCarrierDensity(n(r[0]), n(r[1]));
    wc.see(rel(c.densityPerM3, n(r[2])), JSON.stringify(r));
    we.see(rel(c.boltzmannRelativeError, n(r[3])), JSON.stringify(r));
    assert.equal(c.reducedFermiLevel, n(r[1]));
  }
  wc.done();
  we.done();
  const material = (r) => new qb.Semiconductor({
    electronMassRatio: n(r[0]),
    holeMassRatio: n(r[1]),
    bandGap0K: n(r[2]),
    varshniAlpha: n(r[3]),
    varshniBetaK: n(r[4]),
    energyUnit: 'J',
  });
  const wf = worst(t, 'intrinsic E_F (relative)', 1e-13);
  const wn = worst(t, 'intrinsic n_i (relative)', 1e-13);
  const wb = worst(t, 'Boltzmann E_i and n_i (relative)', 1e-13);
  for (const r of REF.intrinsic) {
    const s = material(r);
    const i = s.intrinsic(n(r[5]));
    wf.see(rel(i.fermiLevel, n(r[6])), JSON.stringify(r));
    wn.see(rel(i.densityPerM3, n(r[7])), JSON.stringify(r));
    wb.see(rel(i.boltzmannFermiLevel, n(r[8])), JSON.stringify(r));
    wb.see(rel(i.boltzmannDensityPerM3, n(r[9])), JSON.stringify(r));
    assert.equal(s.intrinsicDensities([n(r[5])])[0], i.densityPerM3);
    s.free();
  }
  wf.done();
  wn.done();
  wb.done();
  const wi = worst(t, 'E_F from n (relative)', 1e-13);
  for (const r of REF.fermi_from_density) {
    const s = material(r);
    wi.see(rel(s.fermiLevelFromElectronDensity(n(r[6]), n(r[5])), n(r[7])), JSON.stringify(r));
    s.free();
  }
  wi.done();
});

test('semiconductor in eV: silicon-like handbook values, mass action, round trips, narrow gap', () => {
  // Silicon-like parameters (m_de = 1.08, m_dh = 0.81; Varshni 1.170 eV, 4.73e-4 eV/K, 636 K;
  // Sze & Ng 2007, from memory): E_g(300 K) ≈ 1.12 eV, N_c ≈ 2.8e19 cm⁻³, n_i ≈ 8e9 cm⁻³.
  const si = new qb.Semiconductor({ electronMassRatio: 1.08, holeMassRatio: 0.81, bandGap0K: 1.17, varshniAlpha: 4.73e-4, varshniBetaK: 636, energyUnit: 'eV' });
  assert.ok(Math.abs(si.bandGap(300) - 1.12) < 0.005);
  assert.ok(rel(si.conductionBandDensityOfStates(300) / 1e6, 2.8e19) < 0.01);
  const i = si.intrinsic(300);
  assert.ok(rel(i.densityPerM3, 8.0e15) < 0.05);
  assert.ok(rel(i.densityPerM3, i.boltzmannDensityPerM3) < 1e-8, 'non-degenerate: FD = Boltzmann');
  close(i.bandGap, si.bandGap(300), 1e-15, 'intrinsic.bandGap');
  // n·p = n_i² in the non-degenerate limit (mass-action law), Fermi level 0.3 eV above E_v
  const nn = si.electronDensity(0.3, 300);
  const pp = si.holeDensity(0.3, 300);
  close(nn.densityPerM3 * pp.densityPerM3, i.densityPerM3 ** 2, 1e-5, 'n·p = n_i²');
  // the inverses return the level
  close(si.fermiLevelFromElectronDensity(nn.densityPerM3, 300), 0.3, 1e-12, 'E_F from n');
  close(si.fermiLevelFromHoleDensity(pp.densityPerM3, 300), 0.3, 1e-12, 'E_F from p');
  // a Fermi level inside the valence band (negative, from E_v): holes degenerate, Boltzmann off
  const deg = si.holeDensity(-0.1, 300);
  assert.ok(deg.boltzmannRelativeError > 1 && deg.reducedFermiLevel > 3);
  close(si.fermiLevelFromHoleDensity(deg.densityPerM3, 300), -0.1, 1e-12, 'negative E_F round trip');
  // meV and J name the same material
  const mev = new qb.Semiconductor({ electronMassRatio: 1.08, holeMassRatio: 0.81, bandGap0K: 1170, varshniAlpha: 0.473, varshniBetaK: 636, energyUnit: 'meV' });
  close(mev.bandGap(300), si.bandGap(300) * 1000, 1e-14, 'meV');
  // a constant gap without Varshni parameters
  const flat = new qb.Semiconductor({ electronMassRatio: 1, holeMassRatio: 1, bandGap0K: 1.5, energyUnit: 'eV' });
  assert.equal(flat.bandGap(10), 1.5);
  assert.equal(flat.bandGap(1000), 1.5);
  // invented InSb-like narrow gap at 450 K: Boltzmann visibly overestimates n_i
  const narrow = new qb.Semiconductor({ electronMassRatio: 0.014, holeMassRatio: 0.43, bandGap0K: 0.2352, varshniAlpha: 6e-4, varshniBetaK: 500, energyUnit: 'eV' });
  const ni = narrow.intrinsic(450);
  assert.ok(ni.boltzmannDensityPerM3 > 1.3 * ni.densityPerM3);
  const ts = [200, 300, 400];
  const bulk = si.intrinsicDensities(ts);
  ts.forEach((tk, k) => assert.equal(bulk[k], si.intrinsic(tk).densityPerM3));
  // errors
  let e = throwsCode(() => new qb.Semiconductor({ electronMassRatio: 0, holeMassRatio: 0.81, bandGap0K: 1.17, energyUnit: 'eV' }), 'NON_POSITIVE');
  assert.equal(e.message, 'material.electronMassRatio must be > 0 (got 0)');
  e = throwsCode(() => new qb.Semiconductor({ electronMassRatio: 1, holeMassRatio: -1, bandGap0K: 1.17, energyUnit: 'eV' }), 'NON_POSITIVE');
  assert.equal(e.message, 'material.holeMassRatio must be > 0 (got -1)');
  e = throwsCode(() => new qb.Semiconductor({ electronMassRatio: 1, holeMassRatio: 1, bandGap0K: 1.17, varshniAlpha: -1e-4, varshniBetaK: 636, energyUnit: 'eV' }), 'OUT_OF_RANGE');
  assert.equal(e.message, 'material.varshniAlpha must lie in [0, inf) (got -0.0001)');
  e = throwsCode(() => new qb.Semiconductor({ electronMassRatio: 1, holeMassRatio: 1, bandGap0K: 1.17, varshniAlpha: 4.73e-4, energyUnit: 'eV' }), 'WRONG_TYPE');
  assert.equal(e.message, 'material.varshniBetaK is required with material.varshniAlpha (got undefined)');
  e = throwsCode(() => new qb.Semiconductor({ electronMassRatio: 1, holeMassRatio: 1, bandGap0K: 0, energyUnit: 'eV' }), 'NON_POSITIVE');
  assert.equal(e.message, 'material.bandGap0K must be > 0 (got 0)');
  e = throwsCode(() => new qb.Semiconductor({ electronMassRatio: 1, holeMassRatio: 1, bandGap0K: 1, energyUnit: 'nm' }), 'UNSUPPORTED');
  assert.match(e.message, /material\.energyUnit must be an energy unit/);
  throwsCode(() => new qb.Semiconductor({ electronMassRatio: 1, holeMassRatio: 1, bandGap0K: 1, energyUnit: 'eV', gap: 1 }), 'UNSUPPORTED');
  e = throwsCode(() => si.fermiLevelFromElectronDensity(0, 300), 'NON_POSITIVE');
  assert.equal(e.message, 'electronDensityPerM3 must be > 0 (got 0)');
  e = throwsCode(() => si.fermiLevelFromHoleDensity(-1, 300), 'NON_POSITIVE');
  assert.equal(e.message, 'holeDensityPerM3 must be > 0 (got -1)');
  e = throwsCode(() => si.intrinsic(-1), 'NON_POSITIVE_TEMPERATURE');
  assert.equal(e.message, 'temperatureK must be > 0 K (got -1 K)');
  throwsCode(() => si.intrinsic(5000), 'NO_SOLUTION'); // the Varshni gap is ≤ 0 there
  e = throwsCode(() => si.electronDensity(NaN, 300), 'NON_FINITE');
  assert.equal(e.message, 'fermiLevel must be a finite number (got NaN)');
  throwsCode(() => si.intrinsicDensities([300, -1]), 'NON_POSITIVE_TEMPERATURE', 1);
  e = throwsCode(() => qb.bandCarrierDensity(0, 1), 'NON_POSITIVE');
  assert.equal(e.message, 'effectiveDensityPerM3 must be > 0 (got 0)');
  for (const x of [si, mev, flat, narrow]) x.free();
});

// ---- lifecycle -------------------------------------------------------------------------------

test('lifecycle: free() and Symbol.dispose release every object; freed objects throw DISPOSED', () => {
  const live = () => qb.__testing.liveObjects();
  const base = live();
  const raman = new qb.RamanMode({ shiftPerCm: 520.7, excitation: 532, unit: 'nm' });
  const loads = new qb.YFactorLoads({ hotLoadK: 295, coldLoadK: 77, unit: 'GHz' });
  const si = new qb.Semiconductor({ electronMassRatio: 1.08, holeMassRatio: 0.81, bandGap0K: 1.17, energyUnit: 'eV' });
  const fit = qb.fitMultiwavelength({ wavelengths: [0.7, 0.8, 0.9], unit: 'um', radiances: [1, 2, 3], uncertainties: [0.01, 0.01, 0.01] });
  assert.equal(live(), base + 4);
  raman.free();
  loads[Symbol.dispose]();
  si.free();
  fit[Symbol.dispose]();
  assert.equal(live(), base);
  throwsCode(() => raman.ratio(300), 'DISPOSED');
  throwsCode(() => raman.temperatures([0.1]), 'DISPOSED');
  throwsCode(() => loads.receiverTemperature(2, 230), 'DISPOSED');
  throwsCode(() => si.bandGap(300), 'DISPOSED');
  throwsCode(() => fit.emissivity(0.8), 'DISPOSED');
  // what was read stays readable; a second free is harmless
  assert.equal(raman.frequencyFactor > 1, true);
  assert.ok(fit.temperatureK > 0);
  fit.free();
  raman.free();
  assert.equal(live(), base);
  // a failing constructor or fit leaves nothing behind
  assert.throws(() => qb.fitMultiwavelength({ wavelengths: [0.7, 0.8], unit: 'um', radiances: [1, 2], uncertainties: [1, 1] }, { model: { kind: 'polynomial', order: 1 } }));
  assert.throws(() => new qb.Semiconductor({ electronMassRatio: 0, holeMassRatio: 1, bandGap0K: 1, energyUnit: 'eV' }));
  assert.equal(live(), base);
});

// ---- the README example ------------------------------------------------------------------------

test('the numbers in the README example of this area (keep the two in sync)', () => {
  const planck = new qb.Spectrum({ unit: 'um' });
  const wavelengths = [0.7, 0.825, 0.95, 1.075, 1.2];
  const noise = [0.004, -0.003, 0.001, 0.005, -0.004];
  const radiances = wavelengths.map((w, i) => Math.exp(-0.6 - (0.3 * (w - 0.95)) / 0.25) * planck.point(w, 1400) * (1 + noise[i]));
  const measurement = { wavelengths, unit: 'um', radiances, uncertainties: radiances.map((l) => 0.005 * l) };
  const fit = qb.fitMultiwavelength(measurement, { model: { kind: 'logPolynomial', order: 1 } });
  const near = (x, want, digits) => assert.ok(Math.abs(x - want) <= 0.5 * 10 ** -digits, `${x} vs ${want}`);
  // the Rust README example of the same data (tests/quantum_limits.rs) checks 1399.92, 9.13, 0.987
  near(fit.temperatureK, 1399.92, 2);
  near(fit.uTemperatureK, 9.13, 2);
  near(fit.correlationTemperatureSlope, 0.987, 3);
  near(fit.uncertaintyInflation, 33, 0);
  assert.equal(fit.illConditioned, false);
  assert.deepEqual(fit.warnings, []);
  near(fit.greyTwoColourTemperatureK, 1554.6, 1);
  [1372.3, 1350.9, 1326.5, 1298.8, 1266.3].forEach((t, i) => near(fit.brightnessTemperaturesK[i], t, 1));
  near(fit.emissivity(1.0), 0.517, 3);
  const cubic = qb.fitMultiwavelength(measurement, { model: { kind: 'polynomial', order: 3 } });
  assert.equal(cubic.illConditioned, true);
  assert.deepEqual(cubic.warnings, ['conditionNumber', 'correlation', 'localMinima']);
  near(cubic.uTemperatureK, 1068, 0);
  near(cubic.temperatureK, 1700.7, 1);
  const silicon = new qb.RamanMode({ shiftPerCm: 520.7, excitation: 532, unit: 'nm' });
  near(silicon.ratio(300), 0.0972, 4);
  const rd = silicon.temperature(0.0972);
  near(rd.temperatureK, 300.0003, 4);
  near(rd.dTdRatio, 1236, 0);
  near(rd.phononOccupancy, 0.0897, 4);
  const loads = new qb.YFactorLoads({ hotLoadK: 295, coldLoadK: 77, unit: 'GHz' });
  const rx = loads.receiverTemperature(qb.decibelsToPowerRatio(3.2), 230);
  near(rx.receiverNoiseTemperatureK, 122.91, 2);
  near(rx.planckK, 128.43, 2);
  near(rx.planckK - rx.callenWeltonK, 5.52, 2);
  near(rx.rayleighJeansK, 123.13, 2);
  const si = new qb.Semiconductor({ electronMassRatio: 1.08, holeMassRatio: 0.81, bandGap0K: 1.17, varshniAlpha: 4.73e-4, varshniBetaK: 636, energyUnit: 'eV' });
  near(si.bandGap(300), 1.1245, 4);
  near(si.intrinsic(300).densityPerM3 / 1e15, 8.14, 2);
  const n = si.electronDensity(1.12, 300);
  near(n.densityPerM3 / 1e25, 1.87, 2);
  near(n.boltzmannRelativeError, 0.262, 3);
  near(si.fermiLevelFromElectronDensity(1e23, 300), 0.9787, 4);
  for (const o of [planck, fit, cubic, silicon, loads, si]) o.free();
});
