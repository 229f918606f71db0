//! Instrument design for JavaScript: the prepared pixel design (`DetectorDesign` in the facade,
//! `src/wasm/js/design.js`), read once from a [`DesignDefinition`], and the design's free
//! functions of plain numbers (throughput, figures of merit, background limit, source and spot
//! corrections) behind one dispatching export, `designNumber` (one export instead of twenty
//! keeps the module small). Result objects (a pixel report, a spot fill) leave as numbers in
//! f64 scratch buffer 0, from which the facade builds them.
//!
//! Enumerations (cone form, background view, mechanism, cavity shape) arrive as small integer
//! codes: the facade checks the strings the caller wrote and names the parameter in its errors.
//! Arguments whose core name differs from their JavaScript name are checked here first under
//! the JavaScript name.

use wasm_bindgen::prelude::*;

use super::config::read;
use super::error::{in_config, number, some, Fail};
use super::quantum::{bit, map_each, put};
use super::testing::Live;
use crate::design::definition::{DesignDefinition, PreparedDesign, SceneDefinition};
use crate::design::detector::{
    quantum_efficiency_from_responsivity, responsivity_from_quantum_efficiency, PixelReport,
};
use crate::design::merit::{
    background_photon_flux, blip_d_star, blip_d_star_from_flux, d_star_from_nep, d_star_from_netd,
    nep_w, netd_from_d_star, noise_bandwidth_hz,
};
use crate::design::scene::{non_negative, RadianceKind};
use crate::design::sources::{
    cavity_emissivity_gouffe, spot_diameter_focused_m, spot_diameter_m, spot_fill,
    sse_corrected_signal, sse_relative_change,
};
use crate::design::throughput::{
    etendue_between_discs, etendue_from_aperture, etendue_from_f_number, projected_solid_angle_sr,
};
use crate::design::{BackgroundView, Cavity, ConeForm, Mechanism, Optics};
use crate::error::{self as check, Error};
use crate::units::{d_star_to_jones, jones_to_d_star};

/// A checked pixel design.
#[wasm_bindgen(js_name = QbDesign)]
pub struct DesignHandle {
    design: PreparedDesign,
    _live: Live,
}

#[wasm_bindgen(js_class = QbDesign)]
impl DesignHandle {
    /// Reads and checks a design `{ optics, detector, scene, backgroundElectronsPerS? }`.
    pub fn create(design: JsValue) -> Option<DesignHandle> {
        some((|| {
            let d: DesignDefinition = read(design, "design")?;
            // Each part checked under its configuration path, then the whole (again, cheaply).
            d.optics.validate().map_err(in_config("design.optics"))?;
            let conversion = &d.detector.conversion;
            conversion
                .validate()
                .map_err(in_config("design.detector.conversion"))?;
            d.detector
                .validate()
                .map_err(in_config("design.detector"))?;
            non_negative("background_electrons_per_s", d.background_electrons_per_s)
                .map_err(in_config("design"))?;
            let scene = match d.scene {
                SceneDefinition::Model { .. } => "design.scene.model",
                SceneDefinition::Band { .. } => "design.scene",
            };
            let design = d.prepare().map_err(in_config(scene))?;
            Ok(DesignHandle {
                design,
                _live: Live::new(),
            })
        })())
    }

    /// Element-wise over f64 scratch buffer 0 (scene temperatures in, in place): 0 NETD (K),
    /// 1 SNR, 2 well fill. Returns 0, or NaN with the error stored.
    pub fn bulk(&self, op: u32) -> f64 {
        map_each(&|t| {
            check::temperature("temperaturesK", t)?;
            let r = self.design.evaluate(t)?;
            Ok(match op {
                0 => r.netd_k,
                1 => r.snr,
                _ => r.well_fill,
            })
        })
    }

    /// 0 NETD from D* `x`, 1 D* from NETD `x`, at scene temperature `t` (peak wavelength
    /// `peak_m` for a photon scene); 2 the report at scene temperature `t` (its figures in f64
    /// scratch buffer 0, returns their count: `pixelReport` in design.js). NaN with the error
    /// stored.
    pub fn number(&self, op: u32, x: f64, t: f64, peak_m: Option<f64>) -> f64 {
        number(
            (|| {
                if op == 2 {
                    check::temperature("temperatureK", t)?;
                    return Ok(put(&report(&self.design.evaluate(t)?)));
                }
                let inverse = op == 1;
                check::positive(if inverse { "netdK" } else { "dStar" }, x)?;
                check::temperature("temperatureK", t)?;
                if inverse {
                    self.design.d_star_from_netd(x, t, peak_m)
                } else {
                    self.design.netd_from_d_star(x, t, peak_m)
                }
            })()
            .map_err(Fail::from),
        )
    }
}

/// The figures of a pixel report, in declaration order (the radiance kind as its position in
/// `RadianceKind`, booleans 1 or 0).
fn report(r: &PixelReport) -> [f64; 17] {
    let n = &r.noise;
    [
        match r.flux.kind {
            RadianceKind::Energy => 0.0,
            RadianceKind::Photon => 1.0,
            RadianceKind::Current => 2.0,
            RadianceKind::Electron => 3.0,
        },
        r.flux.flux,
        r.flux.d_flux_dt,
        r.photocurrent_a,
        r.signal_electrons,
        r.d_signal_electrons_dt,
        r.background_electrons,
        r.dark_electrons,
        r.well_fill,
        bit(r.saturated),
        n.signal_shot_electrons,
        n.background_shot_electrons,
        n.dark_shot_electrons,
        n.read_electrons,
        n.total_electrons,
        r.snr,
        r.netd_k,
    ]
}

/// Cone-form code of the facade: 1 small angle (4F²), otherwise exact (4F² + 1).
fn cone(code: f64) -> ConeForm {
    if code == 1.0 {
        ConeForm::SmallAngle
    } else {
        ConeForm::Exact
    }
}

/// Background view: code 2 a full hemisphere, otherwise a cold stop of f-number `f_number`
/// (checked under the facade's name `view`) with the cone form of `code`.
fn view(f_number: f64, code: f64) -> crate::Result<BackgroundView> {
    if code == 2.0 {
        return Ok(BackgroundView::Hemisphere);
    }
    check::positive("view", f_number)?;
    Ok(BackgroundView::ColdStop {
        f_number,
        cone: cone(code),
    })
}

/// Mechanism code: 1 photoconductive, otherwise photovoltaic.
fn mechanism(code: f64) -> Mechanism {
    if code == 1.0 {
        Mechanism::Photoconductive
    } else {
        Mechanism::Photovoltaic
    }
}

/// The design free functions returning one number (operation codes in `design.js`).
#[inline(never)]
fn design_op(op: u32, a: f64, b: f64, c: f64, d: f64, e: f64, f: f64) -> crate::Result<f64> {
    match op {
        0 => projected_solid_angle_sr(a, cone(b)),
        1 => etendue_from_f_number(a, b, cone(c)),
        2 => etendue_from_aperture(a, b, c, cone(d)),
        3 => etendue_between_discs(a, b, c, cone(d)),
        4 => Optics::new(a, b)
            .with_field_angle(c)
            .with_cone(cone(d))
            .irradiance_factor_sr(),
        5 => noise_bandwidth_hz(a),
        6 => nep_w(a, b, c),
        7 => d_star_from_nep(a, b, c),
        8 => netd_from_d_star(a, b, c, d),
        9 => d_star_from_netd(a, b, c, d),
        10 => background_photon_flux(a, b, &view(c, d)?),
        11 => blip_d_star(a, b, c, &view(d, e)?, mechanism(f)),
        12 => {
            check::spectral("wavelengthM", a)?;
            blip_d_star_from_flux(a, b, c, mechanism(d))
        }
        13 => {
            check::spectral("wavelengthM", b)?;
            responsivity_from_quantum_efficiency(a, b)
        }
        14 => {
            check::spectral("wavelengthM", b)?;
            quantum_efficiency_from_responsivity(a, b)
        }
        15 => d_star_to_jones(a),
        16 => jones_to_d_star(a),
        17 => {
            let (radius_m, depth_m, aperture_radius_m) = (c, d, e);
            let cavity = if b == 1.0 {
                Cavity::Cone {
                    radius_m,
                    depth_m,
                    aperture_radius_m,
                }
            } else {
                Cavity::Cylinder {
                    radius_m,
                    depth_m,
                    aperture_radius_m,
                }
            };
            cavity_emissivity_gouffe(a, &cavity)
        }
        18 => sse_relative_change(a, b),
        19 => sse_corrected_signal(a, b),
        20 => spot_diameter_m(a, b),
        21 => spot_diameter_focused_m(a, b, c, d),
        // the figures of a spot fill in f64 scratch buffer 0; their count
        22 => spot_fill(a, b).map(|f| put(&[f.diameter_ratio, f.fill_fraction, bit(f.fills)])),
        _ => Err(Error::Unsupported {
            what: "internal: unknown design operation",
        }),
    }
}

/// One design free function of plain numbers: the value, or NaN with the error stored.
#[wasm_bindgen(js_name = designNumber)]
pub fn design_number(op: u32, a: f64, b: f64, c: f64, d: f64, e: f64, f: f64) -> f64 {
    number(design_op(op, a, b, c, d, e, f).map_err(Fail::from))
}
