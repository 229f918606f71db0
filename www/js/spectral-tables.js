// The spectral (non-grey) inputs of the "Signal → temperature" section: target emissivity, path
// transmittance, window transmittance and reflectance, each grey or a table of wavelength and
// value, and the instrument's response as an energy or photon table. Tables are pasted or read
// from a local file (FileReader: nothing leaves the machine) and parsed by the package
// (SpectralInstrument.tableFromText); the package's table errors are worded here for the user,
// naming the line of the text they concern. Also the plot of the tables with the response and
// the invented demo set.
import { api } from './api.js';
import { formatNumber, formatInput } from './fmt.js';
import { drawPlot } from './plot.js';
import { FieldError, number, kelvin, kelvinDiff, labelOf, unitOf, unitText, explain, spectral } from './fields.js';
import { symbol } from './units.js';

const $ = (id) => document.getElementById(id);
const trim = (v) => formatNumber(v, { digits: 6, trim: true });

/**
 * The optical inputs: the menu choosing grey or table, the table's text area, the grey field
 * (in "Object and surroundings" or in the window fieldset), the relative standard uncertainty
 * of a table, the package's table kind and the configuration path its errors name.
 */
export const OPTICAL = [
  { key: 'emissivity', menu: 'sg-ek', table: 'sg-etab', grey: 'sg-eps', uGrey: 'sg-ueps', uRel: 'sg-eur', kind: 'emissivity', path: 'definition.conditions.emissivity', word: 'emissivity' },
  { key: 'path', menu: 'sg-pk', table: 'sg-ptab', grey: 'sg-tau', uGrey: 'sg-utau', uRel: 'sg-pur', kind: 'transmittance', path: 'definition.conditions.pathTransmittance', word: 'transmittance' },
  { key: 'windowT', menu: 'sg-wk', table: 'sg-wttab', grey: 'sg-wtau', uGrey: 'sg-uwtau', uRel: 'sg-wtur', kind: 'transmittance', path: 'definition.conditions.window.transmittance', word: 'transmittance' },
  { key: 'windowR', menu: 'sg-wrk', table: 'sg-wrtab', grey: 'sg-wrho', uGrey: 'sg-uwrho', uRel: 'sg-wrur', kind: 'reflectance', path: 'definition.conditions.window.reflectance', word: 'reflectance' },
];

/** Where the text of each table area came from, for the line numbers of its errors. */
const sources = new Map(); // text-area id → { lines, increasing } of the last table read

/**
 * Decimal commas where they are unambiguous: in a line whose columns are separated by ";" or a
 * tab, or in a line of exactly two blank-separated numbers each with one comma. Line numbers
 * are kept.
 */
function decimalPoints(text) {
  return text.split('\n').map((line) => {
    if (/[;\t]/.test(line)) return line.replace(/(\d),(\d)/g, '$1.$2');
    if (/^\s*[+-]?\d+,\d+\s+[+-]?\d+,\d+\s*$/.test(line)) return line.replace(/(\d),(\d)/g, '$1.$2');
    return line;
  }).join('\n');
}

const REASONS = {
  'expected two columns: wavelength and value': 'needs two numbers, the wavelength and the value',
  'not a number': 'holds something that is not a number',
  'not a finite number': 'holds a number that is not finite',
  'spectral coordinate must be > 0 and convert to a positive wavelength': 'has a first column that is not greater than 0',
  'response below 0': 'has a response below 0; a response must be 0 or more',
  'value outside [0, 1]': 'has a value outside 0 to 1',
};

function lineText(text, n) {
  const l = (text.split(/\r?\n/)[n - 1] ?? '').trim();
  return l.length > 40 ? `${l.slice(0, 40)}…` : l;
}

/** The page's words for an error of the package while reading the text of table `id`. */
function textWords(e, id, text) {
  const L = labelOf(id);
  if (e.code === 'INVALID_LINE') {
    const m = /^line (\d+) of the table text: (.*)$/.exec(e.message);
    if (m) {
      let why = REASONS[m[2]];
      if (!why && /monotone/.test(m[2])) why = 'breaks the order of the wavelengths: they must all rise or all fall, without repeats (the first two data lines set the direction)';
      return `${L}: line ${m[1]} (“${lineText(text, Number(m[1]))}”) ${why ?? 'cannot be read'}.`;
    }
  }
  if (e.code === 'NON_POSITIVE') return `${L}: every response value is 0; at least one must be greater than 0.`;
  if (e.code === 'TOO_LARGE') return `${L}: the text is too long for this page; shorten the table.`;
  if (e.code === 'TOO_FEW_POINTS') {
    const m = /has (\d+) data line/.exec(e.message);
    const n = m ? Number(m[1]) : null;
    return `${L}: a table needs at least 2 lines of wavelength and value${n === null ? '' : `; it has ${n === 1 ? 'one' : n}`}.`;
  }
  return `${L}: the table cannot be read (${e.code.toLowerCase().replace(/_/g, ' ')}).`;
}

/** Reads table `id` (kind `kind`) through the package: { wavelengths (m), values, unit: 'm' }. */
export function readTable(id, kind) {
  const raw = String($(id).value).replace(/^\uFEFF/, '');
  if (raw.trim() === '') throw new FieldError(id, `${labelOf(id)}: paste a table (one line per wavelength: wavelength, value) or load a file.`);
  const text = decimalPoints(raw);
  const unit = unitOf(id);
  let t;
  try {
    t = api.tableFromText(text, unit, kind);
  } catch (e) {
    if (api.isError(e)) throw new FieldError(id, textWords(e, id, raw), e.code);
    throw e;
  }
  // The text lines holding the points (the package skips headers and comments), and whether
  // they run in the package's order (increasing wavelength), to name a point by its line.
  const lines = [];
  const firsts = [];
  text.split(/\r?\n/).forEach((l, k) => {
    const m = /^\s*([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)/.exec(l);
    if (m) {
      lines.push(k + 1);
      firsts.push(Number(m[1]));
    }
  });
  const wavelengthKind = api.spectralKind(unit) === 'wavelength';
  const rising = firsts.length < 2 || firsts[0] < firsts[firsts.length - 1];
  sources.set(id, lines.length === t.values.length ? { lines, increasing: rising === wavelengthKind } : null);
  return { wavelengths: Array.from(t.wavelengths), values: Array.from(t.values), unit: 'm' };
}

/** The text line of point `index` (package order) of table `id`, or null. */
function lineOf(id, index) {
  const s = sources.get(id);
  if (!s || !(index >= 0 && index < s.lines.length)) return null;
  return s.increasing ? s.lines[index] : s.lines[s.lines.length - 1 - index];
}

/** A wavelength in metres written in the unit of table `id`'s menu. */
function inUnit(id, metres) {
  const u = unitOf(id);
  return `${trim(api.convertSpectral(metres, 'm', u))} ${symbol(u)}`;
}

/**
 * Runs fn (which builds a SpectralInstrument); an error goes under the field it concerns, in
 * the page's words. fields: { configuration path → field id } (longest match first).
 */
export function tagSpectral(fields, fn, fallback) {
  try {
    return fn();
  } catch (e) {
    if (!api.isError(e)) throw e;
    const key = Object.keys(fields).sort((a, b) => b.length - a.length).find((k) => e.message.includes(k));
    const id = key ? fields[key] : fallback;
    const el = $(id);
    const isTable = el?.tagName === 'TEXTAREA';
    const L = labelOf(id);
    if (e.code === 'OUTSIDE_TABLE') {
      const m = /is needed at (\S+) m, outside its wavelength grid \[(\S+), (\S+)\] m/.exec(e.message);
      if (m && isTable) {
        const u = unitOf(id);
        const [a, b] = [Number(m[2]), Number(m[3])].map((w) => api.convertSpectral(w, 'm', u)).sort((x, y) => x - y);
        throw new FieldError(id, `${L} covers ${trim(a)} to ${trim(b)} ${symbol(u)}, but the instrument's response needs it at ${inUnit(id, Number(m[1]))}: extend the table, or tick “extend each table beyond its first and last wavelength”.`, e.code);
      }
    }
    if (e.code === 'INVALID_TABLE_ENTRY') {
      const idx = /\[(\d+)\] must lie in/.exec(e.message);
      const got = /\(got (\S+)\)$/.exec(e.message);
      const sum = /sum of the two/.test(e.message);
      const line = isTable && idx ? lineOf(id, Number(idx[1])) : null;
      const where = isTable ? (line ? `line ${line} (“${lineText($(id).value, line)}”)` : `point ${Number(idx?.[1] ?? 0) + 1}`) : '';
      if (sum) {
        const s = got ? ` is ${trim(Number(got[1]))}` : ' is above 1';
        throw new FieldError(id, `${L}${where ? `, ${where}` : ''}: the window's transmittance plus its reflectance${s}${where ? ' there' : ''}; together they cannot exceed 1.`, e.code);
      }
      throw new FieldError(id, `${L}${where ? `, ${where}` : ''}: the value must be from 0 to 1.`, e.code);
    }
    if (e.code === 'TOO_FEW_POINTS' && isTable) throw new FieldError(id, explain(e, id, { unit: '' }), e.code);
    throw new FieldError(id, explain(e, id, isTable ? { text: 'this table', unit: '' } : {}), e.code);
  }
}

/** True when the section's spectral panel asks for the spectral measurement equation. */
export function spectralWanted() {
  return OPTICAL.some((o) => $(o.menu)?.value === 'table') || $('sg-wk')?.value !== 'none' || $('sg-rk')?.value !== 'band';
}

/**
 * Reads the spectral panel: the SpectralInstrument's response and conditions (with the
 * reflected and path temperatures of `scene`), the tables for the plot, and per optical input
 * { table?, grey value, standard uncertainty (absolute, or relative for a table) }.
 */
export function readSpectral(mode, scene) {
  const ends = $('sg-ends').checked ? 'constant' : 'reject';
  const fields = {
    'definition.conditions.reflectedTemperatureK': 'sg-tr',
    'definition.conditions.pathTemperatureK': 'sg-tp',
    'definition.conditions.window.temperatureK': 'sg-wtemp',
    'definition.conditions.window.reflectedTemperatureK': 'sg-wtr',
  };
  const input = {};
  const window = $('sg-wk').value !== 'none';
  for (const o of OPTICAL) {
    if (!window && (o.key === 'windowT' || o.key === 'windowR')) continue;
    if ($(o.menu).value === 'table') {
      const t = readTable(o.table, o.kind);
      const rel = number(o.uRel);
      if (!(rel >= 0)) throw new FieldError(o.uRel, `${labelOf(o.uRel)} must be 0 or more; you entered ${$(o.uRel).value.trim()} %.`, 'OUT_OF_RANGE');
      input[o.key] = { table: { ...t, ends }, value: t, u: rel / 100, relative: true, field: o.table, uField: o.uRel };
      fields[o.path] = o.table;
    } else {
      const v = o.key === 'emissivity' ? scene.eps : o.key === 'path' ? scene.conditions.pathTransmittance : number(o.grey);
      const u = o.key === 'emissivity' ? scene.u.emissivity : o.key === 'path' ? scene.u.pathTransmittance : number(o.uGrey);
      if (!(u >= 0)) throw new FieldError(o.uGrey, `${labelOf(o.uGrey)} must be 0 or more; you entered ${$(o.uGrey).value.trim()}.`, 'OUT_OF_RANGE');
      input[o.key] = { value: v, u, relative: false, field: o.grey, uField: o.uGrey };
      fields[o.path] = o.grey;
    }
  }
  let response;
  let describe;
  const rk = $('sg-rk').value;
  if (rk === 'band') {
    if (mode === 'counts') throw new FieldError('sg-rk', 'With counts, the spectral equation needs the instrument\'s response as a table: choose an energy or a photon response table.');
    if ($('sg-resp').value !== 'band') throw new FieldError('sg-rk', 'Spectral tables need a band, not one wavelength: choose “a flat band” under Instrument, or a response table here.');
    const lo = spectral('sg-lo');
    const hi = spectral('sg-hi');
    response = { wavelengths: [lo.value, hi.value], values: [1, 1], unit: lo.unit, quantity: 'energy' };
    describe = `a flat (rectangular) response from ${trim(lo.value)} to ${trim(hi.value)} ${symbol(lo.unit)}`;
    fields['definition.response'] = 'sg-hi';
  } else {
    const t = readTable('sg-rtab', 'response');
    response = { ...t, quantity: rk };
    describe = `the ${rk} response table`;
    fields['definition.response'] = 'sg-rtab';
  }
  const conditions = {
    emissivity: input.emissivity.table ?? input.emissivity.value,
    reflectedTemperatureK: scene.conditions.reflectedTemperatureK,
    pathTransmittance: input.path.table ?? input.path.value,
    pathTemperatureK: scene.conditions.pathTemperatureK,
  };
  let windowT = null;
  if (window) {
    windowT = { temperatureK: kelvin('sg-wtemp'), u: kelvinDiff('sg-uwtemp'), reflectedK: kelvin('sg-wtr'), uReflected: kelvinDiff('sg-uwtr') };
    for (const id of ['sg-uwtemp', 'sg-uwtr']) {
      if (!(number(id) >= 0)) throw new FieldError(id, `${labelOf(id)} must be 0 or more; you entered ${$(id).value.trim()} ${unitText(id)}.`, 'OUT_OF_RANGE');
    }
    conditions.window = {
      transmittance: input.windowT.table ?? input.windowT.value,
      reflectance: input.windowR.table ?? input.windowR.value,
      temperatureK: windowT.temperatureK,
      reflectedTemperatureK: windowT.reflectedK,
    };
  }
  return { definition: { response, conditions }, input, window: windowT, fields, describe, photon: rk === 'photon' };
}

// ------------------------------------------------------------------ plot

/** Plots the optical inputs (tables or grey lines) and the response (scaled to its peak) in µm. */
export function plotSpectral(figure, def) {
  const um = api.spectralSize('um');
  const r = def.response;
  const rx = r.wavelengths.map((w) => api.convertSpectral(w, r.unit, 'um'));
  const peak = Math.max(...r.values);
  let lo = Math.min(...rx);
  let hi = Math.max(...rx);
  const c = def.conditions;
  const series = [];
  const add = (label, q) => {
    if (q === undefined) return;
    if (typeof q === 'number') series.push({ label: `${label} (grey)`, x: [lo, hi], y: [q, q] });
    else series.push({ label, x: q.wavelengths.map((w) => w / um), y: q.values });
  };
  for (const q of [c.emissivity, c.pathTransmittance, c.window?.transmittance, c.window?.reflectance]) {
    if (q && typeof q === 'object') {
      lo = Math.min(lo, q.wavelengths[0] / um);
      hi = Math.max(hi, q.wavelengths[q.wavelengths.length - 1] / um);
    }
  }
  series.push({ label: `response ÷ its peak (${r.quantity})`, x: rx, y: r.values.map((v) => v / peak), colour: '#1c2230' });
  add('target emissivity ε', c.emissivity);
  add('path transmittance τ', c.pathTransmittance);
  if (c.window) {
    add('window transmittance τw', c.window.transmittance);
    add('window reflectance ρw', c.window.reflectance);
  }
  drawPlot(figure, {
    title: 'Spectral inputs and instrument response',
    x: { label: 'wavelength (µm)', short: 'λ', readoutUnit: 'µm', min: lo, max: hi },
    y: { label: 'value (ε, τ, ρ; response relative to its peak)', min: 0, max: 1.05, readoutUnit: '' },
    series,
    caption: 'Straight lines join the table points; grey inputs are flat lines over the response.',
    height: 240,
  });
}

// ------------------------------------------------------------------ demo

/**
 * The invented demo set: a made-up oxidised-steel sample (emissivity varying across 8–14 µm),
 * a made-up infrared window with its transmittance and reflectance, a short humid path and a
 * made-up detector response. Shapes are plausible, not measurements of any real material.
 */
const DEMO = {
  'sg-etab': `# INVENTED demo: oxidised-steel sample "coupon B7" (made up, not measured)
# wavelength (um), emissivity
7.5, 0.83
8.0, 0.81
8.5, 0.77
9.0, 0.72
9.5, 0.70
10.0, 0.74
10.5, 0.79
11.0, 0.83
12.0, 0.85
13.0, 0.84
14.0, 0.82
14.5, 0.81`,
  'sg-ptab': `# INVENTED demo: 1.5 m of humid indoor air (made up)
# wavelength (um), transmittance
7.5, 0.962
8.0, 0.981
9.0, 0.993
10.0, 0.995
11.0, 0.994
12.0, 0.990
13.0, 0.982
14.0, 0.968
14.5, 0.955`,
  'sg-wttab': `# INVENTED demo: coated inspection window "W-12" (made up)
# wavelength (um), transmittance
7.5, 0.84
8.0, 0.88
9.0, 0.90
10.0, 0.91
11.0, 0.90
12.0, 0.88
13.0, 0.84
14.0, 0.78
14.5, 0.74`,
  'sg-wrtab': `# INVENTED demo: the same window, reflectance towards the instrument
# wavelength (um), reflectance
7.5, 0.05
9.0, 0.03
11.0, 0.03
13.0, 0.04
14.5, 0.06`,
  'sg-rtab': `# INVENTED demo: uncooled microbolometer behind an 8-14 um filter (made up)
# wavelength (um), relative response
7.5, 0
7.8, 0.20
8.2, 0.70
9.0, 0.93
10.0, 1.00
11.0, 0.98
12.0, 0.92
13.0, 0.80
13.8, 0.45
14.3, 0.08
14.5, 0`,
};

/** Puts the demo tables in place (wavelengths in µm) and chooses tables for every input. */
export function loadDemo() {
  for (const [id, text] of Object.entries(DEMO)) {
    $(id).value = text;
    const menu = document.querySelector(`select[data-for~="${id}"]`);
    if (menu) {
      menu.value = 'um';
      menu.dataset.prev = 'um';
    }
  }
  for (const [id, v] of [['sg-ek', 'table'], ['sg-pk', 'table'], ['sg-wk', 'table'], ['sg-wrk', 'table'], ['sg-rk', 'energy'], ['sg-resp', 'band']]) $(id).value = v;
  $('sg-ends').checked = false;
  for (const [id, v] of [['sg-eur', '2'], ['sg-pur', '0.5'], ['sg-wtur', '1'], ['sg-wrur', '10']]) $(id).value = v;
  const temps = [['sg-wtemp', 308.15, 'sg-uwtemp', 1], ['sg-wtr', 300.15, 'sg-uwtr', 2]];
  for (const [id, k, uid, uk] of temps) {
    $(id).value = formatInput(api.fromK(k, unitOf(id)));
    $(uid).value = formatInput(api.diffFromK(uk, unitOf(uid)));
  }
}

