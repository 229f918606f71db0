// Section: instrument design. One pixel behind its optics, looking at a grey scene in two bands
// (the same pixel, optics and readout): signal electrons, photocurrent, well fill, the noise of
// one integration by source, SNR and the first-principles NETD, and a plot of NETD against the
// scene temperature for both bands (through the package's DetectorDesign).
import { api } from './api.js';
import { formatNumber } from './fmt.js';
import { drawPlot, fillResults, fillTable } from './plot.js';
import { toCsv, download } from './csv.js';
import { number, kelvin, spectral, tagMap, tagPair, FieldError, typed, labelOf, unitOf } from './fields.js';
import { showTemperature, showDifference } from './budget.js';
import { symbol } from './units.js';

const $ = (id) => document.getElementById(id);
const N = 121;
let last = null;

const BANDS = [
  { key: 'A', lo: 'dz-a0', hi: 'dz-a1', unit: 'dz-au' },
  { key: 'B', lo: 'dz-b0', hi: 'dz-b1', unit: 'dz-bu' },
];

/** A value of a page-only field that must be greater than 0 (or ≥ 0 with `zeroOk`). */
function positive(id, zeroOk = false) {
  const v = number(id);
  if (zeroOk ? v < 0 : v <= 0) {
    const u = $(id).dataset.unitText;
    throw new FieldError(id, `${labelOf(id)} must be ${zeroOk ? '0 or more' : 'greater than 0'}; you entered ${typed(id)}${u ? ` ${u}` : ''}.`);
  }
  return v;
}

/** NETD text in the chosen NETD unit (a temperature difference). */
function netdText(k, unit) {
  if (!Number.isFinite(k)) return '— (the signal does not change with temperature)';
  if (unit === 'mK') return `${formatNumber(k * 1000, { digits: 3 })} mK`;
  return showDifference(k, unit, 3);
}

function netdValue(k, unit) {
  return unit === 'mK' ? k * 1000 : api.diffFromK(k, unit);
}

/** The core's configuration paths → fields (the longest match wins). */
function pathMap(conv, px) {
  return {
    'optics.fNumber': 'dz-f',
    'optics.transmittance': 'dz-tau',
    'optics.fieldAngleRad': 'dz-th',
    'detector.pixelAreaM2': px === 'pitch' ? 'dz-pitch' : 'dz-area',
    'detector.conversion': conv === 'qe' ? 'dz-qe' : 'dz-resp',
    'detector.integrationTimeS': 'dz-ti',
    'detector.fullWellElectrons': 'dz-fw',
    'detector.darkCurrentA': 'dz-id',
    'detector.readNoiseElectrons': 'dz-rn',
    'scene.emissivity': 'dz-eps',
  };
}

/** Builds one band's DetectorDesign; its errors land under the field they concern. */
function design(base, band, map) {
  const lo = spectral(band.lo);
  const hi = spectral(band.hi);
  const def = { ...base, scene: { ...base.scene, lower: lo.value, upper: hi.value, unit: lo.unit } };
  try {
    return api.detectorDesign(def);
  } catch (e) {
    if (api.isError(e) && (e.code === 'INVALID_BAND' || /scene\.(lower|upper)/.test(e.message) || e.code === 'NON_POSITIVE_SPECTRAL')) {
      return tagPair(band.lo, band.hi, () => {
        throw e;
      });
    }
    return tagMap(map, () => {
      throw e;
    }, band.lo);
  }
}

export const designSection = {
  id: 'design',
  available: () => api.has('DetectorDesign', 'convertSpectral', 'convertTemperature'),
  wire() {
    $('dz-csv').addEventListener('click', () => last && download('quantaband-netd.csv', last.csv));
  },
  compute() {
    last = null;
    const F = number('dz-f');
    const tau = number('dz-tau');
    const thetaDeg = number('dz-th');
    if (!(thetaDeg >= 0 && thetaDeg < 90)) {
      throw new FieldError('dz-th', `Field angle must be at least 0 and less than 90; you entered ${typed('dz-th')} °.`);
    }
    const px = $('dz-px').value;
    const areaM2 = px === 'pitch' ? (positive('dz-pitch') * 1e-6) ** 2 : positive('dz-area') * 1e-12;
    const conv = $('dz-conv').value;
    const conversion = conv === 'qe' ? { kind: 'quantumEfficiency', efficiency: number('dz-qe') } : { kind: 'responsivity', amperesPerWatt: number('dz-resp') };
    const tS = number('dz-ti') * 1e-3;
    const base = {
      optics: { fNumber: F, transmittance: tau, cone: $('dz-cone').value, fieldAngleRad: (thetaDeg * Math.PI) / 180 },
      detector: {
        pixelAreaM2: areaM2,
        conversion,
        integrationTimeS: tS,
        fullWellElectrons: number('dz-fw'),
        darkCurrentA: number('dz-id') * 1e-12,
        readNoiseElectrons: number('dz-rn'),
      },
      scene: { kind: 'band', emissivity: number('dz-eps') },
    };
    const map = pathMap(conv, px);
    const designs = BANDS.map((b) => design(base, b, map));
    const t = kelvin('dz-t');
    const t0 = kelvin('dz-p0');
    const t1 = kelvin('dz-p1');
    if (!(t1 > t0)) {
      const u = symbol(unitOf('dz-p0'));
      throw new FieldError('dz-p1', `Plotted scene temperatures: the highest (${typed('dz-p1')} ${u}) must be above the lowest (${typed('dz-p0')} ${u}).`);
    }
    const reports = designs.map((d) => d.evaluate(t));
    const ou = $('dz-ou').value;
    const nu = $('dz-nu').value;
    const bandText = (b) => `${formatNumber(number(b.lo), { digits: 6, trim: true })}–${formatNumber(number(b.hi), { digits: 6, trim: true })} ${symbol(unitOf(b.lo))}`;
    const names = BANDS.map((b) => `band ${b.key} (${bandText(b)})`);

    // Main result: NETD, well fill and SNR of both bands at the scene temperature.
    const fill = (r) => `${formatNumber(r.wellFill * 100, { digits: 3 })} %${r.saturated ? ' (saturated)' : ''}`;
    fillResults($('dz-res'), [
      ['netdA', `NETD, ${names[0]}`, netdText(reports[0].netdK, nu), { big: true }],
      ['netdB', `NETD, ${names[1]}`, netdText(reports[1].netdK, nu), { big: true }],
      ['fillA', 'Well fill, band A', fill(reports[0])],
      ['fillB', 'Well fill, band B', fill(reports[1])],
      ['snrA', 'SNR, band A', formatNumber(reports[0].snr, { digits: 4 })],
      ['snrB', 'SNR, band B', formatNumber(reports[1].snr, { digits: 4 })],
    ]);
    const sat = reports.map((r, i) => (r.saturated ? BANDS[i].key : null)).filter(Boolean);
    const warn = $('dz-warn');
    warn.hidden = sat.length === 0;
    warn.textContent = sat.length
      ? `Saturated: band ${sat.join(' and band ')} fills more than the full well at ${showTemperature(t, ou, true)}. Its noise, SNR and NETD describe no real pixel; shorten the integration time or reduce the flux (higher f-number, narrower band, lower transmittance).`
      : '';

    const e = (v) => `${formatNumber(v, { digits: 4 })} e⁻`;
    const rows = [
      ['Flux on the pixel', (r) => (r.flux.kind === 'photon' ? `${formatNumber(r.flux.flux, { digits: 4 })} photons/s` : `${formatNumber(r.flux.flux, { digits: 4 })} W`)],
      ['Photocurrent', (r) => `${formatNumber(r.photocurrentA, { digits: 4 })} A`],
      ['Signal electrons Nₛ', (r) => e(r.signalElectrons)],
      ['∂Nₛ/∂T', (r) => `${formatNumber(r.dSignalElectronsDt / api.diffFromK(1, ou), { digits: 4 })} e⁻/${symbol(ou)}`],
      ['Dark electrons', (r) => e(r.darkElectrons)],
      ['Well fill', fill],
      ['Signal shot noise', (r) => `${formatNumber(r.noise.signalShotElectrons, { digits: 4 })} e⁻ rms`],
      ['Dark-current shot noise', (r) => `${formatNumber(r.noise.darkShotElectrons, { digits: 4 })} e⁻ rms`],
      ['Read noise', (r) => `${formatNumber(r.noise.readElectrons, { digits: 4 })} e⁻ rms`],
      ['Total noise', (r) => `${formatNumber(r.noise.totalElectrons, { digits: 4 })} e⁻ rms`],
      ['SNR', (r) => formatNumber(r.snr, { digits: 4 })],
      ['NETD', (r) => netdText(r.netdK, nu)],
    ];
    fillTable($('dz-table'), ['Quantity', `Band A (${bandText(BANDS[0])})`, `Band B (${bandText(BANDS[1])})`],
      rows.map(([name, f]) => [name, ...reports.map(f)]));
    $('dz-table').querySelector('caption').textContent = `One pixel, one integration of ${formatNumber(tS * 1e3, { digits: 6, trim: true })} ms, scene at ${showTemperature(t, ou, true)}`;

    // NETD against scene temperature, both bands; saturated points are left out (a gap).
    const T = Float64Array.from({ length: N }, (_, i) => t0 + ((t1 - t0) * i) / (N - 1));
    T[N - 1] = t1;
    const X = T.map((k) => api.fromK(k, ou));
    const curves = designs.map((d) => {
      const netd = d.netds(T);
      const fills = d.wellFills(T);
      return { netd, fills, y: netd.map((v, i) => (fills[i] < 1 && Number.isFinite(v) ? netdValue(v, nu) : NaN)) };
    });
    const nuSym = nu === 'mK' ? 'mK' : symbol(nu);
    const satFrom = curves.map((c) => {
      const i = c.fills.findIndex((f) => f >= 1);
      return i < 0 ? null : X[i];
    });
    const satNote = satFrom.map((x, i) => (x === null ? null : `band ${BANDS[i].key} saturates from ${formatNumber(x, { digits: 4 })} ${symbol(ou)}`)).filter(Boolean);
    drawPlot($('dz-plot'), {
      title: 'NETD against scene temperature',
      x: { label: `scene temperature (${symbol(ou)})`, short: 'T', readoutUnit: symbol(ou) },
      y: { label: `NETD (${nuSym})`, log: true, readoutUnit: nuSym },
      series: curves.map((c, i) => ({ label: names[i], x: X, y: c.y })),
      caption: `Same pixel, optics and integration in both bands.${satNote.length ? ` Saturated points are not drawn: ${satNote.join('; ')}.` : ''}`,
    });
    const f2 = $('dz-cone').value === 'exact' ? '4F² + 1' : '4F²';
    $('dz-assume').textContent =
      `Design estimate. Assumes a grey scene (ε = ${formatNumber(base.scene.emissivity, { digits: 6, trim: true })}) filling the pixel's field, flat (rectangular) bands with a band-flat ${conv === 'qe' ? 'quantum efficiency' : 'responsivity'}, ` +
      `solid angle π/(${f2})${thetaDeg > 0 ? ' with cos⁴ fall-off' : ' on axis'}, Poisson shot noise (photovoltaic or integrating detector) plus read noise; ` +
      'no 1/f noise, non-uniformity, stray light or warm-optics background. Confirm a design by measurement.';
    const inK = ou === 'K';
    const head = [`scene temperature (${symbol(ou)})`, ...(inK ? [] : ['scene temperature (K)']),
      `NETD band A (${nuSym})`, 'well fill band A', `NETD band B (${nuSym})`, 'well fill band B'];
    last = {
      csv: toCsv(head, [...T].map((k, i) => [X[i], ...(inK ? [] : [k]), netdValue(curves[0].netd[i], nu), curves[0].fills[i], netdValue(curves[1].netd[i], nu), curves[1].fills[i]]),
        [`quantaband instrument design; band A ${bandText(BANDS[0])}; band B ${bandText(BANDS[1])}; F = ${F}; tau = ${tau}; pixel area ${areaM2} m2; integration ${tS} s; well fill >= 1 means saturated`]),
    };
  },
};
