//! Tabulated spectral quantities: target emissivity ε(λ) and reflectance, path and window
//! transmittance τ(λ), window reflectance ρ(λ), and detector responsivity in energy or photon
//! units — a wavelength grid and one value per grid point.
//!
//! [`SpectralTable`] borrows and validates the caller's slices (nothing is copied or allocated);
//! [`SpectralTableBuf`] (feature `alloc`) owns its data, can be (de)serialized (feature
//! `serde`) and can be read from two-column text or CSV ([`SpectralTableBuf::from_text`]).
//!
//! # Interpolation: piecewise linear
//! Between grid points the value is the straight line through its two neighbours. Linear
//! interpolation is a convex combination of the neighbours, so it never overshoots: values
//! tabulated in [0, 1] (ε, τ, ρ) stay in [0, 1] everywhere, and a sum that is ≤ 1 at every grid
//! point of two tables (a window's τ_w + ρ_w) is ≤ 1 everywhere, which a spline does not
//! guarantee. It is also the interpolant anyone can reproduce from the table by hand, and the
//! product of linear pieces is a polynomial, which the quadrature of the measurement equation
//! integrates without interpolation error ([`super::spectral`]).
//!
//! # Outside the grid
//! A value outside [λ_first, λ_last] is an error ([`Error::OutsideTable`]), not a silent
//! extrapolation, unless the table was given constant end values
//! ([`SpectralTable::with_ends`] with [`Ends::Constant`]): then the first value holds below the
//! grid and the last above it. A response table is different: it defines the instrument's band
//! and the response is zero outside it (the measurement equation integrates over the response
//! grid only), so its `ends` setting is never used.
//!
//! # Validation
//! At least 2 points, equal lengths, wavelengths finite, > 0 and strictly increasing, values
//! finite; ε, ρ, τ in [0, 1]; responses ≥ 0 and not all zero. Each failure names the table and
//! the index of the first offending element ([`Error::InvalidTableEntry`],
//! [`Error::NotIncreasing`]); text input names the line ([`Error::InvalidLine`]).
//!
//! # References
//! Piecewise-linear interpolation of tabulated optical data is common practice, no source.
#![forbid(unsafe_code)]

use crate::{Error, Result};

/// What a [`SpectralTable`] holds; the kind fixes the allowed values and how the measurement
/// equation uses the table.
///
/// # Examples
/// ```
/// use quantaband::thermometry::table::TableKind;
/// assert!(TableKind::PhotonResponse.is_response());
/// assert_eq!(TableKind::Emissivity.name(), "emissivity");
/// ```
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase")
)]
pub enum TableKind {
    /// Target spectral emissivity ε(λ), dimensionless, in [0, 1].
    Emissivity,
    /// Spectral reflectance ρ(λ) (of a target or a window), dimensionless, in [0, 1].
    Reflectance,
    /// Spectral transmittance τ(λ) (of a path or a window), dimensionless, in [0, 1].
    Transmittance,
    /// Detector or instrument response to radiant power (A/W, V/W or relative), ≥ 0: the
    /// signal is ∫ R(λ)·L_λ dλ with L_λ in W·m⁻³·sr⁻¹.
    EnergyResponse,
    /// Response to photon flux (quantum efficiency, electrons per photon, or relative), ≥ 0:
    /// the signal is ∫ η(λ)·L_p,λ dλ with the photon radiance L_p,λ = L_λ·λ/(hc) in
    /// photons·s⁻¹·m⁻³·sr⁻¹ (photon-counting detectors).
    PhotonResponse,
}

impl TableKind {
    /// Whether this kind is a detector response (energy or photon).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::table::TableKind;
    /// assert!(!TableKind::Transmittance.is_response());
    /// ```
    pub const fn is_response(self) -> bool {
        matches!(self, TableKind::EnergyResponse | TableKind::PhotonResponse)
    }

    /// A short lower-case name (`"emissivity"`, `"reflectance"`, `"transmittance"`,
    /// `"energy response"`, `"photon response"`).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::table::TableKind;
    /// assert_eq!(TableKind::PhotonResponse.name(), "photon response");
    /// ```
    pub const fn name(self) -> &'static str {
        match self {
            TableKind::Emissivity => "emissivity",
            TableKind::Reflectance => "reflectance",
            TableKind::Transmittance => "transmittance",
            TableKind::EnergyResponse => "energy response",
            TableKind::PhotonResponse => "photon response",
        }
    }

    /// Argument name of the value column in error reports.
    const fn values_arg(self) -> &'static str {
        match self {
            TableKind::Emissivity => "emissivity.values",
            TableKind::Reflectance => "reflectance.values",
            TableKind::Transmittance => "transmittance.values",
            TableKind::EnergyResponse => "energy_response.values",
            TableKind::PhotonResponse => "photon_response.values",
        }
    }

    /// Argument name of the wavelength column in error reports.
    const fn wavelengths_arg(self) -> &'static str {
        match self {
            TableKind::Emissivity => "emissivity.wavelengths_m",
            TableKind::Reflectance => "reflectance.wavelengths_m",
            TableKind::Transmittance => "transmittance.wavelengths_m",
            TableKind::EnergyResponse => "energy_response.wavelengths_m",
            TableKind::PhotonResponse => "photon_response.wavelengths_m",
        }
    }

    /// The allowed values, in interval notation.
    const fn range(self) -> &'static str {
        if self.is_response() {
            "[0, inf)"
        } else {
            "[0, 1]"
        }
    }

    /// Whether `v` is an allowed value (finite, in [`Self::range`]).
    fn accepts(self, v: f64) -> bool {
        if self.is_response() {
            (0.0..f64::INFINITY).contains(&v)
        } else {
            (0.0..=1.0).contains(&v)
        }
    }
}

/// What a table gives outside its wavelength grid (see the module docs).
///
/// # Examples
/// ```
/// use quantaband::thermometry::table::{Ends, SpectralTable, TableKind};
/// let (wl, e) = ([8e-6, 14e-6], [0.9, 0.8]);
/// let t = SpectralTable::new(TableKind::Emissivity, &wl, &e).unwrap();
/// assert_eq!(t.value_at(20e-6).unwrap_err().code(), "OUTSIDE_TABLE");
/// assert_eq!(t.with_ends(Ends::Constant).value_at(20e-6).unwrap(), 0.8);
/// ```
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Default)]
#[cfg_attr(
    feature = "serde",
    derive(serde::Serialize, serde::Deserialize),
    serde(rename_all = "camelCase")
)]
pub enum Ends {
    /// A value outside the grid is an error ([`Error::OutsideTable`]). The default.
    #[default]
    Reject,
    /// The first value holds below the grid, the last above it.
    Constant,
}

/// A validated spectral table borrowed from the caller: wavelengths (m, strictly increasing),
/// one value per wavelength, its [`TableKind`] and its behaviour outside the grid.
///
/// # Formula
/// ```text
/// v(λ) = v_i + (v_{i+1} − v_i)·(λ − λ_i)/(λ_{i+1} − λ_i)     λ_i ≤ λ ≤ λ_{i+1}
/// v(λ) = v_0 (λ < λ_0), v_{n−1} (λ > λ_{n−1})                 only with Ends::Constant
/// ```
///
/// # Errors
/// See [`SpectralTable::new`] and [`SpectralTable::value_at`].
///
/// # Accuracy
/// Exact linear interpolation (a few roundings).
///
/// # Examples
/// ```
/// use quantaband::thermometry::table::{SpectralTable, TableKind};
/// let wl = [8e-6, 10e-6, 14e-6];
/// let tau = [0.90, 0.70, 0.70];
/// let t = SpectralTable::new(TableKind::Transmittance, &wl, &tau).unwrap();
/// assert!((t.value_at(9e-6).unwrap() - 0.80).abs() < 1e-15);
/// // τ = 1.2 at index 1 is rejected, naming the index
/// let bad = SpectralTable::new(TableKind::Transmittance, &wl, &[0.9, 1.2, 0.7]).unwrap_err();
/// assert_eq!(bad.code(), "INVALID_TABLE_ENTRY");
/// assert!(matches!(bad, quantaband::Error::InvalidTableEntry { index: 1, .. }));
/// ```
///
/// # References
/// Common practice, no source (see the module docs for the choice of interpolant).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SpectralTable<'a> {
    kind: TableKind,
    wavelengths_m: &'a [f64],
    values: &'a [f64],
    ends: Ends,
}

/// Validation shared by the borrowed and owned tables.
fn validate(kind: TableKind, wavelengths_m: &[f64], values: &[f64]) -> Result<()> {
    if wavelengths_m.len() != values.len() {
        return Err(Error::LengthMismatch {
            expected: wavelengths_m.len(),
            got: values.len(),
        });
    }
    if wavelengths_m.len() < 2 {
        return Err(Error::TooFewPoints {
            needed: 2,
            got: wavelengths_m.len(),
        });
    }
    let mut prev = 0.0;
    for (i, &w) in wavelengths_m.iter().enumerate() {
        if !(w > 0.0 && w < f64::INFINITY) {
            return Err(Error::InvalidTableEntry {
                arg: kind.wavelengths_arg(),
                index: i,
                value: w,
                range: "(0, inf)",
            });
        }
        if i > 0 && w <= prev {
            return Err(Error::NotIncreasing {
                arg: kind.wavelengths_arg(),
                index: i,
            });
        }
        prev = w;
    }
    let mut any = false;
    for (i, &v) in values.iter().enumerate() {
        if !kind.accepts(v) {
            return Err(Error::InvalidTableEntry {
                arg: kind.values_arg(),
                index: i,
                value: v,
                range: kind.range(),
            });
        }
        any |= v > 0.0;
    }
    if kind.is_response() && !any {
        return Err(Error::NonPositive {
            arg: kind.values_arg(),
            value: 0.0,
        });
    }
    Ok(())
}

impl<'a> SpectralTable<'a> {
    /// Validates and wraps a table of `kind`: `wavelengths_m` (m) and `values` (dimensionless
    /// for ε, ρ, τ; the response's own unit for responses). Outside the grid it rejects
    /// queries ([`Ends::Reject`]); see [`SpectralTable::with_ends`].
    ///
    /// # Formula
    /// ```text
    /// accepted iff n ≥ 2, len(λ) = len(v), 0 < λ_0 < λ_1 < … < ∞,
    ///   ε, ρ, τ: 0 ≤ v_i ≤ 1;   responses: 0 ≤ v_i < ∞ and some v_i > 0
    /// ```
    ///
    /// # Errors
    /// - `LengthMismatch` (expected = number of wavelengths);
    /// - `TooFewPoints` for an empty table or a single point;
    /// - `InvalidTableEntry` (arg `<kind>.wavelengths_m`, the index) for a wavelength that is
    ///   not finite and > 0;
    /// - `NotIncreasing` (arg `<kind>.wavelengths_m`, the index) for a wavelength not larger
    ///   than the one before;
    /// - `InvalidTableEntry` (arg `<kind>.values`, the index) for a NaN/∞ value or one outside
    ///   [0, 1] (ε, ρ, τ) or below 0 (responses);
    /// - `NonPositive` (arg `<kind>.values`) for a response that is zero everywhere.
    ///
    /// # Accuracy
    /// Exact (validation only; the slices are borrowed, not copied).
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::table::{SpectralTable, TableKind};
    /// let e = SpectralTable::new(TableKind::Emissivity, &[8e-6, 8e-6], &[0.9, 0.9]).unwrap_err();
    /// assert_eq!(e.code(), "NOT_INCREASING");
    /// assert_eq!(SpectralTable::new(TableKind::Emissivity, &[], &[]).unwrap_err().code(), "TOO_FEW_POINTS");
    /// ```
    ///
    /// # References
    /// Common practice, no source.
    pub fn new(kind: TableKind, wavelengths_m: &'a [f64], values: &'a [f64]) -> Result<Self> {
        validate(kind, wavelengths_m, values)?;
        Ok(SpectralTable {
            kind,
            wavelengths_m,
            values,
            ends: Ends::Reject,
        })
    }

    /// The same table with the given behaviour outside the grid.
    ///
    /// # Examples
    /// See [`Ends`].
    pub fn with_ends(self, ends: Ends) -> Self {
        SpectralTable { ends, ..self }
    }

    /// The table's kind.
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::table::{Ends, SpectralTable, TableKind};
    /// let t = SpectralTable::new(TableKind::Reflectance, &[1e-6, 2e-6], &[0.1, 0.2]).unwrap();
    /// assert_eq!((t.kind(), t.ends()), (TableKind::Reflectance, Ends::Reject));
    /// assert_eq!(t.wavelengths_m(), &[1e-6, 2e-6]);
    /// assert_eq!(t.values(), &[0.1, 0.2]);
    /// assert_eq!(t.span_m(), (1e-6, 2e-6));
    /// ```
    pub fn kind(&self) -> TableKind {
        self.kind
    }

    /// The behaviour outside the grid; see [`SpectralTable::kind`] for an example.
    pub fn ends(&self) -> Ends {
        self.ends
    }

    /// The wavelengths, m (strictly increasing); see [`SpectralTable::kind`] for an example.
    pub fn wavelengths_m(&self) -> &'a [f64] {
        self.wavelengths_m
    }

    /// The values, one per wavelength; see [`SpectralTable::kind`] for an example.
    pub fn values(&self) -> &'a [f64] {
        self.values
    }

    /// First and last wavelength of the grid, m; see [`SpectralTable::kind`] for an example.
    pub fn span_m(&self) -> (f64, f64) {
        let w = self.wavelengths_m;
        // n ≥ 2 by construction; `first`/`last` keep the code free of panics anyway.
        (
            w.first().copied().unwrap_or(f64::NAN),
            w.last().copied().unwrap_or(f64::NAN),
        )
    }

    /// The interpolated value at `wavelength_m` (m).
    ///
    /// # Formula
    /// See [`SpectralTable`].
    ///
    /// # Errors
    /// `NonFinite` / `NonPositiveSpectral` for a bad wavelength; `OutsideTable` (arg: the
    /// kind's name) outside the grid unless the table has [`Ends::Constant`].
    ///
    /// # Accuracy
    /// A few ulp.
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::table::{SpectralTable, TableKind};
    /// let t = SpectralTable::new(TableKind::Emissivity, &[8e-6, 14e-6], &[0.9, 0.6]).unwrap();
    /// assert!((t.value_at(10e-6).unwrap() - 0.8).abs() < 1e-15);
    /// assert_eq!(t.value_at(7e-6).unwrap_err().code(), "OUTSIDE_TABLE");
    /// ```
    ///
    /// # References
    /// Common practice, no source.
    pub fn value_at(&self, wavelength_m: f64) -> Result<f64> {
        crate::error::spectral("wavelength_m", wavelength_m)?;
        let (lo, hi) = self.span_m();
        let (w, v) = (self.wavelengths_m, self.values);
        if wavelength_m < lo || wavelength_m > hi {
            return match self.ends {
                Ends::Reject => Err(Error::OutsideTable {
                    arg: self.kind.name(),
                    wavelength_m,
                    first_m: lo,
                    last_m: hi,
                }),
                Ends::Constant => Ok(if wavelength_m < lo {
                    v.first().copied().unwrap_or(f64::NAN)
                } else {
                    v.last().copied().unwrap_or(f64::NAN)
                }),
            };
        }
        let i = w
            .partition_point(|&x| x <= wavelength_m)
            .clamp(1, w.len() - 1);
        match (w.get(i - 1..=i), v.get(i - 1..=i)) {
            (Some(&[w0, w1]), Some(&[v0, v1])) => {
                Ok(v0 + (v1 - v0) * ((wavelength_m - w0) / (w1 - w0)))
            }
            _ => Err(Error::NotConverged {
                what: "table lookup (unreachable for a validated table)",
            }),
        }
    }
}

#[cfg(feature = "alloc")]
pub use owned::SpectralTableBuf;

#[cfg(feature = "alloc")]
mod owned {
    use super::{validate, Ends, SpectralTable, TableKind};
    use crate::units::{SpectralKind, SpectralUnit};
    use crate::{Error, Result};
    use alloc::vec::Vec;

    /// A validated spectral table that owns its data (feature `alloc`); serializable with the
    /// `serde` feature (fields `kind`, `wavelengthsM`, `values`, `ends`; deserializing
    /// validates). Borrow it as a [`SpectralTable`] with [`SpectralTableBuf::as_table`].
    ///
    /// # Formula
    /// As [`SpectralTable`].
    ///
    /// # Errors
    /// [`SpectralTableBuf::new`] and deserialization: as [`SpectralTable::new`];
    /// [`SpectralTableBuf::from_text`]: see there.
    ///
    /// # Accuracy
    /// As [`SpectralTable`].
    ///
    /// # Examples
    /// ```
    /// use quantaband::thermometry::table::{SpectralTableBuf, TableKind};
    /// let t = SpectralTableBuf::new(TableKind::Emissivity, vec![8e-6, 14e-6], vec![0.9, 0.7]).unwrap();
    /// assert!((t.as_table().value_at(11e-6).unwrap() - 0.8).abs() < 1e-15);
    /// ```
    ///
    /// # References
    /// As [`SpectralTable`].
    #[derive(Debug, Clone, PartialEq)]
    #[cfg_attr(
        feature = "serde",
        derive(serde::Serialize, serde::Deserialize),
        serde(
            rename_all = "camelCase",
            deny_unknown_fields,
            try_from = "TableFields"
        )
    )]
    pub struct SpectralTableBuf {
        kind: TableKind,
        wavelengths_m: Vec<f64>,
        values: Vec<f64>,
        ends: Ends,
    }

    /// The unvalidated serialized form of [`SpectralTableBuf`].
    #[cfg(feature = "serde")]
    #[derive(serde::Deserialize)]
    #[serde(rename_all = "camelCase", deny_unknown_fields)]
    struct TableFields {
        kind: TableKind,
        wavelengths_m: Vec<f64>,
        values: Vec<f64>,
        #[serde(default)]
        ends: Ends,
    }

    #[cfg(feature = "serde")]
    impl TryFrom<TableFields> for SpectralTableBuf {
        type Error = Error;
        fn try_from(f: TableFields) -> Result<Self> {
            Ok(SpectralTableBuf::new(f.kind, f.wavelengths_m, f.values)?.with_ends(f.ends))
        }
    }

    /// Comment markers: a line whose first non-blank characters are one of these is skipped;
    /// on a data line, `#` and everything after it is ignored.
    const COMMENT_STARTS: [&str; 5] = ["#", "%", "!", "//", ";"];

    /// The pieces of `s` between bytes for which `sep` holds, like `str::split` with those
    /// (ASCII) characters: the separators are single bytes, so every cut is a character
    /// boundary. (A byte scan instead of `split`'s character searchers: smaller in the package.)
    fn pieces(s: &str, sep: fn(u8) -> bool) -> impl Iterator<Item = &str> {
        let mut rest = Some(s);
        core::iter::from_fn(move || {
            let r = rest?;
            match r.bytes().position(sep) {
                Some(p) => {
                    rest = r.get(p + 1..);
                    r.get(..p)
                }
                None => {
                    rest = None;
                    Some(r)
                }
            }
        })
    }

    impl SpectralTableBuf {
        /// Validates and takes ownership of a table (see [`SpectralTable::new`]).
        ///
        /// # Formula
        /// As [`SpectralTable::new`].
        ///
        /// # Errors
        /// As [`SpectralTable::new`].
        ///
        /// # Accuracy
        /// Exact (validation only).
        ///
        /// # Examples
        /// ```
        /// use quantaband::thermometry::table::{SpectralTableBuf, TableKind};
        /// let e = SpectralTableBuf::new(TableKind::Reflectance, vec![1e-6, 2e-6], vec![0.1, f64::NAN]);
        /// assert_eq!(e.unwrap_err().code(), "INVALID_TABLE_ENTRY");
        /// ```
        ///
        /// # References
        /// Common practice, no source.
        pub fn new(kind: TableKind, wavelengths_m: Vec<f64>, values: Vec<f64>) -> Result<Self> {
            validate(kind, &wavelengths_m, &values)?;
            Ok(SpectralTableBuf {
                kind,
                wavelengths_m,
                values,
                ends: Ends::Reject,
            })
        }

        /// The same table with the given behaviour outside the grid.
        ///
        /// # Examples
        /// ```
        /// use quantaband::thermometry::table::{Ends, SpectralTableBuf, TableKind};
        /// let t = SpectralTableBuf::new(TableKind::Emissivity, vec![8e-6, 14e-6], vec![0.9, 0.7])
        ///     .unwrap()
        ///     .with_ends(Ends::Constant);
        /// assert_eq!(t.as_table().value_at(1e-6).unwrap(), 0.9);
        /// ```
        pub fn with_ends(self, ends: Ends) -> Self {
            SpectralTableBuf { ends, ..self }
        }

        /// The table as a borrowed [`SpectralTable`] (no copy, no re-validation).
        ///
        /// # Examples
        /// See [`SpectralTableBuf`].
        pub fn as_table(&self) -> SpectralTable<'_> {
            SpectralTable {
                kind: self.kind,
                wavelengths_m: &self.wavelengths_m,
                values: &self.values,
                ends: self.ends,
            }
        }

        /// Reads a two-column text table (wavelength, value) of `kind`, the first column in
        /// `unit`.
        ///
        /// # Formula
        /// ```text
        /// line     = [blank] wavelength SEP value [blank] ["#" comment]
        /// SEP      = "," | ";" | tab | blanks      (decimal point "."; exponent "e" allowed)
        /// λ_i (m)  = unit → m through crate::units (wavenumber, frequency and photon-energy
        ///            units are converted to vacuum wavelength)
        /// ```
        /// Skipped: blank lines, comment lines (first non-blank characters `#`, `%`, `!`,
        /// `//` or `;`), and header lines before the first data line (lines whose first
        /// field is not a number). The data may be in either order of the spectral
        /// coordinate (wavenumber files are often descending), but strictly monotone
        /// throughout; the table is stored in increasing wavelength.
        ///
        /// # Errors
        /// - `InvalidLine { line, reason }` (1-based line number) for a data line that does not
        ///   have exactly two fields, a field that is not a finite number, a spectral
        ///   coordinate ≤ 0, a value outside [0, 1] (ε, ρ, τ) or below 0 (responses), or a
        ///   coordinate that breaks the order set by the first two data lines;
        /// - `TooFewPoints` for fewer than two data lines; `NonPositive` for an all-zero
        ///   response.
        ///
        /// # Accuracy
        /// Numbers parse correctly rounded (`core`'s `f64::from_str`); the unit conversion is
        /// that of [`SpectralUnit::to_si`] (correctly rounded for decimal units) and
        /// [`SpectralKind::convert_si`].
        ///
        /// # Examples
        /// ```
        /// use quantaband::thermometry::table::{SpectralTableBuf, TableKind};
        /// use quantaband::units::SpectralUnit;
        /// let text = "# invented sample\nwavelength_um,emissivity\n8.0, 0.95\n10.0, 0.90\n14.0, 0.80\n";
        /// let t = SpectralTableBuf::from_text(TableKind::Emissivity, text, SpectralUnit::Micrometre).unwrap();
        /// assert_eq!(t.as_table().wavelengths_m(), &[8e-6, 10e-6, 14e-6]);
        /// let bad = "8.0, 0.95\n10.0, 1.90\n";
        /// let e = SpectralTableBuf::from_text(TableKind::Emissivity, bad, SpectralUnit::Micrometre).unwrap_err();
        /// assert_eq!(e, quantaband::Error::InvalidLine { line: 2, reason: "value outside [0, 1]" });
        /// ```
        ///
        /// # References
        /// Common practice, no source.
        pub fn from_text(kind: TableKind, text: &str, unit: SpectralUnit) -> Result<Self> {
            Self::from_text_with(kind, text, unit, &|field: &str| field.parse::<f64>().ok())
        }

        /// [`SpectralTableBuf::from_text`] with the caller's number parser: `parse` gets each
        /// field (a subslice of `text`) and returns its value, or `None` when the field is not
        /// a number. `from_text` passes Rust's `f64::from_str` (decimal numbers with an optional
        /// sign and exponent, and `inf`, `infinity`, `nan` in any case); a parser that accepts
        /// exactly these strings and rounds correctly gives the same tables and errors. Meant
        /// for callers that have such a parser already (a WebAssembly build can use the host's
        /// number conversion instead of linking a second one).
        ///
        /// # Formula
        /// As [`SpectralTableBuf::from_text`].
        ///
        /// # Errors
        /// As [`SpectralTableBuf::from_text`].
        ///
        /// # Accuracy
        /// That of `parse`, then as [`SpectralTableBuf::from_text`].
        ///
        /// # Examples
        /// ```
        /// use quantaband::thermometry::table::{SpectralTableBuf, TableKind};
        /// use quantaband::units::SpectralUnit;
        /// let parse = |f: &str| f.parse::<f64>().ok();
        /// let t = SpectralTableBuf::from_text_with(TableKind::Transmittance, "1000, 0.5\n2000, 0.6", SpectralUnit::PerCentimetre, &parse).unwrap();
        /// // 2000 cm⁻¹ = 5 µm comes first: the table is stored in increasing wavelength
        /// assert_eq!(t.as_table().values(), &[0.6, 0.5]);
        /// ```
        ///
        /// # References
        /// Common practice, no source.
        pub fn from_text_with(
            kind: TableKind,
            text: &str,
            unit: SpectralUnit,
            parse: &dyn Fn(&str) -> Option<f64>,
        ) -> Result<Self> {
            let text = text.strip_prefix('\u{feff}').unwrap_or(text);
            let mut wl: Vec<f64> = Vec::new();
            let mut vals: Vec<f64> = Vec::new();
            // +1: increasing wavelength, −1: decreasing; 0 until two points are read.
            let mut order = 0i8;
            for (i, raw) in pieces(text, |b| b == b'\n').enumerate() {
                let line = i + 1;
                let t = raw.trim();
                if t.is_empty() || COMMENT_STARTS.iter().any(|c| t.starts_with(c)) {
                    continue;
                }
                let t = pieces(t, |b| b == b'#').next().unwrap_or("").trim();
                let mut fields = pieces(t, |b| matches!(b, b',' | b';' | b'\t' | b' '))
                    .map(str::trim)
                    .filter(|f| !f.is_empty());
                let (f0, f1, more) = (fields.next(), fields.next(), fields.next());
                let x0 = f0.map(parse);
                if wl.is_empty() && !matches!(x0, Some(Some(_))) {
                    continue; // a header line before the data
                }
                let bad = |reason| Err(Error::InvalidLine { line, reason });
                let (x, v) = match (x0, f1.map(parse), more) {
                    (Some(Some(x)), Some(Some(v)), None) => (x, v),
                    (_, _, Some(_)) | (_, None, _) | (None, _, _) => {
                        return bad("expected two columns: wavelength and value")
                    }
                    _ => return bad("not a number"),
                };
                if !x.is_finite() || !v.is_finite() {
                    return bad("not a finite number");
                }
                let lam = to_wavelength_m(unit, x).map_err(|_| Error::InvalidLine {
                    line,
                    reason: "spectral coordinate must be > 0 and convert to a positive wavelength",
                })?;
                if !kind.accepts(v) {
                    return bad(if kind.is_response() {
                        "response below 0"
                    } else {
                        "value outside [0, 1]"
                    });
                }
                if let Some(&prev) = wl.last() {
                    let step = if lam > prev {
                        1
                    } else if lam < prev {
                        -1
                    } else {
                        0
                    };
                    if step == 0 || (order != 0 && step != order) {
                        return bad("wavelengths must be strictly monotone (the first two data lines set the order)");
                    }
                    order = step;
                }
                wl.push(lam);
                vals.push(v);
            }
            if order < 0 {
                wl.reverse();
                vals.reverse();
            }
            SpectralTableBuf::new(kind, wl, vals)
        }

        /// The table's kind; see [`SpectralTableBuf::as_table`] for the other fields.
        ///
        /// # Examples
        /// ```
        /// use quantaband::thermometry::table::{SpectralTableBuf, TableKind};
        /// let t = SpectralTableBuf::new(TableKind::Transmittance, vec![1e-6, 2e-6], vec![1.0, 1.0]).unwrap();
        /// assert_eq!(t.kind(), TableKind::Transmittance);
        /// ```
        pub fn kind(&self) -> TableKind {
            self.kind
        }
    }

    /// A spectral coordinate in `unit` as a vacuum wavelength in m.
    fn to_wavelength_m(unit: SpectralUnit, x: f64) -> Result<f64> {
        let si = unit.to_si("wavelength", x)?;
        match unit.kind() {
            SpectralKind::Wavelength => Ok(si),
            k => k.convert_si("wavelength", si, SpectralKind::Wavelength),
        }
    }
}
