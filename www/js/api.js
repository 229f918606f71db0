// The page's one door to the WebAssembly package. Every number the page shows comes through
// here from the quantaband core; the sections never call the package directly. A section asks
// `api.has(...)` for the bindings it needs and is left out when the package lacks them.

let qb = null;

const SI_UNIT = { wavelength: 'm', wavenumber: 'm-1', frequency: 'Hz', photonEnergy: 'J' };

/** Installs the initialised package. */
export function bindApi(pkg) {
  qb = pkg;
}

function fn(name) {
  const f = qb && qb[name];
  if (typeof f !== 'function') throw new Error(`the quantaband package has no ${name}()`);
  return f;
}

export const api = {
  /** True when every named export exists. */
  has(...names) {
    return !!qb && names.every((n) => typeof qb[n] === 'function');
  },
  isError(e) {
    return !!qb && typeof qb.QuantabandError === 'function' && e instanceof qb.QuantabandError;
  },
  // ---- units (conversion lives in the core's unit module)
  toKelvin(value, unit) {
    return fn('convertTemperature')(value, unit, 'K');
  },
  fromKelvin(kelvin, unit) {
    return fn('convertTemperature')(kelvin, 'K', unit);
  },
  /** A spectral coordinate in `unit` → the SI unit of its kind (m, m⁻¹, Hz or J). */
  spectralToSi(value, unit) {
    return fn('convertSpectral')(value, unit, SI_UNIT[api.spectralKind(unit)]);
  },
  spectralKind(unit) {
    return fn('spectralUnitKind')(unit);
  },
  // ---- radiometric core. spec = { unit, quantity, geometry, emissivity }: coordinates (points,
  // band limits, peaks) in spec.unit, densities per the SI unit of the variable.
  spectrum(spec, xs, temperatureK) {
    return fn('spectralDensityArray')(spec, xs, temperatureK);
  },
  spectralValue(spec, x, temperatureK) {
    return fn('spectralDensity')(spec, x, temperatureK);
  },
  spectralPeak(spec, temperatureK) {
    return fn('spectrumPeak')(spec, temperatureK);
  },
  total(spec, temperatureK) {
    return fn('spectrumTotal')(spec, temperatureK);
  },
  band(spec, lo, hi, temperatureK) {
    return fn('bandIntegral')(spec, lo, hi, temperatureK);
  },
  bandFraction(spec, lo, hi, temperatureK) {
    return fn('bandFraction')(spec, lo, hi, temperatureK);
  },
  bandDdt(spec, lo, hi, temperatureK) {
    return fn('bandIntegralDT')(spec, lo, hi, temperatureK);
  },
  bandOverTemperatures(spec, lo, hi, temperaturesK) {
    return fn('bandIntegralArray')(spec, lo, hi, temperaturesK);
  },
  bandDdtOverTemperatures(spec, lo, hi, temperaturesK) {
    return fn('bandIntegralDTArray')(spec, lo, hi, temperaturesK);
  },
  // ---- quantum statistics (energies in J)
  occupancyBoseEinstein(energyJ, muJ, temperatureK) {
    return fn('occupancyBoseEinstein')(energyJ, muJ, temperatureK);
  },
  occupancyFermiDirac(energyJ, muJ, temperatureK) {
    return fn('occupancyFermiDirac')(energyJ, muJ, temperatureK);
  },
  occupancyMaxwellBoltzmann(energyJ, muJ, temperatureK) {
    return fn('occupancyMaxwellBoltzmann')(energyJ, muJ, temperatureK);
  },
  photonNumber(frequencyHz, temperatureK) {
    return fn('photonNumber')(frequencyHz, temperatureK);
  },
  noiseTemperature(frequencyHz, temperatureK) {
    return fn('noiseTemperature')(frequencyHz, temperatureK);
  },
  rayleighJeansTemperature(frequencyHz, temperatureK) {
    return fn('rayleighJeansTemperature')(frequencyHz, temperatureK);
  },
  noisePower(frequencyHz, temperatureK, zeroPoint) {
    return fn('noisePower')(frequencyHz, temperatureK, zeroPoint);
  },
};
