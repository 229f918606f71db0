// Section 1: spectra of one or several temperatures, with a shaded band and the peaks marked.
import { api } from './api.js';
import { fmt } from './fmt.js';
import { drawPlot, fillTable } from './plot.js';
import { toCsv, download } from './csv.js';
import { tag, readNum, readKelvinList, UNIT_LABEL } from './form.js';
import { densityUnit, bandUnit, variableName, quantityName } from './quantities.js';

const $ = (id) => document.getElementById(id);
const N = 400;
let last = null; // what was plotted, for the CSV export

export const spectrumSection = {
  id: 'spectrum',
  available: () => api.has('spectrum', 'spectralPeak', 'band', 'bandFraction', 'spectralToSi', 'toKelvin', 'fromKelvin'),
  wire() {
    $('sp-csv').addEventListener('click', () => {
      if (!last) return;
      download('quantaband-spectrum.csv', last.csv);
    });
  },
  compute() {
    last = null;
    const tUnit = $('sp-tu').value;
    const unit = $('sp-su').value;
    const variable = api.spectralKind(unit);
    const quantity = $('sp-q').value;
    const geometry = $('sp-g').value;
    const emissivity = readNum('sp-eps');
    const temps = readKelvinList('sp-t', 'sp-tu');
    const spec = { variable, quantity, geometry, emissivity };
    const loSi = tag('sp-lo', () => api.spectralToSi(readNum('sp-lo'), unit));
    const hiSi = tag('sp-hi', () => api.spectralToSi(readNum('sp-hi'), unit));
    tag('sp-lo', () => api.bandFraction({ variable, quantity }, loSi, hiSi, temps[0]));
    tag('sp-eps', () => api.spectralValue(spec, loSi, temps[0]));
    const bloSi = tag('sp-blo', () => api.spectralToSi(readNum('sp-blo'), unit));
    const bhiSi = tag('sp-bhi', () => api.spectralToSi(readNum('sp-bhi'), unit));
    tag('sp-blo', () => api.bandFraction({ variable, quantity }, bloSi, bhiSi, temps[0]));

    // Per-display-unit scale: SI coordinate of one display unit (e.g. 1 µm = 1e-6 m).
    const perUnit = api.spectralToSi(1, unit);
    const logx = $('sp-logx').checked;
    const xs = new Float64Array(N);
    const xsSi = new Float64Array(N);
    const lo = loSi / perUnit;
    const hi = hiSi / perUnit;
    for (let i = 0; i < N; i++) {
      xs[i] = logx ? lo * (hi / lo) ** (i / (N - 1)) : lo + ((hi - lo) * i) / (N - 1);
      xsSi[i] = xs[i] * perUnit;
    }
    const uLabel = UNIT_LABEL[unit] || unit;
    const dUnit = densityUnit(quantity, geometry, unit);
    const series = [];
    const markers = [];
    const rows = [];
    temps.forEach((t, k) => {
      const y = api.spectrum(spec, xsSi, t);
      for (let i = 0; i < N; i++) y[i] *= perUnit;
      const tShown = api.fromKelvin(t, tUnit);
      const label = `${fmt(tShown, 5)} ${UNIT_LABEL[tUnit]}`;
      series.push({ label, x: xs, y });
      const pkSi = api.spectralPeak({ variable, quantity }, t);
      const pk = pkSi / perUnit;
      const pkVal = api.spectralValue(spec, pkSi, t) * perUnit;
      markers.push({ x: pk, y: pkVal, label: '' });
      const bandVal = api.band(spec, bloSi, bhiSi, t);
      const frac = api.bandFraction({ variable, quantity }, bloSi, bhiSi, t);
      rows.push([label, `${fmt(t, 6)} K`, `${fmt(pk, 6)} ${uLabel}`, `${fmt(pkVal, 5)}`, `${fmt(bandVal, 6)}`, `${fmt(100 * frac, 5)} %`]);
    });
    const qName = quantityName(quantity, geometry);
    drawPlot($('sp-plot'), {
      title: `Spectral ${qName} against ${variableName(variable)}`,
      x: { label: `${variableName(variable)} (${uLabel})`, short: variableName(variable), log: logx, min: lo, max: hi, readoutUnit: uLabel },
      y: { label: `spectral ${qName} (${dUnit})`, log: $('sp-logy').checked, readoutUnit: dUnit },
      series,
      bands: [{ from: bloSi / perUnit, to: bhiSi / perUnit, label: 'band' }],
      markers,
      caption: 'Triangles mark the peak of each curve (in the chosen spectral variable and quantity); the shaded strip is the band.',
    });
    fillTable($('sp-table'), [
      'Temperature', 'in kelvin', `Peak (${variableName(variable)})`, `Peak value (${dUnit})`,
      `Band ${fmt(bloSi / perUnit, 4)}–${fmt(bhiSi / perUnit, 4)} ${uLabel} (${bandUnit(quantity, geometry)})`, 'Fraction of total in band',
    ], rows);
    const header = [`${variableName(variable)} (${uLabel})`, ...series.map((s) => `spectral ${qName} at ${s.label} (${dUnit})`)];
    const data = [];
    for (let i = 0; i < N; i++) data.push([xs[i], ...series.map((s) => s.y[i])]);
    last = {
      csv: toCsv(header, data, [`quantaband spectrum; emissivity ${emissivity}; computed by the quantaband WebAssembly core`]),
    };
  },
};
