// Where does the time of one package call go? Runs one benchmark case of the wasm package in a
// loop for a few seconds under V8's sampling profiler (the `node:inspector` Profiler domain,
// sampling every 250 µs) and prints the self time of the hottest functions, plus a summary by
// kind: wasm code (the physics), JS glue of the bindings, UTF-8 string decoding, GC.
//
// usage: node benches/js/profile_case.mjs CASE [--pkg DIR] [--seconds S]
//        e.g. node benches/js/profile_case.mjs band_8_14_300
// Used to explain a missed target in the README performance section; not part of the table.

import { Session } from "node:inspector/promises";
import { readFileSync } from "node:fs";
import path from "node:path";
import { loadReference } from "./harness.mjs";
import { packageCases } from "./package_cases.mjs";
import { makeFrame } from "./scene.mjs";

const args = process.argv.slice(2);
const kase = args[0];
const pkgIdx = args.indexOf("--pkg");
const pkgDir = path.resolve(pkgIdx >= 0 ? args[pkgIdx + 1] : new URL("../../pkg", import.meta.url).pathname);
const secIdx = args.indexOf("--seconds");
const seconds = secIdx >= 0 ? Number(args[secIdx + 1]) : 3;

const pkg = await import(path.join(pkgDir, "quantaband.js"));
pkg.initSync({ module: readFileSync(path.join(pkgDir, "quantaband_bg.wasm")) });
const ref = loadReference().cases;
const spec = ref.spectrum_10k.inputs;
const lambdas = new Float64Array(spec.n);
const step = (spec.last_m - spec.first_m) / (spec.n - 1);
for (let i = 0; i < spec.n; i += 1) lambdas[i] = spec.first_m + i * step;
const shared = {
  ref,
  lambdas,
  sampleIdx: ref.spectrum_10k.sample_index,
  frame: makeFrame(),
  box: (...xs) => Float64Array.from(xs),
};
const c = packageCases(pkg, shared).find((x) => x.case === kase);
if (!c || c.skip) {
  console.error(`case ${kase}: ${c ? c.skip : "unknown"}`);
  process.exit(1);
}

const session = new Session();
session.connect();
await session.post("Profiler.enable");
await session.post("Profiler.setSamplingInterval", { interval: 250 });
// Warm up first so the profile shows optimised code.
for (let i = 0; i < 2000; i += 1) c.fn();
await session.post("Profiler.start");
let sink = 0;
let calls = 0;
const t0 = Date.now();
while (Date.now() - t0 < seconds * 1000) {
  for (let i = 0; i < 100; i += 1) {
    const v = c.fn();
    sink += typeof v === "number" ? v : 1;
  }
  calls += 100;
}
const { profile } = await session.post("Profiler.stop");
const perCallNs = ((Date.now() - t0) * 1e6) / calls;

const byId = new Map(profile.nodes.map((n) => [n.id, n]));
const self = new Map();
profile.samples.forEach((id, i) => {
  const n = byId.get(id);
  const f = n.callFrame;
  const key = `${f.functionName || "(anonymous)"} ${f.url ? path.basename(f.url) : ""}${f.url ? `:${f.lineNumber + 1}` : ""}`;
  self.set(key, (self.get(key) ?? 0) + (profile.timeDeltas[i] ?? 0));
});
const total = [...self.values()].reduce((a, b) => a + b, 0);
const kinds = { "wasm code": 0, "string decoding (UTF-8, TextDecoder)": 0, "JS glue": 0, GC: 0, other: 0 };
for (const [k, t] of self) {
  if (/^wasm-function|^wasm-to-js|^js-to-wasm/.test(k)) kinds["wasm code"] += t;
  else if (/decodeUTF8|getStringFromWasm|decode encoding|TextDecoder|cachedTextDecoder/.test(k)) {
    kinds["string decoding (UTF-8, TextDecoder)"] += t;
  } else if (/quantaband\.js/.test(k)) kinds["JS glue"] += t;
  else if (/garbage collector/.test(k)) kinds.GC += t;
  else kinds.other += t;
}
console.log(`case ${kase}: ${perCallNs.toFixed(0)} ns per call under the profiler (sink ${sink !== 0})`);
console.log("self time by kind:");
for (const [k, t] of Object.entries(kinds)) console.log(`  ${((100 * t) / total).toFixed(1).padStart(5)} %  ${k}`);
console.log("hottest functions (self time):");
[...self.entries()]
  .sort((a, b) => b[1] - a[1])
  .slice(0, 12)
  .forEach(([k, t]) => console.log(`  ${((100 * t) / total).toFixed(1).padStart(5)} %  ${k}`));
