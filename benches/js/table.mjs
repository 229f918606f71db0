// Formats the JSON lines written by the three harnesses (native Rust, Node, SciPy) into ONE
// markdown table, followed by the target checklist.
//
// usage: node benches/js/table.mjs RESULTS.jsonl [--machine MACHINE.json]
//
// Record kinds (one JSON object per line):
//   {impl, case, ns_median, ns_min, samples, iters, value?, sample_values?, max_abs_err_k?,
//    pixels?, note?}                         a timed case
//   {impl, meta: true, ...}                  versions and sizes (no timing)
// impl is one of "native", "wasm", "jsA" (Baseline A), "jsC" (Baseline C), "scipy".

import { readFileSync } from "node:fs";

const args = process.argv.slice(2);
const resultsPath = args[0];
const machineIdx = args.indexOf("--machine");
const machine = machineIdx >= 0 ? JSON.parse(readFileSync(args[machineIdx + 1], "utf8")) : null;
const ref = JSON.parse(readFileSync(new URL("../data/bench_reference.json", import.meta.url), "utf8"));

const records = readFileSync(resultsPath, "utf8")
  .split("\n")
  .filter((l) => l.trim().startsWith("{"))
  .map((l) => JSON.parse(l));

const timed = new Map(); // "impl/case" -> record
const meta = {};
const skipped = [];
for (const r of records) {
  if (r.meta) Object.assign((meta[r.impl] ??= {}), r);
  else if (r.case && r.skipped) skipped.push(`${r.impl} ${r.case} (${r.skipped})`);
  else if (r.case) timed.set(`${r.impl}/${r.case}`, r);
}
const get = (impl, kase) => timed.get(`${impl}/${kase}`);

const ROWS = [
  ["spectral_single", "Spectral radiance L_λ(10 µm, 300 K)"],
  ["spectrum_10k", "Spectrum L_λ, 10 000 points 1–20 µm, 1000 K (per spectrum)"],
  ["band_8_14_300", "Band radiance 8–14 µm, 300 K"],
  ["band_1_2_1500", "Band radiance 1–2 µm, 1500 K"],
  ["band_inverse_8_14", "Band inverse 8–14 µm (T = 350 K)"],
  ["response_signal_400", "Response-weighted signal, 9-point curve, 400 K"],
  ["signal_table_400", "Spectral-table signal: response, ε, τ_p, τ_w, ρ_w tables (120–200 points), 8–14 µm, 400 K"],
  ["sh_inverse", "Sakuma–Hattori inverse, one value"],
  ["frame_640x512", "Frame 640×512 signal → T (Sakuma–Hattori)"],
  ["frame_counts_640x512", "Frame 640×512 counts → T (gain/offset, Sakuma–Hattori)"],
  ["be_occupancy", "Bose–Einstein occupancy, x = 2"],
  ["fd_occupancy", "Fermi–Dirac occupancy, x = 2"],
  ["fd_half", "Fermi–Dirac integral F_{1/2}(1.5)"],
  ["fd_half_inverse", "Inverse of F_{1/2} (η = 1.5)"],
  ["be_g32", "Bose–Einstein integral g_{3/2}(0.5)"],
  ["monte_carlo_1e5", "Monte Carlo, 10⁵ trials of the measurement equation (error: u(y) − GUM u_c, sampling)"],
];

function fmtNs(ns) {
  if (ns === undefined || ns === null || !Number.isFinite(ns)) return "–";
  if (ns >= 1e6) return `${(ns / 1e6).toPrecision(3)} ms`;
  if (ns >= 1e3) return `${(ns / 1e3).toPrecision(3)} µs`;
  return `${ns.toPrecision(3)} ns`;
}

function fmtErr(e) {
  if (e === undefined) return "";
  if (e.kind === "rel") return e.value === 0 ? "rel 0" : `rel ${e.value.toExponential(1)}`;
  if (e.kind === "absK") return e.value === 0 ? "ΔT 0 K" : `ΔT ${e.value.toExponential(1)} K`;
  return "";
}

// Exact difference between an f64 and a decimal string, using BigInt rationals, so that errors
// near the f64 resolution (1e-16) are not blurred by rounding the reference to f64.
function exactParts(v) {
  const dv = new DataView(new ArrayBuffer(8));
  dv.setFloat64(0, v);
  const bits = dv.getBigUint64(0);
  const sign = bits >> 63n ? -1n : 1n;
  const expBits = Number((bits >> 52n) & 0x7ffn);
  let mant = bits & ((1n << 52n) - 1n);
  let e2;
  if (expBits === 0) e2 = -1074;
  else {
    mant |= 1n << 52n;
    e2 = expBits - 1075;
  }
  return { m: sign * mant, e2 };
}
function decimalParts(str) {
  const m = /^([+-]?)(\d*)(?:\.(\d*))?(?:e([+-]?\d+))?$/i.exec(str.trim());
  const digits = (m[2] || "") + (m[3] || "");
  const p = Number(m[4] || 0) - (m[3] || "").length;
  return { d: (m[1] === "-" ? -1n : 1n) * BigInt(digits || "0"), p };
}
const pow = (b, n) => b ** BigInt(n);
/** {abs, rel} of v against the decimal string refStr, exactly, rounded to a Number at the end. */
function exactError(v, refStr) {
  const { m, e2 } = exactParts(v);
  const { d, p } = decimalParts(refStr);
  const E2 = Math.max(0, -e2);
  const P10 = Math.max(0, -p);
  const x = m * pow(2n, e2 + E2) * pow(10n, P10);
  const y = d * pow(10n, p + P10) * pow(2n, E2);
  let diff = x - y;
  if (diff < 0n) diff = -diff;
  const ay = y < 0n ? -y : y;
  const SCALE = 10n ** 30n;
  const rel = Number((diff * SCALE) / ay) / 1e30;
  const denom = pow(2n, E2) * pow(10n, P10);
  const abs = Number((diff * SCALE) / denom) / 1e30;
  return { abs, rel };
}

// Error of one record against the reference (relative, or absolute in K for temperatures).
function errorOf(rec, kase) {
  if (!rec) return undefined;
  if (typeof rec.max_abs_err_k === "number") return { kind: "absK", value: rec.max_abs_err_k };
  const c = ref.cases[kase];
  if (!c) return undefined;
  if (Array.isArray(rec.sample_values) && Array.isArray(c.sample_values)) {
    let m = 0;
    rec.sample_values.forEach((v, i) => {
      m = Math.max(m, exactError(v, c.sample_values[i]).rel);
    });
    return { kind: "rel", value: m };
  }
  if (typeof rec.value !== "number" || c.value === undefined) return undefined;
  const e = exactError(rec.value, c.value);
  if (c.unit === "K") return { kind: "absK", value: e.abs };
  return { kind: "rel", value: e.rel };
}

function worse(a, b) {
  if (!a) return b;
  if (!b) return a;
  return a.value >= b.value ? a : b;
}

function speed(rec) {
  if (!rec) return "–";
  let s = fmtNs(rec.ns_median);
  if (rec.pixels) s += ` (${((rec.pixels / rec.ns_median) * 1e3).toFixed(0)} Mpx/s)`;
  return s;
}

function ratio(num, den) {
  if (!num || !den) return "–";
  const r = num.ns_median / den.ns_median;
  if (r >= 10) return `${r.toFixed(0)}×`;
  if (r >= 0.1) return `${r.toFixed(2)}×`;
  return `${r.toPrecision(2)}×`;
}

const lines = [];
const header = [
  "case",
  "native Rust (median)",
  "wasm in Node (median)",
  "wasm / native",
  "package error",
  "Baseline A/C plain JS",
  "A/C error",
  "A/C time ÷ wasm time",
  "SciPy",
  "SciPy error",
  "SciPy time ÷ wasm time",
];
lines.push(`| ${header.join(" | ")} |`);
lines.push(`|${header.map(() => "---").join("|")}|`);

const results = {}; // for the target checklist
for (const [kase, label] of ROWS) {
  const n = get("native", kase);
  const w = get("wasm", kase);
  const a = get("jsA", kase) ?? get("jsC", kase);
  const s = get("scipy", kase);
  if (!n && !w && !a && !s) continue;
  const pkgErr = worse(errorOf(n, kase), errorOf(w, kase));
  const aErr = errorOf(a, kase);
  const sErr = errorOf(s, kase);
  results[kase] = { n, w, a, s, pkgErr, aErr, sErr };
  const aLabel = a ? (a.impl === "jsC" ? "C: " : "A: ") + speed(a) : "–";
  lines.push(
    `| ${label} | ${speed(n)} | ${speed(w)} | ${ratio(w, n)} | ${fmtErr(pkgErr)} | ${aLabel} | ${fmtErr(aErr)} | ${ratio(a, w)} | ${speed(s)} | ${fmtErr(sErr)} | ${ratio(s, w)} |`,
  );
}

const wm = meta.wasm ?? {};
if (wm.wasm_bytes) {
  lines.push(
    `| .wasm size raw / gzip -9 | – | ${wm.wasm_bytes} B / ${wm.wasm_gzip_bytes} B (${(wm.wasm_bytes / 1000).toFixed(1)} kB / ${(wm.wasm_gzip_bytes / 1000).toFixed(1)} kB) | | | | | | | | |`,
  );
}
const inst = meta.instantiate;
if (inst && inst.ns_median) {
  lines.push(
    `| Module compile + instantiate from bytes (fresh Node process, median of ${inst.runs}) | – | ${fmtNs(inst.ns_median)} (min ${fmtNs(inst.ns_min)}) | | | | | | | | |`,
  );
}

console.log(lines.join("\n"));
if (skipped.length) console.log(`\nNot measured in this run: ${skipped.join("; ")}.`);
if (meta.build && meta.build.warning) console.log(`\nBuild warning: ${meta.build.warning}.`);
if (meta.wasm && meta.wasm.skipped) console.log(`\nwasm package not measured: ${meta.wasm.skipped}.`);

// Target checklist (goals of the issue; never asserted in tests).
const out = [];
const mark = (ok) => (ok === undefined ? "not measured" : ok ? "met" : "MISSED");
// Accuracy verdict: errors both ≤ 1e-15 relative (about 4.5 ulp) are a tie at the f64 rounding
// level; otherwise the smaller error wins.
const ULP_LEVEL = 1e-15;
function accVerdict(pkg, other) {
  if (!pkg || !other) return "not measured";
  if (pkg.kind === "rel" && pkg.value <= ULP_LEVEL && other.value <= ULP_LEVEL) {
    return "tie: both at the f64 rounding level (≤ 1e-15)";
  }
  return pkg.value <= other.value ? "equal or better" : "WORSE";
}
const times = (a, b) => (a && b && Number.isFinite(a.ns_median) && Number.isFinite(b.ns_median) ? a.ns_median / b.ns_median : undefined);
const fx = (x) => (x === undefined ? "not measured" : `${x >= 10 ? x.toFixed(0) : x.toFixed(2)}×`);
const goal = (x, thr) => (x === undefined ? "not measured" : `${fx(x)} (${mark(x >= thr)})`);
function bandTarget(kase) {
  const r = results[kase];
  if (!r) return;
  const wS = times(r.s, r.w);
  const nS = times(r.s, r.n);
  const wA = times(r.a, r.w);
  const nA = times(r.a, r.n);
  out.push(
    `- ${kase} vs SciPy quad (goal ≥ 100×): wasm ${goal(wS, 100)}, native ${goal(nS, 100)}; ` +
      `errors: package ${fmtErr(r.pkgErr)}, SciPy ${fmtErr(r.sErr)} → ${accVerdict(r.pkgErr, r.sErr)}`,
  );
  out.push(
    `- ${kase} vs Baseline A (goal ≥ 20×): wasm ${goal(wA, 20)}, native ${goal(nA, 20)}; ` +
      `errors: package ${fmtErr(r.pkgErr)}, A ${fmtErr(r.aErr)} → ${accVerdict(r.pkgErr, r.aErr)}`,
  );
}
bandTarget("band_8_14_300");
bandTarget("band_1_2_1500");
// Point and bulk calls of the prepared objects against plain JavaScript (Baselines A and C), and
// the band inverse against SciPy's brentq.
for (const [kase, what, cmp] of [
  ["spectral_single", "spectral point vs Baseline A (goal: wasm ≤ 3× plain JS)", 3],
  ["sh_inverse", "Sakuma–Hattori inverse vs Baseline C (goal: wasm ≤ 3× plain JS)", 3],
  ["spectrum_10k", "spectrum 10⁴ points vs Baseline A (goal: wasm ≤ 1× plain JS)", 1],
]) {
  const r = results[kase];
  if (!r || !r.w || !r.a) continue;
  const x = r.w.ns_median / r.a.ns_median;
  out.push(`- ${what}: ${fmtNs(r.w.ns_median)} vs ${fmtNs(r.a.ns_median)} = ${x.toFixed(2)}× (${mark(x <= cmp)})`);
}
{
  const r = results.band_inverse_8_14;
  if (r) out.push(`- band_inverse_8_14 vs SciPy brentq (goal ≥ 100×): wasm ${goal(times(r.s, r.w), 100)}, native ${goal(times(r.s, r.n), 100)}`);
}
const wr = Object.entries(results)
  .filter(([, r]) => r.n && r.w)
  .map(([k, r]) => [k, r.w.ns_median / r.n.ns_median]);
if (wr.length) {
  const bad = wr.filter(([, x]) => x > 2);
  out.push(
    `- wasm within 2× of native: ${bad.length === 0 ? "met for all rows" : `MISSED for ${bad.map(([k, x]) => `${k} (${x.toFixed(2)}×)`).join(", ")}`}`,
  );
}
for (const [key, what] of [
  ["frame_640x512", "frame (f32 signals)"],
  ["frame_counts_640x512", "frame (u16 counts)"],
]) {
  const fr = results[key];
  if (!fr || !fr.w) continue;
  const mpx = (fr.w.pixels / fr.w.ns_median) * 1e3;
  const vsC = fr.a ? fr.a.ns_median / fr.w.ns_median : undefined;
  out.push(
    `- ${what}: ${fmtNs(fr.w.ns_median)} = ${mpx.toFixed(0)} Mpixel/s in Node (≤ 3.3 ms, ≥ 100: ${mark(mpx >= 100)}), ${vsC === undefined ? "?" : vsC.toFixed(2)}× Baseline C (≥ 3×: ${mark(vsC === undefined ? undefined : vsC >= 3)})`,
  );
}
const nb = results.band_8_14_300?.n;
if (nb) out.push(`- native band radiance ${fmtNs(nb.ns_median)} (≤ 200 ns: ${mark(nb.ns_median <= 200)})`);
const ni = results.band_inverse_8_14?.n;
if (ni) out.push(`- native band inverse ${fmtNs(ni.ns_median)} (≤ 2 µs: ${mark(ni.ns_median <= 2000)})`);
if (out.length) console.log("\nTargets (goals, not test assertions):\n" + out.join("\n"));

if (machine) {
  console.log(
    `\nMeasured ${machine.date} on ${machine.cpu} (${machine.nproc} cores visible, shared; load average ${machine.load ?? "?"} at the start), ${machine.rustc}, Node ${machine.node}` +
      (meta.scipy ? `, Python ${meta.scipy.python} + SciPy ${meta.scipy.scipy}` : "") +
      ".",
  );
}
