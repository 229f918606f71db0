//! User units: parse unit names and convert spectral coordinates and temperatures to and from
//! the SI base units the physics uses.
//!
//! This is the one place where user units meet the core. Every physics function takes SI base
//! units (`wavelength_m`, `wavenumber_per_m`, `frequency_hz`, `energy_j`, `temperature_k`); the
//! JavaScript layer and the page parse the unit a user typed with [`SpectralUnit::parse`] /
//! [`TemperatureUnit::parse`] and convert with the functions here.
//!
//! # Spectral coordinates
//!
//! A spectral coordinate is one of four *kinds* ([`SpectralKind`]): vacuum wavelength λ (SI: m),
//! vacuum wavenumber ν̃ = 1/λ (SI: m⁻¹), frequency ν = c/λ (SI: Hz) or photon energy E = hν
//! (SI: J). Converting a value between units of the same kind is a multiplication by an exact
//! decimal factor; converting between kinds uses one exact product or quotient with c, h·c or
//! 1 (never a chain through a third kind, so a value near the ends of the f64 range does not
//! overflow on the way and come back as ∞ or 0).
//!
//! # Temperatures
//!
//! Absolute temperatures ([`TemperatureUnit::to_kelvin`], [`TemperatureUnit::from_kelvin`]) and
//! temperature *differences* ([`TemperatureUnit::difference_to_kelvin`]) are separate functions
//! and are never mixed: 10 °C is 283.15 K, but a rise of 10 °C is a rise of 10 K. An absolute
//! temperature that converts to ≤ 0 K is rejected with [`Error::NonPositiveTemperature`].
//!
//! # Unit names
//!
//! Names are case-sensitive, as SI prefixes are (`mHz` is not `MHz`).
//!
//! | kind | accepted names |
//! |---|---|
//! | wavelength | `m`, `mm`, `um`, `µm` (micro sign), `μm` (Greek mu), `micron`, `nm` |
//! | wavenumber | `m-1`, `m^-1`, `m⁻¹`, `1/m`, `cm-1`, `cm^-1`, `cm⁻¹`, `1/cm` |
//! | frequency | `Hz`, `kHz`, `MHz`, `GHz`, `THz` |
//! | photon energy | `J`, `eV`, `meV` |
//! | temperature | `K`; `degC`, `°C`, `℃`, `C`; `degF`, `°F`, `℉`, `F`; `degR`, `°R` (Rankine) |
//!
//! # References
//! - BIPM, *The International System of Units (SI)*, 9th edition (2019), §2.3.1 (kelvin and
//!   degree Celsius, t/°C = T/K − 273.15) and Table 7 (prefixes).
//! - A. Thompson, B. N. Taylor, *Guide for the Use of the International System of Units (SI)*,
//!   NIST Special Publication 811 (2008), Appendix B.8/B.9 (degree Fahrenheit and Rankine:
//!   T/K = (t/°F + 459.67)/1.8, T/K = (T/°R)/1.8).
//! - E. Tiesinga et al., "CODATA recommended values of the fundamental physical constants: 2018",
//!   Rev. Mod. Phys. 93, 025010 (2021), doi:10.1103/RevModPhys.93.025010 (h, c, e).
#![forbid(unsafe_code)]

use crate::constants::{ELEMENTARY_CHARGE_E, PLANCK_H, SPEED_OF_LIGHT_C};
use crate::error::{self, Error, Result};

/// h·c in J·m, the f64 nearest to the exact product 1.986 445 857 148 928 7…e-25 (computed at
/// 40 digits with mpmath from the exact SI 2019 values of h and c).
const HC: f64 = 1.986_445_857_148_928_6e-25;

/// The accepted spectral unit names, for error messages.
pub(crate) const SPECTRAL_NAMES: &str =
    "spectral unit: m, mm, um, nm, m-1, cm-1, Hz, kHz, MHz, GHz, THz, J, eV or meV";
/// The accepted temperature unit names, for error messages.
const TEMPERATURE_NAMES: &str = "temperature unit: K, degC, degF or degR";

/// The kind of a spectral coordinate, with its SI base unit.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum SpectralKind {
    /// Vacuum wavelength λ, SI unit m.
    Wavelength,
    /// Vacuum wavenumber ν̃ = 1/λ, SI unit m⁻¹.
    Wavenumber,
    /// Frequency ν = c/λ, SI unit Hz.
    Frequency,
    /// Photon energy E = hν, SI unit J.
    PhotonEnergy,
}

impl SpectralKind {
    /// Converts a coordinate in SI units from this kind to kind `to` (m, m⁻¹, Hz, J).
    ///
    /// # Formula
    /// ```text
    /// ν̃ = 1/λ     ν = c/λ     E = h·c/λ     ν = c·ν̃     E = h·c·ν̃     E = h·ν
    /// ```
    /// λ vacuum wavelength (m), ν̃ vacuum wavenumber (m⁻¹), ν frequency (Hz), E photon energy (J),
    /// c speed of light, h Planck constant (both exact, SI 2019).
    ///
    /// # Errors
    /// [`Error::NonFinite`] if `value_si` is NaN or ±∞; [`Error::NonPositiveSpectral`] if it is
    /// ≤ 0. `arg` names the argument in those errors.
    ///
    /// # Accuracy
    /// One f64 multiplication or division by a correctly rounded constant: relative error
    /// ≤ 2.3e-16 (≤ 2 ulp). A result beyond the f64 range is ∞ or 0 only when the true value is.
    /// Checked against CODATA 2018 relationships in the unit tests below.
    ///
    /// # Examples
    /// ```
    /// use quantaband::units::SpectralKind;
    /// // 1 µm is 299.792458 THz (c exact).
    /// let nu = SpectralKind::Wavelength.convert_si("x", 1e-6, SpectralKind::Frequency).unwrap();
    /// assert!((nu - 2.997_924_58e14).abs() < 1.0);
    /// ```
    ///
    /// # References
    /// CODATA 2018 (Tiesinga et al. 2021, doi:10.1103/RevModPhys.93.025010), exact h and c.
    pub fn convert_si(self, arg: &'static str, value_si: f64, to: SpectralKind) -> Result<f64> {
        let v = error::spectral(arg, value_si)?;
        let (k, reciprocal) = self.relation(to);
        Ok(if reciprocal { k / v } else { k * v })
    }

    /// The relation `to = k / from` (reciprocal) or `to = k · from` between SI values of two kinds.
    const fn relation(self, to: SpectralKind) -> (f64, bool) {
        use SpectralKind::*;
        match (self, to) {
            (Wavelength, Wavelength)
            | (Wavenumber, Wavenumber)
            | (Frequency, Frequency)
            | (PhotonEnergy, PhotonEnergy) => (1.0, false),
            (Wavelength, Wavenumber) | (Wavenumber, Wavelength) => (1.0, true),
            (Wavelength, Frequency) | (Frequency, Wavelength) => (SPEED_OF_LIGHT_C, true),
            (Wavelength, PhotonEnergy) | (PhotonEnergy, Wavelength) => (HC, true),
            (Wavenumber, Frequency) => (SPEED_OF_LIGHT_C, false),
            (Frequency, Wavenumber) => (1.0 / SPEED_OF_LIGHT_C, false),
            (Wavenumber, PhotonEnergy) => (HC, false),
            (PhotonEnergy, Wavenumber) => (1.0 / HC, false),
            (Frequency, PhotonEnergy) => (PLANCK_H, false),
            (PhotonEnergy, Frequency) => (1.0 / PLANCK_H, false),
        }
    }

    /// Lower-case name of the kind (`"wavelength"`, `"wavenumber"`, `"frequency"`,
    /// `"photonEnergy"`), as used by the JavaScript layer.
    pub const fn name(self) -> &'static str {
        match self {
            SpectralKind::Wavelength => "wavelength",
            SpectralKind::Wavenumber => "wavenumber",
            SpectralKind::Frequency => "frequency",
            SpectralKind::PhotonEnergy => "photonEnergy",
        }
    }

    /// The SI base unit of this kind (metre, reciprocal metre, hertz, joule).
    pub const fn si_unit(self) -> SpectralUnit {
        match self {
            SpectralKind::Wavelength => SpectralUnit::Metre,
            SpectralKind::Wavenumber => SpectralUnit::PerMetre,
            SpectralKind::Frequency => SpectralUnit::Hertz,
            SpectralKind::PhotonEnergy => SpectralUnit::Joule,
        }
    }
}

/// A unit of a spectral coordinate (wavelength, wavenumber, frequency or photon energy).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum SpectralUnit {
    /// Metre (wavelength, SI).
    Metre,
    /// Millimetre, 1e-3 m.
    Millimetre,
    /// Micrometre, 1e-6 m.
    Micrometre,
    /// Nanometre, 1e-9 m.
    Nanometre,
    /// Reciprocal metre (wavenumber, SI).
    PerMetre,
    /// Reciprocal centimetre, 100 m⁻¹.
    PerCentimetre,
    /// Hertz (frequency, SI).
    Hertz,
    /// Kilohertz, 1e3 Hz.
    Kilohertz,
    /// Megahertz, 1e6 Hz.
    Megahertz,
    /// Gigahertz, 1e9 Hz.
    Gigahertz,
    /// Terahertz, 1e12 Hz.
    Terahertz,
    /// Joule (photon energy, SI).
    Joule,
    /// Electronvolt, e·(1 V) = 1.602 176 634e-19 J exactly.
    Electronvolt,
    /// Millielectronvolt, 1e-3 eV.
    Millielectronvolt,
}

impl SpectralUnit {
    /// Every spectral unit, in declaration order.
    pub const ALL: [SpectralUnit; 14] = [
        SpectralUnit::Metre,
        SpectralUnit::Millimetre,
        SpectralUnit::Micrometre,
        SpectralUnit::Nanometre,
        SpectralUnit::PerMetre,
        SpectralUnit::PerCentimetre,
        SpectralUnit::Hertz,
        SpectralUnit::Kilohertz,
        SpectralUnit::Megahertz,
        SpectralUnit::Gigahertz,
        SpectralUnit::Terahertz,
        SpectralUnit::Joule,
        SpectralUnit::Electronvolt,
        SpectralUnit::Millielectronvolt,
    ];

    /// Parses a unit name (see the module table; case-sensitive).
    ///
    /// # Errors
    /// [`Error::UnknownUnit`] for a name not in the table.
    ///
    /// # Examples
    /// ```
    /// use quantaband::units::SpectralUnit;
    /// assert_eq!(SpectralUnit::parse("µm").unwrap(), SpectralUnit::Micrometre);
    /// assert_eq!(SpectralUnit::parse("cm⁻¹").unwrap(), SpectralUnit::PerCentimetre);
    /// assert_eq!(SpectralUnit::parse("furlong").unwrap_err().code(), "UNKNOWN_UNIT");
    /// ```
    pub fn parse(name: &str) -> Result<Self> {
        use SpectralUnit::*;
        Ok(match name {
            "m" => Metre,
            "mm" => Millimetre,
            "um" | "\u{b5}m" | "\u{3bc}m" | "micron" => Micrometre,
            "nm" => Nanometre,
            "m-1" | "m^-1" | "m\u{207b}\u{b9}" | "1/m" => PerMetre,
            "cm-1" | "cm^-1" | "cm\u{207b}\u{b9}" | "1/cm" => PerCentimetre,
            "Hz" => Hertz,
            "kHz" => Kilohertz,
            "MHz" => Megahertz,
            "GHz" => Gigahertz,
            "THz" => Terahertz,
            "J" => Joule,
            "eV" => Electronvolt,
            "meV" => Millielectronvolt,
            _ => {
                return Err(Error::UnknownUnit {
                    expected: SPECTRAL_NAMES,
                })
            }
        })
    }

    /// The canonical ASCII name of the unit (the first name in the module table).
    pub const fn name(self) -> &'static str {
        use SpectralUnit::*;
        match self {
            Metre => "m",
            Millimetre => "mm",
            Micrometre => "um",
            Nanometre => "nm",
            PerMetre => "m-1",
            PerCentimetre => "cm-1",
            Hertz => "Hz",
            Kilohertz => "kHz",
            Megahertz => "MHz",
            Gigahertz => "GHz",
            Terahertz => "THz",
            Joule => "J",
            Electronvolt => "eV",
            Millielectronvolt => "meV",
        }
    }

    /// The kind of coordinate this unit measures.
    pub const fn kind(self) -> SpectralKind {
        use SpectralUnit::*;
        match self {
            Metre | Millimetre | Micrometre | Nanometre => SpectralKind::Wavelength,
            PerMetre | PerCentimetre => SpectralKind::Wavenumber,
            Hertz | Kilohertz | Megahertz | Gigahertz | Terahertz => SpectralKind::Frequency,
            Joule | Electronvolt | Millielectronvolt => SpectralKind::PhotonEnergy,
        }
    }

    /// The size of one of this unit in the SI base unit of its kind (exact decimal, or e in J).
    pub const fn si_factor(self) -> f64 {
        let (mul, div) = self.scale();
        mul / div
    }

    /// The unit's size as `mul / div` with `div` an exact power of ten, so that converting
    /// `500 nm` gives the correctly rounded `5e-7 m` (a multiplication by the inexact `1e-9`
    /// would not).
    const fn scale(self) -> (f64, f64) {
        use SpectralUnit::*;
        match self {
            Metre | PerMetre | Hertz | Joule => (1.0, 1.0),
            Millimetre => (1.0, 1e3),
            Micrometre => (1.0, 1e6),
            Nanometre => (1.0, 1e9),
            PerCentimetre => (100.0, 1.0),
            Kilohertz => (1e3, 1.0),
            Megahertz => (1e6, 1.0),
            Gigahertz => (1e9, 1.0),
            Terahertz => (1e12, 1.0),
            Electronvolt => (ELEMENTARY_CHARGE_E, 1.0),
            Millielectronvolt => (ELEMENTARY_CHARGE_E, 1e3),
        }
    }

    /// Converts a coordinate in this unit to the SI base unit of its kind (m, m⁻¹, Hz or J).
    ///
    /// # Formula
    /// ```text
    /// x_SI = x · m / d
    /// ```
    /// m/d = [`SpectralUnit::si_factor`], with d an exact power of ten (1, 1e3, 1e6 or 1e9).
    ///
    /// # Errors
    /// [`Error::NonFinite`] for NaN/±∞, [`Error::NonPositiveSpectral`] for `value` ≤ 0,
    /// [`Error::OutOfRange`] (reporting `value` as given) for a positive value whose SI form
    /// underflows to 0 (`arg` names the argument).
    ///
    /// # Accuracy
    /// Correctly rounded for the decimal units (one exact-operand multiplication or division);
    /// ≤ 1 ulp for eV and meV (the f64 value of e is itself correctly rounded).
    ///
    /// # Examples
    /// ```
    /// use quantaband::units::SpectralUnit;
    /// assert_eq!(SpectralUnit::Nanometre.to_si("x", 500.0).unwrap(), 5.0e-7);
    /// ```
    ///
    /// # References
    /// BIPM SI Brochure, 9th ed. (2019), Table 7 (prefixes).
    pub fn to_si(self, arg: &'static str, value: f64) -> Result<f64> {
        let v = error::spectral(arg, value)?;
        let (mul, div) = self.scale();
        let si = if div == 1.0 { v * mul } else { v * mul / div };
        // A positive input below ~1e-300 nm can underflow: report the value the caller gave.
        in_range(arg, value, si)
    }

    /// Converts a coordinate from the SI base unit of this unit's kind into this unit.
    ///
    /// # Errors
    /// [`Error::NonFinite`] for NaN/±∞, [`Error::NonPositiveSpectral`] for `value_si` ≤ 0. A
    /// result beyond the f64 range is +∞ or 0 only when the true value is.
    ///
    /// # Examples
    /// ```
    /// use quantaband::units::SpectralUnit;
    /// assert!((SpectralUnit::Micrometre.from_si("x", 1.0e-5).unwrap() - 10.0).abs() < 1e-14);
    /// ```
    pub fn from_si(self, arg: &'static str, value_si: f64) -> Result<f64> {
        let v = error::spectral(arg, value_si)?;
        let (mul, div) = self.scale();
        Ok(if mul == 1.0 { v * div } else { v * div / mul })
    }
}

/// Converts a spectral coordinate between any two units, across kinds if needed (λ ↔ ν̃ ↔ ν ↔ E).
///
/// # Formula
/// ```text
/// y = C · x      or      y = C / x   (reciprocal kinds: λ ↔ ν̃, λ ↔ ν, λ ↔ E)
/// C = K · (m_from/d_from)^(±1) · (d_to/m_to)
/// ```
/// K the kind relation of [`SpectralKind::convert_si`] (1, c, h·c, h or their inverses), m/d the
/// units' sizes in SI ([`SpectralUnit::si_factor`]). The whole unit-and-kind factor C is formed
/// first, so decimal cases are exact (10 µm → 1000 cm⁻¹ exactly) and no intermediate SI value
/// can overflow or underflow.
///
/// # Errors
/// [`Error::NonFinite`] for NaN/±∞, [`Error::NonPositiveSpectral`] for `value` ≤ 0 (`arg` names
/// the argument). A valid input whose true result lies outside the f64 range gives ∞ or 0.
///
/// # Accuracy
/// At most five roundings (constant C, then one operation): relative error ≤ 6e-16; unit tests
/// compare with CODATA 2018 exact relationships and check every pair round-trips to 1e-15.
///
/// # Examples
/// ```
/// use quantaband::units::{convert_spectral, SpectralUnit};
/// // CODATA 2018: hc/e = 1.239 841 984…e-6 eV·m, so 1 eV is 1239.841984 nm.
/// let nm = convert_spectral("x", 1.0, SpectralUnit::Electronvolt, SpectralUnit::Nanometre).unwrap();
/// assert!((nm - 1239.841_984_332_002_6).abs() < 1e-9);
/// assert_eq!(
///     convert_spectral("x", 10.0, SpectralUnit::Micrometre, SpectralUnit::PerCentimetre).unwrap(),
///     1000.0
/// );
/// ```
///
/// # References
/// CODATA 2018 (Tiesinga et al. 2021), "electron volt–inverse meter relationship"; BIPM SI
/// Brochure 9th ed. (2019), Table 7.
pub fn convert_spectral(
    arg: &'static str,
    value: f64,
    from: SpectralUnit,
    to: SpectralUnit,
) -> Result<f64> {
    let v = error::spectral(arg, value)?;
    if from == to {
        return Ok(v);
    }
    let (k, reciprocal) = from.kind().relation(to.kind());
    let (m_from, d_from) = from.scale();
    let (m_to, d_to) = to.scale();
    Ok(if reciprocal {
        // y_SI = K / (x · m_from/d_from);  y = y_SI · d_to/m_to
        let c = (k * d_from * d_to) / (m_from * m_to);
        c / v
    } else {
        // y_SI = K · x · m_from/d_from;  y = y_SI · d_to/m_to
        let c = (k * m_from * d_to) / (d_from * m_to);
        v * c
    })
}

/// The range reported when a positive, finite coordinate converts to 0 or ∞.
const CONVERTIBLE: &str = "values whose converted form is a positive finite f64";

/// `converted` if it is positive and finite, else `OutOfRange` reporting the `value` the caller
/// gave (not the 0 or ∞ it became).
fn in_range(arg: &'static str, value: f64, converted: f64) -> Result<f64> {
    if converted > 0.0 && converted.is_finite() {
        Ok(converted)
    } else {
        Err(Error::OutOfRange {
            arg,
            value,
            range: CONVERTIBLE,
        })
    }
}

/// [`convert_spectral`] for values that must stay usable: a result that underflows to 0 or
/// overflows to ∞ is an error reporting the value as given.
///
/// # Formula
/// As [`convert_spectral`].
///
/// # Errors
/// Those of [`convert_spectral`]; [`Error::OutOfRange`] with `value` when the result is 0 or ∞.
///
/// # Accuracy
/// As [`convert_spectral`].
///
/// # Examples
/// ```
/// use quantaband::units::{convert_spectral_checked, SpectralUnit};
/// let e = convert_spectral_checked("x", 1e-320, SpectralUnit::Nanometre, SpectralUnit::Metre);
/// assert_eq!(e.unwrap_err().code(), "OUT_OF_RANGE");
/// let m = convert_spectral_checked("x", 10.0, SpectralUnit::Micrometre, SpectralUnit::Metre).unwrap();
/// assert!((m / 1e-5 - 1.0).abs() <= 2.3e-16);
/// ```
///
/// # References
/// As [`convert_spectral`].
pub fn convert_spectral_checked(
    arg: &'static str,
    value: f64,
    from: SpectralUnit,
    to: SpectralUnit,
) -> Result<f64> {
    in_range(arg, value, convert_spectral(arg, value, from, to)?)
}

/// A temperature unit (absolute scale or difference, depending on the function used).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum TemperatureUnit {
    /// Kelvin (SI).
    Kelvin,
    /// Degree Celsius: t/°C = T/K − 273.15.
    Celsius,
    /// Degree Fahrenheit: t/°F = 1.8·T/K − 459.67.
    Fahrenheit,
    /// Degree Rankine: T/°R = 1.8·T/K.
    Rankine,
}

impl TemperatureUnit {
    /// Every temperature unit, in declaration order.
    pub const ALL: [TemperatureUnit; 4] = [
        TemperatureUnit::Kelvin,
        TemperatureUnit::Celsius,
        TemperatureUnit::Fahrenheit,
        TemperatureUnit::Rankine,
    ];

    /// Parses a temperature unit name (see the module table; case-sensitive).
    ///
    /// # Errors
    /// [`Error::UnknownUnit`] for a name not in the table.
    ///
    /// # Examples
    /// ```
    /// use quantaband::units::TemperatureUnit;
    /// assert_eq!(TemperatureUnit::parse("°C").unwrap(), TemperatureUnit::Celsius);
    /// assert_eq!(TemperatureUnit::parse("k").unwrap_err().code(), "UNKNOWN_UNIT");
    /// ```
    pub fn parse(name: &str) -> Result<Self> {
        use TemperatureUnit::*;
        Ok(match name {
            "K" => Kelvin,
            "degC" | "\u{b0}C" | "\u{2103}" | "C" => Celsius,
            "degF" | "\u{b0}F" | "\u{2109}" | "F" => Fahrenheit,
            "degR" | "\u{b0}R" => Rankine,
            _ => {
                return Err(Error::UnknownUnit {
                    expected: TEMPERATURE_NAMES,
                })
            }
        })
    }

    /// The canonical ASCII name (`"K"`, `"degC"`, `"degF"`, `"degR"`).
    pub const fn name(self) -> &'static str {
        match self {
            TemperatureUnit::Kelvin => "K",
            TemperatureUnit::Celsius => "degC",
            TemperatureUnit::Fahrenheit => "degF",
            TemperatureUnit::Rankine => "degR",
        }
    }

    /// Converts an absolute temperature in this unit to kelvin.
    ///
    /// # Formula
    /// ```text
    /// T = t + 273.15            (°C)
    /// T = (t + 459.67) · 5/9    (°F)
    /// T = t · 5/9               (°R)
    /// ```
    /// t the temperature in this unit, T in kelvin.
    ///
    /// # Errors
    /// [`Error::NonFinite`] for NaN/±∞; [`Error::NonPositiveTemperature`] (value in kelvin) when
    /// the result is ≤ 0 K (at or below absolute zero).
    ///
    /// # Accuracy
    /// At most three roundings: absolute error ≤ 2 ulp of max(|t|, 459.67)·5/9, i.e.
    /// ≤ 2e-13 K for |t| < 1000.
    ///
    /// # Examples
    /// ```
    /// use quantaband::units::TemperatureUnit;
    /// // SI Brochure: 0 °C = 273.15 K. NIST SP 811: 212 °F = 373.15 K.
    /// assert_eq!(TemperatureUnit::Celsius.to_kelvin("t", 0.0).unwrap(), 273.15);
    /// assert!((TemperatureUnit::Fahrenheit.to_kelvin("t", 212.0).unwrap() - 373.15).abs() < 1e-12);
    /// assert_eq!(
    ///     TemperatureUnit::Celsius.to_kelvin("t", -300.0).unwrap_err().code(),
    ///     "NON_POSITIVE_TEMPERATURE"
    /// );
    /// ```
    ///
    /// # References
    /// BIPM SI Brochure, 9th ed. (2019), §2.3.1; NIST SP 811 (2008), Appendix B.8.
    pub fn to_kelvin(self, arg: &'static str, value: f64) -> Result<f64> {
        let t = error::finite(arg, value)?;
        let k = match self {
            TemperatureUnit::Kelvin => t,
            TemperatureUnit::Celsius => t + 273.15,
            TemperatureUnit::Fahrenheit => (t + 459.67) * (5.0 / 9.0),
            TemperatureUnit::Rankine => t * (5.0 / 9.0),
        };
        error::temperature(arg, k)
    }

    /// Converts an absolute temperature in kelvin to this unit.
    ///
    /// # Formula
    /// ```text
    /// t = T − 273.15 (°C);   t = 1.8·T − 459.67 (°F);   t = 1.8·T (°R)
    /// ```
    ///
    /// # Errors
    /// [`Error::NonFinite`] for NaN/±∞; [`Error::NonPositiveTemperature`] for `kelvin` ≤ 0.
    /// A result beyond the f64 range (°F or °R above `f64::MAX`/1.8 K) is +∞, not an error.
    ///
    /// # Examples
    /// ```
    /// use quantaband::units::TemperatureUnit;
    /// assert!((TemperatureUnit::Fahrenheit.from_kelvin("t", 233.15).unwrap() + 40.0).abs() < 1e-12);
    /// ```
    pub fn from_kelvin(self, arg: &'static str, kelvin: f64) -> Result<f64> {
        let k = error::temperature(arg, kelvin)?;
        Ok(match self {
            TemperatureUnit::Kelvin => k,
            TemperatureUnit::Celsius => k - 273.15,
            TemperatureUnit::Fahrenheit => k * 1.8 - 459.67,
            TemperatureUnit::Rankine => k * 1.8,
        })
    }

    /// Converts a temperature *difference* in this unit to kelvin (no offset).
    ///
    /// # Formula
    /// ```text
    /// ΔT = Δt (K, °C);   ΔT = Δt · 5/9 (°F, °R)
    /// ```
    ///
    /// # Errors
    /// [`Error::NonFinite`] for NaN/±∞. Differences may be negative or zero.
    ///
    /// # Examples
    /// ```
    /// use quantaband::units::TemperatureUnit;
    /// assert_eq!(TemperatureUnit::Celsius.difference_to_kelvin("dt", 10.0).unwrap(), 10.0);
    /// assert_eq!(TemperatureUnit::Fahrenheit.difference_to_kelvin("dt", 9.0).unwrap(), 5.0);
    /// ```
    pub fn difference_to_kelvin(self, arg: &'static str, delta: f64) -> Result<f64> {
        let d = error::finite(arg, delta)?;
        Ok(match self {
            TemperatureUnit::Kelvin | TemperatureUnit::Celsius => d,
            // d·5 would overflow for |d| > f64::MAX/5 although d·5/9 does not.
            TemperatureUnit::Fahrenheit | TemperatureUnit::Rankine if d.abs() > f64::MAX / 5.0 => {
                d / 9.0 * 5.0
            }
            TemperatureUnit::Fahrenheit | TemperatureUnit::Rankine => d * 5.0 / 9.0,
        })
    }

    /// Converts a temperature *difference* in kelvin to this unit (no offset).
    ///
    /// # Errors
    /// [`Error::NonFinite`] for NaN/±∞. A result beyond the f64 range (°F or °R for
    /// |ΔT| > `f64::MAX`/1.8 K) is ±∞, not an error.
    ///
    /// # Examples
    /// ```
    /// use quantaband::units::TemperatureUnit;
    /// assert_eq!(TemperatureUnit::Fahrenheit.difference_from_kelvin("dt", 5.0).unwrap(), 9.0);
    /// ```
    pub fn difference_from_kelvin(self, arg: &'static str, delta_k: f64) -> Result<f64> {
        let d = error::finite(arg, delta_k)?;
        Ok(match self {
            TemperatureUnit::Kelvin | TemperatureUnit::Celsius => d,
            TemperatureUnit::Fahrenheit | TemperatureUnit::Rankine => d * 1.8,
        })
    }
}

/// Converts an absolute temperature between two units.
///
/// # Errors
/// As [`TemperatureUnit::to_kelvin`]. A result beyond the f64 range is +∞ (see
/// [`TemperatureUnit::from_kelvin`]).
///
/// # Examples
/// ```
/// use quantaband::units::{convert_temperature, TemperatureUnit};
/// // −40 °F is −40 °C (NIST SP 811, Appendix B.8 relations).
/// let c = convert_temperature("t", -40.0, TemperatureUnit::Fahrenheit, TemperatureUnit::Celsius).unwrap();
/// assert!((c + 40.0).abs() < 1e-12);
/// ```
pub fn convert_temperature(
    arg: &'static str,
    value: f64,
    from: TemperatureUnit,
    to: TemperatureUnit,
) -> Result<f64> {
    let k = from.to_kelvin(arg, value)?;
    to.from_kelvin(arg, k)
}

/// Converts a temperature difference between two units.
///
/// # Errors
/// [`Error::NonFinite`] for NaN/±∞. A result beyond the f64 range is ±∞ (see
/// [`TemperatureUnit::difference_from_kelvin`]).
///
/// # Examples
/// ```
/// use quantaband::units::{convert_temperature_difference, TemperatureUnit};
/// let d = convert_temperature_difference("dt", 1.0, TemperatureUnit::Kelvin, TemperatureUnit::Fahrenheit).unwrap();
/// assert_eq!(d, 1.8);
/// ```
pub fn convert_temperature_difference(
    arg: &'static str,
    delta: f64,
    from: TemperatureUnit,
    to: TemperatureUnit,
) -> Result<f64> {
    let k = from.difference_to_kelvin(arg, delta)?;
    to.difference_from_kelvin(arg, k)
}

/// Centimetres per metre: D* in cm·Hz^½·W⁻¹ ("Jones") = 100 × D* in m·Hz^½·W⁻¹.
const JONES_PER_SI_D_STAR: f64 = 100.0;

/// Converts a specific detectivity D* from SI (m·Hz^½·W⁻¹) to cm·Hz^½·W⁻¹ ("Jones"), the unit
/// detector data sheets quote.
///
/// # Formula
/// ```text
/// D*_Jones = 100·D*_SI       (D* = √(A·Δf)/NEP: the √area carries the length unit, 1 m = 100 cm)
/// ```
///
/// # Errors
/// [`Error::NonFinite`] / [`Error::NonPositive`] for `d_star` (a detectivity is > 0);
/// [`Error::OutOfRange`] when the result overflows to ∞ (D* above 1.8e306 m·Hz^½·W⁻¹).
///
/// # Accuracy
/// One rounding of the product (≤ 0.5 ulp); the round trip through [`jones_to_d_star`] returns
/// the input within 1 ulp (`cargo test --lib units`).
///
/// # Examples
/// ```
/// use quantaband::units::d_star_to_jones;
/// // 1e9 m·Hz^½/W is 1e11 cm·Hz^½/W (1 m = 100 cm, BIPM SI Brochure Table 7).
/// assert_eq!(d_star_to_jones(1e9).unwrap(), 1e11);
/// ```
///
/// # References
/// BIPM, *The International System of Units (SI)*, 9th ed. (2019), Table 7 (centi = 10⁻²);
/// R. C. Jones, "Performance of detectors for visible and infrared radiation", Adv. Electron.
/// 5, 1 (1953) (the detectivity normalised to unit area and bandwidth) — from memory.
pub fn d_star_to_jones(d_star: f64) -> Result<f64> {
    error::positive("d_star", d_star)?;
    in_range("d_star", d_star, d_star * JONES_PER_SI_D_STAR)
}

/// Converts a specific detectivity D* from cm·Hz^½·W⁻¹ ("Jones") to SI (m·Hz^½·W⁻¹).
///
/// # Formula
/// ```text
/// D*_SI = D*_Jones/100
/// ```
///
/// # Errors
/// [`Error::NonFinite`] / [`Error::NonPositive`] for `jones`; [`Error::OutOfRange`] when the
/// result underflows to 0 (below about 2.5e-322 cm·Hz^½·W⁻¹).
///
/// # Accuracy
/// One rounding of the quotient (≤ 0.5 ulp in the normal range); round trip as
/// [`d_star_to_jones`].
///
/// # Examples
/// ```
/// use quantaband::units::jones_to_d_star;
/// assert_eq!(jones_to_d_star(6.0e11).unwrap(), 6.0e9);
/// ```
///
/// # References
/// As [`d_star_to_jones`].
pub fn jones_to_d_star(jones: f64) -> Result<f64> {
    error::positive("jones", jones)?;
    in_range("jones", jones, jones / JONES_PER_SI_D_STAR)
}

/// The range reported when a decibel value has no positive finite power ratio.
const DECIBEL_RANGE: &str = "decibel values whose power ratio is a positive finite f64";

/// A power ratio (linear, dimensionless) from its value `decibels` in dB, e.g. a Y factor read
/// from a noise-figure meter.
///
/// # Formula
/// ```text
/// r = 10^(x/10)      x the value in dB
/// ```
///
/// # Errors
/// [`Error::NonFinite`] for NaN/±∞; [`Error::OutOfRange`] when r overflows or underflows to 0
/// (x above about 3082.5 dB or below about −3233 dB).
///
/// Evaluated as exp(x·(ln 10)/10) (one `exp`, no `pow`: the module keeps no `pow` for this).
///
/// # Accuracy
/// ≤ 1 ulp of `exp` plus the roundings of the exponent amplified by |ln r| (relative error
/// ≤ 1e-15 for |x| ≤ 30 dB); checked against mpmath 1.3.0 (30 digits) in the unit tests and
/// `tests/js/quantum.test.mjs`.
///
/// # Examples
/// ```
/// use quantaband::units::power_ratio_from_decibels;
/// assert!((power_ratio_from_decibels("y", 20.0).unwrap() / 100.0 - 1.0).abs() < 1e-15);
/// // 10^0.3 = 1.995 262 314 968 879 601… (mpmath)
/// assert!((power_ratio_from_decibels("y", 3.0).unwrap() / 1.995_262_314_968_879_6 - 1.0).abs() < 4e-16);
/// ```
///
/// # References
/// IEC 60027-3:2002, *Letter symbols to be used in electrical technology — Part 3: Logarithmic
/// and related quantities, and their units* (the decibel of a power ratio) (from memory).
pub fn power_ratio_from_decibels(arg: &'static str, decibels: f64) -> Result<f64> {
    let x = error::finite(arg, decibels)?;
    let r = crate::float::exp(x * (core::f64::consts::LN_10 / 10.0));
    if r > 0.0 && r.is_finite() {
        Ok(r)
    } else {
        Err(Error::OutOfRange {
            arg,
            value: decibels,
            range: DECIBEL_RANGE,
        })
    }
}

/// The value in dB of a power ratio `ratio` (linear, > 0).
///
/// # Formula
/// ```text
/// x = 10·log10(r)
/// ```
///
/// # Errors
/// [`Error::NonFinite`] for NaN/±∞; [`Error::NonPositive`] for r ≤ 0.
///
/// Evaluated as ln(r)·(10/ln 10).
///
/// # Accuracy
/// ≤ 3 ulp of the result plus 1 ulp of ln r (one `ln`, one multiplication by a rounded
/// constant); checked against mpmath 1.3.0 in the unit tests.
///
/// # Examples
/// ```
/// use quantaband::units::power_ratio_to_decibels;
/// assert!((power_ratio_to_decibels("y", 1000.0).unwrap() - 30.0).abs() < 1e-14);
/// // 10·log10(2) = 3.010 299 956 639 811 952… (mpmath)
/// assert!((power_ratio_to_decibels("y", 2.0).unwrap() - 3.010_299_956_639_812).abs() < 1e-15);
/// ```
///
/// # References
/// As [`power_ratio_from_decibels`].
pub fn power_ratio_to_decibels(arg: &'static str, ratio: f64) -> Result<f64> {
    let r = error::positive(arg, ratio)?;
    Ok(crate::float::ln(r) * (10.0 / core::f64::consts::LN_10))
}

#[cfg(test)]
mod tests {
    use super::*;

    fn rel(a: f64, b: f64) -> f64 {
        ((a - b) / b).abs()
    }

    #[test]
    fn hc_constant_matches_product() {
        // The literal is the correctly rounded exact product (mpmath, 40 digits); the f64 product
        // of the exact-by-definition h and c may differ by at most one rounding.
        assert!(rel(HC, PLANCK_H * SPEED_OF_LIGHT_C) < 2.3e-16);
    }

    #[test]
    fn every_unit_round_trips_through_its_name() {
        for u in SpectralUnit::ALL {
            assert_eq!(SpectralUnit::parse(u.name()).unwrap(), u);
            assert_eq!(u.kind().si_unit().kind(), u.kind());
        }
        for u in TemperatureUnit::ALL {
            assert_eq!(TemperatureUnit::parse(u.name()).unwrap(), u);
        }
    }

    #[test]
    fn aliases_parse() {
        for n in ["um", "\u{b5}m", "\u{3bc}m", "micron"] {
            assert_eq!(SpectralUnit::parse(n).unwrap(), SpectralUnit::Micrometre);
        }
        for n in ["cm-1", "cm^-1", "cm\u{207b}\u{b9}", "1/cm"] {
            assert_eq!(SpectralUnit::parse(n).unwrap(), SpectralUnit::PerCentimetre);
        }
        for n in ["degC", "\u{b0}C", "\u{2103}", "C"] {
            assert_eq!(TemperatureUnit::parse(n).unwrap(), TemperatureUnit::Celsius);
        }
        for n in ["degF", "\u{b0}F", "\u{2109}", "F"] {
            assert_eq!(
                TemperatureUnit::parse(n).unwrap(),
                TemperatureUnit::Fahrenheit
            );
        }
    }

    #[test]
    fn unknown_names_are_rejected() {
        for n in ["", "NM", "mhz", "Um", "kelvin ", "cm", "K ", "ev"] {
            assert_eq!(
                SpectralUnit::parse(n).unwrap_err().code(),
                "UNKNOWN_UNIT",
                "{n:?}"
            );
        }
        for n in ["", "k", "c", "deg C", "R", "kelvin"] {
            assert_eq!(
                TemperatureUnit::parse(n).unwrap_err().code(),
                "UNKNOWN_UNIT",
                "{n:?}"
            );
        }
    }

    #[test]
    fn same_kind_conversions_are_decimal() {
        // BIPM SI Brochure 9th ed. Table 7 (prefixes).
        let c = |v, a, b| convert_spectral("x", v, a, b).unwrap();
        assert!(
            rel(
                c(10.0, SpectralUnit::Micrometre, SpectralUnit::Nanometre),
                10_000.0
            ) < 1e-15
        );
        assert!(rel(c(3.0, SpectralUnit::Millimetre, SpectralUnit::Metre), 3e-3) < 1e-15);
        assert!(
            rel(
                c(2.5, SpectralUnit::Terahertz, SpectralUnit::Gigahertz),
                2500.0
            ) < 1e-15
        );
        assert!(
            rel(
                c(1.0, SpectralUnit::PerCentimetre, SpectralUnit::PerMetre),
                100.0
            ) < 1e-15
        );
        assert!(
            rel(
                c(
                    1.0,
                    SpectralUnit::Electronvolt,
                    SpectralUnit::Millielectronvolt
                ),
                1000.0
            ) < 1e-15
        );
        assert!(
            rel(
                c(1.0, SpectralUnit::Electronvolt, SpectralUnit::Joule),
                1.602_176_634e-19
            ) < 1e-15
        );
    }

    #[test]
    fn cross_kind_conversions_match_codata_2018() {
        let c = |v, a, b| convert_spectral("x", v, a, b).unwrap();
        // Definition of the wavenumber: 10 µm ↔ 1000 cm⁻¹.
        assert!(
            rel(
                c(10.0, SpectralUnit::Micrometre, SpectralUnit::PerCentimetre),
                1000.0
            ) < 1e-15
        );
        // c = 299 792 458 m/s exactly: 1 µm ↔ 299.792458 THz.
        assert!(
            rel(
                c(1.0, SpectralUnit::Micrometre, SpectralUnit::Terahertz),
                299.792_458
            ) < 1e-15
        );
        assert!(
            rel(
                c(
                    299.792_458,
                    SpectralUnit::Terahertz,
                    SpectralUnit::Micrometre
                ),
                1.0
            ) < 1e-15
        );
        // CODATA 2018 "electron volt-hertz relationship": 2.417 989 242…e14 Hz (exact).
        assert!(
            rel(
                c(1.0, SpectralUnit::Electronvolt, SpectralUnit::Hertz),
                2.417_989_242_084_918e14
            ) < 1e-15
        );
        // CODATA 2018 "electron volt-inverse meter relationship": 8.065 543 937…e5 m⁻¹ (exact).
        assert!(
            rel(
                c(1.0, SpectralUnit::Electronvolt, SpectralUnit::PerMetre),
                8.065_543_937_349_212e5
            ) < 1e-15
        );
        // hc/e = 1.239 841 984…e-6 m (exact).
        assert!(
            rel(
                c(1.0, SpectralUnit::Electronvolt, SpectralUnit::Metre),
                1.239_841_984_332_002_6e-6
            ) < 1e-15
        );
        // and back
        assert!(
            rel(
                c(
                    1_239.841_984_332_002_6,
                    SpectralUnit::Nanometre,
                    SpectralUnit::Electronvolt
                ),
                1.0
            ) < 1e-15
        );
        // CODATA 2018 "hertz-inverse meter relationship": 1 Hz ↔ 3.335 640 951…e-9 m⁻¹.
        assert!(
            rel(
                c(1.0, SpectralUnit::Hertz, SpectralUnit::PerMetre),
                3.335_640_951_981_52e-9
            ) < 1e-14
        );
    }

    #[test]
    fn every_pair_round_trips() {
        for a in SpectralUnit::ALL {
            for b in SpectralUnit::ALL {
                for v in [1e-3, 0.7, 12.5, 4.0e5] {
                    let y = convert_spectral("x", v, a, b).unwrap();
                    let back = convert_spectral("x", y, b, a).unwrap();
                    assert!(rel(back, v) < 1e-15, "{a:?} -> {b:?} at {v}: {back}");
                }
            }
        }
    }

    #[test]
    fn extreme_spectral_values_do_not_overflow_on_the_way() {
        // λ = 1e-300 m: ν = c/λ ≈ 3.0e308 Hz is above f64::MAX (true overflow, ∞ is right), but
        // E = hc/λ ≈ 1.99e275 J is representable — a chain λ → ν → E would wrongly give ∞.
        let e = SpectralKind::Wavelength
            .convert_si("x", 1e-300, SpectralKind::PhotonEnergy)
            .unwrap();
        assert!(rel(e, 1.986_445_857_148_928_7e275) < 1e-15);
        let nu = SpectralKind::Wavelength
            .convert_si("x", 1e-300, SpectralKind::Frequency)
            .unwrap();
        assert_eq!(nu, f64::INFINITY);
        // A wavenumber of 1e-300 m⁻¹ is a photon energy below the f64 range: 0, not an error.
        let e = SpectralKind::Wavenumber
            .convert_si("x", 1e-300, SpectralKind::PhotonEnergy)
            .unwrap();
        assert_eq!(e, 0.0);
        // 1e-200 m is fine everywhere.
        let e = SpectralKind::Wavelength
            .convert_si("x", 1e-200, SpectralKind::PhotonEnergy)
            .unwrap();
        assert!(rel(e, 1.986_445_857_148_928_7e175) < 1e-15);
        // A gamma-ray photon energy of 1e300 eV has a tiny but representable wavelength.
        let lam =
            convert_spectral("x", 1e300, SpectralUnit::Electronvolt, SpectralUnit::Metre).unwrap();
        assert!(rel(lam, 1.239_841_984_332_002_6e-306) < 1e-14);
        // A nanometre value whose SI form underflows is reported, not silently zero.
        assert_eq!(
            SpectralUnit::Nanometre.to_si("x", 1e-320).unwrap_err(),
            Error::OutOfRange {
                arg: "x",
                value: 1e-320,
                range: CONVERTIBLE
            }
        );
    }

    #[test]
    fn spectral_bad_input() {
        for (v, code) in [
            (f64::NAN, "NON_FINITE"),
            (f64::INFINITY, "NON_FINITE"),
            (f64::NEG_INFINITY, "NON_FINITE"),
            (0.0, "NON_POSITIVE_SPECTRAL"),
            (-1.0, "NON_POSITIVE_SPECTRAL"),
        ] {
            let e = convert_spectral("x", v, SpectralUnit::Micrometre, SpectralUnit::Hertz)
                .unwrap_err();
            assert_eq!(e.code(), code);
            let e = convert_spectral("x", v, SpectralUnit::Micrometre, SpectralUnit::Micrometre)
                .unwrap_err();
            assert_eq!(e.code(), code);
        }
    }

    #[test]
    fn temperature_definitions() {
        use TemperatureUnit::*;
        // BIPM SI Brochure 9th ed. §2.3.1: t/°C = T/K − 273.15.
        assert_eq!(Celsius.to_kelvin("t", 0.0).unwrap(), 273.15);
        assert!((Celsius.to_kelvin("t", 100.0).unwrap() - 373.15).abs() < 1e-12);
        assert!((Celsius.from_kelvin("t", 273.16).unwrap() - 0.01).abs() < 1e-12);
        // NIST SP 811 Appendix B.8: T/K = (t/°F + 459.67)/1.8; 32 °F = 273.15 K, 212 °F = 373.15 K,
        // −40 °F = −40 °C; B.9: T/K = (T/°R)/1.8.
        assert!((Fahrenheit.to_kelvin("t", 32.0).unwrap() - 273.15).abs() < 1e-12);
        assert!((Fahrenheit.to_kelvin("t", 212.0).unwrap() - 373.15).abs() < 1e-12);
        assert!(
            (convert_temperature("t", -40.0, Fahrenheit, Celsius).unwrap() + 40.0).abs() < 1e-12
        );
        assert!((Rankine.to_kelvin("t", 491.67).unwrap() - 273.15).abs() < 1e-12);
        assert!((Rankine.from_kelvin("t", 100.0).unwrap() - 180.0).abs() < 1e-12);
        for u in TemperatureUnit::ALL {
            for k in [1e-6, 0.5, 77.0, 300.0, 1234.5, 3.0e4] {
                let t = u.from_kelvin("t", k).unwrap();
                let back = u.to_kelvin("t", t).unwrap();
                assert!(
                    (back - k).abs() <= 1e-12 * k.max(460.0),
                    "{u:?} {k}: {back}"
                );
            }
        }
    }

    #[test]
    fn temperatures_at_or_below_absolute_zero_are_rejected() {
        use TemperatureUnit::*;
        for (u, t) in [
            (Kelvin, 0.0),
            (Kelvin, -1.0),
            (Celsius, -273.15),
            (Celsius, -300.0),
            (Fahrenheit, -459.67),
            (Fahrenheit, -500.0),
            (Rankine, 0.0),
        ] {
            let e = u.to_kelvin("t", t).unwrap_err();
            assert_eq!(e.code(), "NON_POSITIVE_TEMPERATURE", "{u:?} {t}");
        }
        assert_eq!(
            Celsius.from_kelvin("t", 0.0).unwrap_err().code(),
            "NON_POSITIVE_TEMPERATURE"
        );
        assert_eq!(
            Celsius.to_kelvin("t", f64::NAN).unwrap_err().code(),
            "NON_FINITE"
        );
        // Just above absolute zero is valid.
        assert!(Celsius.to_kelvin("t", -273.14).unwrap() > 0.0);
    }

    #[test]
    fn differences_have_no_offset() {
        use TemperatureUnit::*;
        assert_eq!(Celsius.difference_to_kelvin("dt", -5.0).unwrap(), -5.0);
        assert_eq!(Fahrenheit.difference_to_kelvin("dt", 18.0).unwrap(), 10.0);
        assert_eq!(Rankine.difference_from_kelvin("dt", 10.0).unwrap(), 18.0);
        assert_eq!(
            convert_temperature_difference("dt", 0.0, Fahrenheit, Kelvin).unwrap(),
            0.0
        );
        assert_eq!(
            Kelvin
                .difference_to_kelvin("dt", f64::NAN)
                .unwrap_err()
                .code(),
            "NON_FINITE"
        );
    }

    #[test]
    fn d_star_jones_round_trip_and_limits() {
        // 1 m = 100 cm (BIPM SI Brochure, Table 7): D* scales with the length unit of √area.
        assert_eq!(d_star_to_jones(6.04e9).unwrap(), 6.04e11);
        assert_eq!(jones_to_d_star(6.04e11).unwrap(), 6.04e9);
        let mut worst = 0f64;
        let mut x = 1.234_567_890_123e-300;
        while x < 1e300 {
            let back = jones_to_d_star(d_star_to_jones(x).unwrap()).unwrap();
            worst = worst.max(rel(back, x));
            x *= 7.77;
        }
        assert!(worst <= f64::EPSILON, "{worst}");
        assert_eq!(d_star_to_jones(0.0).unwrap_err().code(), "NON_POSITIVE");
        assert_eq!(d_star_to_jones(-1e9).unwrap_err().code(), "NON_POSITIVE");
        assert_eq!(jones_to_d_star(f64::NAN).unwrap_err().code(), "NON_FINITE");
        assert_eq!(d_star_to_jones(1e307).unwrap_err().code(), "OUT_OF_RANGE");
        assert_eq!(jones_to_d_star(5e-324).unwrap_err().code(), "OUT_OF_RANGE");
        assert_eq!(d_star_to_jones(1.7e306).unwrap(), 1.7e308);
    }

    #[test]
    // the mpmath digits as printed
    #[allow(clippy::excessive_precision)]
    fn decibels_against_mpmath() {
        // mpmath 1.3.0, 30 digits: 10**(mpf(x)/10) and 10*log10(mpf(r)).
        for (db, r) in [
            (3.0, 1.995_262_314_968_879_601_4),
            (1.76, 1.499_684_835_502_373_498_1),
            (-3.0, 0.501_187_233_627_272_285),
            (0.5, 1.122_018_454_301_963_435_6),
            (25.3, 338.844_156_139_202_547_05),
        ] {
            let got = power_ratio_from_decibels("y", db).unwrap();
            assert!(rel(got, r) <= 1e-15, "{db} dB: {got} vs {r}");
        }
        for (r, db) in [
            (2.0, 3.010_299_956_639_811_952_1),
            (1.5, 1.760_912_590_556_812_420_8),
            (0.5, -3.010_299_956_639_811_952_1),
        ] {
            let got = power_ratio_to_decibels("y", r).unwrap();
            assert!((got - db).abs() <= 1e-15 * db.abs(), "{r}: {got} vs {db}");
        }
        assert!(rel(power_ratio_from_decibels("y", 10.0).unwrap(), 10.0) <= 1e-15);
        assert!((power_ratio_to_decibels("y", 100.0).unwrap() - 20.0).abs() <= 1e-14);
        assert_eq!(
            power_ratio_from_decibels("y", 3100.0).unwrap_err().code(),
            "OUT_OF_RANGE"
        );
        assert_eq!(
            power_ratio_from_decibels("y", -3300.0).unwrap_err().code(),
            "OUT_OF_RANGE"
        );
        assert_eq!(
            power_ratio_from_decibels("y", f64::NAN).unwrap_err().code(),
            "NON_FINITE"
        );
        assert_eq!(
            power_ratio_to_decibels("y", 0.0).unwrap_err().code(),
            "NON_POSITIVE"
        );
    }
}
