// Section: Bose–Einstein, Fermi–Dirac and Maxwell–Boltzmann occupancy against level energy.
import { api } from './api.js';
import { formatNumber } from './fmt.js';
import { drawPlot, fillResults } from './plot.js';
import { toCsv, download } from './csv.js';
import { kelvin, spectral, tag, FieldError, typed, unitText } from './fields.js';
import { symbol, kindWord } from './units.js';

const $ = (id) => document.getElementById(id);
const N = 401;
let last = null;

export const occupancySection = {
  id: 'occupancy',
  available: () => api.has('boseEinsteinEnergy', 'fermiDiracEnergy', 'maxwellBoltzmannEnergy', 'convertSpectral', 'convertTemperature', 'constants'),
  wire() {
    $('oc-csv').addEventListener('click', () => last && download('quantaband-occupancy.csv', last.csv));
  },
  compute() {
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
  },
};
