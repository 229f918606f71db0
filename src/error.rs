//! The one error type of the crate.
//!
//! Every function that can be given invalid input returns `Result<_, Error>`. Each variant has a
//! stable machine-readable code ([`Error::code`], `SCREAMING_SNAKE_CASE`, never renamed once
//! released) and a `Display` message that states the violated bound and the offending value.
//! The JavaScript layer copies the code into the `code` property of the thrown error.
//!
//! Valid input whose true result lies outside the f64 range is *not* an error: it returns `0.0`
//! (underflow) or `f64::INFINITY` (overflow), and the function's docs say when.

use core::fmt;

/// Result alias used throughout the crate.
pub type Result<T> = core::result::Result<T, Error>;

/// Everything that can go wrong in a quantaband calculation.
///
/// `arg` fields name the argument as it is spelled in the Rust API (for example `"temperature_k"`),
/// so a message points at the input the caller has to fix.
#[non_exhaustive]
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Error {
    /// An input is NaN or ±∞. Code `NON_FINITE`.
    NonFinite {
        /// Argument name.
        arg: &'static str,
        /// The value received.
        value: f64,
    },
    /// An absolute temperature is ≤ 0 K. Code `NON_POSITIVE_TEMPERATURE`.
    NonPositiveTemperature {
        /// Argument name.
        arg: &'static str,
        /// The value received, in kelvin.
        value: f64,
    },
    /// A wavelength, wavenumber, frequency or photon energy is ≤ 0. Code `NON_POSITIVE_SPECTRAL`.
    NonPositiveSpectral {
        /// Argument name.
        arg: &'static str,
        /// The value received, in the argument's SI unit.
        value: f64,
    },
    /// Another quantity that must be strictly positive (a signal, a density, a mass…) is ≤ 0.
    /// Code `NON_POSITIVE`.
    NonPositive {
        /// Argument name.
        arg: &'static str,
        /// The value received.
        value: f64,
    },
    /// A bounded quantity (emissivity, transmittance, fraction, fugacity…) is outside its range.
    /// Code `OUT_OF_RANGE`.
    OutOfRange {
        /// Argument name.
        arg: &'static str,
        /// The value received.
        value: f64,
        /// The allowed range in interval notation, e.g. `"(0, 1]"`.
        range: &'static str,
    },
    /// A spectral band whose limits are reversed or equal. Code `INVALID_BAND`.
    InvalidBand {
        /// The lower limit received (SI unit of the spectral variable).
        lower: f64,
        /// The upper limit received.
        upper: f64,
    },
    /// An inverse problem has no solution in the representable range (for example a band radiance
    /// larger than any temperature up to the solver's ceiling can give). Code `NO_SOLUTION`.
    NoSolution {
        /// What was being solved for, and the range searched.
        what: &'static str,
    },
    /// A measured signal is at or below what the reflected and path terms alone contribute, so no
    /// object temperature explains it. Code `NO_PHYSICAL_SOLUTION`.
    NoPhysicalSolution {
        /// The signal received.
        signal: f64,
        /// The signal the non-object terms give on their own.
        background: f64,
    },
    /// A Bose–Einstein occupancy was asked for at E ≤ μ, where it diverges or is negative.
    /// Code `DIVERGENT_OCCUPATION`.
    DivergentOccupation {
        /// The reduced energy x = (E − μ)/kT received.
        x: f64,
    },
    /// Two arrays that must have equal lengths do not. Code `LENGTH_MISMATCH`.
    LengthMismatch {
        /// Expected length.
        expected: usize,
        /// Length received.
        got: usize,
    },
    /// Too few points for a table or a fit. Code `TOO_FEW_POINTS`.
    TooFewPoints {
        /// Minimum number of points.
        needed: usize,
        /// Number received.
        got: usize,
    },
    /// A sequence that must be strictly increasing is not. Code `NOT_INCREASING`.
    NotIncreasing {
        /// Argument name.
        arg: &'static str,
        /// Index of the first element that is not larger than its predecessor.
        index: usize,
    },
    /// A fit's data cannot determine its parameters (repeated abscissae, non-monotone signals,
    /// singular normal equations…). Code `DEGENERATE_FIT`.
    DegenerateFit {
        /// Why the data are degenerate.
        reason: &'static str,
    },
    /// An iterative method stopped without meeting its tolerance. Code `NOT_CONVERGED`.
    NotConverged {
        /// What was being iterated.
        what: &'static str,
    },
    /// A unit name that the unit module does not know. Code `UNKNOWN_UNIT`.
    UnknownUnit {
        /// The kind of quantity and the accepted names, e.g. `"spectral unit (nm, um, m, …)"`.
        expected: &'static str,
    },
    /// An argument combination the function does not support (e.g. an order outside the
    /// implemented set). Code `UNSUPPORTED`.
    Unsupported {
        /// What is unsupported and what is.
        what: &'static str,
    },
    /// An input with more elements than the function accepts (a documented limit that keeps
    /// every call short and its memory bounded). Code `TOO_LARGE`.
    TooLarge {
        /// Argument name.
        arg: &'static str,
        /// The largest accepted number of elements.
        limit: usize,
        /// The number given.
        got: usize,
    },
    /// A correlation matrix that is not a valid one: not symmetric, a diagonal entry other than
    /// 1, an entry outside [−1, 1], or not positive semi-definite. Code `INVALID_CORRELATION`.
    InvalidCorrelation {
        /// What is wrong.
        reason: &'static str,
        /// Row of the offending entry (0-based; for "not positive semi-definite", the pivot at
        /// which the Cholesky factorisation failed).
        row: usize,
        /// Column of the offending entry (0-based).
        column: usize,
        /// The offending value (the entry, or the failed pivot).
        value: f64,
    },
    /// An element of a table is invalid: not finite, outside its allowed range, or (for two
    /// tables that must sum to at most 1, such as a window's transmittance and reflectance)
    /// their sum above 1 there. Code `INVALID_TABLE_ENTRY`.
    InvalidTableEntry {
        /// The table and column, e.g. `"emissivity.values"`.
        arg: &'static str,
        /// Index of the offending element (0-based).
        index: usize,
        /// The value received (the sum, for a sum that exceeds its bound).
        value: f64,
        /// The allowed range, e.g. `"[0, 1]"`.
        range: &'static str,
    },
    /// A wavelength at which a table is needed lies outside the table's grid, and the table was
    /// not given constant end values. Code `OUTSIDE_TABLE`.
    OutsideTable {
        /// The table, e.g. `"emissivity"`.
        arg: &'static str,
        /// The wavelength needed, m.
        wavelength_m: f64,
        /// The table's first wavelength, m.
        first_m: f64,
        /// The table's last wavelength, m.
        last_m: f64,
    },
    /// A line of a text table cannot be used. Code `INVALID_LINE`.
    InvalidLine {
        /// The line number (1-based, counting every line of the text).
        line: usize,
        /// What is wrong with it.
        reason: &'static str,
    },
}

impl Error {
    /// The stable machine-readable code of this error (`SCREAMING_SNAKE_CASE`).
    ///
    /// # Examples
    /// ```
    /// use quantaband::Error;
    /// let e = Error::NonPositiveTemperature { arg: "temperature_k", value: -1.0 };
    /// assert_eq!(e.code(), "NON_POSITIVE_TEMPERATURE");
    /// ```
    pub const fn code(&self) -> &'static str {
        match self {
            Error::NonFinite { .. } => "NON_FINITE",
            Error::NonPositiveTemperature { .. } => "NON_POSITIVE_TEMPERATURE",
            Error::NonPositiveSpectral { .. } => "NON_POSITIVE_SPECTRAL",
            Error::NonPositive { .. } => "NON_POSITIVE",
            Error::OutOfRange { .. } => "OUT_OF_RANGE",
            Error::InvalidBand { .. } => "INVALID_BAND",
            Error::NoSolution { .. } => "NO_SOLUTION",
            Error::NoPhysicalSolution { .. } => "NO_PHYSICAL_SOLUTION",
            Error::DivergentOccupation { .. } => "DIVERGENT_OCCUPATION",
            Error::LengthMismatch { .. } => "LENGTH_MISMATCH",
            Error::TooFewPoints { .. } => "TOO_FEW_POINTS",
            Error::NotIncreasing { .. } => "NOT_INCREASING",
            Error::DegenerateFit { .. } => "DEGENERATE_FIT",
            Error::NotConverged { .. } => "NOT_CONVERGED",
            Error::UnknownUnit { .. } => "UNKNOWN_UNIT",
            Error::Unsupported { .. } => "UNSUPPORTED",
            Error::TooLarge { .. } => "TOO_LARGE",
            Error::InvalidCorrelation { .. } => "INVALID_CORRELATION",
            Error::InvalidTableEntry { .. } => "INVALID_TABLE_ENTRY",
            Error::OutsideTable { .. } => "OUTSIDE_TABLE",
            Error::InvalidLine { .. } => "INVALID_LINE",
        }
    }

    /// Every code, in declaration order (for documentation and for the JS type of `code`).
    pub const ALL_CODES: &'static [&'static str] = &[
        "NON_FINITE",
        "NON_POSITIVE_TEMPERATURE",
        "NON_POSITIVE_SPECTRAL",
        "NON_POSITIVE",
        "OUT_OF_RANGE",
        "INVALID_BAND",
        "NO_SOLUTION",
        "NO_PHYSICAL_SOLUTION",
        "DIVERGENT_OCCUPATION",
        "LENGTH_MISMATCH",
        "TOO_FEW_POINTS",
        "NOT_INCREASING",
        "DEGENERATE_FIT",
        "NOT_CONVERGED",
        "UNKNOWN_UNIT",
        "UNSUPPORTED",
        "TOO_LARGE",
        "INVALID_CORRELATION",
        "INVALID_TABLE_ENTRY",
        "OUTSIDE_TABLE",
        "INVALID_LINE",
    ];
}

impl fmt::Display for Error {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match *self {
            Error::NonFinite { arg, value } => {
                write!(f, "{arg} must be a finite number (got {value})")
            }
            Error::NonPositiveTemperature { arg, value } => {
                write!(f, "{arg} must be > 0 K (got {value} K)")
            }
            Error::NonPositiveSpectral { arg, value } => {
                write!(f, "{arg} must be > 0 (got {value})")
            }
            Error::NonPositive { arg, value } => write!(f, "{arg} must be > 0 (got {value})"),
            Error::OutOfRange { arg, value, range } => {
                write!(f, "{arg} must lie in {range} (got {value})")
            }
            Error::InvalidBand { lower, upper } => write!(
                f,
                "band limits must satisfy lower < upper (got lower = {lower}, upper = {upper})"
            ),
            Error::NoSolution { what } => write!(f, "no solution: {what}"),
            Error::NoPhysicalSolution { signal, background } => write!(
                f,
                "no physical solution: signal {signal} must exceed the reflected and path \
                 contribution {background}"
            ),
            Error::DivergentOccupation { x } => write!(
                f,
                "Bose-Einstein occupancy needs E > mu, i.e. x = (E - mu)/kT > 0 (got x = {x})"
            ),
            Error::LengthMismatch { expected, got } => {
                write!(f, "array lengths must match (expected {expected}, got {got})")
            }
            Error::TooFewPoints { needed, got } => {
                write!(f, "at least {needed} points are needed (got {got})")
            }
            Error::NotIncreasing { arg, index } => write!(
                f,
                "{arg} must be strictly increasing (element {index} is not larger than the one before)"
            ),
            Error::DegenerateFit { reason } => write!(f, "degenerate fit: {reason}"),
            Error::NotConverged { what } => write!(f, "did not converge: {what}"),
            Error::UnknownUnit { expected } => write!(f, "unknown unit; expected a {expected}"),
            Error::Unsupported { what } => write!(f, "unsupported: {what}"),
            Error::TooLarge { arg, limit, got } => write!(
                f,
                "{arg} has {got} elements; at most {limit} are accepted"
            ),
            Error::InvalidCorrelation {
                reason,
                row,
                column,
                value,
            } => write!(
                f,
                "invalid correlation matrix: {reason} (entry [{row}][{column}] = {value})"
            ),
            Error::InvalidTableEntry {
                arg,
                index,
                value,
                range,
            } => write!(f, "{arg}[{index}] must lie in {range} (got {value})"),
            Error::OutsideTable {
                arg,
                wavelength_m,
                first_m,
                last_m,
            } => write!(
                f,
                "{arg} is needed at {wavelength_m} m, outside its wavelength grid \
                 [{first_m}, {last_m}] m (give the table constant end values to extend it)"
            ),
            Error::InvalidLine { line, reason } => write!(f, "line {line} of the table text: {reason}"),
        }
    }
}

impl core::error::Error for Error {}

/// Checks that `value` is finite.
#[inline]
pub(crate) fn finite(arg: &'static str, value: f64) -> Result<f64> {
    if value.is_finite() {
        Ok(value)
    } else {
        Err(Error::NonFinite { arg, value })
    }
}

/// Checks that a temperature is finite and > 0 K.
#[inline]
pub(crate) fn temperature(arg: &'static str, value: f64) -> Result<f64> {
    finite(arg, value)?;
    if value > 0.0 {
        Ok(value)
    } else {
        Err(Error::NonPositiveTemperature { arg, value })
    }
}

/// Checks that a spectral coordinate (wavelength, wavenumber, frequency, energy) is finite and > 0.
#[inline]
pub(crate) fn spectral(arg: &'static str, value: f64) -> Result<f64> {
    finite(arg, value)?;
    if value > 0.0 {
        Ok(value)
    } else {
        Err(Error::NonPositiveSpectral { arg, value })
    }
}

/// Checks that a quantity is finite and > 0.
#[inline]
pub(crate) fn positive(arg: &'static str, value: f64) -> Result<f64> {
    finite(arg, value)?;
    if value > 0.0 {
        Ok(value)
    } else {
        Err(Error::NonPositive { arg, value })
    }
}

/// Checks that a quantity is finite and in the half-open interval (0, 1] (emissivity,
/// transmittance).
#[inline]
pub(crate) fn unit_interval_open_closed(arg: &'static str, value: f64) -> Result<f64> {
    finite(arg, value)?;
    if value > 0.0 && value <= 1.0 {
        Ok(value)
    } else {
        Err(Error::OutOfRange {
            arg,
            value,
            range: "(0, 1]",
        })
    }
}

/// Checks that a quantity is finite and in the closed interval [0, 1] (reflectance, weights).
#[inline]
pub(crate) fn unit_interval_closed(arg: &'static str, value: f64) -> Result<f64> {
    finite(arg, value)?;
    if (0.0..=1.0).contains(&value) {
        Ok(value)
    } else {
        Err(Error::OutOfRange {
            arg,
            value,
            range: "[0, 1]",
        })
    }
}

/// Checks that `lower < upper`, both finite and > 0 (a spectral band).
#[inline]
pub(crate) fn band(
    lower_arg: &'static str,
    lower: f64,
    upper_arg: &'static str,
    upper: f64,
) -> Result<(f64, f64)> {
    spectral(lower_arg, lower)?;
    spectral(upper_arg, upper)?;
    if lower < upper {
        Ok((lower, upper))
    } else {
        Err(Error::InvalidBand { lower, upper })
    }
}
