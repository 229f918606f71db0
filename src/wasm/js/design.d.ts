// ---- instrument design (src/wasm/js/design.js) -----------------------------------------------
// SI units throughout (m, m², K, s, A, W, sr, Hz), the unit in every parameter name; band limits
// in the `unit` given with them. D* (specific detectivity) is in m·Hz^½·W⁻¹: multiply by 100
// for cm·Hz^½·W⁻¹ ("Jones"), or use dStarToJones / jonesToDStar.
//
// Cautions: these are design estimates, not measurements. Real detectors and optics add 1/f
// noise, non-uniformity, stray light, spectral structure and drift that these formulas omit.
// Gouffé's cavity emissivity is an approximation; a blackbody's emissivity and a thermometer's
// size-of-source correction used in calibration must come from traceable measurement. Not for
// medical screening or process-safety decisions; follow local codes and standards.

/**
 * Form of the projected solid angle of a circular aperture of f-number F seen from an on-axis
 * point: "exact" = π/(4F² + 1) (a flat aperture, tan θ = 1/(2F)); "smallAngle" = π/(4F²)
 * (paraxial; exact for an aplanatic lens with F = 1/(2 sin θ)). They differ by 1 + 1/(4F²):
 * 6.25 % at F/2.
 */
export type ConeForm = "exact" | "smallAngle";

/** The optics in front of the pixel. */
export interface DesignOptics {
  /** Working f-number F (> 0). */
  fNumber: number;
  /** In-band transmittance τ in (0, 1]. */
  transmittance: number;
  /** Default "exact" (4F² + 1). */
  cone?: ConeForm;
  /** Field angle θ of the pixel, rad, in [0, π/2): the irradiance carries cos⁴θ. Default 0 (on axis). */
  fieldAngleRad?: number;
}

/**
 * How the detector turns flux into electrons: a band-flat responsivity in A/W (the scene band
 * is then an energy radiance), a band-flat quantum efficiency (photon radiance), or "included"
 * (a model scene whose signal already carries the detector response: current or electron kind).
 */
export type DetectorConversion =
  | { kind: "responsivity"; /** ℜ, A/W (> 0). */ amperesPerWatt: number }
  | { kind: "quantumEfficiency"; /** η in (0, 1]. */ efficiency: number }
  | { kind: "included" };

/** The pixel's detector and readout. */
export interface DesignDetector {
  /** Pixel (detector) area A, m² (> 0): 15 µm pitch is 2.25e-10 m². */
  pixelAreaM2: number;
  conversion: DetectorConversion;
  /** Integration time t, s (> 0); the noise bandwidth is Δf = 1/(2t). */
  integrationTimeS: number;
  /** Full-well capacity, electrons (> 0). */
  fullWellElectrons: number;
  /** Dark current, A (≥ 0). */
  darkCurrentA: number;
  /** Read noise, electrons rms (≥ 0). */
  readNoiseElectrons: number;
}

/**
 * The unit family of an in-band radiance: "energy" W·m⁻²·sr⁻¹, "photon"
 * photons·s⁻¹·m⁻²·sr⁻¹, "current" A·m⁻²·sr⁻¹ (weighted by a responsivity in A/W), "electron"
 * electrons·s⁻¹·m⁻²·sr⁻¹ (weighted by a quantum efficiency). On a pixel: W, photons/s, A,
 * electrons/s.
 */
export type RadianceKind = "energy" | "photon" | "current" | "electron";

/**
 * A grey-body scene seen in a rectangular band. The limits are in `unit` (any spectral unit:
 * "um", "nm", "cm-1", "THz", "eV"…; a reciprocal unit may give them in either order of
 * wavelength). Its radiance is energy for a responsivity and photons for a quantum efficiency.
 */
export interface BandScene {
  kind: "band";
  lower: number;
  upper: number;
  unit: SpectralUnit;
  /** Scene emissivity in (0, 1]. Default 1. */
  emissivity?: number;
  /** Default "codata2018". */
  c2?: C2Convention;
}

/**
 * A scene read through an instrument model (as in `new Instrument({ model })`), e.g. a
 * responsivity table in A/W ("current", with conversion "included") or a relative response
 * ("energy", with a responsivity). `radianceKind` states what the model's signal is.
 */
export interface ModelScene {
  kind: "model";
  model: InstrumentModel;
  radianceKind: RadianceKind;
}

export type DesignScene = BandScene | ModelScene;

/** The argument of `new DetectorDesign`. */
export interface DetectorDesignDefinition {
  optics: DesignOptics;
  detector: DesignDetector;
  scene: DesignScene;
  /** Extra background electron rate (stray light, warm optics), electrons/s (≥ 0). Default 0. */
  backgroundElectronsPerS?: number;
}

/** Flux on the pixel (W, photons/s, A or electrons/s by `kind`) and its derivative per K. */
export interface PixelFlux {
  readonly kind: RadianceKind;
  readonly flux: number;
  readonly dFluxDt: number;
}

/** Noise of one integration by source, electrons rms (Poisson shot noise; read noise). */
export interface NoiseBudget {
  readonly signalShotElectrons: number;
  readonly backgroundShotElectrons: number;
  readonly darkShotElectrons: number;
  readonly readElectrons: number;
  /** All in quadrature: √(N_s + N_b + N_d + σ_r²). */
  readonly totalElectrons: number;
}

/** One pixel, one integration (a design estimate). */
export interface PixelReport {
  readonly flux: PixelFlux;
  /** Photocurrent of the scene signal, A. */
  readonly photocurrentA: number;
  /** Signal electrons N_s per integration. */
  readonly signalElectrons: number;
  /** ∂N_s/∂T, electrons per K of scene temperature. */
  readonly dSignalElectronsDt: number;
  readonly backgroundElectrons: number;
  readonly darkElectrons: number;
  /** (N_s + N_b + N_d)/full well; ≥ 1 means the pixel saturates. */
  readonly wellFill: number;
  /** wellFill ≥ 1: the noise, SNR and NETD below no longer describe a real pixel. */
  readonly saturated: boolean;
  readonly noise: NoiseBudget;
  /** N_s/σ (0 without signal and noise). */
  readonly snr: number;
  /** First-principles NETD σ/(∂N_s/∂T), K (Infinity if the signal does not change with T). */
  readonly netdK: number;
}

/**
 * One pixel of an instrument being designed, prepared once:
 * `new DetectorDesign({ optics, detector, scene, backgroundElectronsPerS? })`. Every method
 * takes the scene temperature in K. Bulk methods take a {@link NumberArray} and return a new
 * Float64Array, or fill `out` and return it. `free()` releases it now.
 *
 * Model: Φ = L·A·τ·Ω(F)·cos⁴θ on the pixel; N_s = conversion(Φ)·t, N_b = ṅ_b·t, N_d = I_d·t/e;
 * σ = √(N_s + N_b + N_d + σ_r²) (Poisson shot noise: photovoltaic or integrating detectors);
 * SNR = N_s/σ; NETD = σ/(∂N_s/∂T).
 *
 * Cautions: design estimates, not measurements (no 1/f noise, non-uniformity, stray light or
 * drift); check `saturated` before reading noise figures.
 *
 * @throws {QuantabandError} from the constructor: UNSUPPORTED (unknown field or kind, a
 * conversion that does not suit the scene), WRONG_TYPE, UNKNOWN_UNIT, NON_POSITIVE (f-number,
 * area, integration time, full well), OUT_OF_RANGE (transmittance, quantum efficiency,
 * emissivity, field angle, negative dark current, read noise or background), INVALID_BAND, and
 * the model's errors; messages name the field (`design.optics.fNumber`).
 */
export class DetectorDesign {
  constructor(design: DetectorDesignDefinition);
  free(): void;
  /** Flux, photocurrent, electrons, well fill, noise, SNR and NETD at temperatureK. */
  evaluate(temperatureK: number): PixelReport;
  /** First-principles NETD at temperatureK, K (also where the pixel saturates: see wellFills). */
  netd(temperatureK: number): number;
  /** NETD (K) at each scene temperature: a plot of NETD against T. */
  netds(temperaturesK: NumberArray, out?: Float64Array): Float64Array;
  /** SNR at each scene temperature. */
  snrs(temperaturesK: NumberArray, out?: Float64Array): Float64Array;
  /** Well fill at each scene temperature (≥ 1: saturated). */
  wellFills(temperaturesK: NumberArray, out?: Float64Array): Float64Array;
  /**
   * NETD (K) of this pixel for a detector of D* `dStar` (m·Hz^½·W⁻¹) at temperatureK:
   * NETD = (4F² + 1)·√Δf/(π·τ·D*·√A·∂L/∂T·cos⁴θ) (4F² with cone "smallAngle"), Δf = 1/(2t).
   * Energy (responsivity) scene: D* flat in λ. Photon (quantum-efficiency) scene: an ideal
   * photon detector, D*(λ) = D*·λ/λp, with D* quoted at its peak λp = peakWavelengthM (m;
   * default the band's long-wavelength limit; required for a photon model scene; not accepted
   * for an energy scene). Current and electron scenes: UNSUPPORTED.
   */
  netdFromDStar(dStar: number, temperatureK: number, peakWavelengthM?: number): number;
  /** The D* (m·Hz^½·W⁻¹) giving NETD netdK at temperatureK: the inverse of netdFromDStar. */
  dStarFromNetd(netdK: number, temperatureK: number, peakWavelengthM?: number): number;
}

/** Projected solid angle of a circular aperture of f-number fNumber, sr: π/(4F² + 1) or π/(4F²). Default cone "exact". */
export function projectedSolidAngle(fNumber: number, cone?: ConeForm): number;
/** Étendue A·Ω of a small on-axis pixel of area areaM2 (m²) through an aperture of f-number fNumber, m²·sr. */
export function etendue(areaM2: number, fNumber: number, cone?: ConeForm): number;
/** Étendue of a small on-axis area through a disc aperture of diameter apertureDiameterM at distanceM, m²·sr (F = distance/diameter). */
export function etendueThroughAperture(areaM2: number, apertureDiameterM: number, distanceM: number, cone?: ConeForm): number;
/**
 * Étendue between a field-stop disc and a coaxial aperture disc (diameters and distance in m),
 * m²·sr: the exact coaxial-disc view factor ("exact", default) or A₁A₂/d² ("smallAngle").
 */
export function etendueBetweenDiscs(stopDiameterM: number, apertureDiameterM: number, distanceM: number, cone?: ConeForm): number;
/**
 * Focal-plane irradiance factor K = τ·Ω(F)·cos⁴θ, sr: irradiance E = K·L and pixel flux
 * Φ = K·A·L for a scene radiance L (fieldAngleRad default 0; cos⁴ is the small-aperture law).
 */
export function irradianceFactor(fNumber: number, transmittance: number, fieldAngleRad?: number, cone?: ConeForm): number;

/** Responsivity ℜ = η·e·λ/(h·c), A/W, of quantum efficiency `efficiency` at wavelengthM (m). */
export function responsivityFromQuantumEfficiency(efficiency: number, wavelengthM: number): number;
/** Quantum efficiency η = ℜ·h·c/(e·λ) of a responsivity amperesPerWatt (A/W) at wavelengthM (m); > 1 means gain. */
export function quantumEfficiencyFromResponsivity(amperesPerWatt: number, wavelengthM: number): number;
/** Noise-equivalent bandwidth Δf = 1/(2t) of an integration of integrationTimeS, Hz. */
export function noiseBandwidth(integrationTimeS: number): number;
/** Noise-equivalent power NEP = √(A·Δf)/D*, W (dStar in m·Hz^½·W⁻¹, areaM2 m², bandwidthHz Hz). */
export function nep(dStar: number, areaM2: number, bandwidthHz: number): number;
/** D* = √(A·Δf)/NEP, m·Hz^½·W⁻¹. */
export function dStarFromNep(nepW: number, areaM2: number, bandwidthHz: number): number;
/** NETD = NEP/(∂P/∂T), K, for a pixel whose power changes by dPowerDtWPerK (W/K) per kelvin of scene. */
export function netdFromDStar(dStar: number, areaM2: number, bandwidthHz: number, dPowerDtWPerK: number): number;
/** D* = √(A·Δf)/(NETD·∂P/∂T), m·Hz^½·W⁻¹. */
export function dStarFromNetd(netdK: number, areaM2: number, bandwidthHz: number, dPowerDtWPerK: number): number;
/** D* from m·Hz^½·W⁻¹ to cm·Hz^½·W⁻¹ ("Jones"): ×100. */
export function dStarToJones(dStar: number): number;
/** D* from cm·Hz^½·W⁻¹ ("Jones") to m·Hz^½·W⁻¹: ÷100. */
export function jonesToDStar(jones: number): number;

/** Photovoltaic (shot noise, 2ηΦ) or photoconductive (generation–recombination, 4ηΦ: D* lower by √2). */
export type DetectorMechanism = "photovoltaic" | "photoconductive";
/** The background a detector sees: a cold-stop f-number (cone form per `cone`) or the full "hemisphere" (π sr). */
export type BackgroundView = number | "hemisphere";

/**
 * Background photon flux density Φ_B = Ω·∫₀^λc L_q,λ(λ, T_B) dλ, photons·s⁻¹·m⁻², absorbed by
 * an ideal detector of cut-off cutoffWavelengthM (m) seeing a background at
 * backgroundTemperatureK through `view` (`cone` applies to a cold stop; default "exact").
 */
export function backgroundPhotonFlux(cutoffWavelengthM: number, backgroundTemperatureK: number, view: BackgroundView, cone?: ConeForm): number;
/**
 * Background-limited D* at the cut-off, m·Hz^½·W⁻¹: (λc/hc)·√(η/(2Φ_B)) photovoltaic (default)
 * or (λc/2hc)·√(η/Φ_B) photoconductive. A limit, not a prediction of a real detector.
 */
export function blipDStar(
  cutoffWavelengthM: number,
  quantumEfficiency: number,
  backgroundTemperatureK: number,
  view: BackgroundView,
  mechanism?: DetectorMechanism,
  cone?: ConeForm,
): number;
/** Background-limited D* at wavelengthM (m) for a given background photon flux density (photons·s⁻¹·m⁻²). */
export function blipDStarFromFlux(wavelengthM: number, quantumEfficiency: number, backgroundPhotonFlux: number, mechanism?: DetectorMechanism): number;

/** An isothermal cavity: a cylinder with a flat bottom, or a cone, with an aperture in its lid. */
export type CavityShape = "cylinder" | "cone";
/**
 * Effective emissivity of an isothermal diffuse cavity by Gouffé's approximation (1945): for
 * depth ≥ aperture diameter (else OUT_OF_RANGE); it tracks the on-axis (normal-view) value
 * within 0.084·(1 − ε) for cylinders and 0.20·(1 − ε) for cones (against a radiosity solution).
 * An approximation for design: a reference source's emissivity must come from traceable
 * measurement. Lengths in m.
 */
export function cavityEmissivityGouffe(wallEmissivity: number, shape: CavityShape, radiusM: number, depthM: number, apertureRadiusM: number): number;

/**
 * Relative signal change δ = S(d_m)/S(d_c) − 1 between the measurement and calibration source
 * sizes, from the instrument's size-of-source-effect curve values σ = S(d)/S(d_ref) − 1 (> −1).
 */
export function sizeOfSourceChange(sseAtMeasurement: number, sseAtCalibration: number): number;
/**
 * The signal the instrument would read from a source of the calibration size: S/(1 + δ), in the
 * signal's unit. Its temperature: `instrument.temperature(corrected)` (the blackbody model) or
 * `instrument.objectTemperature(corrected)` (under the instrument's measurement conditions).
 */
export function sizeOfSourceCorrectedSignal(signal: number, relativeChange: number): number;
/**
 * Spot diameter s = d/R, m, at distanceM for a distance-to-spot ratio R (D:S, 12 for 12:1). The
 * spot is the circle from which the maker's stated fraction of the signal comes (often 90 % or
 * 95 %); the cone form holds well beyond the focus (near it use spotDiameterFocused).
 */
export function spotDiameter(distanceM: number, distanceToSpotRatio: number): number;
/**
 * Spot diameter, m, of focused optics (aperture apertureDiameterM, spot focusSpotDiameterM at
 * focusDistanceM) at distanceM: |1 − u|·D_a + u·d_f with u = distance/focus distance (straight
 * ray bundles from the aperture edge through the focal spot; no diffraction or aberration).
 */
export function spotDiameterFocused(distanceM: number, apertureDiameterM: number, focusDistanceM: number, focusSpotDiameterM: number): number;
/** Whether a target fills the spot. */
export interface SpotFill {
  /** Target diameter / spot diameter. */
  readonly diameterRatio: number;
  /** Share of the spot's area covered by a centred target, 0…1. */
  readonly fillFraction: number;
  /** diameterRatio ≥ 1 (a target just filling the spot still needs margin for alignment and the SSE). */
  readonly fills: boolean;
}
/** Target (diameter targetDiameterM, m) against a spot of spotDiameterM (m). */
export function spotFill(targetDiameterM: number, spotDiameterM: number): SpotFill;
