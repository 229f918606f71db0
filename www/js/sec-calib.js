// Section: Sakuma–Hattori calibration curve from calibration points, the object temperature of
// one reading with its uncertainty budget, and whole-frame conversion of raw counts to a
// false-colour map.
import { api } from './api.js';
import { formatNumber } from './fmt.js';
import { drawPlot, fillTable, fillResults } from './plot.js';
import { tag, tagMap, number, table, typed, kelvin, kelvinDiff, FieldError, wireLoaders } from './fields.js';
import { symbol } from './units.js';
import { fillBudget, showTemperature, showDifference, readScene, budgetRows, temperatureDecimals, measurementGumMarkup, readMeasurementGum, gumCall, gumView, uncertaintyItems } from './budget.js';
import { emberRamp } from './colormap.js';
import { kilnConveyorScene, SCENE_W, SCENE_H } from './scene.js';
import { shared } from './shared.js';

const $ = (id) => document.getElementById(id);
const RAMP = emberRamp(256);
const scene = kilnConveyorScene();
let frame = null; // last converted frame, for the pointer readout
let cursor = { x: SCENE_W >> 1, y: SCENE_H >> 1 };
const trim = (v) => formatNumber(v, { digits: 6, trim: true });

function drawScale(minK, maxK, unit) {
  const c = $('cf-scale');
  const ctx = c.getContext('2d');
  const img = ctx.createImageData(1, 256);
  for (let i = 0; i < 256; i++) {
    const k = 255 - i; // hot at the top
    img.data.set([RAMP[3 * k], RAMP[3 * k + 1], RAMP[3 * k + 2], 255], 4 * i);
  }
  ctx.putImageData(img, 0, 0);
  const ticks = $('cf-ticks');
  ticks.textContent = '';
  for (let j = 0; j <= 4; j++) {
    const s = document.createElement('span');
    s.textContent = `${formatNumber(api.fromK(maxK - ((maxK - minK) * j) / 4, unit), { decimals: 1 })} ${symbol(unit)}`;
    ticks.appendChild(s);
  }
}

function drawFrame(temps, minK, maxK) {
  const ctx = $('cf-canvas').getContext('2d');
  const img = ctx.createImageData(SCENE_W, SCENE_H);
  const span = maxK - minK || 1;
  for (let i = 0; i < temps.length; i++) {
    const t = temps[i];
    let rgb = [150, 150, 150];
    if (Number.isFinite(t)) {
      const k = Math.max(0, Math.min(255, Math.round(((t - minK) / span) * 255)));
      rgb = [RAMP[3 * k], RAMP[3 * k + 1], RAMP[3 * k + 2]];
    }
    img.data.set([...rgb, 255], 4 * i);
  }
  ctx.putImageData(img, 0, 0);
  ctx.strokeStyle = '#ffffff';
  ctx.lineWidth = 1;
  ctx.strokeRect(cursor.x - 2.5, cursor.y - 2.5, 6, 6);
}

function readout() {
  if (!frame) return;
  const i = cursor.y * SCENE_W + cursor.x;
  const t = frame.temperaturesK[i];
  $('cf-readout').textContent = Number.isFinite(t)
    ? `pixel (${cursor.x}, ${cursor.y}): ${showTemperature(t, $('cf-ou').value)}  (raw ${frame.counts[i]} counts)`
    : `pixel (${cursor.x}, ${cursor.y}): no valid temperature (raw ${frame.counts[i]} counts)`;
  $('cf-canvas').dataset.readoutK = String(t);
}

/** Words for the response table's core errors, naming its lines. */
function responseWords(lines, wl, values) {
  return (e) => {
    const first = (pred) => lines[Math.max(0, [...wl].findIndex((_, i) => pred(i)))];
    if (e.code === 'NOT_INCREASING') {
      const k = Number(/element (\d+)/.exec(e.message)?.[1] ?? 1);
      return `Spectral response: the wavelengths must increase from line to line; line ${lines[k]} is not above line ${lines[k - 1]}.`;
    }
    if (e.code === 'NON_POSITIVE_SPECTRAL') return `Spectral response: wavelengths must be greater than 0 (line ${first((i) => !(wl[i] > 0))}).`;
    if (e.code === 'OUT_OF_RANGE') return `Spectral response: a relative response must be 0 or more (line ${first((i) => values[i] < 0)}).`;
    if (e.code === 'NON_POSITIVE') return 'Spectral response: every relative response is 0; at least one must be greater than 0.';
    return undefined;
  };
}

/** Words for the fit's core errors, naming the lines of the points concerned. */
function fitWords(lines, tK, sig) {
  return (e) => {
    if (e.code === 'DEGENERATE_FIT' && /repeated/.test(e.message)) {
      for (let i = 0; i < tK.length; i++) for (let j = i + 1; j < tK.length; j++) {
        if (tK[i] === tK[j]) return `Calibration points: lines ${lines[i]} and ${lines[j]} have the same temperature; each point needs its own.`;
      }
    }
    if (e.code === 'DEGENERATE_FIT') {
      const order = [...tK.keys()].sort((a, b) => tK[a] - tK[b]);
      for (let k = 1; k < order.length; k++) {
        if (!(sig[order[k]] > sig[order[k - 1]])) {
          return `Calibration points: the signal must increase with temperature, but line ${lines[order[k]]} (hotter) has no more signal than line ${lines[order[k - 1]]}.`;
        }
      }
      return 'Calibration points: these points do not determine a curve (A, B and C); add points spread over the range.';
    }
    if (e.code === 'NON_POSITIVE') {
      const i = [...sig].findIndex((s) => !(s > 0));
      return `Calibration points: the signal must be greater than 0 (line ${lines[Math.max(0, i)]}).`;
    }
    if (e.code === 'NOT_CONVERGED') return 'Calibration points: the curve fit did not converge for these points.';
    return undefined;
  };
}


const d = (k, ou) => api.diffFromK(k, ou); // a kelvin difference in the output unit
const FP = { indium: 'In', tin: 'Sn', zinc: 'Zn', aluminium: 'Al', silver: 'Ag', gold: 'Au', copper: 'Cu' };

/**
 * Calibration transfer of the least-squares curve (the core's readingUncertainty): each point's
 * ∂T/∂Tᵢ and ∂T/∂Sᵢ for the reading n as columns of the points table, and u_cal.
 */
function transfer(tK, sig, lines, n, un, ou, resShown, tShown, bare) {
  const tL = symbol(ou);
  const ut = kelvinDiff('cf-ut');
  const us = number('cf-us');
  const uSignals = Float64Array.from(sig, (s) => (s * us) / 100);
  const r = tagMap({ 'options.uTemperaturesK': 'cf-ut', 'options.uSignals': 'cf-us', uSignal: 'cf-un' },
    () => api.fitReading(tK, sig, { uTemperaturesK: ut, uSignals }, n, un), 'cf-n');
  const rows = [];
  for (let i = 0; i < tK.length; i++) {
    const fitted = bare.signal(tK[i]);
    rows.push([
      formatNumber(tShown[i], { decimals: temperatureDecimals(tK[i]), trim: true }),
      formatNumber(sig[i], { digits: 7 }),
      formatNumber(fitted, { digits: 7 }),
      `${formatNumber((100 * (sig[i] - fitted)) / fitted, { digits: 3 })} %`,
      formatNumber(resShown[i], { digits: 3 }),
      { text: formatNumber(r.dTdReferenceTemperatures[i], { digits: 3 }), value: r.dTdReferenceTemperatures[i] },
      { text: formatNumber(d(r.dTdReferenceSignals[i], ou), { digits: 3 }), value: r.dTdReferenceSignals[i] },
    ]);
  }
  fillTable($('cf-table'), [`Temperature (${tL})`, 'Measured signal (counts)', 'Curve signal (counts)', 'Signal residual', `T(curve⁻¹(signal)) − T (m${tL})`,
    { html: '∂<i>T</i>/∂<i>T</i><sub>i</sub> of the reading' }, { html: `∂<i>T</i>/∂<i>S</i><sub>i</sub> (${tL}/count)` }], rows);
  fillResults($('cf-xres'), [
    ['tcal', 'Blackbody temperature of the reading through the curve', showTemperature(r.temperatureK, ou)],
    ['ucal', 'Uncertainty from the calibration points, u_cal', showDifference(r.uCalibrationK, ou, 2), { labelHtml: 'From the calibration points, <i>u</i><sub>cal</sub>' }],
    ['usig', 'From the reading\u2019s own signal', showDifference(r.uSignalK, ou, 2)],
    ['sum', 'Sum of ∂T/∂Tᵢ (1 by construction)', formatNumber(r.dTdReferenceTemperaturesSum, { digits: 6 })],
  ]);
}

/** A curve exact through three ITS-90 fixed points for the section's response; each point's influence on a reading. */
function fixedPoints(respDef, ou) {
  const tL = symbol(ou);
  const fps = [1, 2, 3].map((i) => $(`cf-fp${i}`).value);
  const ut = kelvinDiff('cf-fput');
  const us = number('cf-fpus');
  const tr = kelvin('cf-fpt');
  const t90 = fps.map((f) => api.fn('fixedPointTemperature')(f));
  const lo = Math.min(...t90, tr);
  const hi = Math.max(...t90, tr);
  for (let i = 1; i < 3; i++) {
    if (fps.indexOf(fps[i]) < i) throw new FieldError(`cf-fp${i + 1}`, `Fixed point ${i + 1} repeats an earlier one: choose three different fixed points.`, 'DEGENERATE_FIT');
  }
  const def = { model: { ...respDef.model, c2: 'its90' } };
  const signalsAt = api.instrument(def).signals(Float64Array.from(t90));
  const order = [...t90.keys()].sort((a, b) => t90[a] - t90[b]);
  const f = tagMap({ 'options.uTemperaturesK': 'cf-fput', 'options.uSignals': 'cf-fpus' }, () => api.fixedPointCurve(def, fps,
    { uTemperaturesK: ut, uSignals: order.map((k) => (signalsAt[k] * us) / 100), tMinK: lo, tMaxK: hi }, tr), 'cf-fpt');
  const r = f.reading;
  const um = api.spectralSize('um');
  const mK = (k) => `${formatNumber(d(k, ou) * 1e3, { digits: 2 })} m${tL}`;
  const e = f.report.interpolationErrors;
  const items = [
    ['curve', 'Curve A, B, C', `${formatNumber(f.coefficients.aM / um, { digits: 6 })} µm, ${formatNumber(f.coefficients.bMK / um, { digits: 6 })} µm·K, ${formatNumber(f.coefficients.c, { digits: 6 })} W·m⁻²·sr⁻¹`],
    ['between', 'Largest interpolation error between the points', mK(e.between.maxErrorK)],
  ];
  if (e.below) items.push(['below', `Below them (to ${showTemperature(lo, ou)})`, mK(e.below.maxErrorK)]);
  if (e.above) items.push(['above', `Above them (to ${showTemperature(hi, ou)})`, mK(e.above.maxErrorK)]);
  items.push(['t', 'Reading through the curve, T₉₀', showTemperature(r.temperatureK, ou)]);
  items.push(['ucal', 'Its uncertainty from the fixed points, u_cal', showDifference(r.uCalibrationK, ou, 2), { labelHtml: 'Its uncertainty from the fixed points, <i>u</i><sub>cal</sub>' }]);
  fillResults($('cf-fpres'), items);
  const rows = f.report.fixedPoints.map((fp, i) => {
    const cT = r.dTdReferenceTemperatures[i];
    const cS = r.dTdReferenceSignals[i];
    const uS = (f.report.signals[i] * us) / 100;
    return [
      `${FP[fp]} (${fp} freezing point)`,
      showTemperature(f.report.temperaturesK[i], ou),
      formatNumber(f.report.signals[i], { digits: 6 }),
      { text: formatNumber(cT, { digits: 4 }), value: cT },
      { text: formatNumber(d(cS, ou), { digits: 4 }), value: cS },
      { text: showDifference(Math.hypot(cT * ut, cS * uS), ou, 2), value: Math.hypot(cT * ut, cS * uS) },
    ];
  });
  fillTable($('cf-fptable'), ['Fixed point', 'T₉₀', 'Signal (W·m⁻²·sr⁻¹)', { html: '∂<i>T</i>/∂<i>T</i><sub>i</sub>' }, { html: `∂<i>T</i>/∂<i>S</i><sub>i</sub> (${tL}/(W·m⁻²·sr⁻¹))` }, 'Contribution'], rows);
}

export const calibSection = {
  id: 'calib',
  available: () => api.has('CalibrationCurve', 'Instrument', 'convertTemperature', 'convertTemperatureDifference'),
  build() {
    if (!api.has('CalibrationCurve') || typeof api.fn('CalibrationCurve').prototype.convertFrame !== 'function') $('cf-frame-part').remove();
    // Demo: the signal is the mean of 20 frames (Type A, ν = 19); ε known to ± a (rectangular);
    // reflected and path temperatures from one invented sensor, r = 0.5.
    $('cf-gum').innerHTML = measurementGumMarkup('cf', 'Signal', { nu: { sig: '19' }, dist: { eps: 'rectangular' }, corr: [['tr', 'tp', '0.5']] });
    // The ITS-90 defining fixed points of the core (In … Cu); the demo takes In, Sn, Zn.
    [1, 2, 3].forEach((i) => {
      $(`cf-fp${i}`).innerHTML = Object.keys(FP).map((k) => `<option value="${k}">${FP[k]}, ${k}</option>`).join('');
      $(`cf-fp${i}`).value = Object.keys(FP)[i - 1];
    });
  },
  wire(recompute) {
    // "Load" buttons: read a local file into its text area (FileReader; nothing leaves the machine).
    wireLoaders(this.el, recompute);
    const c = $('cf-canvas');
    if (!c) return;
    const move = (x, y) => {
      cursor = { x: Math.max(0, Math.min(SCENE_W - 1, x)), y: Math.max(0, Math.min(SCENE_H - 1, y)) };
      if (frame) drawFrame(frame.temperaturesK, frame.minK, frame.maxK);
      readout();
    };
    c.addEventListener('pointermove', (ev) => {
      const r = c.getBoundingClientRect();
      move(Math.floor(((ev.clientX - r.left) / r.width) * SCENE_W), Math.floor(((ev.clientY - r.top) / r.height) * SCENE_H));
    });
    c.addEventListener('keydown', (ev) => {
      const d = { ArrowLeft: [-1, 0], ArrowRight: [1, 0], ArrowUp: [0, -1], ArrowDown: [0, 1] }[ev.key];
      if (!d) return;
      ev.preventDefault();
      const step = ev.shiftKey ? 10 : 1;
      move(cursor.x + d[0] * step, cursor.y + d[1] * step);
    });
  },
  compute() {
    frame = null;
    shared.curve = null;
    const ou = $('cf-ou').value;
    const tL = symbol(ou);
    // --- response table and calibration points
    const ru = $('cf-ru').value;
    const resp = table('cf-resp', 2, { columns: 'wavelength, relative response' });
    const wl = resp.rows.map((r) => r[0]);
    const rv = resp.rows.map((r) => r[1]);
    const respDef = { model: { kind: 'response', wavelengths: wl, values: rv, unit: ru } };
    const moments = tag('cf-resp', () => api.instrument(respDef).responseMoments(), { custom: responseWords(resp.lines, wl, rv) });
    const pts = table('cf-pts', 2, { columns: 'temperature, signal' });
    const ptu = $('cf-ptu').value;
    const tK = Float64Array.from(pts.rows, (r, i) => tag('cf-pts', () => api.toK(r[0], ptu), { line: pts.lines[i], entryText: trim(r[0]) }));
    const sig = Float64Array.from(pts.rows, (r) => r[1]);
    const fit = tag('cf-pts', () => api.fitCurve(tK, sig), { custom: fitWords(pts.lines, tK, sig) });
    const curve = fit.coefficients;
    shared.curve = curve;
    const um = api.spectralSize('um');
    const mDeg = (k) => `${formatNumber(api.diffFromK(k, ou) * 1e3, { digits: 3 })} m${tL}`;
    const fitItems = [
      ['A', 'A (≈ mean wavelength)', `${formatNumber(curve.aM / um, { digits: 7 })} µm`],
      ['B', 'B', `${formatNumber(curve.bMK / um, { digits: 7 })} µm·K`],
      ['C', 'C', `${formatNumber(curve.c, { digits: 7 })} counts`],
      ['lm', 'Response: mean wavelength', `${formatNumber(api.convertSpectral(moments.mean, ru, 'um'), { digits: 6 })} µm`],
      ['ls', 'Response: spread (standard deviation)', `${formatNumber(api.convertSpectral(moments.spread, ru, 'um'), { digits: 6 })} µm`],
    ];
    const theory = api.curveFromResponse(respDef, tK[tK.length >> 1]);
    fitItems.push(['Ar', 'A predicted from the response', `${formatNumber(theory.aM / um, { digits: 6 })} µm`]);
    fitItems.push(['Br', 'B predicted from the response', `${formatNumber(theory.bMK / um, { digits: 6 })} µm·K`]);
    fitItems.push(['rms', 'RMS temperature residual of the fit', mDeg(fit.rmsResidualK)]);
    fitItems.push(['rmax', 'Largest temperature residual', mDeg(fit.maxAbsResidualK)]);
    fillResults($('cf-fit'), fitItems);
    const model = { kind: 'sakumaHattori', aM: curve.aM, bMK: curve.bMK, c: curve.c, c2: curve.c2 };
    const bare = api.instrument({ model });
    const rows = [];
    const resShown = new Float64Array(tK.length);
    const tShown = Float64Array.from(tK, (k) => api.fromK(k, ou));
    for (let i = 0; i < tK.length; i++) {
      const fitted = bare.signal(tK[i]);
      resShown[i] = api.diffFromK(fit.residualsK[i], ou) * 1e3; // T_curve(S_i) − T_i
      rows.push([
        formatNumber(tShown[i], { decimals: temperatureDecimals(tK[i]), trim: true }),
        formatNumber(sig[i], { digits: 7 }),
        formatNumber(fitted, { digits: 7 }),
        `${formatNumber((100 * (sig[i] - fitted)) / fitted, { digits: 3 })} %`,
        formatNumber(resShown[i], { digits: 3 }),
      ]);
    }
    fillTable($('cf-table'), [`Temperature (${tL})`, 'Measured signal (counts)', 'Curve signal (counts)', 'Signal residual', `T(curve⁻¹(signal)) − T (m${tL})`], rows);
    drawPlot($('cf-plot'), {
      title: 'Temperature residuals of the fitted curve at the calibration points',
      x: { label: `temperature (${tL})`, short: 'T', readoutUnit: tL },
      y: { label: `residual (m${tL})`, readoutUnit: `m${tL}` },
      series: [{ label: 'residual', x: tShown, y: resShown, dash: '' }],
      markers: [...tShown].map((t, i) => ({ x: t, y: resShown[i] })),
      caption: 'How far the fitted curve reads from each calibration temperature (triangles mark the points).',
    });

    // --- one reading with its uncertainty budget
    const n = number('cf-n');
    const un = number('cf-un');
    const sc = readScene('cf');
    const inst = tagMap(sc.condFields, () => api.instrument({ model, conditions: sc.conditions }), 'cf-eps');
    const T = tag('cf-n', () => inst.objectTemperature(n), {
      custom: (e) => (e.code === 'NO_PHYSICAL_SOLUTION'
        ? `Instrument signal ${typed('cf-n')} counts is below what the reflected surroundings and the path alone give with ε = ${trim(sc.eps)}, so no object temperature explains it; check the emissivity and the reflected and path temperatures.`
        : undefined),
    });
    const g = readMeasurementGum('cf', un, sc);
    const budget = gumCall(g.cov, () => inst.uncertaintyBudget(n, g.u, g.cov.options), { 'uncertainties.signal': 'cf-un', ...sc.uFields }, 'cf-un');
    const view = gumView(budget, g.cov.text);
    fillResults($('cf-res'), [
      ['t', 'Object temperature from the reading', showTemperature(T, ou), { big: true }],
      ...uncertaintyItems(view, ou),
      ['tbb', 'Blackbody temperature of the signal (ε = 1, no corrections)', showTemperature(bare.temperature(n), ou)],
    ]);
    const signalRow = { name: 'Signal', value: `${trim(n)} counts`, u: `${trim(un)} counts`, xUnit: 'count', scale: un || Math.abs(n), toX: 1 };
    fillBudget($('cf-budget'), budgetRows(budget, signalRow, sc, ou), view, T, ou);
    transfer(tK, sig, pts.lines, n, un, ou, resShown, tShown, bare);
    fixedPoints(respDef, ou);
    $('cf-assume').textContent = 'Assumes the fitted Sakuma–Hattori curve describes the instrument over the range, a grey body (ε the same at every wavelength the instrument sees) and uniform diffuse surroundings at the reflected temperature.';

    // --- the frame: invented scene → raw counts (through the fitted curve) → core conversion
    if (!$('cf-canvas')) return;
    const sceneSignal = new Float64Array(scene.temperatureK.length);
    const groups = new Map();
    scene.emissivity.forEach((e, i) => (groups.get(e) || groups.set(e, []).get(e)).push(i));
    for (const [eps, idx] of groups) {
      const s = api.instrument({ model, conditions: { ...sc.conditions, emissivity: eps } }).measuredSignals(Float64Array.from(idx, (i) => scene.temperatureK[i]));
      idx.forEach((i, j) => { sceneSignal[i] = s[j]; });
    }
    let maxS = 0;
    for (const s of sceneSignal) maxS = Math.max(maxS, s);
    const gain = Math.ceil(maxS / 60000); // signal units per count, so the frame fits 16 bits
    const counts = new Uint16Array(sceneSignal.length);
    for (let i = 0; i < counts.length; i++) counts[i] = scene.dead[i] ? 0 : Math.min(65535, Math.round(sceneSignal[i] / gain));
    const options = { gain, offset: 0, conditions: sc.conditions };
    if ($('cf-emap').checked) options.emissivity = Float32Array.from(scene.emissivity);
    const out = api.convertFrame(curve, counts, options);
    frame = { ...out, counts };
    drawFrame(out.temperaturesK, out.minK, out.maxK);
    drawScale(out.minK, out.maxK, ou);
    fillResults($('cf-frame-res'), [
      ['valid', 'Valid pixels', String(out.valid)],
      ['invalid', 'Invalid pixels (at or below the background)', String(out.invalid)],
      ['min', 'Coldest valid pixel', showTemperature(out.minK, ou)],
      ['max', 'Hottest valid pixel', showTemperature(out.maxK, ou)],
      ['gain', 'Counts → signal', `${gain} × count`],
    ]);
    readout();
  },
};
