// Unit conversions through the wasm package. Reference values are definitions: BIPM SI Brochure
// 9th ed. (2019) §2.3.1 and Table 7; NIST SP 811 (2008) App. B.8/B.9; CODATA 2018 exact h, c, e
// (Tiesinga et al., Rev. Mod. Phys. 93, 025010 (2021)).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { qb, close, throwsCode } from './helpers.mjs';

test('spectral conversions match SI and CODATA 2018 definitions', () => {
  assert.equal(qb.convertSpectral(10, 'um', 'cm-1'), 1000); // wavenumber definition
  assert.equal(qb.convertSpectral(500, 'nm', 'µm'), 0.5); // SI prefixes
  assert.equal(qb.convertSpectral(500, 'nm', 'μm'), 0.5); // Greek mu spelling
  close(qb.convertSpectral(1, 'um', 'THz'), 299.792458, 1e-15, 'c exact (SI 2019)');
  close(qb.convertSpectral(1, 'eV', 'nm'), 1239.8419843320026, 1e-15, 'CODATA 2018 hc/e');
  close(qb.convertSpectral(1, 'eV', 'Hz'), 2.417989242084918e14, 1e-15, 'CODATA 2018 eV-Hz');
  close(qb.convertSpectral(1, 'eV', 'm-1'), 8.065543937349212e5, 1e-15, 'CODATA 2018 eV-m^-1');
  close(qb.convertSpectral(1, 'meV', 'J'), 1.602176634e-22, 1e-15, 'e exact (SI 2019)');
  close(qb.convertSpectral(1, 'GHz', 'cm⁻¹'), 0.0333564095198152, 1e-15, '1/c');
  assert.equal(qb.spectralUnitKind('cm^-1'), 'wavenumber');
  assert.equal(qb.spectralUnitKind('meV'), 'photonEnergy');
  assert.equal(qb.spectralUnitKind('micron'), 'wavelength');
  assert.equal(qb.spectralUnitKind('kHz'), 'frequency');
});

test('spectral array conversion is elementwise and reports the first bad index', () => {
  const out = qb.convertSpectralArray(new Float64Array([1, 2, 4, 10]), 'um', 'cm-1');
  assert.ok(out instanceof Float64Array);
  assert.deepEqual(Array.from(out), [10000, 5000, 2500, 1000]);
  throwsCode(() => qb.convertSpectralArray(new Float64Array([1, 2, 0, -1]), 'um', 'nm'), 'NON_POSITIVE_SPECTRAL', 2);
  throwsCode(() => qb.convertSpectralArray(new Float64Array([1, NaN]), 'um', 'nm'), 'NON_FINITE', 1);
  assert.equal(qb.convertSpectralArray(new Float64Array(0), 'um', 'nm').length, 0);
});

test('absolute temperatures and differences are separate', () => {
  assert.equal(qb.convertTemperature(0, 'degC', 'K'), 273.15); // SI Brochure §2.3.1
  close(qb.convertTemperature(212, '°F', 'K'), 373.15, 1e-15, 'NIST SP 811 B.8');
  close(qb.convertTemperature(-40, 'F', 'C'), -40, 1e-13, 'NIST SP 811 B.8');
  close(qb.convertTemperature(491.67, 'degR', 'K'), 273.15, 1e-15, 'NIST SP 811 B.9');
  close(qb.convertTemperature(300, 'K', '℃'), 26.85, 1e-13, 'SI Brochure §2.3.1');
  assert.equal(qb.convertTemperatureDifference(9, 'degF', 'K'), 5);
  assert.equal(qb.convertTemperatureDifference(10, 'degC', 'K'), 10);
  assert.equal(qb.convertTemperatureDifference(-3, 'K', 'degC'), -3);
  const arr = qb.convertTemperatureArray(new Float64Array([0, 100, 1000]), 'degC', 'K');
  assert.deepEqual(Array.from(arr), [273.15, 373.15, 1273.15]);
});

test('bad units and impossible temperatures throw QuantabandError', () => {
  throwsCode(() => qb.convertSpectral(1, 'furlong', 'nm'), 'UNKNOWN_UNIT');
  throwsCode(() => qb.convertSpectral(1, 'nm', 'NM'), 'UNKNOWN_UNIT');
  throwsCode(() => qb.spectralUnitKind('mhz'), 'UNKNOWN_UNIT');
  throwsCode(() => qb.convertTemperature(1, 'kelvin', 'K'), 'UNKNOWN_UNIT');
  throwsCode(() => qb.convertSpectral(-1, 'nm', 'um'), 'NON_POSITIVE_SPECTRAL');
  throwsCode(() => qb.convertSpectral(Infinity, 'nm', 'um'), 'NON_FINITE');
  throwsCode(() => qb.convertTemperature(-273.15, 'degC', 'K'), 'NON_POSITIVE_TEMPERATURE');
  throwsCode(() => qb.convertTemperature(-500, 'degF', 'degC'), 'NON_POSITIVE_TEMPERATURE');
  throwsCode(() => qb.convertTemperatureArray(new Float64Array([300, 0]), 'K', 'degC'), 'NON_POSITIVE_TEMPERATURE', 1);
  throwsCode(() => qb.convertTemperatureDifference(NaN, 'K', 'degF'), 'NON_FINITE');
  // a conversion whose result leaves the f64 range reports the value given
  assert.match(throwsCode(() => qb.convertSpectral(1e-320, 'um', 'Hz'), 'OUT_OF_RANGE').message, /\(got 1e-320\)$/);
  // no coercion of strings, booleans or null into numbers
  throwsCode(() => qb.convertTemperature('25', 'degC', 'K'), 'WRONG_TYPE');
  throwsCode(() => qb.convertTemperature(25, 5, 'K'), 'WRONG_TYPE');
  throwsCode(() => qb.convertSpectralArray('123', 'um', 'nm'), 'WRONG_TYPE');
  throwsCode(() => qb.convertSpectralArray(5, 'um', 'nm'), 'WRONG_TYPE');
});

test('a million-element conversion in one call', () => {
  const n = 1_000_000;
  const xs = new Float64Array(n);
  for (let i = 0; i < n; i++) xs[i] = 0.2 + i * 1e-5; // 0.2 … 10.2 µm
  const ys = qb.convertSpectralArray(xs, 'um', 'cm-1');
  assert.equal(ys.length, n);
  for (const i of [0, 1, 4321, n - 1]) close(ys[i], 1e4 / xs[i], 1e-15, `element ${i}`);
});

test('constants are CODATA 2018 / ITS-90 values', () => {
  const c = qb.constants();
  assert.equal(c.planckH, 6.62607015e-34); // exact, SI 2019
  assert.equal(c.speedOfLightC, 299792458);
  assert.equal(c.boltzmannK, 1.380649e-23);
  assert.equal(c.c2Its90, 0.014388); // ITS-90 (Preston-Thomas 1990)
  close(c.c2, 1.438776877e-2, 1e-9, 'CODATA 2018 c2 (NIST table)');
  close(c.stefanBoltzmannSigma, 5.670374419e-8, 1e-9, 'CODATA 2018 sigma (NIST table)');
  close(c.wienB, 2.897771955e-3, 1e-9, 'CODATA 2018 b (NIST table)');
  assert.ok(Object.isFrozen(c));
});

test('error class contract', () => {
  // the one list: the core's codes (Rust Error::ALL_CODES, in order) then the boundary codes
  assert.deepEqual([...qb.ERROR_CODES], [
    ...qb.__testing.coreCodes(),
    'WRONG_TYPE',
    'DETACHED_BUFFER',
    'DISPOSED',
    'NOT_INITIALIZED',
  ]);
  assert.ok(Object.isFrozen(qb.ERROR_CODES));
  assert.equal(new Set(qb.ERROR_CODES).size, qb.ERROR_CODES.length);
  const e = throwsCode(() => qb.convertSpectral(0, 'nm', 'um'), 'NON_POSITIVE_SPECTRAL');
  assert.ok(qb.ERROR_CODES.includes(e.code));
  assert.equal(e.index, undefined);
  assert.match(e.message, /> 0/); // the message states the bound
  assert.ok(typeof e.stack === 'string');
});
