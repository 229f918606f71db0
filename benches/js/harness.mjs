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
  const t0 = nowNs();
  // Warm-up, also estimating the cost of one call.
  let calls = 0;
  while (nowNs() - t0 < warmupMs * 1e6 || calls < 3) {
    consume(fn());
    calls += 1;
  }
  const perCall = (nowNs() - t0) / calls;
  const iters = Math.max(1, Math.ceil((sampleMs * 1e6) / perCall));
  const times = [];
  const start = nowNs();
  for (let s = 0; s < samples; s += 1) {
    const a = nowNs();
    for (let i = 0; i < iters; i += 1) consume(fn());
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
