// Size check of the shipped WebAssembly module: raw bytes and gzip bytes (Node zlib, level 9).
//
//   node tests/size/check.mjs [--report-only] [FILE.wasm]     (default: pkg/quantaband_bg.wasm)
//
// Budget (issue 11; issue 4 set 150 KB / 60 KB for the no_std build this replaced): raw <= 320 KB
// and gzip <= 128 KB for the full API, with 1 KB = 1000 bytes (the stricter reading). Exit 1 when the module is over either limit
// (--report-only: print the figures, never fail). For the package's own module it also writes
// the figures as JSON to target/size-report.json.
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { gzipSync, constants } from 'node:zlib';

export const RAW_LIMIT = 320_000;
export const GZIP_LIMIT = 128_000;

const args = process.argv.slice(2);
let reportOnly = false;
let fileArg;
for (const a of args) {
  if (a === '--report-only') reportOnly = true;
  else if (a.startsWith('--')) {
    console.error(`[size] unknown option ${a}`);
    process.exit(2);
  } else fileArg = a;
}

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..');
const file = resolve(fileArg ?? join(root, 'pkg', 'quantaband_bg.wasm'));
const bytes = readFileSync(file);
if (!WebAssembly.validate(bytes)) {
  console.error(`[size] ${file} is not a valid WebAssembly module`);
  process.exit(1);
}
const raw = bytes.length;
const gz = gzipSync(bytes, { level: constants.Z_BEST_COMPRESSION }).length;
const kb = (n) => `${(n / 1000).toFixed(1)} KB`;
const ok = raw <= RAW_LIMIT && gz <= GZIP_LIMIT;
console.log(
  `[size] ${file}: raw ${raw} B (${kb(raw)}), gzip-9 ${gz} B (${kb(gz)}); ` +
    `budget ${kb(RAW_LIMIT)} / ${kb(GZIP_LIMIT)} gzip -> ` +
    (ok
      ? `within budget (headroom ${RAW_LIMIT - raw} B raw, ${GZIP_LIMIT - gz} B gzip)`
      : `OVER BUDGET by ${Math.max(0, raw - RAW_LIMIT)} B raw, ${Math.max(0, gz - GZIP_LIMIT)} B gzip`),
);
if (file === join(root, 'pkg', 'quantaband_bg.wasm')) {
  mkdirSync(join(root, 'target'), { recursive: true });
  writeFileSync(
    join(root, 'target', 'size-report.json'),
    `${JSON.stringify({ file, raw, gzip: gz, rawLimit: RAW_LIMIT, gzipLimit: GZIP_LIMIT, ok }, null, 2)}\n`,
  );
}
process.exit(ok || reportOnly ? 0 : 1);
