// Pins the TypeScript surface of the spectral-table area (SpectralInstrument, text tables, the
// workflows from an indicated temperature, the per-pixel frame corrections), strict with
// exactOptionalPropertyTypes. Each `@ts-expect-error` line proves a wrong call is rejected.
import {
  CalibrationCurve,
  Instrument,
  SpectralInstrument,
  correctReading,
  emissivityByContact,
  emissivityByReference,
  reflectedTemperature,
} from '../../target/pkg-full/quantaband.js';
import type * as QB from '../../target/pkg-full/quantaband.js';

const emissivity: QB.SpectralTable = { wavelengths: [8, 10, 14], values: [0.9, 0.5, 0.7], unit: 'um', ends: 'constant' };
const def: QB.SpectralInstrumentDefinition = {
  response: { wavelengths: new Float64Array([8, 14]), values: [1, 1], unit: 'um', quantity: 'photon' },
  conditions: {
    emissivity,
    reflectedTemperatureK: 295,
    pathTransmittance: 0.95,
    pathTemperatureK: 290,
    window: { transmittance: { wavelengths: [7, 15], values: [0.8, 0.9], unit: 'um' }, reflectance: 0.04, temperatureK: 300, reflectedTemperatureK: 301 },
  },
  c2: 'codata2018',
};
const si = new SpectralInstrument(def);
const s: number = si.measuredSignal(400);
const t: number = si.objectTemperature(s);
const terms: QB.SignalTerms = si.signalTerms(t);
const eff: QB.BandEffective = si.bandEffective(400);
const sens: QB.SpectralSensitivities = si.sensitivities(s);
const bulk: Float64Array = si.objectTemperatures([s, s], new Float64Array(2));
const budget: QB.SpectralUncertaintyBudget = si.uncertaintyBudget(s, { signal: 0.1, emissivityScale: { standardUncertainty: 0.02, degreesOfFreedom: 8 }, reflectedTemperatureK: 2 }, { correlations: [{ inputs: ['reflectedTemperatureK', 'pathTemperatureK'], coefficient: 0.5 }], coverageFactor: 2 });
const row: QB.SpectralBudgetInput = budget.entries[0]!.input;
// @ts-expect-error the grey key "emissivity" is not an input of a spectral budget
si.uncertaintyBudget(s, { emissivity: 0.01 });
// @ts-expect-error coverageProbability and coverageFactor exclude each other
si.uncertaintyBudget(s, {}, { coverageProbability: 0.95, coverageFactor: 2 });
const x: number = terms.object + terms.windowEmitted + eff.emissivity + sens.emissivityScale + (bulk[0] ?? 0) + budget.expandedUncertaintyK + row.length;
// @ts-expect-error result fields are readonly
terms.signal = 1;
// @ts-expect-error ends is "reject" or "constant"
const badEnds: QB.SpectralTable = { wavelengths: [1, 2], values: [0, 1], unit: 'um', ends: 'linear' };
// @ts-expect-error a table needs a wavelength unit, not a wavenumber unit
const badUnit: QB.SpectralTable = { wavelengths: [1, 2], values: [0, 1], unit: 'cm-1' };
// @ts-expect-error the response has no ends
new SpectralInstrument({ response: { wavelengths: [8, 14], values: [1, 1], unit: 'um', ends: 'constant' } });
// @ts-expect-error a window needs its temperature
new SpectralInstrument({ response: { wavelengths: [8, 14], values: [1, 1], unit: 'um' }, conditions: { window: { transmittance: 0.9 } } });

const text: QB.TextTable = SpectralInstrument.tableFromText('1000, 0.5\n2000, 0.6', 'cm-1', 'transmittance');
const w: Float64Array = text.wavelengths;
new SpectralInstrument({ response: { wavelengths: [8, 14], values: [1, 1], unit: 'um' }, conditions: { pathTransmittance: { ...text, ends: 'reject' }, pathTemperatureK: 290 } });
// @ts-expect-error kind is one of four names
SpectralInstrument.tableFromText('8, 1\n9, 1', 'um', 'absorptance');

const grey = new Instrument({ model: { kind: 'spectralPoint', wavelength: 10, unit: 'um' }, conditions: { emissivity: 0.8, reflectedTemperatureK: 310 } });
const c1: number = correctReading(grey, 350, { emissivity: 0.95, reflectedTemperatureK: 293.15 });
const c2: number = correctReading(si, 350, { emissivity: 0.9, reflectedTemperatureK: 293.15 });
const tr: number = reflectedTemperature(grey, 301.5, { emissivity: 1 }, 0.04, 295);
const ec: number = emissivityByContact(si, 340, { emissivity: 1 }, 352, 295);
const er: QB.ReferenceEmissivity = emissivityByReference(grey, 360, 318, { emissivity: 0.95, reflectedTemperatureK: 295 }, 0.95, 295);
const y: number = c1 + c2 + tr + ec + er.emissivity + er.temperatureK + x + (w[0] ?? 0);
// @ts-expect-error the setting is required
correctReading(grey, 350);
// @ts-expect-error not an instrument
correctReading({ model: 1 }, 350, { emissivity: 1 });

const curve = new CalibrationCurve({ aM: 1e-5, bMK: 1.8e-4, c: 1e6 });
const frame = curve.convertFrame(new Uint16Array(4), { gain: 10, pixelGain: [1, 1, 1, 1], pixelOffset: new Float64Array(4), badPixels: new Uint8Array(4), emissivity: [0.9, 0.9, 0.9, 0.9] });
const inv: number = frame.invalid + y;
// @ts-expect-error the mask is an array, not a flag
curve.convertFrame(new Uint16Array(4), { badPixels: true });
void inv;
si.free();
grey.free();
curve.free();
void badEnds;
void badUnit;
