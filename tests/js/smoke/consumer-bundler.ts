// TypeScript consumer for bundlers (moduleResolution "bundler", see consumer.ts): the `.wasm`
// subpath and the `/web` entry type-check, and the subpath's value is narrowed before initSync,
// as the README's esbuild recipes do.
import init, { initSync, Spectrum } from 'quantaband/web';
import wasm from 'quantaband/quantaband_bg.wasm';

if (typeof wasm === 'string') {
  await init({ module_or_path: wasm }); // a file/asset loader gave its URL
} else {
  initSync({ module: wasm }); // a binary loader gave the bytes
}
await init({ module_or_path: wasm }); // init takes either

// @ts-expect-error the subpath is typed (a URL string or bytes), not `any`
const notANumber: number = wasm;

export { notANumber };
export const radiance: number = new Spectrum({ unit: 'um' }).point(10, 300);
