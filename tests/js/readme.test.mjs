// The README's JavaScript examples run as written against the built module (the `quantaband`
// import pointed at the full build's node.js, see helpers.mjs: the spectral-table examples need
// it), so they cannot drift from the API. Values in their comments
// are checked in the other suites against outside references.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import { ENTRY } from './helpers.mjs';

const readme = readFileSync(new URL('../../README.md', import.meta.url), 'utf8');
const section = readme.slice(readme.indexOf('<!-- BEGIN js'), readme.indexOf('<!-- END js -->'));
const blocks = [...section.matchAll(/```js\n([\s\S]*?)```/g)].map((m) => m[1]).filter((b) => b.includes("from 'quantaband'"));
const entry = ENTRY;

test('the README JavaScript examples run', async () => {
  assert.ok(blocks.length >= 2, `found ${blocks.length} runnable examples`);
  for (const [i, code] of blocks.entries()) {
    const src = code.replaceAll("from 'quantaband'", `from ${JSON.stringify(entry)}`);
    const log = console.log;
    console.log = () => {};
    try {
      await import(`data:text/javascript;base64,${Buffer.from(src).toString('base64')}`);
    } catch (e) {
      assert.fail(`README example ${i + 1} failed: ${e && e.message}`);
    } finally {
      console.log = log;
    }
  }
});
