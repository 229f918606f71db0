// A small SVG line plot: linear/log axes, shaded bands, point markers, legend, and a readout that
// follows the pointer (or the arrow keys when the plot has focus). SVG so that it prints crisply.
import { fmt, fmtTick, esc } from './fmt.js';

const NS = 'http://www.w3.org/2000/svg';
/** Series colours of this page (each ≥ 4.5:1 on white). */
export const SERIES_COLOURS = ['#9c3d14', '#1c57a5', '#4f6b00', '#7a2e8e', '#0b6b63', '#8a5a00', '#b0124f', '#33415c'];
const DASHES = ['', '7 4', '2 3', '10 3 2 3', '4 4', '1 2'];

function el(name, attrs = {}, parent = null) {
  const e = document.createElementNS(NS, name);
  for (const [k, v] of Object.entries(attrs)) e.setAttribute(k, String(v));
  if (parent) parent.appendChild(e);
  return e;
}

function niceStep(span, target) {
  const raw = span / Math.max(1, target);
  const p = 10 ** Math.floor(Math.log10(raw));
  const f = raw / p;
  return (f < 1.5 ? 1 : f < 3.5 ? 2 : f < 7.5 ? 5 : 10) * p;
}

function linTicks(lo, hi, target) {
  const step = niceStep(hi - lo, target);
  const out = [];
  for (let v = Math.ceil(lo / step - 1e-9) * step; v <= hi + step * 1e-9; v += step) out.push(Math.abs(v) < step * 1e-9 ? 0 : v);
  return out;
}

function logTicks(lo, hi, target) {
  const a = Math.floor(Math.log10(lo) + 1e-9);
  const b = Math.ceil(Math.log10(hi) - 1e-9);
  const every = Math.max(1, Math.ceil((b - a) / target));
  const out = [];
  for (let k = a; k <= b; k += every) {
    const v = 10 ** k;
    if (v >= lo * (1 - 1e-9) && v <= hi * (1 + 1e-9)) out.push(v);
  }
  if (out.length < 2) {
    // Less than a decade: fall back to 1-2-5 steps inside it.
    for (let k = a - 1; k <= b; k++) for (const m of [2, 5]) {
      const v = m * 10 ** k;
      if (v >= lo && v <= hi) out.push(v);
    }
    out.sort((x, y) => x - y);
  }
  return out;
}

function extent(values, log) {
  let lo = Infinity;
  let hi = -Infinity;
  for (const arr of values) for (const v of arr) {
    if (!Number.isFinite(v) || (log && v <= 0)) continue;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  if (!(lo <= hi)) return null;
  return [lo, hi];
}

/**
 * Draws (or redraws) a plot into `figure`.
 * spec = { title, x: {label, log, min?, max?}, y: {label, log, min?, max?, floorDecades?},
 *          series: [{label, x: ArrayLike, y: ArrayLike, colour?, dash?}],
 *          bands: [{from, to, label}], markers: [{x, y, label, colour?}], caption }
 * Returns an object with the drawn scales (used by tests through the figure's dataset).
 */
export function drawPlot(figure, spec) {
  const W = 760;
  const H = 380;
  const m = { l: 78, r: 16, t: 16, b: 52 };
  figure.textContent = '';
  const series = spec.series.filter((s) => s.x.length > 0);
  const xs = spec.x;
  const ys = spec.y;
  let xr = extent(series.map((s) => s.x), xs.log);
  let yr = extent(series.map((s) => s.y), ys.log);
  if (xs.min !== undefined && xs.max !== undefined) xr = [xs.min, xs.max];
  if (!xr || !yr) {
    const p = document.createElement('p');
    p.className = 'note';
    p.textContent = 'Nothing to plot for these inputs.';
    figure.appendChild(p);
    return null;
  }
  if (ys.log) {
    const floor = yr[1] / 10 ** (ys.floorDecades ?? 12);
    yr[0] = Math.max(yr[0], floor);
  } else {
    yr = [Math.min(0, yr[0]), yr[1]];
  }
  if (ys.min !== undefined) yr[0] = ys.min;
  if (ys.max !== undefined) yr[1] = ys.max;
  if (yr[0] === yr[1]) yr = ys.log ? [yr[0] / 2, yr[1] * 2] : [yr[0] - 1, yr[1] + 1];
  if (xr[0] === xr[1]) xr = xs.log ? [xr[0] / 2, xr[1] * 2] : [xr[0] - 1, xr[1] + 1];
  if (!ys.log) yr[1] += (yr[1] - yr[0]) * 0.04;

  const fx = xs.log
    ? (v) => m.l + ((Math.log10(v) - Math.log10(xr[0])) / (Math.log10(xr[1]) - Math.log10(xr[0]))) * (W - m.l - m.r)
    : (v) => m.l + ((v - xr[0]) / (xr[1] - xr[0])) * (W - m.l - m.r);
  const fy = ys.log
    ? (v) => H - m.b - ((Math.log10(v) - Math.log10(yr[0])) / (Math.log10(yr[1]) - Math.log10(yr[0]))) * (H - m.t - m.b)
    : (v) => H - m.b - ((v - yr[0]) / (yr[1] - yr[0])) * (H - m.t - m.b);
  const ix = xs.log
    ? (px) => 10 ** (Math.log10(xr[0]) + ((px - m.l) / (W - m.l - m.r)) * (Math.log10(xr[1]) - Math.log10(xr[0])))
    : (px) => xr[0] + ((px - m.l) / (W - m.l - m.r)) * (xr[1] - xr[0]);

  const svg = el('svg', { viewBox: `0 0 ${W} ${H}`, role: 'img', tabindex: 0, 'aria-label': spec.title || 'plot' });
  el('title', {}, svg).textContent = spec.title || 'plot';
  el('desc', {}, svg).textContent =
    `${spec.y.label} against ${spec.x.label}; ${series.map((s) => s.label).join(', ')}. ` +
    'Move the pointer over the plot, or focus it and use the left and right arrow keys, to read values.';
  const clipId = `clip-${figure.id || Math.random().toString(36).slice(2)}`;
  const defs = el('defs', {}, svg);
  const clip = el('clipPath', { id: clipId }, defs);
  el('rect', { x: m.l, y: m.t, width: W - m.l - m.r, height: H - m.t - m.b }, clip);

  // grid + ticks
  const grid = el('g', { class: 'grid' }, svg);
  const ax = el('g', { class: 'ax' }, svg);
  const xt = xs.log ? logTicks(xr[0], xr[1], 8) : linTicks(xr[0], xr[1], 8);
  const yt = ys.log ? logTicks(yr[0], yr[1], 7) : linTicks(yr[0], yr[1], 6);
  for (const t of xt) {
    const x = fx(t);
    el('line', { x1: x, x2: x, y1: m.t, y2: H - m.b }, grid);
    el('line', { x1: x, x2: x, y1: H - m.b, y2: H - m.b + 5 }, ax);
    const tx = el('text', { x, y: H - m.b + 18, 'text-anchor': 'middle' }, ax);
    tx.textContent = fmtTick(t);
  }
  for (const t of yt) {
    const y = fy(t);
    el('line', { x1: m.l, x2: W - m.r, y1: y, y2: y }, grid);
    el('line', { x1: m.l - 5, x2: m.l, y1: y, y2: y }, ax);
    const ty = el('text', { x: m.l - 8, y: y + 4, 'text-anchor': 'end' }, ax);
    ty.textContent = fmtTick(t);
  }
  el('rect', { x: m.l, y: m.t, width: W - m.l - m.r, height: H - m.t - m.b, fill: 'none', stroke: '#30374a' }, ax);
  const xl = el('text', { x: (m.l + W - m.r) / 2, y: H - 10, 'text-anchor': 'middle', class: 'lbl' }, svg);
  xl.textContent = spec.x.label;
  const yl = el('text', { x: 14, y: (m.t + H - m.b) / 2, 'text-anchor': 'middle', class: 'lbl',
    transform: `rotate(-90 14 ${(m.t + H - m.b) / 2})` }, svg);
  yl.textContent = spec.y.label;

  const body = el('g', { 'clip-path': `url(#${clipId})` }, svg);
  for (const b of spec.bands || []) {
    if (!(b.from < b.to)) continue;
    const x0 = fx(Math.max(b.from, xr[0]));
    const x1 = fx(Math.min(b.to, xr[1]));
    if (!(x1 > x0)) continue;
    el('rect', { x: x0, y: m.t, width: x1 - x0, height: H - m.t - m.b, fill: 'rgba(214,150,40,0.22)', class: 'bandshade' }, body);
    const bt = el('text', { x: (x0 + x1) / 2, y: m.t + 14, 'text-anchor': 'middle', class: 'lbl' }, body);
    bt.textContent = b.label || 'band';
  }
  series.forEach((s, k) => {
    const colour = s.colour || SERIES_COLOURS[k % SERIES_COLOURS.length];
    let d = '';
    let pen = false;
    for (let i = 0; i < s.x.length; i++) {
      const xv = s.x[i];
      const yv = s.y[i];
      const ok = Number.isFinite(xv) && Number.isFinite(yv) && (!xs.log || xv > 0) && (!ys.log || yv > 0);
      if (!ok) { pen = false; continue; }
      const py = Math.max(-1e4, Math.min(1e4, fy(Math.max(yv, ys.log ? yr[0] / 10 : yv))));
      d += `${pen ? 'L' : 'M'}${fx(xv).toFixed(2)} ${py.toFixed(2)}`;
      pen = true;
    }
    el('path', { d, fill: 'none', stroke: colour, 'stroke-width': 2, 'stroke-dasharray': s.dash ?? DASHES[k % DASHES.length], class: 'series' }, body);
  });
  for (const mk of spec.markers || []) {
    if (!Number.isFinite(mk.x) || !Number.isFinite(mk.y)) continue;
    if (mk.x < xr[0] || mk.x > xr[1] || (ys.log && mk.y <= 0)) continue;
    const cx = fx(mk.x);
    const cy = fy(mk.y);
    el('path', { d: `M${cx} ${cy - 7}L${cx + 6} ${cy + 4}L${cx - 6} ${cy + 4}Z`, fill: mk.colour || '#1c2230', class: 'marker' }, body);
    if (mk.label) {
      const t = el('text', { x: cx + 8, y: cy - 6, class: 'lbl' }, body);
      t.textContent = mk.label;
    }
  }
  // legend: top right, or top left when the curves pass under the top-right corner
  const lgW = 172;
  const lgH = 8 + 16 * series.length;
  const crowd = (x0) => {
    let n = 0;
    for (const s of series) for (let i = 0; i < s.x.length; i++) {
      if (!Number.isFinite(s.x[i]) || !Number.isFinite(s.y[i]) || (xs.log && s.x[i] <= 0) || (ys.log && s.y[i] <= 0)) continue;
      const px = fx(s.x[i]);
      const py = fy(s.y[i]);
      if (px >= x0 && px <= x0 + lgW && py >= m.t && py <= m.t + lgH) n++;
    }
    return n;
  };
  const right = W - m.r - lgW - 4;
  const left = m.l + 4;
  const lx = crowd(right) <= crowd(left) ? right : left;
  const lg = el('g', { class: 'legend' }, svg);
  const lgBox = el('rect', { x: lx, y: m.t + 1, width: lgW, height: 0, fill: 'rgba(255,255,255,0.88)', stroke: '#c9c4b8' }, lg);
  let ly = m.t + 12;
  series.forEach((s, k) => {
    const colour = s.colour || SERIES_COLOURS[k % SERIES_COLOURS.length];
    el('line', { x1: lx + 6, x2: lx + 32, y1: ly, y2: ly, stroke: colour, 'stroke-width': 2.5, 'stroke-dasharray': s.dash ?? DASHES[k % DASHES.length] }, lg);
    const t = el('text', { x: lx + 38, y: ly + 4 }, lg);
    t.textContent = s.label;
    ly += 16;
  });
  if (series.length) lgBox.setAttribute('height', ly - m.t - 6);
  else lgBox.remove();

  // pointer readout
  const cursor = el('line', { y1: m.t, y2: H - m.b, stroke: '#1c2230', 'stroke-width': 1, visibility: 'hidden' }, svg);
  const dots = series.map((s, k) => el('circle', { r: 4, fill: s.colour || SERIES_COLOURS[k % SERIES_COLOURS.length], visibility: 'hidden' }, svg));
  const hit = el('rect', { x: m.l, y: m.t, width: W - m.l - m.r, height: H - m.t - m.b, fill: 'transparent', class: 'hit' }, svg);
  figure.appendChild(svg);
  const readout = document.createElement('div');
  readout.className = 'readout';
  readout.id = `${figure.id}-readout`;
  readout.setAttribute('aria-live', 'polite');
  figure.appendChild(readout);
  if (spec.caption) {
    const cap = document.createElement('figcaption');
    cap.textContent = spec.caption;
    figure.appendChild(cap);
  }
  const xUnit = spec.x.readoutUnit ?? '';
  const yUnit = spec.y.readoutUnit ?? '';
  let cursorPx = null;
  const show = (px) => {
    px = Math.max(m.l, Math.min(W - m.r, px));
    cursorPx = px;
    const xv = ix(px);
    cursor.setAttribute('x1', px);
    cursor.setAttribute('x2', px);
    cursor.setAttribute('visibility', 'visible');
    const lines = [`${spec.x.short || 'x'} = ${fmt(xv, 5)} ${xUnit}`];
    series.forEach((s, k) => {
      const i = nearest(s.x, xv);
      if (i < 0 || !Number.isFinite(s.y[i])) { dots[k].setAttribute('visibility', 'hidden'); return; }
      const yv = s.y[i];
      if (ys.log && yv <= 0) { dots[k].setAttribute('visibility', 'hidden'); return; }
      dots[k].setAttribute('cx', fx(s.x[i]));
      dots[k].setAttribute('cy', fy(Math.max(yv, yr[0])));
      dots[k].setAttribute('visibility', 'visible');
      lines.push(`${s.label}: ${fmt(yv, 5)} ${yUnit}  (at ${fmt(s.x[i], 5)})`);
    });
    readout.textContent = lines.join('\n');
  };
  const toPx = (ev) => {
    const r = svg.getBoundingClientRect();
    return ((ev.clientX - r.left) / r.width) * W;
  };
  hit.addEventListener('pointermove', (ev) => show(toPx(ev)));
  svg.addEventListener('keydown', (ev) => {
    if (ev.key !== 'ArrowLeft' && ev.key !== 'ArrowRight') return;
    ev.preventDefault();
    const step = (W - m.l - m.r) / (ev.shiftKey ? 10 : 100);
    show((cursorPx ?? (m.l + W - m.r) / 2) + (ev.key === 'ArrowLeft' ? -step : step));
  });
  svg.addEventListener('focus', () => { if (cursorPx === null) show((m.l + W - m.r) / 2); });
  figure.dataset.points = String(series.reduce((n, s) => n + s.x.length, 0));
  return { fx, fy, ix, xr, yr };
}

function nearest(arr, v) {
  const n = arr.length;
  if (n === 0) return -1;
  const asc = arr[n - 1] >= arr[0];
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if ((arr[mid] < v) === asc) lo = mid; else hi = mid;
  }
  return Math.abs(arr[lo] - v) <= Math.abs(arr[hi] - v) ? lo : hi;
}

/** Builds a <table> body from a header row and data rows (strings already formatted). */
export function fillTable(table, header, rows) {
  const cap = table.querySelector('caption');
  table.textContent = '';
  if (cap) table.appendChild(cap);
  const thead = table.createTHead();
  const tr = thead.insertRow();
  for (const h of header) {
    const th = document.createElement('th');
    th.scope = 'col';
    th.innerHTML = esc(h);
    tr.appendChild(th);
  }
  const tb = table.createTBody();
  for (const r of rows) {
    const row = tb.insertRow();
    r.forEach((c, i) => {
      const cell = i === 0 ? document.createElement('th') : document.createElement('td');
      if (i === 0) cell.scope = 'row';
      cell.textContent = c;
      row.appendChild(cell);
    });
  }
}
