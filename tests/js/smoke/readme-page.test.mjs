// The packed README as the npm page shows it: README.md is taken from the tarball, rendered to
// HTML with `marked` (GitHub-flavoured Markdown, pinned devDependency; heading ids made the GitHub
// way, as npm does), opened in Debian's headless Chromium, and checked as a reader would see it:
// one title, every Markdown table and code block rendered as such, no raw Markdown, comment
// markers or template placeholders in the visible text, every in-page link landing on a heading,
// nothing wider than the page. A full-page screenshot is written to
// tests/artifacts/npm-readme.png (ignored by git) for a person to look at.
//
//   node --test tests/js/smoke/readme-page.test.mjs   (QB_TARBALL=path.tgz skips the pack step)
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { execFileSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const here = dirname(fileURLToPath(import.meta.url));
const root = resolve(here, '..', '..', '..');
const artifacts = join(root, 'tests', 'artifacts');

/** GitHub-style heading id (the same rule as tests/js/npm-readme.test.mjs). */
function slug(text) {
  return text
    .toLowerCase()
    .replace(/[^\p{L}\p{N}\s_-]/gu, '')
    .trim()
    .replace(/\s/g, '-');
}

const STYLE = `
  body { box-sizing: border-box; max-width: 980px; margin: 0 auto; padding: 32px 40px;
         font: 16px/1.5 -apple-system, "Segoe UI", "Liberation Sans", Arial, sans-serif; color: #1f2328; }
  h1, h2 { border-bottom: 1px solid #d1d9e0; padding-bottom: .3em; }
  code { font: 85% "Liberation Mono", monospace; background: #eff1f3; padding: .2em .4em; border-radius: 6px; }
  pre { background: #f6f8fa; padding: 16px; overflow: auto; border-radius: 6px; line-height: 1.45; }
  pre code { background: none; padding: 0; }
  table { border-collapse: collapse; display: block; max-width: 100%; overflow: auto; }
  th, td { border: 1px solid #d1d9e0; padding: 6px 13px; }
  a { color: #0969da; }
`;

test('the packed README renders as a clean page', async () => {
  const tgz = process.env.QB_TARBALL || execFileSync('bash', [join(root, 'pkg-scripts', 'pack.sh')], { encoding: 'utf8' }).trim().split('\n').pop();
  const markdown = execFileSync('tar', ['-xzOf', tgz, 'package/README.md'], { encoding: 'utf8' });
  const { Marked } = await import(pathToFileURL(join(root, 'node_modules', 'marked', 'lib', 'marked.esm.js')).href);
  const marked = new Marked({ gfm: true });
  marked.use({
    renderer: {
      heading({ tokens, depth, text }) {
        return `<h${depth} id="${slug(text.replace(/`/g, ''))}">${this.parser.parseInline(tokens)}</h${depth}>\n`;
      },
    },
  });
  const html = `<!doctype html><html lang="en"><meta charset="utf-8"><title>quantaband - npm</title>
<style>${STYLE}</style><body>${marked.parse(markdown)}</body></html>`;
  mkdirSync(artifacts, { recursive: true });
  writeFileSync(join(artifacts, 'npm-readme.html'), html);

  // What the Markdown holds, counted outside code fences.
  const fences = (markdown.match(/^```/gm) ?? []).length / 2;
  const tables = (markdown.replace(/^```[\s\S]*?^```$/gm, '').match(/^\|(?:\s*:?-+:?\s*\|)+\s*$/gm) ?? []).length;
  assert.ok(Number.isInteger(fences) && fences >= 10, `${fences} code blocks`);
  assert.ok(tables >= 2, `${tables} tables`);

  const { chromium } = await import(pathToFileURL(join(root, 'node_modules', 'playwright-core', 'index.mjs')).href);
  const browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  try {
    const page = await browser.newPage({ viewport: { width: 1100, height: 900 } });
    const requests = [];
    const errors = [];
    page.on('request', (r) => requests.push(r.url()));
    page.on('console', (m) => m.type() === 'error' && errors.push(m.text()));
    await page.goto(pathToFileURL(join(artifacts, 'npm-readme.html')).href);
    const seen = await page.evaluate(() => {
      // The visible prose (code is allowed to contain brackets, asterisks and the like).
      const prose = document.body.cloneNode(true);
      for (const c of prose.querySelectorAll('code, pre')) c.remove();
      const text = prose.textContent;
      const ids = new Set([...document.querySelectorAll('[id]')].map((e) => e.id));
      return {
        h1: [...document.querySelectorAll('h1')].map((h) => h.textContent),
        h2: [...document.querySelectorAll('h2')].map((h) => h.textContent),
        tables: document.querySelectorAll('table').length,
        codeBlocks: document.querySelectorAll('pre > code').length,
        raw: ['<!--', '-->', '```', '{{', '}}', '](', '|---', '**'].filter((s) => text.includes(s)),
        deadLinks: [...document.querySelectorAll('a[href^="#"]')].map((a) => a.getAttribute('href')).filter((h) => !ids.has(h.slice(1))),
        inPageLinks: document.querySelectorAll('a[href^="#"]').length,
        overflow: document.documentElement.scrollWidth - document.documentElement.clientWidth,
        height: document.documentElement.scrollHeight,
      };
    });
    await page.screenshot({ path: join(artifacts, 'npm-readme.png'), fullPage: true });
    console.log(`# screenshot: ${join(artifacts, 'npm-readme.png')} (${seen.height} px tall)`);
    assert.deepEqual(seen.h1, ['quantaband']);
    for (const h of ['Install', 'Quick start', 'Examples', 'Errors', 'Bundlers, workers, CSP and supported versions', 'Cautions']) {
      assert.ok(seen.h2.includes(h), `no section "${h}" (have: ${seen.h2.join(' | ')})`);
    }
    assert.equal(seen.tables, tables, 'every Markdown table renders as a table');
    assert.equal(seen.codeBlocks, fences, 'every fenced block renders as code');
    assert.deepEqual(seen.raw, [], 'raw Markdown or markers in the visible text');
    assert.ok(seen.inPageLinks >= 1);
    assert.deepEqual(seen.deadLinks, [], 'in-page links without a target');
    assert.ok(seen.overflow <= 0, `the page is ${seen.overflow} px wider than the window`);
    assert.deepEqual(errors, []);
    assert.deepEqual(
      requests.filter((u) => !u.startsWith('file:')),
      [],
      'the rendered README loads nothing from elsewhere (no images or badges from the network)',
    );
  } finally {
    await browser.close();
  }
});
