// Internal helpers of the uncertainty area (no public names): the uncertainty exports of
// src/wasm/uncertainty.rs leave their results as numbers in f64 scratch buffer 0 and return how
// many; these helpers read them back and build the result objects (layouts documented beside the
// Rust writers). Shared by uncertainty.js, instrument.js (uncertaintyBudget) and calibration.js
// (calibration transfer, fixed-point curves).

import { QuantabandError, wrongType } from './errors.js';
import { F64, config, glue, numbers, optionalConfig, readBack, reserve, result, takeError } from './runtime.js';

/** The numbers a successful export left in f64 scratch 0 (`count` is its return value). */
export function _scratchNumbers(count) {
  const n = result(count);
  return readBack(F64, reserve(F64, 0, n), n, null);
}

/** NaN (nothing) as undefined. */
const opt = (x) => (x === x ? x : undefined);

const EVALUATIONS = ['typeA', 'typeB'];
const DISTRIBUTIONS = ['normal', 'rectangular', 'triangular', 'arcsine', 'studentT'];
const PROPAGATIONS = ['firstOrderUncorrelated', 'firstOrderCorrelated'];
const COVERAGE_METHODS = ['studentT', 'normal', 'statedFactor'];
/** Rows of a measurement budget, in the order of the core's MeasurementInput. */
const MEASUREMENT_INPUTS = [
  'signal',
  'emissivity',
  'reflectedTemperature',
  'pathTransmittance',
  'pathTemperature',
  'windowTransmittance',
  'windowReflectance',
  'windowTemperature',
  'windowReflectedTemperature',
];
/** ITS-90 fixed points, in the order of the core's FixedPoint. */
const FIXED_POINTS = ['indium', 'tin', 'zinc', 'aluminium', 'silver', 'gold', 'copper'];

/** The statement of a GUM method, by propagation code p and coverage code c: the wording of
 * the core's `GumMethod::describe` (tests/gum_statements.rs checks they agree). */
const PROPAGATION_TEXT = [
  'JCGM 100:2008 first-order law of propagation (eq. 10, uncorrelated inputs); ',
  'JCGM 100:2008 first-order law of propagation with correlations (eq. 16); ',
];
const COVERAGE_TEXT = [
  "Welch-Satterthwaite effective degrees of freedom (eq. G.2b), truncated; coverage factor from Student's t",
  'infinite effective degrees of freedom; coverage factor from the normal distribution',
  'stated coverage factor',
];
const statement = (p, c) => PROPAGATION_TEXT[p] + COVERAGE_TEXT[c];

/**
 * The GUM result at v[at…] ([estimate, u_c, ν_eff, k, p, U, propagation, coverage, ν used, n],
 * then 8 numbers per entry). `measurement`: rows named by input, uncertainties in K (the
 * object temperature); otherwise the generic form. Returns [object, index after it].
 */
export function _gum(v, at, measurement) {
  const n = v[at + 9];
  const entries = [];
  for (let i = 0; i < n; i++) {
    const e = at + 10 + 8 * i;
    const row = {
      sensitivity: v[e + 1],
      standardUncertainty: v[e + 2],
      degreesOfFreedom: v[e + 3],
      evaluation: EVALUATIONS[v[e + 4]],
      distribution: DISTRIBUTIONS[v[e + 5]],
    };
    if (measurement) {
      entries.push({ input: MEASUREMENT_INPUTS[v[e]], ...row, contributionK: v[e + 6], varianceShare: v[e + 7] });
    } else {
      entries.push({ ...row, contribution: v[e + 6], varianceShare: v[e + 7] });
    }
  }
  const p = v[at + 6];
  const c = v[at + 7];
  const method = {
    propagation: PROPAGATIONS[p],
    coverage: COVERAGE_METHODS[c],
    degreesOfFreedomUsed: opt(v[at + 8]),
    statement: statement(p, c),
  };
  const common = {
    effectiveDegreesOfFreedom: opt(v[at + 2]),
    coverageFactor: v[at + 3],
    coverageProbability: opt(v[at + 4]),
  };
  const out = measurement
    ? {
        temperatureK: v[at],
        entries,
        combinedStandardUncertaintyK: v[at + 1],
        ...common,
        expandedUncertaintyK: v[at + 5],
        method,
      }
    : {
        entries,
        combinedStandardUncertainty: v[at + 1],
        ...common,
        expandedUncertainty: v[at + 5],
        method,
      };
  return [out, at + 10 + 8 * n];
}

// ---- configuration: read here (keys, types, names), values checked by the module -----------

const q = (s) => `"${s}"`;
const isPlain = (v) => v !== null && typeof v === 'object' && !Array.isArray(v) && !ArrayBuffer.isView(v);

/** `o` (a configuration copy at `path`), a plain object with only the `accepted` keys. */
function object(o, path, accepted) {
  if (!isPlain(o)) throw wrongType(path, 'an object', o);
  for (const k of Object.keys(o)) {
    if (!accepted.includes(k)) {
      throw new QuantabandError('UNSUPPORTED', `${path}: unknown field "${k}" (accepted fields: ${accepted.map(q).join(', ')})`);
    }
  }
  return o;
}

/** The number at o[key] (path.key), or undefined when absent or null. */
function optNumber(o, key, path) {
  const v = o[key];
  if (v === undefined || v === null) return undefined;
  if (typeof v !== 'number') throw wrongType(`${path}.${key}`, 'a number', v);
  return v;
}

/** The number at o[key], required. */
function required(o, key, path) {
  const v = optNumber(o, key, path);
  if (v === undefined) throw new QuantabandError('WRONG_TYPE', `${path}.${key} is required (got ${o[key] === null ? 'null' : 'undefined'})`);
  return v;
}

/** The index of the name at o[key] in `names` (−1 when absent). */
function choice(o, key, path, names) {
  const v = o[key];
  if (v === undefined || v === null) return -1;
  if (typeof v !== 'string') throw wrongType(`${path}.${key}`, 'a string', v);
  const i = names.indexOf(v);
  if (i < 0) throw new QuantabandError('UNSUPPORTED', `${path}.${key} must be one of ${names.map(q).join(', ')} (got "${v}")`);
  return i;
}

const SPEC_KEYS = ['standardUncertainty', 'degreesOfFreedom', 'evaluation', 'distribution'];

/**
 * Writes input uncertainty `v` (at `path`) as [u, ν, evaluation, distribution, shorthand] at
 * out[at…]: a number is a standard uncertainty; ν absent or null is ∞; codes −1 when not given.
 */
function spec(v, path, out, at) {
  if (typeof v === 'number') {
    out.set([v, Infinity, -1, -1, 1], at);
    return;
  }
  if (!isPlain(v)) throw wrongType(path, 'a standard uncertainty (a number) or an object', v);
  object(v, path, SPEC_KEYS);
  const nu = optNumber(v, 'degreesOfFreedom', path);
  out.set(
    [
      required(v, 'standardUncertainty', path),
      nu === undefined ? Infinity : nu,
      choice(v, 'evaluation', path, EVALUATIONS),
      choice(v, 'distribution', path, DISTRIBUTIONS),
      0,
    ],
    at,
  );
}

/** The keys of the measurement equation's uncertainties (MeasurementInput order). */
const UNCERTAINTY_KEYS = [
  'signal',
  'emissivity',
  'reflectedTemperatureK',
  'pathTransmittance',
  'pathTemperatureK',
  'windowTransmittance',
  'windowReflectance',
  'windowTemperatureK',
  'windowReflectedTemperatureK',
];

/** The nine input uncertainties of `uncertainties` (absent: 0). */
function measurementInputs(uncertainties) {
  const u = object(config(uncertainties, 'uncertainties'), 'uncertainties', UNCERTAINTY_KEYS);
  const out = new Float64Array(5 * 9);
  UNCERTAINTY_KEYS.forEach((k, i) => spec(u[k] ?? 0, `uncertainties.${k}`, out, 5 * i));
  return out;
}

/** A list of input uncertainties (`inputs`). */
function inputList(inputs) {
  const list = config(inputs, 'inputs');
  if (list instanceof Float64Array) {
    const out = new Float64Array(5 * list.length);
    list.forEach((u, i) => out.set([u, Infinity, -1, -1, 1], 5 * i));
    return out;
  }
  if (!Array.isArray(list)) throw wrongType('inputs', 'an array of input uncertainties', inputs);
  const out = new Float64Array(5 * list.length);
  list.forEach((v, i) => spec(v, `inputs[${i}]`, out, 5 * i));
  return out;
}

/**
 * `{ inputs: [a, b], coefficient }` pairs as [i, j, r] triples (each pair once, r ∈ [−1, 1]);
 * `keys`: the input names, in row order.
 */
function pairs(list, path, keys = UNCERTAINTY_KEYS) {
  if (list === undefined || list === null) return new Float64Array(0);
  if (list instanceof Float64Array && list.length === 0) return list;
  if (!Array.isArray(list)) throw wrongType(path, 'an array of { inputs, coefficient } objects', list);
  const out = new Float64Array(3 * list.length);
  const seen = new Set();
  const bad = (msg) => new QuantabandError('INVALID_CORRELATION', msg);
  list.forEach((p, k) => {
    const at = `${path}[${k}]`;
    object(p, at, ['inputs', 'coefficient']);
    const names = p.inputs;
    if (!Array.isArray(names) || names.length !== 2) {
      throw wrongType(`${at}.inputs`, 'an array of two input names', names);
    }
    const [i, j] = names.map((name, n) => {
      if (typeof name !== 'string') throw wrongType(`${at}.inputs[${n}]`, 'a string', name);
      const x = keys.indexOf(name);
      if (x < 0) {
        throw new QuantabandError('UNSUPPORTED', `${at}.inputs[${n}] must be one of ${keys.map(q).join(', ')} (got "${name}")`);
      }
      return x;
    });
    const r = required(p, 'coefficient', at);
    if (i === j) throw bad(`${at}: an input cannot be correlated with itself (${names[0]})`);
    if (!(r >= -1 && r <= 1)) throw bad(`${at}.coefficient must lie in [-1, 1] (got ${r})`);
    const key = Math.min(i, j) * keys.length + Math.max(i, j);
    if (seen.has(key)) throw bad(`${at}: the pair ${names[0]} / ${names[1]} is given twice`);
    seen.add(key);
    out.set([i, j, r], 3 * k);
  });
  return out;
}

/** Throws LENGTH_MISMATCH unless `got` (the length of `name`) is `n`. */
function sameLength(n, got, name, per) {
  if (got !== n) throw new QuantabandError('LENGTH_MISMATCH', `${name} must have ${n} elements, one per ${per} (got ${got})`);
}

/** A correlation matrix (rows, or N² numbers row-major) as one row-major Float64Array. */
function matrix(m, path) {
  if (m instanceof Float64Array) return m;
  if (!Array.isArray(m)) throw wrongType(path, 'an array of numbers or of rows', m);
  const n = m.length;
  const flat = new Float64Array(n * n);
  m.forEach((row, i) => {
    if (!(row instanceof Float64Array)) throw wrongType(`${path}[${i}]`, 'an array of numbers (a row of the matrix)', row);
    if (row.length !== n) {
      throw new QuantabandError('LENGTH_MISMATCH', `${path}[${i}] must have ${n} elements, one per row (got ${row.length})`);
    }
    flat.set(row, i * n);
  });
  return flat;
}

/** The options copy, a plain object with only the `accepted` keys ({} when undefined). */
function options(value, accepted) {
  const o = object(optionalConfig(value, 'options'), 'options', accepted);
  if (optNumber(o, 'coverageProbability', 'options') !== undefined && optNumber(o, 'coverageFactor', 'options') !== undefined) {
    throw new QuantabandError('UNSUPPORTED', 'options: give coverageProbability or coverageFactor, not both');
  }
  return o;
}

/** A NumberArray argument as a fresh Float64Array (for a slice argument of the module). */
export function _f64(x, name) {
  return new Float64Array(numbers(x, name)[0]);
}

/** Instrument.uncertaintyBudget on handle `h` (signal already checked). */
export function _measurementBudget(h, signal, uncertainties, opts) {
  const u = measurementInputs(uncertainties);
  const o = options(opts, ['correlations', 'coverageProbability', 'coverageFactor']);
  const c = pairs(o.correlations, 'options.correlations');
  const n = h.uncertaintyBudget(signal, u, c, optNumber(o, 'coverageProbability', 'options'), optNumber(o, 'coverageFactor', 'options'));
  return _gum(_scratchNumbers(n), 0, true)[0];
}

/**
 * The uncertainty key of a row of SpectralInstrument.uncertaintyBudget (rows: the keys of
 * SpectralInstrument.sensitivities after temperatureK; temperatures take a K suffix). A
 * `…Scale` input is the factor k of a whole table (ε, ρ, τ_p, τ_w, ρ_w or the response R) at
 * k = 1, so its standard uncertainty is the table's relative standard uncertainty.
 */
const spectralKey = (row) => (row.endsWith('Temperature') ? `${row}K` : row);
/** The window's inputs (their sensitivities are all 0 without a window). */
const WINDOW_INPUTS = ['windowTransmittanceScale', 'windowReflectanceScale', 'windowTemperature', 'windowReflectedTemperature'];

/**
 * SpectralInstrument.uncertaintyBudget: `names` are the 11 inputs (the sensitivity keys after
 * temperatureK) and `sensitivities()` gives them; the law of propagation is the module's
 * (propagateUncertainty), so the budget is the same engine as Instrument.uncertaintyBudget.
 */
export function _spectralBudget(names, sensitivities, uncertainties, opts) {
  const n = names.length;
  const keys = names.map(spectralKey);
  const windowRows = WINDOW_INPUTS.map((w) => names.indexOf(w));
  const reflectanceRow = names.indexOf('reflectanceScale');
  const u = object(config(uncertainties, 'uncertainties'), 'uncertainties', keys);
  const inputs = new Float64Array(5 * n);
  keys.forEach((k, i) => spec(u[k] ?? 0, `uncertainties.${k}`, inputs, 5 * i));
  const o = options(opts, ['correlations', 'coverageProbability', 'coverageFactor']);
  const pr = pairs(o.correlations, 'options.correlations', keys);
  const s = sensitivities();
  const c = Float64Array.from(names, (k) => s[k]);
  const given = (i) => inputs[5 * i] !== 0;
  if (windowRows.some(given) && windowRows.every((i) => c[i] === 0)) {
    throw new QuantabandError('UNSUPPORTED', 'window uncertainties need a window in the conditions');
  }
  if (given(reflectanceRow) && c[reflectanceRow] === 0) {
    throw new QuantabandError(
      'UNSUPPORTED',
      "uncertainties.reflectanceScale: the target's reflectance does not enter this measurement on its own (an opaque target reflects 1 − ε: give emissivityScale)",
    );
  }
  // Rows as in Instrument.uncertaintyBudget: the window's only with a window; the separate
  // reflectance only for a target that has one (not opaque).
  const noWindow = windowRows.every((i) => c[i] === 0);
  const active = [];
  for (let i = 0; i < n; i++) {
    if (!((noWindow && windowRows.includes(i)) || (i === reflectanceRow && c[i] === 0))) active.push(i);
  }
  const r = active.length;
  const has = pr.length > 0;
  const m = new Float64Array(has ? r * r : 0);
  if (has) {
    for (let i = 0; i < r; i++) m[i * r + i] = 1;
    for (let k = 0; k < pr.length; k += 3) {
      const [a, b] = [active.indexOf(pr[k]), active.indexOf(pr[k + 1])];
      if (a < 0 || b < 0) {
        const name = keys[a < 0 ? pr[k] : pr[k + 1]];
        throw new QuantabandError('UNSUPPORTED', `options.correlations[${k / 3}]: ${name} is not an input of this measurement (no window, or an opaque target)`);
      }
      m[a * r + b] = pr[k + 2];
      m[b * r + a] = pr[k + 2];
    }
  }
  const cs = Float64Array.from(active, (i) => c[i]);
  const us = new Float64Array(5 * r);
  active.forEach((i, j) => us.set(inputs.subarray(5 * i, 5 * i + 5), 5 * j));
  const count = glue.propagateUncertainty(cs, us, m, has, optNumber(o, 'coverageProbability', 'options'), optNumber(o, 'coverageFactor', 'options'));
  const g = _gum(_scratchNumbers(count), 0, false)[0];
  return {
    temperatureK: s.temperatureK,
    entries: g.entries.map(({ contribution, varianceShare, ...row }, j) => ({ input: names[active[j]], ...row, contributionK: contribution, varianceShare })),
    combinedStandardUncertaintyK: g.combinedStandardUncertainty,
    effectiveDegreesOfFreedom: g.effectiveDegreesOfFreedom,
    coverageFactor: g.coverageFactor,
    coverageProbability: g.coverageProbability,
    expandedUncertaintyK: g.expandedUncertainty,
    method: g.method,
  };
}

/** propagateUncertainty. */
export function _propagate(sensitivities, inputs, opts) {
  const c = _f64(sensitivities, 'sensitivities');
  const u = inputList(inputs);
  sameLength(c.length, u.length / 5, 'inputs', 'sensitivity');
  const o = options(opts, ['correlation', 'coverageProbability', 'coverageFactor']);
  const has = o.correlation !== undefined && o.correlation !== null;
  const m = has ? matrix(o.correlation, 'options.correlation') : new Float64Array(0);
  const n = glue.propagateUncertainty(c, u, m, has, optNumber(o, 'coverageProbability', 'options'), optNumber(o, 'coverageFactor', 'options'));
  return _gum(_scratchNumbers(n), 0, false)[0];
}

/** `v` (parameter `name`) as a whole number in [lo, hi] (`range` states it). */
export function _whole(v, name, lo, hi, range) {
  if (!Number.isFinite(v)) throw new QuantabandError('NON_FINITE', `${name} must be a finite number (got ${v})`);
  if (!(v >= lo && v <= hi && Number.isInteger(v))) {
    throw new QuantabandError('OUT_OF_RANGE', `${name} must lie in ${range} (got ${v})`);
  }
  return v;
}

const MC_KEYS = ['coverageProbability', 'seed', 'trials', 'maxTrials', 'significantDigits', 'interval'];
const INTERVALS = ['probabilisticallySymmetric', 'shortest'];
const TRIALS_RANGE = 'integers in [1, 10000000]';

/**
 * The settings of a Monte Carlo run as the module takes them: [p, seed, trials (0: adaptive),
 * capacity, significant digits, interval code], whole numbers checked here.
 */
function mcSettings(o) {
  const p = optNumber(o, 'coverageProbability', 'options') ?? 0.95;
  const seed = optNumber(o, 'seed', 'options');
  const trials = optNumber(o, 'trials', 'options');
  const max = optNumber(o, 'maxTrials', 'options');
  const digits = optNumber(o, 'significantDigits', 'options');
  if (trials !== undefined && max !== undefined) {
    throw new QuantabandError('UNSUPPORTED', 'options: maxTrials limits an adaptive run; give trials (a fixed count) or maxTrials, not both');
  }
  const fixed = trials === undefined ? 0 : _whole(trials, 'options.trials', 1, 1e7, TRIALS_RANGE);
  const capacity = fixed || (max === undefined ? 1e6 : _whole(max, 'options.maxTrials', 1, 1e7, TRIALS_RANGE));
  return Float64Array.of(
    p,
    seed === undefined ? 1 : _whole(seed, 'options.seed', 0, 2 ** 53, 'integers in [0, 2^53]'),
    fixed,
    capacity,
    digits === undefined ? 2 : _whole(digits, 'options.significantDigits', 1, 6, 'integers in [1, 6]'),
    Math.max(0, choice(o, 'interval', 'options', INTERVALS)),
  );
}

/**
 * The GUM result of a GUM export's return value `count` (measurement or generic layout), or
 * undefined when the GUM gives no coverage probability for correlated inputs (UNSUPPORTED).
 */
function gumOrNone(count, measurement, correlated) {
  if (count !== count) {
    const e = takeError();
    if (correlated && e.code === 'UNSUPPORTED') return undefined;
    throw e;
  }
  return _gum(_scratchNumbers(count), 0, measurement)[0];
}

/**
 * A Monte Carlo run of the measurement equation of instrument handle `h`: [its handle, the
 * GUM budget of the same inputs at the run's p (or undefined), [y, u_c, U, p] of it].
 */
export function _mcMeasurement(h, signal, uncertainties, opts) {
  const u = measurementInputs(uncertainties);
  const o = options(opts, ['correlations', ...MC_KEYS]);
  const c = pairs(o.correlations, 'options.correlations');
  const settings = mcSettings(o);
  const mc = glue.QbMonteCarlo.measurement(h, signal, u, c, settings);
  if (mc === undefined) throw takeError();
  try {
    const gum = gumOrNone(h.uncertaintyBudget(signal, u, c, settings[0], undefined), true, c.length > 0);
    const y = gum && Float64Array.of(gum.temperatureK, gum.combinedStandardUncertaintyK, gum.expandedUncertaintyK, gum.coverageProbability);
    return [mc, gum, y ?? new Float64Array(0)];
  } catch (e) {
    mc.free();
    throw e;
  }
}

/** A Monte Carlo run of the linear model: as _mcMeasurement. */
export function _mcLinear(sensitivities, inputs, opts) {
  const c = _f64(sensitivities, 'sensitivities');
  const u = inputList(inputs);
  const o = options(opts, ['correlation', 'estimates', ...MC_KEYS]);
  const hasM = o.correlation !== undefined && o.correlation !== null;
  const hasX = o.estimates !== undefined && o.estimates !== null;
  const x = hasX ? _f64(o.estimates, 'options.estimates') : new Float64Array(c.length);
  sameLength(c.length, u.length / 5, 'inputs', 'sensitivity');
  if (hasX) sameLength(c.length, x.length, 'options.estimates', 'sensitivity');
  const m = hasM ? matrix(o.correlation, 'options.correlation') : new Float64Array(0);
  const settings = mcSettings(o);
  const mc = glue.QbMonteCarlo.linear(c, u, m, hasM, x, settings);
  if (mc === undefined) throw takeError();
  try {
    const gum = gumOrNone(glue.propagateUncertainty(c, u, m, hasM, settings[0], undefined), false, hasM);
    let y = 0;
    for (let i = 0; i < c.length; i++) y += c[i] * x[i];
    const g = gum && Float64Array.of(y, gum.combinedStandardUncertainty, gum.expandedUncertainty, gum.coverageProbability);
    return [mc, gum, g ?? new Float64Array(0)];
  } catch (e) {
    mc.free();
    throw e;
  }
}

/**
 * Per-point standard uncertainties `v` (a number for all n points, or one per point) as a
 * Float64Array, each finite and ≥ 0.
 */
function perPoint(v, n, path) {
  let a;
  if (typeof v === 'number') a = new Float64Array(n).fill(v);
  else if (v instanceof Float64Array) a = v;
  else throw wrongType(path, 'a number or an array of numbers', v);
  sameLength(n, a.length, path, 'point');
  a.forEach((x, i) => {
    if (!Number.isFinite(x)) throw new QuantabandError('NON_FINITE', `${path} must be a finite number (got ${x}) (at index ${i})`, i);
    if (x < 0) throw new QuantabandError('OUT_OF_RANGE', `${path} must lie in [0, inf) (got ${x}) (at index ${i})`, i);
  });
  return a;
}

/** [uTemperaturesK, uSignals, given] of curve options `o` for n points. */
function pointUncertainties(o, n) {
  let given = 0;
  const out = ['uTemperaturesK', 'uSignals'].map((k, i) => {
    const v = o[k];
    if (v === undefined || v === null) return new Float64Array(0);
    given |= 1 << i;
    return perPoint(v, n, `options.${k}`);
  });
  return [out[0], out[1], given];
}

/**
 * The options of CalibrationCurve.fit through n points: [the copy the module reads (c2),
 * uTemperaturesK, uSignals, given].
 */
export function _fitArgs(opts, n) {
  const o = object(optionalConfig(opts, 'options'), 'options', ['c2', 'uTemperaturesK', 'uSignals']);
  const rest = o.c2 === undefined || o.c2 === null ? {} : { c2: o.c2 };
  return [rest, ...pointUncertainties(o, n)];
}

/** The arguments of QbCalibration.throughFixedPoints after the instrument handle. */
export function _fixedPointArgs(fixedPoints, opts) {
  const f = config(fixedPoints, 'fixedPoints');
  if (!Array.isArray(f) || f.length !== 3) throw wrongType('fixedPoints', 'an array of three fixed-point names', fixedPoints);
  const codes = new Float64Array(3);
  f.forEach((name, i) => {
    if (typeof name !== 'string') throw wrongType(`fixedPoints[${i}]`, 'a string', name);
    const k = FIXED_POINTS.indexOf(name);
    if (k < 0) throw new QuantabandError('UNSUPPORTED', `fixedPoints[${i}] must be one of ${FIXED_POINTS.map(q).join(', ')} (got "${name}")`);
    codes[i] = k;
  });
  const o = object(optionalConfig(opts, 'options'), 'options', ['c2', 'uTemperaturesK', 'uSignals', 'tMinK', 'tMaxK', 'nPoints']);
  const codata = choice(o, 'c2', 'options', ['its90', 'codata2018']) === 1;
  return [
    codes,
    codata,
    ...pointUncertainties(o, 3),
    optNumber(o, 'tMinK', 'options'),
    optNumber(o, 'tMaxK', 'options'),
    _whole(optNumber(o, 'nPoints', 'options') ?? 200, 'options.nPoints', 2, 1e5, 'integers in [2, 100000]'),
  ];
}

/** The fixed-point report of a curve handle, or undefined. */
export function _fixedPointReport(h) {
  const v = _scratchNumbers(h.fixedPointReport());
  if (v.length === 0) return undefined;
  const part = (i) => (v[i] === v[i] ? { maxErrorK: v[i], atTemperatureK: v[i + 1] } : undefined);
  return Object.freeze({
    fixedPoints: [FIXED_POINTS[v[0]], FIXED_POINTS[v[1]], FIXED_POINTS[v[2]]],
    temperaturesK: [v[3], v[4], v[5]],
    signals: [v[6], v[7], v[8]],
    interpolationErrors: { between: part(9), below: part(11), above: part(13) },
  });
}

/** 3×3 row-major numbers at v[at…] as nested arrays. */
const rows3 = (v, at) => [0, 1, 2].map((i) => [v[at + 3 * i], v[at + 3 * i + 1], v[at + 3 * i + 2]]);

/** CalibrationCurve.parameterCovariance on handle `h`. */
export function _parameterCovariance(h) {
  const v = _scratchNumbers(h.parameterCovariance());
  return { covariance: rows3(v, 0), correlation: rows3(v, 9) };
}

/** CalibrationCurve.readingUncertainty on handle `h` (arguments already checked). */
export function _readingUncertainty(h, signal, uSignal) {
  const v = _scratchNumbers(h.readingUncertainty(signal, uSignal));
  const n = (v.length - 6) / 2;
  return {
    temperatureK: v[0],
    uCalibrationK: v[1],
    uSignalK: v[2],
    combinedStandardUncertaintyK: v[3],
    dTdSignal: v[4],
    dTdReferenceTemperatures: v.slice(6, 6 + n),
    dTdReferenceSignals: v.slice(6 + n),
    dTdReferenceTemperaturesSum: v[5],
  };
}

const STATUS = ['running', 'stabilized', 'completed', 'capacityReached'];

/** Progress numbers of a Monte Carlo step. */
export function _progress(v) {
  const status = STATUS[v[3]];
  return {
    trials: v[0],
    invalidTrials: v[1],
    batches: v[2],
    status,
    numericalTolerance: opt(v[4]),
    largestSpread: opt(v[5]),
    trialLimit: v[7],
    done: status !== 'running' || v[6] === 1,
  };
}

/** Result numbers of a Monte Carlo run, with the GUM result it was compared with. */
export function _monteCarloResult(v, gum) {
  const bins = v[27];
  const counts = v.slice(30, 30 + bins);
  const edges = new Float64Array(bins + 1);
  for (let k = 0; k < bins; k++) edges[k] = v[24] + k * v[26];
  edges[bins] = v[25];
  const spread = v[12] === v[12] ? { estimate: v[12], standardUncertainty: v[13], lower: v[14], upper: v[15] } : undefined;
  const validation = v[20] === v[20]
    ? { dLow: v[20], dHigh: v[21], tolerance: v[22], interval: INTERVALS[v[9]], passed: v[23] === 1 }
    : undefined;
  return {
    trials: v[0],
    invalidTrials: v[1],
    estimate: v[2],
    standardUncertainty: v[3],
    coverageProbability: v[4],
    symmetricInterval: [v[5], v[6]],
    shortestInterval: [v[7], v[8]],
    interval: INTERVALS[v[9]],
    significantDigits: v[10],
    numericalTolerance: v[11],
    batchSpread: spread,
    batchSize: v[16],
    batches: v[17],
    stabilized: v[18] === 1,
    status: STATUS[v[19]],
    gum,
    validation,
    histogram: { counts, edges, below: v[28], above: v[29] },
  };
}
