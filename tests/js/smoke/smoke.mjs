// Tarball smoke test: packs pkg/ with `npm pack`, installs the .tgz into a scratch project under
// the system temp folder (offline: the package has no dependencies) and uses it as a consumer
// would, through the package name only:
//   - Node, `import … from 'quantaband'` (the "node" condition: instantiated at import, no init);
//   - Node, `quantaband/web` + `initSync` with the bytes of the `quantaband/quantaband_bg.wasm`
//     subpath export;
//   - TypeScript consumer projects under strict + exactOptionalPropertyTypes +
//     noUncheckedIndexedAccess, resolving the types through the manifest: module/moduleResolution
//     nodenext (consumer.ts, and consumer-require.cts through `require`) and esnext/bundler
//     (consumer.ts, and consumer-bundler.ts with the `.wasm` subpath); every @ts-expect-error
//     line must cover a real error;
//   - headless Chromium (Debian's, driven by playwright-core): the "default" entry with
//     `await init()` on the main thread and in a module web worker, served from 127.0.0.1,
//     with no request leaving that origin and no console error.
// Each environment runs the same probe (probe.mjs) and the values are checked against
// reference.json (mpmath, see reference.py).
//
//   node --test tests/js/smoke/smoke.mjs          (QB_TARBALL=path.tgz skips the pack step)
import { after, before, test } from 'node:test';
import assert from 'node:assert/strict';
import { execFileSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:http';
import { tmpdir } from 'node:os';
import { dirname, extname, join, normalize, resolve, sep } from 'node:path';
import { fileURLToPath } from 'node:url';

const here = dirname(fileURLToPath(import.meta.url));
const root = resolve(here, '..', '..', '..');
const reference = JSON.parse(readFileSync(join(here, 'reference.json'), 'utf8'));
const cargoVersion = readFileSync(join(root, 'Cargo.toml'), 'utf8').match(/^version\s*=\s*"([^"]+)"/m)[1];
const errorCodesInCore = [
  ...readFileSync(join(root, 'src', 'error.rs'), 'utf8').matchAll(/Error::\w+ \{ \.\. \} => "([A-Z_]+)"/g),
].map((m) => m[1]);

/** Checks one environment's probe result (see probe.mjs) against the references. */
function checkProbe(result, ref, coreCodes) {
  assert.equal(typeof result, 'object');
  assert.equal(result.failure, undefined, result.failure);
  assert.ok(result.exportCount >= 3, `only ${result.exportCount} exports`);
  assert.deepEqual(result.errorCodes.slice(0, coreCodes.length), coreCodes, 'ERROR_CODES must list the core error codes first, in order');
  assert.deepEqual(result.errorCodes.slice(coreCodes.length), ['WRONG_TYPE', 'DETACHED_BUFFER', 'DISPOSED', 'NOT_INITIALIZED']);
  assert.equal(result.afterFree, 'DISPOSED');
  const kelvin = ref.units.map((u) => u.kelvin);
  result.units.degCToK.forEach((k, i) => assert.ok(Math.abs(k - kelvin[i]) <= 1e-12 * kelvin[i], `${k} K`));
  result.units.degCToKArray.forEach((k, i) => assert.ok(Math.abs(k - kelvin[i]) <= 1e-12 * kelvin[i], `${k} K`));
  assert.ok(Math.abs(result.units.umToPerCm - 1000) <= 1e-12 * 1000, `10 um = ${result.units.umToPerCm} cm-1`);
  assert.deepEqual(result.badInput, {
    instanceOfClass: true,
    instanceOfError: true,
    name: 'QuantabandError',
    code: 'NON_POSITIVE_TEMPERATURE',
  });
  assert.deepEqual(result.badElement, { code: 'NON_FINITE', index: 1 });
  assert.equal(result.afterError, result.units.degCToK[0], 'a call after an error must still work and agree');
  // Planck spectral radiance against mpmath (reference.json); 1e-12 relative is far looser than the
  // core's own accuracy statement and far tighter than any packaging or loading mistake.
  assert.equal(result.radiance.length, ref.cases.length);
  result.radiance.forEach((value, i) => {
    const want = ref.cases[i].radiance_w_m2_sr_m;
    const rel = Math.abs(value - want) / want;
    assert.ok(rel <= 1e-12, `case ${i}: got ${value}, mpmath ${want}, relative error ${rel}`);
  });
  assert.deepEqual(result.radianceArray, [result.radiance[0]], 'array call must agree with the scalar call');
  assert.deepEqual(result.badTemperature, { instanceOfClass: true, code: 'NON_POSITIVE_TEMPERATURE' });
  assert.equal(result.radianceAfterError, result.radiance[0]);
}

let tgz;
let scratch;
let installed;

function run(cmd, args, opts = {}) {
  return execFileSync(cmd, args, { encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'], ...opts });
}

before(() => {
  tgz = process.env.QB_TARBALL || run('bash', [join(root, 'pkg-scripts', 'pack.sh')]).trim().split('\n').pop();
  assert.ok(statSync(tgz).isFile(), `tarball ${tgz} not found`);
  scratch = mkdtempSync(join(tmpdir(), 'quantaband-smoke-'));
  writeFileSync(
    join(scratch, 'package.json'),
    JSON.stringify({ name: 'quantaband-smoke-consumer', version: '1.0.0', private: true, type: 'module' }),
  );
  run('npm', ['install', '--offline', '--no-audit', '--no-fund', '--ignore-scripts', '--loglevel=error', tgz], {
    cwd: scratch,
  });
  installed = join(scratch, 'node_modules', 'quantaband');
});

after(() => {
  if (scratch && !process.env.QB_KEEP_SMOKE) rmSync(scratch, { recursive: true, force: true });
});

test('the tarball holds the package files and nothing else', () => {
  const entries = run('tar', ['-tzf', tgz]).trim().split('\n').sort();
  const required = [
    'package/CHANGELOG.md',
    'package/LICENSE',
    'package/README.md',
    'package/node.js',
    'package/package.json',
    'package/quantaband.d.ts',
    'package/quantaband.js',
    'package/quantaband_bg.wasm',
    'package/quantaband_bg.wasm.d.ts',
    'package/quantaband_glue.js',
  ];
  for (const f of required) assert.ok(entries.includes(f), `${f} missing from the tarball`);
  // the facade's modules (src/wasm/js/*.js) under lib/
  const extra = entries.filter((e) => !required.includes(e) && !/^package\/lib\/[\w-]+\.js$/.test(e));
  assert.deepEqual(extra, [], 'unexpected files in the tarball');
  // Every module an entry or a facade module imports must be in the tarball.
  for (const f of entries.filter((e) => e.endsWith('.js'))) {
    const code = readFileSync(join(installed, f.slice('package/'.length)), 'utf8');
    for (const m of code.matchAll(/from '(\.{1,2}\/[^']+)'/g)) {
      const target = join(dirname(f), m[1]).split(sep).join('/');
      assert.ok(entries.includes(target), `${f} imports ${m[1]}, which is not packed`);
    }
  }
});

test('the installed manifest is an ES module package with node/default entries and types', () => {
  const pj = JSON.parse(readFileSync(join(installed, 'package.json'), 'utf8'));
  assert.equal(pj.name, 'quantaband');
  assert.equal(pj.version, cargoVersion, 'npm version must equal the crate version');
  assert.equal(pj.type, 'module');
  assert.equal(pj.license, 'MIT');
  assert.equal(pj.exports['.'].types, './quantaband.d.ts');
  assert.equal(pj.exports['.'].node, './node.js');
  assert.equal(pj.exports['.'].default, './quantaband.js');
  assert.equal(Object.keys(pj.exports['.'])[0], 'types', '"types" must come first to be picked by TypeScript');
  assert.deepEqual(pj.exports['./quantaband_bg.wasm'], {
    types: './quantaband_bg.wasm.d.ts',
    default: './quantaband_bg.wasm',
  });
  for (const [subpath, target] of Object.entries(pj.exports)) {
    if (typeof target === 'object') assert.equal(Object.keys(target)[0], 'types', `exports["${subpath}"]: "types" first`);
  }
  // Metadata: the Node versions with require(esm) unflagged (the CommonJS consumer in
  // tests/consumers checks require on this Node), explicit files, tree-shaking hint, keywords.
  assert.equal(pj.engines.node, '^20.19.0 || >=22.12.0');
  assert.deepEqual(pj.sideEffects, ['./node.js']);
  assert.ok(pj.files.includes('CHANGELOG.md') && pj.files.includes('quantaband_bg.wasm'), 'files');
  for (const k of ['planck', 'radiometry', 'thermometry', 'blackbody', 'webassembly', 'infrared']) {
    assert.ok(pj.keywords.includes(k), `keyword ${k}`);
  }
  // The project has no public URL: no invented repository/homepage/bugs fields.
  for (const field of ['repository', 'homepage', 'bugs']) assert.equal(pj[field], undefined, field);
  assert.ok(
    readFileSync(join(installed, 'CHANGELOG.md'), 'utf8') === readFileSync(join(root, 'CHANGELOG.md'), 'utf8'),
    'the packed CHANGELOG.md is not the repository\'s (rebuild the package)',
  );
  const wasm = readFileSync(join(installed, 'quantaband_bg.wasm'));
  assert.ok(WebAssembly.validate(wasm), 'packed .wasm must validate');
  assert.deepEqual(
    readFileSync(join(root, 'pkg', 'quantaband_bg.wasm')),
    wasm,
    'packed .wasm must be the one in pkg/',
  );
});

const probeModule = join(here, 'probe.mjs');

test('Node: import from "quantaband" resolves to the node entry and computes without init', () => {
  const script = `
    import * as m from 'quantaband';
    import { runProbe } from ${JSON.stringify(probeModule)};
    const ref = JSON.parse(process.argv[2]);
    const out = { resolved: import.meta.resolve('quantaband'), result: await runProbe(m, ref) };
    process.stdout.write(JSON.stringify(out));
  `;
  writeFileSync(join(scratch, 'node-consumer.mjs'), script);
  const out = JSON.parse(run('node', ['node-consumer.mjs', JSON.stringify(reference)], { cwd: scratch }));
  assert.match(out.resolved, /\/node_modules\/quantaband\/node\.js$/);
  checkProbe(out.result, reference, errorCodesInCore);
});

test('Node: the web entry works with initSync and the .wasm subpath export', () => {
  const script = `
    import { readFileSync } from 'node:fs';
    import * as m from 'quantaband/web';
    import { runProbe } from ${JSON.stringify(probeModule)};
    const wasmUrl = new URL(import.meta.resolve('quantaband/quantaband_bg.wasm'));
    m.initSync({ module: readFileSync(wasmUrl) });
    const ref = JSON.parse(process.argv[2]);
    process.stdout.write(JSON.stringify({ resolved: import.meta.resolve('quantaband/web'), result: await runProbe(m, ref) }));
  `;
  writeFileSync(join(scratch, 'web-consumer.mjs'), script);
  const out = JSON.parse(run('node', ['web-consumer.mjs', JSON.stringify(reference)], { cwd: scratch }));
  assert.match(out.resolved, /\/node_modules\/quantaband\/quantaband\.js$/);
  checkProbe(out.result, reference, errorCodesInCore);
});

const TS_COMMON = {
  strict: true,
  exactOptionalPropertyTypes: true,
  noUncheckedIndexedAccess: true,
  noEmit: true,
  target: 'es2022',
  lib: ['es2022', 'dom'],
  types: [],
  // The package's declarations are checked; the compiler's own lib files need not be.
  skipLibCheck: false,
  skipDefaultLibCheck: true,
};
const TS_PROJECTS = {
  nodenext: { options: { module: 'nodenext', moduleResolution: 'nodenext' }, files: ['consumer.ts', 'consumer-require.cts'] },
  bundler: { options: { module: 'esnext', moduleResolution: 'bundler' }, files: ['consumer.ts', 'consumer-bundler.ts'] },
};

for (const [name, project] of Object.entries(TS_PROJECTS)) {
  test(`TypeScript (${name} resolution, exactOptionalPropertyTypes): consumers type-check and wrong calls are rejected`, () => {
    const dir = join(scratch, `ts-${name}`);
    mkdirSync(dir, { recursive: true });
    const sources = Object.fromEntries(project.files.map((f) => [f, readFileSync(join(here, f), 'utf8')]));
    const write = (blankExpectations) => {
      for (const [f, text] of Object.entries(sources)) {
        writeFileSync(join(dir, f), blankExpectations ? text.replace(/^[ \t]*\/\/ @ts-expect-error.*$/gm, '') : text);
      }
    };
    // The consumer project sits beside the scratch project's node_modules (resolution walks up).
    writeFileSync(
      join(dir, 'tsconfig.json'),
      JSON.stringify({ compilerOptions: { ...TS_COMMON, ...project.options }, files: project.files }),
    );
    const tsc = join(root, 'node_modules', 'typescript', 'bin', 'tsc');
    write(false);
    try {
      run('node', [tsc, '-p', 'tsconfig.json'], { cwd: dir });
    } catch (e) {
      assert.fail(`tsc rejected the consumers:\n${e.stdout}${e.stderr}`);
    }
    // Without the @ts-expect-error lines (blanked, so line numbers stay), each line after one
    // must have an error: the types are not \`any\`.
    const expected = [];
    for (const [f, text] of Object.entries(sources)) {
      text.split('\n').forEach((line, i) => {
        if (/^\s*\/\/ @ts-expect-error/.test(line)) expected.push(`${f}(${i + 2})`);
      });
    }
    assert.ok(expected.length >= 4, `only ${expected.length} @ts-expect-error lines`);
    write(true);
    let output = '';
    try {
      run('node', [tsc, '-p', 'tsconfig.json'], { cwd: dir });
    } catch (e) {
      output = String(e.stdout);
    }
    const got = new Set([...output.matchAll(/^([\w.-]+)\((\d+),\d+\): error TS\d+/gm)].map((m) => `${m[1]}(${m[2]})`));
    for (const where of expected) assert.ok(got.has(where), `no error at ${where}; tsc said:\n${output}`);
  });
}

const MIME = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8',
  '.json': 'application/json',
  '.wasm': 'application/wasm',
};

test('Chromium: the default entry runs with await init() on the main thread and in a module worker', async (t) => {
  const { chromium } = await import(join(root, 'node_modules', 'playwright-core', 'index.mjs'));
  const pj = JSON.parse(readFileSync(join(installed, 'package.json'), 'utf8'));
  // Resolve the browser entry the way a bundler would: exports["."], condition "default".
  const entry = `/node_modules/quantaband/${normalize(pj.exports['.'].default).replace(/^\.\//, '')}`;
  const files = {
    '/index.html': `<!doctype html><meta charset="utf-8"><title>smoke</title><link rel="icon" href="data:,">
<script type="importmap">${JSON.stringify({ imports: { quantaband: entry } })}</script>
<script type="module">
  import init, * as m from 'quantaband';
  import { runProbe } from '/probe.mjs';
  const ref = await (await fetch('/reference.json')).json();
  try { await init(); window.__main = await runProbe(m, ref); }
  catch (e) { window.__main = { failure: String(e && e.stack || e) }; }
  const w = new Worker('/worker.mjs', { type: 'module' });
  w.onmessage = (e) => { window.__worker = e.data; };
  w.onerror = (e) => { window.__worker = { failure: 'worker error: ' + e.message }; };
</script>`,
    '/worker.mjs': `import init, * as m from '${entry}';
import { runProbe } from '/probe.mjs';
try {
  const ref = await (await fetch('/reference.json')).json();
  await init();
  postMessage(await runProbe(m, ref));
} catch (e) { postMessage({ failure: String(e && e.stack || e) }); }`,
  };
  const server = createServer((req, res) => {
    const path = decodeURIComponent(new URL(req.url, 'http://127.0.0.1').pathname);
    let body;
    if (path in files) body = files[path];
    else if (path === '/probe.mjs') body = readFileSync(join(here, 'probe.mjs'));
    else if (path === '/reference.json') body = JSON.stringify(reference);
    else if (path.startsWith('/node_modules/quantaband/')) {
      const file = normalize(join(scratch, path));
      if (file.startsWith(installed + sep)) {
        try {
          body = readFileSync(file);
        } catch {
          body = undefined;
        }
      }
    }
    if (body === undefined) {
      res.writeHead(404).end();
      return;
    }
    res.writeHead(200, { 'content-type': MIME[extname(path)] ?? 'application/octet-stream' }).end(body);
  });
  await new Promise((ok) => server.listen(0, '127.0.0.1', ok));
  const origin = `http://127.0.0.1:${server.address().port}`;
  const browser = await chromium.launch({
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
  t.after(async () => {
    await browser.close();
    await new Promise((ok) => server.close(ok));
  });
  const page = await browser.newPage();
  const consoleErrors = [];
  const foreign = [];
  page.on('console', (msg) => {
    if (msg.type() === 'error') consoleErrors.push(msg.text());
  });
  page.on('pageerror', (err) => consoleErrors.push(String(err)));
  page.on('request', (req) => {
    if (!req.url().startsWith(origin)) foreign.push(req.url());
  });
  await page.goto(`${origin}/index.html`);
  await page.waitForFunction(() => window.__main !== undefined && window.__worker !== undefined, null, {
    timeout: 30_000,
  });
  const main = await page.evaluate(() => window.__main);
  const worker = await page.evaluate(() => window.__worker);
  assert.equal(main.failure, undefined, main.failure);
  assert.equal(worker.failure, undefined, worker.failure);
  checkProbe(main, reference, errorCodesInCore);
  checkProbe(worker, reference, errorCodesInCore);
  assert.deepEqual(consoleErrors, [], 'console errors in the page');
  assert.deepEqual(foreign, [], 'requests outside the test origin');
});
