// Maps the benchmark cases onto the wasm package's public API: the prepared objects (Spectrum,
// Instrument, CalibrationCurve), built once per case outside the timed call, as a user is meant
// to use them, and the free functions. Each entry returns {fn, extra} when the package has what
// the case needs, or null (the case is then reported as skipped), so the bench never times a
// substitute under a wrong name.
//
// Inputs are given in SI units (`unit: "m"`, densities per metre) so they are bit-identical to
// the native and reference inputs. Bulk cases write into a preallocated output array, as
// Baselines A and C do.

import { COUNT_GAIN, COUNT_OFFSET, EMISSIVITY, PIXELS, SH, T_REFLECTED_K, maxAbsError } from "./scene.mjs";

const has = (pkg, ...names) => names.every((n) => typeof pkg[n] === "function");

/** Builds a scalar case: `call()` is timed, its value recorded. */
function scalar(call) {
  return { fn: call, extra: () => ({ value: call() }) };
}

/** The spectrum of every radiometric case: blackbody radiance per metre of wavelength. */
const siSpectrum = (pkg) => new pkg.Spectrum({ unit: "m" });

const CASES = [
  [
    "spectral_single",
    (pkg, { ref }) => {
      if (!has(pkg, "Spectrum")) return null;
      const i = ref.spectral_single.inputs;
      const s = siSpectrum(pkg);
      return scalar(() => s.point(i.wavelength_m, i.temperature_k));
    },
  ],
  [
    "spectrum_10k",
    (pkg, { ref, lambdas, sampleIdx }) => {
      if (!has(pkg, "Spectrum")) return null;
      const t = ref.spectrum_10k.inputs.temperature_k;
      const s = siSpectrum(pkg);
      const out = new Float64Array(lambdas.length);
      const call = () => s.points(lambdas, t, out);
      return {
        fn: call,
        extra: () => {
          call();
          return { sample_values: sampleIdx.map((k) => out[k]), note: "Spectrum.points: Float64Array in, into a preallocated Float64Array" };
        },
      };
    },
  ],
  ...["band_8_14_300", "band_1_2_1500"].map((kase) => [
    kase,
    (pkg, { ref }) => {
      if (!has(pkg, "Spectrum")) return null;
      const i = ref[kase].inputs;
      const s = siSpectrum(pkg);
      return scalar(() => s.band(i.lower_m, i.upper_m, i.temperature_k));
    },
  ]),
  [
    "band_inverse_8_14",
    (pkg, { ref }) => {
      if (!has(pkg, "Spectrum")) return null;
      const i = ref.band_inverse_8_14.inputs;
      const s = siSpectrum(pkg);
      return scalar(() => s.bandTemperature(i.lower_m, i.upper_m, i.radiance));
    },
  ],
  [
    "response_signal_400",
    (pkg, { ref }) => {
      if (!has(pkg, "Instrument")) return null;
      const i = ref.response_signal_400.inputs;
      const instrument = new pkg.Instrument({
        model: {
          kind: "response",
          wavelengths: Float64Array.from(i.wavelengths_m),
          values: Float64Array.from(i.response),
          unit: "m",
        },
      });
      return scalar(() => instrument.signal(i.temperature_k));
    },
  ],
  [
    "signal_table_400",
    (pkg, { ref }) => {
      if (!has(pkg, "SpectralInstrument")) return null;
      const i = ref.signal_table_400.inputs;
      const table = (name) => ({ wavelengths: Float64Array.from(i.tables[name].wavelengths_m), values: Float64Array.from(i.tables[name].values), unit: "m" });
      const instrument = new pkg.SpectralInstrument({
        response: table("response"),
        conditions: {
          emissivity: table("emissivity"),
          reflectedTemperatureK: i.reflected_temperature_k,
          pathTransmittance: table("path_transmittance"),
          pathTemperatureK: i.path_temperature_k,
          window: {
            transmittance: table("window_transmittance"),
            reflectance: table("window_reflectance"),
            temperatureK: i.window_temperature_k,
            reflectedTemperatureK: i.window_reflected_temperature_k,
          },
        },
      });
      return scalar(() => instrument.measuredSignal(i.temperature_k));
    },
  ],
  [
    "sh_inverse",
    (pkg, { ref }) => {
      if (!has(pkg, "CalibrationCurve")) return null;
      const i = ref.sh_inverse.inputs;
      const curve = new pkg.CalibrationCurve({ aM: i.a_m, bMK: i.b_m_k, c: i.c });
      return scalar(() => curve.temperature(i.signal));
    },
  ],
  [
    "frame_640x512",
    (pkg, { frame }) => {
      if (!has(pkg, "CalibrationCurve")) return null;
      const curve = new pkg.CalibrationCurve({ aM: SH.a, bMK: SH.b, c: SH.c });
      const out = new Float32Array(PIXELS);
      const options = { conditions: { emissivity: EMISSIVITY, reflectedTemperatureK: T_REFLECTED_K }, out };
      const call = () => curve.convertFrame(frame.signals, options);
      return {
        fn: () => call().valid,
        extra: () => ({
          pixels: PIXELS,
          max_abs_err_k: maxAbsError(call().temperaturesK, frame.exact),
          note: "Float32Array in, into a preallocated Float32Array (CalibrationCurve.convertFrame, result object)",
        }),
      };
    },
  ],
  [
    "frame_counts_640x512",
    (pkg, { frame }) => {
      if (!has(pkg, "CalibrationCurve") || !frame.counts) return null;
      const curve = new pkg.CalibrationCurve({ aM: SH.a, bMK: SH.b, c: SH.c });
      const out = new Float32Array(PIXELS);
      const options = {
        gain: COUNT_GAIN,
        offset: COUNT_OFFSET,
        conditions: { emissivity: EMISSIVITY, reflectedTemperatureK: T_REFLECTED_K },
        out,
      };
      const call = () => curve.convertFrame(frame.counts, options);
      return {
        fn: () => call().valid,
        extra: () => ({
          pixels: PIXELS,
          max_abs_err_k: maxAbsError(call().temperaturesK, frame.countsExact),
          note: "Uint16Array counts in (gain/offset), into a preallocated Float32Array (CalibrationCurve.convertFrame)",
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
  [
    // Monte Carlo (JCGM 101): 10⁵ trials of the measurement equation of the benchmark camera,
    // created, run in one step and summarised per call. The value is the run's standard
    // uncertainty u(y), K, compared with the GUM u_c of the same inputs (mpmath): they differ by
    // the sampling error.
    "monte_carlo_1e5",
    (pkg, { ref }) => {
      if (!has(pkg, "Instrument", "MonteCarlo")) return null;
      const i = ref.monte_carlo_1e5.inputs;
      const instrument = new pkg.Instrument({
        model: { kind: "sakumaHattori", aM: i.a_m, bMK: i.b_m_k, c: i.c },
        conditions: { emissivity: i.emissivity, reflectedTemperatureK: i.reflected_temperature_k },
      });
      const uncertainties = {
        signal: i.u_signal,
        emissivity: { standardUncertainty: i.u_emissivity, distribution: i.emissivity_distribution },
        reflectedTemperatureK: i.u_reflected_temperature_k,
      };
      const options = { trials: i.trials, seed: i.seed };
      const call = () => {
        const mc = pkg.MonteCarlo.measurement(instrument, i.signal, uncertainties, options);
        mc.step(i.trials);
        const u = mc.result().standardUncertainty;
        mc.free();
        return u;
      };
      return {
        fn: call,
        extra: () => ({ value: call(), note: "MonteCarlo.measurement + step(1e5) + result(); value: u(y) vs the GUM u_c (mpmath), differs by the sampling error" }),
      };
    },
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
