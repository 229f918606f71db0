//! Optical throughput: projected solid angle of an aperture, étendue of a pixel or field stop,
//! focal-plane irradiance and the flux (power, photon rate…) on one pixel.
//!
//! # Method
//!
//! For a Lambertian scene of radiance L, the flux through an optical system is Φ = τ·L·G with
//! G the étendue (m²·sr) of the detector through the aperture: G = ∫∫ cos θ₁ cos θ₂ / s² dA₁ dA₂.
//! For an on-axis pixel of area A (small against the aperture and its distance) behind a
//! circular aperture that subtends a cone of half-angle θ, G = A·π sin²θ. Two forms are given
//! (see [`ConeForm`]):
//!
//! ```text
//! exact cone   (tan θ = 1/(2F) = D/(2d)):   π sin²θ = π/(4F² + 1) = π D²/(D² + 4d²)
//! small angle  (θ ≪ 1, or F = 1/(2 sin θ)):  π sin²θ ≈ π/(4F²)      = π D²/(4d²)
//! ```
//!
//! They differ by the factor 1 + 1/(4F²): 25 % at F/1, 6.25 % at F/2, 1 % at F/5. For a field
//! stop of finite size (a thermometer's target-defining aperture) the exact étendue between two
//! coaxial discs is the view-factor result [`etendue_between_discs`].
//!
//! Off axis, the irradiance of an image point at field angle θ falls as cos⁴θ for a small
//! aperture (projected aperture area cos θ, distance² 1/cos²θ, obliquity at the detector
//! cos θ); lenses with pupil distortion or image-space telecentricity depart from it. It is
//! applied only when [`Optics::field_angle_rad`] is not zero.
#![forbid(unsafe_code)]

use super::scene::{InBandRadiance, RadianceKind};
use crate::error::{finite, positive, unit_interval_open_closed};
use crate::float;
use crate::{Error, Result};
use core::f64::consts::{FRAC_PI_2, FRAC_PI_4, PI};

/// Which form of the projected solid angle of a circular aperture is used.
///
/// # Formula
/// ```text
/// Exact:      Ω = π sin²θ = π/(4F² + 1),  tan θ = 1/(2F)  (flat aperture of diameter D at
///             distance f = F·D from an on-axis point)
/// SmallAngle: Ω = π/(4F²)                 (paraxial; exact when F = 1/(2 sin θ), aplanatic)
/// ```
///
/// # Examples
/// ```
/// use quantaband::design::throughput::{projected_solid_angle_sr, ConeForm};
/// let exact = projected_solid_angle_sr(2.0, ConeForm::Exact).unwrap();
/// let small = projected_solid_angle_sr(2.0, ConeForm::SmallAngle).unwrap();
/// assert!((small / exact - 17.0 / 16.0).abs() < 1e-15);
/// ```
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Default)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase")
)]
pub enum ConeForm {
    /// The exact cone of a flat circular aperture: 4F² + 1.
    #[default]
    Exact,
    /// The paraxial (small-angle) form: 4F².
    SmallAngle,
}

/// Projected solid angle (sr) of a circular aperture of f-number `f_number` seen from an
/// on-axis image point.
///
/// # Formula
/// ```text
/// Exact:      Ω = π/(4F² + 1)     (= π sin²θ, tan θ = 1/(2F))
/// SmallAngle: Ω = π/(4F²)
/// F f-number (focal length / aperture diameter)
/// ```
///
/// # Errors
/// `NonFinite` / `NonPositive` for `f_number`.
/// The small-angle form is +∞ only where its true value π/(4F²) is above `f64::MAX`.
///
/// # Accuracy
/// A few ulp; the exact form agrees with mpmath quadrature of ∫cos θ dΩ over the cone
/// (`tests/design_reference.rs`, F/0.5 to F/100) within 1.6e-16 relative.
///
/// # Examples
/// ```
/// use quantaband::design::throughput::{projected_solid_angle_sr, ConeForm};
/// // F/1: π/5 sr (mpmath quad of 2π sin θ cos θ over 0…atan(1/2)).
/// let w = projected_solid_angle_sr(1.0, ConeForm::Exact).unwrap();
/// assert!((w - 0.628_318_530_717_958_6).abs() < 1e-15);
/// ```
///
/// # References
/// W. L. Wolfe, *Introduction to Radiometry*, SPIE Press (1998), ch. 2 (projected solid
/// angle of a cone, π sin²θ); E. L. Dereniak & G. D. Boreman, *Infrared Detectors and
/// Systems*, Wiley (1996), ch. 2 (image irradiance, 4F² + 1) — both from memory.
pub fn projected_solid_angle_sr(f_number: f64, cone: ConeForm) -> Result<f64> {
    positive("f_number", f_number)?;
    let ff = 4.0 * f_number * f_number;
    Ok(match cone {
        ConeForm::Exact => PI / (ff + 1.0),
        ConeForm::SmallAngle => PI / ff,
    })
}

/// Étendue (m²·sr) of an on-axis pixel or detector of area `area_m2` (m²) through an aperture
/// of f-number `f_number`.
///
/// # Formula
/// ```text
/// Exact:      G = A·π/(4F² + 1)
/// SmallAngle: G = A·π/(4F²)
/// A area, F f-number; the pixel is assumed small against the aperture and on axis
/// ```
///
/// # Errors
/// `NonFinite` / `NonPositive` for `area_m2` or `f_number`.
/// +∞ only where the true value is above `f64::MAX` (see [`projected_solid_angle_sr`]).
///
/// # Accuracy
/// A few ulp: the area times [`projected_solid_angle_sr`] (quadrature check within 1.6e-16).
///
/// # Examples
/// ```
/// use quantaband::design::throughput::{etendue_from_f_number, ConeForm};
/// // 17 µm pixel at F/1: (17e-6)²·π/5 = 1.815 840 553 774 900e-10 m² sr (by hand).
/// let g = etendue_from_f_number(17e-6 * 17e-6, 1.0, ConeForm::Exact).unwrap();
/// assert!((g / 1.815_840_553_774_900e-10 - 1.0).abs() < 1e-15);
/// ```
///
/// # References
/// Wolfe, *Introduction to Radiometry* (1998), ch. 2–3 (étendue, throughput) — from memory.
pub fn etendue_from_f_number(area_m2: f64, f_number: f64, cone: ConeForm) -> Result<f64> {
    positive("area_m2", area_m2)?;
    positive("f_number", f_number)?;
    Ok(cone_etendue(area_m2, f_number, cone))
}

/// A·π/(4q² + 1) or A·π/(4q²) for validated A, q > 0, ordered so that no intermediate over- or
/// underflows unless the result does (A near f64::MAX with q ≫ 1, or q² below the f64 range).
fn cone_etendue(area: f64, q: f64, cone: ConeForm) -> f64 {
    match cone {
        ConeForm::Exact if q >= 1.0 => {
            let inv = 1.0 / q;
            area * (PI / (4.0 + inv * inv)) / q / q
        }
        ConeForm::Exact => area * (PI / (4.0 * q * q + 1.0)),
        // area·π/4 ≤ f64::MAX, and the two divisions move monotonically towards the result.
        ConeForm::SmallAngle => area * (PI / 4.0) / q / q,
    }
}

/// Étendue (m²·sr) of a small on-axis area `area_m2` (m²) through a circular aperture of
/// diameter `aperture_diameter_m` at distance `distance_m` (m).
///
/// # Formula
/// ```text
/// Exact:      G = A·π D²/(D² + 4d²)      (= A·π sin²θ, tan θ = D/(2d))
/// SmallAngle: G = A·π D²/(4d²)           (= A·A_ap/d², A_ap = πD²/4)
/// A small area on the axis, D aperture diameter, d distance between them
/// ```
///
/// # Errors
/// `NonFinite` / `NonPositive` for any argument.
///
/// # Accuracy
/// A few ulp; the exact form against mpmath quadrature of d²/(d² + ρ²)² over the aperture
/// disc within 1.4e-16 relative (`tests/design_reference.rs`).
///
/// # Examples
/// ```
/// use quantaband::design::throughput::{etendue_from_aperture, ConeForm};
/// // 1 mm² detector, 10 mm aperture 50 mm away: π·1e-6/(1 + 4·25) m² sr (by hand).
/// let g = etendue_from_aperture(1e-6, 10e-3, 50e-3, ConeForm::Exact).unwrap();
/// assert!((g / (core::f64::consts::PI * 1e-6 / 101.0) - 1.0).abs() < 1e-15);
/// ```
///
/// # References
/// Wolfe, *Introduction to Radiometry* (1998), ch. 2 (solid angle of a disc seen from an
/// axial point) — from memory.
pub fn etendue_from_aperture(
    area_m2: f64,
    aperture_diameter_m: f64,
    distance_m: f64,
    cone: ConeForm,
) -> Result<f64> {
    positive("area_m2", area_m2)?;
    positive("aperture_diameter_m", aperture_diameter_m)?;
    positive("distance_m", distance_m)?;
    // F = d/D: the same two forms as etendue_from_f_number.
    Ok(cone_etendue(
        area_m2,
        distance_m / aperture_diameter_m,
        cone,
    ))
}

/// Étendue (m²·sr) between a circular field stop of diameter `stop_diameter_m` and a coaxial,
/// parallel circular aperture of diameter `aperture_diameter_m` at distance `distance_m` (m):
/// the throughput of a two-aperture radiometer (field stop and aperture stop).
///
/// # Formula
/// ```text
/// Exact:      G = π·A₁·F₁₂ = (π²/2)·[X − √(X² − 4r₁²r₂²)],  X = r₁² + r₂² + d²
///               = 2π² r₁² r₂² / (X + √((d² + (r₁ − r₂)²)(d² + (r₁ + r₂)²)))   (evaluated form)
/// SmallAngle: G = A₁·A₂/d² = π² r₁² r₂²/d²
/// r₁, r₂ radii of the stop and the aperture, d their separation, F₁₂ the view factor between
/// coaxial parallel discs
/// ```
///
/// # Errors
/// `NonFinite` / `NonPositive` for any argument.
///
/// # Accuracy
/// The evaluated form has no cancellation; against mpmath double quadrature of
/// cos θ₁ cos θ₂/s² over both discs (`tests/design_reference.rs`, 5 cases) within 1.4e-16
/// relative.
/// Lengths are scaled by the largest before squaring, so only results outside the f64 range
/// are 0 or ∞.
///
/// # Examples
/// ```
/// use quantaband::design::throughput::{etendue_between_discs, ConeForm};
/// // Equal discs of radius r at distance r: F₁₂ = (3 − √5)/2 (Howell et al., catalogue of
/// // view factors, coaxial discs — from memory), G = π·πr²·F₁₂.
/// let r = 1e-3;
/// let g = etendue_between_discs(2.0 * r, 2.0 * r, r, ConeForm::Exact).unwrap();
/// let f12 = (3.0 - 5f64.sqrt()) / 2.0;
/// assert!((g / (core::f64::consts::PI * core::f64::consts::PI * r * r * f12) - 1.0).abs() < 1e-14);
/// ```
///
/// # References
/// J. R. Howell, M. P. Mengüç, K. Daun & R. Siegel, *Thermal Radiation Heat Transfer*, 7th ed.,
/// CRC Press (2020), appendix C (view factor between parallel coaxial discs) — from memory;
/// Wolfe, *Introduction to Radiometry* (1998), ch. 3 (throughput of a two-aperture radiometer).
pub fn etendue_between_discs(
    stop_diameter_m: f64,
    aperture_diameter_m: f64,
    distance_m: f64,
    cone: ConeForm,
) -> Result<f64> {
    positive("stop_diameter_m", stop_diameter_m)?;
    positive("aperture_diameter_m", aperture_diameter_m)?;
    positive("distance_m", distance_m)?;
    let (r1, r2, d) = (0.5 * stop_diameter_m, 0.5 * aperture_diameter_m, distance_m);
    // Scale lengths by the largest so no square over- or underflows needlessly.
    let m = r1.max(r2).max(d);
    let (a, b, h) = (r1 / m, r2 / m, d / m);
    let pi2 = PI * PI;
    let g = match cone {
        ConeForm::Exact => {
            let x = a * a + b * b + h * h;
            let s = float::sqrt(h * h + (a - b) * (a - b)) * float::sqrt(h * h + (a + b) * (a + b));
            let ab = a * b;
            2.0 * pi2 * ab * ab / (x + s)
        }
        ConeForm::SmallAngle => {
            let q = a * b / h;
            let g = pi2 * q * q;
            if !g.is_normal() {
                // Lengths so far apart (beyond ~1e300) that a or h underflowed after scaling
                // (0/0, or a spurious 0 or ∞): π²(r1·r2/d)² from logarithms (≈ 1e-13 relative).
                return Ok(float::exp(
                    2.0 * (float::ln(PI) + float::ln(r1) + float::ln(r2) - float::ln(d)),
                ));
            }
            g
        }
    };
    Ok(g * m * m)
}

/// The optics in front of a pixel: f-number, transmittance, cone form and field angle.
///
/// # Formula
/// ```text
/// irradiance factor  K = τ·Ω(F)·cos⁴θ   (sr)      E = K·L,  Φ = K·A·L
/// Ω(F) = π/(4F² + 1) (Exact) or π/(4F²) (SmallAngle); θ field angle (0 = on axis, no fall-off)
/// ```
///
/// # Examples
/// ```
/// use quantaband::design::{ConeForm, Optics};
/// let o = Optics::new(1.0, 0.8).with_cone(ConeForm::SmallAngle);
/// assert!((o.irradiance_factor_sr().unwrap() - 0.8 * core::f64::consts::PI / 4.0).abs() < 1e-15);
/// ```
///
/// With the `serde` feature: `{"fNumber", "transmittance", "cone"?, "fieldAngleRad"?}` (cone
/// default `"exact"`, field angle default 0; unknown fields rejected; read key by key:
/// `src/design/serde_impls.rs`).
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize),
    serde(rename_all = "camelCase")
)]
pub struct Optics {
    /// Working f-number F of the optics (> 0).
    pub f_number: f64,
    /// In-band transmittance τ of the optics, in (0, 1].
    pub transmittance: f64,
    /// Form of the projected solid angle (4F² + 1 or 4F²; serde default: exact, 4F² + 1).
    pub cone: ConeForm,
    /// Field angle θ of the pixel, rad, in [0, π/2); 0 means on axis (no cos⁴ fall-off; serde
    /// default 0).
    pub field_angle_rad: f64,
}

impl Optics {
    /// On-axis optics of f-number `f_number` and transmittance `transmittance` with the exact
    /// cone form.
    ///
    /// # Formula
    /// ```text
    /// Optics { f_number, transmittance, cone: Exact, field_angle_rad: 0 }
    /// ```
    ///
    /// # Errors
    /// None here; the values are validated when used ([`Optics::validate`]).
    ///
    /// # Accuracy
    /// Exact: the values are stored.
    ///
    /// # Examples
    /// ```
    /// use quantaband::design::{ConeForm, Optics};
    /// assert_eq!(Optics::new(2.0, 0.9).cone, ConeForm::Exact);
    /// ```
    ///
    /// # References
    /// Dereniak & Boreman, *Infrared Detectors and Systems* (1996), ch. 2 — from memory.
    pub const fn new(f_number: f64, transmittance: f64) -> Self {
        Optics {
            f_number,
            transmittance,
            cone: ConeForm::Exact,
            field_angle_rad: 0.0,
        }
    }

    /// These optics with another cone form.
    ///
    /// # Formula
    /// ```text
    /// cone ← Exact (4F² + 1) or SmallAngle (4F²)
    /// ```
    ///
    /// # Errors
    /// None.
    ///
    /// # Accuracy
    /// Exact: the value is stored.
    ///
    /// # Examples
    /// ```
    /// use quantaband::design::{ConeForm, Optics};
    /// assert_eq!(Optics::new(2.0, 0.9).with_cone(ConeForm::SmallAngle).cone, ConeForm::SmallAngle);
    /// ```
    ///
    /// # References
    /// See [`ConeForm`].
    pub const fn with_cone(mut self, cone: ConeForm) -> Self {
        self.cone = cone;
        self
    }

    /// These optics for a pixel at field angle `field_angle_rad` (rad, in [0, π/2)).
    ///
    /// # Formula
    /// ```text
    /// field_angle_rad ← θ   (the irradiance then carries cos⁴θ)
    /// ```
    ///
    /// # Errors
    /// None here; validated when used.
    ///
    /// # Accuracy
    /// Exact: the value is stored.
    ///
    /// # Examples
    /// ```
    /// use quantaband::design::Optics;
    /// assert_eq!(Optics::new(2.0, 0.9).with_field_angle(0.1).field_angle_rad, 0.1);
    /// ```
    ///
    /// # References
    /// See [`Optics::irradiance_factor_sr`].
    pub const fn with_field_angle(mut self, field_angle_rad: f64) -> Self {
        self.field_angle_rad = field_angle_rad;
        self
    }

    /// Checks f-number > 0, transmittance in (0, 1] and field angle in [0, π/2).
    ///
    /// # Formula
    /// ```text
    /// 0 < F < ∞,  0 < τ ≤ 1,  0 ≤ θ < π/2
    /// ```
    ///
    /// # Errors
    /// `NonFinite` / `NonPositive` (`f_number`), `NonFinite` / `OutOfRange` (`transmittance`,
    /// `field_angle_rad`).
    ///
    /// # Accuracy
    /// Exact comparisons.
    ///
    /// # Examples
    /// ```
    /// use quantaband::design::Optics;
    /// assert_eq!(Optics::new(0.0, 0.9).validate().unwrap_err().code(), "NON_POSITIVE");
    /// assert_eq!(Optics::new(1.0, 1.5).validate().unwrap_err().code(), "OUT_OF_RANGE");
    /// ```
    ///
    /// # References
    /// The crate's error contract (`src/error.rs`).
    pub fn validate(&self) -> Result<()> {
        positive("f_number", self.f_number)?;
        unit_interval_open_closed("transmittance", self.transmittance)?;
        finite("field_angle_rad", self.field_angle_rad)?;
        if !(self.field_angle_rad >= 0.0 && self.field_angle_rad < FRAC_PI_2) {
            return Err(Error::OutOfRange {
                arg: "field_angle_rad",
                value: self.field_angle_rad,
                range: "[0, pi/2)",
            });
        }
        Ok(())
    }

    /// The factor K (sr) that turns scene radiance into focal-plane irradiance, E = K·L.
    ///
    /// # Formula
    /// ```text
    /// K = τ·Ω(F)·cos⁴θ
    /// Ω(F) = π/(4F² + 1) (Exact) or π/(4F²) (SmallAngle); τ transmittance; θ field angle
    /// (cos⁴θ = 1 on axis)
    /// ```
    ///
    /// # Errors
    /// Those of [`Optics::validate`].
    /// A true factor above `f64::MAX` (the small-angle form with F below about 1e-154) is +∞.
    ///
    /// # Accuracy
    /// A few ulp (cos θ is within 2.3e-16 relative of the platform's cosine over 10⁵ angles,
    /// `cargo test --lib design::throughput`). The cos⁴ law itself is the small-aperture limit: the exact off-axis
    /// projected solid angle of a flat circular aperture (mpmath double quadrature over the
    /// aperture, `tests/design_reference.rs`) exceeds Ω·cos⁴θ (exact-cone Ω) by 2.5e-2 at F/2
    /// and 20°, 4.2e-3 at F/5 and 20°, 8.1e-3 at F/5 and 30°, 2.7e-4 at F/20 and 20°.
    ///
    /// # Examples
    /// ```
    /// use quantaband::design::Optics;
    /// let on = Optics::new(2.0, 1.0).irradiance_factor_sr().unwrap();
    /// let off = Optics::new(2.0, 1.0).with_field_angle(0.5).irradiance_factor_sr().unwrap();
    /// assert!((off / on - 0.5f64.cos().powi(4)).abs() < 1e-15);
    /// ```
    ///
    /// # References
    /// Dereniak & Boreman, *Infrared Detectors and Systems* (1996), ch. 2 (camera equation and
    /// cosine-fourth fall-off); Wolfe, *Introduction to Radiometry* (1998), ch. 3 — from memory.
    pub fn irradiance_factor_sr(&self) -> Result<f64> {
        self.validate()?;
        let omega = projected_solid_angle_sr(self.f_number, self.cone)?;
        let c = cos_field_angle(self.field_angle_rad);
        let c2 = c * c;
        Ok(self.transmittance * omega * (c2 * c2))
    }
}

/// cos θ for a field angle θ ∈ [0, π/2] (rad), without the general-purpose cosine, whose
/// large-argument reduction a field angle never needs (it is most of that function's code in
/// the WebAssembly module).
///
/// θ ≤ π/4: the Taylor series of cos θ; above: sin r with r = π/2 − θ, formed as
/// (PI_2_HI − θ) + PI_2_LO — the difference is exact (Sterbenz: θ lies within a factor 2 of
/// π/2), so r carries no cancellation error. Both series are summed in nested form through the
/// x¹⁶ and x¹⁷ terms; the first omitted term is below 2·10⁻¹⁸ relative for |x| ≤ π/4. Measured
/// against the platform's `f64::cos` on 10⁵ angles (`cos_field_angle_against_std` below).
fn cos_field_angle(theta: f64) -> f64 {
    // π/2 = PI_2_HI + PI_2_LO (mpmath, 40 digits: the low part is π/2 − FRAC_PI_2).
    const PI_2_LO: f64 = 6.123_233_995_736_766e-17;
    let (x, sine) = if theta <= FRAC_PI_4 {
        (theta, false)
    } else {
        ((FRAC_PI_2 - theta) + PI_2_LO, true)
    };
    let x2 = x * x;
    let (mut s, mut c) = (1.0, 1.0);
    let mut k = 8.0;
    while k > 0.5 {
        s = 1.0 - x2 / ((2.0 * k) * (2.0 * k + 1.0)) * s;
        c = 1.0 - x2 / ((2.0 * k - 1.0) * (2.0 * k)) * c;
        k -= 1.0;
    }
    if sine {
        s * x
    } else {
        c
    }
}

/// Focal-plane irradiance behind the optics from a scene radiance (the radiance's unit × sr:
/// W·m⁻² from W·m⁻²·sr⁻¹, photons·s⁻¹·m⁻² from photons·s⁻¹·m⁻²·sr⁻¹).
///
/// # Formula
/// ```text
/// E = τ·π·L·cos⁴θ/(4F² + 1)   (Exact)
/// E = τ·π·L·cos⁴θ/(4F²)       (SmallAngle)
/// L scene radiance (Lambertian, filling the field), τ optics transmittance, F f-number,
/// θ field angle
/// ```
///
/// # Errors
/// `NonFinite` / `OutOfRange` (`radiance` negative); those of [`Optics::validate`].
/// A true irradiance above `f64::MAX` (F-numbers far below 1) is +∞.
///
/// # Accuracy
/// A few ulp: L times [`Optics::irradiance_factor_sr`], whose solid angle agrees with mpmath
/// quadrature of ∫cos θ dΩ over the cone within 1.6e-16 (`tests/design_reference.rs`).
///
/// # Examples
/// ```
/// use quantaband::design::throughput::focal_plane_irradiance;
/// use quantaband::design::Optics;
/// // 8–14 µm radiance of a 300 K blackbody (54.933 461 376 839 69 W m⁻² sr⁻¹, mpmath) at F/1,
/// // τ = 0.9: E = 0.9·π·L/5.
/// let e = focal_plane_irradiance(54.933_461_376_839_69, &Optics::new(1.0, 0.9)).unwrap();
/// assert!((e / (0.9 * core::f64::consts::PI * 54.933_461_376_839_69 / 5.0) - 1.0).abs() < 1e-15);
/// ```
///
/// # References
/// Dereniak & Boreman, *Infrared Detectors and Systems* (1996), ch. 2; G. C. Holst, *Testing
/// and Evaluation of Infrared Imaging Systems*, 3rd ed., SPIE Press (2008), ch. 2 — from memory.
pub fn focal_plane_irradiance(radiance: f64, optics: &Optics) -> Result<f64> {
    super::scene::non_negative("radiance", radiance)?;
    Ok(times(radiance, optics.irradiance_factor_sr()?))
}

/// x·k, with 0 for x = 0 also when k overflowed to ∞ (small-angle F below ~1e-154), where the
/// product would be NaN.
fn times(x: f64, k: f64) -> f64 {
    if x == 0.0 {
        0.0
    } else {
        x * k
    }
}

/// Flux on one pixel and its derivative with respect to the scene temperature.
///
/// `flux` is in the pixel-flux unit of `kind` ([`RadianceKind::flux_unit`]: W, photons/s, A
/// or electrons/s), `d_flux_dt` in the same unit per kelvin.
///
/// # Examples
/// ```
/// use quantaband::design::throughput::pixel_flux;
/// use quantaband::design::{InBandRadiance, Optics, RadianceKind};
/// let l = InBandRadiance::new(RadianceKind::Energy, 10.0, 0.1).unwrap();
/// let p = pixel_flux(&l, &Optics::new(1.0, 1.0), 1e-10).unwrap();
/// assert_eq!(p.kind, RadianceKind::Energy);
/// ```
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase", deny_unknown_fields)
)]
pub struct PixelFlux {
    /// Unit family (W, photons/s, A, electrons/s).
    pub kind: RadianceKind,
    /// Flux on the pixel.
    pub flux: f64,
    /// Its derivative with respect to the scene temperature, per K.
    pub d_flux_dt: f64,
}

/// Flux on a pixel of area `pixel_area_m2` (m²) from an in-band scene radiance: power (W),
/// photon rate (photons/s), current (A) or electron rate (electrons/s) per the radiance's
/// kind, with its temperature derivative.
///
/// # Formula
/// ```text
/// Φ = L·A·τ·Ω(F)·cos⁴θ,   ∂Φ/∂T = ∂L/∂T·A·τ·Ω(F)·cos⁴θ
/// Ω(F) = π/(4F² + 1) (Exact) or π/(4F²) (SmallAngle); A pixel area; τ, F, θ from the optics
/// ```
///
/// # Errors
/// `NonFinite` / `NonPositive` for `pixel_area_m2`; those of [`InBandRadiance::validate`] and
/// [`Optics::validate`].
///
/// # Accuracy
/// A few ulp beyond the radiance's own error. Photon rates for 3–5 µm and 8–14 µm bands
/// against mpmath quad of the Planck photon radiance times a quadrature étendue
/// (`tests/design_reference.rs`): within 2e-15 relative.
///
/// # Examples
/// ```
/// use quantaband::design::throughput::pixel_flux;
/// use quantaband::design::{Band, InBand, Optics};
/// use quantaband::planck::Quantity;
/// let l = Band::wavelength(8e-6, 14e-6, Quantity::Photon).in_band(300.0).unwrap();
/// let p = pixel_flux(&l, &Optics::new(1.0, 1.0), 17e-6 * 17e-6).unwrap();
/// // 3.008 838 695 169 880e21 photons s⁻¹ m⁻² sr⁻¹ (mpmath) × 1.815 840 553 774 900e-10 m² sr.
/// assert!((p.flux / (3.008_838_695_169_880e21 * 1.815_840_553_774_900e-10) - 1.0).abs() < 1e-13);
/// ```
///
/// # References
/// Wolfe, *Introduction to Radiometry* (1998), ch. 3 (flux = radiance × throughput);
/// Dereniak & Boreman (1996), ch. 2 — from memory.
pub fn pixel_flux(
    scene: &InBandRadiance,
    optics: &Optics,
    pixel_area_m2: f64,
) -> Result<PixelFlux> {
    scene.validate()?;
    positive("pixel_area_m2", pixel_area_m2)?;
    let k = optics.irradiance_factor_sr()? * pixel_area_m2;
    Ok(PixelFlux {
        kind: scene.kind,
        flux: times(scene.radiance, k),
        d_flux_dt: times(scene.d_radiance_dt, k),
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    /// The field-angle cosine against the platform's general-purpose `f64::cos` (glibc on the
    /// test host): 10⁵ angles spread over [0, π/2), plus the ends and the switch at π/4.
    #[test]
    fn cos_field_angle_against_std() {
        let mut worst = 0f64;
        let n = 100_000;
        let mut angles: alloc::vec::Vec<f64> = (0..n)
            .map(|i| FRAC_PI_2 * (i as f64 + 0.37) / n as f64)
            .collect();
        angles.extend([0.0, 1e-300, 1e-8, FRAC_PI_4, FRAC_PI_4 * (1.0 + 1e-16)]);
        angles.extend([FRAC_PI_2 * (1.0 - 1e-12), FRAC_PI_2 - 1e-15, FRAC_PI_2]);
        for &t in &angles {
            let (a, b) = (cos_field_angle(t), t.cos());
            worst = worst.max(((a - b) / b).abs());
        }
        assert_eq!(cos_field_angle(0.0), 1.0);
        assert!(worst <= 2.0 * f64::EPSILON, "{worst:e}");
        std::println!("cos_field_angle vs f64::cos: max rel {worst:.1e}");
    }
}
