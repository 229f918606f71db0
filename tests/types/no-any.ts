// Fails to compile if anything a user touches is typed `any`: every export, and every method
// and property of the classes. `IsAny<T>` is true only for `any`.
import type * as QB from '../../pkg/quantaband.js';

type IsAny<T> = 0 extends 1 & T ? true : false;
type AnyParam<F> = F extends (...args: infer P) => unknown
  ? true extends { [K in keyof P]: IsAny<P[K]> }[number]
    ? true
    : false
  : false;
type AnyReturn<F> = F extends (...args: never[]) => infer R ? IsAny<R> : false;
type HasAny<F> = IsAny<F> extends true ? true : AnyParam<F> extends true ? true : AnyReturn<F>;

/** Names of exports whose type, parameters or return type contain a top-level `any`. */
type Offenders = { [K in keyof typeof QB]: HasAny<(typeof QB)[K]> extends true ? K : never }[keyof typeof QB];
/** Members of an instance type with `any` in them. */
type MemberOffenders<T> = { [K in keyof T]: HasAny<T[K]> extends true ? K : never }[keyof T];

const noAnyExports: [Offenders] extends [never] ? true : Offenders = true;
const noAnySpectrum: [MemberOffenders<QB.Spectrum>] extends [never] ? true : MemberOffenders<QB.Spectrum> = true;
const noAnyInstrument: [MemberOffenders<QB.Instrument>] extends [never] ? true : MemberOffenders<QB.Instrument> = true;
const noAnyCurve: [MemberOffenders<QB.CalibrationCurve>] extends [never] ? true : MemberOffenders<QB.CalibrationCurve> = true;
const noAnyStatics: [MemberOffenders<typeof QB.CalibrationCurve>] extends [never] ? true : MemberOffenders<typeof QB.CalibrationCurve> = true;
export { noAnyExports, noAnySpectrum, noAnyInstrument, noAnyCurve, noAnyStatics };
