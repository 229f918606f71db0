// Section: quantum statistics. Four tasks (menu #oc-task): Bose–Einstein, Fermi–Dirac and
// Maxwell–Boltzmann occupancy against level energy; multi-wavelength pyrometry (temperature and
// emissivity model fitted together); Raman anti-Stokes/Stokes thermometry; Y-factor receiver
// noise temperature in the three load conventions.
import { api } from './api.js';
import { formatNumber, formatResolved, formatInput, parseNumber } from './fmt.js';
import { drawPlot, fillResults, fillTable } from './plot.js';
import { toCsv, download } from './csv.js';
import { kelvin, spectral, tag, tagMap, number, table, FieldError, typed, unitText, unitOf } from './fields.js';
import { showTemperature, showDifference } from './budget.js';
import { symbol, kindWord } from './units.js';

const $ = (id) => document.getElementById(id);
const N = 401;
let last = null;

export const occupancySection = {
  id: 'occupancy',
  available: () => api.has('boseEinsteinEnergy', 'fermiDiracEnergy', 'maxwellBoltzmannEnergy', 'convertSpectral', 'convertTemperature', 'constants'),
  build() {
    // Tasks whose bindings this build of the package lacks are removed from the menu.
    const need = { multi: ['fitMultiwavelength'], raman: ['RamanMode'], yfactor: ['YFactorLoads', 'decibelsToPowerRatio', 'powerRatioToDecibels'], carriers: ['Semiconductor'] };
    for (const [task, names] of Object.entries(need)) if (!api.has(...names)) $('oc-task').querySelector(`option[value="${task}"]`).remove();
  },
  wire() {
    $('oc-csv').addEventListener('click', () => last && download('quantaband-occupancy.csv', last.csv));
    // The Y-factor's scale menu converts the value typed (dB ↔ linear), never reinterprets it.
    const yu = $('oc-yf-yu');
    yu.dataset.prev = yu.value;
    yu.addEventListener('change', () => convertY(yu));
  },
  compute() {
    const task = $('oc-task').value;
    // The main result is that of the task shown.
    const main = { occupancy: 'oc-plot', multi: 'oc-mw-res', raman: 'oc-rm-res', yfactor: 'oc-yf-res', carriers: 'oc-sc-res' }[task];
    for (const el of $('occupancy').querySelectorAll('.main-result')) el.classList.remove('main-result');
    $(main).classList.add('main-result');
    if (task === 'multi') return multiwavelength();
    if (task === 'raman') return raman();
    if (task === 'yfactor') return yFactor();
    if (task === 'carriers') return carriers();
    return occupancy();
  },
};

function occupancy() {
    last = null;
    const t = kelvin('oc-t');
    const mu = spectral('oc-mu');
    const muJ = tag('oc-mu', () => api.convertSpectral(mu.value, mu.unit, 'J'));
    const eu = $('oc-eu').value;
    const e0 = spectral('oc-e0').value;
    const e1 = spectral('oc-e1').value;
    if (!(e1 > e0)) {
      const U = unitText('oc-e0');
      throw new FieldError('oc-e1', `Level energies: the highest (${typed('oc-e1')} ${U}) must be above the lowest (${typed('oc-e0')} ${U}).`, 'INVALID_BAND');
    }
    const xu = $('oc-xu').value;
    const E = Float64Array.from({ length: N }, (_, i) => e0 + ((e1 - e0) * i) / (N - 1));
    E[N - 1] = e1;
    const EJ = api.convertSpectralArray(E, eu, 'J'); // E = hν = hc·ν̃: proportional, negatives allowed
    const X = api.convertSpectralArray(E, eu, xu);
    const be = new Float64Array(N);
    const fd = new Float64Array(N);
    const mb = new Float64Array(N);
    const BE = api.fn('boseEinsteinEnergy');
    const FD = api.fn('fermiDiracEnergy');
    const MB = api.fn('maxwellBoltzmannEnergy');
    for (let i = 0; i < N; i++) {
      fd[i] = FD(EJ[i], muJ, t);
      mb[i] = MB(EJ[i], muJ, t);
      be[i] = EJ[i] > muJ ? BE(EJ[i], muJ, t) : NaN; // undefined (diverges) at E ≤ μ: a gap
    }
    const muX = api.convertSpectral(muJ, 'J', xu);
    const xName = `level ${kindWord(api.spectralKind(xu)) === 'photon energy' ? 'energy' : kindWord(api.spectralKind(xu))}`;
    const xLabel = symbol(xu);
    drawPlot($('oc-plot'), {
      title: 'Mean occupancy against level energy',
      x: { label: `${xName} (${xLabel})`, short: 'E', readoutUnit: xLabel },
      y: { label: 'mean occupancy (particles per state)', log: $('oc-logy').checked, floorDecades: 10, readoutUnit: '' },
      series: [
        { label: 'Bose–Einstein', x: X, y: be },
        { label: 'Fermi–Dirac', x: X, y: fd },
        { label: 'Maxwell–Boltzmann', x: X, y: mb },
      ],
      markers: [{ x: muX, y: 0.5, label: 'μ' }],
      caption: 'Bose–Einstein is drawn only above μ, where it is finite; the triangle marks μ at occupancy ½.',
    });
    const kT = api.fn('constants')().boltzmannK * t;
    fillResults($('oc-res'), [
      ['kT', 'Thermal energy kT', `${formatNumber(api.convertSpectral(kT, 'J', xu), { digits: 6 })} ${xLabel}`],
      ['mu', 'Chemical potential μ', `${formatNumber(muX, { digits: 6 })} ${xLabel}`],
    ]);
    const head = [`${xName} (${xLabel})`, 'level energy (J)', 'Bose-Einstein occupancy', 'Fermi-Dirac occupancy', 'Maxwell-Boltzmann occupancy'];
    last = {
      csv: toCsv(head, [...X].map((x, i) => [x, EJ[i], be[i], fd[i], mb[i]]),
        [`quantaband occupancy; T = ${t} K; mu = ${muJ} J; Bose-Einstein cells are empty where E <= mu (no finite value there)`]),
    };
}

const trim = (v) => formatNumber(v, { digits: 6, trim: true });

// ------------------------------------------------------------------ multi-wavelength pyrometry

const WARNING_WORDS = {
  conditionNumber: 'the fit is ill-conditioned (condition number above its limit)',
  correlation: 'temperature and emissivity slope are almost fully correlated',
  localMinima: 'the data admit more than one temperature (several minima of the misfit)',
  unphysicalEmissivity: 'the fitted emissivity leaves 0…1 at a channel (wrong model or wrong radiance unit)',
};

function multiwavelength() {
  const unit = unitOf('oc-mw-data');
  const { rows, lines } = table('oc-mw-data', 3, { columns: 'wavelength, radiance, its uncertainty' });
  const order = Number($('oc-mw-order').value);
  const model = { kind: $('oc-mw-kind').value, order };
  const perUnit = api.spectralSize(unit) / api.spectralSize('um'); // radiance per µm → per `unit`
  const measurement = {
    wavelengths: Float64Array.from(rows, (r) => r[0]),
    unit,
    radiances: Float64Array.from(rows, (r) => r[1] * perUnit),
    uncertainties: Float64Array.from(rows, (r) => r[2] * perUnit),
  };
  const U = symbol(unit);
  const words = (e) => {
    const line = e.index !== undefined ? lines[e.index] : undefined;
    const col = /uncertaint/.test(e.message) ? 'standard uncertainty' : /radiance/.test(e.message) ? 'radiance' : 'wavelength';
    if (e.code === 'NON_POSITIVE' && line) return `Channels: line ${line} has a ${col} of ${trim(rows[e.index][col === 'radiance' ? 1 : col === 'wavelength' ? 0 : 2])}; it must be greater than 0.`;
    if (e.code === 'NOT_INCREASING') {
      const m = /element (\d+)/.exec(e.message);
      const k = m ? Number(m[1]) : -1;
      return `Channels: the wavelengths must increase from line to line${lines[k] ? `; line ${lines[k]} (${trim(rows[k][0])} ${U}) is not above the line before` : ''}.`;
    }
    if (e.code === 'TOO_FEW_POINTS') return `Channels: an emissivity model of order ${order} and the temperature make ${order + 2} unknowns, so at least ${order + 2} channels are needed; there ${rows.length === 1 ? 'is 1' : `are ${rows.length}`}. Lower the order or add channels.`;
    if (e.code === 'DEGENERATE_FIT') return `Channels: these channels cannot separate the temperature from an emissivity model of order ${order} (the fit is singular); lower the order or spread the wavelengths.`;
    if (e.code === 'NO_SOLUTION') return 'Channels: no temperature fits these radiances; check the radiance unit (per µm of wavelength) and the values.';
    return undefined;
  };
  const fit = tag('oc-mw-data', () => api.fitMultiwavelength(measurement, { model }), { custom: words });
  const ou = $('oc-ou').value;
  const warn = $('oc-mw-warn');
  const w = fit.warnings ?? [];
  warn.hidden = w.length === 0;
  warn.textContent = w.length
    ? `${fit.illConditioned ? 'Do not trust the digits of this temperature: ' : 'Check the fit: '}${w.map((k) => WARNING_WORDS[k] ?? k).join('; ')}. Read u(T), compare the grey two-colour and single-colour readings, and prefer a lower model order or more widely spread channels.`
    : '';
  const corr = fit.correlationTemperatureSlope;
  // χ² below the rounding of the radiances (about 10⁻¹² of each, in units of its uncertainty) is 0.
  const chiRes = rows.length * Math.max(...rows.map((r) => (1e-12 * r[1]) / r[2])) ** 2;
  fillResults($('oc-mw-res'), [
    ['t', `Fitted temperature${fit.illConditioned ? ' (ill-conditioned)' : ''}`, showTemperature(fit.temperatureK, ou), { big: true }],
    ['ut', 'Standard uncertainty u(T)', showDifference(fit.uTemperatureK, ou, 2)],
    ['grey2', 'Grey two-colour temperature (first and last channel)', fit.greyTwoColourTemperatureK === undefined ? '— (no solution)' : showTemperature(fit.greyTwoColourTemperatureK, ou)],
    ['cond', 'Condition number (limit)', `${formatNumber(fit.conditionNumber, { digits: 3 })} (${formatNumber(fit.maxConditionNumber, { digits: 3, trim: true })})`],
    ['corr', 'Correlation of T and emissivity slope', corr === undefined ? '— (grey model)' : formatNumber(corr, { decimals: 4 })],
    ['infl', 'u(T) ÷ u(T) with ε known', formatNumber(fit.uncertaintyInflation, { digits: 3 })],
    ['chi2', 'χ² / degrees of freedom', `${formatResolved(fit.chiSquared, '', { digits: 3, resolution: chiRes })} / ${fit.degreesOfFreedom}`],
  ]);
  fillTable($('oc-mw-table'), ['Line', `Wavelength (${U})`, `Single-colour temperature (${symbol(ou)})`, 'Fitted ε'],
    rows.map((r, i) => [String(lines[i]), trim(r[0]), showTemperature(fit.brightnessTemperaturesK[i], ou).replace(/ \S+$/, ''), formatNumber(fit.emissivityAtChannels[i], { digits: 4 })]));
  $('oc-mw-assume').textContent = `Weighted least squares with the full Planck law (after Coates, 1981): temperature and a ${model.kind === 'polynomial' ? 'polynomial ε(λ)' : 'polynomial ln ε(λ)'} of order ${order} fitted together; uncorrelated channel uncertainties; u(T) from the data's noise only — a wrong emissivity model biases T whatever u(T) says.`;
}

// ------------------------------------------------------------------ Raman thermometry

function ramanMode() {
  const x = spectral('oc-rm-x');
  const settings = { shiftPerCm: number('oc-rm-shift'), excitation: x.value, unit: x.unit, detection: $('oc-rm-det').value };
  return tagMap({ 'mode.shiftPerCm': 'oc-rm-shift', 'mode.excitation': 'oc-rm-x' }, () => api.ramanMode(settings), 'oc-rm-shift', {
    custom: (e) => (e.code === 'OUT_OF_RANGE' && /shift/.test(e.message)
      ? `Raman shift (${typed('oc-rm-shift')} cm⁻¹) must be below the excitation line's wavenumber (${trim(api.convertSpectral(x.value, x.unit, 'cm-1'))} cm⁻¹).`
      : undefined),
  });
}

function raman() {
  const mode = ramanMode();
  const ou = $('oc-ou').value;
  const F = mode.frequencyFactor;
  let r;
  let ratio;
  if ($('oc-rm-dir').value === 'ratio') {
    ratio = number('oc-rm-r');
    r = tag('oc-rm-r', () => mode.temperature(ratio), {
      custom: (e) => (e.code === 'OUT_OF_RANGE'
        ? `Anti-Stokes/Stokes ratio must be less than the frequency factor F = ${formatNumber(F, { digits: 5 })} (its limit at infinite temperature); you entered ${typed('oc-rm-r')}.`
        : undefined),
    });
  } else {
    const t = kelvin('oc-rm-t');
    ratio = tag('oc-rm-t', () => mode.ratio(t));
    r = tag('oc-rm-t', () => mode.temperature(ratio));
    r = { ...r, temperatureK: t };
  }
  const d = api.diffFromK(1, ou);
  const fromRatio = $('oc-rm-dir').value === 'ratio';
  fillResults($('oc-rm-res'), [
    fromRatio
      ? ['t', 'Sample temperature', showTemperature(r.temperatureK, ou), { big: true }]
      : ['ratio', 'Anti-Stokes/Stokes ratio', formatNumber(ratio, { digits: 6 }), { big: true }],
    ['dtdr', 'dT/dR (change of T per unit ratio)', `${formatNumber(r.dTdRatio * d, { digits: 4 })} ${symbol(ou)}`],
    ['rel', 'Relative sensitivity (1/R)·dR/dT', `${formatNumber((r.relativeSensitivityPerK / d) * 100, { digits: 4 })} % per ${symbol(ou)}`],
    ['n', 'Phonon occupancy n (Bose–Einstein)', formatNumber(r.phononOccupancy, { digits: 5 })],
    ['f', 'Frequency factor F (ratio as T → ∞)', formatNumber(F, { digits: 6 })],
    ['theta', 'Mode temperature θ = hcν̃/k', showDifference(r.modeTemperatureK, 'K', 6)],
  ]);
}

// ------------------------------------------------------------------ Y-factor

/** The Y-factor as a linear power ratio, read in the scale its menu shows. */
function yLinear() {
  const v = number('oc-yf-y');
  return $('oc-yf-yu').value === 'dB' ? tag('oc-yf-y', () => api.fn('decibelsToPowerRatio')(v)) : v;
}

/** Converts the Y-factor field between dB and a linear ratio (refused for a ratio ≤ 0). */
function convertY(sel) {
  const el = $('oc-yf-y');
  const from = sel.dataset.prev;
  const to = sel.value;
  if (from === to || el.value.trim() === '') {
    sel.dataset.prev = to;
    return;
  }
  let v;
  try {
    v = parseNumber(el.value);
  } catch {
    sel.value = from; // an unreadable value stays as typed, with the reader's message
    return;
  }
  if (to === 'dB' && !(v > 0)) {
    sel.value = from; // no dB value: the scale stays linear, and the message under the field says why Y is unusable
    return;
  }
  el.value = formatInput(to === 'dB' ? api.fn('powerRatioToDecibels')(v) : api.fn('decibelsToPowerRatio')(v));
  sel.dataset.prev = to;
}

/** A noise temperature (K) in `unit`; ≤ 0 K (a convention that does not fit this Y) is marked. */
function noiseT(k, unit) {
  return k > 0 ? showTemperature(k, unit) : `${formatNumber(k, { digits: 5 })} K (not physical)`;
}

const CONVENTIONS = [
  ['rayleighJeans', 'Rayleigh–Jeans: the physical temperature', 'rayleighJeansK'],
  ['planck', 'Planck: (hf/k)/(exp(hf/kT) − 1)', 'planckK'],
  ['callenWelton', 'Callen–Welton: Planck + hf/2k (zero point)', 'callenWeltonK'],
];

function yFactor() {
  const th = kelvin('oc-yf-th');
  const tc = kelvin('oc-yf-tc');
  const f = spectral('oc-yf-f');
  const y = yLinear();
  const ou = $('oc-ou').value;
  const loads = (loadModel) => tagMap({ 'loads.hotLoadK': 'oc-yf-th', 'loads.coldLoadK': 'oc-yf-tc' },
    () => api.yFactorLoads({ hotLoadK: th, coldLoadK: tc, unit: f.unit, loadModel }), 'oc-yf-th', {
      custom: (e) => (e.code === 'OUT_OF_RANGE'
        ? `Hot load temperature (${typed('oc-yf-th')} ${unitText('oc-yf-th')}) must be above the cold load temperature (${typed('oc-yf-tc')} ${unitText('oc-yf-tc')}).`
        : undefined),
    });
  const yText = $('oc-yf-yu').value === 'dB' ? `${typed('oc-yf-y')} dB` : typed('oc-yf-y');
  const read = (loadModel) => {
    const l = loads(loadModel);
    return tagMap({ frequency: 'oc-yf-f' }, () => l.receiverTemperature(y, f.value), 'oc-yf-y', {
      custom: (e) => {
        if (e.code !== 'OUT_OF_RANGE') return undefined;
        if (y <= 1) return `Y-factor must be greater than 1 (above 0 dB): the hot load must give more power than the cold one; you entered ${yText}.`;
        const yMax = l.yFactor(0, f.value);
        return `Y-factor (${yText}) must be below ${formatNumber(yMax, { digits: 4 })} (${formatNumber(api.fn('powerRatioToDecibels')(yMax), { digits: 4 })} dB), the ratio of the loads' noise temperatures: a larger Y would mean a negative receiver noise temperature.`;
      },
    });
  };
  const main = read('callenWelton');
  const d = api.diffFromK(1, ou);
  fillResults($('oc-yf-res'), [
    ['tr', 'Receiver noise temperature (Callen–Welton loads)', noiseT(main.receiverNoiseTemperatureK, ou), { big: true }],
    ['dtdy', 'dT_R/dY (per unit linear Y)', `${formatNumber(main.dTdY * d, { digits: 4 })} ${symbol(ou)}`, { labelHtml: 'dT<sub>R</sub>/dY (per unit linear Y)' }],
    ['ylin', 'Y as a power ratio', `${formatNumber(y, { digits: 6, trim: true })} (${formatNumber(api.fn('powerRatioToDecibels')(y), { digits: 6, trim: true })} dB)`],
  ]);
  // The three conventions side by side: T_R of each from the main reading (no cancellation in
  // the differences), the load noise temperatures from a reading in each convention.
  const loadTemps = (m) => {
    try {
      return read(m);
    } catch {
      return null; // this Y gives no positive T_R in that convention: its loads are still shown below
    }
  };
  const diffs = { rayleighJeans: 0, planck: main.planckMinusRayleighJeansK, callenWelton: main.callenWeltonMinusRayleighJeansK };
  const T = (k) => noiseT(k, ou);
  fillTable($('oc-yf-table'), ['Load convention', 'Hot load', 'Cold load', { html: 'T<sub>R</sub>' }, { html: `T<sub>R</sub> − T<sub>R</sub>(Rayleigh–Jeans) (${symbol(ou)})` }],
    CONVENTIONS.map(([m, name, key]) => {
      const r = m === 'callenWelton' ? main : loadTemps(m);
      return [name, r ? T(r.hotLoadNoiseTemperatureK) : '—', r ? T(r.coldLoadNoiseTemperatureK) : '—',
        { text: T(main[key]), value: main[key] }, { text: showDifference(diffs[m], ou, 3).replace(/ \S+$/, ''), value: diffs[m] }];
    }));
}

// ------------------------------------------------------------------ carrier statistics

/** An energy field (eV or meV menu) in eV. */
const eV = (id) => {
  const x = spectral(id);
  return api.convertSpectral(x.value, x.unit, 'eV');
};

function carriers() {
  const t = kelvin('oc-sc-t');
  const alpha = number('oc-sc-a');
  const material = { electronMassRatio: number('oc-sc-me'), holeMassRatio: number('oc-sc-mh'), bandGap0K: eV('oc-sc-eg'), energyUnit: 'eV' };
  if (alpha !== 0) Object.assign(material, { varshniAlpha: alpha * 1e-3, varshniBetaK: number('oc-sc-b') });
  const sc = tagMap({ electronMassRatio: 'oc-sc-me', holeMassRatio: 'oc-sc-mh', bandGap0K: 'oc-sc-eg', varshniAlpha: 'oc-sc-a', varshniBetaK: 'oc-sc-b' },
    () => api.semiconductor(material), 'oc-sc-eg');
  const gapWords = { custom: (e) => (e.code === 'NO_SOLUTION' ? `Temperature (${typed('oc-sc-t')} ${unitText('oc-sc-t')}): the Varshni band gap is 0 or less there; check α and β.` : undefined) };
  const gap = tag('oc-sc-t', () => sc.bandGap(t), gapWords);
  const ef = $('oc-sc-from').value === 'ef' ? eV('oc-sc-ef') : tag('oc-sc-n', () => sc.fermiLevelFromElectronDensity(number('oc-sc-n') * 1e6, t));
  const n = tag('oc-sc-ef', () => sc.electronDensity(ef, t));
  const p = tag('oc-sc-ef', () => sc.holeDensity(ef, t));
  const ni = tag('oc-sc-t', () => sc.intrinsic(t), gapWords);
  const cm3 = (m3) => `${formatNumber(m3 * 1e-6, { digits: 5 })} cm⁻³`;
  const err = (c) => `+${formatResolved(c.boltzmannRelativeError * 100, '%', { digits: 3, resolution: 1e-12 })}`;
  const energy = (v) => `${formatNumber(v, { digits: 6 })} eV`;
  fillResults($('oc-sc-res'), [
    ['n', 'Electron density n (Fermi–Dirac)', cm3(n.densityPerM3), { big: true }],
    ['p', 'Hole density p (Fermi–Dirac)', cm3(p.densityPerM3), { big: true }],
    ['nerr', 'Error of the Boltzmann approximation in n', err(n)],
    ['perr', 'Error of the Boltzmann approximation in p', err(p)],
    ['ef', 'Fermi level above the valence-band top', energy(ef)],
    ['ni', 'Intrinsic density nᵢ', cm3(ni.densityPerM3)],
    ['ei', 'Intrinsic Fermi level', energy(ni.fermiLevel)],
    ['eg', 'Band gap at this temperature', energy(gap)],
    ['nc', 'Effective densities of states N_c, N_v', `${cm3(sc.conductionBandDensityOfStates(t))}, ${cm3(sc.valenceBandDensityOfStates(t))}`, { labelHtml: 'Effective densities of states N<sub>c</sub>, N<sub>v</sub>' }],
  ]);
}
