// ---- free functions (src/wasm/js/functions.js) -----------------------------------------------
// Energies in J, frequencies in Hz, temperatures in K. Each throws QuantabandError
// (NON_FINITE, NON_POSITIVE_*, OUT_OF_RANGE, …) for invalid input and WRONG_TYPE for a
// non-number argument.

/** Bose–Einstein occupancy 1/(eˣ − 1) of reduced energy x = (E − μ)/kT > 0. */
export function boseEinstein(x: number): number;
/** Fermi–Dirac occupancy 1/(eˣ + 1). */
export function fermiDirac(x: number): number;
/** Maxwell–Boltzmann occupancy e⁻ˣ. */
export function maxwellBoltzmann(x: number): number;
export function boseEinsteinArray(xs: NumberArray, out?: Float64Array): Float64Array;
export function fermiDiracArray(xs: NumberArray, out?: Float64Array): Float64Array;
export function maxwellBoltzmannArray(xs: NumberArray, out?: Float64Array): Float64Array;
export function boseEinsteinEnergy(energyJ: number, chemicalPotentialJ: number, temperatureK: number): number;
export function fermiDiracEnergy(energyJ: number, chemicalPotentialJ: number, temperatureK: number): number;
export function maxwellBoltzmannEnergy(energyJ: number, chemicalPotentialJ: number, temperatureK: number): number;
/** Mean thermal photon number of a mode at frequencyHz. */
export function thermalPhotonNumber(frequencyHz: number, temperatureK: number): number;
/** Bose–Einstein integral g_s(z) (polylogarithm) of order s ∈ {1/2, 1, 3/2, 2, 5/2, 3, …} and fugacity 0 ≤ z ≤ 1. */
export function boseEinsteinIntegral(order: number, fugacity: number): number;
/** BEC critical temperature of an ideal gas, K. */
export function boseCriticalTemperature(numberDensityPerM3: number, massKg: number): number;
/** Order j of the complete Fermi–Dirac integral. */
export type FermiDiracOrder = -0.5 | 0.5 | 1.5;
/** Complete Fermi–Dirac integral F_j(η) (normalised with 1/Γ(j+1)). */
export function fermiDiracIntegral(order: FermiDiracOrder, eta: number): number;
export function fermiDiracIntegralArray(order: FermiDiracOrder, etas: NumberArray, out?: Float64Array): Float64Array;
/** η with F_{1/2}(η) = reducedDensity. */
export function inverseFermiDiracHalf(reducedDensity: number): number;

export function quantumNoiseTemperature(frequencyHz: number, temperatureK: number): number;
export function rayleighJeansBrightnessTemperature(frequencyHz: number, temperatureK: number): number;
export function physicalTemperatureFromRayleighJeans(frequencyHz: number, brightnessTemperatureK: number): number;
/** Available noise power per hertz, W/Hz. */
export function availableNoisePowerDensity(frequencyHz: number, temperatureK: number): number;
export function availableNoisePowerDensityWithZeroPoint(frequencyHz: number, temperatureK: number): number;
/** Entropy density of blackbody radiation, J·K⁻¹·m⁻³. */
export function photonEntropyDensity(temperatureK: number): number;
/** Radiation pressure aT⁴/3, Pa. */
export function photonPressure(temperatureK: number): number;
export function photonDensityOfStates(energyJ: number): number;
export function spectralEnergyDensityEnergy(energyJ: number, temperatureK: number): number;
export function spectralEnergyDensityFrequency(frequencyHz: number, temperatureK: number): number;
/** Photon number density of cavity radiation, m⁻³. */
export function photonNumberDensity(temperatureK: number): number;
/** Energy density aT⁴ of cavity radiation, J·m⁻³. */
export function energyDensity(temperatureK: number): number;
/** Mean photon energy of blackbody radiation, J. */
export function meanPhotonEnergy(temperatureK: number): number;

/** Blackbody fraction of energy emitted below λ·T = lambdaTMK (m·K), CODATA c2. */
export function fractionBelow(lambdaTMK: number): number;
/** The same for photon emission. */
export function photonFractionBelow(lambdaTMK: number): number;
/** λ·T (m·K) below which `fraction` of the energy lies. */
export function lambdaTAtFraction(fraction: number): number;
export function photonLambdaTAtFraction(fraction: number): number;
/** A dimensionless Planck integrand: x²/(eˣ−1), x³/(eˣ−1), x³eˣ/(eˣ−1)², x⁴eˣ/(eˣ−1)². */
export type PlanckKernel = "photon" | "energy" | "photonDerivative" | "energyDerivative";
export function planckIntegral(kernel: PlanckKernel, xLower: number, xUpper: number): number;
export function planckIntegralUpper(kernel: PlanckKernel, x: number): number;
export function planckIntegralLower(kernel: PlanckKernel, x: number): number;
export function planckIntegralTotal(kernel: PlanckKernel): number;

/** The kind of quantity a spectral unit measures. */
export type SpectralKind = "wavelength" | "wavenumber" | "frequency" | "photonEnergy";
/** A temperature unit name: K; degC (°C, ℃, C); degF (°F, ℉, F); degR (°R, Rankine). */
export type TemperatureUnit = "K" | "degC" | "°C" | "℃" | "C" | "degF" | "°F" | "℉" | "F" | "degR" | "°R";
/** Converts a spectral coordinate between units (also between kinds: µm ↔ cm⁻¹ ↔ THz ↔ eV). */
export function convertSpectral(value: number, from: SpectralUnit, to: SpectralUnit): number;
export function convertSpectralArray(values: NumberArray, from: SpectralUnit, to: SpectralUnit, out?: Float64Array): Float64Array;
export function spectralUnitKind(unit: SpectralUnit): SpectralKind;
/** Converts an absolute temperature (≤ 0 K is NON_POSITIVE_TEMPERATURE). */
export function convertTemperature(value: number, from: TemperatureUnit, to: TemperatureUnit): number;
export function convertTemperatureArray(values: NumberArray, from: TemperatureUnit, to: TemperatureUnit, out?: Float64Array): Float64Array;
/** Converts a temperature difference (10 °C of difference = 10 K). */
export function convertTemperatureDifference(value: number, from: TemperatureUnit, to: TemperatureUnit): number;

/** Physical constants used by the package (SI units; CODATA 2018 and ITS-90). */
export interface Constants {
  readonly planckH: number;
  readonly planckHbar: number;
  readonly speedOfLightC: number;
  readonly boltzmannK: number;
  readonly elementaryChargeE: number;
  readonly avogadroNA: number;
  readonly atomicMassU: number;
  readonly electronMass: number;
  readonly c1: number;
  readonly c1L: number;
  readonly c2: number;
  readonly c2Its90: number;
  readonly stefanBoltzmannSigma: number;
  readonly radiationA: number;
  readonly wienB: number;
  readonly wienBFrequency: number;
}
export function constants(): Constants;

/** An ITS-90 defining fixed point (freezing point); the ratio relation takes silver, gold or copper. */
export type FixedPoint = "indium" | "tin" | "zinc" | "aluminium" | "silver" | "gold" | "copper";
/** A radiance-ratio temperature on ITS-90 (an ITS-90 temperature, not a thermodynamic one). */
export interface Its90Temperature {
  /** T90 from the ITS-90 ratio relation with c2 = 0.014388 m·K, K. */
  readonly t90K: number;
  /** The same relation evaluated with c2 = hc/k (CODATA 2018), K. */
  readonly tCodataC2K: number;
  /** tCodataC2K − t90K, K: the effect of the value of c2 alone — NOT T − T90. */
  readonly c2EffectK: number;
  /** True when T90 is below the silver point, where ITS-90 does not define T90 by this relation (the value is an extrapolation). */
  readonly belowSilverPoint: boolean;
}
/** T90 of an ITS-90 fixed point, K. */
export function fixedPointTemperature(fixedPoint: FixedPoint): number;
/** Temperature whose spectral radiance at `wavelength` is `ratio` times that at referenceTemperatureK. */
export function temperatureFromRatio(ratio: number, wavelength: number, unit: WavelengthUnit, referenceTemperatureK: number, c2?: C2Convention): number;
/** L(λ, T)/L(λ, T_ref). */
export function radianceRatio(temperatureK: number, wavelength: number, unit: WavelengthUnit, referenceTemperatureK: number, c2?: C2Convention): number;
/** T90 from a radiance ratio to the silver, gold or copper point, with the CODATA-c2 value for comparison (UNSUPPORTED for another fixed point). */
export function its90Temperature(ratio: number, wavelength: number, unit: WavelengthUnit, fixedPoint: FixedPoint): Its90Temperature;
/** Two-colour temperature from L(λ1)/L(λ2) and ε1/ε2 (channel 1 the shorter wavelength). */
export function twoColourTemperature(wavelength1: number, wavelength2: number, unit: WavelengthUnit, ratio: number, emissivityRatio: number, c2?: C2Convention): RatioReading;
