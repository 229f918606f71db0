// Pins the TypeScript surface of the package (checked by `tsc -p tests/types`, strict, with
// exactOptionalPropertyTypes). Each `@ts-expect-error` line proves a wrong call is rejected at
// compile time: if the declaration became looser, the directive would be unused and tsc would
// fail.
import init, {
  CalibrationCurve,
  ERROR_CODES,
  Instrument,
  MAX_ARRAY_LENGTH,
  QuantabandError,
  Spectrum,
  boseEinstein,
  boseEinsteinIntegral,
  constants,
  convertSpectral,
  convertSpectralArray,
  convertTemperature,
  convertTemperatureArray,
  convertTemperatureDifference,
  fermiDiracArray,
  fermiDiracIntegral,
  initSync,
  its90Temperature,
  spectralUnitKind,
  twoColourTemperature,
  correctReading,
  emissivityByContact,
  emissivityByReference,
  reflectedTemperature,
} from '../../pkg/quantaband.js';
import type {
  BudgetInput,
  Constants,
  ErrorCode,
  FitReport,
  FrameResult,
  InstrumentDefinition,
  InstrumentModel,
  MeasurementConditions,
  NumberArray,
  RatioReading,
  ReadingInstrument,
  ReferenceEmissivity,
  SakumaHattoriModel,
  SpectralKind,
  SpectralUnit,
  SpectrumSettings,
  SpectrumUnits,
  TemperatureUnit,
  UncertaintyBudget,
} from '../../pkg/quantaband.js';

// ---- initialisation -------------------------------------------------------------------------
const ready: Promise<void> = init();
initSync({ module: new Uint8Array(0) });
// @ts-expect-error initSync takes an options object
initSync(new Uint8Array(0));
const limit: number = MAX_ARRAY_LENGTH;

// ---- errors ---------------------------------------------------------------------------------
const codes: readonly ErrorCode[] = ERROR_CODES;
function describe(e: unknown): string {
  if (e instanceof QuantabandError) {
    const code: ErrorCode = e.code;
    const index: number | undefined = e.index;
    const name: 'QuantabandError' = e.name;
    return `${name} ${code} ${index ?? ''} ${e.message}`;
  }
  return String(e);
}
const c0: ErrorCode = 'NON_FINITE';
const cBoundary: ErrorCode[] = ['WRONG_TYPE', 'DETACHED_BUFFER', 'DISPOSED', 'NOT_INITIALIZED', 'TOO_LARGE'];
// @ts-expect-error not an error code
const c1: ErrorCode = 'NOT_A_CODE';
// @ts-expect-error ERROR_CODES is read-only
ERROR_CODES.push('NON_FINITE');

// ---- units ----------------------------------------------------------------------------------
const u: SpectralUnit = 'µm';
const t: TemperatureUnit = 'degC';
const k: SpectralKind = spectralUnitKind('cm-1');
const n1: number = convertSpectral(10, 'um', 'cm-1');
const n2: number = convertTemperature(25, 'degC', 'K');
const n3: number = convertTemperatureDifference(9, 'degF', 'K');
const a1: Float64Array = convertSpectralArray(new Float64Array([1, 2]), 'nm', 'um');
const a2: Float64Array = convertTemperatureArray([1, 2] as readonly number[], 'degC', 'K', new Float64Array(2));
// @ts-expect-error unknown spectral unit literal
convertSpectral(10, 'furlong', 'nm');
// @ts-expect-error a temperature unit is not a spectral unit
convertSpectral(10, 'K', 'nm');
// @ts-expect-error value must be a number
convertSpectral('10', 'um', 'nm');
// @ts-expect-error lower-case k is not a temperature unit
convertTemperature(300, 'k', 'degC');
// @ts-expect-error missing argument
convertTemperature(300, 'K');
// @ts-expect-error the result is a number, not a string
const s1: string = convertSpectral(1, 'eV', 'nm');
// @ts-expect-error bulk conversion returns a Float64Array
const s2: number[] = convertSpectralArray(new Float64Array([1]), 'nm', 'um');
// @ts-expect-error out must be a Float64Array
convertSpectralArray([1], 'nm', 'um', new Float32Array(1));

// ---- constants ------------------------------------------------------------------------------
const cs: Constants = constants();
const h: number = cs.planckH;
const c2: number = cs.c2Its90;
// @ts-expect-error no such constant
cs.planckConstant;
// @ts-expect-error constants are read-only
cs.planckH = 1;

// ---- spectra --------------------------------------------------------------------------------
const settings: SpectrumSettings = { unit: 'um', quantity: 'photon', geometry: 'exitance', emissivity: 0.9, c2: 'its90', densityUnit: 'nm' };
const spectrum = new Spectrum(settings);
const units: SpectrumUnits = spectrum.units;
const per: string = spectrum.units.density;
const d1: number = spectrum.point(10, 300);
// every array-like of numbers is accepted: plain, readonly, typed arrays of any numeric type
const ro: readonly number[] = [8, 10, 12];
const d2: Float64Array = spectrum.points(ro, 300);
const d3: Float64Array = spectrum.points(new Float32Array([10]), 300, new Float64Array(1));
const d4: Float64Array = spectrum.points(new Uint16Array([10]), 300);
const arr: NumberArray = new Int32Array(2);
const b1: number = spectrum.band(8, 14, 300);
const b2: Float64Array = spectrum.bands(8, 14, [300, 400]);
const tt: number = spectrum.temperature(10, 9.9);
const tb: number = spectrum.brightnessTemperature(10, 9.9);
const tr: number = spectrum.bandRatioTemperature(0.9, 1, 1, 1.1, 0.5);
spectrum.free();
// @ts-expect-error the spectral unit is required
new Spectrum({ quantity: 'energy' });
// @ts-expect-error misspelt settings field
new Spectrum({ unit: 'um', emisivity: 0.5 });
// @ts-expect-error emissivity is a number, not a string
new Spectrum({ unit: 'um', emissivity: '0.5' });
// @ts-expect-error quantity literal
new Spectrum({ unit: 'um', quantity: 'photons' });
// @ts-expect-error c2 convention literal
new Spectrum({ unit: 'um', c2: 'ITS-90' });
// @ts-expect-error exactOptionalPropertyTypes: an optional field is left out, not undefined
const undefinedField: SpectrumSettings = { unit: 'um', emissivity: undefined };
// @ts-expect-error temperature must be a number
spectrum.point(10, '300');
// @ts-expect-error bigint arrays are not number arrays
spectrum.points(new BigInt64Array(1), 300);
// @ts-expect-error a string is not an array of numbers
spectrum.points('1,2', 300);
// @ts-expect-error settings are read-only
spectrum.settings.emissivity = 0.5;

// ---- statistics -----------------------------------------------------------------------------
const q1: number = boseEinstein(1);
const q2: number = fermiDiracIntegral(0.5, 0);
const q3: number = boseEinsteinIntegral(1.5, 1);
const q4: Float64Array = fermiDiracArray(new Float32Array([0, 1]));
// @ts-expect-error Fermi–Dirac order must be -0.5, 0.5 or 1.5
fermiDiracIntegral(1, 0);

// ---- thermometry ----------------------------------------------------------------------------
const point: InstrumentModel = { kind: 'spectralPoint', wavelength: 650, unit: 'nm' };
const table: InstrumentModel = { kind: 'response', wavelengths: [8, 14], values: new Float32Array([1, 1]), unit: 'um' };
const curveModel: SakumaHattoriModel = { kind: 'sakumaHattori', aM: 1e-5, bMK: 1.8e-4, c: 1e6 };
const cond: MeasurementConditions = {
  emissivity: 0.9,
  reflectedTemperatureK: 295,
  window: { transmittance: 0.9, temperatureK: 300 },
};
const definition: InstrumentDefinition = { model: table, conditions: cond };
const inst = new Instrument(definition);
const t1: number = inst.signal(1300);
const t2: number = inst.objectTemperature(50);
const t3: Float64Array = inst.objectTemperatures([50, 60]);
const other: Instrument = inst.withConditions({ emissivity: 0.5, reflectedTemperatureK: 300 });
const ub: UncertaintyBudget = inst.uncertaintyBudget(50, { emissivity: 0.02 });
const firstInput: BudgetInput | undefined = ub.entries[0]?.input;
// The workflows from an indicated temperature, with the package's grey Instrument.
const readingInst: ReadingInstrument = inst;
const corrected: number = correctReading(readingInst, 350, { emissivity: 0.95, reflectedTemperatureK: 293 });
const tRefl: number = reflectedTemperature(inst, 300, { emissivity: 1 }, 0.03, 296);
const eContact: number = emissivityByContact(inst, 350, { emissivity: 1 }, 360, 293);
const eRef: ReferenceEmissivity = emissivityByReference(inst, 355, 350, { emissivity: 1 }, 0.95, 293);
// @ts-expect-error the workflows take an instrument object, not a definition
correctReading(definition, 350, { emissivity: 1 });
// @ts-expect-error the setting is required
emissivityByContact(inst, 350);
const rr: RatioReading = new Instrument({ model: point }).ratioTemperature(other, 0.5);
const two: RatioReading = twoColourTemperature(0.9, 1.05, 'um', 0.5, 1);
const t90: number = its90Temperature(10, 650, 'nm', 'gold').t90K;
const fit = CalibrationCurve.fit([400, 600, 900], new Float64Array([1, 2, 3]), { c2: 'its90' });
const report: FitReport | undefined = fit.fitReport;
const residuals: Float64Array | undefined = fit.fitReport?.residualsK;
const aM: number = fit.coefficients.aM;
const curve = new CalibrationCurve({ aM: 1e-5, bMK: 1.8e-4, c: 1e6 });
const fromModel = CalibrationCurve.fitInstrument(inst, 250, 600);
// the frame's element type follows `output`
const f32: FrameResult<Float32Array> = curve.convertFrame(new Uint16Array(4), { gain: 0.01, offset: -100, conditions: cond });
const f64: FrameResult<Float64Array> = curve.convertFrame(new Float32Array(4), { output: 'float64' });
const fOut: Float32Array = curve.convertFrame(new Uint16Array(4), { out: new Float32Array(4) }).temperaturesK;
const fEps: FrameResult<Float64Array> = curve.convertFrame(new Float64Array(4), { output: 'float64', emissivity: [1, 1, 1, 1], out: new Float64Array(4) });
// @ts-expect-error unknown instrument kind
new Instrument({ model: { kind: 'thermocouple' } });
// @ts-expect-error a spectral point needs a wavelength unit, not a wavenumber unit
new Instrument({ model: { kind: 'spectralPoint', wavelength: 1000, unit: 'cm-1' } });
// @ts-expect-error misspelt condition field
new Instrument({ model: curveModel, conditions: { emisivity: 0.9 } });
// @ts-expect-error a window needs its temperature
new Instrument({ model: curveModel, conditions: { window: { transmittance: 0.9 } } });
// @ts-expect-error the argument is a definition { model, conditions }, not a model
new Instrument(curveModel);
// @ts-expect-error fixed point literal
its90Temperature(10, 650, 'nm', 'platinum');
// @ts-expect-error frames are typed arrays, not plain arrays
curve.convertFrame([1, 2, 3]);
// @ts-expect-error output element type literal
curve.convertFrame(new Uint16Array(4), { output: 'int16' });
// @ts-expect-error a float64 frame cannot be written into a Float32Array
curve.convertFrame(new Uint16Array(4), { output: 'float64', out: new Float32Array(4) });
// @ts-expect-error a float64 result is not a Float32Array
const wrongFrame: Float32Array = curve.convertFrame(new Uint16Array(4), { output: 'float64' }).temperaturesK;
// @ts-expect-error fits take an Instrument, not a model object
CalibrationCurve.fitInstrument(curveModel, 250, 600);
// @ts-expect-error ratioTemperature's channel 2 is an Instrument
inst.ratioTemperature(point, 0.5);

export { ready, limit, codes, describe, c0, cBoundary, c1, u, t, k, n1, n2, n3, a1, a2, s1, s2, h, c2 };
export { units, per, d1, d2, d3, d4, arr, b1, b2, tt, tb, tr, undefinedField, q1, q2, q3, q4 };
export { t1, t2, t3, firstInput, rr, two, t90, report, residuals, aM, fromModel, f32, f64, fOut, fEps, wrongFrame };
