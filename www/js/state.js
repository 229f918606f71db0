// Page state in the URL fragment: every control marked `data-state` is saved as id=value in
// `#…` when it differs from the page's default, so a copied link reproduces the inputs. The
// page-wide temperature unit (#tu) is saved too; a temperature menu's default is the page-wide
// unit, and a field whose unit menu has moved from its default is always saved (its text alone
// would not say which unit it is in). A fragment is applied in four steps: every control back
// to its default; the page-wide unit applied as a user would (converting the default values);
// the saved unit menus applied the same way; then the saved values as they are, each in the
// unit its menu now shows. A default is therefore never reinterpreted in another unit.
import { applyTemperatureUnit, convertMenu, menuOf } from './fields.js';

let defaults = new Map();
let timer = null;

function controls(root = document) {
  return [...root.querySelectorAll('[data-state]')].filter((e) => e.id);
}

function valueOf(e) {
  return e.type === 'checkbox' ? (e.checked ? '1' : '0') : e.value;
}

function setValue(e, v) {
  if (e.type === 'checkbox') e.checked = v === '1';
  else if (e.tagName === 'SELECT' && ![...e.options].some((o) => o.value === v)) return false;
  else e.value = v;
  if (e.tagName === 'SELECT') e.dataset.prev = e.value;
  return true;
}

/** Remembers the current (default) values; call once after the controls are built. */
export function captureDefaults() {
  defaults = new Map(controls().map((e) => [e.id, valueOf(e)]));
}

/** The fragment text for the current state. */
export function stateFragment() {
  const p = new URLSearchParams();
  const global = document.querySelector('select[data-global]');
  for (const e of controls()) {
    const v = valueOf(e);
    const follows = global && e !== global && e.matches('select[data-unit="temperature"]');
    const menu = menuOf(e.id);
    const moved = menu && menu.value !== defaults.get(menu.id);
    if ((follows ? global.value : defaults.get(e.id)) !== v || moved) p.set(e.id, v);
  }
  return p.toString();
}

/** Writes the state into the address (debounced; replaces the history entry). */
export function saveState() {
  clearTimeout(timer);
  timer = setTimeout(() => {
    const frag = stateFragment();
    const url = `${location.href.split('#')[0]}${frag ? `#${frag}` : ''}`;
    try {
      history.replaceState(null, '', url);
    } catch {
      location.replace(url);
    }
  }, 150);
}

/** Puts the controls under `root` back to their defaults, in the page-wide temperature unit. */
export function resetControls(root) {
  for (const e of controls(root)) if (defaults.has(e.id) && !e.hasAttribute('data-global')) setValue(e, defaults.get(e.id));
  const global = document.querySelector('select[data-global]');
  if (global) applyTemperatureUnit(global.value, root);
}

/** Applies the state in the address; returns the ids restored. */
export function restoreState(hash = location.hash) {
  const p = new URLSearchParams(hash.replace(/^#/, ''));
  for (const e of controls()) if (defaults.has(e.id)) setValue(e, defaults.get(e.id));
  const global = document.querySelector('select[data-global]');
  if (global && p.has(global.id) && setValue(global, p.get(global.id))) applyTemperatureUnit(global.value);
  const done = [];
  for (const e of controls()) {
    if (e === global || !p.has(e.id) || !e.matches('select[data-unit][data-for]')) continue;
    if ([...e.options].some((o) => o.value === p.get(e.id)) && convertMenu(e, p.get(e.id))) done.push(e.id);
  }
  for (const e of controls()) {
    if (e === global || !p.has(e.id) || e.matches('select[data-unit][data-for]')) continue;
    if (setValue(e, p.get(e.id))) done.push(e.id);
  }
  return done;
}
