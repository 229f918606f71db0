// The page's ONE number formatter and its number readers. Pure functions (no DOM, no core
// calls), so tests/page/format.test.mjs runs them in Node directly.
//
// Writing: formatNumber() is used for every number the page shows (results, tables, tick
// labels, legends, messages, values written back into fields after a unit change):
//   * significant digits are kept, trailing zeros included (310.0000 with 7 digits);
//   * outside the plain range the form is m×10ⁿ (never "e+5");
//   * a value whose magnitude is below the computation's resolution is written 0 (the caller
//     states the resolution; formatResolved() does both);
//   * the minus sign is U+2212, NaN/undefined is "—" (a gap, never "NaN").
// Reading: parseNumber(), parseList() and parseTable() accept a decimal comma where it cannot
// be mistaken for a separator or a thousands separator, and report the problem otherwise.

const SUP = { '-': '⁻', '+': '', 0: '⁰', 1: '¹', 2: '²', 3: '³', 4: '⁴', 5: '⁵', 6: '⁶', 7: '⁷', 8: '⁸', 9: '⁹' };
const UNSUP = { '⁻': '-', '⁺': '+', '⁰': '0', '¹': '1', '²': '2', '³': '3', '⁴': '4', '⁵': '5', '⁶': '6', '⁷': '7', '⁸': '8', '⁹': '9' };
export const MINUS = '\u2212';

/** An integer as superscript digits ("−5" → "⁻⁵"). */
export function superscript(n) {
  return String(n).split('').map((c) => SUP[c] ?? c).join('');
}

function trimZeros(s) {
  return s.includes('.') ? s.replace(/0+$/, '').replace(/\.$/, '') : s;
}

/**
 * Formats a number.
 *   digits     significant digits (default 6); trailing zeros are kept unless `trim`
 *   decimals   fixed number of decimals instead of significant digits (plain notation)
 *   trim       drop trailing zeros (tick labels, values written back into fields)
 *   resolution |v| below it is written "0" (see formatResolved for the stated form)
 *   plainMax   plain notation while the decimal exponent is < plainMax (default: digits,
 *              so a number is never written with more integer digits than it has significant
 *              digits); plain notation also needs exponent ≥ −3
 */
export function formatNumber(v, o = {}) {
  if (typeof v !== 'number' || Number.isNaN(v)) return '—';
  if (!Number.isFinite(v)) return v > 0 ? '∞' : `${MINUS}∞`;
  if (o.resolution > 0 && Math.abs(v) < o.resolution) return '0';
  if (o.decimals !== undefined) {
    let s = v.toFixed(Math.max(0, Math.min(20, o.decimals)));
    if (/^-0\.?0*$/.test(s)) s = s.slice(1);
    if (o.trim) s = trimZeros(s);
    return s.replace('-', MINUS);
  }
  const digits = Math.max(1, Math.min(17, Math.round(o.digits ?? 6)));
  if (v === 0) return '0'; // an exact zero has no significant digits to keep
  const [m, e] = v.toExponential(digits - 1).split('e');
  const exp = Number(e);
  const plainMax = o.plainMax ?? digits;
  if (exp >= -3 && exp < plainMax && o.plainMax !== -Infinity) {
    let s = v.toFixed(Math.max(0, digits - 1 - exp));
    if (o.trim) s = trimZeros(s);
    return s.replace('-', MINUS);
  }
  let mant = o.trim ? trimZeros(m) : m;
  mant = mant.replace('-', MINUS);
  if (o.trim && (mant === '1' || mant === `${MINUS}1`) && o.bareDecade) return exp === 0 ? mant : `${mant === '1' ? '' : MINUS}10${superscript(exp)}`;
  return `${mant}×10${superscript(exp)}`;
}

/**
 * A value with its unit; below `resolution` it reads "0 (below 3×10⁻⁷ K)" so that rounding
 * noise of the computation is never shown as a result.
 */
export function formatResolved(v, unit, o = {}) {
  const u = unit ? ` ${unit}` : '';
  if (typeof v === 'number' && Number.isFinite(v) && v !== 0 && o.resolution > 0 && Math.abs(v) < o.resolution) {
    return `0${u} (below ${formatNumber(o.resolution, { digits: 1, trim: true })}${u})`;
  }
  return `${formatNumber(v, o)}${u}`;
}

/** A tick label for a linear axis whose ticks are `step` apart. */
export function formatTick(v, step) {
  if (Math.abs(v) < Math.abs(step) * 1e-9) return '0';
  const top = Math.floor(Math.log10(Math.abs(v)));
  const s = Math.floor(Math.log10(Math.abs(step)) + 1e-9);
  const digits = Math.max(1, Math.min(6, top - s + 1));
  return formatNumber(v, { digits, trim: true, plainMax: 5 });
}

/**
 * A tick label for a logarithmic axis: decades are written 10ⁿ; with `plain`, values from
 * 0.001 to 9999 are written plainly (an axis spanning few decades).
 */
export function formatLogTick(v, plain = true) {
  return plain
    ? formatNumber(v, { digits: 3, trim: true, plainMax: 4, bareDecade: true })
    : formatNumber(v, { digits: 3, trim: true, plainMax: -Infinity, bareDecade: true });
}

/** A value written back into an input field (12 significant digits, trimmed). */
export function formatInput(v) {
  // A field holds what a user would type: the ASCII hyphen-minus, not U+2212.
  return formatNumber(v, { digits: 12, trim: true, plainMax: 9 }).replace(MINUS, '-');
}

// ------------------------------------------------------------------------------- reading

/** Why a text could not be read: kind ∈ empty | not-number | ambiguous | ambiguous-list | count. */
export class ParseProblem extends Error {
  constructor(kind, text, extra = {}) {
    super(`${kind}: ${text}`);
    this.name = 'ParseProblem';
    this.kind = kind;
    this.text = text;
    Object.assign(this, extra); // entry (1-based list entry), line (1-based line), expected, found
  }
}

const NUMBER_RE = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * Reads one number. Accepts a decimal point or a decimal comma ("0,95"), digit groups separated
 * by spaces, "1,234.5" or "1.234,5" (groups of three), exponents as 1e-5, 1.5×10⁻⁵ or 1.5x10^-5,
 * and the minus signs "-" and "−". "1,500" is ambiguous (1.5 or 1500) and is refused.
 */
export function parseNumber(text) {
  const raw = String(text ?? '');
  let s = raw.trim().replace(/[\u2212\u2012\u2013]/g, '-').replace(/[\s\u00a0\u2009\u202f']/g, '');
  if (s === '') throw new ParseProblem('empty', raw);
  let exp = '';
  const x10 = /^(.*?)[×xX*·]10([⁻⁺]?[⁰¹²³⁴⁵⁶⁷⁸⁹]+|\^[-+]?\d+|[-+]\d+)$/.exec(s);
  if (x10) {
    s = x10[1];
    exp = `e${x10[2].replace('^', '').split('').map((c) => UNSUP[c] ?? c).join('')}`;
    if (s === '') s = '1';
  }
  const ePart = /^(.*?)([eE][+-]?\d+)$/.exec(s);
  if (ePart && !exp) {
    s = ePart[1];
    exp = ePart[2];
  }
  const commas = (s.match(/,/g) || []).length;
  const dots = (s.match(/\./g) || []).length;
  if (commas > 0 && dots > 0) {
    // Both: the last one is the decimal mark, the other groups thousands in threes.
    const dec = s.lastIndexOf(',') > s.lastIndexOf('.') ? ',' : '.';
    const grp = dec === ',' ? '.' : ',';
    const [intPart, frac] = s.split(dec);
    if (s.split(dec).length !== 2 || !new RegExp(`^[+-]?\\d{1,3}(\\${grp}\\d{3})+$`).test(intPart)) throw new ParseProblem('not-number', raw);
    s = `${intPart.split(grp).join('')}.${frac}`;
  } else if (commas > 1) {
    if (!/^[+-]?\d{1,3}(,\d{3})+$/.test(s)) throw new ParseProblem('not-number', raw);
    s = s.replace(/,/g, '');
  } else if (commas === 1) {
    if (/^[+-]?[1-9]\d{0,2},\d{3}$/.test(s) && !exp) throw new ParseProblem('ambiguous', raw);
    s = s.replace(',', '.');
  }
  s += exp;
  if (!NUMBER_RE.test(s)) throw new ParseProblem('not-number', raw);
  const v = Number(s);
  if (!Number.isFinite(v)) throw new ParseProblem('not-number', raw);
  return v;
}

/**
 * Reads a list of numbers. Entries are separated by ";", a line break, a tab, ", " (comma
 * then space) or spaces. With ";" (or line breaks) as separators an entry may use a decimal
 * comma ("1,5; 2,5"). A comma written between two digits with no space ("600,900") is
 * ambiguous (two entries, or a decimal comma) and is refused. Returns the numbers; a bad entry
 * throws ParseProblem with its 1-based `entry`.
 */
export function parseList(text) {
  const raw = String(text ?? '');
  const s = raw.trim();
  if (s === '') throw new ParseProblem('empty', raw);
  let items;
  if (/[;\n\t]/.test(s)) {
    items = s.split(/[;\n\t]+/).map((x) => x.trim()).filter((x) => x !== '');
  } else if (s.includes(',')) {
    if (/\d,\d/.test(s)) throw new ParseProblem('ambiguous-list', raw);
    items = s.split(/\s*,\s*|\s+/).filter((x) => x !== '');
  } else {
    items = s.split(/\s+/).filter((x) => x !== '');
  }
  if (items.length === 0) throw new ParseProblem('empty', raw);
  return items.map((item, k) => {
    try {
      return parseNumber(item);
    } catch (p) {
      throw new ParseProblem(p.kind, item, { entry: k + 1 });
    }
  });
}

/**
 * Reads a table of `columns` numbers per line (pasted text or a loaded CSV file). Lines that
 * are empty or start with "#" are skipped, and so is a line with no number at all (a header).
 * Cells are separated by ";" or tabs (then a decimal comma is allowed), or by commas, or by
 * spaces (then each cell may use a decimal comma); the expected column count decides between
 * "20,5 36344,87" and "20, 36344.87". Returns { rows, lines } with each row's 1-based line.
 */
export function parseTable(text, columns) {
  const rows = [];
  const lines = [];
  String(text ?? '').split(/\r?\n/).forEach((rawLine, k) => {
    const s = rawLine.trim();
    if (s === '' || s.startsWith('#')) return;
    const { cells } = splitRow(s, columns);
    const parsed = cells.map((c) => {
      try {
        return parseNumber(c);
      } catch {
        return null;
      }
    });
    if (parsed.every((v) => v === null)) return; // a header line
    const bad = parsed.indexOf(null);
    if (bad >= 0) throw new ParseProblem('not-number', cells[bad], { line: k + 1 });
    if (parsed.length !== columns) throw new ParseProblem('count', s, { line: k + 1, expected: columns, found: parsed.length });
    rows.push(parsed);
    lines.push(k + 1);
  });
  return { rows, lines };
}

/**
 * Splits one table line into its cells (see parseTable) and names the separator used, so that
 * a line can be written back with one cell changed: { cells, sep }.
 */
export function splitRow(line, columns) {
  const s = line.trim();
  let cells;
  let sep;
  if (/[;\t]/.test(s)) {
    cells = s.split(/\s*[;\t]\s*/);
    sep = s.includes(';') ? '; ' : '\t';
  } else if (s.includes(',')) {
    const byComma = s.split(/\s*,\s*/);
    const bySpace = s.split(/\s+/);
    if (byComma.length !== columns && bySpace.length === columns) {
      cells = bySpace;
      sep = ' ';
    } else {
      cells = byComma;
      sep = ', ';
    }
  } else {
    cells = s.split(/\s+/);
    sep = ' ';
  }
  return { cells: cells.filter((c) => c !== ''), sep };
}

/** Escapes text for HTML. */
export function esc(s) {
  return String(s).replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]);
}
