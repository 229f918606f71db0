// ---- multi-wavelength, Raman and noise-source thermometry; carrier statistics (src/wasm/js/quantum.js)

/** A photon-energy unit (the energy spellings of SpectralUnit): J, eV or meV. */
export type EnergyUnit = "J" | "eV" | "meV";

/**
 * An emissivity model of a multi-wavelength fit, in the reduced wavelength
 * u = (λ − λc)/h of the channels (λc = (λmin + λmax)/2, h = (λmax − λmin)/2, so u ∈ [−1, 1]):
 * "polynomial" ε = a0 + a1·u + … + am·u^m; "logPolynomial" ln ε = a0 + a1·u + … + am·u^m
 * (order 1: the log-linear model). Order 0 of either is the grey body.
 */
export interface EmissivityModel {
  kind: "polynomial" | "logPolynomial";
  /** m: 0 to 4 (m + 1 coefficients; p = m + 2 fitted parameters with T). */
  order: 0 | 1 | 2 | 3 | 4;
}

/**
 * Spectral radiances at N ≥ p single wavelengths (first argument of `fitMultiwavelength`).
 */
export interface SpectralRadianceMeasurement {
  /** Strictly increasing wavelengths, in `unit`. */
  wavelengths: NumberArray;
  unit: WavelengthUnit;
  /**
   * Spectral radiances L_λ > 0, W·m⁻²·sr⁻¹ per `unit` of wavelength (per µm with "um", as
   * `new Spectrum({ unit: "um" }).point` gives them): the emissivity coefficients depend on
   * it, the temperature does not.
   */
  radiances: NumberArray;
  /** Standard uncertainties of the radiances (> 0, same unit), one per channel. */
  uncertainties: NumberArray;
  /** Planck's c2 of the model. Default "codata2018". */
  c2?: C2Convention;
  channels?: never;
  signals?: never;
}

/**
 * Band signals of N ≥ p instrument channels (first argument of `fitMultiwavelength`): channel
 * i's blackbody signal is the model of the Instrument `channels[i]` (its measurement conditions
 * are not used: the fit's own emissivity model takes their place), and the emissivity is taken
 * at `wavelengths[i]`.
 */
export interface ChannelSignalMeasurement {
  /** The channels, one Instrument each (not freed by the fit). */
  channels: readonly Instrument[];
  /** The channels' effective wavelengths, strictly increasing, in `unit`. */
  wavelengths: NumberArray;
  unit: WavelengthUnit;
  /** Signals > 0, each in its channel model's signal unit (as `Instrument.signal` gives them). */
  signals: NumberArray;
  /** Standard uncertainties of the signals (> 0). */
  uncertainties: NumberArray;
  radiances?: never;
  c2?: never;
}

/** The data of a multi-wavelength fit. */
export type MultiwavelengthMeasurement = SpectralRadianceMeasurement | ChannelSignalMeasurement;

/** Options of `fitMultiwavelength`. */
export interface MultiwavelengthOptions {
  /** Default `{ kind: "polynomial", order: 0 }` (grey). */
  model?: EmissivityModel;
  /** Flag the fit when the scaled condition number exceeds this (> 0). Default 1e3. */
  maxConditionNumber?: number;
  /** Flag the fit when |corr(T, a1)| exceeds this, in (0, 1]. Default 0.999. */
  maxAbsCorrelation?: number;
}

/**
 * Why a fit is not to be trusted as precise: "conditionNumber" (above maxConditionNumber),
 * "correlation" (|corr(T, a1)| above maxAbsCorrelation), "localMinima" (the data admit
 * several temperatures; the lowest χ² is returned) — each sets `illConditioned`; and
 * "unphysicalEmissivity" (the fitted ε leaves (0, 1] at a channel: a wrong model or wrong
 * radiance units).
 */
export type MultiwavelengthWarning = "conditionNumber" | "correlation" | "localMinima" | "unphysicalEmissivity";

/**
 * The result of `fitMultiwavelength` (method: weighted least squares with the full Planck
 * law, as analysed by Coates, Metrologia 17, 103 (1981)). All figures are own read-only
 * properties (JSON.stringify shows them); `emissivity` evaluates the fitted model. The
 * covariance describes the noise of the data only: a wrong emissivity model biases T however
 * small `uTemperatureK` is. `free()` releases the WebAssembly memory of `emissivity` (the
 * figures stay); a forgotten fit is freed when garbage-collected.
 *
 * Cautions: a calculation, not a measurement; not for medical or fever screening or
 * process-safety decisions; defer to local codes and standards.
 */
export class MultiwavelengthFit {
  private constructor();
  /** Fitted temperature, K. */
  readonly temperatureK: number;
  /** Its standard uncertainty propagated from `uncertainties` (not rescaled by χ²/ν), K. */
  readonly uTemperatureK: number;
  /**
   * True when the condition number or |corr(T, a1)| exceeds its threshold, or the data admit
   * several temperatures: read `uTemperatureK`, not the digits of `temperatureK`.
   */
  readonly illConditioned: boolean;
  /** What is wrong, if anything (empty for a sound fit). */
  readonly warnings: readonly MultiwavelengthWarning[];
  readonly model: Readonly<EmissivityModel>;
  /** a0 … am (dimensionless, in the reduced wavelength u): m + 1 numbers. */
  readonly coefficients: readonly number[];
  /**
   * Covariance of (T, a0 … am): p × p nested arrays, p = order + 2, row-major; index 0 is T
   * (K² on the diagonal), 1 + k is a_k; `covariance[0][0]` = uTemperatureK².
   */
  readonly covariance: readonly (readonly number[])[];
  /** The measurement's wavelength unit, as given. */
  readonly unit: WavelengthUnit;
  /** λc of the reduced wavelength, in `unit`. */
  readonly centreWavelength: number;
  /** h of the reduced wavelength, in `unit` (slope per unit of wavelength: a1/halfSpan). */
  readonly halfSpan: number;
  /** 2-norm condition number of the weighted Jacobian with unit-norm columns. */
  readonly conditionNumber: number;
  /** Correlation of T and the slope a1 (undefined for order 0). */
  readonly correlationTemperatureSlope: number | undefined;
  /** u(T) divided by u(T) with the emissivity known (≥ 1): what the model's freedom costs. */
  readonly uncertaintyInflation: number;
  /** Local minima of the profile χ²(T) seen over a factor 4 around the start. */
  readonly localMinima: number;
  /** The fitted ε lies in (0, 1] at every channel. */
  readonly emissivityPhysical: boolean;
  /** χ² at the solution. */
  readonly chiSquared: number;
  /** ν = N − p. */
  readonly degreesOfFreedom: number;
  /** Levenberg–Marquardt iterations used. */
  readonly iterations: number;
  /** The Wien-linearised starting temperature, K. */
  readonly startTemperatureK: number;
  /** Brightness temperature (ε = 1) of each channel, K: the single-colour readings. */
  readonly brightnessTemperaturesK: readonly number[];
  /** Grey two-colour temperature of the shortest and longest channel, K (undefined without a solution). */
  readonly greyTwoColourTemperatureK: number | undefined;
  /** The thresholds the fit was judged by. */
  readonly maxConditionNumber: number;
  readonly maxAbsCorrelation: number;
  free(): void;
  /** The fitted ε at `wavelength` (in `unit`); extrapolation beyond the channels is yours. */
  emissivity(wavelength: number): number;
  emissivities(wavelengths: NumberArray, out?: Float64Array): Float64Array;
}

/**
 * Fits the temperature and an emissivity model together to N spectral radiances or band
 * signals.
 *
 * @throws {QuantabandError} TOO_FEW_POINTS (fewer channels than p = order + 2), LENGTH_MISMATCH,
 * NOT_INCREASING (wavelengths), NON_POSITIVE (a radiance, signal or uncertainty, with `index`),
 * OUT_OF_RANGE (options), UNSUPPORTED (a non-wavelength unit, fields of the other form),
 * DEGENERATE_FIT (numerically singular: condition number above 1e13), NO_SOLUTION, WRONG_TYPE.
 */
export function fitMultiwavelength(measurement: MultiwavelengthMeasurement, options?: MultiwavelengthOptions): MultiwavelengthFit;

/**
 * How Raman line intensities were measured: "photonCounting" (CCD, photomultiplier counts:
 * frequency factor to the 3rd power) or "energy" (power-calibrated: 4th power).
 */
export type RamanDetection = "photonCounting" | "energy";

/** The argument of `new RamanMode`. */
export interface RamanModeSettings {
  /** Raman shift ν̃_R of the mode, cm⁻¹ (> 0, below the excitation wavenumber). */
  shiftPerCm: number;
  /** The excitation (laser) line, in `unit`: 532 with "nm", 18796.99 with "cm-1", 2.33 with "eV". */
  excitation: number;
  unit: SpectralUnit;
  /** Default "photonCounting". */
  detection?: RamanDetection;
}

/** A Raman temperature with its sensitivities. */
export interface RamanReading {
  readonly temperatureK: number;
  /** dT/dR, K per unit ratio. */
  readonly dTdRatio: number;
  /** (1/R)·dR/dT = θ/T², K⁻¹. */
  readonly relativeSensitivityPerK: number;
  /** Bose–Einstein occupancy n of the mode at temperatureK. */
  readonly phononOccupancy: number;
  /** F = (ν̃_aS/ν̃_S)^k. */
  readonly frequencyFactor: number;
  /** θ = hc·ν̃_R/k, the mode's temperature scale, K. */
  readonly modeTemperatureK: number;
}

/**
 * A Raman mode prepared once: the anti-Stokes/Stokes ratio R = F·n/(n + 1) = F·exp(−θ/T) and
 * its inverse T = θ/ln(F/R). Ratios must already be corrected for the instrument's relative
 * efficiency at the two lines.
 *
 * @throws {QuantabandError} from the constructor: NON_POSITIVE_SPECTRAL, NON_FINITE,
 * OUT_OF_RANGE (shift not below the excitation wavenumber), UNKNOWN_UNIT, UNSUPPORTED,
 * WRONG_TYPE; from temperature(): NON_POSITIVE (ratio ≤ 0), OUT_OF_RANGE (ratio ≥ F).
 */
export class RamanMode {
  constructor(mode: RamanModeSettings);
  /** F = (ν̃_aS/ν̃_S)^k (> 1): the ratio's limit as T → ∞. */
  readonly frequencyFactor: number;
  free(): void;
  /** I_aS/I_S at temperatureK (0 where it is below the f64 range). */
  ratio(temperatureK: number): number;
  ratios(temperaturesK: NumberArray, out?: Float64Array): Float64Array;
  temperature(ratio: number): RamanReading;
  /** Temperatures (K) only. */
  temperatures(ratios: NumberArray, out?: Float64Array): Float64Array;
}

/**
 * Noise temperature of a matched load at physical temperature T and frequency f:
 * "rayleighJeans" T_L = T; "planck" T_L = (hf/k)/(e^{hf/kT} − 1); "callenWelton"
 * T_L = (hf/2k)·coth(hf/2kT) (with the zero-point half quantum).
 */
export type LoadNoiseModel = "callenWelton" | "planck" | "rayleighJeans";

/** The argument of `new YFactorLoads`. */
export interface YFactorLoadsSettings {
  /** Physical temperature of the hot load, K (> coldLoadK). */
  hotLoadK: number;
  /** Physical temperature of the cold load, K (> 0). */
  coldLoadK: number;
  /** Unit of the frequencies the methods take ("GHz"…; any spectral unit, converted to a frequency). */
  unit: SpectralUnit;
  /** The convention of the receiver temperature. Default "callenWelton". */
  loadModel?: LoadNoiseModel;
}

/** A receiver noise temperature from a Y-factor measurement, in all three conventions. */
export interface YFactorReading {
  /** The convention of receiverNoiseTemperatureK. */
  readonly model: LoadNoiseModel;
  /** T_R = (T_L,hot − Y·T_L,cold)/(Y − 1) in that convention, K (> 0). */
  readonly receiverNoiseTemperatureK: number;
  /** dT_R/dY, K per unit Y. */
  readonly dTdY: number;
  readonly hotLoadNoiseTemperatureK: number;
  readonly coldLoadNoiseTemperatureK: number;
  /** T_R with Rayleigh–Jeans loads, K (may be ≤ 0 when Y does not fit that convention). */
  readonly rayleighJeansK: number;
  /** T_R with Planck loads, K (may be ≤ 0). */
  readonly planckK: number;
  /** T_R with Callen–Welton loads, K (may be ≤ 0). */
  readonly callenWeltonK: number;
  /** planckK − rayleighJeansK, K, without cancellation. */
  readonly planckMinusRayleighJeansK: number;
  /** callenWeltonK − rayleighJeansK, K, without cancellation (planckK − callenWeltonK = hf/2k). */
  readonly callenWeltonMinusRayleighJeansK: number;
}

/**
 * The hot and cold loads of a Y-factor measurement, prepared once; frequencies in the
 * settings' `unit`, Y a linear power ratio (see decibelsToPowerRatio).
 *
 * @throws {QuantabandError} from the constructor: NON_POSITIVE_TEMPERATURE, OUT_OF_RANGE
 * (hotLoadK not above coldLoadK), UNKNOWN_UNIT, UNSUPPORTED, WRONG_TYPE; from the methods:
 * OUT_OF_RANGE (Y ≤ 1, or Y ≥ T_L,hot/T_L,cold), NON_POSITIVE_SPECTRAL.
 */
export class YFactorLoads {
  constructor(loads: YFactorLoadsSettings);
  free(): void;
  receiverTemperature(y: number, frequency: number): YFactorReading;
  /** Y = (T_L,hot + T_R)/(T_L,cold + T_R) of a receiver of noise temperature T_R (K, ≥ 0). */
  yFactor(receiverNoiseTemperatureK: number, frequency: number): number;
}

/** A power ratio (linear) from dB: 10^(decibels/10). */
export function decibelsToPowerRatio(decibels: number): number;
/** The value in dB of a power ratio (> 0): 10·log10(ratio). */
export function powerRatioToDecibels(ratio: number): number;

/**
 * A semiconductor (the argument of `new Semiconductor`): density-of-states effective masses
 * and a Varshni band gap E_g(T) = E_g(0) − αT²/(T + β), energies in `energyUnit`.
 */
export interface SemiconductorMaterial {
  /** m_de/m_e (> 0; for silicon ≈ 1.08 including its six valleys). */
  electronMassRatio: number;
  /** m_dh/m_e (> 0). */
  holeMassRatio: number;
  /** E_g(0), in energyUnit (> 0). */
  bandGap0K: number;
  /** Varshni α, energyUnit per K (≥ 0). Default 0 (a constant gap). */
  varshniAlpha?: number;
  /** Varshni β, K (> 0); required with varshniAlpha. */
  varshniBetaK?: number;
  energyUnit: EnergyUnit;
}

/** The carrier density of one band, Fermi–Dirac and in the Boltzmann approximation. */
export interface CarrierDensity {
  /** N·F_1/2(η), m⁻³. */
  readonly densityPerM3: number;
  /** N·e^η, m⁻³. */
  readonly boltzmannDensityPerM3: number;
  /** Boltzmann's relative error e^η/F_1/2(η) − 1 (≥ 0). */
  readonly boltzmannRelativeError: number;
  /** η used: (E_F − E_c)/kT for electrons, (E_v − E_F)/kT for holes. */
  readonly reducedFermiLevel: number;
}

/** Intrinsic carriers: exact (Fermi–Dirac, n = p solved) and Boltzmann; energies in energyUnit from E_v. */
export interface IntrinsicCarriers {
  /** n_i, m⁻³. */
  readonly densityPerM3: number;
  /** √(N_c·N_v)·exp(−E_g/2kT), m⁻³. */
  readonly boltzmannDensityPerM3: number;
  /** Intrinsic Fermi level, in energyUnit above E_v. */
  readonly fermiLevel: number;
  /** E_g/2 + (kT/2)·ln(N_v/N_c), in energyUnit above E_v. */
  readonly boltzmannFermiLevel: number;
  /** E_g(T), in energyUnit. */
  readonly bandGap: number;
}

/**
 * A semiconductor prepared once. Energies (band gap, Fermi levels) are in the material's
 * `energyUnit`, measured from the valence-band maximum E_v = 0 (E_c = E_g(T)); densities in
 * m⁻³ (1 cm⁻³ = 1e6 m⁻³); temperatures in K.
 *
 * @throws {QuantabandError} from the constructor: NON_POSITIVE (a mass, bandGap0K,
 * varshniBetaK), OUT_OF_RANGE (varshniAlpha < 0), UNSUPPORTED (not an energy unit), WRONG_TYPE;
 * from the methods: NON_POSITIVE_TEMPERATURE, NON_POSITIVE (a density), NO_SOLUTION (the
 * Varshni gap is ≤ 0 at that temperature), NON_FINITE.
 */
export class Semiconductor {
  constructor(material: SemiconductorMaterial);
  free(): void;
  /** E_g(T), in energyUnit. */
  bandGap(temperatureK: number): number;
  /** N_c(T) = 2(2π m_de k T/h²)^{3/2}, m⁻³. */
  conductionBandDensityOfStates(temperatureK: number): number;
  /** N_v(T), m⁻³. */
  valenceBandDensityOfStates(temperatureK: number): number;
  /** n = N_c·F_1/2((E_F − E_c)/kT) at Fermi level `fermiLevel` (energyUnit, from E_v). */
  electronDensity(fermiLevel: number, temperatureK: number): CarrierDensity;
  /** p = N_v·F_1/2((E_v − E_F)/kT). */
  holeDensity(fermiLevel: number, temperatureK: number): CarrierDensity;
  /** E_F (energyUnit, from E_v) giving electron density n (m⁻³), Fermi–Dirac. */
  fermiLevelFromElectronDensity(electronDensityPerM3: number, temperatureK: number): number;
  /** E_F (energyUnit, from E_v) giving hole density p (m⁻³). */
  fermiLevelFromHoleDensity(holeDensityPerM3: number, temperatureK: number): number;
  intrinsic(temperatureK: number): IntrinsicCarriers;
  /** n_i (m⁻³, Fermi–Dirac) at each temperature. */
  intrinsicDensities(temperaturesK: NumberArray, out?: Float64Array): Float64Array;
}

/** Carrier density of a parabolic band with effective density of states N (m⁻³) at reduced Fermi level η. */
export function bandCarrierDensity(effectiveDensityPerM3: number, reducedFermiLevel: number): CarrierDensity;
