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

function showModes(mode) {
  for (const f of document.querySelectorAll('#sg-form [data-modes]')) f.hidden = !f.dataset.modes.split(' ').includes(mode);
}

export const signalSection = {
  id: 'signal',
  available: () => api.hasThermometry() && api.hasRatio(),
  wire() {
    showModes($('sg-mode').value);
  },
  compute() {
    const mode = $('sg-mode').value;
    showModes(mode);
    const unit = $('sg-su').value;
    const tUnit = $('sg-tu').value;
    const tL = UNIT_LABEL[tUnit];
    const signal = readNum('sg-sig');
    const uSigPct = readNum('sg-usig');
    const label = $('sg-sig-label');
    if (mode === 'ratio') {
      label.textContent = 'Measured ratio (band 1 / band 2 radiance)';
      const er = readNum('sg-er');
      const uEr = readNum('sg-uer');
      const r = tag('sg-sig', () => api.ratioTemperature(unit, [readNum('sg-lo'), readNum('sg-hi')], [readNum('sg-lo2'), readNum('sg-hi2')], signal, er));
      const uRatio = (Math.abs(signal) * uSigPct) / 100;
      const budget = api.combine([
        { input: 'ratio', value: signal, sensitivity: r.dTdRatio, standardUncertainty: uRatio },
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
