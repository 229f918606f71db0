// The npm package's README (pkg/README.md, generated from pkg-scripts/npm-readme.md and shared
// parts of README.md by pkg-scripts/lib/npm-readme.mjs):
//   - is the rendering of the current sources (a stale build or a hand edit fails);
//   - reads as an npm page: no internal markers or repository paths, no relative links, every
//     in-page link lands on a heading, the sections a package user looks for are there;
//   - its JavaScript examples run as written against the built package (`quantaband` pointed at
//     pkg/node.js), and each `// → NUMBER` comment equals what that line returns, to the digits
//     shown. Those numbers guard the page against drift; their correctness against outside
//     references is checked by the value suites (radiometry, thermometry, smoke reference.json).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import { renderNpmReadme } from '../../pkg-scripts/lib/npm-readme.mjs';

const root = new URL('../../', import.meta.url);
const readme = readFileSync(new URL('pkg/README.md', root), 'utf8');
const entry = new URL('pkg/node.js', root).href;

/** GitHub-style heading slug (npm's renderer makes the same ids for these headings). */
export function slug(heading) {
  return heading
    .toLowerCase()
    .replace(/`/g, '')
    .replace(/[^\p{L}\p{N}\s_-]/gu, '')
    .trim()
    .replace(/\s/g, '-');
}

/** Markdown text outside fenced code blocks. */
function prose(md) {
  return md.split(/^```[\s\S]*?^```$/m).join('\n');
}

test('pkg/README.md is the rendering of pkg-scripts/npm-readme.md and README.md', () => {
  assert.equal(readme, renderNpmReadme(), 'pkg/README.md is stale: run bash pkg-scripts/build.sh');
});

test('the npm README reads as a package page', () => {
  assert.ok(readme.startsWith('# quantaband\n'), 'starts with the package name');
  assert.match(readme, /^```sh\nnpm install quantaband\n```$/m, 'shows the install command');
  for (const word of ['<!--', '-->', 'owner:', '{{', '}}']) assert.ok(!readme.includes(word), `contains "${word}"`);
  // Nothing that only makes sense inside the repository.
  const text = prose(readme);
  for (const re of [/pkg-scripts\//, /\btests\//, /\bsrc\/wasm/, /DEVELOPERS\.md/, /\bcargo\b/, /\.rs\b/, /\bpkg\//]) {
    const m = re.exec(text);
    assert.ok(!m, `mentions ${re}: …${m && text.slice(Math.max(0, m.index - 60), m.index + 60)}…`);
  }
  const headings = [...readme.matchAll(/^(#{2,3}) (.+)$/gm)].map((m) => m[2]);
  for (const h of [
    'Install',
    'Quick start',
    'Prepare once, then call with numbers',
    'Spectra and bands',
    'Object temperature from an instrument reading',
    'Calibration curve and frame conversion',
    'Fitting a calibration through measured points',
    'Uncertainty budget',
    'Errors',
    'Bundlers, workers, CSP and supported versions',
    'Vite',
    'esbuild',
    'Web Workers',
    'Content-Security-Policy',
    'Browser support',
    'Cautions',
  ]) {
    assert.ok(headings.includes(h), `no heading "${h}"`);
  }
  assert.match(readme, /'wasm-unsafe-eval'/);
  assert.match(readme, /QuantabandError/);
  // Links: absolute, or to a heading of this page.
  const ids = new Set(headings.map(slug));
  const links = [...prose(readme).matchAll(/\]\(([^)\s]+)\)/g)].map((m) => m[1]);
  assert.ok(links.length >= 1);
  for (const href of links) {
    if (href.startsWith('#')) assert.ok(ids.has(href.slice(1)), `link ${href} has no heading`);
    else assert.match(href, /^https:\/\//, `relative link ${href} would be broken on the npm page`);
  }
});

/**
 * Rewrites `EXPR; // → NUMBER …` (also `const x = EXPR; // → …`) so the value is checked, and
 * returns the code and the number of checks.
 */
function instrument(code, block) {
  let checks = 0;
  const lines = code.split('\n').map((line, i) => {
    const m = /^(\s*)((?:const|let) [\w$]+ = )?(.+);(\s*)\/\/ → (-?\d[\d.]*(?:e[-+]?\d+)?)(.*)$/.exec(line);
    if (!m) return line;
    checks++;
    const [, indent, decl = '', expr, , shown] = m;
    return `${indent}${decl}globalThis.__qbCheck(${expr}, ${JSON.stringify(shown)}, ${JSON.stringify(`example ${block}, line ${i + 1}: ${line.trim()}`)});`;
  });
  return { code: lines.join('\n'), checks };
}

test('the npm README examples run and print what they say', async () => {
  const blocks = [...readme.matchAll(/^```js\n([\s\S]*?)^```$/gm)]
    .map((m) => m[1])
    .filter((b) => /from 'quantaband'/.test(b) && !/\bdocument\b|\bself\b/.test(b));
  assert.ok(blocks.length >= 8, `found ${blocks.length} runnable examples`);
  const failures = [];
  let total = 0;
  globalThis.__qbCheck = (value, shown, where) => {
    const [mantissa, exponent = '0'] = shown.split('e');
    const decimals = mantissa.includes('.') ? mantissa.split('.')[1].length : 0;
    const tolerance = 0.5 * 10 ** (Number(exponent) - decimals) * (1 + 1e-9);
    if (typeof value !== 'number' || !(Math.abs(value - Number(shown)) <= tolerance)) {
      failures.push(`${where}: returns ${value}, the comment says ${shown}`);
    }
    return value;
  };
  try {
    for (const [i, block] of blocks.entries()) {
      const { code, checks } = instrument(block, i + 1);
      total += checks;
      const src = code.replaceAll("from 'quantaband'", `from ${JSON.stringify(entry)}`);
      try {
        await import(`data:text/javascript;base64,${Buffer.from(src).toString('base64')}`);
      } catch (e) {
        failures.push(`example ${i + 1} threw: ${e && e.stack}`);
      }
    }
  } finally {
    delete globalThis.__qbCheck;
  }
  assert.deepEqual(failures, []);
  assert.ok(total >= 20, `only ${total} values checked`);
});
