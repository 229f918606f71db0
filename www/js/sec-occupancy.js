// Section 4: occupancy of a level against energy, and the thermal photon number of one mode.
import { api } from './api.js';
import { fmt } from './fmt.js';
import { drawPlot } from './plot.js';
import { toCsv, download } from './csv.js';
import { tag, readNum, readKelvin, PageInputError } from './form.js';
import { fillResults } from './sec-band.js';

const $ = (id) => document.getElementById(id);
const N = 401;
let last = null;

export const occupancySection = {
  id: 'occupancy',
  available: () => api.has('boseEinsteinEnergy', 'fermiDiracEnergy', 'maxwellBoltzmannEnergy', 'thermalPhotonNumber', 'convertSpectral', 'convertTemperature'),
  wire() {
    $('oc-csv').addEventListener('click', () => last && download('quantaband-occupancy.csv', last.csv));
  },
  compute() {
    last = null;
    const t = readKelvin('oc-t', 'oc-tu');
    const eV = api.spectralToSi(1, 'eV'); // joules per electronvolt, from the core's unit table
    const mu = readNum('oc-mu');
    const muJ = mu * eV;
    const axis = $('oc-axis').value;
    for (const f of this.el.querySelectorAll('[data-axis]')) f.hidden = f.dataset.axis !== axis;
    const [idLo, idHi] = axis === 'energy' ? ['oc-e0', 'oc-e1'] : ['oc-f0', 'oc-f1'];
    const a0 = readNum(idLo);
    const a1 = readNum(idHi);
    // Validate the scalar inputs through the core before sweeping.
    tag('oc-mu', () => api.occupancyFermiDirac(0, muJ, t));
    let toJ;
    if (axis === 'energy') {
      tag(idLo, () => api.occupancyFermiDirac(a0 * eV, 0, t));
      tag(idHi, () => api.occupancyFermiDirac(a1 * eV, 0, t));
      toJ = (xs) => xs.map((e) => e * eV);
    } else {
      tag(idLo, () => api.spectralToSi(a0, 'THz'));
      tag(idHi, () => api.spectralToSi(a1, 'THz'));
      toJ = (xs) => api.spectralArray(xs, 'THz', 'J'); // E = hν by the core's unit module
    }
    if (!(a1 > a0)) throw new PageInputError(idHi, `the range must satisfy from < to (got from = ${a0}, to = ${a1})`);
    const E = new Float64Array(N);
    for (let i = 0; i < N; i++) E[i] = a0 + ((a1 - a0) * i) / (N - 1);
    E[N - 1] = a1;
    const EJ = toJ(E);
    const be = new Float64Array(N);
    const fd = new Float64Array(N);
    const mb = new Float64Array(N);
    for (let i = 0; i < N; i++) {
      fd[i] = api.occupancyFermiDirac(EJ[i], muJ, t);
      mb[i] = api.occupancyMaxwellBoltzmann(EJ[i], muJ, t);
      be[i] = EJ[i] > muJ ? api.occupancyBoseEinstein(EJ[i], muJ, t) : NaN; // diverges at E ≤ μ
    }
    const muOnAxis = axis === 'energy' ? mu : muJ > 0 ? api.spectralArray(Float64Array.of(muJ), 'J', 'THz')[0] : NaN;
    drawPlot($('oc-plot'), {
      title: 'Occupancy against level energy',
      x: axis === 'energy' ? { label: 'level energy E (eV)', short: 'E', readoutUnit: 'eV' } : { label: 'level frequency ν = E/h (THz)', short: 'ν', readoutUnit: 'THz' },
      y: { label: 'mean occupancy (particles per state)', log: $('oc-logy').checked, floorDecades: 10, readoutUnit: '' },
      series: [
        { label: 'Bose–Einstein', x: E, y: be },
        { label: 'Fermi–Dirac', x: E, y: fd },
        { label: 'Maxwell–Boltzmann', x: E, y: mb },
      ],
      bands: [],
      markers: [{ x: muOnAxis, y: 0.5, label: 'μ' }],
      caption: 'Bose–Einstein is drawn only for E > μ, where it is finite; the triangle marks μ at occupancy ½.',
    });
    last = {
      csv: toCsv([axis === 'energy' ? 'energy (eV)' : 'frequency (THz)', 'energy (J)', 'Bose-Einstein', 'Fermi-Dirac', 'Maxwell-Boltzmann'], [...E].map((e, i) => [e, EJ[i], be[i], fd[i], mb[i]]),
        [`quantaband occupancy; T = ${t} K; mu = ${mu} eV`]),
    };

    const f = tag('oc-f', () => api.spectralToSi(readNum('oc-f'), 'GHz'));
    const tf = readKelvin('oc-ft', 'oc-tu');
    const n = tag('oc-f', () => api.photonNumber(f, tf));
    const items = [['n', 'Thermal photon number n̄', fmt(n, 7), 'photons per mode', true]];
    if (api.has('quantumNoiseTemperature')) items.push(['tnoise', 'Noise temperature (hf/2k)·coth(hf/2kT)', fmt(api.noiseTemperature(f, tf), 7), 'K', true]);
    if (api.has('rayleighJeansBrightnessTemperature')) items.push(['trj', 'Rayleigh–Jeans brightness temperature', fmt(api.rayleighJeansTemperature(f, tf), 7), 'K']);
    if (api.has('availableNoisePowerDensity', 'availableNoisePowerDensityWithZeroPoint')) {
      items.push(['p', 'Available noise power per bandwidth, n̄·hf', fmt(api.noisePower(f, tf, false), 7), 'W/Hz']);
      items.push(['pz', 'Same with the zero-point half quantum, (n̄+½)·hf', fmt(api.noisePower(f, tf, true), 7), 'W/Hz']);
    }
    fillResults($('oc-res'), items);
  },
};
