// Before initialisation (browser, worker or bundler use of the web entry without `await init()`):
// every function, constructor and static factory throws NOT_INITIALIZED with a message saying
// what to do; after initSync the same calls work. Runs in a child Node process that imports
// the web entry (pkg/quantaband.js), which does not initialise itself.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { execFileSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';

const web = new URL('../../pkg/quantaband.js', import.meta.url).href;
const wasm = fileURLToPath(new URL('../../pkg/quantaband_bg.wasm', import.meta.url));

test('calls before init() throw NOT_INITIALIZED, and work after initSync()', () => {
  const script = `
    import * as q from ${JSON.stringify(web)};
    import { readFileSync } from 'node:fs';
    const out = [];
    for (const f of [() => q.boseEinstein(1), () => new q.Spectrum({ unit: 'um' }), () => q.constants(),
                     () => q.CalibrationCurve.fit([1, 2, 3], [1, 2, 3]), () => q.convertSpectral(1, 'um', 'nm')]) {
      try { f(); out.push('no error'); } catch (e) { out.push(e instanceof q.QuantabandError ? e.code + ': ' + e.message : 'other: ' + e); }
    }
    q.initSync({ module: readFileSync(${JSON.stringify(wasm)}) });
    out.push(String(new q.Spectrum({ unit: 'um' }).point(10, 300)));
    console.log(JSON.stringify(out));
  `;
  const out = JSON.parse(execFileSync(process.execPath, ['--input-type=module', '-e', script], { encoding: 'utf8' }));
  for (const line of out.slice(0, 5)) {
    assert.match(line, /^NOT_INITIALIZED: quantaband is not initialised: call `await init\(\)` \(or `initSync\(\{ module \}\)`\)/);
  }
  // 9.924033330070695 W·m⁻²·sr⁻¹·µm⁻¹ (mpmath, tests/data/gen_core.py), within 1 ulp
  assert.ok(Math.abs(Number(out[5]) / 9.924033330070695 - 1) < 2.3e-16, out[5]);
});
