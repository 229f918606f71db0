// The invented 640x512 benchmark scene: a warm wall with a gradient and one hot spot, seen by a
// made-up long-wave camera whose calibration is a Sakuma-Hattori curve. Demo data only.
//
// Same formulas as the native harness (benches/native.rs, `scene`), so both sides convert the
// same frame.

import { C2 } from "./baselines.mjs";

export const WIDTH = 640;
export const HEIGHT = 512;
export const PIXELS = WIDTH * HEIGHT;

// Sakuma-Hattori calibration S(T) = C / (exp(c2/(A T + B)) - 1) (invented coefficients, the same
// as benches/py/gen_bench_reference.py).
export const SH = { a: 1.05e-5, b: 1.5e-4, c: 2.0e4, c2: C2 };

// Per-frame conditions (invented): emissivity 0.95, reflected surroundings 293.15 K, no path.
export const EMISSIVITY = 0.95;
export const T_REFLECTED_K = 293.15;

// The same scene as raw counts of an invented 14-bit camera: signal = COUNT_GAIN * count +
// COUNT_OFFSET (curve units), so the scene spans counts of about 7 100 to 14 800.
export const COUNT_GAIN = 0.1;
export const COUNT_OFFSET = -500;

/** Sakuma-Hattori forward signal at temperature t (K). */
export function shSignal(tK) {
  return SH.c / Math.expm1(SH.c2 / (SH.a * tK + SH.b));
}

/** Object temperature of pixel (x, y), K: 285..345 K gradient plus a 120 K hot spot. */
export function sceneTemperature(x, y) {
  const dx = x - 400;
  const dy = y - 200;
  return 285 + (40 * x) / (WIDTH - 1) + (20 * y) / (HEIGHT - 1) + 120 * Math.exp(-(dx * dx + dy * dy) / 3200);
}

/**
 * The measured frame as Float32Array signals: s = eps*S(T) + (1-eps)*S(T_refl), and the
 * exact object temperatures of the f32-rounded signals (closed form in f64) for the error check;
 * also as Uint16Array counts (COUNT_GAIN, COUNT_OFFSET) with the exact temperatures of the
 * counts' signals.
 */
export function makeFrame() {
  const signals = new Float32Array(PIXELS);
  const background = (1 - EMISSIVITY) * shSignal(T_REFLECTED_K);
  for (let y = 0; y < HEIGHT; y += 1) {
    for (let x = 0; x < WIDTH; x += 1) {
      signals[y * WIDTH + x] = EMISSIVITY * shSignal(sceneTemperature(x, y)) + background;
    }
  }
  const exact = new Float64Array(PIXELS);
  for (let i = 0; i < PIXELS; i += 1) exact[i] = objectTemperature(signals[i], background);
  // counts: the f64 signal rounded to the nearest count (floor(x + 0.5), as benches/native.rs)
  const counts = new Uint16Array(PIXELS);
  const countsExact = new Float64Array(PIXELS);
  for (let y = 0; y < HEIGHT; y += 1) {
    for (let x = 0; x < WIDTH; x += 1) {
      const i = y * WIDTH + x;
      const s = EMISSIVITY * shSignal(sceneTemperature(x, y)) + background;
      counts[i] = Math.floor((s - COUNT_OFFSET) / COUNT_GAIN + 0.5);
      countsExact[i] = objectTemperature(COUNT_GAIN * counts[i] + COUNT_OFFSET, background);
    }
  }
  return { signals, background, scale: 1 / EMISSIVITY, exact, counts, countsExact };
}

/** Exact object temperature (K) of a measured signal: closed-form inverse in f64. */
function objectTemperature(signal, background) {
  const s = (signal - background) / EMISSIVITY;
  return (SH.c2 / Math.log(SH.c / s + 1) - SH.b) / SH.a;
}

/** Largest |out[i] - exact[i]| in K (NaN outputs count as infinite error). */
export function maxAbsError(out, exact) {
  let m = 0;
  for (let i = 0; i < exact.length; i += 1) {
    const e = Math.abs(out[i] - exact[i]);
    if (!(e <= m)) m = Number.isNaN(e) ? Infinity : e;
  }
  return m;
}
