// Shared set-up for the page's browser tests: launches Debian Chromium through playwright-core,
// opens dist/quantaband.html from disk (file://), and records console errors and every request.
import { chromium } from 'playwright-core';
import { existsSync, mkdirSync, readFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

export const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..');
export const PAGE = process.env.QB_PAGE ? resolve(process.env.QB_PAGE) : resolve(ROOT, 'dist', 'quantaband.html');
export const PAGE_URL = pathToFileURL(PAGE).href;
export const ARTIFACTS = resolve(ROOT, 'tests', 'artifacts');
mkdirSync(ARTIFACTS, { recursive: true });

const ARGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

export async function launch() {
  if (!existsSync(PAGE)) throw new Error(`${PAGE} is missing: run bash pkg-scripts/build.sh (or node www/build.mjs) first`);
  return chromium.launch({ executablePath: '/usr/bin/chromium', args: ARGS });
}

/**
 * Opens the page (optionally with a fragment) in a fresh context and waits until it is ready.
 * Returns { page, context, requests, consoleErrors, readyMs }.
 */
export async function open(browser, fragment = '', { viewport = { width: 1280, height: 900 } } = {}) {
  const context = await browser.newContext({ viewport, acceptDownloads: true });
  const page = await context.newPage();
  const requests = [];
  const consoleErrors = [];
  page.on('request', (r) => requests.push(r.url()));
  page.on('console', (m) => {
    if (m.type() === 'error') consoleErrors.push(m.text());
  });
  page.on('pageerror', (e) => consoleErrors.push(`pageerror: ${e.message}`));
  const t0 = Date.now();
  await page.goto(PAGE_URL + fragment);
  await page.waitForSelector('body[data-ready="1"]', { timeout: 30000 });
  const readyMs = Date.now() - t0;
  return { page, context, requests, consoleErrors, readyMs };
}

/** Requests other than the page document itself and data:/blob: URLs (must be none). */
export function foreignRequests(requests) {
  return requests.filter((u) => !(u.startsWith('data:') || u.startsWith('blob:') || u.split('#')[0] === PAGE_URL));
}

/** Loads a shared reference table from tests/data (written by the physics helpers). */
export function reference(name) {
  const dir = process.env.QB_REFERENCE_DIR || resolve(ROOT, 'tests', 'data');
  return JSON.parse(readFileSync(resolve(dir, name), 'utf8'));
}

/**
 * Sets control `id` as a user edit would (its value, then the `input` and `change` events the
 * page listens to) and waits for the recomputation, in one round trip to the browser. The
 * control must be visible and enabled, as for a user.
 */
async function edit(page, id, value, isSelect) {
  const problem = await page.evaluate(({ id: cid, value: v, isSelect: sel }) => {
    const e = document.getElementById(cid);
    if (!e) return `#${cid} does not exist`;
    if (e.closest('[hidden]') || e.getClientRects().length === 0 || e.disabled) return `#${cid} is not visible or not enabled`;
    if (sel && ![...e.options].some((o) => o.value === v)) return `#${cid} has no option ${v}`;
    e.focus();
    e.value = v;
    e.dispatchEvent(new Event('input', { bubbles: true }));
    e.dispatchEvent(new Event('change', { bubbles: true }));
    return new Promise((r) => requestAnimationFrame(() => r('')));
  }, { id, value: String(value), isSelect });
  if (problem) throw new Error(problem);
}

/** Types `text` into control `id` (replacing its content) and waits for the recomputation. */
export async function setValue(page, id, text) {
  await edit(page, id, text, false);
}

/** Chooses option `value` of <select> `id` and waits for the recomputation. */
export async function select(page, id, value) {
  await edit(page, id, value, true);
}

/**
 * Waits until the page has recomputed after an input event: the page schedules its computation
 * in a requestAnimationFrame callback registered by the event, so a callback registered after it
 * runs once that computation is done.
 */
export async function settle(page) {
  await page.evaluate(() => new Promise((r) => requestAnimationFrame(() => r())));
}

/** Text of a result item <div data-key=key> inside <dl id=dlId>. */
export async function resultText(page, dlId, key) {
  return page.textContent(`#${dlId} [data-key="${key}"] dd`);
}

/** The leading number of a formatted value ("1.234×10⁻⁵ W" → 1.234e-5). */
export function num(text) {
  const sup = { '⁻': '-', '⁰': '0', '¹': '1', '²': '2', '³': '3', '⁴': '4', '⁵': '5', '⁶': '6', '⁷': '7', '⁸': '8', '⁹': '9' };
  const s = text.trim().replace(/\u2212/g, '-');
  const m = /^(-?[0-9.]+)(?:×10([⁻⁰¹²³⁴⁵⁶⁷⁸⁹]+))?/.exec(s);
  if (!m) return NaN;
  const exp = m[2] ? Number(m[2].split('').map((c) => sup[c]).join('')) : 0;
  return Number(m[1]) * 10 ** exp;
}

/** Relative difference. */
export function rel(a, b) {
  return Math.abs(a - b) / Math.abs(b);
}

/** Parses downloaded CSV text (skipping "#" comments) into { header, rows }. */
export function parseCsv(text) {
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/).filter((l) => l && !l.startsWith('#') && !l.startsWith('"#'));
  const split = (l) => l.match(/("([^"]|"")*"|[^,]*)(,|$)/g).filter((x) => x !== '').map((x) => x.replace(/,$/, '').replace(/^"|"$/g, '').replace(/""/g, '"'));
  // An empty cell is an undefined value: NaN here (Number('') would be 0).
  return { header: split(lines[0]), rows: lines.slice(1).map((l) => l.split(',').map((c) => (c === '' ? NaN : Number(c)))) };
}

/** Clicks a button that triggers a download and returns the downloaded text. */
export async function downloadText(page, buttonSelector) {
  const [dl] = await Promise.all([page.waitForEvent('download'), page.click(buttonSelector)]);
  const bytes = readFileSync(await dl.path());
  return { name: dl.suggestedFilename(), text: bytes.toString('utf8'), bytes };
}
