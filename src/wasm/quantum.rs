//! Raman thermometry, Y-factor noise temperatures and semiconductor carrier statistics for
//! JavaScript (`RamanMode`, `YFactorLoads`, `Semiconductor`, `bandCarrierDensity`,
//! `decibelsToPowerRatio`, `powerRatioToDecibels` in `src/wasm/js/quantum.js`). Each object is
//! checked once by its `create`, with the user units it names (a Raman shift in cm⁻¹, an
//! excitation in any spectral unit, frequencies in any spectral unit, energies in J, eV or meV)
//! converted to SI by `crate::units`; the methods take plain numbers.
//!
//! The configuration objects of these classes are flat (numbers, one unit name, one choice of
//! a fixed set), so the facade reads their fields from its plain-data copy (unknown keys, types
//! and required fields checked there, with the same messages as `config::read`) and passes
//! them as arguments: a serde `Deserialize` per configuration cost 6–7 KB of the module each
//! (measured), against a budget of about 15 KB for the whole capability. Values are checked
//! here, under their JavaScript paths. The multi-wavelength fit is in `quantum_fit.rs`.
#![allow(clippy::neg_cmp_op_on_partial_ord)]

use alloc::format;
use serde::Serialize;
use wasm_bindgen::prelude::*;

use super::error::{in_config, some, to_js, Fail};
use super::scratch::{map_in_place, status};
use super::stats::value;
use super::testing::Live;
use crate::error::{self as check, Error};
use crate::stats::{
    band_carrier_density, y_factor, y_factor_noise_temperature, LoadNoiseModel, Semiconductor,
};
use crate::thermometry::raman::{
    anti_stokes_stokes_ratio, raman_frequency_factor, raman_temperature, RamanDetection,
};
use crate::units::{
    convert_spectral_checked, power_ratio_from_decibels, power_ratio_to_decibels, SpectralKind,
    SpectralUnit, SPECTRAL_NAMES,
};

/// The unit named `name` (field `path` of a configuration object).
pub(crate) fn unit_named(path: &str, name: &str) -> Result<SpectralUnit, Fail> {
    SpectralUnit::parse(name).map_err(|_| {
        Fail::Binding(
            "UNKNOWN_UNIT",
            format!("{path}: unknown unit \"{name}\"; expected a {SPECTRAL_NAMES}"),
        )
    })
}

// ---- Raman ------------------------------------------------------------------------------------

/// A checked Raman mode in SI.
#[wasm_bindgen(js_name = QbRamanMode)]
pub struct RamanHandle {
    shift_per_m: f64,
    excitation_m: f64,
    detection: RamanDetection,
    factor: f64,
    _live: Live,
}

#[wasm_bindgen(js_class = QbRamanMode)]
impl RamanHandle {
    /// Checks the fields of `{ shiftPerCm, excitation, unit, detection }` (detection: 0 photon
    /// counting, 1 energy).
    pub fn create(
        shift_per_cm: f64,
        excitation: f64,
        unit: &str,
        detection: u32,
    ) -> Option<RamanHandle> {
        let detection = if detection == 1 {
            RamanDetection::Energy
        } else {
            RamanDetection::PhotonCounting
        };
        some(Self::build(shift_per_cm, excitation, unit, detection))
    }

    #[wasm_bindgen(js_name = frequencyFactor)]
    pub fn frequency_factor(&self) -> f64 {
        self.factor
    }

    pub fn ratio(&self, t: f64) -> f64 {
        value(anti_stokes_stokes_ratio(
            self.shift_per_m,
            self.excitation_m,
            t,
            self.detection,
        ))
    }

    pub fn temperature(&self, ratio: f64) -> Option<JsValue> {
        some(
            raman_temperature(self.shift_per_m, self.excitation_m, ratio, self.detection)
                .map_err(Fail::from)
                .and_then(|r| to_js(&r)),
        )
    }

    /// Bulk forms over f64 scratch buffer 0: 0 ratios of temperatures (K), 1 temperatures (K)
    /// of ratios. Returns 0, or NaN with the error stored.
    pub fn bulk(&self, op: u32) -> f64 {
        let (l, x, d) = (self.shift_per_m, self.excitation_m, self.detection);
        status(if op == 0 {
            map_in_place(|t| {
                check::temperature("temperaturesK", t)?;
                anti_stokes_stokes_ratio(l, x, t, d)
            })
        } else {
            map_in_place(|r| {
                check::positive("ratios", r)?;
                raman_temperature(l, x, r, d).map(|v| v.temperature_k)
            })
        })
    }
}

impl RamanHandle {
    #[inline(never)]
    fn build(
        shift_per_cm: f64,
        excitation: f64,
        unit: &str,
        detection: RamanDetection,
    ) -> Result<RamanHandle, Fail> {
        let at = in_config("mode");
        let shift_per_m = SpectralUnit::PerCentimetre
            .to_si("shiftPerCm", shift_per_cm)
            .map_err(&at)?;
        let unit = unit_named("mode.unit", unit)?;
        let to = |u| convert_spectral_checked("excitation", excitation, unit, u).map_err(&at);
        let excitation_m = to(SpectralUnit::Metre)?;
        // A Stokes line exists only for a shift below the excitation wavenumber.
        if !(shift_per_cm < to(SpectralUnit::PerCentimetre)?) {
            return Err(at(Error::OutOfRange {
                arg: "shiftPerCm",
                value: shift_per_cm,
                range: "(0, the excitation wavenumber in cm-1)",
            }));
        }
        let factor = raman_frequency_factor(shift_per_m, excitation_m, detection).map_err(&at)?;
        Ok(RamanHandle {
            shift_per_m,
            excitation_m,
            detection,
            factor,
            _live: Live::new(),
        })
    }
}

// ---- Y factor ---------------------------------------------------------------------------------

/// A checked pair of loads.
#[wasm_bindgen(js_name = QbYFactorLoads)]
pub struct YFactorHandle {
    hot_k: f64,
    cold_k: f64,
    unit: SpectralUnit,
    model: LoadNoiseModel,
    _live: Live,
}

#[wasm_bindgen(js_class = QbYFactorLoads)]
impl YFactorHandle {
    /// Checks the fields of `{ hotLoadK, coldLoadK, unit, loadModel }` (loadModel: 0
    /// Callen–Welton, 1 Planck, 2 Rayleigh–Jeans).
    pub fn create(hot_k: f64, cold_k: f64, unit: &str, model: u32) -> Option<YFactorHandle> {
        let model = match model {
            1 => LoadNoiseModel::Planck,
            2 => LoadNoiseModel::RayleighJeans,
            _ => LoadNoiseModel::CallenWelton,
        };
        some(Self::build(hot_k, cold_k, unit, model))
    }

    #[wasm_bindgen(js_name = receiverTemperature)]
    pub fn receiver_temperature(&self, y: f64, frequency: f64) -> Option<JsValue> {
        some((|| {
            let f = self.hz(frequency)?;
            let r = y_factor_noise_temperature(y, self.hot_k, self.cold_k, f, self.model)?;
            to_js(&r)
        })())
    }

    #[wasm_bindgen(js_name = yFactor)]
    pub fn y_factor(&self, receiver_k: f64, frequency: f64) -> f64 {
        value(
            self.hz(frequency)
                .and_then(|f| y_factor(receiver_k, self.hot_k, self.cold_k, f, self.model)),
        )
    }
}

impl YFactorHandle {
    #[inline(never)]
    fn build(
        hot_k: f64,
        cold_k: f64,
        unit: &str,
        model: LoadNoiseModel,
    ) -> Result<YFactorHandle, Fail> {
        let at = in_config("loads");
        check::temperature("hotLoadK", hot_k).map_err(&at)?;
        check::temperature("coldLoadK", cold_k).map_err(&at)?;
        if !(hot_k > cold_k) {
            return Err(at(Error::OutOfRange {
                arg: "hotLoadK",
                value: hot_k,
                range: "(coldLoadK, inf)",
            }));
        }
        Ok(YFactorHandle {
            hot_k,
            cold_k,
            unit: unit_named("loads.unit", unit)?,
            model,
            _live: Live::new(),
        })
    }

    /// A frequency in the loads' unit (any spectral unit) in Hz.
    fn hz(&self, frequency: f64) -> crate::Result<f64> {
        convert_spectral_checked("frequency", frequency, self.unit, SpectralUnit::Hertz)
    }
}

/// 10^(x/10) (`to_ratio`) or 10·log10(x): `decibelsToPowerRatio` and `powerRatioToDecibels`.
#[wasm_bindgen(js_name = qbDecibels)]
pub fn decibels(to_ratio: bool, x: f64) -> f64 {
    value(if to_ratio {
        power_ratio_from_decibels("decibels", x)
    } else {
        power_ratio_to_decibels("ratio", x)
    })
}

// ---- semiconductors ---------------------------------------------------------------------------

/// Intrinsic carriers with the energies in the material's unit.
#[derive(Serialize)]
#[serde(rename_all = "camelCase")]
struct Intrinsic {
    density_per_m3: f64,
    boltzmann_density_per_m3: f64,
    fermi_level: f64,
    boltzmann_fermi_level: f64,
    band_gap: f64,
}

/// A checked semiconductor.
#[wasm_bindgen(js_name = QbSemiconductor)]
pub struct SemiconductorHandle {
    material: Semiconductor,
    unit: SpectralUnit,
    _live: Live,
}

/// An energy `x` (any sign) in `unit` (J, eV or meV) in joules, through `crate::units`.
fn energy_to_j(arg: &'static str, x: f64, unit: SpectralUnit) -> crate::Result<f64> {
    check::finite(arg, x)?;
    Ok(if x == 0.0 {
        0.0
    } else {
        unit.to_si(arg, x.abs())?.copysign(x)
    })
}

/// An energy `j` in joules (any sign) in `unit`.
fn energy_from_j(arg: &'static str, j: f64, unit: SpectralUnit) -> crate::Result<f64> {
    check::finite(arg, j)?;
    Ok(if j == 0.0 {
        0.0
    } else {
        unit.from_si(arg, j.abs())?.copysign(j)
    })
}

#[wasm_bindgen(js_class = QbSemiconductor)]
impl SemiconductorHandle {
    /// Checks the fields of `{ electronMassRatio, holeMassRatio, bandGap0K, varshniAlpha?,
    /// varshniBetaK?, energyUnit }`.
    pub fn create(
        electron_mass_ratio: f64,
        hole_mass_ratio: f64,
        band_gap_0k: f64,
        varshni_alpha: Option<f64>,
        varshni_beta_k: Option<f64>,
        energy_unit: &str,
    ) -> Option<SemiconductorHandle> {
        some(Self::build(
            [electron_mass_ratio, hole_mass_ratio, band_gap_0k],
            varshni_alpha,
            varshni_beta_k,
            energy_unit,
        ))
    }

    /// A number at temperature `t` (K): 0 E_g(T), 1 N_c(T), 2 N_v(T) (m⁻³), 3 E_F from the
    /// electron density `x` (m⁻³), 4 E_F from the hole density `x`; energies in the unit.
    pub fn number(&self, op: u32, x: f64, t: f64) -> f64 {
        let m = &self.material;
        value(match op {
            0 => m.band_gap_j(t).and_then(|j| self.in_unit("bandGap", j)),
            1 => m.conduction_band_density_of_states(t),
            2 => m.valence_band_density_of_states(t),
            3 => m
                .fermi_level_from_electron_density(x, t)
                .and_then(|j| self.in_unit("fermiLevel", j)),
            _ => m
                .fermi_level_from_hole_density(x, t)
                .and_then(|j| self.in_unit("fermiLevel", j)),
        })
    }

    /// Electron (or, with `holes`, hole) density at Fermi level `fermi_level` (in the unit,
    /// from E_v) and temperature `t` (K).
    pub fn density(&self, holes: bool, fermi_level: f64, t: f64) -> Option<JsValue> {
        some((|| {
            let e = energy_to_j("fermiLevel", fermi_level, self.unit)?;
            let c = if holes {
                self.material.hole_density(e, t)?
            } else {
                self.material.electron_density(e, t)?
            };
            to_js(&c)
        })())
    }

    pub fn intrinsic(&self, t: f64) -> Option<JsValue> {
        some((|| {
            let i = self.material.intrinsic(t)?;
            to_js(&Intrinsic {
                density_per_m3: i.density_per_m3,
                boltzmann_density_per_m3: i.boltzmann_density_per_m3,
                fermi_level: self.in_unit("fermiLevel", i.fermi_level_j)?,
                boltzmann_fermi_level: self
                    .in_unit("boltzmannFermiLevel", i.boltzmann_fermi_level_j)?,
                band_gap: self.in_unit("bandGap", i.band_gap_j)?,
            })
        })())
    }

    /// Bulk form over f64 scratch buffer 0: intrinsic densities (m⁻³, Fermi–Dirac) of
    /// temperatures (K). Returns 0, or NaN with the error stored.
    #[wasm_bindgen(js_name = intrinsicBulk)]
    pub fn intrinsic_bulk(&self) -> f64 {
        status(map_in_place(|t| {
            check::temperature("temperaturesK", t)?;
            Ok(self.material.intrinsic(t)?.density_per_m3)
        }))
    }
}

impl SemiconductorHandle {
    #[inline(never)]
    fn build(
        [electron_mass_ratio, hole_mass_ratio, band_gap_0k]: [f64; 3],
        varshni_alpha: Option<f64>,
        varshni_beta_k: Option<f64>,
        energy_unit: &str,
    ) -> Result<SemiconductorHandle, Fail> {
        let at = in_config("material");
        let unit = unit_named("material.energyUnit", energy_unit)?;
        if unit.kind() != SpectralKind::PhotonEnergy {
            return Err(Error::Unsupported {
                what: "material.energyUnit must be an energy unit (J, eV or meV)",
            }
            .into());
        }
        check::positive("bandGap0K", band_gap_0k).map_err(&at)?;
        let alpha = varshni_alpha.unwrap_or(0.0);
        check::finite("varshniAlpha", alpha).map_err(&at)?;
        if alpha < 0.0 {
            return Err(at(Error::OutOfRange {
                arg: "varshniAlpha",
                value: alpha,
                range: "[0, inf)",
            }));
        }
        let beta = match (varshni_alpha, varshni_beta_k) {
            (_, Some(b)) => b,
            // a constant gap: β does not enter
            (None, None) => 1.0,
            (Some(_), None) => return Err(Fail::Binding(
                "WRONG_TYPE",
                alloc::string::String::from(
                    "material.varshniBetaK is required with material.varshniAlpha (got undefined)",
                ),
            )),
        };
        check::positive("varshniBetaK", beta).map_err(&at)?;
        let material = Semiconductor::new(
            electron_mass_ratio,
            hole_mass_ratio,
            energy_to_j("bandGap0K", band_gap_0k, unit).map_err(&at)?,
            energy_to_j("varshniAlpha", alpha, unit).map_err(&at)?,
            beta,
        )
        .map_err(&at)?;
        Ok(SemiconductorHandle {
            material,
            unit,
            _live: Live::new(),
        })
    }

    fn in_unit(&self, arg: &'static str, j: f64) -> crate::Result<f64> {
        energy_from_j(arg, j, self.unit)
    }
}

#[wasm_bindgen(js_name = bandCarrierDensity)]
pub fn band_carrier_density_js(effective_density_per_m3: f64, eta: f64) -> Option<JsValue> {
    some(
        band_carrier_density(effective_density_per_m3, eta)
            .map_err(Fail::from)
            .and_then(|c| to_js(&c)),
    )
}
