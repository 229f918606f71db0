// Deterministic random calls of every export with arguments of every kind (numbers at the edges
// of the f64 range, NaN/±∞, strings, options objects, typed arrays, null, undefined). A panic
// would abort the instance (release builds use panic = abort) and a bad glue path could trap:
// either shows up as a WebAssembly.RuntimeError. Allowed outcomes: a result, a QuantabandError,
// or the glue's own TypeError for null/undefined where a typed array is expected.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { qb } from './helpers.mjs';

test('40 000 random calls: no trap, no poisoned instance', () => {
  const fns = Object.entries(qb).filter(
    ([k, v]) => typeof v === 'function' && !['default', 'initSync', 'QuantabandError'].includes(k),
  );
  let seed = 20261201;
  const rnd = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
  const pick = (a) => a[Math.floor(rnd() * a.length)];
  const nums = [0, -0, 1, -1, 300, 1e-320, 5e-324, 1e308, -1e308, NaN, Infinity, -Infinity, 0.5, 1.5, 2.5, 1e9, 1e-9, 650, 10, 2 ** 31];
  const strs = ['um', 'nm', 'K', 'degC', 'eV', 'cm-1', 'Hz', 'gold', 'energy', 'float64', '', 'µm'];
  const models = [
    { kind: 'spectralPoint', wavelength: 10, unit: 'um' },
    { kind: 'response', wavelengths: [8, 14], values: [1, 1], unit: 'um' },
    { kind: 'sakumaHattori', aM: 1e-5, bMK: 1.8e-4, c: 1e6 },
    { kind: 'sakumaHattori', aM: 1e-5, bMK: -1, c: 1e6 },
    { kind: 'response', wavelengths: [1e-300, 1e300], values: [1, 1], unit: 'm' },
  ];
  const arg = () => {
    const r = rnd();
    if (r < 0.35) return pick(nums);
    if (r < 0.5) return pick(strs);
    if (r < 0.6) return { unit: pick(strs), emissivity: pick(nums), variable: pick(['wavelength', 'frequency', 'x']) };
    if (r < 0.7) return pick(models);
    if (r < 0.78) return new Float64Array(Array.from({ length: Math.floor(rnd() * 6) }, () => pick(nums)));
    if (r < 0.82) return new Uint16Array([0, 2, 65535]);
    if (r < 0.86) return { emissivity: pick(nums), reflectedTemperatureK: pick(nums), pathTransmittance: pick(nums), pathTemperatureK: pick(nums) };
    if (r < 0.9) return { lower: pick(nums), upper: pick(nums) };
    if (r < 0.93) return null;
    if (r < 0.96) return undefined;
    return [pick(nums), pick(nums)];
  };
  const outcomes = { result: 0, quantabandError: 0, glueTypeError: 0 };
  for (let i = 0; i < 40_000; i++) {
    const [name, f] = pick(fns);
    const args = Array.from({ length: f.length }, arg);
    try {
      f(...args);
      outcomes.result++;
    } catch (e) {
      if (e instanceof qb.QuantabandError) {
        assert.ok(qb.ERROR_CODES.includes(e.code));
        outcomes.quantabandError++;
      } else if (e instanceof TypeError && /null|undefined/.test(e.message)) {
        outcomes.glueTypeError++;
      } else {
        assert.fail(`${name}(${args.map(String).join(', ')}) threw ${e.constructor.name}: ${e.message}`);
      }
    }
  }
  assert.ok(outcomes.result > 1000 && outcomes.quantabandError > 1000, JSON.stringify(outcomes));
  assert.equal(qb.spectralDensity({ unit: 'um' }, 10, 300), 9924033.330070695);
});
