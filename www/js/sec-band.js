// Section: band quantities at one temperature and over a temperature sweep.
import { api } from './api.js';
import { formatNumber } from './fmt.js';
import { drawPlot, fillTable, fillResults } from './plot.js';
import { toCsv, download } from './csv.js';
import { tag, tagPair, number, kelvin, spectral, count, FieldError, typed, unitText } from './fields.js';
import { bandUnit, symbol } from './units.js';
import { showTemperature, temperatureDecimals } from './budget.js';

const $ = (id) => document.getElementById(id);
let last = null;

export const bandSection = {
  id: 'band',
  available: () => api.has('Spectrum', 'convertTemperature', 'spectralUnitKind'),
  wire() {
    $('bd-csv').addEventListener('click', () => last && download('quantaband-band-sweep.csv', last.csv));
  },
  compute() {
    last = null;
    const unit = $('bd-bu').value;
    const geometry = $('bd-g').value;
    const lo = spectral('bd-lo').value;
    const hi = spectral('bd-hi').value;
    const t = kelvin('bd-t');
    const emissivity = number('bd-eps');
    const energy = tag('bd-eps', () => api.spectrum({ unit, quantity: 'energy', geometry, emissivity }));
    const photon = api.spectrum({ unit, quantity: 'photon', geometry, emissivity });
    const F = tagPair('bd-lo', 'bd-hi', () => energy.bandFraction(lo, hi, t));
    const L = energy.band(lo, hi, t);
    const P = photon.band(lo, hi, t);
    const dL = energy.bandDerivative(lo, hi, t);
    const contrast = (100 * dL) / L;
    const uL = bandUnit('energy', geometry);
    const uP = bandUnit('photon', geometry);
    const ou = $('bd-ou').value;
    const tL = symbol(ou);
    const perDeg = api.diffToK(1, ou); // kelvin per output degree: d/dT per °F = d/dT per K × 5/9
    const name = geometry === 'radiance' ? 'radiance' : 'exitance';
    fillResults($('bd-res'), [
      ['L', `Band ${name}`, `${formatNumber(L, { digits: 7 })} ${uL}`, { big: true }],
      ['P', `Band photon ${name}`, `${formatNumber(P, { digits: 7 })} ${uP}`],
      ['F', 'Fraction of the total (energy)', `${formatNumber(100 * F, { digits: 7 })} %`],
      ['dLdT', `d(band ${name})/dT`, `${formatNumber(dL * perDeg, { digits: 7 })} ${uL}·${tL}⁻¹`],
      ['contrast', 'Thermal contrast (dL/dT)/L', `${formatNumber(contrast * perDeg, { digits: 6 })} %/${tL}`],
      ['t', 'Temperature', showTemperature(t, ou, true)],
    ]);
    $('bd-assume').textContent = `Assumes a flat (rectangular) band response from ${formatNumber(lo, { digits: 6, trim: true })} to ${formatNumber(hi, { digits: 6, trim: true })} ${symbol(unit)} and a grey body (ε = ${formatNumber(emissivity, { digits: 6, trim: true })} at every wavelength in the band).`;

    // Sweep
    const t0 = kelvin('bd-t0');
    const t1 = kelvin('bd-t1');
    if (!(t1 > t0)) {
      const U = unitText('bd-t0');
      throw new FieldError('bd-t1', `Sweep end (${typed('bd-t1')} ${U}) must be above the sweep start (${typed('bd-t0')} ${U}).`);
    }
    const n = count('bd-n', 2, 200);
    const temps = Float64Array.from({ length: n }, (_, i) => t0 + ((t1 - t0) * i) / (n - 1));
    const Ls = energy.bands(lo, hi, temps);
    const Ps = photon.bands(lo, hi, temps);
    const dLs = energy.bandDerivatives(lo, hi, temps);
    const shown = temps.map((tk) => api.fromK(tk, ou));
    const rows = [];
    const csvRows = [];
    for (let i = 0; i < n; i++) {
      const c = (100 * dLs[i]) / Ls[i];
      rows.push([
        formatNumber(shown[i], { decimals: temperatureDecimals(temps[i]), trim: true }),
        formatNumber(Ls[i], { digits: 6 }),
        formatNumber(Ps[i], { digits: 6 }),
        formatNumber(dLs[i] * perDeg, { digits: 6 }),
        formatNumber(c * perDeg, { digits: 5 }),
      ]);
      csvRows.push(ou === 'K' ? [temps[i], Ls[i], Ps[i], dLs[i], c] : [temps[i], shown[i], Ls[i], Ps[i], dLs[i], c]);
    }
    fillTable($('bd-table'), [`Temperature (${tL})`, `Band ${name} (${uL})`, `Photon ${name} (${uP})`, `dL/dT (${uL}·${tL}⁻¹)`, `Contrast (%/${tL})`], rows);
    const fine = Float64Array.from({ length: 121 }, (_, i) => t0 + ((t1 - t0) * i) / 120);
    drawPlot($('bd-plot'), {
      title: `Band ${name} against temperature`,
      x: { label: `temperature (${tL})`, short: 'T', readoutUnit: tL },
      y: { label: `band ${name} (${uL})`, readoutUnit: uL },
      series: [{ label: `${formatNumber(lo, { digits: 6, trim: true })}–${formatNumber(hi, { digits: 6, trim: true })} ${symbol(unit)}`, x: fine.map((tk) => api.fromK(tk, ou)), y: energy.bands(lo, hi, fine) }],
      markers: [{ x: api.fromK(t, ou), y: L }],
      caption: 'The triangle marks the single temperature above.',
    });
    const head = ['temperature (K)', `band ${name} (${uL})`, `band photon ${name} (${uP})`, `dL/dT (${uL}·K⁻¹)`, 'thermal contrast (%/K)'];
    if (ou !== 'K') head.splice(1, 0, `temperature (${tL})`);
    last = {
      csv: toCsv(head, csvRows, [`quantaband band sweep; band ${lo} to ${hi} ${symbol(unit)}; emissivity ${emissivity}; flat band response, grey body`]),
    };
  },
};
