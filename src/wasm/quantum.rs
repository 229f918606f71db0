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
use wasm_bindgen::prelude::*;

use super::error::{in_config, number, some, Fail};
use super::scratch::{map_in_place, status, with_f64};
use super::stats::value;
use super::testing::Live;
use crate::error::{self as check, Error};
use crate::stats::{
    band_carrier_density, y_factor, y_factor_noise_temperature, CarrierDensity, LoadNoiseModel,
    Semiconductor,
};
use crate::thermometry::raman::{
    anti_stokes_stokes_ratio, raman_frequency_factor, raman_temperature, RamanDetection,
};
use crate::units::{
    convert_spectral_checked, power_ratio_from_decibels, power_ratio_to_decibels, SpectralKind,
    SpectralUnit, SPECTRAL_NAMES,
};

/// Writes the figures `values` of a result object to f64 scratch buffer 0 (the facade builds
/// the object from them: a serde `Serialize` per result type cost 0.5–1.5 KB of the module
/// each) and returns their count.
#[inline(never)]
pub(crate) fn put(values: &[f64]) -> f64 {
    with_f64(|b| {
        let out = &mut b[0];
        out.clear();
        out.extend_from_slice(values);
    });
    values.len() as f64
}

/// A core result `r` of an export: its figures (`put`) and their count, or NaN with the error
/// stored.
pub(crate) fn figures<const N: usize>(r: crate::Result<[f64; N]>) -> f64 {
    number(r.map(|v| put(&v)).map_err(Fail::from))
}

/// `map_in_place` through a dynamic operation: one loop for every bulk method of this area
/// (none is a hot path; each generic copy of the loop cost 0.5–1 KB of the module). Returns 0,
/// or NaN with the error stored.
#[inline(never)]
pub(crate) fn map_each(op: &dyn Fn(f64) -> crate::Result<f64>) -> f64 {
    status(map_in_place(op))
}

/// 1 or 0.
pub(crate) fn bit(b: bool) -> f64 {
    if b {
        1.0
    } else {
        0.0
    }
}

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

    /// 0 the anti-Stokes/Stokes ratio at temperature `x` (K); 1 the reading of ratio `x`
    /// (its figures in f64 scratch buffer 0, returns their count: `ramanReading` in
    /// quantum.js); 2 the frequency factor. NaN with the error stored.
    pub fn number(&self, op: u32, x: f64) -> f64 {
        let (l, e, d) = (self.shift_per_m, self.excitation_m, self.detection);
        match op {
            0 => value(anti_stokes_stokes_ratio(l, e, x, d)),
            1 => figures(raman_temperature(l, e, x, d).map(|r| {
                [
                    r.temperature_k,
                    r.d_t_d_ratio,
                    r.relative_sensitivity_per_k,
                    r.phonon_occupancy,
                    r.frequency_factor,
                    r.mode_temperature_k,
                ]
            })),
            _ => self.factor,
        }
    }

    /// Bulk forms over f64 scratch buffer 0: 0 ratios of temperatures (K), 1 temperatures (K)
    /// of ratios. Returns 0, or NaN with the error stored.
    pub fn bulk(&self, op: u32) -> f64 {
        let (l, x, d) = (self.shift_per_m, self.excitation_m, self.detection);
        if op == 0 {
            map_each(&|t| {
                check::temperature("temperaturesK", t)?;
                anti_stokes_stokes_ratio(l, x, t, d)
            })
        } else {
            map_each(&|r| {
                check::positive("ratios", r)?;
                raman_temperature(l, x, r, d).map(|v| v.temperature_k)
            })
        }
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

    /// 0 the Y factor of receiver noise temperature `x` (K); 1 the receiver noise temperature
    /// of the measured Y `x` (its figures in f64 scratch buffer 0, the load model's code first;
    /// returns their count: `yFactorReading` in quantum.js); at `frequency` in the loads' unit.
    /// NaN with the error stored.
    pub fn number(&self, op: u32, x: f64, frequency: f64) -> f64 {
        let (h, c, m) = (self.hot_k, self.cold_k, self.model);
        let f = self.hz(frequency);
        if op == 0 {
            return value(f.and_then(|f| y_factor(x, h, c, f, m)));
        }
        figures(
            f.and_then(|f| y_factor_noise_temperature(x, h, c, f, m))
                .map(|r| {
                    [
                        match r.model {
                            LoadNoiseModel::CallenWelton => 0.0,
                            LoadNoiseModel::Planck => 1.0,
                            LoadNoiseModel::RayleighJeans => 2.0,
                        },
                        r.receiver_noise_temperature_k,
                        r.d_t_d_y,
                        r.hot_load_noise_temperature_k,
                        r.cold_load_noise_temperature_k,
                        r.rayleigh_jeans_k,
                        r.planck_k,
                        r.callen_welton_k,
                        r.planck_minus_rayleigh_jeans_k,
                        r.callen_welton_minus_rayleigh_jeans_k,
                    ]
                }),
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
    /// Figures in f64 scratch buffer 0 (returns their count; `carriers` and `intrinsic` in
    /// quantum.js): 5 electron and 6 hole densities at Fermi level `x` (in the unit, from
    /// E_v), 7 the intrinsic carriers. NaN with the error stored.
    pub fn number(&self, op: u32, x: f64, t: f64) -> f64 {
        let m = &self.material;
        match op {
            5 | 6 => figures((|| {
                let e = energy_to_j("fermiLevel", x, self.unit)?;
                carriers(if op == 6 {
                    m.hole_density(e, t)?
                } else {
                    m.electron_density(e, t)?
                })
            })()),
            7 => figures((|| {
                let i = m.intrinsic(t)?;
                Ok([
                    i.density_per_m3,
                    i.boltzmann_density_per_m3,
                    self.in_unit("fermiLevel", i.fermi_level_j)?,
                    self.in_unit("boltzmannFermiLevel", i.boltzmann_fermi_level_j)?,
                    self.in_unit("bandGap", i.band_gap_j)?,
                ])
            })()),
            _ => value(match op {
                0 => m.band_gap_j(t).and_then(|j| self.in_unit("bandGap", j)),
                1 => m.conduction_band_density_of_states(t),
                2 => m.valence_band_density_of_states(t),
                3 => m
                    .fermi_level_from_electron_density(x, t)
                    .and_then(|j| self.in_unit("fermiLevel", j)),
                _ => m
                    .fermi_level_from_hole_density(x, t)
                    .and_then(|j| self.in_unit("fermiLevel", j)),
            }),
        }
    }

    /// Bulk form over f64 scratch buffer 0: intrinsic densities (m⁻³, Fermi–Dirac) of
    /// temperatures (K). Returns 0, or NaN with the error stored.
    #[wasm_bindgen(js_name = intrinsicBulk)]
    pub fn intrinsic_bulk(&self) -> f64 {
        map_each(&|t| {
            check::temperature("temperaturesK", t)?;
            Ok(self.material.intrinsic(t)?.density_per_m3)
        })
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

/// The figures of a carrier density, in declaration order.
fn carriers(c: CarrierDensity) -> crate::Result<[f64; 4]> {
    Ok([
        c.density_per_m3,
        c.boltzmann_density_per_m3,
        c.boltzmann_relative_error,
        c.reduced_fermi_level,
    ])
}

/// The carrier density of one band (`bandCarrierDensity`): its figures in f64 scratch buffer 0
/// and their count, or NaN with the error stored.
#[wasm_bindgen(js_name = qbBandCarrierDensity)]
pub fn band_carrier_density_js(effective_density_per_m3: f64, eta: f64) -> f64 {
    figures(band_carrier_density(effective_density_per_m3, eta).and_then(carriers))
}
