// Pins the TypeScript surface of the package (checked by `tsc -p tests/types`, strict). Each
// `@ts-expect-error` line proves a wrong call is rejected at compile time: if the declaration
// became looser, the directive would be unused and tsc would fail.
import {
  ERROR_CODES,
  QuantabandError,
  constants,
  convertSpectral,
  convertSpectralArray,
  convertTemperature,
  convertTemperatureArray,
  convertTemperatureDifference,
  spectralUnitKind,
  spectralDensity,
  spectralDensityArray,
  spectralDensityGrid,
  bandIntegral,
  bandIntegralArray,
  temperatureFromBandArray,
  boseEinstein,
  fermiDiracIntegral,
  boseEinsteinIntegral,
  modelSignal,
  objectTemperature,
  objectTemperatureArray,
  sakumaHattoriFit,
  its90Temperature,
  uncertaintyBudget,
  convertFrame,
} from '../../pkg/quantaband.js';
import type {
  Band,
  BudgetInput,
  FrameResult,
  InstrumentModel,
  MeasurementConditions,
  SakumaHattoriModel,
  SpectrumOptions,
  Constants,
  ErrorCode,
  SpectralKind,
  SpectralUnit,
  TemperatureUnit,
} from '../../pkg/quantaband.js';

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
const a2: Float64Array = convertTemperatureArray(new Float64Array([1, 2]), 'degC', 'K');
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

// ---- constants ------------------------------------------------------------------------------
const cs: Constants = constants();
const h: number = cs.planckH;
const c2: number = cs.c2Its90;
// @ts-expect-error no such constant
cs.planckConstant;
// @ts-expect-error constants are read-only
cs.planckH = 1;

// ---- spectra and bands -------------------------------------------------------------------
const spec: SpectrumOptions = { unit: 'um', quantity: 'photon', geometry: 'exitance', emissivity: 0.9, c2: 'its90' };
const d1: number = spectralDensity(spec, 10, 300);
const d2: Float64Array = spectralDensityArray({ unit: 'nm' }, new Float64Array([500]), 5800);
const d3: Float64Array = spectralDensityGrid({ unit: 'GHz' }, new Float64Array([1]), new Float64Array([2.725]));
const b1: number = bandIntegral({ unit: 'um' }, 8, 14, 300);
const b2: Float64Array = bandIntegralArray({ unit: 'um' }, 8, 14, new Float64Array([300, 400]));
const band: Band = { lower: 0.9, upper: 1.0 };
const b4: Float64Array = temperatureFromBandArray({ unit: 'um' }, 8, 14, new Float64Array([50]));
// @ts-expect-error the spectral unit is required
spectralDensity({ quantity: 'energy' }, 10, 300);
// @ts-expect-error misspelt option field
spectralDensity({ unit: 'um', emisivity: 0.5 }, 10, 300);
// @ts-expect-error emissivity is a number, not a string
spectralDensity({ unit: 'um', emissivity: '0.5' }, 10, 300);
// @ts-expect-error quantity literal
spectralDensity({ unit: 'um', quantity: 'photons' }, 10, 300);
// @ts-expect-error c2 convention literal
spectralDensity({ unit: 'um', c2: 'ITS-90' }, 10, 300);
// @ts-expect-error a band needs both limits
const badBand: Band = { lower: 1 };
// @ts-expect-error temperature must be a number
spectralDensity({ unit: 'um' }, 10, '300');

// ---- statistics -------------------------------------------------------------------------
const q1: number = boseEinstein(1);
const q2: number = fermiDiracIntegral(0.5, 0);
const q3: number = boseEinsteinIntegral(1.5, 1);
// @ts-expect-error Fermi–Dirac order must be -0.5, 0.5 or 1.5
fermiDiracIntegral(1, 0);

// ---- thermometry ------------------------------------------------------------------------
const point: InstrumentModel = { kind: 'spectralPoint', wavelength: 650, unit: 'nm' };
const table: InstrumentModel = { kind: 'response', wavelengths: [8, 14], values: new Float64Array([1, 1]), unit: 'um' };
const curve: SakumaHattoriModel = { kind: 'sakumaHattori', aM: 1e-5, bMK: 1.8e-4, c: 1e6 };
const cond: MeasurementConditions = {
  emissivity: 0.9,
  reflectedTemperatureK: 295,
  window: { transmittance: 0.9, temperatureK: 300 },
};
const t1: number = modelSignal(point, 1300);
const t2: number = objectTemperature(table, 50, cond);
const t3: number = objectTemperature(curve, 50);
const t4: Float64Array = objectTemperatureArray(curve, new Float64Array([50]), cond);
const fit = sakumaHattoriFit(new Float64Array([400, 600, 900]), new Float64Array([1, 2, 3]));
const fitCurve: SakumaHattoriModel = fit.curve;
const fitRes: Float64Array | undefined = fit.residualsK;
const t90: number = its90Temperature(10, 650, 'nm', 'gold').t90K;
const ub = uncertaintyBudget(curve, 50, cond, { emissivity: 0.02 });
const firstInput: BudgetInput | undefined = ub.entries[0]?.input;
const frame: FrameResult = convertFrame(curve, new Uint16Array(4), { gain: 0.01, offset: -100, output: 'float64' });
const frameT: Float32Array | Float64Array = frame.temperaturesK;
// @ts-expect-error unknown instrument kind
modelSignal({ kind: 'thermocouple' }, 300);
// @ts-expect-error a spectral point needs a wavelength unit, not a wavenumber unit
modelSignal({ kind: 'spectralPoint', wavelength: 1000, unit: 'cm-1' }, 300);
// @ts-expect-error misspelt condition field
objectTemperature(curve, 50, { emisivity: 0.9 });
// @ts-expect-error a window needs its temperature
objectTemperature(curve, 50, { window: { transmittance: 0.9 } });
// @ts-expect-error fixed point literal
its90Temperature(10, 650, 'nm', 'tin');
// @ts-expect-error frames are typed arrays, not plain arrays
convertFrame(curve, [1, 2, 3]);
// @ts-expect-error output element type literal
convertFrame(curve, new Uint16Array(4), { output: 'int16' });
// @ts-expect-error convertFrame needs a Sakuma–Hattori curve
convertFrame(point, new Uint16Array(4));

export { spec, d1, d2, d3, b1, b2, band, badBand, b4, q1, q2, q3, table, t1, t2, t3, t4, fitCurve, fitRes, t90, firstInput, frameT };
export { codes, describe, c0, c1, u, t, k, n1, n2, n3, a1, a2, s1, s2, h, c2 };
