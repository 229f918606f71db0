// Section: the object temperature behind a reading, through the measurement equation, with
// the GUM budget. The reading can be what the practitioner has at hand: an instrument's
// indicated temperature (with its emissivity and reflected-temperature settings), a radiance,
// counts through a Sakuma–Hattori curve, or a two-colour reading (ratio or indicated ratio
// temperature) of two equal narrow bands.
import { api } from './api.js';
import { formatNumber, formatInput } from './fmt.js';
import { fillResults, fillTable } from './plot.js';
import { tag, tagMap, tagPair, number, kelvin, kelvinDiff, spectral, count, FieldError, labelOf, typed, unitText, wireLoaders } from './fields.js';
import { symbol } from './units.js';
import { fillBudget, showTemperature, showDifference, readScene, budgetRows, gumMarkup, gumView, uncertaintyItems, uncertaintyOf, readCoverage, readMeasurementGum, gumCall, MEASUREMENT_INPUTS } from './budget.js';
import { monteCarloPanel } from './montecarlo.js';
import { shared } from './shared.js';
import { spectralWanted, readSpectral, tagSpectral, plotSpectral, loadDemo } from './spectral-tables.js';

const $ = (id) => document.getElementById(id);
const RADIANCE = 'W·m⁻²·sr⁻¹';
const trim = (v) => formatNumber(v, { digits: 6, trim: true });
const SINGLE = 'sg-mode=indicated,radiance,counts';
let mcInputs = null; // the last valid inputs of a single-reading budget (for the Monte Carlo run)
let panel = null;

/** A standard uncertainty the page combines itself must not be negative. */
function nonNegative(id, v) {
  if (v < 0) throw new FieldError(id, `${labelOf(id)} must be 0 or more; you entered ${typed(id)}${unitText(id) ? ` ${unitText(id)}` : ''}.`, 'OUT_OF_RANGE');
  return v;
}

const NO_PHYS = /signal (\S+) must exceed the reflected and path contribution (\S+)/;

function readModel(mode) {
  if (mode === 'counts') {
    const um = api.spectralSize('um');
    const model = { kind: 'sakumaHattori', aM: number('sg-ca') * um, bMK: number('sg-cb') * um, c: number('sg-cc') };
    tagMap({ 'model.aM': 'sg-ca', 'model.bMK': 'sg-cb', 'model.c': 'sg-cc' }, () => api.instrument({ model }), 'sg-ca');
    const describe = `the Sakuma–Hattori curve A = ${trim(number('sg-ca'))} µm, B = ${trim(number('sg-cb'))} µm·K, C = ${trim(number('sg-cc'))} counts`;
    return { model, describe, id: 'sg-ca' };
  }
  if ($('sg-resp').value === 'band') {
    const unit = $('sg-bu').value;
    const lo = spectral('sg-lo').value;
    const hi = spectral('sg-hi').value;
    const model = { kind: 'response', wavelengths: [lo, hi], values: [1, 1], unit };
    tagPair('sg-lo', 'sg-hi', () => api.instrument({ model }));
    return { model, describe: `a flat (rectangular) response from ${trim(lo)} to ${trim(hi)} ${symbol(unit)}`, id: 'sg-lo' };
  }
  const unit = $('sg-xu').value;
  const x = spectral('sg-x').value;
  const model = { kind: 'spectralPoint', wavelength: x, unit };
  tag('sg-x', () => api.instrument({ model }));
  return { model, describe: `a single wavelength, ${trim(x)} ${symbol(unit)} (the narrow-band limit)`, id: 'sg-x' };
}

function computeSingle(mode, ou) {
  if (spectralAvailable() && spectralWanted()) {
    computeSpectral(mode, ou);
    return;
  }
  setSignalUnit(RADIANCE);
  const { model, describe } = readModel(mode);
  const scene = readScene('sg');
  const eps = scene.eps;
  if (spectralAvailable()) plotGrey(scene);
  const inst = tagMap(scene.condFields, () => api.instrument({ model, conditions: scene.conditions }), 'sg-eps');
  const blackbody = api.instrument({ model });

  // The reading as a signal of the model (SI for radiances), with its standard uncertainty and
  // how the budget's first row shows it (toX = ∂S/∂x, x being the reading as entered).
  let S;
  let uS;
  let row;
  let readId;
  let readUId;
  let settings = null;
  let indicatedK = null;
  if (mode === 'indicated') {
    readId = 'sg-ti';
    readUId = 'sg-uti';
    indicatedK = kelvin('sg-ti');
    const uTi = kelvinDiff('sg-uti');
    const eset = number('sg-eset');
    const trset = kelvin('sg-trset');
    settings = tagMap({ 'conditions.emissivity': 'sg-eset', 'conditions.reflectedTemperatureK': 'sg-trset' },
      () => api.instrument({ model, conditions: { emissivity: eset, reflectedTemperatureK: trset } }), 'sg-eset');
    S = tag('sg-ti', () => settings.measuredSignal(indicatedK));
    const dTi = settings.sensitivities(S).signal; // ∂T_indicated/∂S of the instrument's own settings
    uS = uTi / dTi;
    row = { name: 'Indicated temperature', value: showTemperature(indicatedK, ou, true), u: showDifference(uTi, ou, 6, 0, true), xUnit: 'T', scale: uTi || indicatedK, toX: 1 / dTi };
  } else if (mode === 'counts') {
    readId = 'sg-n';
    readUId = 'sg-un';
    S = number('sg-n');
    uS = number('sg-un');
    row = { name: 'Signal', value: `${trim(S)} counts`, u: `${trim(uS)} counts`, xUnit: 'count', scale: uS || Math.abs(S), toX: 1 };
  } else if ($('sg-resp').value === 'band') {
    readId = 'sg-sig';
    readUId = 'sg-usig';
    S = number('sg-sig');
    uS = number('sg-usig');
    row = { name: 'Band radiance', value: `${trim(S)} ${RADIANCE}`, u: `${trim(uS)} ${RADIANCE}`, xUnit: RADIANCE, scale: uS || Math.abs(S), toX: 1 };
  } else {
    readId = 'sg-ssig';
    readUId = 'sg-ussig';
    const per = $('sg-ssu').value;
    const size = api.spectralSize(per); // metres per unit: L per m = L per unit / size
    const v = number('sg-ssig');
    const uv = number('sg-ussig');
    S = v / size;
    uS = uv / size;
    const text = unitText('sg-ssig');
    row = { name: 'Spectral radiance', value: `${trim(v)} ${text}`, u: `${trim(uv)} ${text}`, xUnit: text, scale: uv || Math.abs(v), toX: 1 / size };
  }

  const noSolution = (e) => {
    if (e.code === 'NO_PHYSICAL_SOLUTION') {
      const m = NO_PHYS.exec(e.message);
      if (mode === 'indicated' || !m) {
        return `No object temperature explains this reading: with ε = ${trim(eps)}, the reflected surroundings and the path alone would give the instrument more than it saw. Check the emissivity and the reflected and path temperatures.`;
      }
      const scale = mode === 'radiance' && $('sg-resp').value === 'point' ? api.spectralSize($('sg-ssu').value) : 1;
      const u = mode === 'counts' ? 'counts' : unitText(readId) || RADIANCE;
      return `${labelOf(readId)} ${typed(readId)} ${u} is below the ${formatNumber(Number(m[2]) * scale, { digits: 4 })} ${u} that the reflected surroundings and the path alone give, so no object temperature explains it. Check the emissivity and the reflected and path temperatures.`;
    }
    if (e.code === 'NO_SOLUTION') return `${labelOf(readId)}: no object temperature up to 10⁹ K gives this reading.`;
    return undefined;
  };
  const T = tag(readId, () => inst.objectTemperature(S), { custom: noSolution });
  const g = readMeasurementGum('sg', uS, scene);
  const budget = gumCall(g.cov, () => inst.uncertaintyBudget(S, g.u, g.cov.options), { 'uncertainties.signal': readUId, ...scene.uFields }, readUId);
  const view = gumView(budget, g.cov.text);
  const seed = count('sg-seed', 0, 2 ** 53);
  const fields = Object.fromEntries(MEASUREMENT_INPUTS.map(([k]) => [k, [`sg-nu-${k}`, `sg-d-${k}`]]));
  const key = JSON.stringify([model, scene.conditions, S, g.u, g.cov.options, seed]);
  mcInputs = { def: { model, conditions: scene.conditions }, S, u: g.u, options: g.cov.options, pairs: g.cov.pairs, view, T, key, seed, ou, fields };
  const tbb = blackbody.temperature(S);

  const items = [['t', 'Object temperature', showTemperature(T, ou), { big: true }], ...uncertaintyItems(view, ou)];
  if (mode === 'indicated') items.push(['corr', 'Correction to the indicated temperature', showDifference(T - indicatedK, ou, 4)]);
  items.push(['tbb', 'Blackbody temperature of the signal (ε = 1, no corrections)', showTemperature(tbb, ou)]);
  fillResults($('sg-res'), items);

  const rows = budgetRows(budget, row, scene, ou);
  fillBudget($('sg-table'), rows, view, T, ou);
  panel?.render(ou, key);

  const parts = [`Assumes ${describe}`, 'a grey body (ε the same at every wavelength the instrument sees)', 'uniform diffuse surroundings at the reflected temperature'];
  if (mode === 'indicated') parts.push('and an instrument that computed its reading with this same response, the emissivity and reflected temperature set on it, and no path correction');
  $('sg-assume').textContent = `${parts.join(', ')}.`;
}

function computeRatio(ou) {
  const unit = $('sg-lu').value;
  const U = symbol(unit);
  const l1 = spectral('sg-l1').value;
  const l2 = spectral('sg-l2').value;
  const w = spectral('sg-lw').value;
  if (!(l1 > 0)) throw new FieldError('sg-l1', `Channel 1 wavelength must be greater than 0; you entered ${typed('sg-l1')} ${U}.`, 'NON_POSITIVE_SPECTRAL');
  if (!(l2 > l1)) {
    throw new FieldError('sg-l2', `Channel 2 wavelength (${typed('sg-l2')} ${U}) must be longer than channel 1 (${typed('sg-l1')} ${U}): channel 1 is the shorter one.`, 'UNSUPPORTED');
  }
  if (w < 0) throw new FieldError('sg-lw', `Channel width must be 0 (single wavelengths) or more; you entered ${typed('sg-lw')} ${U}.`, 'OUT_OF_RANGE');
  if (w >= 2 * l1) throw new FieldError('sg-lw', `Channel width (${typed('sg-lw')} ${U}) must be less than twice channel 1 wavelength (${trim(2 * l1)} ${U}).`, 'OUT_OF_RANGE');
  if (l1 + w / 2 > l2 - w / 2) throw new FieldError('sg-lw', `Channel width (${typed('sg-lw')} ${U}) makes the two channels overlap; it must be at most ${trim(l2 - l1)} ${U}.`, 'OUT_OF_RANGE');
  const channel = (l) => (w > 0 ? { kind: 'response', wavelengths: [l - w / 2, l + w / 2], values: [1, 1], unit } : { kind: 'spectralPoint', wavelength: l, unit });
  const i1 = tag('sg-l1', () => api.instrument({ model: channel(l1) }));
  const i2 = tag('sg-l2', () => api.instrument({ model: channel(l2) }));
  const er = number('sg-er');
  const uer = nonNegative('sg-uer', number('sg-uer'));

  const indicated = $('sg-rin').value === 'indicated';
  let r;
  let readRow;
  let guess = 1000;
  let ti = null;
  let setRead = null;
  const readId = indicated ? 'sg-rti' : 'sg-ratio';
  if (indicated) {
    ti = kelvin('sg-rti');
    const uTi = nonNegative('sg-urti', kelvinDiff('sg-urti'));
    const erset = number('sg-erset');
    // What the pyrometer measured: the grey-body ratio its setting turns into T_indicated.
    r = erset * (tag('sg-rti', () => i1.signal(ti)) / i2.signal(ti));
    setRead = tagMap({ emissivityRatio: 'sg-erset' }, () => i1.ratioTemperature(i2, r, erset, ti), 'sg-rti');
    guess = ti;
    readRow = { name: 'Indicated ratio temperature', value: showTemperature(ti, ou, true), u: showDifference(uTi, ou, 6, 0, true), xUnit: 'T', uX: uTi, scale: uTi || ti, perX: 1 / setRead.dTdRatio };
  } else {
    r = number('sg-ratio');
    const ur = nonNegative('sg-uratio', number('sg-uratio'));
    readRow = { name: 'Radiance ratio L₁/L₂', value: trim(r), u: trim(ur), xUnit: '', uX: ur, scale: ur || Math.abs(r), perX: 1 };
  }
  const res = tagMap({ emissivityRatio: 'sg-er' }, () => i1.ratioTemperature(i2, r, er, guess), readId, {
    custom: (e) => (e.code === 'NO_SOLUTION' || e.code === 'UNSUPPORTED'
      ? `${labelOf(readId)}: no temperature gives this ratio in these two channels with ε₁/ε₂ = ${trim(er)}.`
      : undefined),
  });
  // JCGM 100 eq. 10 through the core (propagateUncertainty), with ν and the coverage of the settings.
  const base = [
    { ...readRow, sensitivityK: res.dTdRatio * readRow.perX },
    { name: 'Emissivity ratio ε₁/ε₂', value: trim(er), u: trim(uer), xUnit: '', uX: uer, scale: uer || er, sensitivityK: res.dTdEmissivityRatio },
  ];
  const cov = readCoverage('sg');
  const inputs = [uncertaintyOf('sg', 'sig', readRow.uX), uncertaintyOf('sg', 'er', uer)];
  const gum = gumCall(cov, () => api.fn('propagateUncertainty')(base.map((r) => r.sensitivityK), inputs, cov.options), {}, readId);
  const rows = base.map((r, i) => {
    const e = gum.entries[i];
    return { ...r, contributionK: e.contribution, share: e.varianceShare, nu: e.degreesOfFreedom, evaluation: e.evaluation, distribution: e.distribution };
  });
  const view = gumView(gum);
  const items = [['t', 'Object temperature', showTemperature(res.temperatureK, ou), { big: true }], ...uncertaintyItems(view, ou)];
  if (indicated) items.push(['err', 'Error of the indicated temperature (indicated − true)', showDifference(ti - res.temperatureK, ou, 4)]);
  items.push(['ratio', 'Radiance ratio L₁/L₂', formatNumber(r, { digits: 6 })]);
  fillResults($('sg-res'), items);
  fillBudget($('sg-table'), rows, view, res.temperatureK, ou);
  const what = w > 0
    ? `two flat bands of equal width ${trim(w)} ${U} centred on ${trim(l1)} and ${trim(l2)} ${U}`
    : `single wavelengths ${trim(l1)} and ${trim(l2)} ${U} (the narrow-band limit)`;
  $('sg-assume').textContent = `Assumes ${what}, a grey-body ratio (ε₁/ε₂ as entered), and no reflected radiation or path absorption that differs between the channels.`;
}

// ------------------------------------------------------------------ spectral (non-grey) readings

const spectralAvailable = () => api.has('SpectralInstrument', 'correctReading') && !!$('sg-ngp');

/** The unit shown beside the band-signal reading (it follows the response's kind). */
function setSignalUnit(u) {
  for (const id of ['sg-sig', 'sg-usig']) $(id).dataset.unitText = u;
  const span = $('sg-sig').parentElement.querySelector('.unit');
  if (span) span.textContent = u;
}

/** The plot of the grey inputs over a flat band (nothing to plot for one wavelength). */
function plotGrey(scene) {
  const fig = $('sg-ngplot');
  fig.hidden = $('sg-resp').value !== 'band';
  if (fig.hidden) return;
  const lo = spectral('sg-lo');
  const hi = spectral('sg-hi');
  if (api.spectralKind(lo.unit) !== 'wavelength' || !(hi.value > lo.value && lo.value > 0)) return;
  plotSpectral(fig, {
    response: { wavelengths: [lo.value, hi.value], values: [1, 1], unit: lo.unit, quantity: 'energy' },
    conditions: { emissivity: scene.eps, pathTransmittance: scene.conditions.pathTransmittance },
  });
}

const TERM_NAMES = [
  ['object', 'Target emission', 'τ<sub>w</sub>·τ·ε·<i>L</i>(<i>T</i>)'],
  ['reflected', 'Surroundings reflected by the target', 'τ<sub>w</sub>·τ·(1 − ε)·<i>L</i>(<i>T</i><sub>refl</sub>)'],
  ['path', 'Path emission', 'τ<sub>w</sub>·(1 − τ)·<i>L</i>(<i>T</i><sub>path</sub>)'],
  ['windowReflected', 'Reflected by the window', 'ρ<sub>w</sub>·<i>L</i>(<i>T</i><sub>wr</sub>)'],
  ['windowEmitted', 'Window emission', '(1 − τ<sub>w</sub> − ρ<sub>w</sub>)·<i>L</i>(<i>T</i><sub>w</sub>)'],
];

/**
 * A reading through the spectral measurement equation (SpectralInstrument): the object
 * temperature, the band-effective values at it, the terms of the signal and a first-order
 * budget (JCGM 100 eq. 10/13 through the core's propagateUncertainty) with the package's
 * sensitivity coefficients; a table enters the budget as a scale factor k (u(k) relative).
 */
function computeSpectral(mode, ou) {
  $('sg-ngplot').hidden = false;
  const scene = readScene('sg');
  // The budget below is the page's propagation: its standard uncertainties must not be negative.
  for (const id of ['sg-ueps', 'sg-utr', 'sg-utau', 'sg-utp']) if (!$(id).closest('[hidden]')) nonNegative(id, number(id));
  const ng = readSpectral(mode, scene);
  const { response } = ng.definition;
  const si = tagSpectral(ng.fields, () => api.spectralInstrument(ng.definition), 'sg-rtab');
  const bb = api.spectralInstrument({ response });
  plotSpectral($('sg-ngplot'), ng.definition);
  const table = $('sg-rk').value !== 'band';
  const sigUnit = ng.photon ? 's⁻¹·m⁻²·sr⁻¹×η' : table ? 'W·m⁻²·sr⁻¹×R' : RADIANCE;
  setSignalUnit(sigUnit);

  // The reading as a signal S of the response, and ∂S/∂x of the reading x as entered.
  let S;
  let uX;
  let dSdX;
  let row;
  let readId;
  let readUId;
  let indicatedK = null;
  let setting = null;
  if (mode === 'indicated') {
    readId = 'sg-ti';
    readUId = 'sg-uti';
    indicatedK = kelvin('sg-ti');
    uX = nonNegative('sg-uti', kelvinDiff('sg-uti'));
    setting = { emissivity: number('sg-eset'), reflectedTemperatureK: kelvin('sg-trset') };
    const setInst = tagSpectral({ 'definition.conditions.emissivity': 'sg-eset', 'definition.conditions.reflectedTemperatureK': 'sg-trset' },
      () => api.spectralInstrument({ response, conditions: setting }), 'sg-eset');
    S = tag('sg-ti', () => setInst.measuredSignal(indicatedK));
    dSdX = 1 / setInst.sensitivities(S).signal;
    row = { name: 'Indicated temperature', value: showTemperature(indicatedK, ou, true), u: showDifference(uX, ou, 6, 0, true), xUnit: 'T', scale: uX || indicatedK };
  } else if (mode === 'counts') {
    readId = 'sg-n';
    readUId = 'sg-un';
    const { model } = readModel('counts');
    const curve = api.instrument({ model });
    const n = number('sg-n');
    uX = nonNegative('sg-un', number('sg-un'));
    const tbbK = tag('sg-n', () => curve.temperature(n));
    S = bb.signal(tbbK);
    dSdX = curve.sensitivities(n).signal / bb.sensitivities(S).signal; // (dT/dn of the curve) / (dT/dS of the response)
    row = { name: 'Signal', value: `${trim(n)} counts`, u: `${trim(uX)} counts`, xUnit: 'count', scale: uX || Math.abs(n) };
  } else {
    readId = 'sg-sig';
    readUId = 'sg-usig';
    S = number('sg-sig');
    uX = nonNegative('sg-usig', number('sg-usig'));
    dSdX = 1;
    row = { name: 'Band signal', value: `${trim(S)} ${sigUnit}`, u: `${trim(uX)} ${sigUnit}`, xUnit: sigUnit, scale: uX || Math.abs(S) };
  }

  const custom = (e) => {
    if (e.code === 'NO_PHYSICAL_SOLUTION') {
      return `No object temperature explains this reading: the reflected surroundings, the path and the window alone would give the instrument ${mode === 'indicated' ? 'more than it saw' : `more than ${typed(readId)} ${mode === 'counts' ? 'counts' : sigUnit}`}. Check the emissivity, the transmittances and the reflected, path and window temperatures.`;
    }
    if (e.code === 'NO_SOLUTION') return `${labelOf(readId)}: no object temperature up to 10⁹ K gives this reading.`;
    return undefined;
  };
  const T = mode === 'indicated'
    ? tag('sg-ti', () => api.correctReading(si, indicatedK, setting), { custom })
    : tag(readId, () => si.objectTemperature(S), { custom });
  const sens = si.sensitivities(S);
  const eff = si.bandEffective(T);
  const terms = si.signalTerms(T);

  // Budget rows: the reading, then each optical input (a grey value, or a table's scale k) and
  // the temperatures of the other terms.
  const inp = ng.input;
  const greyDerivative = (key, scaleSens) => {
    const x = inp[key];
    if (x.relative) return scaleSens;
    if (x.value > 0) return scaleSens / x.value;
    if (!(x.u > 0)) return 0;
    // ∂T/∂x at x = 0 (a scale factor has no effect there): one-sided difference, step 10⁻⁶.
    const h = 1e-6;
    const c = JSON.parse(JSON.stringify(ng.definition.conditions));
    if (key === 'emissivity') c.emissivity = h;
    else if (key === 'path') c.pathTransmittance = h;
    else if (key === 'windowT') c.window.transmittance = h;
    else c.window.reflectance = h;
    return (api.spectralInstrument({ response, conditions: c }).objectTemperature(S) - T) / h;
  };
  const optical = (key, name, scaleSens) => {
    const x = inp[key];
    return x.relative
      ? { name: `${name}, table scale k`, value: '1 (as tabulated)', u: `${trim(100 * x.u)} % (relative)`, xUnit: '', scale: x.u || 1, sensitivityK: scaleSens, uX: x.u }
      : { name, value: trim(x.value), u: trim(x.u), xUnit: '', scale: x.u || x.value || 1, sensitivityK: greyDerivative(key, scaleSens), uX: x.u };
  };
  const tRow = (name, k, uk, s) => ({ name, value: showTemperature(k, ou, true), u: showDifference(uk, ou, 6, 0, true), xUnit: 'T', scale: uk || k, sensitivityK: s, uX: uk });
  const rows = [
    ['sig', { ...row, sensitivityK: sens.signal * dSdX, uX }],
    ['eps', optical('emissivity', 'Emissivity ε', sens.emissivityScale)],
    ['tr', tRow('Reflected temperature', scene.conditions.reflectedTemperatureK, scene.u.reflectedTemperatureK, sens.reflectedTemperature)],
    ['tau', optical('path', 'Path transmittance τ', sens.pathTransmittanceScale)],
    ['tp', tRow('Path temperature', scene.conditions.pathTemperatureK, scene.u.pathTemperatureK, sens.pathTemperature)],
  ];
  if (ng.window) {
    rows.push(
      ['wt', optical('windowT', 'Window transmittance τw', sens.windowTransmittanceScale)],
      ['wr', optical('windowR', 'Window reflectance ρw', sens.windowReflectanceScale)],
      ['wT', tRow('Window temperature', ng.window.temperatureK, ng.window.u, sens.windowTemperature)],
      ['wTr', tRow('Temperature the window reflects', ng.window.reflectedK, ng.window.uReflected, sens.windowReflectedTemperature)],
    );
  }
  const coreKey = Object.fromEntries(MEASUREMENT_INPUTS.map(([key, core]) => [key, core]));
  const names = Object.fromEntries(MEASUREMENT_INPUTS.map(([key, , label]) => [key, label.replace(/ [ετ]$/, '').toLowerCase()]));
  const cov = readCoverage('sg', coreKey, names);
  const options = { ...cov.options };
  delete options.correlations;
  if (cov.pairs.length) {
    const at = Object.fromEntries(rows.map(([k], i) => [k, i]));
    const m = rows.map((_, i) => rows.map((__, j) => (i === j ? 1 : 0)));
    for (const p of cov.pairs) {
      const [i, j] = p.keys.map((k) => at[k]);
      m[i][j] = p.coefficient;
      m[j][i] = p.coefficient;
    }
    options.correlation = m;
  }
  const inputs = rows.map(([k, r]) => (MEASUREMENT_INPUTS.some(([key]) => key === k) ? uncertaintyOf('sg', k, r.uX) : { standardUncertainty: r.uX, distribution: 'normal' }));
  const gum = gumCall(cov, () => api.fn('propagateUncertainty')(rows.map(([, r]) => r.sensitivityK), inputs, options), {}, readUId);
  const budgetRowsOut = rows.map(([, r], i) => {
    const e = gum.entries[i];
    return { ...r, contributionK: e.contribution, share: e.varianceShare, nu: e.degreesOfFreedom, evaluation: e.evaluation, distribution: e.distribution };
  });
  const view = gumView(gum, cov.text);

  const items = [['t', 'Object temperature', showTemperature(T, ou), { big: true }], ...uncertaintyItems(view, ou)];
  if (mode === 'indicated') items.push(['corr', 'Correction to the indicated temperature', showDifference(T - indicatedK, ou, 4)]);
  const at = `at ${showTemperature(T, ou)}`;
  items.push(['epseff', 'Band-effective emissivity', formatNumber(eff.emissivity, { digits: 5 }), { labelHtml: `Band-effective emissivity <i>ε</i><sub>eff</sub> ${at}` }]);
  items.push(['taueff', 'Band-effective path transmittance', formatNumber(eff.pathTransmittance, { digits: 5 }), { labelHtml: `Band-effective path transmittance <i>τ</i><sub>eff</sub> ${at}` }]);
  if (ng.window) {
    items.push(['twineff', 'Band-effective window transmittance', formatNumber(eff.windowTransmittance, { digits: 5 }), { labelHtml: `Band-effective window transmittance <i>τ</i><sub>w,eff</sub> ${at}` }]);
  }
  items.push(['tbb', 'Blackbody temperature of the signal (ε = 1, no corrections)', showTemperature(bb.objectTemperature(S), ou)]);
  fillResults($('sg-res'), items);
  fillBudget($('sg-table'), budgetRowsOut, view, T, ou);

  const shown = TERM_NAMES.filter(([k]) => ng.window || (k !== 'windowReflected' && k !== 'windowEmitted'));
  fillTable($('sg-terms'), ['Term', 'Model', `Signal (${sigUnit})`, 'Share of the signal'], [
    ...shown.map(([k, name, model]) => [name, { html: model }, { text: formatNumber(terms[k], { digits: 5 }), value: terms[k] },
      { text: formatNumber((100 * terms[k]) / terms.signal, { digits: 3 }) + ' %', value: terms[k] / terms.signal }]),
    ['Total (the reading)', '', { text: formatNumber(terms.signal, { digits: 5 }), value: terms.signal }, '100 %'],
  ]);

  const what = (key, word) => (inp[key].relative ? `${word} from its table` : `${word} grey`);
  const parts = [`Assumes the spectral measurement equation with ${ng.describe}`, what('emissivity', 'ε'), what('path', 'τ')];
  if (ng.window) parts.push(`a window (${what('windowT', 'τw')}, ${what('windowR', 'ρw')})`);
  parts.push('straight lines between table points', 'an opaque target (reflectance 1 − ε)', 'uniform diffuse surroundings at the reflected temperature');
  if (mode === 'indicated') parts.push('an instrument that computed its reading with this same response, the emissivity and reflected temperature set on it, and no path or window correction');
  if (mode === 'counts') parts.push('a calibration curve that belongs to the instrument whose response is the table (the curve gives its blackbody temperature, the table the spectral weighting)');
  $('sg-assume').textContent = `${parts.join(', ')}. A table enters the budget as a scale factor k with the relative uncertainty entered for it; the Monte Carlo check is for grey inputs only.`;
}

export const signalSection = {
  id: 'signal',
  available: () => api.has('Instrument', 'convertTemperature', 'convertTemperatureDifference'),
  build() {
    const inputs = MEASUREMENT_INPUTS.map(([k, , label]) => [k, label, k === 'sig' ? '' : SINGLE]);
    inputs.push(['er', 'Emissivity ratio ε₁/ε₂', 'sg-mode=ratio']);
    // Neutral defaults (every input Type B and normal, no correlation, p = 95 %): nothing the
    // practitioner did not choose changes the result; the pair most often correlated is offered.
    if (!api.has('SpectralInstrument', 'correctReading')) {
      // A package without the spectral bindings: the panel stays out of view, its menus at grey.
      $('sg-ngp').dataset.when = 'sg-mode=none';
      for (const a of this.el.querySelectorAll('a[href="#sg-ngp"]')) a.closest('p').remove();
    }
    $('sg-gum').innerHTML = gumMarkup('sg', inputs, MEASUREMENT_INPUTS.map(([k, , l]) => [k, l]), { corr: [['tr', 'tp', '0']], corrWhen: SINGLE });
  },
  wire(recompute) {
    panel = monteCarloPanel('sg', this.el, () => (this.el.dataset.state === 'ok' && $('sg-mode').value !== 'ratio' ? mcInputs : null));
    if (spectralAvailable()) {
      wireLoaders($('sg-ngp'), recompute);
      $('sg-demo').addEventListener('click', () => {
        loadDemo();
        recompute();
      });
      // A response table reads a band signal: the reading field of a band.
      $('sg-rk').addEventListener('change', () => {
        if ($('sg-rk').value !== 'band') $('sg-resp').value = 'band';
      });
    }
    $('sg-take').addEventListener('click', () => {
      const c = shared.curve;
      if (!c) {
        document.getElementById('sg-ca-msg').textContent = 'The calibration section has no fitted curve yet (check its inputs).';
        return;
      }
      const um = api.spectralSize('um');
      $('sg-ca').value = formatInput(c.aM / um);
      $('sg-cb').value = formatInput(c.bMK / um);
      $('sg-cc').value = formatInput(c.c);
      recompute();
    });
  },
  compute() {
    mcInputs = null;
    const mode = $('sg-mode').value;
    const ou = $('sg-ou').value;
    if (mode === 'ratio') computeRatio(ou);
    else computeSingle(mode, ou);
  },
};
