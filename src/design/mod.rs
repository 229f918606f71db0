//! The instrument designer's radiometry: optical throughput, detector signal and noise,
//! figures of merit (NETD, D*, background-limited D*) and source and geometry corrections.
//!
//! Every function takes SI units with the unit in the argument name (m, m², K, s, A, W, sr);
//! D* is in m·Hz^½·W⁻¹ (1 cm·Hz^½·W⁻¹ — one "Jones" — is 0.01 m·Hz^½·W⁻¹). Nothing allocates and
//! everything builds `no_std`.
//!
//! | file | concept |
//! |---|---|
//! | [`scene`] | what the scene delivers in the band: [`InBandRadiance`] (radiance and ∂/∂T, energy, photon, or already detector-weighted) and the [`InBand`] trait with its providers |
//! | [`throughput`] | étendue, projected solid angle, focal-plane irradiance, flux on a pixel |
//! | [`detector`] | photocurrent, electrons, well fill, shot/dark/read noise, SNR, first-principles NETD |
//! | [`merit`] | noise bandwidth, NEP, D* ↔ NETD, background-limited (BLIP) D* |
//! | [`sources`] | effective emissivity of a cavity (Gouffé), size-of-source correction, distance-to-spot |
//! | [`definition`] | (`alloc`) a whole pixel design as data in user units ([`definition::DesignDefinition`]), checked once into SI ([`definition::PreparedDesign`]) |
//!
//! # Design: the in-band radiance is the interface
//!
//! Every instrument-level quantity here needs only two numbers from the scene: its radiance in
//! the instrument's band and the derivative of that radiance with respect to the scene
//! temperature — in energy units (W·m⁻²·sr⁻¹), in photon units (photons·s⁻¹·m⁻²·sr⁻¹), or
//! already weighted by the detector's spectral response (A·m⁻²·sr⁻¹ for a responsivity in A/W,
//! electrons·s⁻¹·m⁻²·sr⁻¹ for a quantum efficiency). The functions therefore take an
//! [`InBandRadiance`] value (kind, radiance, ∂/∂T), and the [`InBand`] trait is the one thing
//! a spectral description has to implement to feed them:
//!
//! - [`scene::Band`]: a rectangular band through the core's exact band integrals
//!   ([`crate::band::band`] / [`crate::band::band_d_dt`]) with `Quantity::Energy` or
//!   `Quantity::Photon`; the band may be open-ended (upper limit `f64::MAX`), e.g. 0…λc of an
//!   ideal photon detector in wavenumber.
//! - [`scene::Line`]: a narrow band of given width around one spectral point
//!   ([`crate::planck::Spectrum::spectral`] × width).
//! - [`scene::ModelRadiance`]: any [`crate::thermometry::SignalModel`], in particular the existing
//!   response-table integral [`crate::thermometry::ResponseSignal`] (∫R(λ)·L_λ dλ). With a
//!   responsivity table in A/W it is a [`RadianceKind::Current`]; with a relative table it is a
//!   weighted [`RadianceKind::Energy`].
//!
//! No second table or integration engine is built here. A photon (quantum-efficiency) response
//! over a table, ∫η(λ)·L_q,λ dλ, is not an energy-weighted integral (η·λ is not piecewise linear
//! when η is), so [`crate::thermometry::ResponseSignal`] cannot give it exactly; the general
//! spectral tables (emissivity, transmittance, responsivity or quantum efficiency) implement
//! [`InBand`] — returning a [`RadianceKind::Electron`] or [`RadianceKind::Current`] value — and
//! plug into every function of this module without an API change.
//!
//! # Conventions
//!
//! - **Cone form.** An on-axis point behind a circular aperture of diameter D at distance f
//!   (f-number F = f/D) sees a cone of half-angle θ with tan θ = 1/(2F); its projected solid
//!   angle is π sin²θ = π/(4F² + 1) ([`ConeForm::Exact`]). The familiar π/(4F²)
//!   ([`ConeForm::SmallAngle`]) is the paraxial approximation of that, and is exact for an
//!   aplanatic lens whose F is defined by the marginal ray, F = 1/(2 sin θ). Both are
//!   available wherever they differ.
//! - **Bandwidth.** The noise-equivalent bandwidth of an integrator of duration t is
//!   Δf = 1/(2t) ([`merit::noise_bandwidth_hz`]).
//! - **Shot noise** is Poisson (variance = mean number of electrons): photovoltaic or
//!   integrating detectors. Photoconductors add recombination noise (variance × 2); that enters
//!   only [`merit::blip_d_star`] through [`Mechanism::Photoconductive`].
//! - **Range.** Valid inputs whose true result lies beyond the f64 range (a D* from a NETD of
//!   1e-300 K, the small-angle solid angle of F = 1e-160, a spot from a distance-to-spot ratio of
//!   1e-320…) return +∞ or 0, not an error and never NaN; products and quotients are ordered so
//!   that this happens only where the true value is out of range.
//!
//! # Cautions
//!
//! These are design estimates, not measurements: real detectors and optics have spectral
//! structure, stray light, 1/f noise, non-uniformity and temperature drifts that the formulas
//! omit. A blackbody's effective emissivity and a thermometer's size-of-source correction used
//! for calibration must come from traceable measurement, not from these approximations alone.
//! Not for medical screening or process-safety decisions; follow local codes and standards.
#![forbid(unsafe_code)]
// `!(x > 0.0)` is used on purpose: it is also true for NaN.
#![allow(clippy::neg_cmp_op_on_partial_ord)]

#[cfg(feature = "alloc")]
pub mod definition;
pub mod detector;
pub mod merit;
pub mod scene;
#[cfg(feature = "serde")]
mod serde_impls;
pub mod sources;
pub mod throughput;

pub use detector::{Conversion, Detector, NoiseBudget, PixelReport};
pub use merit::{BackgroundView, DStarShape, Mechanism};
pub use scene::{Band, InBand, InBandRadiance, Line, ModelRadiance, RadianceKind};
pub use sources::{Cavity, SizeOfSourceReading, SpotFill};
pub use throughput::{ConeForm, Optics, PixelFlux};
