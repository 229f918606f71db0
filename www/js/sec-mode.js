// Section: one mode of the radiation field (a microwave or terahertz channel, an IR mode): its
// thermal photon number, quantum noise temperature, Rayleigh–Jeans brightness temperature and
// available noise power, with its own frequency (any frequency unit, or a wavelength or
// wavenumber) and its own temperature, and a plot of the photon number around it.
import { api } from './api.js';
import { formatNumber } from './fmt.js';
import { drawPlot, fillResults } from './plot.js';
import { kelvin, spectral, tag } from './fields.js';
import { symbol } from './units.js';
import { showTemperature } from './budget.js';

const $ = (id) => document.getElementById(id);
const N = 241;

export const modeSection = {
  id: 'mode',
  available: () => api.has('thermalPhotonNumber', 'quantumNoiseTemperature', 'rayleighJeansBrightnessTemperature',
    'availableNoisePowerDensity', 'availableNoisePowerDensityWithZeroPoint', 'convertSpectral', 'convertTemperature'),
  compute() {
    const f = spectral('md-f');
    const t = kelvin('md-t');
    const hz = tag('md-f', () => api.convertSpectral(f.value, f.unit, 'Hz'));
    const n = tag('md-f', () => api.fn('thermalPhotonNumber')(hz, t));
    const ou = $('md-ou').value;
    const xu = $('md-xu').value;
    const tn = api.fn('quantumNoiseTemperature')(hz, t);
    const trj = api.fn('rayleighJeansBrightnessTemperature')(hz, t);
    const p = api.fn('availableNoisePowerDensity')(hz, t);
    const pz = api.fn('availableNoisePowerDensityWithZeroPoint')(hz, t);
    const hf = api.convertSpectral(hz, 'Hz', 'meV');
    fillResults($('md-res'), [
      ['n', 'Thermal photon number n̄ (photons per mode)', formatNumber(n, { digits: 7 }), { big: true }],
      ['tnoise', 'Quantum noise temperature (hf/2k)·coth(hf/2kT)', showTemperature(tn, ou)],
      ['trj', 'Rayleigh–Jeans brightness temperature n̄·hf/k', showTemperature(trj, ou)],
      ['p', 'Available noise power per hertz, n̄·hf', `${formatNumber(p, { digits: 7 })} W/Hz`],
      ['pz', 'Same with the zero-point half quantum, (n̄ + ½)·hf', `${formatNumber(pz, { digits: 7 })} W/Hz`],
      ['hf', 'Photon energy hf', `${formatNumber(hf, { digits: 7 })} meV`],
    ]);
    // n̄ against frequency, two decades either side of the chosen one, at this mode's temperature.
    const fx = api.convertSpectral(hz, 'Hz', xu);
    const xs = Float64Array.from({ length: N }, (_, i) => fx * 10 ** (-2 + (4 * i) / (N - 1)));
    const hzs = api.convertSpectralArray(xs, xu, 'Hz');
    const nbar = api.fn('thermalPhotonNumber');
    const ys = Float64Array.from(hzs, (h) => nbar(h, t));
    drawPlot($('md-plot'), {
      title: 'Thermal photon number against frequency',
      x: { label: `frequency (${symbol(xu)})`, short: 'f', log: true, readoutUnit: symbol(xu) },
      y: { label: 'thermal photon number n̄ (photons per mode)', log: true, floorDecades: 14, readoutUnit: '' },
      series: [{ label: `n̄ at ${showTemperature(t, ou, true)}`, x: xs, y: ys }],
      markers: [{ x: fx, y: n, label: '' }],
      legend: true,
      caption: `The triangle marks the mode above, at its own temperature ${showTemperature(t, ou, true)}.`,
    });
  },
};
