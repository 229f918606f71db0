// ---- spectral (non-grey) instruments (src/wasm/js/spectral.js) -------------------------------

/**
 * A tabulated spectral quantity: wavelengths (strictly increasing, in `unit`) and one value
 * per wavelength, straight lines between the points. ε, ρ and τ values lie in [0, 1].
 * Read two-column text with `SpectralInstrument.tableFromText`.
 */
export interface SpectralTable {
  /** At least 2, strictly increasing, > 0, in `unit`. */
  wavelengths: NumberArray;
  /** One value per wavelength. */
  values: NumberArray;
  /** A wavelength unit (tables in other spectral units: `SpectralInstrument.tableFromText`). */
  unit: WavelengthUnit;
  /**
   * Outside the wavelength grid: "reject" (default: a table that does not cover the
   * instrument's band is OUTSIDE_TABLE) or "constant" (the first value below the grid, the
   * last above it).
   */
  ends?: "reject" | "constant";
}

/** An optical input: a number (the same at every wavelength, in [0, 1]) or a table. */
export type SpectralInput = number | SpectralTable;

/**
 * The instrument's spectral response R(λ), zero outside its table. With quantity "energy" the
 * signal is ∫ R·L_λ dλ (W·m⁻²·sr⁻¹ times the unit of R: A/W, V/W or relative); with "photon"
 * (quantum efficiency, electrons per photon) it is ∫ η·L_λ·λ/(hc) dλ
 * (photons·s⁻¹·m⁻²·sr⁻¹ times the unit of η).
 */
export interface SpectralResponse {
  wavelengths: NumberArray;
  /** ≥ 0, not all zero. */
  values: NumberArray;
  unit: WavelengthUnit;
  /** Default "energy". */
  quantity?: Quantity;
}

/** A window between scene and instrument; τ_w + ρ_w ≤ 1 at every wavelength. */
export interface SpectralWindow {
  /** τ_w(λ). */
  transmittance: SpectralInput;
  /** ρ_w(λ) towards the instrument. Default 0. */
  reflectance?: SpectralInput;
  /** Window temperature, K (it emits 1 − τ_w − ρ_w). */
  temperatureK: number;
  /** Temperature of what the window reflects into the instrument, K. Required unless reflectance is 0. */
  reflectedTemperatureK?: number;
}

/**
 * Conditions of a spectral measurement:
 * signal = ∫ R·{τ_w·[τ_p·(ε·L(T) + ρ·L(T_refl)) + (1 − τ_p)·L(T_path)] + ρ_w·L(T_int) + (1 − τ_w − ρ_w)·L(T_w)} dλ.
 * Omitted: a blackbody seen through vacuum.
 */
export interface SpectralConditions {
  /** Target emissivity ε(λ). Default 1. */
  emissivity?: SpectralInput;
  /**
   * Target reflectance ρ(λ) of a semi-transparent target (ε + ρ ≤ 1 everywhere). Omitted: an
   * opaque target, ρ = 1 − ε.
   */
  reflectance?: SpectralInput;
  /** Temperature of the reflected surroundings, K. Required unless the target reflects nothing. */
  reflectedTemperatureK?: number;
  /** Path transmittance τ_p(λ) (the path emits 1 − τ_p). Default 1. */
  pathTransmittance?: SpectralInput;
  /** Path temperature, K. Required unless pathTransmittance is 1. */
  pathTemperatureK?: number;
  window?: SpectralWindow;
}

/** The argument of `new SpectralInstrument`. */
export interface SpectralInstrumentDefinition {
  response: SpectralResponse;
  conditions?: SpectralConditions;
  /** Default "codata2018". */
  c2?: C2Convention;
}

/** What a text table holds (it fixes the allowed values: [0, 1], or ≥ 0 for a response). */
export type TextTableKind = "emissivity" | "reflectance" | "transmittance" | "response";

/** A table read from text: wavelengths in metres, increasing. */
export interface TextTable {
  readonly wavelengths: Float64Array;
  readonly values: Float64Array;
  readonly unit: "m";
}

/** The five terms of the spectral measurement equation, in the instrument's signal unit. */
export interface SignalTerms {
  /** The sum of the five terms. */
  readonly signal: number;
  /** ∫ R·τ_w·τ_p·ε·L(T) dλ. */
  readonly object: number;
  /** ∫ R·τ_w·τ_p·ρ·L(T_refl) dλ. */
  readonly reflected: number;
  /** ∫ R·τ_w·(1 − τ_p)·L(T_path) dλ. */
  readonly path: number;
  /** ∫ R·ρ_w·L(T_int) dλ. */
  readonly windowReflected: number;
  /** ∫ R·(1 − τ_w − ρ_w)·L(T_w) dλ. */
  readonly windowEmitted: number;
}

/** Band-effective values q_eff(T) = ∫ R·q·L(T) dλ / ∫ R·L(T) dλ (dimensionless). */
export interface BandEffective {
  /** Temperature of the weighting, K. */
  readonly temperatureK: number;
  /** ε_eff(T). */
  readonly emissivity: number;
  /** ρ_eff(T) of the target (1 − ε_eff for an opaque target). */
  readonly reflectance: number;
  /** τ_p,eff(T). */
  readonly pathTransmittance: number;
  /** τ_w,eff(T) (1 without a window). */
  readonly windowTransmittance: number;
  /** ρ_w,eff(T) (0 without a window). */
  readonly windowReflectance: number;
  /** (τ_w·τ_p·ε)_eff(T): the object term over the blackbody signal. */
  readonly objectGain: number;
}

/**
 * Sensitivity coefficients of the object temperature at a reading. A `…Scale` coefficient is
 * ∂T/∂k for the whole table multiplied by k (at k = 1), K: a relative standard uncertainty of
 * the table enters a budget as u(k).
 */
export interface SpectralSensitivities {
  /** The object temperature of the reading, K. */
  readonly temperatureK: number;
  /** ∂T/∂signal, K per signal unit. */
  readonly signal: number;
  /** ε(λ) → k·ε(λ) (an opaque target's reflectance follows), K. */
  readonly emissivityScale: number;
  /** ρ(λ) → k·ρ(λ), K (0 for an opaque target). */
  readonly reflectanceScale: number;
  readonly pathTransmittanceScale: number;
  /** K (0 without a window). */
  readonly windowTransmittanceScale: number;
  /** K (0 without a window). */
  readonly windowReflectanceScale: number;
  /** R(λ) → k·R(λ): a calibration scale error, K. */
  readonly responseScale: number;
  /** ∂T/∂T_refl, K/K. */
  readonly reflectedTemperature: number;
  /** ∂T/∂T_path, K/K. */
  readonly pathTemperature: number;
  /** ∂T/∂T_w, K/K (0 without a window). */
  readonly windowTemperature: number;
  /** ∂T/∂T_int, K/K (0 without a window). */
  readonly windowReflectedTemperature: number;
}

/**
 * An instrument with a tabulated spectral response and spectral (non-grey) measurement
 * conditions, prepared once: every table is read, converted to SI and checked in the
 * constructor (also that each table covers the band where the response is not zero, unless
 * it has constant ends). Integration is exact for the straight lines between table points
 * (Gauss–Legendre on the union of the grids; ≤ 2e-15 relative against mpmath quadrature).
 * Grey inputs give the numbers of `Instrument` to rounding. `free()` releases it now; a
 * forgotten object is freed when garbage-collected.
 *
 * Cautions: these are calculations, not measurements; a table from a handbook describes a
 * sample, not necessarily your target. They do not replace calibrated instruments and standard
 * procedures and must not be used for medical or fever screening or process-safety decisions.
 *
 * @throws {QuantabandError} from the constructor: WRONG_TYPE, UNSUPPORTED (unknown field or
 * value, a required temperature left out, a non-wavelength unit), UNKNOWN_UNIT,
 * LENGTH_MISMATCH, TOO_FEW_POINTS, NOT_INCREASING, INVALID_TABLE_ENTRY (NaN, a wavelength
 * ≤ 0, ε/ρ/τ outside [0, 1], a negative response, τ_w + ρ_w > 1 or ε + ρ > 1 — with the table
 * and the index), NON_POSITIVE (an all-zero response), OUTSIDE_TABLE, OUT_OF_RANGE (a
 * constant outside [0, 1]), NON_FINITE, NON_POSITIVE_TEMPERATURE.
 */
export class SpectralInstrument {
  constructor(definition: SpectralInstrumentDefinition);
  /**
   * Reads a two-column text table (wavelength and value per line, separated by a comma,
   * semicolon, tab or blanks; blank, comment (#, %, !, //, ;) and leading header lines are
   * skipped; `#` ends a data line). `unit` is the unit of the first column, any spectral unit:
   * wavenumber, frequency and photon-energy coordinates are converted to wavelength, and the
   * lines may run in either order. The result is in metres, ready for a definition (spread it
   * to add `ends`).
   *
   * @throws {QuantabandError} INVALID_LINE (with the line number: not two numbers, a value
   * outside [0, 1] — or below 0 for a response —, a coordinate ≤ 0 or out of order),
   * TOO_FEW_POINTS, NON_POSITIVE (an all-zero response), UNKNOWN_UNIT, UNSUPPORTED (kind),
   * TOO_LARGE (more than MAX_ARRAY_LENGTH characters).
   */
  static tableFromText(text: string, unit: SpectralUnit, kind: TextTableKind): TextTable;
  free(): void;
  /** Blackbody signal ∫ R·L(T) dλ (no conditions). */
  signal(temperatureK: number): number;
  /** The signal read from an object at objectTemperatureK under the conditions. */
  measuredSignal(objectTemperatureK: number): number;
  /**
   * The object temperature explaining a signal (NO_PHYSICAL_SOLUTION when the signal does not
   * exceed the other four terms).
   */
  objectTemperature(signal: number): number;
  measuredSignals(objectTemperaturesK: NumberArray, out?: Float64Array): Float64Array;
  objectTemperatures(signals: NumberArray, out?: Float64Array): Float64Array;
  /** The five terms of the measurement equation at one object temperature. */
  signalTerms(objectTemperatureK: number): SignalTerms;
  /** ε_eff, τ_eff… weighted with the response and Planck's law at temperatureK. */
  bandEffective(temperatureK: number): BandEffective;
  /** ∂T/∂(signal, each table's scale, the temperatures of the other terms) at a reading. */
  sensitivities(signal: number): SpectralSensitivities;
  /**
   * The GUM budget of the object temperature at a reading (JCGM 100:2008 eq. 10, or eq. 16 with
   * correlations; ν_eff by eq. G.2b): the coefficients of `sensitivities(signal)` with the
   * inputs' standard uncertainties, through the same law of propagation as
   * `propagateUncertainty` and `Instrument.uncertaintyBudget`. A `…Scale` input is a factor k
   * multiplying a whole table at k = 1, so its standard uncertainty is the table's relative
   * standard uncertainty (0.01 for 1 %). Rows: every input, except the window's four without a
   * window and `reflectanceScale` for an opaque target.
   *
   * @throws {QuantabandError} those of `sensitivities`; WRONG_TYPE / UNSUPPORTED (unknown key,
   * an uncertainty on the window without a window, on `reflectanceScale` for an opaque target,
   * a correlation naming an input that is not a row); INVALID_CORRELATION; NON_FINITE /
   * OUT_OF_RANGE for an uncertainty, ν, p or k outside its range.
   */
  uncertaintyBudget(
    signal: number,
    uncertainties: SpectralMeasurementUncertainties,
    options?: SpectralBudgetOptions,
  ): SpectralUncertaintyBudget;
}

/** The inputs of a spectral measurement's budget (rows; the sensitivity keys). */
export type SpectralBudgetInput = Exclude<keyof SpectralSensitivities, "temperatureK">;

/**
 * The standard uncertainties of a spectral measurement's inputs (absent: 0). Scales are
 * relative (dimensionless), temperatures in K, the signal in its unit.
 */
export interface SpectralMeasurementUncertainties {
  signal?: UncertaintyInput;
  emissivityScale?: UncertaintyInput;
  reflectanceScale?: UncertaintyInput;
  pathTransmittanceScale?: UncertaintyInput;
  windowTransmittanceScale?: UncertaintyInput;
  windowReflectanceScale?: UncertaintyInput;
  responseScale?: UncertaintyInput;
  reflectedTemperatureK?: UncertaintyInput;
  pathTemperatureK?: UncertaintyInput;
  windowTemperatureK?: UncertaintyInput;
  windowReflectedTemperatureK?: UncertaintyInput;
}

/** The correlation coefficient r ∈ [−1, 1] of two inputs of a spectral budget. */
export interface SpectralInputCorrelation {
  inputs: readonly [keyof SpectralMeasurementUncertainties, keyof SpectralMeasurementUncertainties];
  coefficient: number;
}

/** Options of `SpectralInstrument.uncertaintyBudget`. */
export type SpectralBudgetOptions = CoverageOptions & {
  correlations?: readonly SpectralInputCorrelation[];
};

/** One row of a spectral measurement's budget. */
export interface SpectralBudgetEntry extends BudgetRow {
  readonly input: SpectralBudgetInput;
  /** u_i(T) = |c|·u(x), K (JCGM 100 eq. 11a). */
  readonly contributionK: number;
}

/** The GUM budget of the object temperature of a spectral measurement. */
export interface SpectralUncertaintyBudget extends GumCoverage {
  /** The object temperature the reading gives, K. */
  readonly temperatureK: number;
  readonly entries: readonly SpectralBudgetEntry[];
  /** Combined standard uncertainty u_c(T), K. */
  readonly combinedStandardUncertaintyK: number;
  /** U = k·u_c, K. */
  readonly expandedUncertaintyK: number;
}

/** A SpectralInstrument is accepted by the workflows from an indicated temperature too. */
export interface ReadingInstruments {
  SpectralInstrument: SpectralInstrument;
}
