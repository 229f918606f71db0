// ---- spectra (src/wasm/js/spectrum.js) -------------------------------------------------------

/**
 * A spectral unit name (case-sensitive). Wavelength: m, mm, um/µm/μm/micron, nm. Wavenumber:
 * m-1 (m^-1, m⁻¹, 1/m), cm-1 (cm^-1, cm⁻¹, 1/cm). Frequency: Hz, kHz, MHz, GHz, THz. Photon
 * energy: J, eV, meV. Results name units by their first (canonical) spelling.
 */
export type SpectralUnit =
  | "m" | "mm" | "um" | "µm" | "μm" | "micron" | "nm"
  | "m-1" | "m^-1" | "m⁻¹" | "1/m"
  | "cm-1" | "cm^-1" | "cm⁻¹" | "1/cm"
  | "Hz" | "kHz" | "MHz" | "GHz" | "THz"
  | "J" | "eV" | "meV";

/** A wavelength unit (the wavelength spellings of SpectralUnit). */
export type WavelengthUnit = "m" | "mm" | "um" | "µm" | "μm" | "micron" | "nm";

/** What a spectral density is "per": wavelength, wavenumber or frequency. */
export type SpectralVariable = "wavelength" | "wavenumber" | "frequency";
/** Radiant energy (W) or photon number (photons/s). */
export type Quantity = "energy" | "photon";
/** Radiance (per steradian) or hemispherical exitance (π × radiance). */
export type Geometry = "radiance" | "exitance";
/** Second radiation constant: CODATA 2018 hc/k, or 0.014388 m·K exactly as fixed by ITS-90. */
export type C2Convention = "codata2018" | "its90";

/** A Planck spectrum in user units (the argument of `new Spectrum`). */
export interface SpectrumSettings {
  /** Unit of every spectral coordinate given or returned (points, band limits, peaks). */
  unit: SpectralUnit;
  /** What the density is per. Default: the kind of `unit`; required for J, eV, meV. */
  variable?: SpectralVariable;
  /** Default "energy". */
  quantity?: Quantity;
  /** Default "radiance". */
  geometry?: Geometry;
  /** Grey-body emissivity in (0, 1]. Default 1. */
  emissivity?: number;
  /** Refractive index of the medium radiated into (> 0; enters as n²). Default 1. */
  refractiveIndex?: number;
  /** Default "codata2018". */
  c2?: C2Convention;
  /**
   * The unit the density is "per" (a unit of the variable's kind). Default: `unit` (so
   * `{ unit: "um" }` gives W·m⁻²·sr⁻¹ per µm), or the SI unit when `unit` is of another kind.
   */
  densityUnit?: SpectralUnit;
}

/** The settings in use, every default filled in, units by their canonical names. */
export interface ResolvedSpectrumSettings {
  readonly unit: SpectralUnit;
  readonly variable: SpectralVariable;
  readonly quantity: Quantity;
  readonly geometry: Geometry;
  readonly emissivity: number;
  readonly refractiveIndex: number;
  readonly c2: C2Convention;
  readonly densityUnit: SpectralUnit;
}

/** Plain-text unit labels of a spectrum's results. */
export interface SpectrumUnits {
  /** Unit of spectral coordinates, e.g. "um". */
  readonly coordinate: string;
  /** The unit densities are per, e.g. "um". */
  readonly densityPer: string;
  /** Unit of point()/points(), e.g. "W m^-2 sr^-1 um^-1". */
  readonly density: string;
  /** Unit of derivative(), e.g. "W m^-2 sr^-1 um^-1 K^-1". */
  readonly densityDerivative: string;
  /** Unit of band() and total(), e.g. "W m^-2 sr^-1". */
  readonly total: string;
  /** Unit of bandDerivative() and totalDerivative(). */
  readonly totalDerivative: string;
}

/**
 * A Planck spectrum prepared once: `new Spectrum({ unit: "um" })`. Methods take plain numbers:
 * spectral coordinates in `settings.unit`, temperatures in K; densities come per
 * `settings.densityUnit` (see `units`), band integrals and totals in SI. Bulk methods take a
 * {@link NumberArray} and return a new Float64Array, or fill `out` (a Float64Array of the same
 * length) and return it. Call `free()` (or use `Symbol.dispose`) when done; a forgotten object is
 * freed when garbage-collected.
 *
 * @throws {QuantabandError} from the constructor: UNKNOWN_UNIT, UNSUPPORTED (unknown field or
 * value), WRONG_TYPE, OUT_OF_RANGE (emissivity), NON_POSITIVE (refractiveIndex).
 */
export class Spectrum {
  constructor(settings: SpectrumSettings);
  readonly settings: ResolvedSpectrumSettings;
  readonly units: SpectrumUnits;
  /** Releases the WebAssembly memory now; later calls throw DISPOSED. */
  free(): void;
  /** Spectral density at point `x` and `temperatureK` (per `units.density`). */
  point(x: number, temperatureK: number): number;
  /** ∂/∂T of point() (per kelvin). */
  derivative(x: number, temperatureK: number): number;
  /** The spectrum integrated over its whole range (W·m⁻²·sr⁻¹ for energy radiance). */
  total(temperatureK: number): number;
  /** ∂/∂T of total(). */
  totalDerivative(temperatureK: number): number;
  /** Position of the density's maximum, in `settings.unit`. */
  peak(temperatureK: number): number;
  /** Band integral over [lower, upper] (in `settings.unit`; lower < upper). */
  band(lower: number, upper: number, temperatureK: number): number;
  /** ∂/∂T of band(). */
  bandDerivative(lower: number, upper: number, temperatureK: number): number;
  /** Fraction (0…1) of total() in the band. */
  bandFraction(lower: number, upper: number, temperatureK: number): number;
  /**
   * True temperature (K) of this spectrum's grey body (its emissivity) whose density at `x` is
   * `value` (per `units.density`). Equal to brightnessTemperature() when emissivity is 1.
   */
  temperature(x: number, value: number): number;
  /** Brightness temperature (K): the blackbody (ε = 1) temperature giving `value` at `x`. */
  brightnessTemperature(x: number, value: number): number;
  /** Temperature (K) at which band(lower, upper, T) equals `value`. */
  bandTemperature(lower: number, upper: number, value: number): number;
  /** Temperature (K) at which (ε1/ε2)·band1/band2 equals `ratio` (two-band ratio thermometry). */
  bandRatioTemperature(lower1: number, upper1: number, lower2: number, upper2: number, ratio: number, emissivityRatio?: number): number;
  points(xs: NumberArray, temperatureK: number, out?: Float64Array): Float64Array;
  derivatives(xs: NumberArray, temperatureK: number, out?: Float64Array): Float64Array;
  bands(lower: number, upper: number, temperaturesK: NumberArray, out?: Float64Array): Float64Array;
  bandDerivatives(lower: number, upper: number, temperaturesK: NumberArray, out?: Float64Array): Float64Array;
  bandFractions(lower: number, upper: number, temperaturesK: NumberArray, out?: Float64Array): Float64Array;
  bandTemperatures(lower: number, upper: number, values: NumberArray, out?: Float64Array): Float64Array;
  temperatures(x: number, values: NumberArray, out?: Float64Array): Float64Array;
  brightnessTemperatures(x: number, values: NumberArray, out?: Float64Array): Float64Array;
}
