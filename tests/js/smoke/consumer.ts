// A TypeScript consumer of the installed npm package, checked by the smoke test with `tsc` under
// strict, exactOptionalPropertyTypes and noUncheckedIndexedAccess, once with module/moduleResolution
// "nodenext" and once with "esnext"/"bundler" (tsconfig written by smoke.mjs). It proves the
// manifest's "types" conditions resolve and the declarations are real types: the smoke test also
// blanks every @ts-expect-error line and expects tsc to report an error on each following line.
import init, {
  CalibrationCurve,
  ERROR_CODES,
  Instrument,
  QuantabandError,
  Spectrum,
  convertTemperature,
  type ErrorCode,
  type FrameResult,
  type InstrumentDefinition,
} from 'quantaband';

const kelvin: number = convertTemperature(25, 'degC', 'K');
const spectrum = new Spectrum({ unit: 'um', emissivity: 0.95 });
const radiance: number = spectrum.point(10, 300);
const codes: readonly ErrorCode[] = ERROR_CODES;
const ready: Promise<void> = init();

// Every array-like the functions accept is accepted by the types.
const wavelengthsUm: readonly number[] = [8, 10, 12];
const fromReadonly: Float64Array = spectrum.points(wavelengthsUm, 300);
const fromFloat32: Float64Array = spectrum.points(new Float32Array([8, 10]), 300);
const intoOut: Float64Array = spectrum.points({ length: 2, 0: 8, 1: 10 }, 300, new Float64Array(2));

const definition: InstrumentDefinition = {
  model: { kind: 'response', wavelengths: [7.5, 8, 13, 14], values: [0, 1, 1, 0], unit: 'um' },
  conditions: { emissivity: 0.95, reflectedTemperatureK: 293.15 },
};
const camera = new Instrument(definition);
const curve = CalibrationCurve.fitInstrument(camera, 250, 600);
// The frame result follows the requested output precision.
const single: FrameResult<Float32Array> = curve.convertFrame(new Uint16Array(4), { gain: 1e-3 });
const double: Float64Array = curve.convertFrame(new Uint16Array(4), { output: 'float64' }).temperaturesK;

function describe(e: unknown): string {
  return e instanceof QuantabandError ? `${e.code}: ${e.message}` : String(e);
}

// @ts-expect-error a temperature value must be a number, not a string
convertTemperature('25', 'degC', 'K');
// @ts-expect-error exactOptionalPropertyTypes: an optional setting is omitted, never undefined
new Spectrum({ unit: 'um', emissivity: undefined });
// @ts-expect-error a single-precision frame is not a Float64Array
const wrongPrecision: Float64Array = curve.convertFrame(new Uint16Array(4)).temperaturesK;
// @ts-expect-error not a spectral unit
new Spectrum({ unit: 'microns' });

export { codes, describe, double, fromFloat32, fromReadonly, intoOut, kelvin, radiance, ready, single, wrongPrecision };
