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
} from '../../pkg/quantaband.js';
import type {
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

export { codes, describe, c0, c1, u, t, k, n1, n2, n3, a1, a2, s1, s2, h, c2 };
