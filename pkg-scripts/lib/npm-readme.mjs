// Renders the npm package's README (pkg/README.md, the npm page) from pkg-scripts/npm-readme.md,
// pulling the parts it shares with the repository README out of README.md so the two cannot
// drift. Called by write-pkg-json.mjs during the build; tests/js/npm-readme.test.mjs calls it
// again and compares.
//
//   node pkg-scripts/lib/npm-readme.mjs [PKG_DIR]     prints the rendering
//
// Directives in the source (HTML comments, one per line):
//   <!-- @include README.md section=NAME -->            text between BEGIN NAME … / END NAME
//   <!-- @include README.md heading="## Title" -->      text under that heading, to the next
//                                                       heading of the same or a higher level
//   … table                                             only the first Markdown table of it
//   … paragraph="Lead text"                             only the paragraph starting with it
// Placeholders: {{wasm.raw}}, {{wasm.gzip}} (sizes of PKG_DIR/quantaband_bg.wasm).
// Every HTML comment is removed from the result (the source's notes, the directives, the
// repository's BEGIN/END markers); a directive that matches nothing fails the build.
import { readFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { gzipSync } from 'node:zlib';

const here = dirname(fileURLToPath(import.meta.url));

function fail(msg) {
  throw new Error(`npm README: ${msg}`);
}

/** The text between `<!-- BEGIN name (…) -->` and `<!-- END name -->`. */
function markerSection(text, name) {
  const begin = new RegExp(`^<!-- BEGIN ${name}\\b[^>]*-->\\s*$`, 'm').exec(text);
  if (!begin) fail(`README.md has no BEGIN ${name} marker`);
  const rest = text.slice(begin.index + begin[0].length);
  const end = new RegExp(`^<!-- END ${name} -->\\s*$`, 'm').exec(rest);
  if (!end) fail(`README.md has no END ${name} marker`);
  return rest.slice(0, end.index);
}

/**
 * The text under a heading line (exact, and the only such line), up to the next heading of the
 * same or a higher level outside code fences (fences are tracked from the heading on, so an
 * unbalanced fence elsewhere in the file does not matter).
 */
function headingSection(text, heading) {
  const level = /^#+/.exec(heading)?.[0].length;
  if (!level) fail(`not a heading: ${heading}`);
  const lines = text.split('\n');
  const at = lines.flatMap((l, i) => (l === heading ? [i] : []));
  if (at.length !== 1) fail(`README.md has ${at.length} lines "${heading}" (want exactly 1)`);
  let inFence = false;
  const out = [];
  for (const line of lines.slice(at[0] + 1)) {
    if (/^(```|~~~)/.test(line)) inFence = !inFence;
    const h = !inFence && /^(#+)\s/.exec(line);
    if (h && h[1].length <= level) break;
    out.push(line);
  }
  return out.join('\n');
}

/** The paragraph (blank-line separated, outside code fences) that starts with `lead`. */
function paragraph(text, lead) {
  const blocks = [];
  let cur = [];
  let inFence = false;
  for (const line of text.split('\n')) {
    if (/^(```|~~~)/.test(line)) inFence = !inFence;
    if (!inFence && line.trim() === '') {
      if (cur.length) blocks.push(cur.join('\n'));
      cur = [];
    } else cur.push(line);
  }
  if (cur.length) blocks.push(cur.join('\n'));
  const found = blocks.filter((b) => b.startsWith(lead));
  if (found.length !== 1) fail(`${found.length} paragraphs start with "${lead}" (want exactly 1)`);
  return found[0];
}

/** The first Markdown table (consecutive lines starting with `|`). */
function firstTable(text) {
  const lines = text.split('\n');
  const i = lines.findIndex((l) => l.startsWith('|'));
  if (i < 0) fail('no table found');
  let j = i;
  while (j < lines.length && lines[j].startsWith('|')) j++;
  return lines.slice(i, j).join('\n');
}

function formatKB(bytes) {
  return `${(bytes / 1000).toFixed(1)} KB`;
}

/**
 * Renders the npm README. `root` is the repository, `pkgDir` the built package (for the .wasm
 * size); `source` and `readme` default to the files in the repository.
 */
export function renderNpmReadme({
  root = resolve(here, '..', '..'),
  pkgDir = join(root, 'pkg'),
  source = readFileSync(join(root, 'pkg-scripts', 'npm-readme.md'), 'utf8'),
  readme = readFileSync(join(root, 'README.md'), 'utf8'),
} = {}) {
  const wasm = readFileSync(join(pkgDir, 'quantaband_bg.wasm'));
  let text = source.replace(/^<!-- @include (\S+) (.*?) -->$/gm, (_, file, args) => {
    if (file !== 'README.md') fail(`can only include README.md, not ${file}`);
    const opts = {};
    for (const m of args.matchAll(/(\w+)(?:=(?:"([^"]*)"|(\S+)))?/g)) opts[m[1]] = m[2] ?? m[3] ?? true;
    let part;
    if (opts.section) part = markerSection(readme, opts.section);
    else if (opts.heading) part = headingSection(readme, opts.heading);
    else fail(`include needs section= or heading=: ${args}`);
    if (opts.paragraph) part = paragraph(part, opts.paragraph);
    if (opts.table) part = firstTable(part);
    return part.trim();
  });
  if (/@include/.test(text.replace(/<!--[\s\S]*?-->/g, ''))) fail('an @include line was not recognised');
  text = text
    .replaceAll('{{wasm.raw}}', formatKB(wasm.length))
    .replaceAll('{{wasm.gzip}}', formatKB(gzipSync(wasm, { level: 9 }).length));
  const unknown = text.match(/\{\{[^}]*\}\}/);
  if (unknown) fail(`unknown placeholder ${unknown[0]}`);
  // Remove every HTML comment outside code fences, then tidy the blank lines they leave.
  const parts = text.split(/^(```[\s\S]*?^```)$/m);
  text = parts.map((p, i) => (i % 2 === 1 ? p : p.replace(/<!--[\s\S]*?-->\n?/g, ''))).join('');
  text = text.replace(/\n{3,}/g, '\n\n').trim();
  return `${text}\n`;
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const pkgDir = process.argv[2] ? resolve(process.argv[2]) : undefined;
  process.stdout.write(renderNpmReadme(pkgDir ? { pkgDir } : {}));
}
