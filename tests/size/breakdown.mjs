// Where the bytes of a WebAssembly module go: section sizes, the largest functions and the code
// size summed per Rust module path. Needs a module that still has its "name" section, e.g. the
// wasm-bindgen output without --remove-name-section, optimised with `wasm-opt -g`
// (pkg-scripts/build.sh runs this automatically when the size budget is exceeded, or with
// --size-report).
//
//   node tests/size/breakdown.mjs FILE.wasm [TOP=25]
import { readFileSync } from 'node:fs';

const file = process.argv[2];
const top = Number(process.argv[3] ?? 25);
if (!file) {
  console.error('usage: breakdown.mjs FILE.wasm [TOP]');
  process.exit(2);
}
const b = readFileSync(file);
const dec = new TextDecoder();
function uleb(p) {
  let v = 0;
  let s = 0;
  for (;;) {
    const x = b[p++];
    v += (x & 0x7f) * 2 ** s;
    if (!(x & 0x80)) return [v, p];
    s += 7;
  }
}
const SECTION = ['custom', 'type', 'import', 'function', 'table', 'memory', 'global', 'export', 'start', 'element', 'code', 'data', 'datacount', 'tag'];
const sections = [];
let code;
let names;
let importedFuncs = 0;
let pos = 8;
while (pos < b.length) {
  const id = b[pos++];
  let size;
  [size, pos] = uleb(pos);
  const end = pos + size;
  let label = SECTION[id] ?? `#${id}`;
  if (id === 0) {
    const [n, p] = uleb(pos);
    label = `custom "${dec.decode(b.subarray(p, p + n))}"`;
    if (label === 'custom "name"') names = [p + n, end];
  }
  if (id === 2) {
    let [n, p] = uleb(pos);
    for (let i = 0; i < n; i++) {
      let l;
      [l, p] = uleb(p);
      p += l;
      [l, p] = uleb(p);
      p += l;
      const kind = b[p++];
      if (kind === 0) {
        importedFuncs++;
        [, p] = uleb(p);
      } else if (kind === 1) {
        p += 1;
        const fl = b[p++];
        [, p] = uleb(p);
        if (fl & 1) [, p] = uleb(p);
      } else if (kind === 2) {
        const fl = b[p++];
        [, p] = uleb(p);
        if (fl & 1) [, p] = uleb(p);
      } else if (kind === 3) {
        p += 2;
      } else if (kind === 4) {
        p += 1;
        [, p] = uleb(p);
      }
    }
  }
  if (id === 10) code = [pos, end];
  sections.push([label, size]);
  pos = end;
}

const fnName = new Map();
if (names) {
  let p = names[0];
  while (p < names[1]) {
    const sub = b[p++];
    let sz;
    [sz, p] = uleb(p);
    const e = p + sz;
    if (sub === 1) {
      let n;
      [n, p] = uleb(p);
      for (let i = 0; i < n; i++) {
        let idx;
        let l;
        [idx, p] = uleb(p);
        [l, p] = uleb(p);
        fnName.set(idx, dec.decode(b.subarray(p, p + l)));
        p += l;
      }
    }
    p = e;
  }
}

/** Readable path of a (possibly mangled) Rust symbol: legacy `_ZN…E` or v0 `_R…`, roughly. */
function demangle(s) {
  if (s.startsWith('_ZN')) {
    const parts = [];
    let i = 3;
    while (i < s.length && s[i] !== 'E') {
      const m = /^\d+/.exec(s.slice(i));
      if (!m) break;
      const len = Number(m[0]);
      i += m[0].length;
      parts.push(s.slice(i, i + len));
      i += len;
    }
    if (parts.length && /^h[0-9a-f]{16}$/.test(parts[parts.length - 1])) parts.pop();
    return parts
      .join('::')
      .replace(/\$LT\$/g, '<')
      .replace(/\$GT\$/g, '>')
      .replace(/\$u20\$/g, ' ')
      .replace(/\$u7b\$/g, '{')
      .replace(/\$u7d\$/g, '}')
      .replace(/\.\./g, '::');
  }
  if (s.startsWith('_R')) {
    // v0 mangling: keep the identifiers (length-prefixed, after an optional disambiguator).
    return [...s.matchAll(/(?:^|[^0-9])(\d{1,3})([A-Za-z_][A-Za-z0-9_]*)/g)]
      .map((m) => m[2].slice(0, Number(m[1])))
      .filter((x) => x.length > 1)
      .join('::');
  }
  return s.replace(/\[[0-9a-f]+\]/g, '').replace(/::h[0-9a-f]{16}$/, '');
}

console.log(`[size] ${file}: ${b.length} B`);
console.log('[size] sections: ' + sections.map(([l, s]) => `${l} ${s}`).join(', '));
if (!code) process.exit(0);
let [n, p] = uleb(code[0]);
const fns = [];
for (let i = 0; i < n; i++) {
  let sz;
  [sz, p] = uleb(p);
  const raw = fnName.get(importedFuncs + i);
  fns.push({ size: sz, name: raw === undefined ? `function #${importedFuncs + i}` : demangle(raw) });
  p += sz;
}
if (fnName.size === 0) console.log('[size] (no name section: function names unknown)');
fns.sort((x, y) => y.size - x.size);
console.log(`[size] largest of ${n} functions (body bytes):`);
for (const f of fns.slice(0, top)) console.log(`[size] ${String(f.size).padStart(7)}  ${f.name.slice(0, 140)}`);
const groups = new Map();
for (const f of fns) {
  if (/ shim$/.test(f.name)) {
    // wasm-bindgen export shims, with the Rust function bodies inlined into them.
    groups.set('(export shims)', (groups.get('(export shims)') ?? 0) + f.size);
    continue;
  }
  const inner = f.name.replace(/^<([^ >]+).*$/, '$1');
  const key = inner.split('::').slice(0, 3).filter((x) => !/^\{\{closure\}\}$/.test(x)).slice(0, 3).join('::') || f.name;
  groups.set(key, (groups.get(key) ?? 0) + f.size);
}
console.log('[size] code bytes per module path (first three segments):');
for (const [k, v] of [...groups].sort((x, y) => y[1] - x[1]).slice(0, top)) {
  console.log(`[size] ${String(v).padStart(7)}  ${k}`);
}
