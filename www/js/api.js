// The page's one door to the WebAssembly package. Every number the page shows comes through
// here from the quantaband core; the sections never call the package directly. A section asks
// `api.has(...)` for the bindings it needs and is left out when the package lacks them.

let qb = null;

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
    return fn('toKelvin')(value, unit);
  },
  fromKelvin(kelvin, unit) {
    return fn('fromKelvin')(kelvin, unit);
  },
  spectralToSi(value, unit) {
    return fn('spectralToSi')(value, unit);
  },
  spectralFromSi(valueSi, unit) {
    return fn('spectralFromSi')(valueSi, unit);
  },
  spectralKind(unit) {
    return fn('spectralKind')(unit);
  },
  // ---- radiometric core. spec = { variable, quantity, geometry, emissivity }; coordinates in SI.
  spectrum(spec, xsSi, temperatureK) {
    return fn('spectrum')(spec, xsSi, temperatureK);
  },
  spectralValue(spec, xSi, temperatureK) {
    return fn('spectralValue')(spec, xSi, temperatureK);
  },
  spectralPeak(spec, temperatureK) {
    return fn('spectralPeak')(spec, temperatureK);
  },
  band(spec, loSi, hiSi, temperatureK) {
    return fn('band')(spec, loSi, hiSi, temperatureK);
  },
  bandFraction(spec, loSi, hiSi, temperatureK) {
    return fn('bandFraction')(spec, loSi, hiSi, temperatureK);
  },
  bandDdt(spec, loSi, hiSi, temperatureK) {
    return fn('bandDdt')(spec, loSi, hiSi, temperatureK);
  },
  bandOverTemperatures(spec, loSi, hiSi, temperaturesK) {
    return fn('bandOverTemperatures')(spec, loSi, hiSi, temperaturesK);
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
