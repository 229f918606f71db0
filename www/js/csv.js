// CSV export (download through a Blob URL, no network) and a tolerant numeric CSV reader.

/** Quotes one CSV field when needed; numbers keep full round-trip precision. */
function field(v) {
  if (typeof v === 'number') return Number.isFinite(v) || Number.isNaN(v) ? String(v) : String(v);
  const s = String(v);
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** Builds CSV text: optional comment lines (prefixed "# "), a header row and data rows. */
export function toCsv(header, rows, comments = []) {
  const lines = comments.map((c) => `# ${c}`);
  lines.push(header.map(field).join(','));
  for (const r of rows) lines.push(r.map(field).join(','));
  return `${lines.join('\r\n')}\r\n`;
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

/**
 * Reads numeric rows from pasted text: separators comma, semicolon, tab or spaces; lines starting
 * with "#" and lines with no number at all (headers) are skipped. A malformed cell becomes NaN so
 * that the core reports it. Returns { rows, lines } with the 1-based source line of each row.
 */
export function parseNumericTable(text) {
  const rows = [];
  const lines = [];
  String(text).split(/\r?\n/).forEach((raw, k) => {
    const s = raw.trim();
    if (s === '' || s.startsWith('#')) return;
    const cells = s.split(/\s*[,;\t]\s*|\s+/).filter((c) => c !== '');
    const nums = cells.map((c) => Number(c.replace(/\u2212/g, '-')));
    if (nums.every((n) => Number.isNaN(n))) return; // header line
    rows.push(nums);
    lines.push(k + 1);
  });
  return { rows, lines };
}
