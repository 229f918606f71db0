// Consumers of the packed npm tarball, set up the way a user would and checked by a computed value:
//   - the README's recipes, run as written: the code blocks of README.md's "npm" section whose
//     first line names a file (`// build-copy.mjs`, `// src/main.js`, …) are written to those
//     files, and the ```html block is the page that uses the package without a bundler;
//   - the npm README's (the tarball's) command-line quick start for esbuild, run as written;
//   - esbuild (0.28, root devDependency): recipe 1 (copy the .wasm; also builds the module
//     worker), recipe 2 (file loader + public path), recipe 3 (binary loader + initSync), and the
//     failure the recipes exist for (no copy: the .wasm is a 404);
//   - Vite (8.4, root devDependency): `vite build` (page + module worker) and the dev server;
//   - Content-Security-Policy: the Vite build under `script-src 'self' 'wasm-unsafe-eval'` works,
//     and under `script-src 'self'` init() is refused (what the README says);
//   - a page with an import map and no bundler;
//   - CommonJS: `require('quantaband')` on this Node (tests/consumers/cjs/index.cjs).
// Pages run in Debian's headless Chromium (playwright-core, no-network flags), served from
// 127.0.0.1; no request may leave that origin. Values: Planck radiance at 10 µm, 300 K against
// mpmath (tests/js/smoke/reference.json), and equal to what the same package computes in Node.
//
//   node --test tests/consumers/consumers.test.mjs    (QB_TARBALL=path.tgz skips the pack step;
//                                                      QB_KEEP_CONSUMERS=1 keeps the scratch folder)
import { after, before, test } from 'node:test';
import assert from 'node:assert/strict';
import { execFileSync } from 'node:child_process';
import { cpSync, mkdirSync, mkdtempSync, readFileSync, rmSync, statSync, symlinkSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:http';
import { tmpdir } from 'node:os';
import { dirname, extname, join, normalize, resolve, sep } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const here = dirname(fileURLToPath(import.meta.url));
const root = resolve(here, '..', '..');
const reference = JSON.parse(readFileSync(join(root, 'tests', 'js', 'smoke', 'reference.json'), 'utf8'));
// mpmath: L_λ(10 µm, 300 K) per metre; the recipes print it per µm.
const refCase = reference.cases.find((c) => c.wavelength_m === 1e-5 && c.temperature_k === 300);
const REF_PER_UM = refCase.radiance_w_m2_sr_m * 1e-6;

function run(cmd, args, opts = {}) {
  return execFileSync(cmd, args, { encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'], ...opts });
}

/** The README's recipe files: { 'build-copy.mjs': code, 'src/main.js': code, …, html: page }. */
function readmeRecipes() {
  const readme = readFileSync(join(root, 'README.md'), 'utf8');
  const begin = readme.search(/^<!-- BEGIN npm\b/m);
  const end = readme.indexOf('<!-- END npm -->');
  assert.ok(begin >= 0 && end > begin, 'README.md has no npm section');
  const section = readme.slice(begin, end);
  const files = {};
  for (const m of section.matchAll(/^```(js|html)\n([\s\S]*?)^```$/gm)) {
    const [, lang, code] = m;
    if (lang === 'html') {
      assert.equal(files.html, undefined, 'one html example');
      files.html = code;
      continue;
    }
    const name = /^\/\/ ([\w./-]+)\n/.exec(code)?.[1];
    if (!name) continue;
    assert.ok(!(name in files) || files[name] === code, `${name} is shown twice, differently`);
    files[name] = code;
  }
  return files;
}

const recipes = readmeRecipes();
let tgz;
let scratch;
let nodeValues;

before(async () => {
  tgz = process.env.QB_TARBALL || run('bash', [join(root, 'pkg-scripts', 'pack.sh')]).trim().split('\n').pop();
  assert.ok(statSync(tgz).isFile(), `tarball ${tgz} not found`);
  scratch = mkdtempSync(join(tmpdir(), 'quantaband-consumers-'));
  writeFileSync(
    join(scratch, 'package.json'),
    JSON.stringify({ name: 'quantaband-consumers', version: '1.0.0', private: true, type: 'module' }),
  );
  run('npm', ['install', '--offline', '--no-audit', '--no-fund', '--ignore-scripts', '--loglevel=error', tgz], {
    cwd: scratch,
  });
  // The bundlers are the repository's pinned devDependencies; a consumer project resolves them
  // from its own node_modules, so link them there (they resolve their own files by real path).
  for (const dep of ['esbuild', 'vite']) symlinkSync(join(root, 'node_modules', dep), join(scratch, 'node_modules', dep), 'dir');
  const q = await import(pathToFileURL(join(scratch, 'node_modules', 'quantaband', 'node.js')).href);
  const spectrum = new q.Spectrum({ unit: 'um' });
  nodeValues = { radiance: spectrum.point(10, 300), worker: Array.from(spectrum.points([8, 10, 12], 300)) };
  spectrum.free();
});

after(() => {
  if (scratch && !process.env.QB_KEEP_CONSUMERS) rmSync(scratch, { recursive: true, force: true });
});

/** Writes the README files `names` into `dir`. */
function writeRecipes(dir, names) {
  for (const name of names) {
    assert.ok(name in recipes, `README.md shows no ${name}`);
    mkdirSync(dirname(join(dir, name)), { recursive: true });
    writeFileSync(join(dir, name), recipes[name]);
  }
}

const MIME = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8',
  '.wasm': 'application/wasm',
};

/** Serves `dir` on 127.0.0.1 (with a Content-Security-Policy header when `csp` is given). */
async function serve(dir, csp) {
  const server = createServer((req, res) => {
    const path = decodeURIComponent(new URL(req.url, 'http://127.0.0.1').pathname);
    const file = normalize(join(dir, path.endsWith('/') ? `${path}index.html` : path));
    let body;
    if (file === dir || file.startsWith(dir + sep)) {
      try {
        body = readFileSync(file);
      } catch {
        body = undefined;
      }
    }
    const headers = { 'content-type': MIME[extname(file)] ?? 'application/octet-stream' };
    if (csp) headers['content-security-policy'] = csp;
    if (body === undefined) res.writeHead(404, headers).end();
    else res.writeHead(200, headers).end(body);
  });
  await new Promise((ok) => server.listen(0, '127.0.0.1', ok));
  return { origin: `http://127.0.0.1:${server.address().port}`, close: () => new Promise((ok) => server.close(ok)) };
}

let browser;
async function chromium() {
  if (!browser) {
    const { chromium: c } = await import(pathToFileURL(join(root, 'node_modules', 'playwright-core', 'index.mjs')).href);
    browser = await c.launch({
      executablePath: '/usr/bin/chromium',
      args: [
        '--no-sandbox',
        '--disable-gpu',
        '--disable-quic',
        '--no-first-run',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
      ],
    });
  }
  return browser;
}
after(async () => {
  if (browser) await browser.close();
});

/**
 * Opens `url` and waits until every selector in `outputs` has text, or an error shows. Returns
 * the texts, console errors, page errors, failed responses and requests outside `origin`.
 */
async function visit(url, origin, outputs, { expectFailure = false } = {}) {
  const page = await (await chromium()).newPage();
  const consoleErrors = [];
  const pageErrors = [];
  const failed = [];
  const foreign = [];
  const requests = [];
  page.on('console', (m) => m.type() === 'error' && consoleErrors.push(m.text()));
  page.on('pageerror', (e) => pageErrors.push(String(e)));
  page.on('response', (r) => r.status() >= 400 && failed.push(`${r.status()} ${r.url()}`));
  page.on('request', (r) => {
    requests.push(r.url());
    if (!r.url().startsWith(origin)) foreign.push(r.url());
  });
  try {
    await page.goto(url);
    if (expectFailure) {
      // Until the failure shows (an uncaught error of the page's module), at most 20 s.
      for (let t = Date.now(); pageErrors.length === 0 && Date.now() - t < 20000; ) await new Promise((ok) => setTimeout(ok, 50));
    } else {
      await page
        .waitForFunction((sels) => sels.every((s) => document.querySelector(s)?.textContent), outputs, { timeout: 20000 })
        .catch(() => {});
    }
    const texts = {};
    for (const s of outputs) texts[s] = (await page.textContent(s)) ?? '';
    return { texts, consoleErrors, pageErrors, failed, foreign, requests };
  } finally {
    await page.close();
  }
}

/** Checks a page's outputs against mpmath and the Node run of the same package. */
function checkOutputs(r, label, { worker = false } = {}) {
  assert.deepEqual(r.pageErrors, [], `${label}: page errors`);
  assert.deepEqual(r.consoleErrors, [], `${label}: console errors`);
  assert.deepEqual(r.failed, [], `${label}: failed requests`);
  assert.deepEqual(r.foreign, [], `${label}: requests outside the test origin`);
  const text = r.texts['#radiance'];
  assert.match(text, /^\S+ W·m⁻²·sr⁻¹·µm⁻¹$/, `${label}: ${JSON.stringify(text)}`);
  const value = Number(text.split(' ')[0]);
  assert.ok(Math.abs(value / REF_PER_UM - 1) <= 1e-12, `${label}: L(10 µm, 300 K) = ${value}, mpmath ${REF_PER_UM}`);
  assert.equal(value, nodeValues.radiance, `${label}: differs from the same package in Node`);
  if (worker) {
    const values = r.texts['#worker'].split(' ').map(Number);
    assert.deepEqual(values, nodeValues.worker, `${label}: worker result`);
    assert.ok(Math.abs(values[1] / REF_PER_UM - 1) <= 1e-12, `${label}: worker L(10 µm, 300 K) = ${values[1]}`);
  }
}

test('esbuild: the three README recipes build and compute in Chromium, with the worker', async () => {
  const dir = join(scratch, 'esbuild');
  mkdirSync(dir);
  writeRecipes(dir, [
    'build-copy.mjs',
    'build-file.mjs',
    'build-inline.mjs',
    'src/main.js',
    'src/main-file.js',
    'src/main-inline.js',
    'src/worker.js',
    'src/main-worker.js',
  ]);
  for (const build of ['build-copy.mjs', 'build-file.mjs', 'build-inline.mjs']) run('node', [build], { cwd: dir });
  const dist = join(dir, 'dist');
  for (const page of ['copy', 'file', 'inline']) cpSync(join(here, 'esbuild', `${page}.html`), join(dist, `${page}.html`));
  const server = await serve(dist);
  try {
    checkOutputs(await visit(`${server.origin}/copy.html`, server.origin, ['#radiance', '#worker']), 'recipe 1 (copy)', {
      worker: true,
    });
    checkOutputs(await visit(`${server.origin}/file.html`, server.origin, ['#radiance']), 'recipe 2 (file loader)');
    const inline = await visit(`${server.origin}/inline.html`, server.origin, ['#radiance']);
    checkOutputs(inline, 'recipe 3 (inline)');
    // Self-contained: the page and its one script, nothing fetched.
    assert.deepEqual(inline.requests.map((u) => new URL(u).pathname), ['/inline.html', '/inline.js']);
  } finally {
    await server.close();
  }
});

test("esbuild: the npm README's command-line quick start works as written", async () => {
  const readme = run('tar', ['-xzOf', tgz, 'package/README.md']);
  const block = [...readme.matchAll(/^```sh\n([\s\S]*?)^```$/gm)].map((m) => m[1]).find((b) => b.includes('esbuild'));
  assert.ok(block, 'the packed README has no esbuild command-line block');
  // The project: src/main.js as in the recipes, esbuild's command in node_modules/.bin (npx finds
  // it there and asks no registry).
  writeRecipes(scratch, ['src/main.js']);
  mkdirSync(join(scratch, 'node_modules', '.bin'), { recursive: true });
  symlinkSync(join(root, 'node_modules', 'esbuild', 'bin', 'esbuild'), join(scratch, 'node_modules', '.bin', 'esbuild'));
  run('bash', ['-euo', 'pipefail', '-c', block], { cwd: scratch, env: { ...process.env, npm_config_offline: 'true' } });
  cpSync(join(here, 'esbuild', 'cli.html'), join(scratch, 'dist', 'cli.html'));
  const server = await serve(join(scratch, 'dist'));
  try {
    checkOutputs(await visit(`${server.origin}/cli.html`, server.origin, ['#radiance']), 'command-line quick start');
  } finally {
    await server.close();
  }
});

test('esbuild: without the copy step the .wasm is a 404 (why the recipes exist)', async () => {
  const dir = join(scratch, 'esbuild-plain');
  mkdirSync(dir);
  writeRecipes(dir, ['src/main.js']);
  const { build } = await import(pathToFileURL(join(root, 'node_modules', 'esbuild', 'lib', 'main.js')).href);
  await build({ absWorkingDir: dir, entryPoints: ['src/main.js'], bundle: true, format: 'esm', outdir: 'dist', logLevel: 'silent' });
  cpSync(join(here, 'esbuild', 'copy.html'), join(dir, 'dist', 'copy.html'));
  const server = await serve(join(dir, 'dist'));
  try {
    const r = await visit(`${server.origin}/copy.html`, server.origin, ['#radiance'], { expectFailure: true });
    assert.equal(r.texts['#radiance'], '');
    assert.ok(r.failed.some((f) => /^404 .*\/quantaband_bg\.wasm$/.test(f)), `no 404 for the .wasm: ${r.failed}`);
  } finally {
    await server.close();
  }
});

test('Vite: vite build and the dev server compute in Chromium, page and module worker', async () => {
  const dir = join(scratch, 'vite');
  mkdirSync(dir);
  cpSync(join(here, 'vite', 'index.html'), join(dir, 'index.html'));
  writeRecipes(dir, ['src/main.js', 'src/worker.js', 'src/main-worker.js']);
  run('node', [join(scratch, 'node_modules', 'vite', 'bin', 'vite.js'), 'build', '--logLevel', 'warn'], { cwd: dir });
  const server = await serve(join(dir, 'dist'));
  try {
    checkOutputs(await visit(`${server.origin}/`, server.origin, ['#radiance', '#worker']), 'vite build', { worker: true });
  } finally {
    await server.close();
  }
  const vite = await import(pathToFileURL(join(root, 'node_modules', 'vite', 'dist', 'node', 'index.js')).href);
  const dev = await vite.createServer({
    root: dir,
    logLevel: 'warn',
    clearScreen: false,
    server: { host: '127.0.0.1', port: 0, strictPort: false },
  });
  try {
    await dev.listen();
    const origin = dev.resolvedUrls.local[0].replace(/\/$/, '');
    checkOutputs(await visit(`${origin}/`, origin, ['#radiance', '#worker']), 'vite dev server', { worker: true });
  } finally {
    await dev.close();
  }
});

test("Content-Security-Policy: 'wasm-unsafe-eval' is needed and enough", async () => {
  const dist = join(scratch, 'vite', 'dist');
  assert.ok(statSync(dist).isDirectory(), 'the Vite test builds dist/ first');
  const allowed = await serve(dist, "default-src 'self'; img-src data:; script-src 'self' 'wasm-unsafe-eval'");
  try {
    checkOutputs(await visit(`${allowed.origin}/`, allowed.origin, ['#radiance', '#worker']), 'CSP with wasm-unsafe-eval', {
      worker: true,
    });
  } finally {
    await allowed.close();
  }
  const strict = await serve(dist, "default-src 'self'; img-src data:; script-src 'self'");
  try {
    const r = await visit(`${strict.origin}/`, strict.origin, ['#radiance'], { expectFailure: true });
    assert.equal(r.texts['#radiance'], '');
    const errors = [...r.pageErrors, ...r.consoleErrors].join('\n');
    assert.match(errors, /CompileError/, errors);
    assert.match(errors, /WebAssembly module violates the following Content Security policy/i, errors);
  } finally {
    await strict.close();
  }
});

test('a page without a bundler (import map, await init()) computes in Chromium', async () => {
  writeFileSync(join(scratch, 'index.html'), recipes.html);
  const server = await serve(scratch);
  try {
    const r = await visit(`${server.origin}/`, server.origin, ['#radiance']);
    // The README's page has no icon link: Chromium asks for /favicon.ico, a 404 that is not ours.
    r.failed = r.failed.filter((f) => !f.endsWith('/favicon.ico'));
    r.consoleErrors = r.consoleErrors.filter((e) => !/Failed to load resource.*404/.test(e));
    checkOutputs(r, 'import map page');
  } finally {
    await server.close();
  }
});

test('CommonJS: require("quantaband") works on this Node, as the manifest\'s engines say', () => {
  const pj = JSON.parse(readFileSync(join(scratch, 'node_modules', 'quantaband', 'package.json'), 'utf8'));
  assert.equal(pj.engines.node, '^20.19.0 || >=22.12.0');
  const [major, minor] = process.versions.node.split('.').map(Number);
  const inRange = (major === 20 && minor >= 19) || (major === 22 && minor >= 12) || major >= 23;
  assert.ok(inRange, `this Node ${process.version} is outside the package's engines: the test proves nothing`);
  const dir = join(scratch, 'cjs');
  mkdirSync(dir);
  cpSync(join(here, 'cjs', 'index.cjs'), join(dir, 'index.cjs'));
  const stdout = execFileSync('node', ['index.cjs'], { cwd: dir, encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] });
  const out = JSON.parse(stdout);
  assert.ok(out.requireModule, 'process.features.require_module');
  assert.ok(out.resolved.endsWith(`${sep}node_modules${sep}quantaband${sep}node.js`), out.resolved);
  assert.ok(Math.abs(out.radiance / REF_PER_UM - 1) <= 1e-12, `L(10 µm, 300 K) = ${out.radiance}`);
  assert.equal(out.radiance, nodeValues.radiance);
  assert.equal(out.kelvin, 298.15);
  assert.deepEqual(out.error, { instanceOfClass: true, code: 'NON_POSITIVE_TEMPERATURE' });
  // Nothing on stderr: no ExperimentalWarning or deprecation for the user to see.
  const both = execFileSync('bash', ['-c', 'node index.cjs 2>&1 >/dev/null'], { cwd: dir, encoding: 'utf8' });
  assert.equal(both, '', 'stderr of the CommonJS consumer');
});
