// ---- instruments (src/wasm/js/instrument.js) -------------------------------------------------

/** An instrument that sees one wavelength: signal = spectral radiance L_λ, W·m⁻²·sr⁻¹·m⁻¹. */
export interface SpectralPointModel {
  kind: "spectralPoint";
  /** Wavelength, in `unit`. */
  wavelength: number;
  unit: WavelengthUnit;
  /** Default "codata2018". */
  c2?: C2Convention;
}

/**
 * An instrument with a relative spectral response R(λ) (linear between the points, zero
 * outside): signal = ∫ R(λ)·L_λ(λ, T) dλ, W·m⁻²·sr⁻¹ times the unit of R.
 */
export interface ResponseModel {
  kind: "response";
  /** Strictly increasing wavelengths, in `unit` (at least 2). */
  wavelengths: NumberArray;
  /** Response values ≥ 0 (not all zero), one per wavelength. */
  values: NumberArray;
  unit: WavelengthUnit;
  /** Default "codata2018". */
  c2?: C2Convention;
}

/** A Sakuma–Hattori curve S(T) = C / (exp(c2 / (A·T + B)) − 1), in the signal unit of C. */
export interface SakumaHattoriModel {
  kind: "sakumaHattori";
  /** A, m (> 0). */
  aM: number;
  /** B, m·K. */
  bMK: number;
  /** C, signal units (> 0). */
  c: number;
  /** Default "codata2018". */
  c2?: C2Convention;
}

/** An instrument's blackbody signal S(T), strictly increasing in T. */
export type InstrumentModel = SpectralPointModel | ResponseModel | SakumaHattoriModel;

/** A window between scene and instrument (grey in the instrument's band). */
export interface WindowConditions {
  /** τ_w in (0, 1]. */
  transmittance: number;
  /** ρ_w (instrument side) in [0, 1), τ_w + ρ_w ≤ 1. Default 0. */
  reflectance?: number;
  /** Window temperature, K. */
  temperatureK: number;
  /** Temperature of what the window reflects into the instrument, K. Required when reflectance > 0. */
  reflectedTemperatureK?: number;
}

/**
 * Measurement conditions: signal = τ_w·{τ·[ε·S(T_obj) + (1 − ε)·S(T_refl)] + (1 − τ)·S(T_path)}
 * + ρ_w·S(T_w,refl) + (1 − τ_w − ρ_w)·S(T_w). Omitted: a blackbody seen through vacuum.
 */
export interface MeasurementConditions {
  /** Object emissivity ε in (0, 1]. Default 1. */
  emissivity?: number;
  /** Reflected (surroundings) temperature, K. Required when emissivity < 1. */
  reflectedTemperatureK?: number;
  /** Path transmittance τ in (0, 1]. Default 1. */
  pathTransmittance?: number;
  /** Path temperature, K. Required when pathTransmittance < 1. */
  pathTemperatureK?: number;
  window?: WindowConditions;
}

/** The argument of `new Instrument`: a model and its measurement conditions. */
export interface InstrumentDefinition {
  model: InstrumentModel;
  conditions?: MeasurementConditions;
}

/** Measurement conditions in use (SI), every default filled in. */
export interface ResolvedConditions {
  readonly emissivity: number;
  readonly reflectedTemperatureK: number;
  readonly pathTransmittance: number;
  readonly pathTemperatureK: number;
  readonly window:
    | {
        readonly transmittance: number;
        readonly reflectance: number;
        readonly temperatureK: number;
        readonly reflectedTemperatureK: number;
      }
    | undefined;
}

/** The measurement equation in affine form: signal = gain·S(T_obj) + background. */
export interface AffineForm {
  readonly gain: number;
  readonly background: number;
}

/** Response-weighted mean wavelength and spread (standard deviation), in the model's unit. */
export interface ResponseMoments {
  readonly mean: number;
  readonly spread: number;
}

/** A ratio (two-colour) reading with its sensitivities. */
export interface RatioReading {
  readonly temperatureK: number;
  /** ∂T/∂r, K per unit ratio. */
  readonly dTdRatio: number;
  /** ∂T/∂(ε1/ε2), K per unit emissivity ratio. */
  readonly dTdEmissivityRatio: number;
}

/** Sensitivity coefficients ∂T_obj/∂x of the object temperature at a reading. */
export interface Sensitivities {
  readonly temperatureK: number;
  /** K per signal unit. */
  readonly signal: number;
  /** K per unit emissivity. */
  readonly emissivity: number;
  /** K per K of reflected temperature. */
  readonly reflectedTemperature: number;
  /** K per unit path transmittance. */
  readonly pathTransmittance: number;
  /** K per K of path temperature. */
  readonly pathTemperature: number;
}

/**
 * An instrument prepared once: `new Instrument({ model, conditions })`. Signals are in the
 * model's signal unit, temperatures in K. Bulk methods take a {@link NumberArray} and return a
 * new Float64Array, or fill `out` and return it. `free()` releases it now; a forgotten object is
 * freed when garbage-collected.
 *
 * Cautions: these are calculations, not measurements; they do not replace calibrated
 * instruments and standard procedures and must not be used for medical or fever screening or
 * process-safety decisions; defer to local codes and standards.
 *
 * @throws {QuantabandError} from the constructor: UNSUPPORTED (unknown field, kind or value),
 * WRONG_TYPE, UNKNOWN_UNIT, and the model's and conditions' range errors.
 */
export class Instrument {
  constructor(definition: InstrumentDefinition);
  /** The definition as read (canonical unit names; tables as arrays). */
  readonly definition: InstrumentDefinition;
  free(): void;
  /** The same model under other conditions (a new Instrument to free). */
  withConditions(conditions?: MeasurementConditions): Instrument;
  conditions(): ResolvedConditions;
  /** Blackbody signal S(T) of the model. */
  signal(temperatureK: number): number;
  /** dS/dT. */
  signalDerivative(temperatureK: number): number;
  /** Blackbody temperature giving the model signal `signal` (the inverse of signal()). */
  temperature(signal: number): number;
  /** The signal read from an object at objectTemperatureK under the conditions. */
  measuredSignal(objectTemperatureK: number): number;
  /** The object temperature explaining a reading under the conditions. */
  objectTemperature(signal: number): number;
  signals(temperaturesK: NumberArray, out?: Float64Array): Float64Array;
  signalDerivatives(temperaturesK: NumberArray, out?: Float64Array): Float64Array;
  temperatures(signals: NumberArray, out?: Float64Array): Float64Array;
  measuredSignals(objectTemperaturesK: NumberArray, out?: Float64Array): Float64Array;
  objectTemperatures(signals: NumberArray, out?: Float64Array): Float64Array;
  sensitivities(signal: number): Sensitivities;
  /**
   * The GUM budget (JCGM 100) of the object temperature at a reading: the analytic sensitivity
   * of every input of the measurement equation (window included when the conditions have one),
   * the inputs' uncertainties with Type A/B, degrees of freedom and distributions, optional
   * correlations, ν_eff (Welch–Satterthwaite), k for the coverage probability (default 0.95) or
   * a stated k, U = k·u_c, and the method statement. Check it by Monte Carlo with
   * `MonteCarlo.measurement` (same arguments) where the equation is strongly non-linear.
   */
  uncertaintyBudget(signal: number, uncertainties: MeasurementUncertainties, options?: BudgetOptions): UncertaintyBudget;
  measurementAffine(): AffineForm;
  /** Response models only (else UNSUPPORTED): moments of R(λ), in the model's unit. */
  responseMoments(): ResponseMoments;
  /** Mean wavelength and spread of R(λ)·L_λ(λ, T). */
  signalMoments(temperatureK: number): ResponseMoments;
  /** λ_T = c2/(T²·d ln S/dT), in the model's unit. */
  limitingEffectiveWavelength(temperatureK: number): number;
  /** λ_e = c2·(1/T1 − 1/T2)/ln(S(T2)/S(T1)), in the model's unit. */
  effectiveWavelength(t1K: number, t2K: number): number;
  /** R(λ) at one wavelength (in the model's unit): linear, 0 outside the table. */
  responseAt(wavelength: number): number;
  /** Two-colour temperature with this instrument as channel 1 (the shorter wavelengths). */
  ratioTemperature(channel2: Instrument, ratio: number, emissivityRatio?: number, guessK?: number): RatioReading;
}
