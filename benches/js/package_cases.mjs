// Maps the benchmark cases onto the wasm package's exports. Each entry returns {fn, extra} when
// the package has what the case needs, or null (the case is then reported as skipped), so the
// bench never times a substitute under a wrong name.
//
// Inputs are given in SI units (`unit: "m"`) so they are bit-identical to the native and
// reference inputs; the per-call cost includes reading the options object, as a user pays it.

import { COUNT_GAIN, COUNT_OFFSET, EMISSIVITY, PIXELS, SH, T_REFLECTED_K, maxAbsError } from "./scene.mjs";

const has = (pkg, ...names) => names.every((n) => typeof pkg[n] === "function");
const SI = Object.freeze({ unit: "m" });

/** Builds a scalar case: `call()` is timed, its value recorded. */
function scalar(call) {
  return { fn: call, extra: () => ({ value: call() }) };
}

const CASES = [
  [
    "spectral_single",
    (pkg, { ref }) => {
      if (!has(pkg, "spectralDensity")) return null;
      const i = ref.spectral_single.inputs;
      return scalar(() => pkg.spectralDensity(SI, i.wavelength_m, i.temperature_k));
    },
  ],
  [
    "spectrum_10k",
    (pkg, { ref, lambdas, sampleIdx }) => {
      if (!has(pkg, "spectralDensityArray")) return null;
      const t = ref.spectrum_10k.inputs.temperature_k;
      const call = () => pkg.spectralDensityArray(SI, lambdas, t);
      return {
        fn: call,
        extra: () => {
          const out = call();
          return { sample_values: sampleIdx.map((k) => out[k]), note: "Float64Array in, new Float64Array out" };
        },
      };
    },
  ],
  ...["band_8_14_300", "band_1_2_1500"].map((kase) => [
    kase,
    (pkg, { ref }) => {
      if (!has(pkg, "bandIntegral")) return null;
      const i = ref[kase].inputs;
      return scalar(() => pkg.bandIntegral(SI, i.lower_m, i.upper_m, i.temperature_k));
    },
  ]),
  [
    "band_inverse_8_14",
    (pkg, { ref }) => {
      const name = ["temperatureFromBand", "bandTemperature"].find((n) => has(pkg, n));
      if (!name) return null;
      const i = ref.band_inverse_8_14.inputs;
      return scalar(() => pkg[name](SI, i.lower_m, i.upper_m, i.radiance));
    },
  ],
  [
    "response_signal_400",
    (pkg, { ref }) => {
      if (!has(pkg, "modelSignal")) return null;
      const i = ref.response_signal_400.inputs;
      const model = {
        kind: "response",
        wavelengths: Float64Array.from(i.wavelengths_m),
        values: Float64Array.from(i.response),
        unit: "m",
      };
      return scalar(() => pkg.modelSignal(model, i.temperature_k));
    },
  ],
  [
    "sh_inverse",
    (pkg, { ref }) => {
      if (!has(pkg, "modelTemperature")) return null;
      const i = ref.sh_inverse.inputs;
      const model = { kind: "sakumaHattori", aM: i.a_m, bMK: i.b_m_k, c: i.c };
      return scalar(() => pkg.modelTemperature(model, i.signal));
    },
  ],
  [
    "frame_640x512",
    (pkg, { frame }) => {
      if (!has(pkg, "convertFrame")) return null;
      const curve = { kind: "sakumaHattori", aM: SH.a, bMK: SH.b, c: SH.c };
      const options = { conditions: { emissivity: EMISSIVITY, reflectedTemperatureK: T_REFLECTED_K } };
      const call = () => pkg.convertFrame(curve, frame.signals, options);
      return {
        fn: () => call().valid,
        extra: () => ({
          pixels: PIXELS,
          max_abs_err_k: maxAbsError(call().temperaturesK, frame.exact),
          note: "Float32Array in, Float32Array out (convertFrame, result object)",
        }),
      };
    },
  ],
  [
    "frame_counts_640x512",
    (pkg, { frame }) => {
      if (!has(pkg, "convertFrame") || !frame.counts) return null;
      const curve = { kind: "sakumaHattori", aM: SH.a, bMK: SH.b, c: SH.c };
      const options = {
        gain: COUNT_GAIN,
        offset: COUNT_OFFSET,
        conditions: { emissivity: EMISSIVITY, reflectedTemperatureK: T_REFLECTED_K },
      };
      const call = () => pkg.convertFrame(curve, frame.counts, options);
      return {
        fn: () => call().valid,
        extra: () => ({
          pixels: PIXELS,
          max_abs_err_k: maxAbsError(call().temperaturesK, frame.countsExact),
          note: "Uint16Array counts in (gain/offset), Float32Array out (convertFrame, result object)",
        }),
      };
    },
  ],
  ["be_occupancy", (pkg) => (has(pkg, "boseEinstein") ? scalar(() => pkg.boseEinstein(2.0)) : null)],
  ["fd_occupancy", (pkg) => (has(pkg, "fermiDirac") ? scalar(() => pkg.fermiDirac(2.0)) : null)],
  [
    "fd_half",
    (pkg) => (has(pkg, "fermiDiracIntegral") ? scalar(() => pkg.fermiDiracIntegral(0.5, 1.5)) : null),
  ],
  [
    "fd_half_inverse",
    (pkg, { ref }) =>
      has(pkg, "inverseFermiDiracHalf")
        ? scalar(() => pkg.inverseFermiDiracHalf(ref.fd_half_inverse.inputs.value))
        : null,
  ],
  [
    "be_g32",
    (pkg) => (has(pkg, "boseEinsteinIntegral") ? scalar(() => pkg.boseEinsteinIntegral(1.5, 0.5)) : null),
  ],
];

/** The cases, each either {case, fn, extra} or {case, skip}. */
export function packageCases(pkg, shared) {
  return CASES.map(([kase, make]) => {
    try {
      const c = make(pkg, shared);
      return c ? { case: kase, ...c } : { case: kase, skip: "export not found in pkg/" };
    } catch (e) {
      return { case: kase, skip: `failed: ${e && e.message}` };
    }
  });
}
