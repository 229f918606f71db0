// Input handling shared by every section:
//   * readers that take a field's text (fmt.js rules: decimal comma, lists) and its unit menu,
//     and give SI values through the core's unit module;
//   * unit menus that CONVERT the values of the fields they govern (data-for), never
//     reinterpret them, and refuse (leaving the unit as it was, with a note) when a value cannot
//     be converted;
//   * messages in the page's words, under the field concerned, naming the field's label, the
//     value as entered and its unit (the core's error code is kept in data-code);
//   * conditional fields (data-when) and the page-wide default temperature unit.
//
// Markup conventions (see DEVELOPERS.md, "The page"):
//   <input id=X data-kind="temperature|tdiff|temperatures|spectral|density|number|table"
//          data-label="name used in messages (defaults to the <label> text)"
//          data-unit-text="fixed unit symbol, when the field has no unit menu">
//   <select data-unit="temperature|spectral|density" data-kinds="wavelength frequency …"
//           data-for="X Y" [data-pair]>  a unit menu converting fields X and Y
//   <select data-unit="…" data-out>       an output-unit menu (no fields; results only)
//   <div data-when="selectId=v1,v2;otherId=v3">  shown only while every clause holds
import { parseNumber, parseList, parseTable, splitRow, ParseProblem, formatNumber, formatInput, MINUS } from './fmt.js';
import { api } from './api.js';
import { unitOptions, symbol } from './units.js';

const $ = (id) => document.getElementById(id);

/** An input problem attributed to field `fieldId`, already worded for the user. */
export class FieldError extends Error {
  constructor(fieldId, message, code = 'PAGE_INPUT') {
    super(message);
    this.name = 'FieldError';
    this.fieldId = fieldId;
    this.code = code;
  }
}

// ------------------------------------------------------------------ field metadata

const unitMenuOf = new Map(); // field id → its unit <select>
let lastEdited = null;
const notes = new Map(); // field id → a note to show once (a refused unit change)

/** The name of field `id` in messages. */
export function labelOf(id) {
  const el = $(id);
  if (el?.dataset.label) return el.dataset.label;
  const l = document.querySelector(`label[for="${id}"]`);
  return l ? l.textContent.replace(/\s*\([^)]*\)\s*$/, '').replace(/[:\s]+$/, '').trim() : id;
}

/** The unit menu governing field `id` (undefined for a field without one). */
export function menuOf(id) {
  return unitMenuOf.get(id);
}

/** The unit (core name) of field `id`: its menu's value or data-unit. */
export function unitOf(id) {
  const s = unitMenuOf.get(id);
  return s ? s.value : $(id)?.dataset.unit;
}

/** The unit symbol of field `id` as shown to the user ("" for a pure number). */
export function unitText(id) {
  const s = unitMenuOf.get(id);
  if (s) return s.dataset.unit === 'density' ? s.selectedOptions[0]?.textContent ?? '' : symbol(s.value);
  return $(id)?.dataset.unitText ?? '';
}

/** The text of field `id` as the user typed it (trimmed, with a proper minus sign). */
export function typed(id) {
  return String($(id)?.value ?? '').trim().replace(/^-/, MINUS);
}

const withUnit = (t, u) => (u ? `${t} ${u}` : t);

// ------------------------------------------------------------------ wording of problems

const INTERVAL_RE = /must lie in ([[(])\s*([^,]+?)\s*,\s*([^\])]+?)\s*([\])])/;

function bound(s) {
  if (s === 'inf' || s === '+inf') return '∞';
  const v = Number(s);
  return Number.isFinite(v) ? formatNumber(v, { digits: 6, trim: true }) : s;
}

/** "(0, 1]" → "greater than 0 and at most 1"; "[0, inf)" → "0 or more". */
export function intervalWords(lb, lo, hi, rb) {
  if (hi === 'inf' || hi === '+inf') return lb === '[' ? `${bound(lo)} or more` : `greater than ${bound(lo)}`;
  const low = lb === '[' ? `at least ${bound(lo)}` : `greater than ${bound(lo)}`;
  const high = rb === ']' ? `at most ${bound(hi)}` : `less than ${bound(hi)}`;
  return `${low} and ${high}`;
}

/** Words for a text that could not be read as a number (list entry and line included). */
export function parseWords(p, id, ctx = {}) {
  const L = ctx.label ?? labelOf(id);
  const t = `“${String(p.text).trim()}”`;
  const where = p.entry ? `entry ${p.entry}, ${t},` : p.line ? `line ${p.line}, ${t},` : t;
  switch (p.kind) {
    case 'empty':
      return `${L}: enter a value.`;
    case 'ambiguous': {
      const s = String(p.text).trim();
      return `${L}: ${t} could mean ${s.replace(',', '.')} or ${s.replace(',', '')}; write ${s.replace(',', '.')} (decimal point) or ${s.replace(',', '')} (no thousands separator).`;
    }
    case 'ambiguous-list':
      return `${L}: ${t} is ambiguous in a list; separate the entries with “;” or with “, ” (a comma and a space).`;
    case 'count':
      return `${L}: line ${p.line} has ${p.found} number${p.found === 1 ? '' : 's'}; each line needs ${p.expected}${ctx.columns ? ` (${ctx.columns})` : ''}.`;
    default:
      return `${L}: ${where} is not a number.`;
  }
}

/**
 * The page's words for a core error about field `id`. ctx: { label, unit, text, entry,
 * entryText, line, custom(e) → string|undefined }.
 */
export function explain(e, id, ctx = {}) {
  if (ctx.custom) {
    const m = ctx.custom(e);
    if (m) return m;
  }
  const L = ctx.label ?? labelOf(id);
  const U = ctx.unit ?? unitText(id);
  const text = ctx.text ?? typed(id);
  const entered = ctx.entry
    ? `entry ${ctx.entry} is ${withUnit(ctx.entryText, U)}`
    : ctx.line ? `line ${ctx.line} has ${withUnit(ctx.entryText ?? text, U)}` : `you entered ${withUnit(text, U)}`;
  switch (e.code) {
    case 'NON_POSITIVE_TEMPERATURE':
      return `${L} must be above absolute zero (0 K = ${MINUS}273.15 °C = ${MINUS}459.67 °F); ${entered}.`;
    case 'NON_POSITIVE_SPECTRAL':
    case 'NON_POSITIVE':
      return `${L} must be greater than 0; ${entered}.`;
    case 'OUT_OF_RANGE': {
      const m = INTERVAL_RE.exec(e.message);
      return m ? `${L} must be ${intervalWords(m[1], m[2], m[3], m[4])}; ${entered}.` : `${L} is outside the range this calculation accepts; ${entered}.`;
    }
    case 'NON_FINITE':
      return `${L} must be a finite number; ${entered}.`;
    case 'TOO_FEW_POINTS': {
      const m = /at least (\d+) points are needed \(got (\d+)\)/.exec(e.message);
      return m ? `${L}: at least ${m[1]} points are needed; ${m[2] === '1' ? 'there is 1' : `there are ${m[2]}`}.` : `${L}: too few points.`;
    }
    case 'INVALID_BAND':
      return `${L}: the upper limit must be greater than the lower limit.`;
    case 'NO_SOLUTION':
      return `${L}: no temperature matches ${withUnit(text, U)} with these settings.`;
    case 'NO_PHYSICAL_SOLUTION':
      return `${L} (${withUnit(text, U)}) is less than what the reflected surroundings and the path alone would give, so no object temperature explains it; check the emissivity and the reflected and path temperatures.`;
    default:
      return `${L}: ${withUnit(text, U)} cannot be used here.`;
  }
}

/** Runs fn; a core error becomes a FieldError of field `id` in page words (code kept). */
export function tag(id, fn, ctx = {}) {
  try {
    return fn();
  } catch (e) {
    if (api.isError(e)) throw new FieldError(id, explain(e, id, ctx), e.code);
    throw e;
  }
}

/**
 * Runs fn; a core error is attributed by the configuration path its message names (`map`:
 * { 'conditions.emissivity': fieldId, … }, longest match first) or to `fallbackId`.
 */
export function tagMap(map, fn, fallbackId, ctx = {}) {
  try {
    return fn();
  } catch (e) {
    if (!api.isError(e)) throw e;
    const key = Object.keys(map).sort((a, b) => b.length - a.length).find((k) => e.message.includes(k));
    const id = key ? map[key] : fallbackId;
    throw new FieldError(id, explain(e, id, ctx), e.code);
  }
}

/**
 * Runs fn over a pair of limits (idLo, idHi). "Upper ≤ lower" goes under the limit edited last
 * (the upper one by default), naming both values; other errors go to the limit they concern.
 */
export function tagPair(idLo, idHi, fn, ctx = {}) {
  try {
    return fn();
  } catch (e) {
    if (!api.isError(e)) throw e;
    if (e.code === 'INVALID_BAND' || e.code === 'NOT_INCREASING') {
      const id = lastEdited === idLo ? idLo : idHi;
      const U = unitText(idLo);
      const what = ctx.label ?? $(idLo)?.dataset.group ?? labelOf(idLo);
      throw new FieldError(id, `${what}: the upper limit (${withUnit(typed(idHi), U)}) must be greater than the lower limit (${withUnit(typed(idLo), U)}).`, e.code);
    }
    const id = e.index === 1 || /\bupper\b/.test(e.message) ? idHi : idLo;
    throw new FieldError(id, explain(e, id, ctx), e.code);
  }
}

// ------------------------------------------------------------------ readers

function parsed(id, parse, ctx) {
  try {
    return parse($(id).value);
  } catch (p) {
    if (p instanceof ParseProblem) throw new FieldError(id, parseWords(p, id, ctx));
    throw p;
  }
}

/** A plain number from field `id` (decimal comma accepted). */
export function number(id) {
  return parsed(id, parseNumber);
}

/** An absolute temperature in kelvin from field `id` in its menu's unit. */
export function kelvin(id) {
  const v = number(id);
  return tag(id, () => api.toK(v, unitOf(id)));
}

/** A temperature difference (an uncertainty) in kelvin from field `id`. */
export function kelvinDiff(id) {
  const v = number(id);
  return tag(id, () => api.diffToK(v, unitOf(id)));
}

/** A list of absolute temperatures in kelvin; a bad entry is named by its position. */
export function kelvinList(id) {
  const list = parsed(id, parseList);
  const unit = unitOf(id);
  return list.map((v, k) => tag(id, () => api.toK(v, unit), { entry: k + 1, entryText: formatNumber(v, { digits: 12, trim: true }) }));
}

/** A spectral coordinate in its menu's unit: { value, unit }. */
export function spectral(id) {
  return { value: number(id), unit: unitOf(id) };
}

/** A whole number in [min, max] from a page-only field (a step count). */
export function count(id, min, max) {
  const v = number(id);
  if (!Number.isInteger(v) || v < min || v > max) {
    throw new FieldError(id, `${labelOf(id)} must be a whole number from ${min} to ${max}; you entered ${typed(id)}.`);
  }
  return v;
}

/** A table of `columns` numbers per line: { rows, lines }. ctx.columns describes them. */
export function table(id, columns, ctx = {}) {
  return parsed(id, (t) => parseTable(t, columns), ctx);
}

// ------------------------------------------------------------------ unit menus

/** Converts the text of one governed field from unit `from` to `to`: { ok, text } or { ok: false, why }. */
function convertText(el, from, to) {
  const text = el.value;
  if (text.trim() === '') return { ok: true, text };
  const kind = el.dataset.kind;
  const one = (v, k = kind) => {
    switch (k) {
      case 'temperature':
        return api.fromK(api.toK(v, from), to);
      case 'tdiff':
        return api.diffFromK(api.diffToK(v, from), to);
      case 'spectral':
        return api.convertSpectral(v, from, to);
      case 'density':
        return v * (api.spectralSize(to) / api.spectralSize(from));
      default:
        throw new Error(`field ${el.id}: no conversion for kind ${k}`);
    }
  };
  try {
    if (kind === 'temperatures') return { ok: true, text: parseList(text).map((v) => formatInput(one(v, 'temperature'))).join(', ') };
    if (kind === 'table') {
      const colKind = el.dataset.colKind;
      const columns = Number(el.dataset.columns || 2);
      parseTable(text, columns); // refuse a table that cannot be read
      const lines = text.split(/\r?\n/).map((line) => {
        const s = line.trim();
        if (s === '' || s.startsWith('#')) return line;
        const { cells, sep } = splitRow(s, columns);
        let first;
        try {
          first = parseNumber(cells[0]);
        } catch {
          return line; // a header line
        }
        return [formatInput(one(first, colKind)), ...cells.slice(1)].join(sep);
      });
      return { ok: true, text: lines.join('\n') };
    }
    return { ok: true, text: formatInput(one(parseNumber(text))) };
  } catch (e) {
    if (e instanceof ParseProblem) return { ok: false, why: parseWords(e, el.id).replace(/\.$/, '') };
    if (api.isError(e)) {
      const L = labelOf(el.id);
      if (e.code === 'NON_POSITIVE_TEMPERATURE') return { ok: false, why: `${L}: ${withUnit(typed(el.id), symbol(from))} is not above absolute zero and has no value in ${symbol(to)}` };
      return { ok: false, why: `${L}: ${withUnit(typed(el.id), symbol(from))} has no equivalent in ${symbol(to)} (it must be greater than 0)` };
    }
    throw e;
  }
}

/**
 * Switches unit menu `sel` to `to`, converting the fields it governs. Returns false (and
 * leaves menu and fields as they were, with a note under the field) when a value cannot be
 * converted.
 */
export function convertMenu(sel, to = sel.value) {
  const from = sel.dataset.prev ?? to;
  if (from === to) {
    sel.value = to;
    return true;
  }
  const ids = (sel.dataset.for || '').split(/\s+/).filter(Boolean);
  const updates = [];
  for (const id of ids) {
    const el = $(id);
    if (!el) continue;
    const r = convertText(el, from, to);
    if (!r.ok) {
      sel.value = from;
      notes.set(id, `${r.why}. The unit was left at ${symbol(from)}: correct the value, then change the unit.`);
      return false;
    }
    updates.push([el, r.text]);
  }
  for (const [el, t] of updates) el.value = t;
  // A reciprocal conversion (wavelength ↔ frequency) reverses a range: swap its limits.
  if (sel.hasAttribute('data-pair') && updates.length === 2 && !api.spectralLinear(from, to)) {
    const [[a], [b]] = updates;
    [a.value, b.value] = [b.value, a.value];
  }
  sel.value = to;
  sel.dataset.prev = to;
  return true;
}

/** Fills unit menus, records their fields, gives every control a message slot. */
export function setupFields(root) {
  for (const sel of root.querySelectorAll('select[data-unit]')) {
    if (sel.options.length === 0) {
      const kinds = sel.dataset.kinds ? sel.dataset.kinds.split(/\s+/) : null;
      const only = sel.dataset.units ? new Set(sel.dataset.units.split(/\s+/)) : null;
      sel.innerHTML = unitOptions(sel.dataset.unit, kinds, sel.hasAttribute('data-out'))
        .filter(([v]) => !only || only.has(v))
        .map(([v, t]) => `<option value="${v}">${t}</option>`)
        .join('');
      if (sel.dataset.default) sel.value = sel.dataset.default;
    }
    sel.dataset.prev = sel.value;
    for (const id of (sel.dataset.for || '').split(/\s+/).filter(Boolean)) unitMenuOf.set(id, sel);
    if (sel.dataset.for) sel.addEventListener('change', () => convertMenu(sel));
  }
  for (const q of root.querySelectorAll('.fld > .qty')) q.parentElement.classList.add('with-qty');
  for (const c of root.querySelectorAll('.fld input, .fld select, .fld textarea')) {
    if (!c.id || $(`${c.id}-msg`)) continue;
    const msg = document.createElement('p');
    msg.className = 'msg';
    msg.id = `${c.id}-msg`;
    msg.setAttribute('aria-live', 'polite');
    c.closest('.fld').appendChild(msg);
    const d = c.getAttribute('aria-describedby');
    c.setAttribute('aria-describedby', d ? `${d} ${msg.id}` : msg.id);
  }
  root.addEventListener('input', (ev) => {
    if (ev.target && ev.target.id) lastEdited = ev.target.id;
  }, true);
}

/** Sets every temperature menu under `root` to `unit` (converting fields; refusals stay). */
export function applyTemperatureUnit(unit, root = document) {
  for (const sel of root.querySelectorAll('select[data-unit="temperature"]:not([data-global])')) {
    if (sel.dataset.for) convertMenu(sel, unit);
    else {
      sel.value = unit;
      sel.dataset.prev = unit;
    }
  }
}

// ------------------------------------------------------------------ visibility and messages

function clauseHolds(clause) {
  const [id, values] = clause.split('=');
  const c = $(id.trim());
  if (!c) return false;
  const v = c.type === 'checkbox' ? (c.checked ? '1' : '0') : c.value;
  return values.split(',').map((s) => s.trim()).includes(v);
}

/** Shows or hides the elements of `root` that carry data-when. */
export function applyWhen(root) {
  for (const el of root.querySelectorAll('[data-when]')) {
    el.hidden = !el.dataset.when.split(';').filter(Boolean).every(clauseHolds);
  }
}

/** Clears every message of `section` (then shows pending unit-change notes). */
export function clearMessages(section) {
  for (const c of section.querySelectorAll('[aria-invalid="true"]')) c.removeAttribute('aria-invalid');
  for (const m of section.querySelectorAll('.msg, .secmsg')) {
    m.textContent = '';
    delete m.dataset.code;
  }
  for (const [id, text] of notes) {
    const m = $(`${id}-msg`);
    if (!m || !section.contains(m)) continue;
    m.textContent = text;
    m.dataset.code = 'UNIT_NOT_CHANGED';
    notes.delete(id);
  }
}

/** Shows an error of `section` under its field (or at the section's top). */
export function showError(section, e) {
  const secMsg = $(`${section.id}-msg`);
  if (e instanceof FieldError) {
    const c = $(e.fieldId);
    const m = $(`${e.fieldId}-msg`);
    if (c && m && !c.closest('[hidden]')) {
      c.setAttribute('aria-invalid', 'true');
      const note = m.dataset.code === 'UNIT_NOT_CHANGED' ? ` ${m.textContent}` : ''; // keep a refused unit change in view
      m.textContent = e.message + note;
      m.dataset.code = e.code;
      return;
    }
    secMsg.textContent = e.message;
    secMsg.dataset.code = e.code;
    return;
  }
  console.error(e);
  if (api.isError(e)) {
    secMsg.textContent = 'The calculation stopped on an input it cannot use; check the values of this section.';
    secMsg.dataset.code = e.code;
    return;
  }
  secMsg.textContent = `Unexpected problem in the page: ${e && e.message ? e.message : String(e)}`;
  secMsg.dataset.code = 'PAGE';
}

/** Runs a section's compute function, routing errors to the messages. Returns success. */
export function guarded(section, fn) {
  applyWhen(section);
  clearMessages(section);
  try {
    fn();
    section.dataset.state = 'ok';
    return true;
  } catch (e) {
    showError(section, e);
    section.dataset.state = 'error';
    return false;
  }
}

/**
 * The "Load a file" inputs (`input.loader`, `data-target` = the text area) under `root`: the
 * file is read locally with FileReader (nothing leaves the machine), a leading BOM dropped.
 */
export function wireLoaders(root, recompute) {
  for (const input of root.querySelectorAll('input.loader')) {
    input.addEventListener('change', () => {
      const file = input.files && input.files[0];
      if (!file) return;
      const reader = new FileReader();
      reader.onload = () => {
        $(input.dataset.target).value = String(reader.result).replace(/^\uFEFF/, '');
        recompute();
      };
      reader.readAsText(file);
    });
  }
}
