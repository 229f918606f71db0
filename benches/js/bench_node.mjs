// Node side of the benchmark: the wasm package (pkg/, built by pkg-scripts/build.sh) and the
// plain-JavaScript baselines A and C, measured in the same process.
//
// usage: node benches/js/bench_node.mjs [--quick] [--pkg DIR]
// Prints one JSON line per case (see benches/js/table.mjs for the fields).

import { existsSync, readFileSync } from "node:fs";
import { gzipSync } from "node:zlib";
import path from "node:path";
import { emit, loadReference, measure, sinkValue } from "./harness.mjs";
import * as A from "./baselines.mjs";
import { COUNT_GAIN, COUNT_OFFSET, PIXELS, SH, makeFrame, maxAbsError } from "./scene.mjs";
import { packageCases } from "./package_cases.mjs";

const args = process.argv.slice(2);
const quick = args.includes("--quick");
const pkgIdx = args.indexOf("--pkg");
const pkgDir = path.resolve(pkgIdx >= 0 ? args[pkgIdx + 1] : new URL("../../pkg", import.meta.url).pathname);
const opts = quick ? { warmupMs: 20, sampleMs: 2, samples: 7, maxMs: 300 } : {};

const ref = loadReference().cases;

function timed(impl, kase, fn, extra = {}) {
  const t = measure(fn, opts);
  emit({
    impl,
    case: kase,
    ns_median: t.nsMedian,
    ns_min: t.nsMin,
    samples: t.samples,
    iters: t.iters,
    ...extra,
  });
}

// Scalar inputs are read from Float64Arrays inside the timed closures: V8 may constant-fold
// loads from a constant object (and then the whole call), never typed-array element loads.
const box = (...xs) => Float64Array.from(xs);

// Shared inputs.
const spec = ref.spectrum_10k.inputs;
const lambdas = new Float64Array(spec.n);
const step = (spec.last_m - spec.first_m) / (spec.n - 1);
for (let i = 0; i < spec.n; i += 1) lambdas[i] = spec.first_m + i * step;
const sampleIdx = ref.spectrum_10k.sample_index;
const frame = makeFrame();
const shared = { ref, lambdas, sampleIdx, frame, opts, box };

// ---- the package ---------------------------------------------------------------------------
let pkg = null;
const glue = path.join(pkgDir, "quantaband.js");
const wasmPath = path.join(pkgDir, "quantaband_bg.wasm");
if (existsSync(glue) && existsSync(wasmPath)) {
  const bytes = readFileSync(wasmPath);
  pkg = await import(glue);
  pkg.initSync({ module: bytes });
  emit({
    impl: "wasm",
    meta: true,
    wasm_bytes: bytes.length,
    wasm_gzip_bytes: gzipSync(bytes, { level: 9 }).length,
    node: process.version,
  });
  for (const c of packageCases(pkg, shared)) {
    if (c.skip) {
      emit({ impl: "wasm", case: c.case, skipped: c.skip });
      continue;
    }
    timed("wasm", c.case, c.fn, c.extra());
  }
} else {
  emit({ impl: "wasm", meta: true, skipped: `no package at ${pkgDir} (run bash pkg-scripts/build.sh)` });
}

// ---- Baseline A: plain JS Planck, Simpson (1000 intervals), bisection -----------------------
{
  const i = ref.spectral_single.inputs;
  const x = box(i.wavelength_m, i.temperature_k);
  timed("jsA", "spectral_single", () => A.planck(x[0], x[1]), {
    value: A.planck(x[0], x[1]),
  });
}
{
  const out = new Float64Array(lambdas.length);
  const t = ref.spectrum_10k.inputs.temperature_k;
  timed("jsA", "spectrum_10k", () => A.planckSpectrum(lambdas, t, out), {
    sample_values: sampleIdx.map((k) => A.planckSpectrum(lambdas, t, out)[k]),
  });
}
for (const kase of ["band_8_14_300", "band_1_2_1500"]) {
  const i = ref[kase].inputs;
  const x = box(i.lower_m, i.upper_m, i.temperature_k);
  timed("jsA", kase, () => A.bandSimpson(x[0], x[1], x[2]), {
    value: A.bandSimpson(x[0], x[1], x[2]),
    note: "Simpson, 1000 intervals",
  });
}
{
  const i = ref.band_inverse_8_14.inputs;
  const x = box(i.lower_m, i.upper_m, i.radiance);
  timed("jsA", "band_inverse_8_14", () => A.bandInverseBisection(x[0], x[1], x[2]), {
    value: A.bandInverseBisection(x[0], x[1], x[2]),
    note: "bisection on [50, 5000] K to 1e-9 relative, Simpson inside",
  });
}

// ---- Baseline C: Sakuma-Hattori closed form as a plain loop over the frame -----------------
{
  const i = ref.sh_inverse.inputs;
  const x = box(i.signal, SH.a, SH.b, SH.c, SH.c2);
  timed("jsC", "sh_inverse", () => A.shInverse(x[0], x[1], x[2], x[3], x[4]), {
    value: A.shInverse(x[0], x[1], x[2], x[3], x[4]),
  });
  const out = new Float32Array(PIXELS);
  const run = () =>
    A.frameShInverse(frame.signals, out, SH.a, SH.b, SH.c, SH.c2, frame.background, frame.scale);
  timed("jsC", "frame_640x512", run, {
    pixels: PIXELS,
    max_abs_err_k: maxAbsError(run(), frame.exact),
    note: "Float32Array in, Float32Array out",
  });
  const outK = new Float32Array(PIXELS);
  const runK = () =>
    A.frameCountsShInverse(frame.counts, outK, SH.a, SH.b, SH.c, SH.c2, frame.background, frame.scale, COUNT_GAIN, COUNT_OFFSET);
  timed("jsC", "frame_counts_640x512", runK, {
    pixels: PIXELS,
    max_abs_err_k: maxAbsError(runK(), frame.countsExact),
    note: "Uint16Array counts in, Float32Array out",
  });
}

emit({ impl: "node", meta: true, sink: sinkValue() });
