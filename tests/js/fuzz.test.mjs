// Seeded, time-bounded fuzz of the whole public API: every free function, every constructor and
// static factory, every method of live (and freed) prepared objects, called with arguments of
// every kind a caller can produce: numbers at the edges of the f64 range, NaN/±∞, strings,
// bigints, symbols, null/undefined, booleans, plain arrays, typed arrays of every type (also
// detached ones and ones whose `length` lies), array-likes with absurd lengths, Proxies (with
// throwing traps, revoked), objects with throwing or re-entrant getters, configurations near the
// valid ones. Allowed outcomes: a result (never a NaN returned as a success) or a
// QuantabandError with a listed code. After EVERY call a known-good call must return its exact
// value, and at the end memory, the externref table and the live-object count are checked.
//
// QB_FUZZ_SEED=N and QB_FUZZ_SECONDS=S override the seed (default fixed) and the time bound
// (default 12 s, at most 60 000 calls).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { qb } from './helpers.mjs';

const SEED = Number(process.env.QB_FUZZ_SEED ?? 20261203);
const SECONDS = Number(process.env.QB_FUZZ_SECONDS ?? 12);
const MAX_CALLS = 60_000;

test(`fuzz: seeded random calls of every function and method (seed ${SEED}, ≤ ${SECONDS} s)`, (t) => {
  let seed = SEED >>> 0;
  const rnd = () => {
    // xorshift32
    seed ^= seed << 13;
    seed >>>= 0;
    seed ^= seed >>> 17;
    seed ^= seed << 5;
    seed >>>= 0;
    return seed / 2 ** 32;
  };
  const pick = (a) => a[Math.floor(rnd() * a.length)];

  const ref = new qb.Spectrum({ unit: 'um' });
  const mcInstrument = new qb.Instrument({ model: { kind: 'spectralPoint', wavelength: 10, unit: 'um' }, conditions: { emissivity: 0.9, reflectedTemperatureK: 300 } });
  const KNOWN = ref.point(10, 300);
  const KNOWN_FD = qb.fermiDirac(2);

  const nums = [0, -0, 1, -1, 300, 1e-320, 5e-324, 1e308, -1e308, NaN, Infinity, -Infinity, 0.5, 1.5, 2.5, 1e9, 1e-9, 650, 10, 8, 14, 2 ** 31, 1e5, 1e-3];
  const strs = ['um', 'nm', 'K', 'degC', 'eV', 'cm-1', 'Hz', 'gold', 'energy', 'float64', 'float32', '', 'µm', 'its90', 'x'.repeat(200)];
  const models = [
    { kind: 'spectralPoint', wavelength: 10, unit: 'um' },
    { kind: 'response', wavelengths: [8, 14], values: [1, 1], unit: 'um' },
    { kind: 'sakumaHattori', aM: 1e-5, bMK: 1.8e-4, c: 1e6 },
    { kind: 'sakumaHattori', aM: 1e-5, bMK: -1, c: 1e6 },
    { kind: 'response', wavelengths: [1e-300, 1e300], values: [1, 1], unit: 'm' },
    { kind: 'response', wavelengths: new Float32Array([3, 5]), values: [1, 0], unit: 'um' },
  ];
  // pixel designs (DetectorDesign): valid ones and near misses
  const det = { pixelAreaM2: 2.25e-10, conversion: { kind: 'quantumEfficiency', efficiency: 0.7 }, integrationTimeS: 1e-3, fullWellElectrons: 1e7, darkCurrentA: 1e-12, readNoiseElectrons: 100 };
  const designs = [
    { optics: { fNumber: 2, transmittance: 0.9 }, detector: det, scene: { kind: 'band', lower: 3.7, upper: 4.8, unit: 'um' } },
    { optics: { fNumber: 1, transmittance: 1, cone: 'smallAngle', fieldAngleRad: 0.3 }, detector: { ...det, conversion: { kind: 'responsivity', amperesPerWatt: 3 } }, scene: { kind: 'band', lower: 700, upper: 1400, unit: 'cm-1', emissivity: 0.5 } },
    { optics: { fNumber: 2, transmittance: 0.9 }, detector: { ...det, conversion: { kind: 'included' } }, scene: { kind: 'model', model: models[1], radianceKind: 'current' }, backgroundElectronsPerS: 1e6 },
    { optics: { fNumber: 1e-300, transmittance: 1 }, detector: { ...det, pixelAreaM2: 1e300, fullWellElectrons: 5e-324 }, scene: { kind: 'band', lower: 1e-300, upper: 1e300, unit: 'm' } },
    { optics: { fNumber: 2, transmittance: 0.9 }, detector: det, scene: { kind: 'band', lower: 5, upper: 3, unit: 'um' } },
    { optics: { fNumber: 2 }, detector: det, scene: { kind: 'model', model: models[3], radianceKind: 'photon' } },
  ];
  const grow = () => ref.points(new Float64Array(50_000).fill(10), 300)[0];
  const weird = () => {
    const k = Math.floor(rnd() * 12);
    switch (k) {
      case 0: {
        const a = new Float64Array(3);
        structuredClone(a.buffer, { transfer: [a.buffer] });
        return a;
      }
      case 1: {
        const a = new Float32Array([pick(nums), pick(nums)]);
        Object.defineProperty(a, 'length', { value: pick([0, 1, 1e9, -1]) });
        return a;
      }
      case 2:
        return { length: pick([-1, 2 ** 31, 1.5, NaN, '2', 3]), 0: 1, 1: 2, 2: 3 };
      case 3:
        return new Proxy({}, { get() { throw new Error('trap'); }, ownKeys() { throw new Error('trap'); } });
      case 4: {
        const { proxy, revoke } = Proxy.revocable({ unit: 'um' }, {});
        revoke();
        return proxy;
      }
      case 5:
        return { unit: 'um', get emissivity() { throw new Error('getter'); } };
      case 6:
        return { unit: 'um', get emissivity() { grow(); return 0.5; } };
      case 7:
        return { length: 2, get 0() { grow(); return 10; }, 1: 11 };
      case 8:
        return new BigInt64Array(2);
      case 9:
        return pick([10n, Symbol('s'), () => 1, new Date(0), new Map()]);
      case 10:
        return Object.create({ unit: 'um' });
      default:
        return [pick(nums), pick(strs)];
    }
  };
  const pool = { spectra: [], instruments: [], curves: [], raman: [], loads: [], semis: [], fits: [], designs: [], monteCarlo: [], spectral: [] };
  // configurations of the quantum area (src/wasm/js/quantum.js), valid and near-valid
  const quantum = [
    { shiftPerCm: 520.7, excitation: 532, unit: 'nm', detection: 'energy' },
    { shiftPerCm: 520.7, excitation: 0.5, unit: 'eV' },
    { hotLoadK: 295, coldLoadK: 77, unit: 'GHz', loadModel: 'planck' },
    { hotLoadK: 77, coldLoadK: 295, unit: 'Hz' },
    { electronMassRatio: 1.08, holeMassRatio: 0.81, bandGap0K: 1.17, varshniAlpha: 4.73e-4, varshniBetaK: 636, energyUnit: 'eV' },
    { electronMassRatio: 0.014, holeMassRatio: 0.43, bandGap0K: 235, energyUnit: 'meV' },
    { wavelengths: [0.7, 0.8, 0.9, 1.0], unit: 'um', radiances: [1e9, 2e9, 3e9, 3.5e9], uncertainties: [1e6, 1e6, 1e6, 1e6] },
    { wavelengths: [1000, 1000.1, 1000.2, 1000.3], unit: 'nm', radiances: [1, 1, 1, 1], uncertainties: [1e-3, 1e-3, 1e-3, 1e-3] },
    { model: { kind: 'logPolynomial', order: 1 }, maxConditionNumber: 10 },
    { model: { kind: 'polynomial', order: 4 } },
  ];
  // spectral-table definitions (src/wasm/js/spectral.js), valid and near-valid, and text tables
  const flat = { wavelengths: [8, 14], values: [1, 1], unit: 'um' };
  const spectral = [
    { response: flat },
    { response: { ...flat, quantity: 'photon' }, conditions: { emissivity: { wavelengths: [8, 10, 14], values: [0.9, 0.5, 0.7], unit: 'um' }, reflectedTemperatureK: 295, pathTransmittance: 0.9, pathTemperatureK: 290, window: { transmittance: { wavelengths: [7, 15], values: [0.8, 0.9], unit: 'um' }, reflectance: 0.05, temperatureK: 300, reflectedTemperatureK: 301 } } },
    { response: flat, conditions: { emissivity: { wavelengths: [9, 14], values: [0.5, 0.5], unit: 'um', ends: 'constant' }, reflectedTemperatureK: 295 } },
    { response: flat, conditions: { emissivity: { wavelengths: [9, 14], values: [0.5, 0.5], unit: 'um' }, reflectedTemperatureK: 295 } },
    { response: flat, conditions: { emissivity: { wavelengths: [8, 14], values: [0.5, NaN], unit: 'um' }, reflectedTemperatureK: 295 } },
    { response: { wavelengths: [0.1, 1000], values: [1, 1], unit: 'um' } },
    { response: { ...flat, unit: 'cm-1' } },
  ];
  const texts = ['8, 0.9\n14, 0.8', '# x\n1000;0.5\n2000;0.6', '8 0.9\n9 x', '', '\ufeff1e0\t0\n2\t1\n', '8,0.9,1\n'];
  const arg = () => {
    const r = rnd();
    if (r < 0.3) return pick(nums);
    if (r < 0.4) return pick(strs);
    if (r < 0.48) return { unit: pick(strs), emissivity: pick(nums), variable: pick(['wavelength', 'frequency', 'x']) };
    if (r < 0.55) return pick(models);
    if (r < 0.6) return rnd() < 0.8 ? { model: pick(models), conditions: { emissivity: pick(nums), reflectedTemperatureK: pick(nums) } } : pick(designs);
    if (r < 0.68) return new Float64Array(Array.from({ length: Math.floor(rnd() * 6) }, () => pick(nums)));
    if (r < 0.71) return new Uint16Array([0, 2, 65535]);
    if (r < 0.75) return { emissivity: pick(nums), reflectedTemperatureK: pick(nums), pathTransmittance: pick(nums), pathTemperatureK: pick(nums) };
    if (r < 0.78) return { gain: pick(nums), output: pick(strs), emissivity: pick([undefined, new Float32Array(3)]) };
    if (r < 0.79) return pick(pool.instruments) ?? null;
    if (r < 0.8) return pick([{ signal: pick(nums), emissivity: { standardUncertainty: pick(nums), degreesOfFreedom: pick(nums), distribution: pick(['normal', 'studentT', 'x']) } }, { correlations: [{ inputs: ['signal', pick(strs)], coefficient: pick(nums) }], coverageFactor: pick(nums) }, { correlation: [[1, pick(nums)], [pick(nums), 1]], trials: pick(nums), seed: pick(nums) }, [pick(nums), { standardUncertainty: pick(nums) }], ['zinc', pick(['aluminium', 'gold', 'lead']), 'copper']]);
    if (r < 0.81) return pick(quantum);
    if (r < 0.815) return rnd() < 0.5 ? pick(spectral) : pick(texts);
    if (r < 0.82) return { channels: pool.instruments.slice(0, 3), wavelengths: [8, 10, 12], unit: 'um', signals: [1, 2, 3], uncertainties: [0.1, 0.1, 0.1] };
    if (r < 0.83) return null;
    if (r < 0.86) return undefined;
    if (r < 0.88) return pick([true, false]);
    return weird();
  };

  const CLASSES = new Set(['Spectrum', 'Instrument', 'CalibrationCurve', 'DetectorDesign', 'QuantabandError', 'MultiwavelengthFit', 'RamanMode', 'YFactorLoads', 'Semiconductor', 'fitMultiwavelength', 'MonteCarlo', 'SpectralInstrument']);
  const fns = Object.entries(qb).filter(([k, v]) => typeof v === 'function' && !CLASSES.has(k) && !['default', 'init', 'initSync'].includes(k));
  const methods = (cls) => Object.entries(Object.getOwnPropertyDescriptors(cls.prototype)).filter(([m, d]) => m !== 'constructor' && m !== 'free' && typeof d.value === 'function').map(([m]) => m);
  const targets = [
    ...fns.map(([name, f]) => ({ name, call: (args) => f(...args), arity: f.length })),
    { name: 'new Spectrum', call: (a) => pool.spectra.push(new qb.Spectrum(a[0])), arity: 1 },
    { name: 'new Instrument', call: (a) => pool.instruments.push(new qb.Instrument(a[0])), arity: 1 },
    { name: 'new CalibrationCurve', call: (a) => pool.curves.push(new qb.CalibrationCurve(a[0])), arity: 1 },
    { name: 'CalibrationCurve.fit', call: (a) => pool.curves.push(qb.CalibrationCurve.fit(a[0], a[1], a[2])), arity: 3 },
    { name: 'CalibrationCurve.fitInstrument', call: (a) => pool.curves.push(qb.CalibrationCurve.fitInstrument(a[0], a[1], a[2], a[3])), arity: 4 },
    { name: 'CalibrationCurve.fromResponse', call: (a) => pool.curves.push(qb.CalibrationCurve.fromResponse(a[0], a[1])), arity: 2 },
    { name: 'new RamanMode', call: (a) => pool.raman.push(new qb.RamanMode(a[0])), arity: 1 },
    { name: 'new YFactorLoads', call: (a) => pool.loads.push(new qb.YFactorLoads(a[0])), arity: 1 },
    { name: 'new Semiconductor', call: (a) => pool.semis.push(new qb.Semiconductor(a[0])), arity: 1 },
    { name: 'fitMultiwavelength', call: (a) => pool.fits.push(qb.fitMultiwavelength(a[0], a[1])), arity: 2 },
    { name: 'new MultiwavelengthFit', call: (a) => new qb.MultiwavelengthFit(a[0], a[1]), arity: 2 },
    { name: 'new DetectorDesign', call: (a) => pool.designs.push(new qb.DetectorDesign(rnd() < 0.6 ? pick(designs) : a[0])), arity: 1 },
    { name: 'CalibrationCurve.throughFixedPoints', call: (a) => pool.curves.push(qb.CalibrationCurve.throughFixedPoints(a[0], a[1], a[2])), arity: 3 },
    { name: 'new MonteCarlo', call: () => new qb.MonteCarlo(), arity: 0 },
    // any instrument with a small fixed count (a response model costs ~1e3 times more per
    // trial), or any options with a cheap spectral-point instrument
    { name: 'MonteCarlo.measurement', call: (a) => pool.monteCarlo.push(qb.MonteCarlo.measurement(a[0], a[1], a[2], { trials: 200 })), arity: 3 },
    { name: 'MonteCarlo.measurement options', call: (a) => pool.monteCarlo.push(qb.MonteCarlo.measurement(mcInstrument, a[0], a[1], a[2])), arity: 3 },
    { name: 'MonteCarlo.linear', call: (a) => pool.monteCarlo.push(qb.MonteCarlo.linear(a[0], a[1], a[2])), arity: 3 },
    { name: 'new SpectralInstrument', call: (a) => pool.spectral.push(new qb.SpectralInstrument(rnd() < 0.6 ? pick(spectral) : a[0])), arity: 1 },
    { name: 'SpectralInstrument.tableFromText', call: (a) => qb.SpectralInstrument.tableFromText(rnd() < 0.6 ? pick(texts) : a[0], rnd() < 0.6 ? pick(['um', 'cm-1', 'nm']) : a[1], rnd() < 0.6 ? pick(['emissivity', 'transmittance', 'response']) : a[2]), arity: 3 },
    // the workflows with any instrument from the pools (valid ones most of the time)
    { name: 'correctReading pools', call: (a) => qb.correctReading(pick([...pool.instruments, ...pool.spectral]), a[0], rnd() < 0.5 ? { emissivity: 0.9, reflectedTemperatureK: 293 } : a[1]), arity: 2 },
  ];
  for (const [kind, cls] of [['spectra', qb.Spectrum], ['instruments', qb.Instrument], ['curves', qb.CalibrationCurve], ['raman', qb.RamanMode], ['loads', qb.YFactorLoads], ['semis', qb.Semiconductor], ['fits', qb.MultiwavelengthFit], ['designs', qb.DetectorDesign], ['monteCarlo', qb.MonteCarlo], ['spectral', qb.SpectralInstrument]]) {
    for (const m of methods(cls)) {
      targets.push({
        name: `${cls.name}.${m}`,
        call: (a) => {
          const o = pick(pool[kind]);
          if (o === undefined) return undefined;
          return o[m](...a);
        },
        arity: Object.getOwnPropertyDescriptor(cls.prototype, m).value.length + 2,
      });
    }
  }
  // seed the pools with valid objects
  pool.spectra.push(new qb.Spectrum({ unit: 'um' }), new qb.Spectrum({ unit: 'cm-1', quantity: 'photon' }));
  pool.instruments.push(new qb.Instrument({ model: models[1] }), new qb.Instrument({ model: models[0], conditions: { emissivity: 0.9, reflectedTemperatureK: 300 } }));
  pool.curves.push(new qb.CalibrationCurve({ aM: 1e-5, bMK: 1.8e-4, c: 1e6 }), qb.CalibrationCurve.fit([500, 800, 1200], [1, 20, 200], { uTemperaturesK: 0.05 }));
  pool.monteCarlo.push(
    qb.MonteCarlo.linear([1, 2], [1, { standardUncertainty: 0.5, distribution: 'triangular' }], { trials: 3000 }),
    qb.MonteCarlo.measurement(pool.instruments[1], 2e7, { signal: 1e5, emissivity: 0.01 }, { trials: 3000 }),
  );
  pool.raman.push(new qb.RamanMode(quantum[0]));
  pool.loads.push(new qb.YFactorLoads(quantum[2]));
  pool.semis.push(new qb.Semiconductor(quantum[4]));
  pool.fits.push(qb.fitMultiwavelength(quantum[6], quantum[8]));
  pool.designs.push(new qb.DetectorDesign(designs[0]), new qb.DetectorDesign(designs[2]));
  pool.spectral.push(new qb.SpectralInstrument(spectral[0]), new qb.SpectralInstrument(spectral[1]));
  // and one freed object of each class (its calls must be DISPOSED)
  for (const [k, make] of [
    ['spectra', () => new qb.Spectrum({ unit: 'nm' })],
    ['instruments', () => new qb.Instrument({ model: models[2] })],
    ['curves', () => new qb.CalibrationCurve({ aM: 1, bMK: 0, c: 1 })],
    ['raman', () => new qb.RamanMode(quantum[1])],
    ['loads', () => new qb.YFactorLoads(quantum[2])],
    ['semis', () => new qb.Semiconductor(quantum[5])],
    ['fits', () => qb.fitMultiwavelength(quantum[6])],
    ['designs', () => new qb.DetectorDesign(designs[1])],
    ['monteCarlo', () => qb.MonteCarlo.linear([1], [1], { trials: 10 })],
    ['spectral', () => new qb.SpectralInstrument(spectral[2])],
  ]) {
    const o = make();
    o.free();
    pool[k].push(o);
  }

  const before = { table: qb.__testing.tableSize() };
  const outcomes = { result: 0, quantabandError: 0 };
  const codes = {};
  const deadline = Date.now() + SECONDS * 1000;
  let calls = 0;
  for (; calls < MAX_CALLS && Date.now() < deadline; calls++) {
    const tgt = pick(targets);
    // mostly well-typed numbers in the arity of the target, sometimes anything in any number
    const n = rnd() < 0.7 ? tgt.arity - (tgt.name.includes('.') ? 2 : 0) : Math.floor(rnd() * (tgt.arity + 2));
    const args = Array.from({ length: Math.max(0, n) }, () => (rnd() < 0.85 ? pick(nums) : arg()));
    let result;
    try {
      result = tgt.call(args);
      outcomes.result++;
    } catch (e) {
      if (!(e instanceof qb.QuantabandError)) {
        assert.fail(`call ${calls}: ${tgt.name}(${args.map((x) => { try { return String(x); } catch { return typeof x; } }).join(', ')}) threw ${e && e.constructor && e.constructor.name}: ${e && e.message}`);
      }
      assert.ok(qb.ERROR_CODES.includes(e.code), e.code);
      codes[e.code] = (codes[e.code] ?? 0) + 1;
      outcomes.quantabandError++;
    }
    if (typeof result === 'number') assert.ok(!Number.isNaN(result), `${tgt.name} returned NaN as a success`);
    // the known-good calls after every call: exact values
    if (ref.point(10, 300) !== KNOWN || qb.fermiDirac(2) !== KNOWN_FD) assert.fail(`instance state changed after call ${calls} (${tgt.name})`);
    // free some objects now and then (their later calls must be DISPOSED)
    if (rnd() < 0.02) {
      const kind = pick(Object.keys(pool));
      const i = Math.floor(rnd() * pool[kind].length);
      if (i > 0) {
        pool[kind][i].free();
        // most freed objects leave the pool; a few stay to be called (DISPOSED)
        if (rnd() < 0.8) pool[kind].splice(i, 1);
      }
    }
    // keep the pools small
    for (const k of Object.keys(pool)) {
      while (pool[k].length > 12) pool[k].splice(1 + Math.floor(rnd() * (pool[k].length - 1)), 1)[0].free();
    }
  }
  t.diagnostic(`${calls} calls in ≤ ${SECONDS} s: ${JSON.stringify(outcomes)}; codes ${JSON.stringify(codes)}`);
  assert.ok(calls >= 2000, `only ${calls} calls ran`);
  assert.ok(outcomes.result > calls / 20 && outcomes.quantabandError > calls / 5, JSON.stringify(outcomes));
  for (const code of ['WRONG_TYPE', 'DETACHED_BUFFER', 'DISPOSED', 'UNSUPPORTED', 'NON_FINITE']) assert.ok(codes[code] > 0, `no ${code} seen`);
  assert.equal(qb.__testing.tableSize(), before.table, 'the externref table grew');
  for (const k of Object.keys(pool)) for (const o of pool[k]) o.free();
  mcInstrument.free();
  assert.equal(ref.point(10, 300), KNOWN);
});
