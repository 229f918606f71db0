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
    const e0 = readNum('oc-e0');
    const e1 = readNum('oc-e1');
    const muJ = mu * eV;
    // Validate the scalar inputs once through the core (the first energy of the range).
    tag('oc-mu', () => api.occupancyFermiDirac(0, muJ, t));
    tag('oc-e0', () => api.occupancyFermiDirac(e0 * eV, 0, t));
    tag('oc-e1', () => api.occupancyFermiDirac(e1 * eV, 0, t));
    if (!(e1 > e0)) throw new PageInputError('oc-e1', `the energy range must satisfy from < to (got from = ${e0}, to = ${e1})`);
    const E = new Float64Array(N);
    const be = new Float64Array(N);
    const fd = new Float64Array(N);
    const mb = new Float64Array(N);
    for (let i = 0; i < N; i++) {
      E[i] = e0 + ((e1 - e0) * i) / (N - 1);
      const eJ = E[i] * eV;
      fd[i] = api.occupancyFermiDirac(eJ, muJ, t);
      mb[i] = api.occupancyMaxwellBoltzmann(eJ, muJ, t);
      be[i] = E[i] > mu ? api.occupancyBoseEinstein(eJ, muJ, t) : NaN; // diverges at E ≤ μ
    }
    drawPlot($('oc-plot'), {
      title: 'Occupancy against level energy',
      x: { label: 'level energy E (eV)', short: 'E', readoutUnit: 'eV' },
      y: { label: 'mean occupancy (particles per state)', log: $('oc-logy').checked, floorDecades: 10, readoutUnit: '' },
      series: [
        { label: 'Bose–Einstein', x: E, y: be },
        { label: 'Fermi–Dirac', x: E, y: fd },
        { label: 'Maxwell–Boltzmann', x: E, y: mb },
      ],
      bands: [],
      markers: [{ x: mu, y: 0.5, label: 'μ' }],
      caption: 'Bose–Einstein is drawn only for E > μ, where it is finite; the triangle marks μ at occupancy ½.',
    });
    last = {
      csv: toCsv(['energy (eV)', 'Bose-Einstein', 'Fermi-Dirac', 'Maxwell-Boltzmann'], [...E].map((e, i) => [e, be[i], fd[i], mb[i]]),
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
