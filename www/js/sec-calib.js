// Section 5: Sakuma–Hattori calibration curve from calibration points, object temperature with
// its uncertainty budget, and whole-frame conversion of raw counts to a false-colour map.
import { api } from './api.js';
import { fmt } from './fmt.js';
import { drawPlot, fillTable } from './plot.js';
import { parseNumericTable } from './csv.js';
import { PageInputError, tag, readNum, UNIT_LABEL } from './form.js';
import { fillResults } from './sec-band.js';
import { fillBudget, readConditions } from './sec-signal.js';
import { emberRamp } from './colormap.js';
import { kilnConveyorScene, SCENE_W, SCENE_H } from './scene.js';

const $ = (id) => document.getElementById(id);
const RAMP = emberRamp(256);
const scene = kilnConveyorScene();
let frame = null; // last converted frame, for the pointer readout
let cursor = { x: SCENE_W >> 1, y: SCENE_H >> 1 };

function columns(id, what) {
  const { rows, lines } = parseNumericTable($(id).value);
  for (let k = 0; k < rows.length; k++) {
    if (rows[k].length !== 2) {
      throw new PageInputError(id, `line ${lines[k]}: expected two numbers (${what}), found ${rows[k].length}`);
    }
  }
  return [Float64Array.from(rows, (r) => r[0]), Float64Array.from(rows, (r) => r[1])];
}

function drawScale(minShown, maxShown, unitLabel) {
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
    const v = maxShown - ((maxShown - minShown) * j) / 4;
    const s = document.createElement('span');
    s.textContent = `${fmt(v, 4)} ${unitLabel}`;
    ticks.appendChild(s);
  }
}

function drawFrame(temps, minK, maxK) {
  const c = $('cf-canvas');
  const ctx = c.getContext('2d');
  const img = ctx.createImageData(SCENE_W, SCENE_H);
  const span = maxK - minK || 1;
  for (let i = 0; i < temps.length; i++) {
    const t = temps[i];
    let r = 150;
    let g = 150;
    let b = 150;
    if (Number.isFinite(t)) {
      const k = Math.max(0, Math.min(255, Math.round(((t - minK) / span) * 255)));
      r = RAMP[3 * k];
      g = RAMP[3 * k + 1];
      b = RAMP[3 * k + 2];
    }
    img.data[4 * i] = r;
    img.data[4 * i + 1] = g;
    img.data[4 * i + 2] = b;
    img.data[4 * i + 3] = 255;
  }
  ctx.putImageData(img, 0, 0);
  // cursor
  ctx.strokeStyle = '#ffffff';
  ctx.lineWidth = 1;
  ctx.strokeRect(cursor.x - 2.5, cursor.y - 2.5, 6, 6);
}

function readout() {
  if (!frame) return;
  const i = cursor.y * SCENE_W + cursor.x;
  const t = frame.temperaturesK[i];
  const tUnit = $('cf-tu').value;
  $('cf-readout').textContent = Number.isFinite(t)
    ? `pixel (${cursor.x}, ${cursor.y}): ${fmt(api.fromKelvin(t, tUnit), 6)} ${UNIT_LABEL[tUnit]}  (raw ${frame.counts[i]} counts)`
    : `pixel (${cursor.x}, ${cursor.y}): no valid temperature (raw ${frame.counts[i]} counts)`;
  $('cf-canvas').dataset.readoutK = String(t);
}

export const calibSection = {
  id: 'calib',
  available: () => api.hasCalibration(),
  build() {
    if (!api.hasFrame()) $('cf-frame-part').remove(); // this build of the core has no frame converter
  },
  wire(recompute) {
    // "Load" buttons: read a local file into its text area (FileReader; nothing leaves the machine).
    for (const input of this.el.querySelectorAll('input.loader')) {
      input.addEventListener('change', () => {
        const file = input.files && input.files[0];
        if (!file) return;
        const reader = new FileReader();
        reader.onload = () => {
          $(input.dataset.target).value = String(reader.result);
          recompute();
        };
        reader.readAsText(file);
      });
    }
    if (!api.hasFrame()) return;
    const c = $('cf-canvas');
    c.addEventListener('pointermove', (ev) => {
      const r = c.getBoundingClientRect();
      cursor = {
        x: Math.max(0, Math.min(SCENE_W - 1, Math.floor(((ev.clientX - r.left) / r.width) * SCENE_W))),
        y: Math.max(0, Math.min(SCENE_H - 1, Math.floor(((ev.clientY - r.top) / r.height) * SCENE_H))),
      };
      if (frame) drawFrame(frame.temperaturesK, frame.minK, frame.maxK);
      readout();
    });
    c.addEventListener('keydown', (ev) => {
      const d = { ArrowLeft: [-1, 0], ArrowRight: [1, 0], ArrowUp: [0, -1], ArrowDown: [0, 1] }[ev.key];
      if (!d) return;
      ev.preventDefault();
      const step = ev.shiftKey ? 10 : 1;
      cursor = {
        x: Math.max(0, Math.min(SCENE_W - 1, cursor.x + d[0] * step)),
        y: Math.max(0, Math.min(SCENE_H - 1, cursor.y + d[1] * step)),
      };
      if (frame) drawFrame(frame.temperaturesK, frame.minK, frame.maxK);
      readout();
    });
  },
  compute() {
    frame = null;
    const tUnit = $('cf-tu').value;
    const tL = UNIT_LABEL[tUnit];
    // --- response table and calibration points
    const [wlUm, resp] = columns('cf-resp', 'wavelength in µm, relative response');
    const moments = tag('cf-resp', () => api.responseMoments(wlUm, resp, 'um'));
    const [tShown, sig] = columns('cf-pts', `temperature in ${tL}, signal`);
    const tK = tag('cf-pts', () => api.toKelvinArray(tShown, tUnit));
    const fit = tag('cf-pts', () => api.fitCurve(tK, sig));
    const curve = fit.curve;
    const fitItems = [
      ['A', 'A (≈ mean wavelength)', fmt(curve.aM * 1e6, 7), 'µm', true],
      ['B', 'B', fmt(curve.bMK * 1e6, 7), 'µm·K'],
      ['C', 'C', fmt(curve.c, 7), 'counts'],
    ];
    fitItems.push(['lm', 'Response: mean wavelength', fmt(moments.mean, 6), 'µm']);
    fitItems.push(['ls', 'Response: spread (standard deviation)', fmt(moments.spread, 6), 'µm']);
    if (api.has('sakumaHattoriFromResponse')) {
      // The curve the response alone predicts (at the middle calibration temperature), for comparison.
      const theory = api.curveFromResponse(wlUm, resp, 'um', tK[tK.length >> 1]);
      fitItems.push(['Ar', 'A predicted from the response', fmt(theory.aM * 1e6, 6), 'µm']);
      fitItems.push(['Br', 'B predicted from the response', fmt(theory.bMK * 1e6, 6), 'µm·K']);
    }
    fitItems.push(['rms', 'RMS temperature residual of the fit', fmt(fit.rmsResidualK * 1e3, 4), 'mK']);
    fitItems.push(['rmax', 'Largest temperature residual', fmt(fit.maxAbsResidualK * 1e3, 4), 'mK']);
    fillResults($('cf-fit'), fitItems);
    const rows = [];
    const resMk = new Float64Array(tK.length);
    for (let i = 0; i < tK.length; i++) {
      const fitted = api.curveSignal(curve, tK[i]);
      resMk[i] = fit.residualsK[i] * 1e3; // T_curve(S_i) − T_i from the core's fit report
      rows.push([`${fmt(tShown[i], 6)} ${tL}`, fmt(sig[i], 8), fmt(fitted, 8), `${fmt((100 * (sig[i] - fitted)) / fitted, 3)} %`, `${fmt(resMk[i], 4)} mK`]);
    }
    fillTable($('cf-table'), ['Temperature', 'Measured signal (counts)', 'Curve signal (counts)', 'Signal residual', 'Temperature residual T(curve⁻¹(signal)) − T'], rows);
    drawPlot($('cf-plot'), {
      title: 'Temperature residuals of the fitted curve at the calibration points',
      x: { label: `temperature (${tL})`, short: 'T', readoutUnit: tL },
      y: { label: 'residual (mK)', readoutUnit: 'mK' },
      series: [{ label: 'residual', x: tShown, y: resMk, dash: '' }],
      markers: [...tShown].map((t, i) => ({ x: t, y: resMk[i], label: '' })),
      caption: 'How far the fitted curve reads from each calibration temperature (triangles mark the points).',
    });

    // --- one reading with its uncertainty budget
    const { cond, u } = readConditions('cf');
    const signal = readNum('cf-sig');
    u.signal = readNum('cf-usig');
    const model = { kind: 'curve', curve };
    const budget = tag('cf-sig', () => api.thermoBudget(model, signal, cond, u));
    fillResults($('cf-res'), [
      ['t', 'Object temperature', fmt(api.fromKelvin(budget.temperatureK, tUnit), 7), tL, true],
      ['uc', 'Combined standard uncertainty', fmt(budget.combinedK, 3), 'K'],
      ['U', 'Expanded uncertainty (k = 2)', fmt(2 * budget.combinedK, 3), 'K'],
    ]);
    fillBudget($('cf-budget'), budget, { signal: 'counts', emissivity: '', reflectedTemperature: 'K', pathTransmittance: '', pathTemperature: 'K' });

    // --- the frame: invented scene → raw counts (through the fitted curve) → core conversion
    if (!api.hasFrame()) return;
    const sceneSignal = api.thermoMeasuredSignals(model, scene.temperatureK, scene.emissivity, cond);
    let maxS = 0;
    for (const s of sceneSignal) maxS = Math.max(maxS, s);
    const gain = Math.ceil(maxS / 60000); // signal units per count, so the frame fits 16 bits
    const offset = 0;
    const counts = new Uint16Array(sceneSignal.length);
    for (let i = 0; i < counts.length; i++) counts[i] = scene.dead[i] ? 0 : Math.min(65535, Math.round((sceneSignal[i] - offset) / gain));
    const emap = $('cf-emap').checked ? Float32Array.from(scene.emissivity) : null;
    const out = api.convertFrame(model, counts, gain, offset, cond, emap);
    frame = { ...out, counts };
    const minShown = api.fromKelvin(out.minK, tUnit);
    const maxShown = api.fromKelvin(out.maxK, tUnit);
    drawFrame(out.temperaturesK, out.minK, out.maxK);
    drawScale(minShown, maxShown, tL);
    fillResults($('cf-frame-res'), [
      ['valid', 'Valid pixels', String(out.valid), ''],
      ['invalid', 'Invalid pixels (at or below the background)', String(out.invalid), ''],
      ['min', 'Coldest valid pixel', fmt(minShown, 6), tL],
      ['max', 'Hottest valid pixel', fmt(maxShown, 6), tL],
      ['gain', 'Counts → signal', `${gain} × count + ${offset}`, ''],
    ]);
    readout();
  },
};
