// Tests of the page inliner's module bundler (www/build.mjs) on small synthetic module graphs:
// every import/export form the project uses, evaluation order, and the errors for what it does
// not support. No browser needed.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { mkdtempSync, writeFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import vm from 'node:vm';
import { bundleModules } from '../../www/build.mjs';

function graph(files) {
  const dir = mkdtempSync(join(tmpdir(), 'qb-inliner-'));
  for (const [name, text] of Object.entries(files)) writeFileSync(join(dir, name), text);
  return dir;
}

test('bundles named, renamed, namespace, default and bare imports into one script', (t) => {
  const dir = graph({
    'main.js': [
      "import * as ns from './a.js';",
      "import def, { b as bee } from './b.js';",
      "import './side.js';",
      "import { C } from './a.js';",
      'globalThis.out = { f: ns.f(), k: ns.k, bee, def: def(), c: new C().v, url: ns.where() };',
    ].join('\n'),
    'a.js': [
      'export function f() { return 1; }',
      'export const k = 2;',
      'export class C { constructor() { this.v = 3; } }',
      'export function where() { return import.meta.url; }',
    ].join('\n'),
    'b.js': ['const x = 5;', 'function y() { return 7; }', 'export { x as b, y as default };'].join('\n'),
    'side.js': 'globalThis.side = (globalThis.side || 0) + 1;',
  });
  t.after(() => rmSync(dir, { recursive: true }));
  const { code, paths } = bundleModules(join(dir, 'main.js'));
  assert.doesNotMatch(code, /^\s*(import|export)\s/m);
  assert.doesNotMatch(code, /import\.meta/);
  assert.equal(paths.at(-1), join(dir, 'main.js'), 'the entry is evaluated last');
  assert.equal(paths.length, 4, 'each module once');
  const sandbox = { document: { baseURI: 'file:///x/page.html' } };
  vm.runInNewContext(code, sandbox);
  assert.deepEqual({ ...sandbox.out }, { f: 1, k: 2, bee: 5, def: 7, c: 3, url: 'file:///x/page.html' });
  assert.equal(sandbox.side, 1, 'a module imported for its side effects runs exactly once');
});

test('an alias redirects a module path (how --pkg swaps in another package build)', (t) => {
  const dir = graph({
    'main.js': "import { v } from './pkg.js';\nglobalThis.out = v;",
    'pkg.js': 'export const v = 1;',
    'other.js': 'export const v = 2;',
  });
  t.after(() => rmSync(dir, { recursive: true }));
  const { code } = bundleModules(join(dir, 'main.js'), new Map([[join(dir, 'pkg.js'), join(dir, 'other.js')]]));
  const sandbox = {};
  vm.runInNewContext(code, sandbox);
  assert.equal(sandbox.out, 2);
});

test('refuses import cycles, missing modules and syntax it cannot inline; accepts multi-line imports', (t) => {
  const dir = graph({
    'cyc1.js': "import { b } from './cyc2.js';\nexport const a = 1;",
    'cyc2.js': "import { a } from './cyc1.js';\nexport const b = 2;",
    'missing.js': "import { z } from './nowhere.js';",
    'default.js': 'export default function () { return 1; }',
    'dynamic.js': "export async function later() { return import('./cyc1.js'); }",
    'multi.js': "import {\n  a,\n  b as bee,\n} from './ab.js';\nglobalThis.out = a + bee;",
    'ab.js': 'export const a = 1;\nexport const b = 2;',
  });
  t.after(() => rmSync(dir, { recursive: true }));
  assert.throws(() => bundleModules(join(dir, 'cyc1.js')), /import cycle/);
  assert.throws(() => bundleModules(join(dir, 'missing.js')), /missing module/);
  assert.throws(() => bundleModules(join(dir, 'default.js')), /unsupported export form/);
  assert.throws(() => bundleModules(join(dir, 'dynamic.js')), /dynamic import\(\)/);
  // An import list spread over several lines is fine.
  const sandbox = {};
  vm.runInNewContext(bundleModules(join(dir, 'multi.js')).code, sandbox);
  assert.equal(sandbox.out, 3);
});
