// Minimal timing harness for the Node side of the benchmark (no dependencies).
//
// measure(fn) warms fn up until V8 has had time to optimise it, picks an inner repetition count
// so that one sample lasts at least `sampleMs`, then takes `samples` samples and returns the
// median and minimum time per call in nanoseconds. Every return value is folded into a sink so
// the optimiser cannot drop the call.

import { readFileSync } from "node:fs";

let sink = 0;

/** Folds a value into the global sink (numbers, typed arrays, objects). */
export function consume(v) {
  if (typeof v === "number") {
    sink += v;
  } else if (v && typeof v.length === "number" && v.length > 0) {
    sink += Number(v[0]);
  } else if (v && typeof v === "object") {
    sink += 1;
  }
}

/** The sink value (print it once so nothing is dead code). */
export function sinkValue() {
  return sink;
}

function nowNs() {
  return Number(process.hrtime.bigint());
}

// Each measured case gets its OWN copy of the timing loop (compiled from source with
// `new Function`), so the call `fn()` inside it stays monomorphic and V8 can inline it, as the
// native harness's closure is inlined. A single shared loop would become megamorphic after the
// first few cases and add ~10-40 ns of call overhead to every later case.
const LOOP_SRC = `
  let acc = 0;
  for (let i = 0; i < iters; i += 1) {
    const v = fn();
    acc += typeof v === "number" ? v : v && v.length ? Number(v[0]) : 1;
  }
  return acc;
`;
let loops = 0;
function makeLoop() {
  // A unique comment makes the source unique, so V8's compilation cache cannot hand back a loop
  // whose call-site feedback is shared with an earlier case.
  loops += 1;
  // eslint-disable-next-line no-new-func
  return new Function("fn", "iters", `// timing loop ${loops}\n${LOOP_SRC}`);
}

/**
 * Times `fn` (called with no arguments).
 * @param {() => unknown} fn
 * @param {{warmupMs?: number, sampleMs?: number, samples?: number, maxMs?: number}} [opts]
 * @returns {{nsMedian: number, nsMin: number, samples: number, iters: number}}
 */
export function measure(fn, opts = {}) {
  const warmupMs = opts.warmupMs ?? 150;
  const sampleMs = opts.sampleMs ?? 10;
  const samples = opts.samples ?? 21;
  const maxMs = opts.maxMs ?? 4000;
  const loop = makeLoop();
  const t0 = nowNs();
  // Warm-up in growing batches, also estimating the cost of one call.
  let calls = 0;
  let batch = 1;
  while (nowNs() - t0 < warmupMs * 1e6 || calls < 3) {
    sink += loop(fn, batch);
    calls += batch;
    if (batch < 1024) batch *= 2;
  }
  const perCall = (nowNs() - t0) / calls;
  const iters = Math.max(1, Math.ceil((sampleMs * 1e6) / perCall));
  const times = [];
  const start = nowNs();
  for (let s = 0; s < samples; s += 1) {
    const a = nowNs();
    sink += loop(fn, iters);
    times.push((nowNs() - a) / iters);
    if (times.length >= 5 && nowNs() - start > maxMs * 1e6) break;
  }
  times.sort((x, y) => x - y);
  const mid = times.length >> 1;
  const nsMedian = times.length % 2 ? times[mid] : (times[mid - 1] + times[mid]) / 2;
  return { nsMedian, nsMin: times[0], samples: times.length, iters };
}

/** Reads benches/data/bench_reference.json (path relative to this file). */
export function loadReference() {
  const url = new URL("../data/bench_reference.json", import.meta.url);
  return JSON.parse(readFileSync(url, "utf8"));
}

/** Emits one JSON result line on stdout. */
export function emit(record) {
  process.stdout.write(JSON.stringify(record) + "\n");
}
