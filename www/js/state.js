// Page state in the URL fragment: every control marked `data-state` is saved as id=value in
// `#...` (only values that differ from the page's defaults), so a link reproduces the inputs.

let defaults = new Map();
let timer = null;

function controls() {
  return [...document.querySelectorAll('[data-state]')].filter((e) => e.id);
}

function valueOf(e) {
  return e.type === 'checkbox' ? (e.checked ? '1' : '0') : e.value;
}

/** Remembers the current (default) values; call once after the controls are built. */
export function captureDefaults() {
  defaults = new Map(controls().map((e) => [e.id, valueOf(e)]));
}

/** The fragment text for the current state. */
export function stateFragment() {
  const p = new URLSearchParams();
  for (const e of controls()) {
    const v = valueOf(e);
    if (defaults.get(e.id) !== v) p.set(e.id, v);
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

/** Applies the state in the address; returns the ids restored. */
export function restoreState(hash = location.hash) {
  const p = new URLSearchParams(hash.replace(/^#/, ''));
  const done = [];
  for (const e of controls()) {
    const v = p.has(e.id) ? p.get(e.id) : defaults.get(e.id);
    if (v === undefined) continue;
    if (e.type === 'checkbox') e.checked = v === '1';
    else if (e.tagName === 'SELECT' && ![...e.options].some((o) => o.value === v)) continue;
    else e.value = v;
    if (p.has(e.id)) done.push(e.id);
  }
  return done;
}
