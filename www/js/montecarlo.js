// The Monte Carlo panel (JCGM 101:2008) of a section that reads a temperature through the
// measurement equation: the core's prepared run (MonteCarlo.measurement) is stepped in slices
// of about 25 ms on the main thread, yielding to the browser between slices (setTimeout), so
// the page keeps answering clicks and typing while 10⁶ trials run; a progress bar and a Stop
// button. (A Web Worker would need a second copy of the glue and a CSP that admits blob:
// workers; the single-file page has neither, and one trial costs about 2 µs, so slices do.)
// Results: mean, standard deviation, both coverage intervals, the §8 comparison with the GUM
// result of the same inputs, and the histogram with the GUM's distribution y + u_c·t(ν_eff).
import { api } from './api.js';
import { formatNumber } from './fmt.js';
import { drawPlot, fillResults } from './plot.js';
import { symbol } from './units.js';
import { FieldError, showError } from './fields.js';
import { showTemperature, showDifference, showDof } from './budget.js';

const $ = (id) => document.getElementById(id);
const SLICE_MS = 25;
const BINS = 80;

/**
 * Wires the panel of prefix `p` (ids p-mcn, p-seed, p-mcrun, p-mcstop, p-mcprog, p-mcstatus,
 * p-mcres, p-mchist) in section element `sec`. `current()` gives the last valid inputs:
 * { def (instrument definition), S, u, options, pairs, view (gumView), T, key, seed, ou, fields: { key: [νId, distId] } }
 * or null. Returns { render(ou, key) } for the section's compute().
 */
export function monteCarloPanel(p, sec, current) {
  let run = null; // { mc, inputs, timer }
  let done = null; // { res, inputs, stopped }
  const status = (t) => {
    $(`${p}-mcstatus`).textContent = t;
  };
  const buttons = (running) => {
    $(`${p}-mcrun`).disabled = running;
    $(`${p}-mcstop`).disabled = !running;
    sec.dataset.mc = running ? 'running' : done ? 'done' : 'idle';
  };

  function finish(stopped) {
    const r = run;
    run = null;
    clearTimeout(r.timer);
    try {
      const res = r.mc.result(BINS);
      done = { res, inputs: r.inputs, stopped };
    } catch (e) {
      if (!(api.isError(e) && e.code === 'TOO_FEW_POINTS')) throw e;
      status('Stopped before two trials were complete: no result.');
    } finally {
      r.mc.free();
    }
    buttons(false);
    if (done) render(current()?.ou ?? r.inputs.ou, current()?.key);
  }

  function slice() {
    if (!run) return;
    // Steps sized from the measured cost of a trial (≈ 1 µs for a curve, ≈ 0.1 ms for a band
    // response integrated per trial), so that no slice blocks the page for long.
    const t0 = performance.now();
    let pr;
    let t = t0;
    do {
      const n = Math.max(20, Math.min(20000, Math.round((SLICE_MS / 2) / run.perTrial)));
      pr = run.mc.step(n);
      const now = performance.now();
      run.perTrial = Math.max(1e-5, (now - t) / n);
      t = now;
    } while (!pr.done && t - t0 < SLICE_MS);
    $(`${p}-mcprog`).value = pr.trials / pr.trialLimit;
    const tol = pr.numericalTolerance === undefined ? '' : `; batch spread ${formatNumber(pr.largestSpread, { digits: 2 })} K against δ = ${formatNumber(pr.numericalTolerance, { digits: 1 })} K`;
    status(`Running: ${pr.trials.toLocaleString('en-GB')} of up to ${pr.trialLimit.toLocaleString('en-GB')} trials${tol}.`);
    if (pr.done) finish(false);
    else run.timer = setTimeout(slice, 0);
  }

  function start() {
    if (run) return;
    const c = current();
    if (!c) {
      status('Fix the marked input first: the run uses the inputs of the budget above.');
      return;
    }
    // Correlated inputs are sampled from a multivariate normal distribution (JCGM 101 §6.4.8).
    for (const pair of c.pairs) {
      for (const k of pair.keys) {
        const u = c.u[pair.inputs[pair.keys.indexOf(k)]];
        if (u.evaluation === 'typeA' || u.distribution !== 'normal') {
          const [nuId, dId] = c.fields[k];
          showError(sec, new FieldError(u.evaluation === 'typeA' ? nuId : dId,
            'A correlated input is sampled from a joint normal distribution in the Monte Carlo run: make it Type B and normal, or remove its correlation.', 'UNSUPPORTED'));
          status('Not started: see the marked input.');
          return;
        }
      }
    }
    const n = $(`${p}-mcn`).value;
    const pc = Math.min(c.view.p ?? 0.95, 1 - 1e-7);
    const options = { ...c.options, seed: c.seed, coverageProbability: pc };
    delete options.coverageFactor;
    if (n === 'adaptive') options.maxTrials = 1e6;
    else options.trials = Number(n);
    const mc = api.monteCarlo(api.instrument(c.def), c.S, c.u, options); // from the cache (or rebuilt if it was dropped)
    run = { mc, inputs: c, timer: 0, perTrial: 0.1 };
    done = null;
    $(`${p}-mcres`).textContent = '';
    $(`${p}-mchist`).textContent = '';
    buttons(true);
    status('Running…');
    run.timer = setTimeout(slice, 0);
  }

  function render(ou, key) {
    if (!done) return;
    const { res, inputs, stopped } = done;
    const g = res.gum;
    const tL = symbol(ou);
    const pct = `${formatNumber(100 * res.coverageProbability, { digits: 3 })} %`;
    const span = ([a, b]) => `${showTemperature(a, ou)} to ${showTemperature(b, ou)}`;
    const v = res.validation;
    const items = [
      ['n', 'Trials', `${res.trials.toLocaleString('en-GB')}${stopped ? ' (stopped)' : res.stabilized ? ' (stabilised)' : ''}${res.invalidTrials ? `, ${res.invalidTrials} outside the model's domain` : ''}`],
      ['mean', 'Mean y', showTemperature(res.estimate, ou)],
      ['sd', 'Standard deviation u(y)', showDifference(res.standardUncertainty, ou, 3), { labelHtml: 'Standard deviation <i>u</i>(<i>y</i>)' }],
      ['sym', `Probabilistically symmetric ${pct} interval`, span(res.symmetricInterval)],
      ['short', `Shortest ${pct} interval`, span(res.shortestInterval)],
    ];
    if (g) {
      const k = formatNumber(g.coverageFactor, { digits: 3 });
      const nu = showDof(g.effectiveDegreesOfFreedom);
      items.push(['gum', `GUM: y ± U (k = ${k}, effective degrees of freedom ${nu})`, span([g.temperatureK - g.expandedUncertaintyK, g.temperatureK + g.expandedUncertaintyK]),
        { labelHtml: `GUM: <i>y</i> ± <i>U</i> (<i>k</i> = ${k}, <i>ν</i><sub>eff</sub> = ${nu})` }]);
    }
    if (v) {
      const d = (x) => showDifference(x, ou, 2);
      items.push(['valid', 'GUM validated by Monte Carlo (JCGM 101 §8)',
        `${v.passed ? 'yes' : 'no'}: ends differ by ${d(v.dLow)} and ${d(v.dHigh)}, tolerance δ = ${d(v.tolerance)}`]);
    } else {
      items.push(['valid', 'GUM validated by Monte Carlo (JCGM 101 §8)', 'not compared: the GUM coverage is not defined for these inputs']);
    }
    items.push(['tol', 'Numerical tolerance of u(y)', showDifference(res.numericalTolerance, ou, 1)]);
    fillResults($(`${p}-mcres`), items);
    const h = res.histogram;
    const x = [];
    const y = [];
    const gx = [];
    const gy = [];
    const cdf = api.fn('studentTCdf');
    const nu = g?.effectiveDegreesOfFreedom ?? Infinity;
    const uc = g?.combinedStandardUncertaintyK;
    for (let i = 0; i < h.counts.length; i++) {
      const a = api.fromK(h.edges[i], ou);
      const b = api.fromK(h.edges[i + 1], ou);
      x.push(a, b);
      y.push(h.counts[i], h.counts[i]);
      if (g && uc > 0) {
        const expected = res.trials * (cdf((h.edges[i + 1] - g.temperatureK) / uc, nu) - cdf((h.edges[i] - g.temperatureK) / uc, nu));
        gx.push(a, b);
        gy.push(expected, expected);
      }
    }
    const series = [{ label: 'Monte Carlo: trials per bin', x, y, dash: '' }];
    if (gx.length) series.push({ label: 'GUM distribution (scaled t at ν eff), expected per bin', x: gx, y: gy });
    drawPlot($(`${p}-mchist`), {
      title: 'Histogram of the Monte Carlo output temperatures',
      x: { label: `object temperature (${tL})`, short: 'T', readoutUnit: tL },
      y: { label: 'trials per bin', readoutUnit: '' },
      series,
      bands: [{ from: api.fromK(res.symmetricInterval[0], ou), to: api.fromK(res.symmetricInterval[1], ou), label: `${pct} interval` }],
      legend: true,
      caption: `${res.trials.toLocaleString('en-GB')} trials over the central 99.9 % of the values; the shaded band is the probabilistically symmetric ${pct} coverage interval.`,
    });
    const stale = key !== undefined && key !== inputs.key;
    status(stale ? 'The inputs have changed since this run: run it again to check the budget above.'
      : `${stopped ? 'Stopped' : 'Done'}: ${res.trials.toLocaleString('en-GB')} trials, seed ${inputs.seed}.`);
    $(`${p}-mcres`).classList.toggle('stale-run', stale);
  }

  $(`${p}-mcrun`).addEventListener('click', start);
  $(`${p}-mcstop`).addEventListener('click', () => {
    if (run) finish(true);
  });
  buttons(false);
  return { render };
}
