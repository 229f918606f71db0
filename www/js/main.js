// Start-up: inflate the embedded wasm, start the glue with initSync, build the sections whose
// bindings exist (each gets its number, a "reset this section" and a "print" button), set up
// the fields and unit menus, restore the state from the address, compute, and mark the page
// ready.
import * as qb from '../../pkg/quantaband.js';
import { bindApi } from './api.js';
import { captureDefaults, restoreState, saveState, resetControls } from './state.js';
import { setupFields, guarded, applyTemperatureUnit, applyWhen } from './fields.js';
import { spectrumSection } from './sec-spectrum.js';
import { bandSection } from './sec-band.js';
import { signalSection } from './sec-signal.js';
import { occupancySection } from './sec-occupancy.js';
import { modeSection } from './sec-mode.js';
import { calibSection } from './sec-calib.js';
import { designSection } from './sec-design.js';

/** The sections, in page order. A new section is one module here and its markup in index.html. */
const SECTIONS = [spectrumSection, bandSection, signalSection, occupancySection, modeSection, calibSection, designSection];

async function wasmBytes() {
  const holder = document.getElementById('qb-wasm');
  const bin = atob(holder.textContent.trim());
  const gz = new Uint8Array(bin.length);
  for (let i = 0; i < bin.length; i++) gz[i] = bin.charCodeAt(i);
  const stream = new Blob([gz]).stream().pipeThrough(new DecompressionStream('gzip'));
  return new Uint8Array(await new Response(stream).arrayBuffer());
}

function run(sec) {
  guarded(sec.el, () => sec.compute());
}

function scheduleCompute(sec) {
  if (sec.pending) return;
  sec.pending = true;
  requestAnimationFrame(() => {
    sec.pending = false;
    run(sec);
    saveState();
  });
}

/** The section's header buttons: reset and print. */
function toolbar(sec, number) {
  sec.el.querySelector('h2 .num').textContent = String(number);
  const bar = document.createElement('div');
  bar.className = 'secbar actions';
  bar.innerHTML = `<button type="button" class="reset-sec" data-reset="${sec.id}">Reset this section</button>` +
    `<button type="button" class="print-sec" data-print="${sec.id}">Print this section</button>`;
  sec.el.querySelector('.sechead').appendChild(bar);
  const stale = document.createElement('p');
  stale.className = 'stale';
  stale.textContent = 'Fix the marked input: the results below still belong to the last valid inputs.';
  document.getElementById(`${sec.id}-msg`).after(stale);
}

async function boot() {
  const t0 = performance.now();
  const status = document.getElementById('status');
  try {
    qb.initSync({ module: await wasmBytes() });
    bindApi(qb);
  } catch (e) {
    status.textContent = `The calculation core could not start: ${e.message}`;
    status.classList.add('bad');
    throw e;
  }
  const live = [];
  for (const sec of SECTIONS) {
    sec.el = document.getElementById(sec.id);
    if (!sec.available()) {
      sec.el.remove(); // this build of the core lacks the functions the section needs
      continue;
    }
    sec.build?.();
    live.push(sec);
    toolbar(sec, live.length);
  }
  setupFields(document);
  captureDefaults();
  restoreState();
  applyWhen(document);
  const toc = document.getElementById('toc');
  toc.innerHTML = live.map((s) => `<li><a href="#${s.id}">${s.el.dataset.title}</a></li>`).join('');
  // In-page links must not overwrite the state fragment: scroll and move focus instead.
  document.addEventListener('click', (ev) => {
    const a = ev.target.closest('a[href^="#"]');
    const target = a && document.getElementById(a.getAttribute('href').slice(1));
    if (!target) return;
    ev.preventDefault();
    target.scrollIntoView();
    target.querySelector('input, select, textarea, button')?.focus({ preventScroll: true });
  });
  for (const sec of live) {
    sec.el.addEventListener('input', () => scheduleCompute(sec));
    sec.el.addEventListener('change', () => scheduleCompute(sec));
    sec.wire?.(() => scheduleCompute(sec));
    run(sec);
  }
  // The page-wide temperature unit: every temperature menu follows it (fields are converted).
  const tu = document.getElementById('tu');
  tu.addEventListener('change', () => {
    applyTemperatureUnit(tu.value);
    live.forEach(run);
    saveState();
  });
  document.addEventListener('click', (ev) => {
    const b = ev.target.closest('button.reset-sec');
    if (!b) return;
    const sec = live.find((s) => s.id === b.dataset.reset);
    resetControls(sec.el);
    run(sec);
    saveState();
  });
  window.addEventListener('hashchange', () => {
    if (location.hash.length > 1 && !location.hash.includes('=')) return;
    restoreState();
    live.forEach(run);
  });
  const ms = performance.now() - t0;
  status.textContent = `Ready: the core started and computed every section in ${ms.toFixed(0)} ms.`;
  document.body.dataset.readyMs = ms.toFixed(1);
  document.body.dataset.sections = live.map((s) => s.id).join(' ');
  document.body.dataset.ready = '1';
}

boot();

// "Print this section": only that section (with the header, cautions and a link to the state)
// goes to paper. `beforeprint`/`afterprint` also cover the browser's own print command.
document.addEventListener('click', (ev) => {
  const b = ev.target.closest('button.print-sec');
  if (!b) return;
  printSection(b.dataset.print);
  window.print();
});
window.addEventListener('afterprint', () => printSection(null));
window.addEventListener('beforeprint', () => {
  if (!document.body.dataset.printing) printSection(null); // whole-page print: refresh the copies
});

/** Marks which section the print stylesheet keeps (null = all). Exposed for the browser tests. */
function printSection(id) {
  // Text areas cannot grow on paper: print a copy of their full text instead.
  for (const t of document.querySelectorAll('textarea')) {
    let pre = document.getElementById(`${t.id}-print`);
    if (!pre) {
      pre = document.createElement('pre');
      pre.className = 'print-mirror';
      pre.id = `${t.id}-print`;
      pre.setAttribute('aria-hidden', 'true');
      t.after(pre);
    }
    pre.textContent = t.value;
  }
  document.getElementById('print-link').textContent = location.href;
  for (const s of document.querySelectorAll('.calc')) s.classList.toggle('printing', s.id === id);
  if (id) document.body.dataset.printing = id;
  else delete document.body.dataset.printing;
}
window.quantabandPrintSection = printSection;
