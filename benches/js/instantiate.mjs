// Module start-up cost: compile + instantiate the package's .wasm from bytes already in memory
// (`initSync({ module: bytes })`), each run in a FRESH Node process so that V8's in-process
// module cache cannot serve a second compile. Prints one meta JSON line with the median and
// minimum over the runs.
//
// usage: node benches/js/instantiate.mjs [--runs N] [--pkg DIR]

import { execFileSync } from "node:child_process";
import path from "node:path";

const args = process.argv.slice(2);
const runsIdx = args.indexOf("--runs");
const runs = runsIdx >= 0 ? Number(args[runsIdx + 1]) : 15;
const pkgIdx = args.indexOf("--pkg");
const pkgDir = path.resolve(pkgIdx >= 0 ? args[pkgIdx + 1] : new URL("../../pkg", import.meta.url).pathname);

const child = `
import { readFileSync } from "node:fs";
const bytes = readFileSync(${JSON.stringify(path.join(pkgDir, "quantaband_bg.wasm"))});
const glue = await import(${JSON.stringify(path.join(pkgDir, "quantaband.js"))});
const t0 = process.hrtime.bigint();
glue.initSync({ module: bytes });
const t1 = process.hrtime.bigint();
process.stdout.write(String(t1 - t0));
`;

const times = [];
for (let i = 0; i < runs; i += 1) {
  const out = execFileSync(process.execPath, ["--input-type=module", "-e", child], { encoding: "utf8" });
  times.push(Number(out));
}
times.sort((a, b) => a - b);
const mid = times.length >> 1;
const median = times.length % 2 ? times[mid] : (times[mid - 1] + times[mid]) / 2;
process.stdout.write(
  JSON.stringify({ impl: "instantiate", meta: true, ns_median: median, ns_min: times[0], runs: times.length }) + "\n",
);
