// A small SVG line plot drawn at the size of its container (redrawn when the container is
// resized, so text stays 12 px at any width): linear/log axes, shaded bands, point markers, an
// HTML legend and axis titles (they wrap instead of shrinking), and a readout that follows the
// pointer (or the arrow keys when the plot has focus). SVG so that it prints crisply.
import { formatNumber, formatTick, formatLogTick, esc } from './fmt.js';

const NS = 'http://www.w3.org/2000/svg';
/** Series colours of this page (each ≥ 4.5:1 on white). */
export const SERIES_COLOURS = ['#9c3d14', '#1c57a5', '#4f6b00', '#7a2e8e', '#0b6b63', '#8a5a00', '#b0124f', '#33415c'];
const DASHES = ['', '7 4', '2 3', '10 3 2 3', '4 4', '1 2'];
/** Pixel size of tick and label text (the tests require ≥ 10 px as rendered). */
export const PLOT_FONT_PX = 12;
const CHAR_PX = 7.2; // width of one tick-label character at 12 px (DejaVu/Liberation Sans)

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
  return { ticks: out, label: (v) => formatTick(v, step) };
}

function logTicks(lo, hi, target) {
  const a = Math.floor(Math.log10(lo) + 1e-9);
  const b = Math.ceil(Math.log10(hi) - 1e-9);
  const every = Math.max(1, Math.ceil((b - a) / Math.max(1, target)));
  const out = [];
  for (let k = a; k <= b; k += every) {
    const v = 10 ** k;
    if (v >= lo * (1 - 1e-9) && v <= hi * (1 + 1e-9)) out.push(v);
  }
  if (out.length < 2) {
    // Less than a decade: 1-2-5 steps inside it.
    for (let k = a - 1; k <= b; k++) for (const m of [2, 5]) {
      const v = m * 10 ** k;
      if (v >= lo && v <= hi) out.push(v);
    }
    out.sort((x, y) => x - y);
  }
  const plain = b - a <= 4;
  return { ticks: out, label: (v) => formatLogTick(v, plain) };
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

const specs = new WeakMap();
let observer = null;

/**
 * Draws (and keeps redrawing at its container's width) a plot into `figure`.
 * spec = { title, x: { label, short, log, min?, max?, readoutUnit }, y: { label, log, min?, max?,
 *          floorDecades?, readoutUnit }, series: [{ label, x, y, colour?, dash? }],
 *          bands: [{ from, to, label }], markers: [{ x, y, label?, colour? }], caption, height? }
 */
export function drawPlot(figure, spec) {
  specs.set(figure, spec);
  if (!observer && typeof ResizeObserver === 'function') {
    observer = new ResizeObserver((entries) => {
      for (const en of entries) {
        const f = en.target;
        const w = Math.round(f.clientWidth);
        if (specs.has(f) && Math.abs(w - Number(f.dataset.drawnWidth || 0)) >= 2) render(f);
      }
    });
  }
  observer?.observe(figure);
  render(figure);
}

function render(figure) {
  const spec = specs.get(figure);
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
    return;
  }
  if (ys.log) yr[0] = Math.max(yr[0], yr[1] / 10 ** (ys.floorDecades ?? 12));
  else yr = [Math.min(0, yr[0]), yr[1]];
  if (ys.min !== undefined) yr[0] = ys.min;
  if (ys.max !== undefined) yr[1] = ys.max;
  if (yr[0] === yr[1]) yr = ys.log ? [yr[0] / 2, yr[1] * 2] : [yr[0] - 1, yr[1] + 1];
  if (xr[0] === xr[1]) xr = xs.log ? [xr[0] / 2, xr[1] * 2] : [xr[0] - 1, xr[1] + 1];
  if (!ys.log) yr[1] += (yr[1] - yr[0]) * 0.04;

  const W = Math.max(240, Math.round(figure.clientWidth || 640));
  figure.dataset.drawnWidth = String(W);
  const H = Math.round(Math.min(spec.height ?? 340, Math.max(200, W * 0.52)));
  const top = 10;
  const bottom = 26;
  const right = 14;
  const plotH = H - top - bottom;
  const yt = ys.log ? logTicks(yr[0], yr[1], Math.floor(plotH / 40)) : linTicks(yr[0], yr[1], Math.max(3, Math.floor(plotH / 45)));
  const yLabels = yt.ticks.map(yt.label);
  const left = Math.ceil(Math.max(...yLabels.map((s) => s.length), 1) * CHAR_PX) + 14;
  const plotW = W - left - right;
  const xt = xs.log ? logTicks(xr[0], xr[1], Math.floor(plotW / 70)) : linTicks(xr[0], xr[1], Math.max(3, Math.floor(plotW / 80)));

  const fx = xs.log
    ? (v) => left + ((Math.log10(v) - Math.log10(xr[0])) / (Math.log10(xr[1]) - Math.log10(xr[0]))) * plotW
    : (v) => left + ((v - xr[0]) / (xr[1] - xr[0])) * plotW;
  const fy = ys.log
    ? (v) => top + plotH - ((Math.log10(v) - Math.log10(yr[0])) / (Math.log10(yr[1]) - Math.log10(yr[0]))) * plotH
    : (v) => top + plotH - ((v - yr[0]) / (yr[1] - yr[0])) * plotH;
  const ix = xs.log
    ? (px) => 10 ** (Math.log10(xr[0]) + ((px - left) / plotW) * (Math.log10(xr[1]) - Math.log10(xr[0])))
    : (px) => xr[0] + ((px - left) / plotW) * (xr[1] - xr[0]);

  const yTitle = document.createElement('div');
  yTitle.className = 'ytitle';
  yTitle.textContent = spec.y.label;
  figure.appendChild(yTitle);

  const svg = el('svg', { viewBox: `0 0 ${W} ${H}`, width: W, height: H, role: 'img', tabindex: 0, 'aria-label': spec.title || 'plot' });
  el('title', {}, svg).textContent = spec.title || 'plot';
  el('desc', {}, svg).textContent =
    `${spec.y.label} against ${spec.x.label}; ${series.map((s) => s.label).join(', ')}. ` +
    'Move the pointer over the plot, or focus it and use the left and right arrow keys, to read values.';
  const clipId = `clip-${figure.id || Math.random().toString(36).slice(2)}`;
  const clip = el('clipPath', { id: clipId }, el('defs', {}, svg));
  el('rect', { x: left, y: top, width: plotW, height: plotH }, clip);

  const grid = el('g', { class: 'grid' }, svg);
  const ax = el('g', { class: 'ax' }, svg);
  xt.ticks.forEach((t) => {
    const x = fx(t);
    el('line', { x1: x, x2: x, y1: top, y2: top + plotH }, grid);
    el('line', { x1: x, x2: x, y1: top + plotH, y2: top + plotH + 5 }, ax);
    el('text', { x, y: top + plotH + 18, 'text-anchor': 'middle' }, ax).textContent = xt.label(t);
  });
  yt.ticks.forEach((t, k) => {
    const y = fy(t);
    el('line', { x1: left, x2: left + plotW, y1: y, y2: y }, grid);
    el('line', { x1: left - 5, x2: left, y1: y, y2: y }, ax);
    el('text', { x: left - 8, y: y + 4, 'text-anchor': 'end' }, ax).textContent = yLabels[k];
  });
  el('rect', { x: left, y: top, width: plotW, height: plotH, fill: 'none', stroke: '#30374a' }, ax);

  const body = el('g', { 'clip-path': `url(#${clipId})` }, svg);
  for (const b of spec.bands || []) {
    if (!(b.from < b.to)) continue;
    const x0 = fx(Math.max(b.from, xr[0]));
    const x1 = fx(Math.min(b.to, xr[1]));
    if (!(x1 > x0)) continue;
    el('rect', { x: x0, y: top, width: x1 - x0, height: plotH, fill: 'rgba(214,150,40,0.22)', class: 'bandshade' }, body);
    el('text', { x: (x0 + x1) / 2, y: top + 14, 'text-anchor': 'middle', class: 'lbl' }, body).textContent = b.label || 'band';
  }
  const colourOf = (s, k) => s.colour || SERIES_COLOURS[k % SERIES_COLOURS.length];
  const dashOf = (s, k) => s.dash ?? DASHES[k % DASHES.length];
  series.forEach((s, k) => {
    let d = '';
    let pen = false;
    for (let i = 0; i < s.x.length; i++) {
      const xv = s.x[i];
      const yv = s.y[i];
      const ok = Number.isFinite(xv) && Number.isFinite(yv) && (!xs.log || xv > 0) && (!ys.log || yv > 0);
      if (!ok) {
        pen = false;
        continue;
      }
      const py = Math.max(-1e4, Math.min(1e4, fy(Math.max(yv, ys.log ? yr[0] / 10 : yv))));
      d += `${pen ? 'L' : 'M'}${fx(xv).toFixed(2)} ${py.toFixed(2)}`;
      pen = true;
    }
    el('path', { d, fill: 'none', stroke: colourOf(s, k), 'stroke-width': 2, 'stroke-dasharray': dashOf(s, k), class: 'series' }, body);
  });
  for (const mk of spec.markers || []) {
    if (!Number.isFinite(mk.x) || !Number.isFinite(mk.y)) continue;
    if (mk.x < xr[0] || mk.x > xr[1] || (ys.log && mk.y <= 0)) continue;
    const cx = fx(mk.x);
    const cy = fy(mk.y);
    el('path', { d: `M${cx} ${cy - 7}L${cx + 6} ${cy + 4}L${cx - 6} ${cy + 4}Z`, fill: mk.colour || '#1c2230', class: 'marker' }, body);
    if (mk.label) el('text', { x: cx + 8, y: cy - 6, class: 'lbl' }, body).textContent = mk.label;
  }

  const cursor = el('line', { y1: top, y2: top + plotH, stroke: '#1c2230', 'stroke-width': 1, visibility: 'hidden' }, svg);
  const dots = series.map((s, k) => el('circle', { r: 4, fill: colourOf(s, k), visibility: 'hidden' }, svg));
  const hit = el('rect', { x: left, y: top, width: plotW, height: plotH, fill: 'transparent', class: 'hit' }, svg);
  figure.appendChild(svg);

  const xTitle = document.createElement('div');
  xTitle.className = 'xtitle';
  xTitle.textContent = spec.x.label;
  figure.appendChild(xTitle);

  if (series.length > 1 || spec.legend) {
    const lg = document.createElement('ul');
    lg.className = 'legend';
    lg.innerHTML = series
      .map((s, k) => `<li><svg width="28" height="10" aria-hidden="true"><line x1="1" x2="27" y1="5" y2="5" stroke="${colourOf(s, k)}" stroke-width="2.5" stroke-dasharray="${dashOf(s, k)}"/></svg>${esc(s.label)}</li>`)
      .join('');
    figure.appendChild(lg);
  }
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
    px = Math.max(left, Math.min(left + plotW, px));
    cursorPx = px;
    const xv = ix(px);
    cursor.setAttribute('x1', px);
    cursor.setAttribute('x2', px);
    cursor.setAttribute('visibility', 'visible');
    const lines = [`${spec.x.short || 'x'} = ${formatNumber(xv, { digits: 5 })} ${xUnit}`.trim()];
    series.forEach((s, k) => {
      const i = nearest(s.x, xv);
      if (i < 0 || !Number.isFinite(s.y[i]) || (ys.log && s.y[i] <= 0)) {
        dots[k].setAttribute('visibility', 'hidden');
        return;
      }
      dots[k].setAttribute('cx', fx(s.x[i]));
      dots[k].setAttribute('cy', fy(Math.max(s.y[i], yr[0])));
      dots[k].setAttribute('visibility', 'visible');
      lines.push(`${s.label}: ${formatNumber(s.y[i], { digits: 5 })} ${yUnit}  (at ${formatNumber(s.x[i], { digits: 5 })} ${xUnit})`.replace(/ +\)/, ')'));
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
    const step = plotW / (ev.shiftKey ? 10 : 100);
    show((cursorPx ?? left + plotW / 2) + (ev.key === 'ArrowLeft' ? -step : step));
  });
  svg.addEventListener('focus', () => {
    if (cursorPx === null) show(left + plotW / 2);
  });
  figure.dataset.points = String(series.reduce((n, s) => n + s.x.length, 0));
}

function nearest(arr, v) {
  const n = arr.length;
  if (n === 0) return -1;
  const asc = arr[n - 1] >= arr[0];
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if ((arr[mid] < v) === asc) lo = mid;
    else hi = mid;
  }
  return Math.abs(arr[lo] - v) <= Math.abs(arr[hi] - v) ? lo : hi;
}

/**
 * Builds a <table> from a header row and data rows. A cell is text, { html } for markup the
 * page writes itself (subscripts), or { text, value } to keep the full-precision SI value in
 * the cell's data-value.
 */
export function fillTable(table, header, rows) {
  const cap = table.querySelector('caption');
  table.textContent = '';
  table.dataset.filled = '';
  if (cap) table.appendChild(cap);
  const tr = table.createTHead().insertRow();
  for (const h of header) {
    const th = document.createElement('th');
    th.scope = 'col';
    if (h && typeof h === 'object') th.innerHTML = h.html;
    else th.textContent = h;
    tr.appendChild(th);
  }
  const tb = table.createTBody();
  for (const r of rows) {
    const row = tb.insertRow();
    r.forEach((c, i) => {
      const cell = document.createElement(i === 0 ? 'th' : 'td');
      if (i === 0) cell.scope = 'row';
      if (c && typeof c === 'object') {
        if (c.html !== undefined) cell.innerHTML = c.html;
        else cell.textContent = c.text;
        if (c.value !== undefined) cell.dataset.value = String(c.value); // full precision, SI
      } else cell.textContent = c;
      row.appendChild(cell);
    });
  }
}

/** Fills a results list: items [key, label, value text, { big, html }]. */
export function fillResults(dl, items) {
  dl.innerHTML = '';
  for (const [key, label, value, opts = {}] of items) {
    const div = document.createElement('div');
    div.dataset.key = key;
    const dt = document.createElement('dt');
    if (opts.labelHtml) dt.innerHTML = opts.labelHtml;
    else dt.textContent = label;
    const dd = document.createElement('dd');
    dd.textContent = value;
    if (opts.big) {
      dd.className = 'big';
      div.className = 'big';
    }
    div.append(dt, dd);
    dl.appendChild(div);
  }
}
