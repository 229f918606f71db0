// Section 2: band quantities at one temperature and over a temperature sweep.
import { api } from './api.js';
import { fmt } from './fmt.js';
import { drawPlot, fillTable } from './plot.js';
import { toCsv, download } from './csv.js';
import { PageInputError, tag, readNum, readKelvin, UNIT_LABEL } from './form.js';
import { bandUnit } from './quantities.js';

const $ = (id) => document.getElementById(id);
let last = null;


function result(dl, items) {
  dl.innerHTML = '';
  for (const [key, label, value, unit, big] of items) {
    const div = document.createElement('div');
    div.dataset.key = key;
    const dt = document.createElement('dt');
    dt.textContent = label;
    const dd = document.createElement('dd');
    dd.textContent = `${value} ${unit}`.trim();
    if (big) dd.className = 'big';
    div.append(dt, dd);
    dl.appendChild(div);
  }
}
export { result as fillResults };

export const bandSection = {
  id: 'band',
  available: () => api.has('bandIntegral', 'bandIntegralDT', 'bandFraction', 'bandIntegralArray', 'bandIntegralDTArray', 'convertTemperature', 'spectralUnitKind'),
  wire() {
    $('bd-csv').addEventListener('click', () => last && download('quantaband-band-sweep.csv', last.csv));
  },
  compute() {
    last = null;
    const unit = $('bd-su').value;
    const tUnit = $('bd-tu').value;
    const variable = api.spectralKind(unit);
    const geometry = $('bd-g').value;
    const lo = readNum('bd-lo');
    const hi = readNum('bd-hi');
    const t = readKelvin('bd-t', 'bd-tu');
    const emissivity = readNum('bd-eps');
    const eSpec = { unit, quantity: 'energy', geometry, emissivity };
    const pSpec = { unit, quantity: 'photon', geometry, emissivity };
    tag('bd-lo', () => api.bandFraction({ unit }, lo, hi, t));
    const L = tag('bd-eps', () => api.band(eSpec, lo, hi, t));
    const P = api.band(pSpec, lo, hi, t);
    const F = api.bandFraction({ unit }, lo, hi, t);
    const dL = api.bandDdt(eSpec, lo, hi, t);
    const contrast = (100 * dL) / L;
    const uL = bandUnit('energy', geometry);
    const uP = bandUnit('photon', geometry);
    const uLabel = UNIT_LABEL[unit];
    const tLabel = UNIT_LABEL[tUnit];
    const name = geometry === 'radiance' ? 'radiance' : 'exitance';
    result($('bd-res'), [
      ['L', `Band ${name}`, fmt(L, 7), uL, true],
      ['P', `Band photon ${name}`, fmt(P, 7), uP],
      ['F', 'Fraction of the total (energy)', fmt(100 * F, 7), '%'],
      ['dLdT', `d(band ${name})/dT`, fmt(dL, 7), `${uL}·K⁻¹`],
      ['contrast', 'Thermal contrast (dL/dT)/L', fmt(contrast, 6), '%/K'],
    ]);

    // sweep
    const t0 = readKelvin('bd-t0', 'bd-tu');
    const t1 = readKelvin('bd-t1', 'bd-tu');
    const nRaw = readNum('bd-n');
    if (!(Number.isInteger(nRaw) && nRaw >= 2 && nRaw <= 200)) {
      throw new PageInputError('bd-n', `steps must be a whole number from 2 to 200 (got ${$('bd-n').value.trim() || 'nothing'})`);
    }
    const temps = new Float64Array(nRaw);
    for (let i = 0; i < nRaw; i++) temps[i] = t0 + ((t1 - t0) * i) / (nRaw - 1);
    const Ls = api.bandOverTemperatures(eSpec, lo, hi, temps);
    const Ps = api.bandOverTemperatures(pSpec, lo, hi, temps);
    const dLs = api.bandDdtOverTemperatures(eSpec, lo, hi, temps);
    const shown = temps.map((tk) => api.fromKelvin(tk, tUnit));
    const rows = [];
    const csvRows = [];
    for (let i = 0; i < nRaw; i++) {
      const c = (100 * dLs[i]) / Ls[i];
      rows.push([`${fmt(shown[i], 6)} ${tLabel}`, fmt(Ls[i], 6), fmt(Ps[i], 6), fmt(dLs[i], 6), fmt(c, 5)]);
      csvRows.push([shown[i], temps[i], Ls[i], Ps[i], dLs[i], c]);
    }
    fillTable($('bd-table'), [`Temperature (${tLabel})`, `Band ${name} (${uL})`, `Photon ${name} (${uP})`, `dL/dT (${uL}·K⁻¹)`, 'Contrast (%/K)'], rows);
    // The plot uses a fine grid over the same range (the table keeps the chosen steps).
    const fine = new Float64Array(121);
    for (let i = 0; i < fine.length; i++) fine[i] = t0 + ((t1 - t0) * i) / (fine.length - 1);
    const fineL = api.bandOverTemperatures(eSpec, lo, hi, fine);
    const fineShown = fine.map((tk) => api.fromKelvin(tk, tUnit));
    drawPlot($('bd-plot'), {
      title: `Band ${name} against temperature`,
      x: { label: `temperature (${tLabel})`, short: 'T', readoutUnit: tLabel },
      y: { label: `band ${name} (${uL})`, readoutUnit: uL },
      series: [{ label: `${fmt(lo, 4)}–${fmt(hi, 4)} ${uLabel}`, x: fineShown, y: fineL }],
      markers: [{ x: api.fromKelvin(t, tUnit), y: L, label: '' }],
      caption: 'The triangle marks the single temperature above.',
    });
    last = {
      csv: toCsv(
        [`temperature (${tLabel})`, 'temperature (K)', `band ${name} (${uL})`, `band photon ${name} (${uP})`, `dL/dT (${uL}/K)`, 'thermal contrast (%/K)'],
        csvRows,
        [`quantaband band sweep; band ${lo} to ${hi} ${unit} (${variable}); emissivity ${emissivity}`],
      ),
    };
  },
};
