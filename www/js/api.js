// The page's one door to the WebAssembly package. Every number the page shows comes through
// here from the quantaband core; the sections never call the package directly. A section asks
// `api.has(...)` for the bindings it needs and is left out when the package lacks them.

let qb = null;

const SI_UNIT = { wavelength: 'm', wavenumber: 'm-1', frequency: 'Hz', photonEnergy: 'J' };

function instrument(model) {
  if (model.kind === 'band') return { kind: 'response', wavelengths: [model.lower, model.upper], values: [1, 1], unit: model.unit };
  if (model.kind === 'spectral') return { kind: 'spectralPoint', wavelength: model.wavelength, unit: model.unit };
  if (model.kind === 'curve') return model.curve;
  throw new Error(`unknown model kind ${model.kind}`);
}

/** Factor from the page's signal unit to the package's (spectral radiance per µm → per m). */
function signalScale(model) {
  return model.kind === 'spectral' ? 1 / api.spectralToSi(1, model.unit) : 1;
}

/** The frame-conversion binding as (curve, counts, gain, offset, cond, emissivityMap?) → frame. */
function frameFn() {
  if (!qb || typeof qb.convertFrame !== 'function') return null;
  return (curve, counts, gain, offset, cond, emissivity) => {
    const r = qb.convertFrame(curve, counts, { gain, offset, conditions: cond, ...(emissivity ? { emissivity } : {}) });
    return { temperaturesK: r.temperaturesK, valid: r.valid, invalid: r.invalid, minK: r.minTemperatureK, maxK: r.maxTemperatureK };
  };
}

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
  /** Converts an array of spectral coordinates between units (one call into the core). */
  spectralArray(values, from, to) {
    return fn('convertSpectralArray')(values, from, to);
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
  // ---- quantum statistics (energies in J, frequencies in Hz)
  occupancyBoseEinstein(energyJ, muJ, temperatureK) {
    return fn('boseEinsteinEnergy')(energyJ, muJ, temperatureK);
  },
  occupancyFermiDirac(energyJ, muJ, temperatureK) {
    return fn('fermiDiracEnergy')(energyJ, muJ, temperatureK);
  },
  occupancyMaxwellBoltzmann(energyJ, muJ, temperatureK) {
    return fn('maxwellBoltzmannEnergy')(energyJ, muJ, temperatureK);
  },
  photonNumber(frequencyHz, temperatureK) {
    return fn('thermalPhotonNumber')(frequencyHz, temperatureK);
  },
  noiseTemperature(frequencyHz, temperatureK) {
    return fn('quantumNoiseTemperature')(frequencyHz, temperatureK);
  },
  rayleighJeansTemperature(frequencyHz, temperatureK) {
    return fn('rayleighJeansBrightnessTemperature')(frequencyHz, temperatureK);
  },
  noisePower(frequencyHz, temperatureK, zeroPoint) {
    return fn(zeroPoint ? 'availableNoisePowerDensityWithZeroPoint' : 'availableNoisePowerDensity')(frequencyHz, temperatureK);
  },
  // ---- radiation thermometry. Page model descriptors → the package's InstrumentModel:
  //   { kind: 'band', unit, lower, upper }  → a rectangular response (1 from lower to upper)
  //   { kind: 'spectral', unit, wavelength } → a spectral point (signal per display unit)
  //   { kind: 'curve', curve }               → a Sakuma–Hattori curve from sakumaHattoriFit
  hasThermometry() {
    return api.has('uncertaintyBudget', 'objectTemperature', 'modelSignal');
  },
  hasRatio() {
    return api.has('ratioTemperature');
  },
  hasCalibration() {
    return api.has('sakumaHattoriFit', 'modelSignal', 'modelTemperature', 'uncertaintyBudget', 'responseMoments', 'convertTemperatureArray');
  },
  hasFrame() {
    return !!frameFn() && api.has('measuredSignalArray');
  },
  thermoCheckModel(model) {
    return fn('modelSignal')(instrument(model), 300);
  },
  thermoObjectTemperature(model, signal, cond) {
    return fn('objectTemperature')(instrument(model), signal * signalScale(model), cond ?? undefined);
  },
  thermoBudget(model, signal, cond, u) {
    const k = signalScale(model);
    const b = fn('uncertaintyBudget')(instrument(model), signal * k, cond, { ...u, signal: u.signal * k });
    const values = {
      signal,
      emissivity: cond.emissivity,
      reflectedTemperature: cond.reflectedTemperatureK,
      pathTransmittance: cond.pathTransmittance,
      pathTemperature: cond.pathTemperatureK,
    };
    return {
      temperatureK: b.temperatureK,
      combinedK: b.combinedStandardUncertaintyK,
      entries: b.entries.map((e) => (e.input === 'signal'
        ? { ...e, value: values.signal, sensitivity: e.sensitivity * k, standardUncertainty: e.standardUncertainty / k }
        : { ...e, value: values[e.input] })),
    };
  },
  /** Signals of many object temperatures, each with its own emissivity (grouped per value). */
  thermoMeasuredSignals(model, temperaturesK, emissivities, cond) {
    const out = new Float64Array(temperaturesK.length);
    const groups = new Map();
    emissivities.forEach((e, i) => (groups.get(e) || groups.set(e, []).get(e)).push(i));
    for (const [eps, idx] of groups) {
      const ts = Float64Array.from(idx, (i) => temperaturesK[i]);
      const s = fn('measuredSignalArray')(instrument(model), ts, { ...cond, emissivity: eps });
      idx.forEach((i, j) => { out[i] = s[j] / signalScale(model); });
    }
    return out;
  },
  ratioTemperature(unit, band1, band2, ratio, emissivityRatio) {
    const b1 = instrument({ kind: 'band', unit, lower: band1[0], upper: band1[1] });
    const b2 = instrument({ kind: 'band', unit, lower: band2[0], upper: band2[1] });
    return fn('ratioTemperature')(b1, b2, ratio, emissivityRatio, 1000);
  },
  responseMoments(wavelengths, values, unit) {
    return fn('responseMoments')({ kind: 'response', wavelengths, values, unit });
  },
  curveFromResponse(wavelengths, values, unit, referenceTemperatureK) {
    return fn('sakumaHattoriFromResponse')({ kind: 'response', wavelengths, values, unit }, referenceTemperatureK);
  },
  fitCurve(temperaturesK, signals) {
    return fn('sakumaHattoriFit')(temperaturesK, signals);
  },
  curveSignal(curve, temperatureK) {
    return fn('modelSignal')(curve, temperatureK);
  },
  curveTemperature(curve, signal) {
    return fn('modelTemperature')(curve, signal);
  },
  toKelvinArray(values, unit) {
    return fn('convertTemperatureArray')(values, unit, 'K');
  },
  convertFrame(model, counts, gain, offset, cond, emissivityMap) {
    return frameFn()(instrument(model), counts, gain, offset, cond, emissivityMap);
  },
};
