// Section 1: spectra of one or several temperatures, with a shaded band and the peaks marked.
import { api } from './api.js';
import { fmt } from './fmt.js';
import { drawPlot, fillTable } from './plot.js';
import { toCsv, download } from './csv.js';
import { PageInputError, tag, readNum, readKelvinList, UNIT_LABEL } from './form.js';
import { densityUnit, bandUnit, variableName, quantityName } from './quantities.js';

const $ = (id) => document.getElementById(id);
const N = 400;
const hasBands = () => api.has('bandIntegral', 'bandFraction');

/** Checks a range lower < upper through the core's band validation (or the page's, without it). */
function checkRange(idLo, lo, hi, shape, t) {
  if (hasBands()) return tag(idLo, () => api.bandFraction(shape, lo, hi, t));
  tag(idLo, () => api.spectralToSi(lo, shape.unit));
  tag(idLo.replace('lo', 'hi'), () => api.spectralToSi(hi, shape.unit));
  if (!(lo < hi)) throw new PageInputError(idLo, `the range must satisfy from < to (got from = ${lo}, to = ${hi})`);
  return 0;
}
let last = null; // what was plotted, for the CSV export

export const spectrumSection = {
  id: 'spectrum',
  available: () => api.has('spectralDensityArray', 'spectralDensity', 'spectrumPeak', 'convertSpectral', 'convertTemperature', 'spectralUnitKind'),
  build() {
    // The shaded band needs the band bindings; without them the section plots spectra only.
    if (!hasBands()) $('sp-band-set').remove();
  },
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
    const spec = { unit, quantity, geometry, emissivity };
    const shape = { unit, quantity };
    const lo = readNum('sp-lo');
    const hi = readNum('sp-hi');
    // Validate through the core: the plot range and the shaded band as bands, emissivity once.
    checkRange('sp-lo', lo, hi, shape, temps[0]);
    tag('sp-eps', () => api.spectralValue(spec, lo, temps[0]));
    const bands = hasBands();
    const blo = bands ? readNum('sp-blo') : NaN;
    const bhi = bands ? readNum('sp-bhi') : NaN;
    if (bands) tag('sp-blo', () => api.bandFraction(shape, blo, bhi, temps[0]));

    // Densities come per SI unit of the variable; per display unit = × (SI size of one unit).
    const perUnit = api.spectralToSi(1, unit);
    const logx = $('sp-logx').checked;
    const xs = new Float64Array(N);
    for (let i = 0; i < N; i++) xs[i] = logx ? lo * (hi / lo) ** (i / (N - 1)) : lo + ((hi - lo) * i) / (N - 1);
    xs[N - 1] = hi;
    const uLabel = UNIT_LABEL[unit] || unit;
    const dUnit = densityUnit(quantity, geometry, unit);
    const series = [];
    const markers = [];
    const rows = [];
    temps.forEach((t, k) => {
      const y = api.spectrum(spec, xs, t);
      for (let i = 0; i < N; i++) y[i] *= perUnit;
      const tShown = api.fromKelvin(t, tUnit);
      const label = `${fmt(tShown, 5)} ${UNIT_LABEL[tUnit]}`;
      series.push({ label, x: xs, y });
      const pk = api.spectralPeak(shape, t);
      const pkVal = api.spectralValue(spec, pk, t) * perUnit;
      markers.push({ x: pk, y: pkVal, label: '' });
      const row = [label, `${fmt(t, 6)} K`, `${fmt(pk, 6)} ${uLabel}`, `${fmt(pkVal, 5)}`];
      if (bands) row.push(fmt(api.band(spec, blo, bhi, t), 6), `${fmt(100 * api.bandFraction(shape, blo, bhi, t), 5)} %`);
      rows.push(row);
    });
    const qName = quantityName(quantity, geometry);
    drawPlot($('sp-plot'), {
      title: `Spectral ${qName} against ${variableName(variable)}`,
      x: { label: `${variableName(variable)} (${uLabel})`, short: variableName(variable), log: logx, min: lo, max: hi, readoutUnit: uLabel },
      y: { label: `spectral ${qName} (${dUnit})`, log: $('sp-logy').checked, readoutUnit: dUnit },
      series,
      bands: bands ? [{ from: blo, to: bhi, label: 'band' }] : [],
      markers,
      caption: 'Triangles mark the peak of each curve (in the chosen spectral variable and quantity); the shaded strip is the band.',
    });
    const head = ['Temperature', 'in kelvin', `Peak (${variableName(variable)})`, `Peak value (${dUnit})`];
    if (bands) head.push(`Band ${fmt(blo, 4)}–${fmt(bhi, 4)} ${uLabel} (${bandUnit(quantity, geometry)})`, 'Fraction of total in band');
    fillTable($('sp-table'), head, rows);
    const header = [`${variableName(variable)} (${uLabel})`, ...series.map((s) => `spectral ${qName} at ${s.label} (${dUnit})`)];
    const data = [];
    for (let i = 0; i < N; i++) data.push([xs[i], ...series.map((s) => s.y[i])]);
    last = {
      csv: toCsv(header, data, [`quantaband spectrum; emissivity ${emissivity}; computed by the quantaband WebAssembly core`]),
    };
  },
};
