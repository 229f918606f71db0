// Prints the wasm-opt `--enable-…` flags for the features a module declares in its
// `target_features` custom section (written by rustc/LLVM, kept by wasm-bindgen).
//
//   node pkg-scripts/lib/wasm-features.mjs FILE.wasm        -> "--enable-simd --enable-sign-ext …"
//   node pkg-scripts/lib/wasm-features.mjs --list FILE.wasm -> one "+feature" per line
//
// Passing exactly the declared features (never `-all`) keeps wasm-opt from emitting instructions
// the engines that run the module were not promised. Exits 1 when the section is missing or a
// feature has no known wasm-opt flag, so a toolchain change is noticed instead of silently
// optimising for the MVP feature set.
import { readFileSync } from 'node:fs';

const FLAG = {
  'atomics': '--enable-threads',
  'bulk-memory': '--enable-bulk-memory',
  'bulk-memory-opt': '--enable-bulk-memory-opt',
  'call-indirect-overlong': '--enable-call-indirect-overlong',
  'exception-handling': '--enable-exception-handling',
  'extended-const': '--enable-extended-const',
  'fp16': '--enable-fp16',
  'gc': '--enable-gc',
  'memory64': '--enable-memory64',
  'multimemory': '--enable-multimemory',
  'multivalue': '--enable-multivalue',
  'mutable-globals': '--enable-mutable-globals',
  'nontrapping-fptoint': '--enable-nontrapping-float-to-int',
  'reference-types': '--enable-reference-types',
  'relaxed-simd': '--enable-relaxed-simd',
  'sign-ext': '--enable-sign-ext',
  'simd128': '--enable-simd',
  'tail-call': '--enable-tail-call',
};

/** Reads an unsigned LEB128 number at `pos`; returns [value, nextPos]. */
function uleb(bytes, pos) {
  let value = 0;
  let shift = 0;
  for (;;) {
    if (pos >= bytes.length) throw new Error('truncated LEB128');
    const b = bytes[pos++];
    value += (b & 0x7f) * 2 ** shift;
    if ((b & 0x80) === 0) return [value, pos];
    shift += 7;
    if (shift > 35) throw new Error('LEB128 too long');
  }
}

/** Returns the declared features as [{prefix, name}] or null when the section is absent. */
export function targetFeatures(bytes) {
  const magic = [0x00, 0x61, 0x73, 0x6d];
  if (bytes.length < 8 || magic.some((m, i) => bytes[i] !== m)) throw new Error('not a wasm module');
  const dec = new TextDecoder();
  let pos = 8;
  while (pos < bytes.length) {
    const id = bytes[pos++];
    let size;
    [size, pos] = uleb(bytes, pos);
    const end = pos + size;
    if (end > bytes.length) throw new Error('section runs past the end of the file');
    if (id === 0) {
      let [nlen, p] = uleb(bytes, pos);
      const name = dec.decode(bytes.subarray(p, p + nlen));
      p += nlen;
      if (name === 'target_features') {
        let count;
        [count, p] = uleb(bytes, p);
        const out = [];
        for (let i = 0; i < count; i++) {
          const prefix = String.fromCharCode(bytes[p++]);
          let flen;
          [flen, p] = uleb(bytes, p);
          out.push({ prefix, name: dec.decode(bytes.subarray(p, p + flen)) });
          p += flen;
        }
        return out;
      }
    }
    pos = end;
  }
  return null;
}

const isMain = import.meta.url === new URL(`file://${process.argv[1]}`).href;
if (isMain) {
  const args = process.argv.slice(2);
  const list = args[0] === '--list';
  const file = list ? args[1] : args[0];
  if (!file) {
    console.error('usage: wasm-features.mjs [--list] FILE.wasm');
    process.exit(2);
  }
  const feats = targetFeatures(readFileSync(file));
  if (feats === null) {
    console.error(`${file}: no target_features section (was the module built with strip = true?)`);
    process.exit(1);
  }
  const used = feats.filter((f) => f.prefix === '+' || f.prefix === '=');
  if (list) {
    for (const f of feats) console.log(`${f.prefix}${f.name}`);
  } else {
    const unknown = used.filter((f) => !(f.name in FLAG)).map((f) => f.name);
    if (unknown.length) {
      console.error(`${file}: no wasm-opt flag known for feature(s): ${unknown.join(', ')}`);
      process.exit(1);
    }
    console.log(used.map((f) => FLAG[f.name]).join(' '));
  }
}
