//! Whole-frame conversion of raw signals (camera counts or calibrated signals) to object
//! temperatures through a Sakuma–Hattori calibration curve and the measurement equation.
//!
//! # Method
//! Everything that is the same for the whole frame is hoisted out of the pixel loop by
//! [`FrameConverter::new`]: the measurement equation's gain and background
//! ([`Conditions::affine`]), the count-to-signal gain/offset and the curve constants. With
//! signal = g·count + o and the Sakuma–Hattori inverse T = (c2/ln(1 + C/S_obj) − B)/A, each pixel
//! needs
//!
//! ```text
//! T = k1 / ln(1 + num/den) − k0
//! scalar ε:   num = 1,          den = α·raw + β         α = g/(C·a),  β = (o − b)/(C·a)
//! ε map:      num = C·K·ε_i,    den = g·raw + (o − b0) + K·S(T_refl)·ε_i
//! k1 = c2/A,  k0 = B/A,  K = τ_w·τ,  a = K·ε,  b0 = b + a·S(T_refl) (the background at ε = 0)
//! ```
//!
//! so each pixel costs one multiply–add, one logarithm and two divisions.
//!
//! The logarithm is a tailored kernel, [`fast_ln`]: w = 2^k·m with m ∈ [√½, √2) taken from the
//! bits of w (k converted to f64 with the 2⁵² trick, so every step is a plain SIMD lane
//! operation), then ln m = 2·atanh(s) = 2s·(1 + z/3 + z²/5 + z³/7 + z⁴/9 + z⁵/11) with
//! s = (m − 1)/(m + 1) and z = s². Since |s| ≤ (√2 − 1)/(√2 + 1) = 0.1716, z ≤ 0.02944 and the neglected tail
//! Σ_{j≥6} z^j/(2j + 1) is at most z⁶/(13(1 − z)) ≤ 5.2e-11 relative to ln m; with k ≠ 0 the
//! relative error of k·ln 2 + ln m is smaller still. (A 128-entry table-driven logarithm was
//! also tried: faster in a scalar build, slower once the loop is vectorised for simd128,
//! because wasm has no gather.)
//!
//! Error bound. L = ln(1 + num/den) = c2/(A·T + B) = x (the Planck exponent) and
//! T + B/A = k1/L, so a relative error δ in L gives |ΔT| = (T + B/A)·δ. δ is the 5.2e-11 of the
//! series plus roundings: those of w = 1 + v (≤ 1.1e-16·w/(w − 1)·1/L relative, i.e. ≈ 1e-16/x²
//! for small x) and a few ulp in the kernel. For every thermometer with λT ≤ 0.29 m·K (x ≥ 0.05:
//! 14 µm up to 20 000 K) that is |ΔT| ≤ 1e-10·(T + B/A) — 0.3 µK at 3000 K, far below the
//! 1 mK target. The sweep test in `tests/thermometry_frame.rs` measures the actual maximum
//! against the closed-form f64 inverse. With f32 output the final rounding (≤ 6e-8·T)
//! dominates.
//!
//! Single-precision loop (u16 counts or f32 signals → f32 output, no emissivity map; counts
//! first, f32 signals below). The output is f32
//! anyway, so these frames are evaluated in f32, four pixels per simd128 operation:
//!
//! ```text
//! d = (raw − r0_hi) − r0_lo     r0 = −β/α (the count at the background), r0_hi = r0 rounded
//!                               to a multiple of 2⁻⁶, r0_lo = r0 − r0_hi as f32
//! v = ia/d                      ia = 1/α as f32  (v = num/den of the scalar form)
//! L = ln32(1 + v)               2^k·m split as in fast_ln; ln m = 2s(1 + z/3 + z²/5 + z³/7 + z⁴/9);
//!                               ln 2 split (fdlibm's hi/lo), so k·ln2_hi is exact
//! T = k1/L − k0                 k1, k0 as f32
//! ```
//!
//! Error bound (u = 2⁻²⁴, first order; products of two error terms are below 1e-13
//! relative). raw < 2¹⁶ and |r0_hi| < 2¹⁷ are multiples of 2⁻⁶, so raw − r0_hi is exact; with
//! |d| ≥ 1/16 the rounded r0_lo (≤ 2⁻⁷·u absolute) and the last subtraction give ≤ 1.13 u
//! relative in d, and the f64 r0 itself ≤ 2e-10 u. v: + ia's rounding + the division, δv ≤
//! 3.13 u. Since v/((1 + v)·ln(1 + v)) ≤ 1, δv passes to L at most unchanged; rounding 1 + v
//! costs ≤ u absolute in L, ≤ 1.45 u relative because the loop takes only v ≥ 1 (L ≥ ln 2);
//! the kernel (s to 2 u, the three additions, truncation z⁵/11 ≤ 0.03 u) ≤ 2.6 u relative for
//! L ≥ ln 2 (measured 1.76 u by the unit test below). So δL ≤ 7.2 u, k1/L adds k1's rounding and the division (≤ 9.2 u relative on
//! T + k0), and the subtraction of k0 adds u·|k0| and the final rounding u·T:
//!
//! ```text
//! |ΔT| ≤ 9.2 u·(T + k0) + u·|k0| + u·T
//! ```
//!
//! The loop is used only where T + k0 ≤ 1200 K and |k0| ≤ 100 K, which caps this at
//! (11 040 + 100 + 1300)·u = 0.74 mK. If any pixel is outside that range (hotter, v < 1,
//! |d| < 1/16 — where the valid/invalid decision is close — or T < 1 K), the whole frame is
//! converted again by the f64 loop (one pass; cheaper in code than redoing single pixels), so
//! the frame stays within 1 mK; frames whose constants do not fit (|r0| ≥ 2¹⁷, |k0| > 100 K,
//! constants outside the normal f32 range) take the f64 loop directly. Invalid pixels
//! (d ≤ −1/16: at or below the background) are decided as in the f64 loop. The sweep test `frame_f32_path_error_bound_sweep`
//! (every count 0..=65535, an 8–14 µm curve over 200–1500 K and a 0.65 µm curve over
//! 500–3500 K in several gains, background counts inside, near and outside the count range) measured a maximum
//! of 0.21 mK against the exact closed-form inverse.
//!
//! f32 signals (f32 → f32 output, no emissivity map) take the same loop with other constants:
//! r0_hi = r0 rounded to f32, r0_lo = (r0 − r0_hi) rounded to f32 (r0 − r0_hi is exact in f64),
//! and a fallback margin μ relative to |r0| instead of the 1/16 count. Raw is any f32 now, so
//! raw − r0_hi is no longer exact. With d = raw − r0 the true value, |r0 − r0_hi| ≤ u·|r0|,
//! |r0_lo − (r0 − r0_hi)| ≤ u²·|r0| (+2⁻¹⁵⁰ if subnormal), and one rounding per subtraction
//! (raw − r0_hi = d + (r0 − r0_hi), so its rounding is ≤ u·(|d| + u·|r0|), whatever |raw|):
//!
//! ```text
//! |d̂ − d| ≤ 2u·|d| + 2u²·|r0|     (first order)
//! δd ≤ 2u + 2u·(u·|r0|/|d|) ≤ 2.002 u   for |d̂| ≥ μ = max(2⁻¹⁴·|r0|, 2⁻¹²⁰·ia, 2⁻¹²⁵)
//! ```
//!
//! (the f64 r0 = −β/α adds ~1e-16·|r0|/|d| ≤ 0.001 u). The other two terms of μ keep
//! v = ia/d ≤ 2¹²⁰ (finite, so ln32 applies) and d a normal f32. Then δv ≤ 4.002 u, δL ≤ 8.1 u,
//! the division by L ≤ 10.1 u on T + k0, and with the same T + k0 ≤ 1200 K, |k0| ≤ 100 K limits
//!
//! ```text
//! |ΔT| ≤ 10.1 u·(T + k0) + u·|k0| + u·T ≤ (12 120 + 100 + 1300)·u = 0.81 mK
//! ```
//!
//! A pixel with |d̂| < μ, T + k0 > 1200 K, T < 1 K or raw = +∞ sends the frame to the f64 loop;
//! d̂ ≤ −μ (then d < 0: at or below the background), NaN and −∞ are invalid as in the f64 loop
//! (|d̂ − d| ≪ μ, so the decision agrees with it). Constants outside the normal f32 range
//! (|r0|, 1/α, k1, |k0| above 1e30 or nonzero below 1e-30) send every frame to the f64 loop. A
//! large background can leave the signal of a cold object below the f32 resolution of raw: such
//! pixels are within μ of r0 and fall back; f32 input cannot carry them anyway. The sweep test
//! `frame_f32_signals_error_bound_sweep` (10⁶ log-spaced signals per setting plus values at the
//! margins; an 8–14 µm curve over 200–1500 K and a 0.65 µm curve over 500–3500 K, 8
//! emissivity/reflected/path/gain/offset settings with r0 positive, zero and negative) measured
//! a maximum of 0.21 mK against the exact closed-form inverse.
//!
//! The loops are branch-free (invalid pixels are computed on a substitute value and replaced by
//! NaN with a select) so LLVM can vectorise them. The summary's minimum and maximum come from a
//! second pass over the output on the integer bit patterns (positive floats order like their
//! bits; NaN sorts above +∞), which vectorises where float min/max reductions do not (the
//! single-precision loop takes them in the same loop, on i32 lanes).
//!
//! The single-precision loop runs over blocks of 256 pixels: raw values are copied into the
//! block (counts converted to f32, exactly) and the block is padded with NaN, which is neutral
//! (invalid, not counted, no fallback). The package's wasm build optimises for size, and at that
//! level LLVM's loop vectoriser is off, so on wasm32 with simd128 the block loop is written with
//! the simd128 intrinsics, four lanes per operation; it performs the scalar loop's f32
//! operations in the same order (no fused multiply–add in either), so it gives the same bits.
//! Other targets run the scalar loop, which LLVM vectorises at the release optimisation level.
//!
//! Per-pixel corrections ([`FrameConverter::convert_corrected`], [`PixelCorrections`]): a
//! non-uniformity correction raw′ = g_i·raw + o_i per pixel ahead of the frame's gain and
//! offset, an emissivity map and a bad-pixel mask. Without any correction the call is
//! [`FrameConverter::convert`]; a mask alone keeps the single-precision loop (masked pixels are
//! fed to it as NaN, which it already treats as invalid without a fallback); a gain, offset or
//! emissivity map takes the f64 loop with the corrected value in place of raw (same formula,
//! same error bound for the corrected signal).
//!
//! Invalid pixels — a non-finite input, a signal at or below the background the reflected,
//! path and window terms give (no physical solution), an emissivity outside (0, 1], or a result
//! that is not a positive finite temperature — become NaN and are counted in [`FrameSummary`].
//!
//! Cautions: a thermal image converted this way is a calculation from the given emissivity and
//! conditions; it is not a substitute for a calibrated instrument and standard procedures, and
//! must not be used for medical or fever screening.
#![forbid(unsafe_code)]
// Non-short-circuit `&` of comparisons keeps the pixel loop branch-free (vectorisable).
#![allow(clippy::manual_range_contains)]

use super::measurement::Conditions;
use super::model::SignalModel;
use super::sakuma_hattori::SakumaHattori;
use crate::error::finite;
use crate::{Error, Result};

/// A pixel type that frames can be read from (`u16` counts, `f32`, `f64`). Sealed.
pub trait FrameInput: Copy + sealed::Sealed {
    /// The value as f64.
    fn to_f64(self) -> f64;
}
/// A pixel type that temperatures can be written to (`f32`, `f64`). Sealed.
pub trait FrameOutput: Copy + sealed::Sealed {
    /// From an f64 temperature (rounded to nearest; for `f32` a temperature above `f32::MAX`,
    /// about 3.4e38 K, becomes +∞ and one below the f32 range 0, both still counted valid).
    fn from_f64(v: f64) -> Self;
    /// Smallest and largest non-NaN value of a slice of non-negative values and NaN (as f64).
    fn min_max(values: &[Self]) -> (f64, f64);
}

mod sealed {
    /// Private dispatch: the `u16` → `f32` and `f32` → `f32` pairs take the single-precision
    /// pixel loop.
    pub trait Sealed: Sized {
        fn as_counts(_s: &[Self]) -> Option<&[u16]> {
            None
        }
        fn as_f32(_s: &[Self]) -> Option<&[f32]> {
            None
        }
        fn as_f32_mut(_s: &mut [Self]) -> Option<&mut [f32]> {
            None
        }
    }
    impl Sealed for u16 {
        fn as_counts(s: &[Self]) -> Option<&[u16]> {
            Some(s)
        }
    }
    impl Sealed for f32 {
        fn as_f32(s: &[Self]) -> Option<&[f32]> {
            Some(s)
        }
        fn as_f32_mut(s: &mut [Self]) -> Option<&mut [f32]> {
            Some(s)
        }
    }
    impl Sealed for f64 {}
}

impl FrameInput for u16 {
    #[inline(always)]
    fn to_f64(self) -> f64 {
        // Exact: 2^52 + x has x in its mantissa. Written with bits so it vectorises (wasm has
        // no 64-bit integer to float lane conversion).
        f64::from_bits(TWO52_BITS | u64::from(self)) - TWO52
    }
}
impl FrameInput for f32 {
    #[inline(always)]
    fn to_f64(self) -> f64 {
        f64::from(self)
    }
}
impl FrameInput for f64 {
    #[inline(always)]
    fn to_f64(self) -> f64 {
        self
    }
}
// Non-negative floats order like their bit patterns; the positive NaN the loop writes has bits
// above +∞, so an integer minimum skips it and the maximum masks it out.
impl FrameOutput for f32 {
    #[inline(always)]
    fn from_f64(v: f64) -> Self {
        v as f32
    }
    fn min_max(values: &[Self]) -> (f64, f64) {
        let mut lo = i32::MAX;
        let mut hi = 0i32;
        for v in values {
            let b = v.to_bits() as i32;
            lo = lo.min(b);
            hi = hi.max(if b <= 0x7f80_0000 { b } else { 0 });
        }
        (
            f64::from(f32::from_bits(lo as u32)),
            f64::from(f32::from_bits(hi as u32)),
        )
    }
}
impl FrameOutput for f64 {
    #[inline(always)]
    fn from_f64(v: f64) -> Self {
        v
    }
    fn min_max(values: &[Self]) -> (f64, f64) {
        let mut lo = i64::MAX;
        let mut hi = 0i64;
        for v in values {
            let b = v.to_bits() as i64;
            lo = lo.min(b);
            hi = hi.max(if b <= 0x7ff0_0000_0000_0000 { b } else { 0 });
        }
        (f64::from_bits(lo as u64), f64::from_bits(hi as u64))
    }
}

/// Counts of a converted frame (pixel counts, and the temperature range of the valid pixels
/// in K), returned by [`FrameConverter::convert`] and [`FrameConverter::convert_with_emissivity`].
///
/// # Examples
/// ```
/// use quantaband::thermometry::frame::FrameConverter;
/// use quantaband::thermometry::measurement::Conditions;
/// use quantaband::thermometry::sakuma_hattori::SakumaHattori;
/// let curve = SakumaHattori::new(1.0e-5, 1.8e-4, 1.0e6, Default::default()).unwrap();
/// let conv = FrameConverter::new(&curve, &Conditions::BLACKBODY, 1.0, 0.0).unwrap();
/// let raw = [f64::NAN, 2.0e4, 3.0e4];
/// let mut out = [0f64; 3];
/// let sum = conv.convert(&raw, &mut out).unwrap();
/// // every pixel is counted once; the range spans the valid pixels only
/// assert_eq!((sum.valid, sum.invalid), (2, 1));
/// assert_eq!((sum.min_temperature_k, sum.max_temperature_k), (out[1], out[2]));
/// ```
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct FrameSummary {
    /// Pixels converted to a temperature.
    pub valid: usize,
    /// Pixels set to NaN (non-finite input, at/below background, bad emissivity).
    pub invalid: usize,
    /// Lowest temperature among valid pixels, K (NaN if none is valid).
    pub min_temperature_k: f64,
    /// Highest temperature among valid pixels, K (NaN if none is valid; +∞ for an `f32` output
    /// with a pixel above `f32::MAX`, see [`FrameOutput::from_f64`]).
    pub max_temperature_k: f64,
}

/// Per-pixel corrections for [`FrameConverter::convert_corrected`]: a non-uniformity
/// correction (gain and offset per pixel, applied to the raw value before the frame's
/// count-to-signal gain and offset), a per-pixel emissivity map and a bad-pixel mask. Every
/// map that is `Some` must be as long as the frame. Maps are `f32` by default (any
/// [`FrameInput`] type works).
///
/// # Formula
/// ```text
/// raw′_i    = g_i·raw_i + o_i                 (g_i = 1, o_i = 0 without a NUC map)
/// signal_i  = gain·raw′_i + offset            (the converter's gain and offset)
/// T_i       = as FrameConverter::convert (or convert_with_emissivity with ε_i); NaN if mask_i ≠ 0
/// ```
///
/// # Examples
/// ```
/// use quantaband::thermometry::frame::{FrameConverter, PixelCorrections};
/// use quantaband::thermometry::measurement::Conditions;
/// use quantaband::thermometry::sakuma_hattori::SakumaHattori;
/// let curve = SakumaHattori::new(1.0e-5, 1.8e-4, 1.0e6, Default::default()).unwrap();
/// let conv = FrameConverter::new(&curve, &Conditions::BLACKBODY, 1.0, 0.0).unwrap();
/// let raw = [20000.0f64, 20000.0, 20000.0];
/// let gain = [1.0f32, 1.05, 1.0];
/// let bad = [0u8, 0, 1];
/// let corr = PixelCorrections { gain: Some(&gain[..]), bad_pixels: Some(&bad[..]), ..PixelCorrections::NONE };
/// let mut out = [0f64; 3];
/// let sum = conv.convert_corrected(&raw, &corr, &mut out).unwrap();
/// assert_eq!((sum.valid, sum.invalid), (2, 1));
/// assert!(out[1] > out[0] && out[2].is_nan());
/// ```
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PixelCorrections<'a, P: FrameInput = f32> {
    /// Per-pixel gain g_i of the non-uniformity correction (dimensionless).
    pub gain: Option<&'a [P]>,
    /// Per-pixel offset o_i of the non-uniformity correction, in raw units.
    pub offset: Option<&'a [P]>,
    /// Per-pixel emissivity ε_i in (0, 1] replacing the scalar emissivity (pixels outside
    /// (0, 1] become invalid).
    pub emissivity: Option<&'a [P]>,
    /// Bad-pixel mask: a nonzero entry marks a pixel to be set to NaN and counted invalid.
    pub bad_pixels: Option<&'a [u8]>,
}

impl<P: FrameInput> PixelCorrections<'_, P> {
    /// No correction at all: [`FrameConverter::convert_corrected`] is then
    /// [`FrameConverter::convert`].
    pub const NONE: Self = PixelCorrections {
        gain: None,
        offset: None,
        emissivity: None,
        bad_pixels: None,
    };
}

impl<P: FrameInput> Default for PixelCorrections<'_, P> {
    fn default() -> Self {
        Self::NONE
    }
}

const LN2: f64 = core::f64::consts::LN_2;
/// bits of √½ (rounded): subtracting them makes the exponent field of w the k of w = 2^k·m.
const SQRT_HALF_BITS: u64 = 0x3fe6_a09e_667f_3bcd;
/// 2^52 as f64 bits: OR-ing a small integer into the mantissa and subtracting 2^52 converts it.
const TWO52_BITS: u64 = 0x4330_0000_0000_0000;
const TWO52: f64 = 4_503_599_627_370_496.0;

/// Natural logarithm for w ≥ 1 (finite), relative error ≤ 5.2e-11 plus a few ulp (see the module
/// docs); branch-free lane arithmetic so that it vectorises.
///
/// # Formula
/// ```text
/// w = 2^k·m, m ∈ [√½, √2);  s = (m − 1)/(m + 1),  z = s²
/// ln w ≈ k·ln 2 + 2s·(1 + z/3 + z²/5 + z³/7 + z⁴/9 + z⁵/11)
/// ```
///
/// # Errors
/// None; the result is meaningless for w < √½ or non-finite w (the frame loop never passes
/// such values).
///
/// # Accuracy
/// Truncation ≤ z⁶/(13(1 − z)) ≤ 5.2e-11 relative; the measured maximum relative error over
/// w ∈ [1 + 1e-12, 1e300] is stated in `tests/thermometry_frame.rs`.
///
/// # Examples
/// ```
/// use quantaband::thermometry::frame::fast_ln;
/// assert!((fast_ln(10.0) / 10f64.ln() - 1.0).abs() < 1e-10);
/// ```
///
/// # References
/// Range reduction with an exponent offset of √½ as in FreeBSD/musl `log` — from memory;
/// series ln m = 2·atanh((m − 1)/(m + 1)): Abramowitz & Stegun 4.1.27.
#[inline(always)]
pub fn fast_ln(w: f64) -> f64 {
    let bits = w.to_bits();
    // For w ≥ √½ the difference is non-negative, so a logical shift gives k.
    let k = bits.wrapping_sub(SQRT_HALF_BITS) >> 52;
    let m = f64::from_bits(bits.wrapping_sub(k << 52));
    let kf = f64::from_bits(TWO52_BITS | k) - TWO52;
    let f = m - 1.0;
    let s = f / (2.0 + f);
    let z = s * s;
    let p = 1.0
        + z * (1.0 / 3.0 + z * (1.0 / 5.0 + z * (1.0 / 7.0 + z * (1.0 / 9.0 + z * (1.0 / 11.0)))));
    kf * LN2 + 2.0 * s * p
}

/// Per-frame constants of the conversion (see the module docs for the formula, the error bound
/// and its measurement). Build once per frame (or whenever the conditions change) and convert
/// any number of frames; construction and use are shown at [`FrameConverter::new`].
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct FrameConverter {
    alpha: f64,
    beta: f64,
    k1: f64,
    k0: f64,
    // emissivity-map form: num = ck·ε, den = g·raw + o_minus_b0 + ks_r·ε
    ck: f64,
    gain: f64,
    o_minus_b0: f64,
    ks_r: f64,
    background: f64,
}

/// Per-frame constants of the single-precision pixel loop: v = ia/((raw − r0_hi) − r0_lo),
/// T = k1/ln(1 + v) − k0, with r0 = −β/α the raw value at which the signal equals the
/// background.
#[derive(Debug, Clone, Copy, PartialEq)]
struct Fast32 {
    r0_hi: f32,
    r0_lo: f32,
    /// Pixels with |d| below this fall back to f64 (sign and precision of d = raw − r0).
    margin: f32,
    ia: f32,
    k1: f32,
    k0: f32,
    /// Smallest ln(1 + v) taken in f32: T + k0 ≤ [`F32_SUM_LIMIT_K`] and v ≥ 1.
    l_min: f32,
}

/// Largest T + k0 (K) converted in f32; hotter pixels fall back to f64 (see the module docs).
const F32_SUM_LIMIT_K: f64 = 1200.0;
/// Largest |k0| (K) for which the f32 loop is used.
const F32_K0_LIMIT_K: f64 = 100.0;
/// Counts: pixels with |raw − r0| below this (counts) fall back to f64 (sign and precision).
const F32_COUNT_MARGIN: f64 = 0.0625;
/// f32 signals: pixels with |raw − r0| below this fraction of |r0| fall back to f64.
const F32_REL_MARGIN: f64 = 1.0 / 16384.0;
const NAN32_BITS: u32 = 0x7fc0_0000;
/// √½ as f32 bits, and ln 2 split so that k·LN2_HI32 is exact for |k| < 128 (fdlibm's split).
const SQRT_HALF_BITS32: u32 = 0x3f35_04f3;
const LN2_HI32: f32 = f32::from_bits(0x3f31_7180);
const LN2_LO32: f32 = f32::from_bits(0x3717_f7d1);

/// Single-precision ln for w ≥ 1 (finite, w < 2¹²⁸): 2^k·m split, ln m = 2·atanh(s) to z⁴/9.
#[cfg(not(all(target_arch = "wasm32", target_feature = "simd128")))]
#[inline(always)]
fn ln32(w: f32) -> f32 {
    let bits = w.to_bits();
    let k = (bits.wrapping_sub(SQRT_HALF_BITS32) as i32) >> 23;
    let m = f32::from_bits(bits.wrapping_sub((k as u32) << 23));
    let kf = k as f32;
    let f = m - 1.0;
    let s = f / (2.0 + f);
    let z = s * s;
    let p = z * (1.0 / 3.0 + z * (1.0 / 5.0 + z * (1.0 / 7.0 + z * (1.0 / 9.0))));
    // 2s + 2s·p keeps the leading term exact-ish; the split ln 2 avoids its rounding.
    let two_s = s + s;
    kf * LN2_HI32 + (two_s + (two_s * p + kf * LN2_LO32))
}

impl Fast32 {
    /// The constants for u16 counts (`counts`) or for f32 signals; None when they do not fit
    /// the loop's preconditions (module docs).
    fn new(alpha: f64, beta: f64, k1: f64, k0: f64, counts: bool) -> Option<Fast32> {
        let r0 = -beta / alpha;
        let ia = 1.0 / alpha;
        let ok32 = |v: f64| v.is_finite() && v.abs() < 1e30 && (v == 0.0 || v.abs() > 1e-30);
        let fits = ok32(r0) && ok32(ia) && ia > 0.0 && ok32(k1) && ok32(k0) && k1 > 0.0;
        if !(fits && k0.abs() <= F32_K0_LIMIT_K) {
            return None;
        }
        let (r0_hi, margin) = if counts {
            // Counts are < 2¹⁶: with r0_hi a multiple of 2⁻⁶ and |r0_hi| < 2¹⁷, raw − r0_hi is
            // exact.
            if !(r0.abs() < 131_072.0) {
                return None;
            }
            (crate::float::round(r0 * 64.0) / 64.0, F32_COUNT_MARGIN)
        } else {
            // r0 to f32 (r0 − r0_hi is then exact in f64); the margin keeps |d| ≥ 2⁻¹⁴·|r0|,
            // v = ia/d ≤ 2¹²⁰ and d a normal f32.
            let m = (F32_REL_MARGIN * r0.abs()).max(ia * 7.52e-37).max(2.36e-38);
            (f64::from(r0 as f32), m)
        };
        let r0_lo = r0 - r0_hi;
        Some(Fast32 {
            r0_hi: r0_hi as f32,
            r0_lo: r0_lo as f32,
            margin: margin as f32,
            ia: ia as f32,
            k1: k1 as f32,
            k0: k0 as f32,
            // and ln(1 + v) ≥ ln 2 (v ≥ 1), so rounding 1 + v costs ≤ 1.45 u of L
            l_min: (k1 / F32_SUM_LIMIT_K).max(0.6932) as f32,
        })
    }
}

impl FrameConverter {
    /// Prepares the conversion of raw values with signal = `gain`·raw + `offset` (use 1 and 0 for
    /// frames that already hold signals in the curve's unit) through `curve` under
    /// `conditions`.
    ///
    /// # Formula
    /// ```text
    /// signal = gain·raw + offset;   signal = a·S(T_obj) + b  (Conditions::affine with the curve)
    /// ```
    ///
    /// # Errors
    /// `NonFinite` for gain/offset; `NonPositive` for gain ≤ 0; as [`Conditions::validate`];
    /// errors of the curve at the background temperatures.
    ///
    /// # Accuracy
    /// See the module docs.
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::frame::FrameConverter;
    /// use quantaband::thermometry::measurement::Conditions;
    /// use quantaband::thermometry::model::SignalModel;
    /// use quantaband::thermometry::sakuma_hattori::SakumaHattori;
    /// // an invented 8–14 µm microbolometer core: 0.01 signal units per count, offset −100
    /// let curve = SakumaHattori::new(1.0e-5, 1.8e-4, 1.0e6, Default::default()).unwrap();
    /// let conv = FrameConverter::new(&curve, &Conditions::BLACKBODY, 0.01, -100.0).unwrap();
    /// let counts: [u16; 3] = [0, 20000, 40000];
    /// let mut out = [0f32; 3];
    /// let sum = conv.convert(&counts, &mut out).unwrap();
    /// assert_eq!((sum.valid, sum.invalid), (2, 1)); // count 0 gives a negative signal
    /// assert!(out[0].is_nan());
    /// let t = curve.temperature(0.01 * 20000.0 - 100.0).unwrap();
    /// assert!((out[1] as f64 - t).abs() < 1e-3);
    /// ```
    ///
    /// # References
    /// See the module docs.
    pub fn new(
        curve: &SakumaHattori,
        conditions: &Conditions,
        gain: f64,
        offset: f64,
    ) -> Result<Self> {
        crate::error::positive("gain", gain)?;
        finite("offset", offset)?;
        // The background terms through the trait object: the same compiled code as for any
        // other signal model (once per frame, not per pixel).
        let model: &dyn SignalModel = curve;
        let (a, b) = conditions.affine(model)?;
        let c = curve.c();
        let alpha = gain / (c * a);
        let beta = (offset - b) / (c * a);
        let k1 = curve.c2_mk() / curve.a_m();
        let k0 = curve.b_mk() / curve.a_m();
        // Emissivity-map form: K = τ_w·τ, the background at ε = 0 and the reflected-term slope.
        let unit_eps = Conditions {
            emissivity: 1.0,
            ..*conditions
        };
        let (k_gain, _) = unit_eps.affine(model)?; // = τ_w·τ
        let s_r = model.signal(conditions.reflected_temperature_k)?;
        let b0 = b + a * s_r; // b(ε) = b0 − K·ε·S_r, and a = K·ε
        let ck = c * k_gain;
        let ks_r = k_gain * s_r;
        if ![alpha, beta, k1, k0, ck, b0, ks_r]
            .iter()
            .all(|v| v.is_finite())
        {
            return Err(Error::NoSolution {
                what: "frame constants overflow: gain/(C*emissivity*transmittance) out of the f64 range",
            });
        }
        Ok(FrameConverter {
            alpha,
            beta,
            k1,
            k0,
            ck,
            gain,
            o_minus_b0: offset - b0,
            ks_r,
            background: b,
        })
    }

    /// The background signal b (reflected, path and window terms) for the frame's scalar
    /// emissivity, in the curve's unit (the signal unit of its parameter C).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::frame::FrameConverter;
    /// use quantaband::thermometry::measurement::Conditions;
    /// use quantaband::thermometry::sakuma_hattori::SakumaHattori;
    /// let curve = SakumaHattori::new(1.0e-5, 1.8e-4, 1.0e6, Default::default()).unwrap();
    /// // a blackbody in vacuum has no reflected or path term
    /// let conv = FrameConverter::new(&curve, &Conditions::BLACKBODY, 1.0, 0.0).unwrap();
    /// assert_eq!(conv.background(), 0.0);
    /// ```
    pub fn background(&self) -> f64 {
        self.background
    }

    /// T = k1/ln(1 + num/den) − k0 for one pixel, and whether it is valid.
    #[inline(always)]
    fn finish(&self, num: f64, den: f64, ok: bool) -> (f64, bool) {
        // Substitute a harmless value for invalid pixels so the arithmetic stays branch-free.
        let w = if ok { 1.0 + num / den } else { 2.0 };
        let t = self.k1 / fast_ln(w) - self.k0;
        let ok = ok & (t > 0.0) & (t < f64::INFINITY);
        (t, ok)
    }

    /// Converts a frame with the scalar conditions given to [`FrameConverter::new`]; `out_k`
    /// (same length) receives temperatures in K, NaN for invalid pixels.
    ///
    /// # Formula
    /// See the module docs.
    ///
    /// # Errors
    /// `LengthMismatch` if `out_k` and `raw` differ in length.
    ///
    /// # Accuracy
    /// |ΔT| ≤ 1e-10·(T + B/A) for x = c2/(A·T + B) ≥ 0.05, plus the output rounding (module
    /// docs); u16 counts into f32 take the single-precision loop, |ΔT| ≤ 0.74 mK (module docs;
    /// measured maximum 0.21 mK), and f32 signals into f32 too, |ΔT| ≤ 0.81 mK (measured
    /// maximum 0.21 mK). All measured in `tests/thermometry_frame.rs`.
    ///
    /// # Examples
    /// See [`FrameConverter::new`].
    ///
    /// # References
    /// See the module docs.
    pub fn convert<I: FrameInput, O: FrameOutput>(
        &self,
        raw: &[I],
        out_k: &mut [O],
    ) -> Result<FrameSummary> {
        if raw.len() != out_k.len() {
            return Err(Error::LengthMismatch {
                expected: raw.len(),
                got: out_k.len(),
            });
        }
        if let Some(out) = O::as_f32_mut(out_k) {
            let fast = match (I::as_counts(raw), I::as_f32(raw)) {
                (None, None) => None,
                (c, s) => self.convert_f32(c.unwrap_or(&[]), s.unwrap_or(&[]), out),
            };
            if let Some(sum) = fast {
                return Ok(sum);
            }
        }
        let n = raw.len();
        Ok(drive::<O, _, false>(
            out_k,
            |i| self.pixel64(raw[i].to_f64()),
            n,
        ))
    }

    /// The f64 pixel of [`FrameConverter::convert`].
    #[inline(always)]
    fn pixel64(&self, raw: f64) -> (f64, bool) {
        let den = self.alpha * raw + self.beta;
        // den below the normal range means S_obj ≤ 2.2e-308·C: treated as no signal.
        let ok = (den >= f64::MIN_POSITIVE) & (den < f64::INFINITY);
        self.finish(1.0, den, ok)
    }

    /// u16 counts (`counts`, with `signals` empty) or f32 signals → f32 kelvin in single
    /// precision (4 lanes of simd128), when every pixel is inside the f32 loop's proven range
    /// (module docs). `None` (the output then holds nothing usable) when the frame constants do
    /// not suit the f32 loop or a pixel needs f64; the caller then takes the f64 loop. Slices of
    /// unequal length are cut to the shorter.
    #[inline(never)]
    pub(crate) fn convert_f32(
        &self,
        counts: &[u16],
        signals: &[f32],
        out: &mut [f32],
    ) -> Option<FrameSummary> {
        self.convert_f32_masked(counts, signals, &[], out)
    }

    /// [`FrameConverter::convert_f32`] with a bad-pixel mask (`mask`, nonzero = bad; empty for
    /// none, else as long as the input): masked pixels enter the loop as NaN, which the loop
    /// treats as invalid without a fallback, so a mask keeps the single-precision loop.
    fn convert_f32_masked(
        &self,
        counts: &[u16],
        signals: &[f32],
        mask: &[u8],
        out: &mut [f32],
    ) -> Option<FrameSummary> {
        let f = Fast32::new(self.alpha, self.beta, self.k1, self.k0, signals.is_empty())?;
        lanes32(&f, counts, signals, mask, out)
    }

    /// Converts a frame with a per-pixel emissivity map (`emissivity`, same length as `raw`)
    /// replacing the scalar emissivity; the other conditions stay per-frame.
    ///
    /// # Formula
    /// ```text
    /// num_i = C·K·ε_i,  den_i = g·raw_i + (o − b0) + K·S(T_refl)·ε_i,   K = τ_w·τ
    /// T_i = k1/(ln(den_i + num_i) − ln(den_i)) − k0
    /// ```
    ///
    /// # Errors
    /// `LengthMismatch` if the three slices differ in length. Pixels with ε outside (0, 1] are
    /// invalid (NaN), not an error.
    ///
    /// # Accuracy
    /// As [`FrameConverter::convert`].
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::frame::FrameConverter;
    /// use quantaband::thermometry::measurement::{object_temperature, Conditions};
    /// use quantaband::thermometry::sakuma_hattori::SakumaHattori;
    /// let curve = SakumaHattori::new(1.0e-5, 1.8e-4, 1.0e6, Default::default()).unwrap();
    /// let cond = Conditions { reflected_temperature_k: 300.0, ..Conditions::BLACKBODY };
    /// let conv = FrameConverter::new(&curve, &cond, 1.0, 0.0).unwrap();
    /// let raw = [20000.0f64, 20000.0];
    /// let eps = [0.9f32, 1.5];
    /// let mut out = [0f64; 2];
    /// let sum = conv.convert_with_emissivity(&raw, &eps, &mut out).unwrap();
    /// assert_eq!(sum.invalid, 1);
    /// let exact = object_temperature(&curve, 20000.0, &Conditions { emissivity: 0.9f32 as f64, ..cond }).unwrap();
    /// assert!((out[0] - exact).abs() < 1e-4);
    /// ```
    ///
    /// # References
    /// See the module docs.
    pub fn convert_with_emissivity<I: FrameInput, E: FrameInput, O: FrameOutput>(
        &self,
        raw: &[I],
        emissivity: &[E],
        out_k: &mut [O],
    ) -> Result<FrameSummary> {
        if emissivity.len() != raw.len() {
            return Err(Error::LengthMismatch {
                expected: raw.len(),
                got: emissivity.len(),
            });
        }
        if raw.len() != out_k.len() {
            return Err(Error::LengthMismatch {
                expected: raw.len(),
                got: out_k.len(),
            });
        }
        let n = raw.len();
        Ok(drive::<O, _, true>(
            out_k,
            |i| {
                let eps = emissivity[i].to_f64();
                let den = self.gain * raw[i].to_f64() + self.o_minus_b0 + self.ks_r * eps;
                let num = self.ck * eps;
                let ok = (eps > 0.0)
                    & (eps <= 1.0)
                    & (den >= f64::MIN_POSITIVE)
                    & (den < f64::INFINITY)
                    & (num >= f64::MIN_POSITIVE);
                self.finish(num, den, ok)
            },
            n,
        ))
    }
}

impl FrameConverter {
    /// Converts a frame with per-pixel corrections (non-uniformity gain and offset, emissivity
    /// map, bad-pixel mask; see [`PixelCorrections`]); `out_k` (same length as `raw`) receives
    /// temperatures in K, NaN for invalid and masked pixels (counted as invalid).
    ///
    /// Which loop runs: without any correction this gives what [`FrameConverter::convert`] gives (u16
    /// counts or f32 signals into f32 take the single-precision simd128 loop); with a mask
    /// only, those frames still take it (masked pixels enter as NaN, which the loop treats as
    /// invalid); with a gain, offset or emissivity map, the f64 loop.
    ///
    /// # Formula
    /// ```text
    /// den_i = α·(g_i·raw_i + o_i) + β,  T_i = k1/ln(1 + 1/den_i) − k0          (scalar ε)
    /// den_i = g·(g_i·raw_i + o_i) + (o − b0) + K·S(T_refl)·ε_i,  num_i = C·K·ε_i  (ε map)
    /// T_i   = k1/ln(1 + num_i/den_i) − k0;   T_i = NaN where mask_i ≠ 0
    /// ```
    /// (symbols of the module docs and [`FrameConverter::convert_with_emissivity`]).
    ///
    /// # Errors
    /// `LengthMismatch` if `out_k` or a map that is `Some` differs in length from `raw`.
    /// Pixels with a non-finite input, gain or offset, an emissivity outside (0, 1] or a
    /// signal at or below the background become NaN (not errors).
    ///
    /// # Accuracy
    /// As [`FrameConverter::convert`] for the corrected signal g·(g_i·raw_i + o_i) + o: the f64
    /// loop ≤ 1e-10·(T + B/A); masked-only u16/f32 frames into f32 ≤ 0.74 / 0.81 mK (module
    /// docs). Measured against the exact closed-form inverse per pixel in
    /// `tests/thermometry_frame_corrections.rs`.
    ///
    /// # Examples
    /// See [`PixelCorrections`].
    ///
    /// # References
    /// Two-point non-uniformity correction of focal-plane arrays: D. L. Perry, E. L. Dereniak,
    /// "Linear theory of nonuniformity correction in infrared staring sensors", Opt. Eng. 32,
    /// 1854–1859 (1993) — from memory.
    pub fn convert_corrected<I: FrameInput, P: FrameInput, O: FrameOutput>(
        &self,
        raw: &[I],
        corrections: &PixelCorrections<'_, P>,
        out_k: &mut [O],
    ) -> Result<FrameSummary> {
        let n = raw.len();
        let check = |len: Option<usize>| match len {
            Some(got) if got != n => Err(Error::LengthMismatch { expected: n, got }),
            _ => Ok(()),
        };
        check(corrections.gain.map(<[P]>::len))?;
        check(corrections.offset.map(<[P]>::len))?;
        check(corrections.emissivity.map(<[P]>::len))?;
        check(corrections.bad_pixels.map(<[u8]>::len))?;
        check(Some(out_k.len()))?;
        let PixelCorrections {
            gain,
            offset,
            emissivity,
            bad_pixels,
        } = *corrections;
        if gain.is_none() && offset.is_none() && emissivity.is_none() {
            // No map (a mask or nothing): the single-precision loop where it applies.
            if let Some(out) = O::as_f32_mut(out_k) {
                let fast = match (I::as_counts(raw), I::as_f32(raw)) {
                    (None, None) => None,
                    (c, s) => self.convert_f32_masked(
                        c.unwrap_or(&[]),
                        s.unwrap_or(&[]),
                        bad_pixels.unwrap_or(&[]),
                        out,
                    ),
                };
                if let Some(sum) = fast {
                    return Ok(sum);
                }
            }
        }
        // Otherwise one f64 loop per emissivity case; with no correction at all it computes
        // what `convert` does (1·raw + 0 is raw, and every pixel is good), so the loop of
        // `convert` is not instantiated a second time here.
        let at = |m: Option<&[P]>, i: usize, default: f64| -> f64 {
            m.map_or(default, |m| m.get(i).map_or(f64::NAN, |v| v.to_f64()))
        };
        let good = |i: usize| bad_pixels.is_none_or(|b| b.get(i).is_some_and(|&b| b == 0));
        let corrected = |i: usize| -> f64 {
            let r = raw.get(i).map_or(f64::NAN, |v| v.to_f64());
            at(gain, i, 1.0) * r + at(offset, i, 0.0)
        };
        Ok(match emissivity {
            None => drive::<O, _, false>(
                out_k,
                |i| {
                    let den = self.alpha * corrected(i) + self.beta;
                    let ok = (den >= f64::MIN_POSITIVE) & (den < f64::INFINITY) & good(i);
                    self.finish(1.0, den, ok)
                },
                n,
            ),
            Some(e) => drive::<O, _, true>(
                out_k,
                |i| {
                    let eps = e.get(i).map_or(f64::NAN, |v| v.to_f64());
                    let den = self.gain * corrected(i) + self.o_minus_b0 + self.ks_r * eps;
                    let num = self.ck * eps;
                    let ok = (eps > 0.0)
                        & (eps <= 1.0)
                        & (den >= f64::MIN_POSITIVE)
                        & (den < f64::INFINITY)
                        & (num >= f64::MIN_POSITIVE)
                        & good(i);
                    self.finish(num, den, ok)
                },
                n,
            ),
        })
    }
}

/// Running totals of the single-precision loop: valid pixels, bit-pattern min/max of the
/// output, and whether a pixel needs the f64 loop.
struct Acc32 {
    valid: usize,
    lo: u32,
    hi: u32,
    redo: bool,
}

/// One pixel of the single-precision loop (module docs): the output bits (T or NaN), whether it
/// is valid, and whether it is decided invalid (at or below the background, or NaN).
#[cfg(not(all(target_arch = "wasm32", target_feature = "simd128")))]
#[inline(always)]
fn pixel32(f: &Fast32, x: f32) -> (u32, bool, bool) {
    let d = (x - f.r0_hi) - f.r0_lo;
    let v = f.ia / d;
    let l = ln32(1.0 + v);
    let t = f.k1 / l - f.k0;
    let bad = !(d > -f.margin);
    // (v ≥ 1 follows from l ≥ l_min; v ≤ 2¹²⁰ from d ≥ margin)
    let good = (d >= f.margin) & (l >= f.l_min) & (t >= 1.0);
    (if good { t.to_bits() } else { NAN32_BITS }, good, bad)
}

/// Block length (pixels) of the single-precision loop: raw values are copied (counts converted
/// exactly) into a block padded with NaN, which is neutral (invalid, not counted as a valid
/// pixel, no fallback, below nothing in the range), so the loop has no tail.
const BLOCK32: usize = 256;
/// A block of the single-precision loop, in groups of four lanes.
type Block32 = [[f32; 4]; BLOCK32 / 4];

/// The single-precision loop over one block.
#[cfg(not(all(target_arch = "wasm32", target_feature = "simd128")))]
#[inline(never)]
fn block32(f: &Fast32, raw: &Block32, out: &mut Block32, acc: &mut Acc32) {
    // local accumulators (u32 count and flag) keep the loop vectorisable
    let (mut valid, mut redo, mut lo, mut hi) = (0u32, 0u32, u32::MAX, 0u32);
    for (o, &x) in out.as_flattened_mut().iter_mut().zip(raw.as_flattened()) {
        let (bits, good, bad) = pixel32(f, x);
        *o = f32::from_bits(bits);
        valid += u32::from(good);
        redo |= u32::from(!good & !bad);
        // positive floats order like their bits; the NaN is above +∞ (module docs)
        lo = lo.min(bits);
        hi = hi.max(if good { bits } else { 0 });
    }
    acc.valid += valid as usize;
    acc.redo |= redo != 0;
    acc.lo = acc.lo.min(lo);
    acc.hi = acc.hi.max(hi);
}

/// `pixel32` over one block, four lanes at a time with wasm simd128 intrinsics, operation for
/// operation (so the results are bit-identical to the scalar loop the other targets run): the
/// package build optimises for size, which turns LLVM's loop vectoriser off.
#[cfg(all(target_arch = "wasm32", target_feature = "simd128"))]
#[inline(never)]
fn block32(f: &Fast32, raw: &Block32, out: &mut Block32, acc: &mut Acc32) {
    use core::arch::wasm32::*;
    let sp = f32x4_splat;
    let (r0_hi, r0_lo, ia, k1, k0) = (sp(f.r0_hi), sp(f.r0_lo), sp(f.ia), sp(f.k1), sp(f.k0));
    let (margin, neg_margin, l_min, one) = (sp(f.margin), sp(-f.margin), sp(f.l_min), sp(1.0));
    let (mut valid, mut redo) = (i32x4_splat(0), i32x4_splat(0));
    let (mut lo, mut hi) = (u32x4_splat(u32::MAX), u32x4_splat(0));
    for (o, r) in out.iter_mut().zip(raw) {
        let x = f32x4(r[0], r[1], r[2], r[3]);
        let d = f32x4_sub(f32x4_sub(x, r0_hi), r0_lo);
        let v = f32x4_div(ia, d);
        // ln32 on four lanes
        let w = f32x4_add(one, v);
        let k = i32x4_shr(i32x4_sub(w, u32x4_splat(SQRT_HALF_BITS32)), 23);
        let m = i32x4_sub(w, i32x4_shl(k, 23));
        let kf = f32x4_convert_i32x4(k);
        let fr = f32x4_sub(m, one);
        let s = f32x4_div(fr, f32x4_add(sp(2.0), fr));
        let z = f32x4_mul(s, s);
        let horner = |c: f32, p: v128| f32x4_mul(z, f32x4_add(sp(c), p));
        let p = horner(
            1.0 / 3.0,
            horner(1.0 / 5.0, horner(1.0 / 7.0, f32x4_mul(z, sp(1.0 / 9.0)))),
        );
        let two_s = f32x4_add(s, s);
        let tail = f32x4_add(f32x4_mul(two_s, p), f32x4_mul(kf, sp(LN2_LO32)));
        let l = f32x4_add(f32x4_mul(kf, sp(LN2_HI32)), f32x4_add(two_s, tail));
        let t = f32x4_sub(f32x4_div(k1, l), k0);
        let not_bad = f32x4_gt(d, neg_margin);
        let good = v128_and(
            v128_and(f32x4_ge(d, margin), f32x4_ge(l, l_min)),
            f32x4_ge(t, one),
        );
        let bits = v128_bitselect(t, u32x4_splat(NAN32_BITS), good);
        *o = [
            f32x4_extract_lane::<0>(bits),
            f32x4_extract_lane::<1>(bits),
            f32x4_extract_lane::<2>(bits),
            f32x4_extract_lane::<3>(bits),
        ];
        valid = i32x4_sub(valid, good); // good lanes are −1
        redo = v128_or(redo, v128_andnot(not_bad, good));
        lo = u32x4_min(lo, bits);
        hi = u32x4_max(hi, v128_and(bits, good));
    }
    let lanes = |v: v128| {
        [
            u32x4_extract_lane::<0>(v),
            u32x4_extract_lane::<1>(v),
            u32x4_extract_lane::<2>(v),
            u32x4_extract_lane::<3>(v),
        ]
    };
    for ((c, l), h) in lanes(valid).into_iter().zip(lanes(lo)).zip(lanes(hi)) {
        acc.valid += c as usize;
        acc.lo = acc.lo.min(l);
        acc.hi = acc.hi.max(h);
    }
    acc.redo |= v128_any_true(redo);
}

/// The single-precision loop (module docs) over u16 counts (`counts`) or f32 signals, block by
/// block; None if a pixel is outside the proven range (the caller then takes the f64 loop).
fn lanes32(
    f: &Fast32,
    counts: &[u16],
    signals: &[f32],
    mask: &[u8],
    out: &mut [f32],
) -> Option<FrameSummary> {
    let mut acc = Acc32 {
        valid: 0,
        lo: u32::MAX,
        hi: 0,
        redo: false,
    };
    let m = counts.len().max(signals.len()).min(out.len());
    let (mut inb, mut outb): (Block32, Block32) =
        ([[0.0; 4]; BLOCK32 / 4], [[0.0; 4]; BLOCK32 / 4]);
    // (`get` instead of indexing: the ranges are in bounds, and no panic path is linked)
    for (b, o) in out[..m].chunks_mut(BLOCK32).enumerate() {
        let (at, n) = (b * BLOCK32, o.len());
        let x = inb.as_flattened_mut();
        if let Some(c) = counts.get(at..at + n) {
            for (x, &c) in x.iter_mut().zip(c) {
                *x = f32::from(c); // exact
            }
        }
        if let (Some(x), Some(s)) = (x.get_mut(..n), signals.get(at..at + n)) {
            x.copy_from_slice(s);
        }
        // bad pixels: NaN is neutral in the loop (invalid, no fallback)
        if let (Some(x), Some(bad)) = (x.get_mut(..n), mask.get(at..at + n)) {
            for (x, &b) in x.iter_mut().zip(bad) {
                if b != 0 {
                    *x = f32::NAN;
                }
            }
        }
        if let Some(pad) = x.get_mut(n..) {
            pad.fill(f32::NAN);
        }
        block32(f, &inb, &mut outb, &mut acc);
        if let Some(t) = outb.as_flattened().get(..n) {
            o.copy_from_slice(t);
        }
    }
    // a pixel outside the f32 loop's range: the f64 loop takes the frame
    if acc.redo {
        return None;
    }
    if acc.valid == 0 {
        return Some(summary(m, 0, f64::NAN, f64::NAN));
    }
    let (lo, hi) = (f32::from_bits(acc.lo), f32::from_bits(acc.hi));
    Some(summary(m, acc.valid, f64::from(lo), f64::from(hi)))
}

/// Runs `pixel` over indices 0..n (n = out.len(), the inputs already checked to be as long),
/// writing T or NaN and counting valid pixels; then takes min/max in a second pass.
#[inline(always)]
fn drive<O: FrameOutput, F: Fn(usize) -> (f64, bool), const FUSED: bool>(
    out: &mut [O],
    pixel: F,
    n: usize,
) -> FrameSummary {
    let m = n.min(out.len());
    let out = &mut out[..m];
    let mut valid = 0usize;
    let (mut lo, mut hi) = (u64::MAX, 0u64);
    for (i, o) in out.iter_mut().enumerate() {
        let (t, ok) = pixel(i);
        *o = O::from_f64(if ok { t } else { f64::NAN });
        valid += usize::from(ok);
        if FUSED {
            // valid t are positive: they order like their bits
            let b = t.to_bits();
            lo = lo.min(if ok { b } else { u64::MAX });
            hi = hi.max(if ok { b } else { 0 });
        }
    }
    if valid == 0 {
        return summary(m, 0, f64::NAN, f64::NAN);
    }
    if !FUSED {
        let (lo, hi) = O::min_max(out);
        return summary(m, valid, lo, hi);
    }
    // rounding to the output type is monotone: the extremes of the output are the rounded
    // extremes, read back as f64 through `min_max`
    let (lo, _) = O::min_max(&[O::from_f64(f64::from_bits(lo))]);
    let (_, hi) = O::min_max(&[O::from_f64(f64::from_bits(hi))]);
    summary(m, valid, lo, hi)
}

fn summary(n: usize, valid: usize, lo: f64, hi: f64) -> FrameSummary {
    FrameSummary {
        valid,
        invalid: n - valid,
        min_temperature_k: lo,
        max_temperature_k: hi,
    }
}

#[cfg(all(test, feature = "std"))]
mod tests {
    use super::ln32;

    /// The f32 kernel against the platform f64 logarithm (`f64::ln`, an outside implementation,
    /// correctly rounded to within an ulp) for w ≥ 2, the only range the f32 loop uses: every
    /// 5th f32 in [2, 16), every 101st above up to 1e30. Bound from the module docs: 2.6 u.
    #[test]
    fn ln32_relative_error_within_bound() {
        let u = 2f64.powi(-24);
        let mut worst: f64 = 0.0;
        let mut b = 2f32.to_bits();
        while f32::from_bits(b) < 1e30 {
            let w = f32::from_bits(b);
            let e = (f64::from(ln32(w)) / f64::from(w).ln() - 1.0).abs() / u;
            worst = worst.max(e);
            b += if w < 16.0 { 5 } else { 101 };
        }
        std::println!("ln32: max relative error {worst} u");
        assert!(worst <= 2.6, "{worst} u");
    }
}
