// Size budget of the shipped WebAssembly module: raw bytes and gzip bytes (Node zlib, level 9).
//
//   node tests/size/check.mjs [FILE.wasm]     (default: pkg/quantaband_bg.wasm)
//
// Budget (project rule, issue 4): raw <= 150 KB and gzip <= 60 KB, with 1 KB = 1000 bytes (the
// stricter reading). Prints one line with the figures and exits 1 when either limit is exceeded.
// For the package's own module it also writes the figures as JSON to target/size-report.json.
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { gzipSync, constants } from 'node:zlib';

export const RAW_LIMIT = 150_000;
export const GZIP_LIMIT = 60_000;

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..');
const file = resolve(process.argv[2] ?? join(root, 'pkg', 'quantaband_bg.wasm'));
const bytes = readFileSync(file);
if (!WebAssembly.validate(bytes)) {
  console.error(`[size] ${file} is not a valid WebAssembly module`);
  process.exit(1);
}
const raw = bytes.length;
const gz = gzipSync(bytes, { level: constants.Z_BEST_COMPRESSION }).length;
const ok = raw <= RAW_LIMIT && gz <= GZIP_LIMIT;
const kb = (n) => `${(n / 1000).toFixed(1)} KB`;
console.log(
  `[size] ${file}: raw ${raw} B (${kb(raw)}, limit ${kb(RAW_LIMIT)}), gzip-9 ${gz} B (${kb(gz)}, limit ${kb(GZIP_LIMIT)}) -> ${ok ? 'within budget' : 'OVER BUDGET'}`,
);
if (file === join(root, 'pkg', 'quantaband_bg.wasm')) {
  mkdirSync(join(root, 'target'), { recursive: true });
  writeFileSync(
    join(root, 'target', 'size-report.json'),
    `${JSON.stringify({ file, raw, gzip: gz, rawLimit: RAW_LIMIT, gzipLimit: GZIP_LIMIT, ok }, null, 2)}\n`,
  );
}
process.exit(ok ? 0 : 1);
