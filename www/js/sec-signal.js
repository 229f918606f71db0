// Section 3: signal → object temperature through the measurement equation, with the
// sensitivity of the answer to every input (uncertainty budget).
import { api } from './api.js';
import { fmt } from './fmt.js';
import { fillTable } from './plot.js';
import { tag, readNum, readKelvin, UNIT_LABEL } from './form.js';
import { fillResults } from './sec-band.js';
import { bandUnit, densityUnit } from './quantities.js';

const $ = (id) => document.getElementById(id);

const INPUT_NAMES = {
  signal: 'Signal',
  emissivity: 'Emissivity ε',
  reflectedTemperature: 'Reflected ambient temperature',
  pathTransmittance: 'Path transmittance τ',
  pathTemperature: 'Path temperature',
  ratio: 'Measured ratio',
  emissivityRatio: 'Emissivity ratio ε₁/ε₂',
};

/** Fills an uncertainty-budget table from the core's budget (entries + combined). */
export function fillBudget(table, budget, units) {
  const rows = budget.entries.map((e) => [
    INPUT_NAMES[e.input] || e.input,
    `${fmt(e.value, 6)} ${units[e.input] || ''}`.trim(),
    `${fmt(e.standardUncertainty, 3)} ${units[e.input] || ''}`.trim(),
    `${fmt(e.sensitivity, 5)} K/${/[·/]/.test(units[e.input] || '') ? `(${units[e.input]})` : units[e.input] || '1'}`,
    `${fmt(e.contributionK, 3)} K`,
    `${fmt(100 * e.varianceShare, 3)} %`,
  ]);
  rows.push(['Combined standard uncertainty u_c', '', '', '', `${fmt(budget.combinedK, 3)} K`, '100 %']);
  fillTable(table, ['Input', 'Value', 'Standard uncertainty u', 'Sensitivity ∂T/∂x', 'Contribution |∂T/∂x|·u', 'Share of variance'], rows);
}

/** Reads the scene conditions and their standard uncertainties (prefix "sg" or "cf"). */
export function readConditions(p) {
  const tu = `${p}-tu`;
  const cond = {
    emissivity: readNum(`${p}-eps`),
    reflectedTemperatureK: readKelvin(`${p}-tr`, tu),
    pathTransmittance: readNum(`${p}-tau`),
    pathTemperatureK: readKelvin(`${p}-tp`, tu),
  };
  const u = {
    emissivity: readNum(`${p}-ueps`),
    reflectedTemperatureK: readNum(`${p}-utr`),
    pathTransmittance: readNum(`${p}-utau`),
    pathTemperatureK: readNum(`${p}-utp`),
  };
  return { cond, u };
}

/** First-order combination of uncorrelated contributions (GUM eq. 10) for the ratio reading. */
function combine(entries) {
  const rows = entries.map((e) => ({ ...e, contributionK: Math.abs(e.sensitivity) * e.standardUncertainty }));
  const variance = rows.reduce((a, e) => a + e.contributionK ** 2, 0);
  for (const e of rows) e.varianceShare = variance > 0 ? e.contributionK ** 2 / variance : 0;
  return { entries: rows, combinedK: Math.sqrt(variance) };
}

function showModes(mode) {
  for (const f of document.querySelectorAll('#sg-form [data-modes]')) f.hidden = !f.dataset.modes.split(' ').includes(mode);
}

export const signalSection = {
  id: 'signal',
  available: () => api.hasThermometry() && api.has('bandIntegral'),
  build() {
    // The ratio reading needs ratioTemperature, which some builds of the package leave out.
    if (!api.hasRatio()) {
      $('sg-mode').querySelector('option[value="ratio"]').remove();
      for (const f of this.el.querySelectorAll('[data-modes="ratio"]')) f.remove();
    }
  },
  wire() {
    showModes($('sg-mode').value);
  },
  compute() {
    const mode = $('sg-mode').value;
    showModes(mode);
    const unit = $('sg-su').value;
    const tUnit = $('sg-tu').value;
    const tL = UNIT_LABEL[tUnit];
    const uSigPct = readNum('sg-usig');
    const label = $('sg-sig-label');
    if (mode === 'ratio') {
      const ratio = readNum('sg-ratio');
      const er = readNum('sg-er');
      const uEr = readNum('sg-uer');
      const b1 = [readNum('sg-r1lo'), readNum('sg-r1hi')];
      const b2 = [readNum('sg-r2lo'), readNum('sg-r2hi')];
      tag('sg-r1lo', () => api.band({ unit }, b1[0], b1[1], 300));
      tag('sg-r2lo', () => api.band({ unit }, b2[0], b2[1], 300));
      const r = tag('sg-ratio', () => api.ratioTemperature(unit, b1, b2, ratio, er));
      // Two uncorrelated inputs: the core gives the sensitivities, the page combines them
      // by JCGM 100:2008 eq. (10): u_c² = Σ (∂T/∂x_i · u(x_i))².
      const budget = combine([
        { input: 'ratio', value: ratio, sensitivity: r.dTdRatio, standardUncertainty: (Math.abs(ratio) * uSigPct) / 100 },
        { input: 'emissivityRatio', value: er, sensitivity: r.dTdEmissivityRatio, standardUncertainty: uEr },
      ]);
      fillResults($('sg-res'), [
        ['t', 'Object temperature (grey-body ratio)', fmt(api.fromKelvin(r.temperatureK, tUnit), 7), tL, true],
        ['uc', 'Combined standard uncertainty', fmt(budget.combinedK, 3), 'K'],
        ['U', 'Expanded uncertainty (k = 2)', fmt(2 * budget.combinedK, 3), 'K'],
      ]);
      fillBudget($('sg-table'), budget, { ratio: '', emissivityRatio: '' });
      return;
    }
    const signal = readNum('sg-sig');
    const model = mode === 'band'
      ? { kind: 'band', unit, lower: readNum('sg-lo'), upper: readNum('sg-hi') }
      : { kind: 'spectral', unit, wavelength: readNum('sg-x') };
    const sigUnit = mode === 'band' ? bandUnit('energy', 'radiance') : densityUnit('energy', 'radiance', unit);
    label.textContent = mode === 'band' ? `Measured band radiance (${sigUnit})` : `Measured spectral radiance (${sigUnit})`;
    const { cond, u } = readConditions('sg');
    u.signal = (Math.abs(signal) * uSigPct) / 100;
    tag(mode === 'band' ? 'sg-lo' : 'sg-x', () => api.thermoCheckModel(model));
    const budget = api.thermoBudget(model, signal, cond, u);
    const blackbody = tag('sg-sig', () => api.thermoObjectTemperature(model, signal, null));
    fillResults($('sg-res'), [
      ['t', 'Object temperature', fmt(api.fromKelvin(budget.temperatureK, tUnit), 7), tL, true],
      ['tbb', 'Apparent (blackbody, no corrections) temperature', fmt(api.fromKelvin(blackbody, tUnit), 7), tL],
      ['uc', 'Combined standard uncertainty', fmt(budget.combinedK, 3), 'K'],
      ['U', 'Expanded uncertainty (k = 2)', fmt(2 * budget.combinedK, 3), 'K'],
    ]);
    fillBudget($('sg-table'), budget, {
      signal: sigUnit, emissivity: '', reflectedTemperature: 'K', pathTransmittance: '', pathTemperature: 'K',
    });
  },
};
