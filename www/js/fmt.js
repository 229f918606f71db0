// Number formatting for the page: readable significant digits, SI-style exponents.

const SUP = { '-': '⁻', 0: '⁰', 1: '¹', 2: '²', 3: '³', 4: '⁴', 5: '⁵', 6: '⁶', 7: '⁷', 8: '⁸', 9: '⁹' };

/** Formats a number with `digits` significant digits; exponents as ×10ⁿ outside [1e-3, 1e6). */
export function fmt(v, digits = 6) {
  if (typeof v !== 'number') return String(v);
  if (Number.isNaN(v)) return '—';
  if (!Number.isFinite(v)) return v > 0 ? '∞' : '−∞';
  if (v === 0) return '0';
  const a = Math.abs(v);
  if (a >= 1e-3 && a < 1e6) {
    let s = v.toPrecision(digits);
    if (s.includes('.') && !s.includes('e')) s = s.replace(/0+$/, '').replace(/\.$/, '');
    return s.replace('-', '−');
  }
  const [m, e] = v.toExponential(digits - 1).split('e');
  const mant = m.includes('.') ? m.replace(/0+$/, '').replace(/\.$/, '') : m;
  const exp = String(Number(e)).split('').map((c) => SUP[c]).join('');
  return `${mant.replace('-', '−')}×10${exp}`;
}

/** Short tick label (3 significant digits). */
export function fmtTick(v) {
  if (v === 0) return '0';
  const a = Math.abs(v);
  if (a >= 1e-3 && a < 1e5) return String(Number(v.toPrecision(3))).replace('-', '−');
  const [m, e] = v.toExponential(2).split('e');
  const mant = String(Number(m));
  const exp = String(Number(e)).split('').map((c) => SUP[c]).join('');
  return mant === '1' ? `10${exp}` : `${mant.replace('-', '−')}×10${exp}`;
}

/** Parses user text to a number: empty or malformed text gives NaN (the core then reports it). */
export function parseNum(text) {
  const s = String(text).trim().replace(/\u2212/g, '-').replace(/\s+/g, '');
  if (s === '') return NaN;
  return Number(s);
}

/** Parses a comma/semicolon/space separated list of numbers. */
export function parseList(text) {
  return String(text)
    .split(/[,;\s]+/)
    .filter((s) => s.length > 0)
    .map(parseNum);
}

/** Escapes text for HTML. */
export function esc(s) {
  return String(s).replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]);
}
