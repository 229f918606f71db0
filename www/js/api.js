// The page's one door to the WebAssembly package. Every number the page shows comes through
// here from the quantaband core; the sections never call the package directly. A section asks
// `api.has(...)` for the capabilities it needs and is left out when the package lacks them.
//
// The package's API is prepared objects (Spectrum, Instrument, CalibrationCurve) built once from
// a configuration and then called with plain numbers. The sections speak in terms of small
// descriptors (a spectrum's settings, a page model descriptor); this module keeps one prepared
// object per distinct descriptor in a small cache (freeing the ones it drops), so a redraw that
// evaluates the same spectrum thousands of times reads its settings once.

let qb = null;

const SI_UNIT = { wavelength: 'm', wavenumber: 'm-1', frequency: 'Hz', photonEnergy: 'J' };

/**
 * The capabilities `has()` knows, by the names the sections ask for (the names of the bindings
 * that served them before the prepared-object API), and the package exports each one needs.
 */
const CAPABILITIES = {
  spectralDensity: ['Spectrum'],
  spectralDensityArray: ['Spectrum'],
  spectrumPeak: ['Spectrum'],
  bandIntegral: ['Spectrum'],
  bandIntegralDT: ['Spectrum'],
  bandFraction: ['Spectrum'],
  bandIntegralArray: ['Spectrum'],
  bandIntegralDTArray: ['Spectrum'],
  convertSpectral: ['convertSpectral'],
  convertTemperature: ['convertTemperature'],
  convertTemperatureArray: ['convertTemperatureArray'],
  spectralUnitKind: ['spectralUnitKind'],
  boseEinsteinEnergy: ['boseEinsteinEnergy'],
  fermiDiracEnergy: ['fermiDiracEnergy'],
  maxwellBoltzmannEnergy: ['maxwellBoltzmannEnergy'],
  thermalPhotonNumber: ['thermalPhotonNumber'],
  quantumNoiseTemperature: ['quantumNoiseTemperature'],
  rayleighJeansBrightnessTemperature: ['rayleighJeansBrightnessTemperature'],
  availableNoisePowerDensity: ['availableNoisePowerDensity'],
  availableNoisePowerDensityWithZeroPoint: ['availableNoisePowerDensityWithZeroPoint'],
  modelSignal: ['Instrument'],
  modelTemperature: ['Instrument'],
  objectTemperature: ['Instrument'],
  measuredSignalArray: ['Instrument'],
  uncertaintyBudget: ['Instrument'],
  responseMoments: ['Instrument'],
  ratioTemperature: ['Instrument'],
  sakumaHattoriFit: ['CalibrationCurve'],
  sakumaHattoriFromResponse: ['CalibrationCurve', 'Instrument'],
  convertFrame: ['CalibrationCurve'],
};

/** Prepared objects by descriptor (insertion order = age); the oldest is freed beyond 32. */
const cache = new Map();
function prepared(kind, config) {
  const key = `${kind}:${JSON.stringify(config, (k, v) => (ArrayBuffer.isView(v) ? Array.from(v) : v))}`;
  let o = cache.get(key);
  if (o !== undefined) {
    cache.delete(key);
    cache.set(key, o);
    return o;
  }
  o = kind === 'spectrum' ? new qb.Spectrum(config) : new qb.Instrument(config);
  cache.set(key, o);
  if (cache.size > 32) {
    const [oldKey, old] = cache.entries().next().value;
    cache.delete(oldKey);
    old.free();
  }
  return o;
}

/**
 * A section's spectrum descriptor { unit, variable?, quantity, geometry, emissivity } as a
 * prepared Spectrum whose densities are per the SI unit of the variable (the page converts them
 * to its display unit itself).
 */
function spectrumOf(spec) {
  const variable = spec.variable ?? fn('spectralUnitKind')(spec.unit);
  const densityUnit = SI_UNIT[variable] ?? SI_UNIT.wavelength;
  return prepared('spectrum', { ...spec, densityUnit });
}

/** A page model descriptor → the package's instrument model. */
function instrument(model) {
  if (model.kind === 'band') return { kind: 'response', wavelengths: [model.lower, model.upper], values: [1, 1], unit: model.unit };
  if (model.kind === 'spectral') return { kind: 'spectralPoint', wavelength: model.wavelength, unit: model.unit };
  if (model.kind === 'curve') return { kind: 'sakumaHattori', aM: model.curve.aM, bMK: model.curve.bMK, c: model.curve.c, c2: model.curve.c2 ?? 'codata2018' };
  throw new Error(`unknown model kind ${model.kind}`);
}

/** The prepared Instrument of a page model under conditions `cond` (optional). */
function instrumentOf(model, cond) {
  const definition = { model: instrument(model) };
  if (cond !== undefined && cond !== null) definition.conditions = cond;
  return prepared('instrument', definition);
}

/** Factor from the page's signal unit to the package's (spectral radiance per µm → per m). */
function signalScale(model) {
  return model.kind === 'spectral' ? 1 / api.spectralToSi(1, model.unit) : 1;
}

/** A Sakuma–Hattori curve as the page keeps it (plain coefficients with kind). */
function curveShape(c) {
  return { kind: 'sakumaHattori', aM: c.aM, bMK: c.bMK, c: c.c, c2: c.c2 };
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
  /** True when every named capability is served by the package. */
  has(...names) {
    return !!qb && names.every((n) => (CAPABILITIES[n] ?? [n]).every((e) => typeof qb[e] === 'function'));
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
    return spectrumOf(spec).points(xs, temperatureK);
  },
  spectralValue(spec, x, temperatureK) {
    return spectrumOf(spec).point(x, temperatureK);
  },
  spectralPeak(spec, temperatureK) {
    return spectrumOf(spec).peak(temperatureK);
  },
  band(spec, lo, hi, temperatureK) {
    return spectrumOf(spec).band(lo, hi, temperatureK);
  },
  bandFraction(spec, lo, hi, temperatureK) {
    return spectrumOf(spec).bandFraction(lo, hi, temperatureK);
  },
  bandDdt(spec, lo, hi, temperatureK) {
    return spectrumOf(spec).bandDerivative(lo, hi, temperatureK);
  },
  bandOverTemperatures(spec, lo, hi, temperaturesK) {
    return spectrumOf(spec).bands(lo, hi, temperaturesK);
  },
  bandDdtOverTemperatures(spec, lo, hi, temperaturesK) {
    return spectrumOf(spec).bandDerivatives(lo, hi, temperaturesK);
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
  //   { kind: 'curve', curve }               → a Sakuma–Hattori curve from fitCurve
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
    return api.has('convertFrame', 'measuredSignalArray');
  },
  thermoCheckModel(model) {
    return instrumentOf(model).signal(300);
  },
  thermoObjectTemperature(model, signal, cond) {
    return instrumentOf(model, cond).objectTemperature(signal * signalScale(model));
  },
  thermoBudget(model, signal, cond, u) {
    const k = signalScale(model);
    const b = instrumentOf(model, cond).uncertaintyBudget(signal * k, { ...u, signal: u.signal * k });
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
    const scale = signalScale(model);
    for (const [eps, idx] of groups) {
      const ts = Float64Array.from(idx, (i) => temperaturesK[i]);
      const s = instrumentOf(model, { ...cond, emissivity: eps }).measuredSignals(ts);
      idx.forEach((i, j) => { out[i] = s[j] / scale; });
    }
    return out;
  },
  ratioTemperature(unit, band1, band2, ratio, emissivityRatio) {
    const b1 = instrumentOf({ kind: 'band', unit, lower: band1[0], upper: band1[1] });
    const b2 = instrumentOf({ kind: 'band', unit, lower: band2[0], upper: band2[1] });
    return b1.ratioTemperature(b2, ratio, emissivityRatio, 1000);
  },
  responseMoments(wavelengths, values, unit) {
    return prepared('instrument', { model: { kind: 'response', wavelengths, values, unit } }).responseMoments();
  },
  curveFromResponse(wavelengths, values, unit, referenceTemperatureK) {
    const inst = prepared('instrument', { model: { kind: 'response', wavelengths, values, unit } });
    const c = fn('CalibrationCurve').fromResponse(inst, referenceTemperatureK);
    try {
      return curveShape(c.coefficients);
    } finally {
      c.free();
    }
  },
  /** A least-squares curve: { curve, rmsResidualK, maxAbsResidualK, iterations, residualsK }. */
  fitCurve(temperaturesK, signals) {
    const c = fn('CalibrationCurve').fit(temperaturesK, signals);
    try {
      return { curve: curveShape(c.coefficients), ...c.fitReport };
    } finally {
      c.free();
    }
  },
  curveSignal(curve, temperatureK) {
    return instrumentOf({ kind: 'curve', curve }).signal(temperatureK);
  },
  curveTemperature(curve, signal) {
    return instrumentOf({ kind: 'curve', curve }).temperature(signal);
  },
  toKelvinArray(values, unit) {
    return fn('convertTemperatureArray')(values, unit, 'K');
  },
  convertFrame(model, counts, gain, offset, cond, emissivityMap) {
    const m = instrument(model);
    if (m.kind !== 'sakumaHattori') throw new Error('frames need a calibration curve');
    const c = new (fn('CalibrationCurve'))({ aM: m.aM, bMK: m.bMK, c: m.c, c2: m.c2 });
    try {
      const options = { gain, offset };
      if (cond !== undefined && cond !== null) options.conditions = cond;
      if (emissivityMap) options.emissivity = emissivityMap;
      const r = c.convertFrame(counts, options);
      return { temperaturesK: r.temperaturesK, valid: r.valid, invalid: r.invalid, minK: r.minTemperatureK, maxK: r.maxTemperatureK };
    } finally {
      c.free();
    }
  },
};
