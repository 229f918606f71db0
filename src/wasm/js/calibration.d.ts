// ---- calibration curves and frames (src/wasm/js/calibration.js) ------------------------------

/** The coefficients of a Sakuma–Hattori curve (the argument of `new CalibrationCurve`). */
export interface CurveCoefficients {
  /** A, m (> 0). */
  aM: number;
  /** B, m·K. */
  bMK: number;
  /** C, signal units (> 0). */
  c: number;
  /** Default "codata2018". */
  c2?: C2Convention;
}

/** Options of the fits. */
export interface FitOptions {
  /** Default "codata2018". */
  c2?: C2Convention;
}

/** The report of the fit that made a curve. */
export interface FitReport {
  /** RMS of T_curve(S_i) − T_i, K. */
  readonly rmsResidualK: number;
  /** Largest |T_curve(S_i) − T_i|, K. */
  readonly maxAbsResidualK: number;
  /** Levenberg–Marquardt iterations used. */
  readonly iterations: number;
  /** T_curve(S_i) − T_i per point, K (fits through points only). */
  readonly residualsK?: Float64Array;
}

/** Largest interpolation error of a curve against an exact model. */
export interface InterpolationError {
  /** max |T_curve(S_exact(T)) − T|, K. */
  readonly maxErrorK: number;
  /** Temperature where it occurs, K. */
  readonly atTemperatureK: number;
}

/** A frame of raw values: camera counts or signals, row-major, any shape. */
export type FrameInput = Uint16Array | Float32Array | Float64Array;

/** Per-frame options of `convertFrame`. */
export interface FrameOptionsBase {
  /** signal = gain·raw + offset (signal in the curve's unit). Default 1; must be > 0. */
  gain?: number;
  /** Default 0. */
  offset?: number;
  /** Default: a blackbody seen through vacuum. */
  conditions?: MeasurementConditions;
  /** Per-pixel emissivity (one per pixel), replacing conditions.emissivity; ε outside (0, 1] gives NaN. */
  emissivity?: NumberArray;
  /**
   * Per-pixel gain g_i of a non-uniformity correction (one per pixel, dimensionless), applied
   * to the raw value before `gain` and `offset`: signal_i = gain·(g_i·raw_i + o_i) + offset.
   * Default 1 everywhere. A non-finite g_i makes the pixel invalid.
   */
  pixelGain?: NumberArray;
  /** Per-pixel offset o_i of the non-uniformity correction, in raw units (one per pixel). Default 0. */
  pixelOffset?: NumberArray;
  /**
   * Bad-pixel mask, one entry per pixel: nonzero (or NaN) marks a pixel that becomes NaN and
   * is counted invalid. A Uint8Array is used as it is; other arrays are read as numbers.
   */
  badPixels?: NumberArray;
}

/** A converted frame: temperatures in K (NaN for invalid pixels) and counts. */
export interface FrameResult<T extends Float32Array | Float64Array> {
  /** Object temperature per pixel, K; the caller's `out` when given. */
  readonly temperaturesK: T;
  /** Pixels converted. */
  readonly valid: number;
  /** Pixels set to NaN (non-finite input, at or below the background, bad emissivity). */
  readonly invalid: number;
  /** Smallest valid temperature, K (NaN when none). */
  readonly minTemperatureK: number;
  /** Largest valid temperature, K (NaN when none). */
  readonly maxTemperatureK: number;
  /** Background signal (reflected, path and window terms) for the scalar emissivity. */
  readonly backgroundSignal: number;
}

/**
 * A Sakuma–Hattori calibration curve S(T) = C / (exp(c2 / (A·T + B)) − 1), prepared once:
 * from coefficients, or by a fit. `free()` releases it now; a forgotten object is freed when
 * garbage-collected.
 *
 * @throws {QuantabandError} from the constructor: WRONG_TYPE, UNSUPPORTED (unknown field),
 * NON_FINITE, NON_POSITIVE (A or C ≤ 0).
 */
export class CalibrationCurve {
  constructor(coefficients: CurveCoefficients);
  /**
   * Least-squares fit through calibration points: temperatures (K) and signals, same length,
   * 3 to 10 000 points (TOO_LARGE above), signals increasing with temperature, any order.
   */
  static fit(temperaturesK: NumberArray, signals: NumberArray, options?: PointFitOptions): CalibrationCurve;
  /**
   * A curve exact through an instrument's signals at three different ITS-90 fixed points
   * (any order), with its interpolation error against the instrument's model between and
   * beyond them (`fixedPointReport`). These are ITS-90 temperatures T90, not thermodynamic
   * temperatures. DEGENERATE_FIT for a repeated fixed point.
   */
  static throughFixedPoints(
    instrument: Instrument,
    fixedPoints: readonly [FixedPoint, FixedPoint, FixedPoint],
    options?: FixedPointCurveOptions,
  ): CalibrationCurve;
  /** Fit to an instrument's exact model over [tMinK, tMaxK] (reweighted towards equal ripple). */
  static fitInstrument(instrument: Instrument, tMinK: number, tMaxK: number, options?: FitOptions): CalibrationCurve;
  /** Starting curve from a response instrument's moments, exact at referenceTemperatureK. */
  static fromResponse(instrument: Instrument, referenceTemperatureK: number): CalibrationCurve;
  readonly coefficients: Readonly<Required<CurveCoefficients>>;
  /** The fit's report (undefined for a curve made from coefficients). */
  readonly fitReport: FitReport | undefined;
  /** The fixed points and interpolation errors of a curve from `throughFixedPoints` (else undefined). */
  readonly fixedPointReport: FixedPointReport | undefined;
  /**
   * Covariance of (aM, bMK, c) propagated from the reference points' uncertainties (first
   * order, points independent). Curves from `fit` or `throughFixedPoints` only (UNSUPPORTED
   * otherwise).
   */
  parameterCovariance(): ParameterCovariance;
  /**
   * A reading at `signal` with the uncertainty the calibration transfers to it and that of its
   * own signal (`uSignal`, default 0), and ∂T/∂T_i, ∂T/∂S_i of every reference point. Curves
   * from `fit` or `throughFixedPoints` only (UNSUPPORTED otherwise).
   */
  readingUncertainty(signal: number, uSignal?: number): CalibratedReading;
  free(): void;
  signal(temperatureK: number): number;
  signalDerivative(temperatureK: number): number;
  temperature(signal: number): number;
  signals(temperaturesK: NumberArray, out?: Float64Array): Float64Array;
  signalDerivatives(temperaturesK: NumberArray, out?: Float64Array): Float64Array;
  temperatures(signals: NumberArray, out?: Float64Array): Float64Array;
  /** max |T_curve(S_exact(T)) − T| over nPoints temperatures in [tMinK, tMaxK]. */
  maxInterpolationError(instrument: Instrument, tMinK: number, tMaxK: number, nPoints: number): InterpolationError;
  /**
   * Converts a whole frame to object temperatures through this curve and the measurement
   * equation, into a new array or the caller's `out` (no allocation per frame then). Invalid
   * pixels become NaN and are counted; they do not throw. Per-pixel corrections (`emissivity`,
   * `pixelGain`, `pixelOffset`, `badPixels`) take the double-precision loop; without them u16
   * counts and f32 signals into Float32Array output take the single-precision loop.
   *
   * Caution: a calculation from the given emissivity and conditions, not a substitute for a
   * calibrated instrument; never use it for medical or fever screening.
   */
  convertFrame(raw: FrameInput, options: FrameOptionsBase & { output: "float64"; out?: Float64Array }): FrameResult<Float64Array>;
  convertFrame(raw: FrameInput, options?: FrameOptionsBase & { output?: "float32"; out?: Float32Array }): FrameResult<Float32Array>;
}
