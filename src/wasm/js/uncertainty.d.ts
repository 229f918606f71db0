// ---- uncertainty evaluation (src/wasm/js/uncertainty.js) -------------------------------------
// JCGM 100:2008 (GUM) and JCGM 101:2008 (Monte Carlo). The GUM budget of an instrument's
// measurement equation is `Instrument.uncertaintyBudget`; the calibration transfer and the
// fixed-point curves are members of `CalibrationCurve`.
//
// Degrees of freedom ν = ∞ are the number `Infinity` in results; in inputs ∞ is `Infinity`,
// `null` or an omitted field (JSON has no ∞: a budget written with JSON.stringify, where
// Infinity becomes null, reads back the same). A result field that is not defined (e.g. ν_eff of
// correlated inputs with finite ν) is `undefined`.

/** How a standard uncertainty was evaluated (JCGM 100 §4.2 Type A, §4.3 Type B). */
export type Evaluation = "typeA" | "typeB";

/**
 * The distribution of an input quantity (used by the Monte Carlo method; the GUM uses only
 * the standard uncertainty u): normal N(x, u²); rectangular of half-width a = √3·u;
 * symmetric triangular a = √6·u; arcsine (U-shaped) a = √2·u; studentT: x + u·t_ν, the
 * scaled and shifted t of a Type A mean (JCGM 101 §6.4.9; its standard deviation is
 * u·√(ν/(ν − 2))).
 */
export type Distribution = "normal" | "rectangular" | "triangular" | "arcsine" | "studentT";

/**
 * What is known about one input quantity apart from its estimate, in the input's unit.
 * Defaults: `degreesOfFreedom` ∞; `distribution` "studentT" for a Type A input with finite
 * ν, else "normal"; `evaluation` "typeA" for a studentT distribution, else "typeB".
 */
export interface InputUncertainty {
  /** Standard uncertainty u ≥ 0 (for a rectangular distribution of half-width a: a/√3). */
  standardUncertainty: number;
  /** ν > 0; `Infinity`, `null` or omitted: ∞ (exactly known). Type A from n readings: n − 1. */
  degreesOfFreedom?: number | null;
  evaluation?: Evaluation;
  distribution?: Distribution;
}

/** An input's uncertainty: a number (a standard uncertainty: Type B, normal, ν = ∞) or the object form. */
export type UncertaintyInput = number | InputUncertainty;

/**
 * The standard uncertainties of the nine inputs of the measurement equation (each omitted =
 * 0): signal (signal units), emissivity, reflected temperature (K), path transmittance and
 * temperature (K), and, with a window in the conditions, its transmittance, reflectance,
 * temperature (K) and the temperature of what it reflects into the instrument (K).
 */
export interface MeasurementUncertainties {
  signal?: UncertaintyInput;
  emissivity?: UncertaintyInput;
  reflectedTemperatureK?: UncertaintyInput;
  pathTransmittance?: UncertaintyInput;
  pathTemperatureK?: UncertaintyInput;
  windowTransmittance?: UncertaintyInput;
  windowReflectance?: UncertaintyInput;
  windowTemperatureK?: UncertaintyInput;
  windowReflectedTemperatureK?: UncertaintyInput;
}

/** A key of {@link MeasurementUncertainties}. */
export type MeasurementInputKey = keyof MeasurementUncertainties;

/**
 * The correlation coefficient r ∈ [−1, 1] of two inputs (JCGM 100 eq. 14), e.g. reflected and
 * path temperatures read by the same sensor. Pairs not listed are uncorrelated; the matrix
 * they make must be positive semi-definite (INVALID_CORRELATION otherwise).
 */
export interface InputCorrelation {
  inputs: readonly [MeasurementInputKey, MeasurementInputKey];
  coefficient: number;
}

/**
 * The coverage asked for: a coverage probability p ∈ (0, 1) (default 0.95; k then follows
 * from Student's t at the Welch–Satterthwaite ν_eff, truncated), or a stated coverage factor
 * k > 0 (the result reports the probability it gives).
 */
export type CoverageOptions =
  | { coverageProbability?: number; coverageFactor?: never }
  | { coverageFactor: number; coverageProbability?: never };

/** Options of `Instrument.uncertaintyBudget`. */
export type BudgetOptions = CoverageOptions & {
  correlations?: readonly InputCorrelation[];
};

/**
 * A correlation matrix r_ij, symmetric, unit diagonal, entries in [−1, 1], positive
 * semi-definite: N rows of N numbers, or the N² numbers row-major.
 */
export type CorrelationMatrix = NumberArray | readonly NumberArray[];

/** Options of `propagateUncertainty`. */
export type PropagationOptions = CoverageOptions & {
  correlation?: CorrelationMatrix;
};

/** An input of the measurement budget (a row). */
export type BudgetInput =
  | "signal"
  | "emissivity"
  | "reflectedTemperature"
  | "pathTransmittance"
  | "pathTemperature"
  | "windowTransmittance"
  | "windowReflectance"
  | "windowTemperature"
  | "windowReflectedTemperature";

/** The input-side fields of a budget row. */
export interface BudgetRow {
  /** c = ∂y/∂x (output unit per input unit). */
  readonly sensitivity: number;
  /** u(x), in the input's unit. */
  readonly standardUncertainty: number;
  /** ν (Infinity for ∞). */
  readonly degreesOfFreedom: number;
  readonly evaluation: Evaluation;
  readonly distribution: Distribution;
  /** Share of u_c²: c_i u_i Σ_j r_ij c_j u_j / u_c² (the shares sum to 1; negative with some correlations). */
  readonly varianceShare: number;
}

/** One row of an instrument's budget. */
export interface BudgetEntry extends BudgetRow {
  readonly input: BudgetInput;
  /** u_i(T) = |c|·u(x), K (JCGM 100 eq. 11a). */
  readonly contributionK: number;
}

/** One row of a budget of any model (rows in the order of the inputs). */
export interface PropagationEntry extends BudgetRow {
  /** u_i(y) = |c|·u(x), in the output's unit (JCGM 100 eq. 11a). */
  readonly contribution: number;
}

/** The method behind a GUM result. */
export interface GumMethod {
  readonly propagation: "firstOrderUncorrelated" | "firstOrderCorrelated";
  /** Where k came from: Student's t at ν_eff, the normal distribution (ν_eff = ∞), or stated. */
  readonly coverage: "studentT" | "normal" | "statedFactor";
  /** ν at which k was taken (ν_eff truncated; Infinity); undefined for a stated k without ν_eff. */
  readonly degreesOfFreedomUsed: number | undefined;
  /** One sentence for a report (JCGM 100 equations used). */
  readonly statement: string;
}

/** The coverage fields of a GUM result. */
export interface GumCoverage {
  /** Welch–Satterthwaite ν_eff, untruncated (Infinity when every contributing ν is ∞); undefined for correlated inputs with finite ν. */
  readonly effectiveDegreesOfFreedom: number | undefined;
  /** Coverage factor k. */
  readonly coverageFactor: number;
  /** p asked for, or the p a stated k gives at ν_eff (undefined when ν_eff is not defined). */
  readonly coverageProbability: number | undefined;
  readonly method: GumMethod;
}

/**
 * The GUM uncertainty budget of an object temperature (JCGM 100): rows for signal, ε, T_refl,
 * τ, T_path, plus τ_w, ρ_w, T_w, T_w,refl when the conditions have a window.
 */
export interface UncertaintyBudget extends GumCoverage {
  /** The object temperature the reading gives, K. */
  readonly temperatureK: number;
  readonly entries: readonly BudgetEntry[];
  /** Combined standard uncertainty u_c(T), K. */
  readonly combinedStandardUncertaintyK: number;
  /** U = k·u_c, K. */
  readonly expandedUncertaintyK: number;
}

/** The GUM result of any model (uncertainties in the output's unit). */
export interface PropagationResult extends GumCoverage {
  readonly entries: readonly PropagationEntry[];
  readonly combinedStandardUncertainty: number;
  readonly expandedUncertainty: number;
}

/** A Type A evaluation of repeated observations (JCGM 100 §4.2, in their unit). */
export interface TypeAEvaluation {
  /** Arithmetic mean q̄. */
  readonly mean: number;
  /** Experimental standard deviation s (divisor n − 1). */
  readonly standardDeviation: number;
  /** s/√n: the standard uncertainty of the mean. */
  readonly standardUncertainty: number;
  /** ν = n − 1. */
  readonly degreesOfFreedom: number;
}

/** Sensitivity coefficients of a radiance-ratio temperature (ITS-90 relation). */
export interface RatioSensitivities {
  /** T, K. */
  readonly temperatureK: number;
  /** ∂T/∂r, K per unit ratio. */
  readonly dTdRatio: number;
  /** ∂T/∂T_X, K/K. */
  readonly dTdReferenceTemperature: number;
  /** ∂T/∂λ at fixed ratio, K per wavelength unit of the call. */
  readonly dTdWavelength: number;
}

/** Student's t distribution function P(T ≤ t), ν > 0 (any real; Infinity: the normal one). */
export function studentTCdf(t: number, degreesOfFreedom: number): number;
/** The t with P(T ≤ t) = probability ∈ (0, 1). */
export function studentTQuantile(probability: number, degreesOfFreedom: number): number;
/** k = t_{(1+p)/2}(ν): the coverage factor of a symmetric interval with coverage probability p ∈ (0, 1). */
export function coverageFactor(coverageProbability: number, degreesOfFreedom: number): number;
/** Type A evaluation of at least 2 repeated observations. */
export function typeA(observations: NumberArray): TypeAEvaluation;
/** Correlation r(q̄, r̄) of the means of two series observed in pairs (JCGM 100 eq. 17), in [−1, 1]. */
export function typeACorrelation(x: NumberArray, y: NumberArray): number;
/**
 * The GUM law of propagation for any model y = f(x_1, …, x_N) (JCGM 100 eq. 10/16, G.2b, §6):
 * sensitivity coefficients c_i = ∂f/∂x_i, the inputs' uncertainties (same length, at most
 * 1000), an optional correlation matrix and the coverage. A coverage probability with
 * correlated finite-ν inputs is UNSUPPORTED (ν_eff is not defined): state coverageFactor.
 */
export function propagateUncertainty(
  sensitivities: NumberArray,
  inputs: readonly UncertaintyInput[],
  options?: PropagationOptions,
): PropagationResult;
/**
 * ∂T/∂r, ∂T/∂T_X, ∂T/∂λ of the ratio temperature T(r, λ, T_X) of temperatureFromRatio (same
 * arguments): the sensitivity coefficients of a budget above the silver point.
 */
export function ratioTemperatureSensitivities(
  ratio: number,
  wavelength: number,
  unit: WavelengthUnit,
  referenceTemperatureK: number,
  c2?: C2Convention,
): RatioSensitivities;

/** Settings of a Monte Carlo run. */
export interface MonteCarloSettings {
  /** Seed of the generator (xoshiro256** seeded by SplitMix64), an integer in [0, 2^53]; default 1. Same seed, same numbers. */
  seed?: number;
  /** A fixed number of valid trials (1 to 10⁷); omitted: adaptive (JCGM 101 §7.9). */
  trials?: number;
  /** Capacity of an adaptive run (default 10⁶ trials, 8 bytes each; at most 10⁷). Not with `trials`. */
  maxTrials?: number;
  /** Coverage probability p of the intervals, in (0, 1 − 10⁻⁷] (default 0.95); the GUM comparison uses the same p. */
  coverageProbability?: number;
  /** Significant digits n_dig of u(y) regarded as meaningful, 1 to 6 (default 2): set the numerical tolerance δ. */
  significantDigits?: number;
  /** The interval used for the stabilisation test and the GUM comparison (both are reported). Default "probabilisticallySymmetric". */
  interval?: "probabilisticallySymmetric" | "shortest";
}

/** Options of `MonteCarlo.measurement` (correlated inputs must be normal). */
export interface MeasurementMonteCarloOptions extends MonteCarloSettings {
  correlations?: readonly InputCorrelation[];
}

/** Options of `MonteCarlo.linear` (correlated inputs must be normal, at most 32 inputs). */
export interface LinearMonteCarloOptions extends MonteCarloSettings {
  correlation?: CorrelationMatrix;
  /** Input estimates x_i (default 0). */
  estimates?: NumberArray;
}

/** Where a run stands. */
export type MonteCarloStatus = "running" | "stabilized" | "completed" | "capacityReached";

/** Progress of a run (for a progress display). */
export interface MonteCarloProgress {
  /** Valid trials so far. */
  readonly trials: number;
  /** Trials whose model evaluation failed (inputs drawn outside the model's domain). */
  readonly invalidTrials: number;
  /** Complete batches (of max(⌈100/(1 − p)⌉, 10⁴) trials). */
  readonly batches: number;
  readonly status: MonteCarloStatus;
  /** δ of u(y) so far (after 2 batches). */
  readonly numericalTolerance: number | undefined;
  /** Largest 2s of the batch statistics so far; an adaptive run stabilises when ≤ δ. */
  readonly largestSpread: number | undefined;
  /** The fixed count, or the capacity of an adaptive run: `trials / trialLimit` for a progress bar. */
  readonly trialLimit: number;
  /** No more trials will run (status not "running", or result() was called). */
  readonly done: boolean;
}

/** Twice the standard deviations of the batch statistics (JCGM 101 §7.9.4), output unit. */
export interface BatchSpread {
  readonly estimate: number;
  readonly standardUncertainty: number;
  readonly lower: number;
  readonly upper: number;
}

/** The JCGM 101 §8 comparison of the GUM interval y ± U with the Monte Carlo one. */
export interface GumValidation {
  /** |y − U − y_low|. */
  readonly dLow: number;
  /** |y + U − y_high|. */
  readonly dHigh: number;
  /** δ: numerical tolerance of the GUM u_c at the run's significant digits. */
  readonly tolerance: number;
  readonly interval: "probabilisticallySymmetric" | "shortest";
  /** Both differences ≤ δ: the GUM uncertainty framework is validated for this case. */
  readonly passed: boolean;
}

/** A histogram of the output values over their central 99.9 %. */
export interface MonteCarloHistogram {
  /** Values per bin. */
  readonly counts: Float64Array;
  /** bins + 1 bin edges, increasing (output unit). */
  readonly edges: Float64Array;
  /** Values below the first edge. */
  readonly below: number;
  /** Values above the last edge. */
  readonly above: number;
}

/** The result of a Monte Carlo run (output unit: K for the measurement equation). */
export interface MonteCarloResult<G> {
  /** Valid trials M. */
  readonly trials: number;
  readonly invalidTrials: number;
  /** y: the mean of the output values. */
  readonly estimate: number;
  /** u(y): their standard deviation. */
  readonly standardUncertainty: number;
  readonly coverageProbability: number;
  /** Probabilistically symmetric coverage interval [low, high] (JCGM 101 §7.7.1). */
  readonly symmetricInterval: readonly [number, number];
  /** Shortest coverage interval (§7.7.2). */
  readonly shortestInterval: readonly [number, number];
  readonly interval: "probabilisticallySymmetric" | "shortest";
  readonly significantDigits: number;
  /** δ of u(y) (§7.9.2): the sampling error regarded as negligible. */
  readonly numericalTolerance: number;
  /** Undefined with fewer than two batches. */
  readonly batchSpread: BatchSpread | undefined;
  readonly batchSize: number;
  readonly batches: number;
  /** Every 2s ≤ δ. */
  readonly stabilized: boolean;
  /** "running" when result() ended the run early. */
  readonly status: MonteCarloStatus;
  /** The GUM result of the same inputs at the same p (undefined for correlated inputs with finite ν). */
  readonly gum: G | undefined;
  /** The §8 comparison with `gum` (undefined without it). */
  readonly validation: GumValidation | undefined;
  readonly histogram: MonteCarloHistogram;
}

/**
 * The Monte Carlo method (JCGM 101): a prepared run of the measurement equation of an
 * instrument, or of a linear model, executed in chunks so that a page or worker stays
 * responsive: `step(n)` runs n more trials and returns the progress; `result()` ends the run.
 * Reproducible from its seed; chunking does not change the numbers. `free()` releases its
 * output values (8 bytes per trial) now.
 *
 * Caution: the result is only as good as the input distributions and the model; the numerical
 * tolerance states the sampling error, not their adequacy.
 */
export class MonteCarlo<G = UncertaintyBudget | PropagationResult> {
  private constructor();
  /** The measurement equation of `instrument` at a reading `signal`, inputs as for `uncertaintyBudget`. */
  static measurement(
    instrument: Instrument,
    signal: number,
    uncertainties: MeasurementUncertainties,
    options?: MeasurementMonteCarloOptions,
  ): MonteCarlo<UncertaintyBudget>;
  /** The linear model Y = Σ c_i X_i (at most 32 inputs). */
  static linear(
    sensitivities: NumberArray,
    inputs: readonly UncertaintyInput[],
    options?: LinearMonteCarloOptions,
  ): MonteCarlo<PropagationResult>;
  free(): void;
  /** Runs up to `trials` more trials (default 10 000; 0 runs none). */
  step(trials?: number): MonteCarloProgress;
  progress(): MonteCarloProgress;
  /** Ends the run (later steps run nothing) and returns the result, histogram with `bins` bins (1 to 10 000; default Freedman–Diaconis). TOO_FEW_POINTS before 2 valid trials. */
  result(bins?: number): MonteCarloResult<G>;
}

/** Options of `CalibrationCurve.fit` through points. */
export interface PointFitOptions extends FitOptions {
  /** Standard uncertainty of each reference temperature, K: one number for all, or one per point. */
  uTemperaturesK?: number | NumberArray;
  /** Standard uncertainty of each reference signal (signal units): one number or one per point. */
  uSignals?: number | NumberArray;
}

/** Options of `CalibrationCurve.throughFixedPoints`. */
export interface FixedPointCurveOptions {
  /** c2 of the curve; default "its90" (the curve then realises T90). */
  c2?: C2Convention;
  /** Standard uncertainty of each fixed point's realisation, K (one number, or one per fixed point in the order given). */
  uTemperaturesK?: number | NumberArray;
  /** Standard uncertainty of each fixed-point signal (one number, or one per fixed point in the order given). */
  uSignals?: number | NumberArray;
  /** Interpolation errors from tMinK (default: the lowest fixed point), K. */
  tMinK?: number;
  /** … to tMaxK (default: the highest fixed point), K. */
  tMaxK?: number;
  /** Temperatures sampled per part of the range (2 to 10⁵, default 200). */
  nPoints?: number;
}

/** The fixed points of a curve from `throughFixedPoints` and its interpolation errors. */
export interface FixedPointReport {
  /** In increasing temperature. */
  readonly fixedPoints: readonly [FixedPoint, FixedPoint, FixedPoint];
  /** T90 of each, K (ITS-90 Table 1). */
  readonly temperaturesK: readonly [number, number, number];
  /** The instrument model's signal at each. */
  readonly signals: readonly [number, number, number];
  /** Largest |T_curve(S_model(T)) − T| between the fixed points, below the lowest and above the highest (extrapolation; undefined when the range does not reach there). */
  readonly interpolationErrors: {
    readonly between: InterpolationError;
    readonly below: InterpolationError | undefined;
    readonly above: InterpolationError | undefined;
  };
}

/** Covariance of the curve parameters (aM, bMK, c), from the reference points' uncertainties. */
export interface ParameterCovariance {
  /** 3×3, rows and columns in the order aM (m), bMK (m·K), c (signal units). */
  readonly covariance: readonly (readonly number[])[];
  /** The correlation matrix (0 where a variance is 0). */
  readonly correlation: readonly (readonly number[])[];
}

/** A temperature read with a fitted curve, with the uncertainty the calibration transfers to it. */
export interface CalibratedReading {
  /** T = T_curve(S) of the least-squares solution, K. */
  readonly temperatureK: number;
  /** From the reference temperatures and signals, K. */
  readonly uCalibrationK: number;
  /** From the reading's own signal uncertainty, K. */
  readonly uSignalK: number;
  /** √(uCalibrationK² + uSignalK²), K. */
  readonly combinedStandardUncertaintyK: number;
  /** ∂T/∂S of the reading, K per signal unit. */
  readonly dTdSignal: number;
  /** ∂T/∂T_i for each reference point (K/K; in the fit's point order, fixed points in increasing temperature). */
  readonly dTdReferenceTemperatures: Float64Array;
  /** ∂T/∂S_i for each reference point, K per signal unit. */
  readonly dTdReferenceSignals: Float64Array;
  /** Σ ∂T/∂T_i: 1 up to rounding (a shift of every reference temperature shifts the reading). */
  readonly dTdReferenceTemperaturesSum: number;
}
