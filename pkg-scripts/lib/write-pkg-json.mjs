// Writes pkg/package.json (the published manifest) and copies the Node entry, README and LICENSE
// into pkg/. Run by pkg-scripts/build.sh after wasm-bindgen and wasm-opt.
//
//   node pkg-scripts/lib/write-pkg-json.mjs [PKG_DIR]
//
// Entry points:
//   "node"    -> node.js: reads quantaband_bg.wasm with fs and calls initSync, so Node users need
//                no init call;
//   "default" -> quantaband.js (the facade's web entry, over the wasm-bindgen --target web glue
//                in quantaband_glue.js): browsers, web workers and bundlers, which `await init()`
//                once (it fetches quantaband_bg.wasm next to the module) or call
//                `initSync({ module: bytes })`.
import { copyFileSync, readFileSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..');
const pkgDir = resolve(process.argv[2] ?? join(root, 'pkg'));

/** Reads a string value of the [package] table of Cargo.toml (single-line `key = "value"`). */
function cargoPackageField(toml, key) {
  const m = toml.match(/^\[package\]\s*$([\s\S]*?)(?=^\[|(?![\s\S]))/m);
  if (!m) throw new Error('Cargo.toml has no [package] table');
  const f = m[1].match(new RegExp(`^${key}\\s*=\\s*"([^"]*)"`, 'm'));
  if (!f) throw new Error(`Cargo.toml [package] has no ${key}`);
  return f[1];
}

const toml = readFileSync(join(root, 'Cargo.toml'), 'utf8');
const name = cargoPackageField(toml, 'name');
const version = cargoPackageField(toml, 'version');
const description = cargoPackageField(toml, 'description');
const license = cargoPackageField(toml, 'license');
const keywordsLine = toml.match(/^keywords\s*=\s*\[([^\]]*)\]/m);
const keywords = keywordsLine ? [...keywordsLine[1].matchAll(/"([^"]+)"/g)].map((k) => k[1]) : [];

for (const f of [`${name}.js`, `${name}.d.ts`, `${name}_bg.wasm`]) {
  if (!statSync(join(pkgDir, f), { throwIfNoEntry: false })) {
    throw new Error(`${pkgDir}/${f} missing: run wasm-bindgen first`);
  }
}

copyFileSync(join(root, 'pkg-scripts', 'lib', 'node-entry.js'), join(pkgDir, 'node.js'));
copyFileSync(join(root, 'README.md'), join(pkgDir, 'README.md'));
copyFileSync(join(root, 'LICENSE'), join(pkgDir, 'LICENSE'));

// Everything in the staging folder (entries, lib/, glue, types, wasm) plus our files;
// package.json, README and LICENSE are always packed by npm.
const files = readdirSync(pkgDir)
  .filter((f) => !['package.json', 'README.md', 'LICENSE', '.gitignore'].includes(f))
  .sort();

const manifest = {
  name,
  version,
  description,
  license,
  keywords,
  type: 'module',
  main: './node.js',
  module: `./${name}.js`,
  browser: `./${name}.js`,
  types: `./${name}.d.ts`,
  exports: {
    '.': {
      types: `./${name}.d.ts`,
      node: './node.js',
      default: `./${name}.js`,
    },
    './web': {
      types: `./${name}.d.ts`,
      default: `./${name}.js`,
    },
    [`./${name}_bg.wasm`]: `./${name}_bg.wasm`,
    './package.json': './package.json',
  },
  files,
  // node.js instantiates the module when imported: a bundler must not drop it as unused.
  sideEffects: ['./node.js'],
  engines: { node: '>=18' },
};

writeFileSync(join(pkgDir, 'package.json'), `${JSON.stringify(manifest, null, 2)}\n`);
console.log(`[build] wrote package.json (${name}@${version}; files: ${files.join(', ')})`);
