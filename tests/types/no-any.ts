// Fails to compile if any export of the package's public surface is typed `any` (the generated
// .d.ts must give real types). `IsAny<T>` is true only for `any`.
import type * as QB from '../../pkg/quantaband.js';

type IsAny<T> = 0 extends 1 & T ? true : false;
type AnyParam<F> = F extends (...args: infer P) => unknown
  ? true extends { [K in keyof P]: IsAny<P[K]> }[number]
    ? true
    : false
  : false;
type AnyReturn<F> = F extends (...args: never[]) => infer R ? IsAny<R> : false;

/** Names of exports whose parameters or return type contain a top-level `any`. */
type Offenders = {
  [K in keyof typeof QB]: IsAny<(typeof QB)[K]> extends true
    ? K
    : AnyParam<(typeof QB)[K]> extends true
      ? K
      : AnyReturn<(typeof QB)[K]> extends true
        ? K
        : never;
}[keyof typeof QB];

// `initSync`/`default` (wasm-bindgen's loader) are typed by wasm-bindgen itself and are excluded.
type Checked = Exclude<Offenders, 'initSync' | 'default'>;
const noAnyExports: [Checked] extends [never] ? true : Checked = true;
export { noAnyExports };
