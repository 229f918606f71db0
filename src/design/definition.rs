//! A design as data: one pixel's optics, detector and scene in the units a designer types
//! ([`DesignDefinition`], serde with the `serde` feature), checked once and turned into the SI
//! objects of this module ([`PreparedDesign`]), which then evaluates the pixel at any scene
//! temperature.
//!
//! The scene is a rectangular band of a grey body with its limits in any spectral unit
//! ([`SceneDefinition::Band`]), or an instrument model of [`crate::definition`] (a response table
//! in A/W, say) read as an in-band radiance of a declared kind ([`SceneDefinition::Model`]). A
//! band's quantity follows the detector: a quantum efficiency counts photons, a responsivity
//! weighs energy, so a band can never be paired with the wrong conversion.
//!
//! Needs the `alloc` feature (a model scene owns its response table).
//!
//! # Cautions
//!
//! These are design estimates, not measurements: see the [module docs of `design`](super).
#![forbid(unsafe_code)]

use super::detector::{electron_rate, Conversion, Detector, PixelReport};
use super::merit::DStarShape;
use super::merit::{d_star_from_netd_optics, netd_from_d_star_optics, noise_bandwidth_hz};
use super::scene::{non_negative, Band, InBand, InBandRadiance, ModelRadiance, RadianceKind};
use super::throughput::{Optics, PixelFlux};
use crate::constants::C2Convention;
use crate::definition::{InstrumentModel, PreparedModel};
use crate::error::{band as check_band, unit_interval_open_closed};
use crate::planck::{Quantity, Spectrum};
use crate::units::{convert_spectral_checked, SpectralUnit};
use crate::{Error, Result};

/// The scene of a design, as written in a definition (tag `"kind"`: `"band"` or `"model"`).
///
/// # Formula
/// ```text
/// band:  L = ε·∫_λ1^λ2 L_λ(λ, T) dλ   (energy, W m⁻² sr⁻¹) or ε·∫ L_q,λ dλ (photon,
///        photons s⁻¹ m⁻² sr⁻¹); λ1, λ2 the limits converted to metres and ordered
/// model: L = S(T) of the instrument model, read as a radiance of kind radiance_kind
/// ```
///
/// # Examples
/// ```
/// use quantaband::design::definition::SceneDefinition;
/// use quantaband::units::SpectralUnit;
/// let s = SceneDefinition::Band {
///     lower: 3.7, upper: 4.8, unit: SpectralUnit::Micrometre,
///     emissivity: 1.0, c2: Default::default(),
/// };
/// assert!(matches!(s, SceneDefinition::Band { .. }));
/// ```
///
/// With the `serde` feature: `{"kind": "band", "lower", "upper", "unit", "emissivity"?, "c2"?}`
/// or `{"kind": "model", "model", "radianceKind"}` (read key by key, unknown fields rejected;
/// `src/design/serde_impls.rs`).
#[derive(Debug, Clone, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize),
    serde(tag = "kind", rename_all = "camelCase")
)]
pub enum SceneDefinition {
    /// A grey-body band between two spectral limits in `unit` (any spectral unit: wavelength,
    /// wavenumber, frequency or photon energy; the limits may come in either order of
    /// wavelength, e.g. 2000–2700 cm⁻¹ is 3.70–5.00 µm). Energy or photon radiance as the
    /// detector's conversion needs (responsivity: energy; quantum efficiency: photon).
    #[cfg_attr(feature = "serde", serde(rename_all = "camelCase"))]
    Band {
        /// Lower limit, in `unit` (> 0).
        lower: f64,
        /// Upper limit, in `unit` (> lower).
        upper: f64,
        /// Unit of the two limits.
        unit: SpectralUnit,
        /// Grey-body emissivity of the scene in (0, 1] (serde default 1).
        emissivity: f64,
        /// c₂ convention (serde default CODATA 2018).
        c2: C2Convention,
    },
    /// An instrument model (spectral point, response table, Sakuma–Hattori curve) whose signal
    /// is an in-band radiance of kind `radiance_kind` (a responsivity table in A/W: `Current`
    /// with `Conversion::Included`; a relative table: `Energy` with a responsivity).
    #[cfg_attr(feature = "serde", serde(rename_all = "camelCase"))]
    Model {
        /// The model, as in an instrument definition.
        model: InstrumentModel,
        /// What the model's signal is (its unit family).
        radiance_kind: RadianceKind,
    },
}

/// A design as written: optics, detector, scene and an extra background electron rate.
///
/// # Examples
/// ```
/// use quantaband::design::definition::{DesignDefinition, SceneDefinition};
/// use quantaband::design::{Conversion, Detector, Optics};
/// use quantaband::units::SpectralUnit;
/// let d = DesignDefinition {
///     optics: Optics::new(2.0, 0.9),
///     detector: Detector {
///         pixel_area_m2: 15e-6 * 15e-6,
///         conversion: Conversion::QuantumEfficiency { efficiency: 0.7 },
///         integration_time_s: 1e-3,
///         full_well_electrons: 1.1e7,
///         dark_current_a: 1e-12,
///         read_noise_electrons: 200.0,
///     },
///     scene: SceneDefinition::Band {
///         lower: 3.7, upper: 4.8, unit: SpectralUnit::Micrometre,
///         emissivity: 1.0, c2: Default::default(),
///     },
///     background_electrons_per_s: 0.0,
/// };
/// assert!(d.prepare().is_ok());
/// ```
///
/// With the `serde` feature: `{"optics", "detector", "scene", "backgroundElectronsPerS"?}`
/// (unknown fields rejected; read key by key: `src/design/serde_impls.rs`).
#[derive(Debug, Clone, PartialEq)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize),
    serde(rename_all = "camelCase")
)]
pub struct DesignDefinition {
    /// F-number, transmittance, cone form and field angle.
    pub optics: Optics,
    /// Pixel area, conversion, integration time, full well, dark current, read noise.
    pub detector: Detector,
    /// What the pixel looks at.
    pub scene: SceneDefinition,
    /// Extra background electron rate (stray light, warm optics), electrons/s, ≥ 0 (serde
    /// default 0).
    pub background_electrons_per_s: f64,
}

/// A checked scene in SI: a [`Band`] or a prepared instrument model with its radiance kind.
/// Implements [`InBand`].
#[derive(Debug, Clone, PartialEq)]
pub enum PreparedScene {
    /// A rectangular wavelength band (limits in m).
    Band(Band),
    /// An instrument model read as a radiance of the given kind.
    Model(PreparedModel, RadianceKind),
}

impl InBand for PreparedScene {
    fn in_band(&self, temperature_k: f64) -> Result<InBandRadiance> {
        match self {
            PreparedScene::Band(b) => b.in_band(temperature_k),
            PreparedScene::Model(m, kind) => ModelRadiance::new(m, *kind).in_band(temperature_k),
        }
    }
}

impl PreparedScene {
    /// The radiance kind this scene gives ([`RadianceKind::Energy`] or `Photon` for a band).
    ///
    /// # Formula
    /// ```text
    /// Band: Energy or Photon (its spectrum's quantity);  Model: the declared kind
    /// ```
    ///
    /// # Errors
    /// None.
    ///
    /// # Accuracy
    /// Exact.
    ///
    /// # Examples
    /// ```
    /// use quantaband::design::definition::PreparedScene;
    /// use quantaband::design::{Band, RadianceKind};
    /// use quantaband::planck::Quantity;
    /// let s = PreparedScene::Band(Band::wavelength(3e-6, 5e-6, Quantity::Photon));
    /// assert_eq!(s.kind(), RadianceKind::Photon);
    /// ```
    ///
    /// # References
    /// See [`RadianceKind`].
    pub fn kind(&self) -> RadianceKind {
        match self {
            PreparedScene::Band(b) => match b.spectrum.quantity {
                Quantity::Energy => RadianceKind::Energy,
                Quantity::Photon => RadianceKind::Photon,
            },
            PreparedScene::Model(_, kind) => *kind,
        }
    }
}

impl SceneDefinition {
    /// The checked SI scene for a detector with conversion `conversion`.
    ///
    /// # Formula
    /// ```text
    /// Band: λ_i = limit_i converted from unit to m (c/ν, 1/ν̃, hc/E for other kinds),
    ///       ordered; quantity = Photon for a quantum efficiency, Energy for a responsivity
    /// Model: the model checked and converted (InstrumentModel::prepare); its kind must suit
    ///       the conversion (Energy: responsivity; Photon: quantum efficiency; Current,
    ///       Electron: Included)
    /// ```
    ///
    /// # Errors
    /// Band: `NonFinite` / `NonPositiveSpectral` (`lower`, `upper`), `InvalidBand` (lower ≥
    /// upper, as given), `OutOfRange` (a limit whose metres overflow or underflow;
    /// `emissivity` outside (0, 1]), `Unsupported` for `Conversion::Included` (a band carries no
    /// detector response). Model: those of [`InstrumentModel::prepare`]; `Unsupported` for a
    /// kind the conversion cannot turn into electrons. Both: those of
    /// [`Conversion::validate`].
    ///
    /// # Accuracy
    /// One rounding per converted limit (≤ 2.3e-16 relative for decimal wavelength units).
    ///
    /// # Examples
    /// ```
    /// use quantaband::design::definition::{PreparedScene, SceneDefinition};
    /// use quantaband::design::Conversion;
    /// use quantaband::units::SpectralUnit;
    /// // 2000–2700 cm⁻¹ is 3.7037…–5 µm.
    /// let s = SceneDefinition::Band {
    ///     lower: 2000.0, upper: 2700.0, unit: SpectralUnit::PerCentimetre,
    ///     emissivity: 1.0, c2: Default::default(),
    /// };
    /// let p = s.prepare(Conversion::QuantumEfficiency { efficiency: 0.8 }).unwrap();
    /// let PreparedScene::Band(b) = p else { panic!() };
    /// assert_eq!(b.upper, 5e-6);
    /// ```
    ///
    /// # References
    /// Unit relations: BIPM, *The International System of Units*, 9th ed. (2019).
    pub fn prepare(&self, conversion: Conversion) -> Result<PreparedScene> {
        conversion.validate()?;
        match self {
            SceneDefinition::Band {
                lower,
                upper,
                unit,
                emissivity,
                c2,
            } => {
                let quantity = match conversion {
                    Conversion::QuantumEfficiency { .. } => Quantity::Photon,
                    Conversion::Responsivity { .. } => Quantity::Energy,
                    Conversion::Included => {
                        return Err(Error::Unsupported {
                            what: "an 'included' conversion with a band scene (a band has no \
                                   detector response; use a model scene)",
                        })
                    }
                };
                check_band("lower", *lower, "upper", *upper)?;
                unit_interval_open_closed("emissivity", *emissivity)?;
                let a = convert_spectral_checked("lower", *lower, *unit, SpectralUnit::Metre)?;
                let b = convert_spectral_checked("upper", *upper, *unit, SpectralUnit::Metre)?;
                let (lo, hi) = if a < b { (a, b) } else { (b, a) };
                if !(lo < hi) {
                    // Distinct limits that round to the same wavelength.
                    return Err(Error::InvalidBand {
                        lower: *lower,
                        upper: *upper,
                    });
                }
                let spectrum = Spectrum::BLACKBODY
                    .with_quantity(quantity)
                    .with_emissivity(*emissivity)
                    .with_c2(*c2);
                Ok(PreparedScene::Band(Band::new(spectrum, lo, hi)))
            }
            SceneDefinition::Model {
                model,
                radiance_kind,
            } => {
                let prepared = model.prepare()?;
                let probe = PixelFlux {
                    kind: *radiance_kind,
                    flux: 0.0,
                    d_flux_dt: 0.0,
                };
                electron_rate(&probe, conversion)?;
                Ok(PreparedScene::Model(prepared, *radiance_kind))
            }
        }
    }
}

impl DesignDefinition {
    /// Checks the whole design once and returns it in SI.
    ///
    /// # Formula
    /// ```text
    /// optics, detector checked; background ≥ 0; scene = SceneDefinition::prepare(conversion)
    /// ```
    ///
    /// # Errors
    /// Those of [`Optics::validate`], [`Detector::validate`], [`SceneDefinition::prepare`];
    /// `NonFinite` / `OutOfRange` for a negative `background_electrons_per_s`.
    ///
    /// # Accuracy
    /// Exact apart from the limits' unit conversion (see [`SceneDefinition::prepare`]).
    ///
    /// # Examples
    /// See [`DesignDefinition`] and [`PreparedDesign::evaluate`].
    ///
    /// # References
    /// None (validation and unit conversion).
    pub fn prepare(&self) -> Result<PreparedDesign> {
        self.optics.validate()?;
        self.detector.validate()?;
        non_negative(
            "background_electrons_per_s",
            self.background_electrons_per_s,
        )?;
        let scene = self.scene.prepare(self.detector.conversion)?;
        Ok(PreparedDesign {
            optics: self.optics,
            detector: self.detector,
            scene,
            background_electrons_per_s: self.background_electrons_per_s,
        })
    }
}

/// A checked design in SI: evaluate the pixel, and convert between D* and NETD for its optics,
/// pixel, integration time and scene.
///
/// # Examples
/// See [`PreparedDesign::evaluate`].
#[derive(Debug, Clone, PartialEq)]
pub struct PreparedDesign {
    /// The optics (checked).
    pub optics: Optics,
    /// The detector (checked).
    pub detector: Detector,
    /// The scene in SI.
    pub scene: PreparedScene,
    /// Extra background electron rate, electrons/s.
    pub background_electrons_per_s: f64,
}

impl PreparedDesign {
    /// Signal, noise, SNR, well fill and first-principles NETD of the pixel viewing the scene at
    /// `temperature_k` (K).
    ///
    /// # Formula
    /// ```text
    /// L, ∂L/∂T = scene.in_band(T);  then Detector::evaluate(L, optics, background):
    /// N_s = conversion(L·A·τ·Ω(F)·cos⁴θ)·t,  σ = √(N_s + N_b + N_d + σ_r²),
    /// SNR = N_s/σ,  NETD = σ/(∂N_s/∂T)
    /// ```
    ///
    /// # Errors
    /// `NonFinite` / `NonPositiveTemperature` (`temperature_k`); those of the scene's
    /// [`InBand`] and of [`Detector::evaluate`].
    ///
    /// # Accuracy
    /// That of [`Detector::evaluate`] (≤ 8.9e-16 relative beyond the band value) and of the
    /// band (≤ 1.7e-14); the mpmath detector rows of `tests/data/design_reference.json` through
    /// a definition with the limits typed in µm (`tests/design_definition.rs`): 1.1e-15.
    ///
    /// # Examples
    /// ```
    /// use quantaband::design::definition::{DesignDefinition, SceneDefinition};
    /// use quantaband::design::{Conversion, Detector, Optics};
    /// use quantaband::units::SpectralUnit;
    /// let d = DesignDefinition {
    ///     optics: Optics::new(2.0, 0.9),
    ///     detector: Detector {
    ///         pixel_area_m2: 2.25e-10,
    ///         conversion: Conversion::QuantumEfficiency { efficiency: 0.7 },
    ///         integration_time_s: 1e-3,
    ///         full_well_electrons: 1.1e7,
    ///         dark_current_a: 1e-12,
    ///         read_noise_electrons: 200.0,
    ///     },
    ///     scene: SceneDefinition::Band {
    ///         lower: 3.7e-6, upper: 4.8e-6, unit: SpectralUnit::Metre,
    ///         emissivity: 1.0, c2: Default::default(),
    ///     },
    ///     background_electrons_per_s: 0.0,
    /// };
    /// let r = d.prepare().unwrap().evaluate(300.0).unwrap();
    /// // mpmath chain (tests/data/gen_design.py, case "mwir_doc"): NETD 0.033 172 571 793 443 83 K.
    /// assert!((r.netd_k / 0.033_172_571_793_443_83 - 1.0).abs() < 1e-13);
    /// ```
    ///
    /// # References
    /// Dereniak & Boreman, *Infrared Detectors and Systems* (1996), ch. 5–6 — from memory.
    pub fn evaluate(&self, temperature_k: f64) -> Result<PixelReport> {
        let scene = self.scene.in_band(temperature_k)?;
        self.detector
            .evaluate(&scene, &self.optics, self.background_electrons_per_s)
    }

    /// The D* spectral shape the D* ↔ NETD conversions use for this scene.
    ///
    /// # Formula
    /// ```text
    /// Energy scene: Flat (D* independent of λ); peak_wavelength_m must be None
    /// Photon scene: IdealPhoton { λp }, λp = peak_wavelength_m, or for a band its upper
    ///               (long-wavelength) limit; D*(λ) = D*(λp)·λ/λp
    /// ```
    ///
    /// # Errors
    /// `Unsupported` for a current or electron scene (the response is already in the
    /// radiance), for a peak given with an energy scene, and for a photon model scene without a
    /// peak; `NonFinite` / `NonPositiveSpectral` (`peak_wavelength_m`).
    ///
    /// # Accuracy
    /// Exact.
    ///
    /// # Examples
    /// ```
    /// use quantaband::design::definition::{PreparedDesign, PreparedScene};
    /// use quantaband::design::{Band, Conversion, DStarShape, Detector, Optics};
    /// use quantaband::planck::Quantity;
    /// let p = PreparedDesign {
    ///     optics: Optics::new(2.0, 0.9),
    ///     detector: Detector { pixel_area_m2: 1e-10, conversion: Conversion::QuantumEfficiency { efficiency: 0.7 },
    ///         integration_time_s: 1e-3, full_well_electrons: 1e7, dark_current_a: 0.0, read_noise_electrons: 0.0 },
    ///     scene: PreparedScene::Band(Band::wavelength(3.7e-6, 4.8e-6, Quantity::Photon)),
    ///     background_electrons_per_s: 0.0,
    /// };
    /// assert_eq!(p.d_star_shape(None).unwrap(), DStarShape::IdealPhoton { peak_wavelength_m: 4.8e-6 });
    /// ```
    ///
    /// # References
    /// Dereniak & Boreman, *Infrared Detectors and Systems* (1996), ch. 4 (D* of an ideal photon
    /// detector rises ∝ λ to its cut-off) — from memory.
    pub fn d_star_shape(&self, peak_wavelength_m: Option<f64>) -> Result<DStarShape> {
        match (self.scene.kind(), peak_wavelength_m) {
            (RadianceKind::Energy, None) => Ok(DStarShape::Flat),
            (RadianceKind::Energy, Some(_)) => Err(Error::Unsupported {
                what: "a D* peak wavelength with an energy scene (its D* is flat)",
            }),
            (RadianceKind::Photon, Some(p)) => {
                crate::error::spectral("peak_wavelength_m", p)?;
                Ok(DStarShape::IdealPhoton {
                    peak_wavelength_m: p,
                })
            }
            (RadianceKind::Photon, None) => match &self.scene {
                PreparedScene::Band(b) => Ok(DStarShape::IdealPhoton {
                    peak_wavelength_m: b.upper,
                }),
                PreparedScene::Model(..) => Err(Error::Unsupported {
                    what: "a photon model scene without a D* peak wavelength",
                }),
            },
            _ => Err(Error::Unsupported {
                what: "D* for a current or electron scene (D* needs an energy or photon scene)",
            }),
        }
    }

    /// NETD (K) of the pixel from a detector D* (m·Hz^½·W⁻¹) at scene temperature
    /// `temperature_k` (K), with Δf = 1/(2 t_int) and the optics' cone form.
    ///
    /// # Formula
    /// ```text
    /// NETD = (4F² + 1)·√Δf / (π·τ·D*·√A·∂L/∂T·cos⁴θ)    (4F² in the small-angle form)
    /// ∂L/∂T: energy band derivative (flat D*), or (hc/λp)·∂L_q/∂T (ideal photon, D* at λp)
    /// Δf = 1/(2 t_int), A pixel area
    /// ```
    ///
    /// # Errors
    /// `NonFinite` / `NonPositive` (`d_star`); those of [`PreparedDesign::d_star_shape`], the
    /// scene's [`InBand`] and [`netd_from_d_star_optics`].
    ///
    /// # Accuracy
    /// That of [`netd_from_d_star_optics`] (≤ 1.3e-15 against mpmath) plus the band's.
    ///
    /// # Examples
    /// ```
    /// use quantaband::design::definition::{PreparedDesign, PreparedScene};
    /// use quantaband::design::{Band, Conversion, Detector, Optics};
    /// use quantaband::planck::Quantity;
    /// // tests/data/design_reference.json, netd_d_star row 5 (mpmath quadrature of D*(λ)·∂L_λ/∂T).
    /// let p = PreparedDesign {
    ///     optics: Optics::new(2.0, 0.9),
    ///     detector: Detector { pixel_area_m2: 2.25e-10, conversion: Conversion::QuantumEfficiency { efficiency: 0.7 },
    ///         integration_time_s: 1e-3, full_well_electrons: 1e7, dark_current_a: 0.0, read_noise_electrons: 0.0 },
    ///     scene: PreparedScene::Band(Band::wavelength(3.7e-6, 4.8e-6, Quantity::Photon)),
    ///     background_electrons_per_s: 0.0,
    /// };
    /// let netd = p.netd_from_d_star(1e9, 300.0, None).unwrap();
    /// assert!((netd / 0.213_794_776_904_140_48 - 1.0).abs() < 1e-13);
    /// ```
    ///
    /// # References
    /// Dereniak & Boreman, *Infrared Detectors and Systems* (1996), ch. 6; Holst, *Testing and
    /// Evaluation of Infrared Imaging Systems*, 3rd ed. (2008) — from memory.
    pub fn netd_from_d_star(
        &self,
        d_star: f64,
        temperature_k: f64,
        peak_wavelength_m: Option<f64>,
    ) -> Result<f64> {
        crate::error::positive("d_star", d_star)?;
        let shape = self.d_star_shape(peak_wavelength_m)?;
        let scene = self.scene.in_band(temperature_k)?;
        let df = noise_bandwidth_hz(self.detector.integration_time_s)?;
        netd_from_d_star_optics(
            d_star,
            shape,
            &scene,
            &self.optics,
            self.detector.pixel_area_m2,
            df,
        )
    }

    /// The detector D* (m·Hz^½·W⁻¹) that gives NETD `netd_k` (K) at scene temperature
    /// `temperature_k` (K): the inverse of [`PreparedDesign::netd_from_d_star`].
    ///
    /// # Formula
    /// ```text
    /// D* = (4F² + 1)·√Δf / (π·τ·NETD·√A·∂L/∂T·cos⁴θ)   (symbols as netd_from_d_star)
    /// ```
    ///
    /// # Errors
    /// `NonFinite` / `NonPositive` (`netd_k`); as [`PreparedDesign::netd_from_d_star`].
    ///
    /// # Accuracy
    /// Round trip with [`PreparedDesign::netd_from_d_star`] within a few ulp.
    ///
    /// # Examples
    /// ```
    /// use quantaband::design::definition::{PreparedDesign, PreparedScene};
    /// use quantaband::design::{Band, Conversion, Detector, Optics};
    /// use quantaband::planck::Quantity;
    /// let p = PreparedDesign {
    ///     optics: Optics::new(2.0, 0.9),
    ///     detector: Detector { pixel_area_m2: 2.25e-10, conversion: Conversion::QuantumEfficiency { efficiency: 0.7 },
    ///         integration_time_s: 1e-3, full_well_electrons: 1e7, dark_current_a: 0.0, read_noise_electrons: 0.0 },
    ///     scene: PreparedScene::Band(Band::wavelength(3.7e-6, 4.8e-6, Quantity::Photon)),
    ///     background_electrons_per_s: 0.0,
    /// };
    /// let d = p.d_star_from_netd(0.213_794_776_904_140_48, 300.0, None).unwrap();
    /// assert!((d / 1e9 - 1.0).abs() < 1e-13);
    /// ```
    ///
    /// # References
    /// As [`PreparedDesign::netd_from_d_star`].
    pub fn d_star_from_netd(
        &self,
        netd_k: f64,
        temperature_k: f64,
        peak_wavelength_m: Option<f64>,
    ) -> Result<f64> {
        crate::error::positive("netd_k", netd_k)?;
        let shape = self.d_star_shape(peak_wavelength_m)?;
        let scene = self.scene.in_band(temperature_k)?;
        let df = noise_bandwidth_hz(self.detector.integration_time_s)?;
        d_star_from_netd_optics(
            netd_k,
            shape,
            &scene,
            &self.optics,
            self.detector.pixel_area_m2,
            df,
        )
    }
}
