// Node.js entry of the quantaband package (selected by the "node" export condition).
//
// The `--target web` glue (quantaband.js) loads its .wasm with fetch(), which Node's fetch cannot
// do for a file: URL. This entry reads the bytes from disk and instantiates the module
// synchronously at import time, so in Node every export is ready to call right after
// `import { … } from 'quantaband'`. Calling the default `init()` afterwards is harmless: the glue
// returns the already-instantiated module.
import { readFileSync } from 'node:fs';
import { initSync } from './quantaband.js';

initSync({ module: readFileSync(new URL('./quantaband_bg.wasm', import.meta.url)) });

export * from './quantaband.js';
export { default } from './quantaband.js';
