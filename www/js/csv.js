// CSV export: UTF-8 with a byte-order mark (so that spreadsheets read µ, ⁻, ², · correctly),
// comment lines first, ONE header row whose names are unique, numbers at full precision with a
// decimal point, and an empty cell for an undefined value. Downloaded through a Blob URL (no
// network).

/** Quotes one CSV field when needed; a non-finite or missing number is an empty cell. */
function field(v) {
  if (v === undefined || v === null) return '';
  if (typeof v === 'number') return Number.isFinite(v) ? String(v) : '';
  const s = String(v);
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** Builds CSV text: a BOM, comment lines ("# …"), the header row, data rows. Headers must be unique. */
export function toCsv(header, rows, comments = []) {
  const seen = new Set();
  for (const h of header) {
    if (seen.has(h)) throw new Error(`CSV header "${h}" appears twice`);
    seen.add(h);
  }
  const lines = comments.map((c) => field(`# ${c}`));
  lines.push(header.map(field).join(','));
  for (const r of rows) lines.push(r.map(field).join(','));
  return `\uFEFF${lines.join('\r\n')}\r\n`;
}

/** Offers `text` as a file download via a temporary Blob URL. */
export function download(name, text, type = 'text/csv') {
  const url = URL.createObjectURL(new Blob([text], { type: `${type};charset=utf-8` }));
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  a.style.display = 'none';
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 5000);
}
