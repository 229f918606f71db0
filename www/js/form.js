// Input handling shared by the sections: inline messages under each control, attribution of a
// thrown QuantabandError to the control it concerns, and readers that convert user units to SI
// through the core's unit module.
import { parseNum, parseList } from './fmt.js';
import { api } from './api.js';

/** Gives every control in `root` a message element and wires aria-describedby. */
export function setupFields(root) {
  for (const c of root.querySelectorAll('.fld input, .fld select, .fld textarea')) {
    if (!c.id || document.getElementById(`${c.id}-msg`)) continue;
    const msg = document.createElement('p');
    msg.className = 'msg';
    msg.id = `${c.id}-msg`;
    msg.setAttribute('aria-live', 'polite');
    c.closest('.fld').appendChild(msg);
    const d = c.getAttribute('aria-describedby');
    c.setAttribute('aria-describedby', d ? `${d} ${msg.id}` : msg.id);
  }
}

/** Marks an error as belonging to control `id` (re-thrown to the section's guard). */
export function tag(id, fn) {
  try {
    return fn();
  } catch (e) {
    if (e && typeof e === 'object' && !e.fieldId) e.fieldId = id;
    throw e;
  }
}

/** An invalid value in a page-only control (one the core never sees, e.g. a step count). */
export class PageInputError extends Error {
  constructor(fieldId, message) {
    super(message);
    this.name = 'PageInputError';
    this.code = 'PAGE_INPUT';
    this.fieldId = fieldId;
  }
}

function isCoreError(e) {
  return !!e && typeof e === 'object' && typeof e.code === 'string' && (e.name === 'QuantabandError' || api.isError(e));
}

function norm(s) {
  return s.toLowerCase().replace(/[^a-z0-9]/g, '');
}

/** Finds the control of `section` an error message names (via the controls' data-args lists). */
function controlFor(section, e) {
  if (e.fieldId) return document.getElementById(e.fieldId);
  const words = new Set((e.message.match(/[A-Za-z_][A-Za-z0-9_]*/g) || []).map(norm));
  for (const c of section.querySelectorAll('[data-args]')) {
    if (c.closest('[hidden]')) continue;
    const args = c.dataset.args.split(/\s+/).map(norm);
    if (args.some((a) => words.has(a))) return c;
  }
  return null;
}

/** Clears every message of `section`. */
export function clearMessages(section) {
  for (const c of section.querySelectorAll('[aria-invalid="true"]')) c.removeAttribute('aria-invalid');
  for (const m of section.querySelectorAll('.msg, .secmsg')) {
    m.textContent = '';
    delete m.dataset.code;
  }
}

/** Shows an error of `section` under its control (or at the section's top). */
export function showError(section, e) {
  const secMsg = document.getElementById(`${section.id}-msg`);
  if (!isCoreError(e) && !(e instanceof PageInputError)) {
    console.error(e);
    secMsg.textContent = `Unexpected problem: ${e && e.message ? e.message : String(e)}`;
    secMsg.dataset.code = 'PAGE';
    return;
  }
  const c = controlFor(section, e);
  const target = c ? document.getElementById(`${c.id}-msg`) : secMsg;
  if (c) c.setAttribute('aria-invalid', 'true');
  target.textContent = e.message;
  target.dataset.code = e.code;
}

/** Runs a section's compute function, routing errors to the inline messages. Returns success. */
export function guarded(section, fn) {
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

const val = (id) => document.getElementById(id).value;

/** Raw number from control `id` (NaN for empty/malformed text: the core reports it). */
export function readNum(id) {
  return parseNum(val(id));
}

/** A temperature in kelvin from control `id` in the unit chosen in `unitId`. */
export function readKelvin(id, unitId) {
  return tag(id, () => api.toKelvin(parseNum(val(id)), val(unitId)));
}

/** A list of temperatures in kelvin. */
export function readKelvinList(id, unitId) {
  return tag(id, () => {
    const list = parseList(val(id));
    if (list.length === 0) list.push(NaN);
    return list.map((t) => api.toKelvin(t, val(unitId)));
  });
}

/** Fills a temperature-unit <select>. */
export function fillTemperatureUnits(sel) {
  const opts = [['K', 'K'], ['degC', '°C'], ['degF', '°F']];
  sel.innerHTML = opts.map(([v, t]) => `<option value="${v}">${t}</option>`).join('');
}

/** Fills a spectral-unit <select> (value = the core's unit name). */
export function fillSpectralUnits(sel, which = 'all') {
  const groups = [
    ['wavelength', [['um', 'wavelength, µm'], ['nm', 'wavelength, nm']]],
    ['wavenumber', [['cm-1', 'wavenumber, cm⁻¹']]],
    ['frequency', [['THz', 'frequency, THz'], ['GHz', 'frequency, GHz']]],
  ];
  sel.innerHTML = groups
    .filter(([g]) => which === 'all' || which.includes(g))
    .flatMap(([, list]) => list)
    .map(([v, t]) => `<option value="${v}">${t}</option>`)
    .join('');
}

/** Display symbols of unit names. */
export const UNIT_LABEL = { um: 'µm', nm: 'nm', 'cm-1': 'cm⁻¹', THz: 'THz', GHz: 'GHz', K: 'K', degC: '°C', degF: '°F', m: 'm', Hz: 'Hz', 'm-1': 'm⁻¹' };
