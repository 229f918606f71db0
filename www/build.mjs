#!/usr/bin/env node
// Builds the single self-contained offline page dist/quantaband.html from www/ and pkg/.
//
// Opened from disk (file://), Chromium refuses module `src=` scripts, imports of sibling files
// and fetches of a sibling .wasm, so everything is put inline:
//   * www/style.css                      -> one <style> element
//   * www/js/*.js and pkg/quantaband.js  -> one <script type="module"> with no import/export left:
//     each ES module becomes a function scope `const __qbN = (() => { ...; return {exports}; })();`
//     and every `import {a as b} from './x.js'` becomes `const { a: b } = __qbK;`
//     (a tiny bundler for the small subset of module syntax this project uses; see DEVELOPERS.md)
//   * pkg/quantaband_bg.wasm             -> gzip, base64, in a non-executed
//     <script type="application/octet-stream" id="qb-wasm">; the app inflates it with
//     DecompressionStream and starts the glue with initSync({ module: bytes }).
//   * the bundled script is minified by esbuild (whitespace, comments and syntax only; every name
//     is kept, so stack traces and the console still read like the sources): about half the bytes.
// A CSP meta forbids every network request.
// Usage: node www/build.mjs [--out FILE] [--pkg DIR]   (defaults: dist/quantaband.html, pkg/)
import { readFileSync, writeFileSync, mkdirSync, existsSync } from 'node:fs';
import { dirname, resolve, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { gzipSync } from 'node:zlib';
import { transformSync } from 'esbuild';

const here = dirname(fileURLToPath(import.meta.url));
const root = resolve(here, '..');

const CSP =
  "default-src 'none'; script-src 'unsafe-inline' 'wasm-unsafe-eval'; " +
  "style-src 'unsafe-inline'; img-src data: blob:";

// ---------------------------------------------------------------- module bundling
const IMPORT_RE = /^[ \t]*import\s+([^'";]+?)\s+from\s+['"]([^'"]+)['"]\s*;?[ \t]*$/gm;
const BARE_IMPORT_RE = /^[ \t]*import\s+['"]([^'"]+)['"]\s*;?[ \t]*$/gm;
const EXPORT_LIST_RE = /^[ \t]*export\s*\{([^}]*)\}\s*;?[ \t]*$/gm;
const EXPORT_DECL_RE = /^([ \t]*)export\s+(async\s+function\*?|function\*?|class|const|let|var)\s+([A-Za-z_$][\w$]*)/gm;


function bindingList(spec, modVar) {
  // spec: `{ a, b as c }`, `* as ns`, `def`, or `def, { a }`
  const out = [];
  let rest = spec.trim();
  const ns = /^\*\s+as\s+([A-Za-z_$][\w$]*)$/.exec(rest);
  if (ns) return [`const ${ns[1]} = ${modVar};`];
  const def = /^([A-Za-z_$][\w$]*)\s*(?:,\s*(.*))?$/s.exec(rest);
  if (def) {
    out.push(`const ${def[1]} = ${modVar}.default;`);
    rest = (def[2] || '').trim();
    if (!rest) return out;
  }
  const named = /^\{([^}]*)\}$/s.exec(rest);
  if (!named) throw new Error(`unsupported import form: ${spec}`);
  const parts = named[1].split(',').map((s) => s.trim()).filter(Boolean).map((p) => {
    const m = /^([A-Za-z_$][\w$]*)(?:\s+as\s+([A-Za-z_$][\w$]*))?$/.exec(p);
    if (!m) throw new Error(`unsupported import specifier: ${p}`);
    return m[2] ? `${m[1]}: ${m[2]}` : m[1];
  });
  out.push(`const { ${parts.join(', ')} } = ${modVar};`);
  return out;
}

/**
 * Bundles the ES-module graph rooted at `entry` into one script with no import/export left.
 * `alias` maps absolute module paths to replacements (used to point pkg/quantaband.js at --pkg).
 * Returns { code, paths } (paths: every module included, in evaluation order).
 */
export function bundleModules(entry, alias = new Map()) {
  const modules = new Map(); // abs path -> { id, code, deps, exportsMap }
  let counter = 0;

  function load(absPath, stack = []) {
    if (alias.has(absPath)) absPath = alias.get(absPath);
    if (modules.has(absPath)) return modules.get(absPath);
    if (stack.includes(absPath)) throw new Error(`import cycle: ${[...stack, absPath].map((p) => relative(root, p)).join(' -> ')}`);
    if (!existsSync(absPath)) throw new Error(`missing module ${relative(root, absPath)} (imported by ${relative(root, stack.at(-1) || '')})`);
    let code = readFileSync(absPath, 'utf8');
    const deps = [];
    const exportsMap = []; // [exportedName, localName]
    const rec = { id: `__qb${counter++}`, path: absPath, code: '', deps, exportsMap };

    code = code.replace(BARE_IMPORT_RE, (_, spec) => {
      const dep = load(resolve(dirname(absPath), spec), [...stack, absPath]);
      deps.push(dep);
      return '';
    });
    code = code.replace(IMPORT_RE, (_, what, spec) => {
      const dep = load(resolve(dirname(absPath), spec), [...stack, absPath]);
      deps.push(dep);
      return bindingList(what, dep.id).join(' ');
    });
    code = code.replace(EXPORT_LIST_RE, (_, list) => {
      for (const p of list.split(',').map((s) => s.trim()).filter(Boolean)) {
        const m = /^([A-Za-z_$][\w$]*)(?:\s+as\s+([A-Za-z_$][\w$]*))?$/.exec(p);
        if (!m) throw new Error(`unsupported export specifier in ${relative(root, absPath)}: ${p}`);
        exportsMap.push([m[2] || m[1], m[1]]);
      }
      return '';
    });
    code = code.replace(EXPORT_DECL_RE, (_, indent, kind, name) => {
      exportsMap.push([name, name]);
      return `${indent}${kind} ${name}`;
    });
    if (/^[ \t]*export\s/m.test(code)) throw new Error(`unsupported export form left in ${relative(root, absPath)}`);
    if (/^[ \t]*import[\s{*]/m.test(code)) throw new Error(`unsupported import form left in ${relative(root, absPath)}`);
    if (/(^|[^.\w$])import\s*\(/m.test(code)) throw new Error(`dynamic import() in ${relative(root, absPath)} cannot work from file://`);
    // The glue's default wasm location (only used by the async init, which the page never calls).
    code = code.replace(/import\.meta\.url/g, 'document.baseURI');
    rec.code = code;
    modules.set(absPath, rec);
    return rec;
  }

  const ordered = [];
  const seen = new Set();
  (function visit(m) {
    if (seen.has(m)) return;
    seen.add(m);
    m.deps.forEach(visit);
    ordered.push(m);
  })(load(entry));
  const code = ordered
    .map((m) => {
      const ret = m.exportsMap.map(([ext, local]) => (ext === local ? local : `${JSON.stringify(ext)}: ${local}`));
      return `// ---- ${relative(root, m.path)}\nconst ${m.id} = (() => {\n${m.code.trim()}\nreturn Object.freeze({ ${ret.join(', ')} });\n})();`;
    })
    .join('\n\n');
  return { code, paths: ordered.map((m) => m.path) };
}

function fail(msg) {
  console.error(`www/build.mjs: ${msg}`);
  process.exit(1);
}

function main() {
const here = dirname(fileURLToPath(import.meta.url));
const args = process.argv.slice(2);
const outArg = args.indexOf('--out');
const outPath = outArg >= 0 ? resolve(args[outArg + 1]) : resolve(root, 'dist', 'quantaband.html');
const pkgArg = args.indexOf('--pkg');
const pkgDir = pkgArg >= 0 ? resolve(args[pkgArg + 1]) : resolve(root, 'pkg');

const glue = resolve(pkgDir, 'quantaband.js');
const wasmPath = resolve(pkgDir, 'quantaband_bg.wasm');
if (!existsSync(glue) || !existsSync(wasmPath)) {
  fail('pkg/quantaband.js or pkg/quantaband_bg.wasm is missing: build the package first (bash pkg-scripts/build.sh)');
}

let js;
try {
  const b = bundleModules(resolve(here, 'js', 'main.js'), new Map([[resolve(root, 'pkg', 'quantaband.js'), glue]]));
  js = b.code;
  if (!b.paths.includes(glue)) fail('www/js/*.js never imports ../../pkg/quantaband.js');
  js = transformSync(js, {
    format: 'esm',
    target: 'es2022',
    minifyWhitespace: true,
    minifySyntax: true,
    minifyIdentifiers: false,
    legalComments: 'none',
  }).code;
} catch (e) {
  fail(e.message);
}

// ---------------------------------------------------------------- assembling the page
const wasm = readFileSync(wasmPath);
const wasmGz = gzipSync(wasm, { level: 9 });
const css = readFileSync(resolve(here, 'style.css'), 'utf8');
let html = readFileSync(resolve(here, 'index.html'), 'utf8');

const scriptSafe = (s) => s.replace(/<\/script/gi, '<\\/script').replace(/<!--/g, '<\\!--');
const pkgVersion = (() => {
  try {
    return /^version\s*=\s*"([^"]+)"/m.exec(readFileSync(resolve(root, 'Cargo.toml'), 'utf8'))[1];
  } catch {
    return 'unknown';
  }
})();

const replacements = {
  '<!-- @csp -->': `<meta http-equiv="Content-Security-Policy" content="${CSP}">`,
  '<!-- @style -->': `<style>\n${css}\n</style>`,
  '<!-- @wasm -->':
    `<script type="application/octet-stream" id="qb-wasm" data-encoding="gzip+base64" ` +
    `data-raw-bytes="${wasm.length}">${wasmGz.toString('base64')}</script>`,
  '<!-- @script -->': `<script type="module">\n${scriptSafe(js)}\n</script>`,
  '<!-- @version -->': pkgVersion,
};
for (const [marker, value] of Object.entries(replacements)) {
  if (!html.includes(marker)) fail(`www/index.html lacks the marker ${marker}`);
  html = html.split(marker).join(value);
}

mkdirSync(dirname(outPath), { recursive: true });
writeFileSync(outPath, html);
const kb = (n) => (n / 1024).toFixed(1);
console.log(`page: ${outPath}`);
console.log(
  `page size: ${html.length} bytes (${kb(Buffer.byteLength(html))} KiB; wasm ${kb(wasm.length)} KiB raw, ` +
    `${kb(wasmGz.length)} KiB gzip, embedded as base64; script ${kb(js.length)} KiB; style ${kb(css.length)} KiB)`,
);
if (Buffer.byteLength(html) > 600 * 1024) console.warn('warning: page is larger than the 600 KiB budget');
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) main();
