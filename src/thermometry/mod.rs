//! Radiation-thermometry workflow: instrument spectral response, response-weighted signals,
//! the measurement equation (emissivity, reflected surroundings, path and window), Sakuma–Hattori
//! calibration curves, ITS-90 radiance-ratio temperatures, sensitivity coefficients and GUM
//! uncertainty budgets, two-colour (ratio) thermometry, and fast whole-frame conversion.
//!
//! Every function takes SI units (K, m) with the unit in the argument name; signals are in the
//! unit of the [`model::SignalModel`] in use. No function allocates; variable-size data (response
//! tables, calibration points, frames) are caller-provided slices.
//!
//! Cautions: results are calculations, not measurements. They do not replace calibrated
//! instruments, traceable calibration and standard procedures; do not use them for medical or
//! fever screening or for process-safety decisions; defer to local codes and standards.
#![forbid(unsafe_code)]
// `!(x > 0.0)` is used on purpose throughout: it is also true for NaN.
#![allow(clippy::neg_cmp_op_on_partial_ord)]

pub mod frame;
pub(crate) mod gauss_legendre;
pub mod its90;
mod kernel;
pub mod measurement;
pub mod model;
pub mod ratio;
pub mod rectangular;
pub mod response;
pub mod sakuma_hattori;
pub mod uncertainty;

pub use frame::{FrameConverter, FrameSummary};
pub use its90::{
    its90_temperature, radiance_ratio, temperature_from_ratio, FixedPoint, Its90Temperature,
};
pub use measurement::{measured_signal, object_temperature, Conditions, Window};
pub use model::{SignalModel, SpectralPoint};
pub use ratio::{ratio_temperature, two_colour_temperature, RatioReading};
pub use rectangular::RectangularBand;
pub use response::{Response, ResponseSignal};
pub use sakuma_hattori::{max_interpolation_error_k, FitReport, SakumaHattori};
pub use uncertainty::{
    sensitivities, uncertainty_budget, BudgetEntry, BudgetInput, Sensitivities,
    StandardUncertainties, UncertaintyBudget,
};

// Multi-wavelength pyrometry and Raman thermometry (issue 18).
pub mod multiwavelength;
pub use multiwavelength::{
    multiwavelength_fit, multiwavelength_fit_channels, EmissivityModel, MultiwavelengthFit,
    MultiwavelengthOptions,
};
pub mod raman;
pub use raman::{
    anti_stokes_stokes_ratio, raman_frequency_factor, raman_temperature, RamanDetection,
    RamanReading,
};
// Uncertainty evaluation (JCGM 100 / JCGM 101), calibration transfer.
pub mod calibration_transfer;
pub mod gum;
pub mod measurement_gum;
pub mod monte_carlo;
pub mod random;
pub mod student_t;
// Spectral (non-grey) inputs: tables, the spectral measurement equation, workflows that start
// from an indicated temperature.
pub mod indicated;
pub mod spectral;
pub mod table;
pub use frame::PixelCorrections;
pub use indicated::{
    correct_reading, correct_reading_spectral, emissivity_by_contact, emissivity_by_reference,
    reflected_temperature, ReferenceEmissivity,
};
pub use spectral::{
    band_effective, spectral_measured_signal, spectral_object_temperature, spectral_sensitivities,
    spectral_signal_terms, BandEffective, SignalTerms, SpectralConditions, SpectralInstrument,
    SpectralSensitivities, SpectralValue, SpectralWindow,
};
#[cfg(feature = "alloc")]
pub use table::SpectralTableBuf;
pub use table::{Ends, SpectralTable, TableKind};
