// Maps the benchmark cases onto the wasm package's exports. Each entry returns {fn, extra} when
// the package has what the case needs, or null (the case is then reported as skipped), so the
// bench never times a substitute under a wrong name.
//
// Inputs are given in SI units (`unit: "m"`) so they are bit-identical to the native and
// reference inputs; the per-call cost includes reading the options object, as a user pays it.

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
      const band = { lower: i.lower_m, upper: i.upper_m };
      return scalar(() => pkg.bandIntegral(SI, band, i.temperature_k));
    },
  ]),
  [
    "band_inverse_8_14",
    (pkg, { ref }) => {
      if (!has(pkg, "bandTemperature")) return null;
      const i = ref.band_inverse_8_14.inputs;
      const band = { lower: i.lower_m, upper: i.upper_m };
      return scalar(() => pkg.bandTemperature(SI, band, i.radiance));
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
