// The uncertainty-budget table and the temperature results shared by the sections that invert
// a reading (signal → temperature, calibration): every temperature and every temperature
// difference (uncertainty, contribution) in the section's output unit, differences converted
// as differences; values below the computation's resolution written 0 with the resolution.
import { api } from './api.js';
import { formatNumber, formatResolved } from './fmt.js';
import { fillTable } from './plot.js';
import { symbol } from './units.js';
import { number, kelvin, kelvinDiff, tagMap, FieldError, labelOf, typed, unitText } from './fields.js';

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

/** Degrees of freedom as shown: ∞, or 3 significant digits. */
export const showDof = (nu) => (nu === undefined || nu === null ? 'not defined' : formatNumber(nu, { digits: 3, trim: true }));

const DIST_WORDS = { normal: 'normal', rectangular: 'rectangular', triangular: 'triangular', arcsine: 'U-shaped', studentT: 'scaled t' };

/**
 * Fills a budget table. rows: [{ name, value (text with unit), u (text with unit),
 * sensitivityK (∂T/∂x, kelvin per unit of x), xUnit ('' = dimensionless, 'T' = a temperature,
 * else a unit symbol), scale (a natural change of x in its unit: u, or |x|), contributionK,
 * share, nu, evaluation, distribution }]; gum: gumView() of the core's result; temperatureK
 * sets the resolution; unit is the output temperature unit. ν_eff, k and U go in the table's
 * foot with the core's statement of its method.
 */
export function fillBudget(table, rows, gum, temperatureK, unit) {
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
      { text: showDof(r.nu), value: r.nu },
      `${r.evaluation === 'typeA' ? 'A' : 'B'}, ${DIST_WORDS[r.distribution] ?? r.distribution}`,
    ];
  });
  body.push([{ html: 'Combined standard uncertainty, <i>u</i><sub>c</sub>' }, '', '', '', { text: showDifference(gum.combinedK, unit, 2, resK), value: gum.combinedK }, '100 %', '', '']);
  fillTable(table, ['Input', 'Value', { html: 'Standard uncertainty <i>u</i>' }, 'Sensitivity ∂T/∂x', { html: 'Contribution |∂T/∂x|·<i>u</i>' }, 'Share of variance',
    { html: '<i>ν</i>' }, 'Type'], body);
  const foot = table.createTFoot();
  const line = (key, html, text, value) => {
    const tr = foot.insertRow();
    tr.dataset.key = key;
    const th = document.createElement('th');
    th.scope = 'row';
    th.colSpan = 4;
    th.innerHTML = html;
    const td = document.createElement('td');
    td.colSpan = 4;
    td.textContent = text;
    if (value !== undefined) td.dataset.value = String(value);
    tr.append(th, td);
  };
  line('nueff', 'Effective degrees of freedom <i>ν</i><sub>eff</sub> (Welch–Satterthwaite)', showDof(gum.nuEff), gum.nuEff);
  const pText = gum.p === undefined ? '' : `, coverage probability ${formatNumber(100 * gum.p, { digits: 3 })} %`;
  line('k', `Coverage factor <i>k</i>${gum.stated ? ' (stated)' : ''}`, `${formatNumber(gum.k, { digits: 3 })}${pText}`, gum.k);
  line('U', 'Expanded uncertainty <i>U</i> = <i>k</i>·<i>u</i><sub>c</sub>', showDifference(gum.expandedK, unit, 2, resK), gum.expandedK);
  const td = document.createElement('td');
  td.colSpan = 8;
  td.className = 'method';
  td.textContent = `${gum.correlations ? `${gum.correlations}. ` : ''}Method: ${gum.statement.replace(/Welch-Satterthwaite/g, 'Welch–Satterthwaite')}.`;
  foot.insertRow().appendChild(td);
}

/** The page's view of a core GUM result (an instrument budget or any propagation). */
export function gumView(r, correlations = '') {
  return {
    combinedK: r.combinedStandardUncertaintyK ?? r.combinedStandardUncertainty,
    expandedK: r.expandedUncertaintyK ?? r.expandedUncertainty,
    nuEff: r.effectiveDegreesOfFreedom,
    k: r.coverageFactor,
    p: r.coverageProbability,
    stated: r.method.coverage === 'statedFactor',
    statement: r.method.statement,
    correlations: correlations && r.method.propagation !== 'firstOrderCorrelated' ? `${correlations} (no effect: an input of each pair has no uncertainty)` : correlations,
  };
}

/** The result items u_c and U (with its k and p) of a GUM view, in output unit `ou`. */
export function uncertaintyItems(g, ou) {
  const p = g.p === undefined ? '' : `, <i>p</i> = ${formatNumber(100 * g.p, { digits: 3 })} %`;
  return [
    ['uc', 'Standard uncertainty', showDifference(g.combinedK, ou, 2), { labelHtml: 'Standard uncertainty <i>u</i><sub>c</sub>' }],
    ['U', 'Expanded uncertainty', showDifference(g.expandedK, ou, 2), { labelHtml: `Expanded uncertainty <i>U</i> (<i>k</i> = ${formatNumber(g.k, { digits: 3 })}${p})` }],
  ];
}

// ------------------------------------------------------------------ degrees of freedom, correlation, coverage

const DISTS = [['normal', 'normal'], ['rectangular', 'rectangular'], ['triangular', 'triangular'], ['arcsine', 'U-shaped']];

/**
 * The markup of a section's budget settings (generated by the section's build(), before the
 * fields are set up): per input a degrees-of-freedom field (blank = ∞, Type B) and the
 * distribution of a Type B input; two correlation lines (input, input, r); the coverage
 * (a probability, or a stated k). inputs: [[key, label, when?]]; pairs: the inputs a
 * correlation may name [[key, label]]; d: { nu: {key: text}, dist: {key: value}, corr: [[a, b, r]], corrWhen }.
 */
export function gumMarkup(p, inputs, pairs, d = {}) {
  const when = (w) => (w ? ` data-when="${w}"` : '');
  const rows = inputs.map(([key, label, w]) => {
    const dist = DISTS.map(([v, t]) => `<option value="${v}"${d.dist?.[key] === v ? ' selected' : ''}>${t}</option>`).join('');
    return `<div class="fld"${when(w)}><label for="${p}-nu-${key}">${label}: <i>ν</i></label><div class="qty">` +
      `<input id="${p}-nu-${key}" data-state data-kind="number" data-label="Degrees of freedom of the ${label.toLowerCase()}" inputmode="decimal" value="${d.nu?.[key] ?? ''}" placeholder="∞">` +
      `<label class="vh" for="${p}-d-${key}">Distribution of the ${label.toLowerCase()} (Type B)</label><select id="${p}-d-${key}" data-state>${dist}</select></div></div>`;
  }).join('');
  const opts = (sel) => `<option value="">—</option>${pairs.map(([k, t]) => `<option value="${k}"${k === sel ? ' selected' : ''}>${t}</option>`).join('')}`;
  const corr = [1, 2].map((i) => {
    const [a, b, r] = d.corr?.[i - 1] ?? ['', '', '0'];
    return `<div class="fld wide"${when(d.corrWhen)}><label for="${p}-ca${i}">Correlation ${i}</label><div class="qty">` +
      `<select id="${p}-ca${i}" data-state data-label="Correlation ${i}, first input">${opts(a)}</select><label class="to" for="${p}-cb${i}">with<span class="vh"> (correlation ${i}, second input)</span></label>` +
      `<select id="${p}-cb${i}" data-state data-label="Correlation ${i}, second input">${opts(b)}</select><label class="pm" for="${p}-cr${i}"><i>r</i> =<span class="vh"> correlation coefficient ${i}</span></label>` +
      `<input id="${p}-cr${i}" class="u" data-state data-kind="number" data-label="Correlation coefficient ${i}" inputmode="decimal" value="${r}"></div></div>`;
  }).join('');
  return `<form class="gumform" novalidate autocomplete="off"><fieldset><legend>Budget: degrees of freedom, correlation, coverage</legend>
<p class="hint row">A Type A input (the mean of <i>n</i> readings) has <i>ν</i> = <i>n</i> − 1; leave <i>ν</i> blank (∞) for a Type B input and choose its distribution (used by the Monte Carlo method only).${d.corrWhen !== undefined || pairs.length ? ' Reflected and path temperatures read by the same sensor are correlated.' : ''}</p>
${rows}${corr}
<div class="fld"><label for="${p}-cov">Coverage</label><select id="${p}-cov" data-state><option value="p">a coverage probability</option><option value="k">a stated factor k</option></select></div>
<div class="fld" data-when="${p}-cov=p"><label for="${p}-p">Coverage probability</label><div class="qty"><input id="${p}-p" data-state data-kind="number" data-unit-text="%" inputmode="decimal" value="95"><span class="unit">%</span></div></div>
<div class="fld narrow" data-when="${p}-cov=k"><label for="${p}-k">Coverage factor k</label><input id="${p}-k" data-state data-kind="number" inputmode="decimal" value="2"></div>
</fieldset></form>`;
}

const bad = (id, words) => new FieldError(id, `${labelOf(id)} ${words}; you entered ${typed(id)}${unitText(id) ? ` ${unitText(id)}` : ''}.`, 'OUT_OF_RANGE');

/** The degrees of freedom in field `id` (blank or ∞: Infinity). */
export function dof(id) {
  const t = document.getElementById(id).value.trim();
  if (t === '' || t === '∞') return Infinity;
  const v = number(id);
  if (!(v > 0)) throw bad(id, 'must be greater than 0 (blank for ∞, a Type B input)');
  return v;
}

/** An input's uncertainty in the core's form: Type A (finite ν: a scaled t) or Type B (ν = ∞, the chosen distribution). */
export function uncertaintyOf(p, key, u) {
  const nu = dof(`${p}-nu-${key}`);
  return Number.isFinite(nu)
    ? { standardUncertainty: u, degreesOfFreedom: nu, evaluation: 'typeA' }
    : { standardUncertainty: u, distribution: document.getElementById(`${p}-d-${key}`).value };
}

/**
 * The correlation lines (shown ones only) and the coverage of section `p`: { options (the
 * core's: correlations by `coreKey[key]`, coverageProbability | coverageFactor), text (the
 * correlations in words), lastId (coefficient field of the last line used), covId }.
 */
export function readCoverage(p, coreKey = null, names = {}) {
  const $ = (id) => document.getElementById(id);
  const correlations = [];
  const words = [];
  const seen = new Set();
  let lastId = null;
  for (const i of coreKey ? [1, 2] : []) {
    const a = $(`${p}-ca${i}`);
    const b = $(`${p}-cb${i}`);
    if (a.closest('[hidden]') || !a.value || !b.value) continue;
    const rId = `${p}-cr${i}`;
    const r = number(rId);
    if (!(r >= -1 && r <= 1)) throw bad(rId, 'must be from −1 to 1');
    if (a.value === b.value) throw new FieldError(b.id, `Correlation ${i}: an input cannot be correlated with itself; choose two different inputs.`);
    const pair = [a.value, b.value].sort().join();
    if (seen.has(pair)) throw new FieldError(b.id, `Correlation ${i} repeats the pair of correlation 1; give each pair once.`);
    seen.add(pair);
    if (r === 0) continue;
    correlations.push({ inputs: [coreKey[a.value], coreKey[b.value]], coefficient: r, keys: [a.value, b.value] });
    words.push(`r(${names[a.value]}, ${names[b.value]}) = ${formatNumber(r, { digits: 6, trim: true })}`);
    lastId = rId;
  }
  const options = coreKey ? { correlations: correlations.map(({ inputs, coefficient }) => ({ inputs, coefficient })) } : {};
  let covId = `${p}-p`;
  if ($(`${p}-cov`).value === 'k') {
    covId = `${p}-k`;
    const k = number(covId);
    if (!(k > 0)) throw bad(covId, 'must be greater than 0');
    options.coverageFactor = k;
  } else {
    const pc = number(covId);
    if (!(pc > 0 && pc < 100)) throw bad(covId, 'must be greater than 0 % and less than 100 %');
    options.coverageProbability = pc / 100;
  }
  return { options, pairs: correlations, text: words.length ? `Correlations: ${words.join('; ')}` : '', lastId, covId };
}

/** Runs a GUM call of the core: correlation and coverage errors go under their fields, others by `map`. */
export function gumCall(cov, fn, map, fallback) {
  try {
    return fn();
  } catch (e) {
    if (api.isError(e) && e.code === 'INVALID_CORRELATION' && cov.lastId) {
      throw new FieldError(cov.lastId, 'These correlation coefficients cannot hold together (no joint distribution of the inputs has them); make one of them smaller in magnitude.', e.code);
    }
    if (api.isError(e) && e.code === 'UNSUPPORTED' && /effective degrees of freedom/.test(e.message)) {
      throw new FieldError(cov.covId, 'The effective degrees of freedom are not defined when an input with finite degrees of freedom is correlated: choose a stated coverage factor k, or make that input Type B (blank ν).', e.code);
    }
    return tagMap(map, () => {
      throw e;
    }, fallback);
  }
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
    return { ...base, sensitivityK: e.sensitivity * k, contributionK: e.contributionK, share: e.varianceShare, nu: e.degreesOfFreedom, evaluation: e.evaluation, distribution: e.distribution };
  });
}

/** The budget settings' inputs of a reading through the measurement equation: [field key, core key, label]. */
export const MEASUREMENT_INPUTS = [
  ['sig', 'signal', 'Reading'],
  ['eps', 'emissivity', 'Emissivity ε'],
  ['tr', 'reflectedTemperatureK', 'Reflected temperature'],
  ['tau', 'pathTransmittance', 'Path transmittance τ'],
  ['tp', 'pathTemperatureK', 'Path temperature'],
];

/**
 * The uncertainties (ν, distribution) and options of a reading's budget in section `p`, from
 * the standard uncertainty of the signal `uS` and of the scene `sc`: { u, cov }.
 */
export function readMeasurementGum(p, uS, sc) {
  const std = { signal: uS, ...sc.u };
  const u = Object.fromEntries(MEASUREMENT_INPUTS.map(([key, core]) => [core, uncertaintyOf(p, key, std[core])]));
  const coreKey = Object.fromEntries(MEASUREMENT_INPUTS.map(([key, core]) => [key, core]));
  const names = Object.fromEntries(MEASUREMENT_INPUTS.map(([key, , label]) => [key, label.replace(/ [ετ]$/, '').toLowerCase()]));
  return { u, cov: readCoverage(p, coreKey, names) };
}

/** gumMarkup() for a reading through the measurement equation (correlation lines over its inputs). */
export function measurementGumMarkup(p, readingLabel, d, when) {
  const inputs = MEASUREMENT_INPUTS.map(([key, , label]) => [key, key === 'sig' ? readingLabel : label, when]);
  return gumMarkup(p, inputs, MEASUREMENT_INPUTS.map(([key, , label]) => [key, label]), { ...d, corrWhen: when });
}
