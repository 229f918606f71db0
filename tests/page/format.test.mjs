// Unit tests of the page's one number formatter and its readers (www/js/fmt.js), in Node (no
// browser). Conventions checked: the SI Brochure (9th ed., 2019, §5.4.3–5.4.4: a number times a
// power of ten, the decimal marker a point or a comma, digits grouped by thin spaces, never by
// points or commas) and ISO 80000-1:2009 §7.3 (the same rules); "significant digits kept" is
// the page's own rule from issue 13.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import {
  formatNumber, formatResolved, formatTick, formatLogTick, formatInput, parseNumber, parseList, parseTable, ParseProblem, superscript,
} from '../../www/js/fmt.js';

const M = '\u2212';

test('significant digits are kept, trailing zeros included', () => {
  assert.equal(formatNumber(310, { digits: 7 }), '310.0000');
  assert.equal(formatNumber(0.5, { digits: 3 }), '0.500');
  assert.equal(formatNumber(1.2345678, { digits: 4 }), '1.235');
  assert.equal(formatNumber(9.9999996, { digits: 7 }), '10.00000'); // rounding carries into a new digit
  assert.equal(formatNumber(-23.15, { digits: 6 }), `${M}23.1500`);
  assert.equal(formatNumber(0, { digits: 7 }), '0');
});

test('powers of ten are written ×10ⁿ, never with an "e"', () => {
  assert.equal(formatNumber(131060, { digits: 5 }), '1.3106×10⁵');
  assert.equal(formatNumber(3000, { digits: 3 }), '3.00×10³');
  assert.equal(formatNumber(20300, { digits: 3 }), '2.03×10⁴');
  assert.equal(formatNumber(1.5264e-19, { digits: 5 }), '1.5264×10⁻¹⁹');
  assert.equal(formatNumber(-4.2e-5, { digits: 2 }), `${M}4.2×10⁻⁵`);
  assert.equal(formatNumber(0.00123, { digits: 3 }), '0.00123'); // exponent −3 stays plain
  assert.equal(formatNumber(999, { digits: 3 }), '999');
  assert.equal(formatNumber(1234567, { digits: 7 }), '1234567');
  for (const v of [1e-300, 5e307, -7.5e-12, 6.02214076e23]) assert.doesNotMatch(formatNumber(v, { digits: 4 }), /e/);
  assert.equal(superscript(-12), '⁻¹²');
});

test('fixed decimals, and no negative zero', () => {
  assert.equal(formatNumber(21.85, { decimals: 4 }), '21.8500');
  assert.equal(formatNumber(-0.00001, { decimals: 3 }), '0.000');
  assert.equal(formatNumber(-1.5, { decimals: 1 }), `${M}1.5`);
});

test('undefined values are a dash, infinities a symbol, never "NaN"', () => {
  assert.equal(formatNumber(NaN), '—');
  assert.equal(formatNumber(undefined), '—');
  assert.equal(formatNumber(Infinity), '∞');
  assert.equal(formatNumber(-Infinity), `${M}∞`);
});

test('values below the resolution of the computation are written 0 with the resolution stated', () => {
  assert.equal(formatNumber(-1.5264e-19, { digits: 5, resolution: 1e-9 }), '0');
  assert.equal(formatResolved(-1.5264e-19, 'K/K', { digits: 5, resolution: 3e-7 }), '0 K/K (below 3×10⁻⁷ K/K)');
  assert.equal(formatResolved(4.9e-36, '%', { digits: 3, resolution: 1e-7 }), '0 % (below 1×10⁻⁷ %)');
  assert.equal(formatResolved(0.0243, 'K/K', { digits: 3, resolution: 3e-7 }), '0.0243 K/K');
});

test('tick labels: as many digits as the step needs, decades as 10ⁿ on log axes', () => {
  assert.equal(formatTick(0.5, 0.5), '0.5');
  assert.equal(formatTick(1, 0.5), '1');
  assert.equal(formatTick(14000, 2000), '14000');
  assert.equal(formatTick(2e5, 5e4), '2×10⁵');
  assert.equal(formatTick(-0.02, 0.01), `${M}0.02`);
  assert.equal(formatTick(1e-17, 0.1), '0');
  assert.equal(formatLogTick(1e-6), '10⁻⁶');
  assert.equal(formatLogTick(100), '100');
  assert.equal(formatLogTick(2e-3), '0.002');
});

test('values written back into fields round-trip through the reader', () => {
  for (const v of [21.850000000000023, 295, 0.899, 1.5e-5, -273.15, 6.02214076e23, 1e-12, 12345.678901234]) {
    const s = formatInput(v);
    assert.ok(Math.abs(parseNumber(s) - v) <= Math.abs(v) * 1e-11, `${v} → ${s}`);
  }
  assert.equal(formatInput(21.850000000000023), '21.85');
  assert.equal(formatInput(1.5e-5), '1.5×10⁻⁵');
});

test('reader: decimal point or comma, exponents, minus signs, digit groups', () => {
  assert.equal(parseNumber('1.5'), 1.5);
  assert.equal(parseNumber('1,5'), 1.5);
  assert.equal(parseNumber(' 0,95 '), 0.95);
  assert.equal(parseNumber('0,500'), 0.5); // a leading zero cannot start a thousands group
  assert.equal(parseNumber('1234,5'), 1234.5);
  assert.equal(parseNumber(`${M}5`), -5);
  assert.equal(parseNumber('1e-5'), 1e-5);
  assert.equal(parseNumber('1.5×10⁻⁵'), 1.5e-5);
  assert.equal(parseNumber('1,5x10^-5'), 1.5e-5);
  assert.equal(parseNumber('2.5·10³'), 2500);
  assert.equal(parseNumber('1 500 000'), 1.5e6); // thin-space-style grouping (SI Brochure §5.4.4)
  assert.equal(parseNumber('1,234.5'), 1234.5);
  assert.equal(parseNumber('1.234,5'), 1234.5);
  assert.equal(parseNumber('1,000,000'), 1e6);
});

test('reader: refuses empty, malformed and ambiguous text with the reason', () => {
  const kind = (s) => {
    try {
      parseNumber(s);
      return 'ok';
    } catch (e) {
      assert.ok(e instanceof ParseProblem);
      return e.kind;
    }
  };
  assert.equal(kind(''), 'empty');
  assert.equal(kind('   '), 'empty');
  assert.equal(kind('abc'), 'not-number');
  assert.equal(kind('1.2.3'), 'not-number');
  assert.equal(kind('1,5,7'), 'not-number');
  assert.equal(kind('0x10'), 'not-number');
  assert.equal(kind('1,500'), 'ambiguous'); // 1.5 or 1500?
  assert.equal(kind('-12,345'), 'ambiguous');
  assert.equal(kind('NaN'), 'not-number');
  assert.equal(kind('Infinity'), 'not-number');
});

test('lists: unambiguous separators, decimal commas with semicolons, the bad entry named', () => {
  assert.deepEqual(parseList('600, 900, 1300'), [600, 900, 1300]);
  assert.deepEqual(parseList('600 900 1300'), [600, 900, 1300]);
  assert.deepEqual(parseList('1,5; 2,5'), [1.5, 2.5]);
  assert.deepEqual(parseList('1.5, 2.5'), [1.5, 2.5]);
  assert.deepEqual(parseList('300\n400'), [300, 400]);
  assert.throws(() => parseList('1,5'), (x) => x.kind === 'ambiguous-list'); // 1.5, or 1 and 5?
  assert.throws(() => parseList('600,900'), (x) => x.kind === 'ambiguous-list');
  assert.throws(() => parseList('600, abc, 900'), (x) => x.kind === 'not-number' && x.entry === 2 && x.text === 'abc');
  assert.throws(() => parseList(''), (x) => x.kind === 'empty');
});

test('tables: the column count tells a decimal comma from a separator; lines are reported', () => {
  const t = parseTable('# comment\ntemperature_K,signal\n20, 36344.87\n20,5 36344,87\n60;64442,16\n7.5\t0\n', 2);
  assert.deepEqual(t.rows, [[20, 36344.87], [20.5, 36344.87], [60, 64442.16], [7.5, 0]]);
  assert.deepEqual(t.lines, [3, 4, 5, 6]);
  assert.throws(() => parseTable('8, 1\n9, x1\n', 2), (x) => x.kind === 'not-number' && x.line === 2);
  assert.throws(() => parseTable('8, 1\n9, 1, 3\n', 2), (x) => x.kind === 'count' && x.line === 2 && x.found === 3);
});
