// Section: spectra of one or several temperatures, with a shaded band and the peaks marked.
// Inputs keep their own units (temperatures, plot range, band); the plot's spectral variable
// and the temperatures shown are output choices that never change the inputs.
import { api } from './api.js';
import { formatNumber } from './fmt.js';
import { drawPlot, fillTable } from './plot.js';
import { toCsv, download } from './csv.js';
import { tag, tagPair, number, kelvinList, spectral, FieldError, labelOf } from './fields.js';
import { symbol, kindWord, densityUnit, bandUnit, quantityName } from './units.js';
import { showTemperature } from './budget.js';

const $ = (id) => document.getElementById(id);
const N = 400;
let last = null; // what was plotted, for the CSV export

export const spectrumSection = {
  id: 'spectrum',
  available: () => api.has('Spectrum', 'convertSpectral', 'convertTemperature', 'spectralUnitKind'),
  wire() {
    $('sp-csv').addEventListener('click', () => last && download('quantaband-spectrum.csv', last.csv));
  },
  compute() {
    last = null;
    const quantity = $('sp-q').value;
    const geometry = $('sp-g').value;
    const temps = kelvinList('sp-t');
    const emissivity = number('sp-eps');
    tag('sp-eps', () => api.spectrum({ unit: 'um', emissivity }));
    const range = { lo: spectral('sp-lo').value, hi: spectral('sp-hi').value, unit: $('sp-ru').value };
    const band = { lo: spectral('sp-blo').value, hi: spectral('sp-bhi').value, unit: $('sp-bu').value };
    const shape = (unit) => api.spectrum({ unit, quantity, geometry, emissivity });
    tagPair('sp-lo', 'sp-hi', () => shape(range.unit).bandFraction(range.lo, range.hi, temps[0]));
    tagPair('sp-blo', 'sp-bhi', () => shape(band.unit).bandFraction(band.lo, band.hi, temps[0]));

    // Output choices: the plot's spectral variable and the temperatures' display unit.
    const xu = $('sp-xu').value;
    const ou = $('sp-ou').value;
    const variable = api.spectralKind(xu);
    const toX = (v, u) => api.convertSpectral(v, u, xu);
    const [x0, x1] = [toX(range.lo, range.unit), toX(range.hi, range.unit)].sort((a, b) => a - b);
    const [b0, b1] = [toX(band.lo, band.unit), toX(band.hi, band.unit)].sort((a, b) => a - b);
    const logx = $('sp-logx').checked;
    if (logx && !(x0 > 0)) throw new FieldError('sp-lo', `${labelOf('sp-lo')} must be greater than 0 for a logarithmic axis.`);
    const xs = new Float64Array(N);
    for (let i = 0; i < N; i++) xs[i] = logx ? x0 * (x1 / x0) ** (i / (N - 1)) : x0 + ((x1 - x0) * i) / (N - 1);
    xs[N - 1] = x1;
    const plotSpec = shape(xu); // densities per plot unit (µm⁻¹, cm, THz⁻¹ …)
    const xLabel = symbol(xu);
    const dUnit = densityUnit(quantity, geometry, xu);
    const bUnit = bandUnit(quantity, geometry);
    const series = [];
    const markers = [];
    const rows = [];
    temps.forEach((t) => {
      const y = plotSpec.points(xs, t);
      const label = showTemperature(t, ou, true);
      series.push({ label, x: xs, y });
      const pk = plotSpec.peak(t);
      const pkVal = plotSpec.point(pk, t);
      markers.push({ x: pk, y: pkVal });
      rows.push([
        label,
        `${formatNumber(pk, { digits: 6 })} ${xLabel}`,
        `${formatNumber(pkVal, { digits: 6 })} ${dUnit}`,
        `${formatNumber(shape(band.unit).band(band.lo, band.hi, t), { digits: 6 })} ${bUnit}`,
        `${formatNumber(100 * shape(band.unit).bandFraction(band.lo, band.hi, t), { digits: 5 })} %`,
      ]);
    });
    const qName = quantityName(quantity, geometry);
    const vName = kindWord(variable);
    drawPlot($('sp-plot'), {
      title: `Spectral ${qName} against ${vName}`,
      x: { label: `${vName} (${xLabel})`, short: vName, log: logx, min: x0, max: x1, readoutUnit: xLabel },
      y: { label: `spectral ${qName} (${dUnit})`, log: $('sp-logy').checked, readoutUnit: dUnit },
      series,
      bands: [{ from: b0, to: b1, label: 'band' }],
      markers,
      legend: true,
      caption: `Triangles mark each curve's peak in ${vName} (the peak depends on the spectral variable); the shaded strip is the band.`,
    });
    $('sp-assume').textContent = emissivity === 1
      ? 'A blackbody (ε = 1).'
      : `A grey body: ε = ${formatNumber(emissivity, { digits: 6, trim: true })} at every wavelength.`;
    const bandText = `${formatNumber(band.lo, { digits: 6, trim: true })}–${formatNumber(band.hi, { digits: 6, trim: true })} ${symbol(band.unit)}`;
    fillTable($('sp-table'), ['Temperature', `Peak ${vName}`, 'Spectral value at the peak', `In the band ${bandText}`, 'Fraction of the total'], rows);

    // One header per column, unique even when a temperature is listed twice.
    const header = [`${vName} (${xLabel})`, ...series.map((s, k) => `spectral ${qName} at ${s.label}${series.findIndex((o) => o.label === s.label) < k ? ` (entry ${k + 1})` : ''} (${dUnit})`)];
    const data = [];
    for (let i = 0; i < N; i++) data.push([xs[i], ...series.map((s) => s.y[i])]);
    last = {
      csv: toCsv(header, data, [
        `quantaband spectrum; emissivity ${emissivity}; temperatures ${temps.map((t) => `${t} K`).join(', ')}`,
        'computed by the quantaband WebAssembly core',
      ]),
    };
  },
};
