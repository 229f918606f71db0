// The uncertainty-budget table and the temperature results shared by the sections that invert
// a reading (signal → temperature, calibration): every temperature and every temperature
// difference (uncertainty, contribution) in the section's output unit, differences converted
// as differences; values below the computation's resolution written 0 with the resolution.
import { api } from './api.js';
import { formatNumber, formatResolved } from './fmt.js';
import { fillTable } from './plot.js';
import { symbol } from './units.js';
import { number, kelvin, kelvinDiff } from './fields.js';

/** Relative resolution of the core's temperature inversions (≈ 10⁶ × machine epsilon). */
export const RELATIVE_RESOLUTION = 1e-9;

/** Digits of a temperature result: 7 significant digits of its value in kelvin, as decimals. */
export function temperatureDecimals(kelvin) {
  return Math.max(0, 6 - Math.floor(Math.log10(Math.abs(kelvin) || 1)));
}

/**
 * A temperature (K) shown in `unit` with the resolution of 7 digits in kelvin; `trim` for an
 * input echoed back (its trailing zeros carry no information).
 */
export function showTemperature(kelvin, unit, trim = false) {
  const v = api.fromK(kelvin, unit);
  // Very small or very large kelvin values: significant digits (fixed decimals would hide them).
  const o = unit === 'K' && (kelvin < 1e-3 || kelvin >= 1e7) ? { digits: 7, trim } : { decimals: temperatureDecimals(kelvin), trim };
  return `${formatNumber(v, o)} ${symbol(unit)}`;
}

/**
 * A temperature difference (K) shown in `unit` (converted as a difference) with `digits`
 * significant digits; `trim` for an input echoed back; below `resolutionK` it reads 0.
 */
export function showDifference(kelvin, unit, digits = 2, resolutionK = 0, trim = false) {
  return formatResolved(api.diffFromK(kelvin, unit), symbol(unit), { digits, trim, resolution: api.diffFromK(resolutionK, unit) });
}

/** An entered number echoed back (6 significant digits at most, no padding). */
export const echo = (v) => formatNumber(v, { digits: 6, trim: true });

/**
 * Fills a budget table. rows: [{ name, value (text with unit), u (text with unit),
 * sensitivityK (∂T/∂x, kelvin per unit of x), xUnit ('' = dimensionless, 'T' = a temperature,
 * else a unit symbol), scale (a natural change of x in its unit: u, or |x|), contributionK,
 * share }]; temperatureK sets the resolution; unit is the output temperature unit.
 */
export function fillBudget(table, rows, combinedK, temperatureK, unit) {
  const tL = symbol(unit);
  const d = api.diffFromK(1, unit); // output-unit degrees per kelvin of difference
  const resK = RELATIVE_RESOLUTION * Math.abs(temperatureK);
  const body = rows.map((r) => {
    const isT = r.xUnit === 'T';
    const sens = isT ? r.sensitivityK : r.sensitivityK * d;
    const sUnit = isT ? `${tL}/${tL}` : r.xUnit ? (/[·/]/.test(r.xUnit) ? `${tL}/(${r.xUnit})` : `${tL}/${r.xUnit}`) : tL;
    const scale = r.scale > 0 ? r.scale : 1;
    const sRes = (isT ? resK / scale : (resK * d) / scale);
    return [
      r.name,
      r.value,
      r.u,
      { text: formatResolved(sens, sUnit, { digits: 4, resolution: sRes }), value: r.sensitivityK },
      { text: showDifference(r.contributionK, unit, 2, resK), value: r.contributionK },
      { text: formatResolved(100 * r.share, '%', { digits: 3, resolution: 1e-7 }), value: r.share },
    ];
  });
  body.push([{ html: 'Combined standard uncertainty, <i>u</i><sub>c</sub>' }, '', '', '', { text: showDifference(combinedK, unit, 2, resK), value: combinedK }, '100 %']);
  fillTable(table, ['Input', 'Value', { html: 'Standard uncertainty <i>u</i>' }, 'Sensitivity ∂T/∂x', { html: 'Contribution |∂T/∂x|·<i>u</i>' }, 'Share of variance'], body);
}

/** First-order combination of uncorrelated contributions (JCGM 100:2008, eq. 10). */
export function combine(entries) {
  const rows = entries.map((e) => ({ ...e, contributionK: Math.abs(e.sensitivityK) * e.uX }));
  const variance = rows.reduce((a, e) => a + e.contributionK ** 2, 0);
  for (const e of rows) e.share = variance > 0 ? e.contributionK ** 2 / variance : 0;
  return { rows, combinedK: Math.sqrt(variance) };
}

/**
 * Reads the object-and-surroundings fields of a section (ids `${p}-eps`, `${p}-ueps`, `${p}-tr`,
 * `${p}-utr`, `${p}-tau`, `${p}-utau`, `${p}-tp`, `${p}-utp`): the instrument conditions (SI),
 * their standard uncertainties, which field each configuration path belongs to, and the budget
 * rows of these inputs in output unit `ou`.
 */
export function readScene(p) {
  const f = (s) => `${p}-${s}`;
  const eps = number(f('eps'));
  const ueps = number(f('ueps'));
  const tr = kelvin(f('tr'));
  const utr = kelvinDiff(f('utr'));
  const tau = number(f('tau'));
  const utau = number(f('utau'));
  const tp = kelvin(f('tp'));
  const utp = kelvinDiff(f('utp'));
  const trim = (v) => formatNumber(v, { digits: 6, trim: true });
  return {
    eps,
    conditions: { emissivity: eps, reflectedTemperatureK: tr, pathTransmittance: tau, pathTemperatureK: tp },
    u: { emissivity: ueps, reflectedTemperatureK: utr, pathTransmittance: utau, pathTemperatureK: utp },
    condFields: {
      'conditions.emissivity': f('eps'),
      'conditions.reflectedTemperatureK': f('tr'),
      'conditions.pathTransmittance': f('tau'),
      'conditions.pathTemperatureK': f('tp'),
    },
    uFields: {
      'uncertainties.emissivity': f('ueps'),
      'uncertainties.reflectedTemperatureK': f('utr'),
      'uncertainties.pathTransmittance': f('utau'),
      'uncertainties.pathTemperatureK': f('utp'),
    },
    /** Budget-row descriptions by the core's input name, in output unit `ou`. */
    rows: (ou) => ({
      emissivity: { name: 'Emissivity ε', value: trim(eps), u: trim(ueps), xUnit: '', scale: ueps || eps },
      reflectedTemperature: { name: 'Reflected temperature', value: showTemperature(tr, ou, true), u: showDifference(utr, ou, 6, 0, true), xUnit: 'T', scale: utr || tr },
      pathTransmittance: { name: 'Path transmittance τ', value: trim(tau), u: trim(utau), xUnit: '', scale: utau || tau },
      pathTemperature: { name: 'Path temperature', value: showTemperature(tp, ou, true), u: showDifference(utp, ou, 6, 0, true), xUnit: 'T', scale: utp || tp },
    }),
  };
}

/**
 * Budget rows from a core UncertaintyBudget: the signal row is `signalRow` (with toX = ∂S/∂x of
 * the reading as entered), the others come from `scene.rows(ou)`.
 */
export function budgetRows(budget, signalRow, scene, ou) {
  const named = scene.rows(ou);
  return budget.entries.map((e) => {
    const base = e.input === 'signal' ? signalRow : named[e.input];
    const k = e.input === 'signal' ? signalRow.toX ?? 1 : 1;
    return { ...base, sensitivityK: e.sensitivity * k, contributionK: e.contributionK, share: e.varianceShare };
  });
}
