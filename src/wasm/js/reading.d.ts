// ---- workflows from an indicated temperature (src/wasm/js/reading.js) ------------------------

/**
 * The instrument classes the workflows from an indicated temperature accept, by name: an
 * Instrument, and the spectral-table instrument class where the build has those bindings.
 */
export interface ReadingInstruments {
  Instrument: Instrument;
}

/** An instrument the workflows from an indicated temperature accept. */
export type ReadingInstrument = ReadingInstruments[keyof ReadingInstruments];

/** Emissivity from the reference-coating method, with the true temperature it gave. */
export interface ReferenceEmissivity {
  /** The surface's band emissivity. */
  readonly emissivity: number;
  /** The true surface temperature from the reference reading, K. */
  readonly temperatureK: number;
}

/**
 * Corrects a reading: the object temperature (K) under the instrument's conditions (grey for
 * an Instrument, spectral for a spectral-table instrument) from the temperature the instrument
 * indicated with its settings `setting` (its emissivity, reflected temperature and, if it has
 * them, path and window settings). The instrument's signal model or response must be that of
 * the instrument that made the reading.
 *
 * Follows the emissivity correction of ASTM E1933 and ISO 18434-1 (recalled, not quoted).
 */
export function correctReading(
  instrument: ReadingInstrument,
  indicatedTemperatureK: number,
  setting: MeasurementConditions,
): number;

/**
 * The reflected (surroundings) temperature, K, from a reading of a diffuse reflector (e.g.
 * crumpled foil) of emissivity reflectorEmissivity in [0, 1) at reflectorTemperatureK, placed
 * at the target and facing like it (reflector method, as in ASTM E1862). Uses only the
 * instrument's blackbody signal and `setting` (path and window from the setting); the
 * instrument's own conditions are not used.
 */
export function reflectedTemperature(
  instrument: ReadingInstrument,
  indicatedTemperatureK: number,
  setting: MeasurementConditions,
  reflectorEmissivity: number,
  reflectorTemperatureK: number,
): number;

/**
 * The surface's band emissivity in (0, 1] from a reading and its true temperature measured by
 * a contact (reference) thermometer (contact method, as in ASTM E1933). The surface must be
 * clearly hotter or colder than reflectedTemperatureK. The instrument's own conditions are not
 * used.
 */
export function emissivityByContact(
  instrument: ReadingInstrument,
  indicatedTemperatureK: number,
  setting: MeasurementConditions,
  trueTemperatureK: number,
  reflectedTemperatureK: number,
): number;

/**
 * The surface's band emissivity from two readings taken with the same setting: one of a
 * reference coating or tape of known emissivity on the surface (giving the true temperature)
 * and one of the bare surface next to it (reference-material method, as in ASTM E1933). The
 * instrument's own conditions are not used.
 */
export function emissivityByReference(
  instrument: ReadingInstrument,
  referenceReadingK: number,
  surfaceReadingK: number,
  setting: MeasurementConditions,
  referenceEmissivity: number,
  reflectedTemperatureK: number,
): ReferenceEmissivity;
