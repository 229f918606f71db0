// A TypeScript consumer of the installed npm package (copied into the smoke test's scratch
// project and checked with `tsc --strict`, module/moduleResolution "nodenext"). It proves the
// manifest's "types" condition resolves and that the declarations are real types, not `any`:
// the smoke test also removes the @ts-expect-error line and expects tsc to fail.
import init, { ERROR_CODES, QuantabandError, Spectrum, convertTemperature } from 'quantaband';

const kelvin: number = convertTemperature(25, 'degC', 'K');
const radiance: number = new Spectrum({ unit: 'um', emissivity: 0.95 }).point(10, 300);
const codes: readonly string[] = ERROR_CODES;
const ready: Promise<void> = init();

function describe(e: unknown): string {
  return e instanceof QuantabandError ? `${e.code}: ${e.message}` : String(e);
}

// @ts-expect-error a temperature value must be a number, not a string
convertTemperature('25', 'degC', 'K');

export { codes, describe, kelvin, radiance, ready };
