// The page's one door to the WebAssembly package. Every number the page shows comes from the
// quantaband core through here; sections never import the package themselves.
//
// The package's API is prepared objects (Spectrum, Instrument, CalibrationCurve) built once
// from a configuration and then called with plain numbers, and free functions. Sections build
// their objects through `api.spectrum(settings)` / `api.instrument(definition)`, which keep one
// object per distinct configuration in a small cache (freeing those it drops), so a redraw that
// calls the same spectrum thousands of times reads its settings once.

let qb = null;

/** Installs the initialised package. */
export function bindApi(pkg) {
  qb = pkg;
}

const cache = new Map();
const CACHE_SIZE = 48;

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
  if (cache.size > CACHE_SIZE) {
    const [oldKey, old] = cache.entries().next().value;
    cache.delete(oldKey);
    old.free();
  }
  return o;
}

function fn(name) {
  const f = qb && qb[name];
  if (typeof f !== 'function') throw new Error(`the quantaband package has no ${name}`);
  return f;
}

/** A prepared object of package class `className` for `config`, cached like the others. */
function preparedOf(className, config) {
  const key = `${className}:${JSON.stringify(config)}`;
  let o = cache.get(key);
  if (o !== undefined) {
    cache.delete(key);
    cache.set(key, o);
    return o;
  }
  o = new (fn(className))(config);
  cache.set(key, o);
  if (cache.size > CACHE_SIZE) {
    const [oldKey, old] = cache.entries().next().value;
    cache.delete(oldKey);
    old.free();
  }
  return o;
}

export const api = {
  /** True when the package exports every named function or class. */
  has(...names) {
    return !!qb && names.every((n) => typeof qb[n] === 'function');
  },
  /** True for the package's error class (the page keeps its `code`). */
  isError(e) {
    return !!qb && typeof qb.QuantabandError === 'function' && e instanceof qb.QuantabandError;
  },
  /** A free function of the package by name (sections call e.g. api.fn('thermalPhotonNumber')). */
  fn,

  // ---- units: every conversion is the core's (src/units.rs through convertTemperature/Spectral)
  toK(value, unit) {
    return fn('convertTemperature')(value, unit, 'K'); // also rejects ≤ 0 K
  },
  fromK(kelvin, unit) {
    return fn('convertTemperature')(kelvin, 'K', unit);
  },
  /** A temperature difference in `unit` → kelvin (10 °C of difference = 10 K, 9 °F = 5 K). */
  diffToK(value, unit) {
    return fn('convertTemperatureDifference')(value, unit, 'K');
  },
  diffFromK(kelvin, unit) {
    return fn('convertTemperatureDifference')(kelvin, 'K', unit);
  },
  spectralKind(unit) {
    return fn('spectralUnitKind')(unit);
  },
  /** True when converting between the two units is a proportion (not a reciprocal). */
  spectralLinear(from, to) {
    return (api.spectralKind(from) === 'wavelength') === (api.spectralKind(to) === 'wavelength');
  },
  /**
   * A spectral coordinate in `from` → `to`. Between proportional kinds (µm↔nm, eV↔THz↔cm⁻¹)
   * the core's factor is applied, so zero and negative values (level energies) convert too;
   * wavelength ↔ the others is a reciprocal and needs a positive value.
   */
  convertSpectral(value, from, to) {
    if (from === to) return value;
    if (api.spectralLinear(from, to)) return value * fn('convertSpectral')(1, from, to);
    return fn('convertSpectral')(value, from, to);
  },
  convertSpectralArray(values, from, to) {
    if (from === to) return Float64Array.from(values);
    if (api.spectralLinear(from, to)) {
      const k = fn('convertSpectral')(1, from, to);
      return Float64Array.from(values, (v) => v * k);
    }
    return fn('convertSpectralArray')(values, from, to);
  },
  /** Size of one `unit` in the SI unit of its kind (1 µm → 1e-6 m). */
  spectralSize(unit) {
    const si = { wavelength: 'm', wavenumber: 'm-1', frequency: 'Hz', photonEnergy: 'J' }[api.spectralKind(unit)];
    return fn('convertSpectral')(1, unit, si);
  },

  // ---- prepared objects
  /** A Spectrum for these settings (see the package's SpectrumSettings). */
  spectrum(settings) {
    return prepared('spectrum', settings);
  },
  /** An Instrument for this definition ({ model, conditions? }). */
  instrument(definition) {
    return prepared('instrument', definition);
  },
  /** A least-squares Sakuma–Hattori fit: { coefficients, rmsResidualK, maxAbsResidualK, residualsK }. */
  fitCurve(temperaturesK, signals) {
    const c = fn('CalibrationCurve').fit(temperaturesK, signals);
    try {
      return { coefficients: { ...c.coefficients }, ...c.fitReport };
    } finally {
      c.free();
    }
  },
  /** The curve a spectral response alone predicts, at reference temperature tRefK. */
  curveFromResponse(definition, tRefK) {
    const c = fn('CalibrationCurve').fromResponse(api.instrument(definition), tRefK);
    try {
      return { ...c.coefficients };
    } finally {
      c.free();
    }
  },
  /** Converts a frame of raw counts through a curve: { temperaturesK, valid, invalid, minK, maxK }. */
  convertFrame(coefficients, counts, options) {
    const C = fn('CalibrationCurve');
    const c = new C({ aM: coefficients.aM, bMK: coefficients.bMK, c: coefficients.c, c2: coefficients.c2 ?? 'codata2018' });
    try {
      const r = c.convertFrame(counts, options);
      return { temperaturesK: r.temperaturesK, valid: r.valid, invalid: r.invalid, minK: r.minTemperatureK, maxK: r.maxTemperatureK };
    } finally {
      c.free();
    }
  },

  // ---- instrument design and quantum-statistics thermometry (design.d.ts, quantum.d.ts)
  /** A DetectorDesign for this definition ({ optics, detector, scene }). */
  detectorDesign(definition) {
    return preparedOf('DetectorDesign', definition);
  },
  /** A RamanMode ({ shiftPerCm, excitation, unit, detection }). */
  ramanMode(settings) {
    return preparedOf('RamanMode', settings);
  },
  /** A Semiconductor ({ electronMassRatio, holeMassRatio, bandGap0K, varshniAlpha?, varshniBetaK?, energyUnit }). */
  semiconductor(material) {
    return preparedOf('Semiconductor', material);
  },
  /** YFactorLoads ({ hotLoadK, coldLoadK, unit, loadModel }). */
  yFactorLoads(settings) {
    return preparedOf('YFactorLoads', settings);
  },
  /**
   * A multi-wavelength fit as plain figures (the package's fit object is freed), with the
   * fitted emissivity at each channel wavelength in `emissivityAtChannels`.
   */
  fitMultiwavelength(measurement, options) {
    const f = fn('fitMultiwavelength')(measurement, options);
    try {
      const figures = JSON.parse(JSON.stringify(f));
      return { ...figures, emissivityAtChannels: Array.from(f.emissivities(measurement.wavelengths)) };
    } finally {
      f.free();
    }
  },
  /**
   * A Monte Carlo run (JCGM 101) of an instrument's measurement equation, prepared; the caller
   * steps it (`step(n)`), ends it (`result(bins)`) and frees it.
   */
  monteCarlo(instrument, signal, uncertainties, options) {
    return fn('MonteCarlo').measurement(instrument, signal, uncertainties, options);
  },
  /**
   * A least-squares curve through points with their uncertainties (options: uTemperaturesK,
   * uSignals) and the calibration transfer to a reading at `signal`: the core's CalibratedReading.
   */
  fitReading(temperaturesK, signals, options, signal, uSignal) {
    const c = fn('CalibrationCurve').fit(temperaturesK, signals, options);
    try {
      return c.readingUncertainty(signal, uSignal);
    } finally {
      c.free();
    }
  },
  /**
   * A curve exact through three ITS-90 fixed points for an instrument definition, and a reading
   * at the instrument's signal for readingK: { coefficients, report, signal, reading }.
   */
  fixedPointCurve(definition, fixedPoints, options, readingK) {
    const inst = api.instrument(definition);
    const c = fn('CalibrationCurve').throughFixedPoints(inst, fixedPoints, options);
    try {
      const signal = inst.signal(readingK);
      return { coefficients: { ...c.coefficients }, report: c.fixedPointReport, signal, reading: c.readingUncertainty(signal, 0) };
    } finally {
      c.free();
    }
  },

  // ---- spectral (non-grey) instruments (spectral.d.ts)
  /** A SpectralInstrument for this definition ({ response, conditions }), cached. */
  spectralInstrument(definition) {
    return preparedOf('SpectralInstrument', definition);
  },
  /** A two-column text table read by the package: { wavelengths (m), values, unit: 'm' }. */
  tableFromText(text, unit, kind) {
    return fn('SpectralInstrument').tableFromText(text, unit, kind);
  },
  /** The object temperature (K) behind a reading made with grey settings `setting`. */
  correctReading(instrument, indicatedK, setting) {
    return fn('correctReading')(instrument, indicatedK, setting);
  },
};
