// Browser tests of the single-file offline page (dist/quantaband.html), opened with file:// in
// headless Debian Chromium. Reference values come from the shared tables in tests/data/, which
// the physics helpers generate with mpmath (the oracle each JSON header names).
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { statSync, readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import {
  PAGE, ARTIFACTS, launch, open, foreignRequests, reference, setValue, select, settle, resultText, num, rel,
  parseCsv, downloadText,
} from './harness.mjs';

let browser;
before(async () => {
  browser = await launch();
});
after(async () => {
  await browser?.close();
});

const thermo = () => reference('thermometry_reference.json');
const stats = () => reference('stats_reference.json');

test('the page is one self-contained file of at most 600 KB', () => {
  const bytes = statSync(PAGE).size;
  console.log(`page size: ${bytes} bytes (${(bytes / 1024).toFixed(1)} KiB)`);
  assert.ok(bytes <= 600 * 1024, `dist/quantaband.html is ${bytes} bytes`);
  const html = readFileSync(PAGE, 'utf8');
  // Nothing to fetch: no script/link/img sources, no links except in-page anchors, and the one
  // module script has no import/export statement left (file:// forbids module imports).
  assert.doesNotMatch(html, /<(script|img|link|iframe)[^>]*\s(src|href)=/i);
  for (const m of html.matchAll(/\shref="([^"]*)"/g)) assert.ok(m[1].startsWith('#'), `link ${m[1]}`);
  const modules = [...html.matchAll(/<script type="module">([\s\S]*?)<\/script>/g)];
  assert.equal(modules.length, 1);
  assert.doesNotMatch(modules[0][1], /^\s*(import|export)\s/m);
  assert.match(html, /<script type="application\/octet-stream" id="qb-wasm"/);
});

test('opens from file://, becomes ready with no console errors and no network requests', async () => {
  const { page, context, requests, consoleErrors, readyMs } = await open(browser);
  const inPage = await page.evaluate(() => Number(document.body.dataset.readyMs));
  console.log(`navigation to ready: ${readyMs} ms (page's own measure from script start: ${inPage} ms)`);
  const sections = (await page.getAttribute('body', 'data-sections')).split(' ');
  console.log(`sections present: ${sections.join(', ')}`);
  assert.deepEqual(sections, ['spectrum', 'band', 'signal', 'occupancy', 'mode', 'calib', 'design']);
  // Every section computed without an error on the defaults.
  for (const id of sections) assert.equal(await page.getAttribute(`#${id}`, 'data-state'), 'ok', `section ${id}`);
  // The CSP meta is there and forbids the network.
  const csp = await page.getAttribute('meta[http-equiv="Content-Security-Policy"]', 'content');
  assert.match(csp, /default-src 'none'/);
  for (const id of sections) {
    await page.locator(`#${id}`).screenshot({ path: resolve(ARTIFACTS, `section-${id}.png`) });
  }
  await page.screenshot({ path: resolve(ARTIFACTS, 'page-full.png'), fullPage: true });
  // Every number shown is written by the page's one formatter: no "e+5", no "NaN", no "K/1",
  // no literal underscores in results, tables, legends and readouts.
  const shown = await page.$$eval('dl.results, table.res, figure.plot, .assume, .scale', (els) => els.map((e) => e.innerText).join('\n'));
  assert.doesNotMatch(shown, /\d[eE][+-]?\d|NaN|Infinity|undefined|K\/1\b|_/);
  assert.deepEqual(consoleErrors, []);
  assert.deepEqual(foreignRequests(requests), []);
  await context.close();
});

test('spectrum: value at 10 µm and 300 K matches the mpmath reference, CSV holds the plotted points', async () => {
  const ref = thermo().spectral_points.find((p) => p.wavelength_m === 1e-5 && p.temperature_k === 300);
  assert.ok(ref, 'reference point 10 µm / 300 K');
  const { page, context, requests, consoleErrors } = await open(browser);
  await select(page, 'sp-tu', 'K');
  await select(page, 'sp-ru', 'um');
  await select(page, 'sp-xu', 'um');
  await select(page, 'sp-q', 'energy');
  await select(page, 'sp-g', 'radiance');
  await setValue(page, 'sp-t', '300, 500');
  await setValue(page, 'sp-lo', '10');
  await setValue(page, 'sp-hi', '30');
  const points = Number(await page.getAttribute('#sp-plot', 'data-points'));
  const { name, text } = await downloadText(page, '#sp-csv');
  assert.match(name, /\.csv$/);
  const csv = parseCsv(text);
  assert.equal(csv.header.length, 3);
  assert.match(csv.header[1], /300 K/);
  assert.equal(csv.rows.length * 2, points, 'one CSV row per plotted x, one column per curve');
  assert.equal(csv.rows[0][0], 10);
  assert.ok(rel(csv.rows.at(-1)[0], 30) < 1e-12);
  // W m^-2 sr^-1 m^-1 -> per µm
  const expected = ref.radiance * 1e-6;
  assert.ok(rel(csv.rows[0][1], expected) < 1e-9, `${csv.rows[0][1]} vs ${expected}`);
  // The table's peak for 300 K: Wien's displacement law λ_max·T = b = 2.897 771 955e-3 m K (CODATA 2018).
  const peakText = await page.textContent('#sp-table tbody tr:first-child td:nth-child(2)');
  assert.ok(rel(num(peakText), 2.897771955e-3 / 300 / 1e-6) < 1e-6, peakText);
  assert.deepEqual(consoleErrors, []);
  assert.deepEqual(foreignRequests(requests), []);
  await context.close();
});

test('spectrum: photon units per THz and per cm⁻¹ match the core reference (mpmath quad)', async () => {
  const cases = reference('core_reference.json').cases;
  const find = (variable, quantity, x, t) => cases.find((c) => c.kind === 'spectral' && c.variable === variable && c.quantity === quantity && c.x === x && c.temperature_k === t);
  const { page, context, consoleErrors } = await open(browser);
  await select(page, 'sp-tu', 'K');
  await select(page, 'sp-g', 'radiance');
  await setValue(page, 'sp-t', '300');
  const firstRow = async () => parseCsv((await downloadText(page, '#sp-csv')).text).rows[0];
  // 10 THz, 300 K, photons s^-1 m^-2 sr^-1 Hz^-1 → per THz (× 1e12)
  await select(page, 'sp-ru', 'THz');
  await select(page, 'sp-bu', 'THz');
  await select(page, 'sp-xu', 'THz');
  await select(page, 'sp-q', 'photon');
  await setValue(page, 'sp-lo', '10');
  await setValue(page, 'sp-hi', '100');
  await setValue(page, 'sp-blo', '20');
  await setValue(page, 'sp-bhi', '30');
  let row = await firstRow();
  assert.equal(row[0], 10);
  assert.ok(rel(row[1], Number(find('frequency', 'photon', '1e13', '300').expected) * 1e12) < 1e-9, String(row[1]));
  // 1000 cm⁻¹ (1e5 m⁻¹), 300 K, energy, W m^-2 sr^-1 (m^-1)^-1 → per cm^-1 (× 100)
  await select(page, 'sp-ru', 'cm-1');
  await select(page, 'sp-bu', 'cm-1');
  await select(page, 'sp-xu', 'cm-1');
  await select(page, 'sp-q', 'energy');
  await setValue(page, 'sp-lo', '1000');
  await setValue(page, 'sp-hi', '3000');
  await setValue(page, 'sp-blo', '1500');
  await setValue(page, 'sp-bhi', '2000');
  row = await firstRow();
  assert.equal(row[0], 1000);
  assert.ok(rel(row[1], Number(find('wavenumber', 'energy', '1e5', '300').expected) * 100) < 1e-9, String(row[1]));
  assert.deepEqual(consoleErrors, []);
  await context.close();
});

test('band: 8–14 µm radiance and dL/dT at 250 K match the mpmath reference', async () => {
  const ref = thermo().integrals.find((r) => r.response === 'rect_8_14um' && r.temperature_k === 250);
  const { page, context } = await open(browser);
  await select(page, 'bd-bu', 'um');
  await select(page, 'bd-tu', 'K');
  await select(page, 'bd-g', 'radiance');
  await setValue(page, 'bd-lo', '8');
  await setValue(page, 'bd-hi', '14');
  await setValue(page, 'bd-eps', '1');
  await setValue(page, 'bd-t', '250');
  const L = num(await resultText(page, 'bd-res', 'L'));
  const dL = num(await resultText(page, 'bd-res', 'dLdT'));
  const c = num(await resultText(page, 'bd-res', 'contrast'));
  assert.ok(rel(L, ref.signal) < 1e-6, `${L} vs ${ref.signal}`); // 7 digits shown
  assert.ok(rel(dL, ref.d_signal_dt) < 1e-6, `${dL} vs ${ref.d_signal_dt}`);
  assert.ok(rel(c, (100 * ref.d_signal_dt) / ref.signal) < 1e-5, `${c}`);
  // Photon radiance and energy fraction at 300 K, and the same band as wavenumbers (core reference).
  const core = reference('core_reference.json').cases;
  const pick = (kind, variable, quantity, note) => Number(core.find((x) => x.kind === kind && x.variable === variable && x.quantity === quantity && x.temperature_k === '300' && (note ? x.note === note : x.lower === '8e-6' && x.upper === '14e-6')).expected);
  await setValue(page, 'bd-t', '300');
  assert.ok(rel(num(await resultText(page, 'bd-res', 'P')), pick('band', 'wavelength', 'photon')) < 1e-6);
  assert.ok(rel(num(await resultText(page, 'bd-res', 'F')) / 100, pick('band_fraction', 'wavelength', 'energy')) < 1e-6);
  await select(page, 'bd-bu', 'cm-1');
  await setValue(page, 'bd-lo', '714');
  await setValue(page, 'bd-hi', '1250');
  assert.ok(rel(num(await resultText(page, 'bd-res', 'L')), pick('band', 'wavenumber', 'energy', '8-14 um as wavenumber')) < 1e-6);
  await select(page, 'bd-bu', 'um');
  await setValue(page, 'bd-lo', '8');
  await setValue(page, 'bd-hi', '14');
  await setValue(page, 'bd-t', '250');
  // Celsius input gives the same answer (unit conversion in the core): 250 K = −23.15 °C. The
  // unit menu converts the field itself; typing the value in °C gives the same result.
  await select(page, 'bd-tu', 'degC');
  assert.equal(await page.inputValue('#bd-t'), '-23.15');
  await setValue(page, 'bd-t', '-23.15');
  assert.ok(rel(num(await resultText(page, 'bd-res', 'L')), ref.signal) < 1e-6);
  // Sweep CSV: 300 K and 600 K rows against the same reference.
  await select(page, 'bd-tu', 'K');
  await select(page, 'bd-swu', 'K');
  await setValue(page, 'bd-t', '250');
  await setValue(page, 'bd-t0', '300');
  await setValue(page, 'bd-t1', '600');
  await setValue(page, 'bd-n', '4');
  const csv = parseCsv((await downloadText(page, '#bd-csv')).text);
  assert.equal(csv.rows.length, 4);
  for (const t of [300, 600]) {
    const r = thermo().integrals.find((x) => x.response === 'rect_8_14um' && x.temperature_k === t);
    assert.equal(csv.header[0], 'temperature (K)');
    const row = csv.rows.find((x) => x[0] === t);
    assert.ok(row, `sweep row at ${t} K`);
    assert.ok(rel(row[1], r.signal) < 1e-9, `${row[1]} vs ${r.signal}`);
    assert.ok(rel(row[3], r.d_signal_dt) < 1e-7, `${row[3]} vs ${r.d_signal_dt}`);
  }
  await context.close();
});

test('photons in a mode: photon number and quantum noise temperature match the mpmath reference', async () => {
  const { page, context } = await open(browser);
  const sections = await page.getAttribute('body', 'data-sections');
  assert.match(sections, /mode/, 'mode section present');
  const rows = stats().rows;
  const n = rows.find((r) => r[0] === 'thermal_photon_number' && r[1] === '1.4204e9' && r[2] === '2.725');
  const tn = rows.find((r) => r[0] === 'quantum_noise_temperature' && r[1] === '1.4204e9' && r[2] === '2.725');
  await select(page, 'md-tu', 'K');
  await select(page, 'md-fu', 'GHz');
  await setValue(page, 'md-f', '1.4204');
  await setValue(page, 'md-t', '2.725');
  assert.ok(rel(num(await resultText(page, 'md-res', 'n')), Number(n[3])) < 1e-6);
  assert.ok(rel(num(await resultText(page, 'md-res', 'tnoise')), Number(tn[3])) < 1e-6);
  await context.close();
});

test('signal → temperature: band and spectral readings invert the mpmath reference radiances', async () => {
  const t = thermo();
  const band = t.integrals.find((r) => r.response === 'rect_8_14um' && r.temperature_k === 250);
  const point = t.spectral_points.find((p) => p.wavelength_m === 1e-5 && p.temperature_k === 300);
  const { page, context, consoleErrors } = await open(browser);
  assert.match(await page.getAttribute('body', 'data-sections'), /signal/, 'signal section present');
  await select(page, 'sg-mode', 'radiance');
  await select(page, 'sg-resp', 'band');
  await select(page, 'sg-bu', 'um');
  await setValue(page, 'sg-lo', '8');
  await setValue(page, 'sg-hi', '14');
  await setValue(page, 'sg-eps', '1');
  await setValue(page, 'sg-tau', '1');
  await setValue(page, 'sg-sig', String(band.signal));
  assert.equal(await page.getAttribute('#signal', 'data-state'), 'ok');
  assert.ok(Math.abs(num(await resultText(page, 'sg-res', 't')) - 250) < 1e-4, await resultText(page, 'sg-res', 't'));
  // Sensitivity to the signal: ∂T/∂S = 1/(dS/dT) with ε = τ = 1 (reference dS/dT).
  // Cells keep their full-precision value (kelvin, SI) in data-value; the text is rounded.
  const cells = await page.$$eval('#sg-table tbody tr', (trs) => trs.map((tr) => [...tr.children].map((c) => ({ text: c.textContent, value: Number(c.dataset.value) }))));
  const sigRow = cells.find((r) => r[0].text === 'Band radiance');
  assert.ok(rel(sigRow[3].value, 1 / band.d_signal_dt) < 1e-6, sigRow[3].text);
  assert.ok(rel(num(sigRow[3].text), 1 / band.d_signal_dt) < 1e-3, sigRow[3].text); // shown with 4 digits
  // GUM eq. (10), uncorrelated inputs: u_c² = Σ (|c_i|·u_i)²  (JCGM 100:2008).
  const isCombined = (r) => r[0].text.startsWith('Combined standard uncertainty');
  const contributions = cells.filter((r) => !isCombined(r)).map((r) => r[4].value);
  const combined = cells.find(isCombined)[4].value;
  const rss = Math.sqrt(contributions.reduce((a, c) => a + c * c, 0));
  assert.ok(rel(rss, combined) < 1e-12, `${rss} vs ${combined}`);
  await page.locator('#signal').screenshot({ path: resolve(ARTIFACTS, 'section-signal-band.png') });

  await select(page, 'sg-resp', 'point');
  await select(page, 'sg-xu', 'um');
  await select(page, 'sg-ssu', 'um');
  await setValue(page, 'sg-x', '10');
  await setValue(page, 'sg-ssig', String(point.radiance * 1e-6)); // W m^-2 sr^-1 µm^-1
  assert.ok(Math.abs(num(await resultText(page, 'sg-res', 't')) - 300) < 1e-4, await resultText(page, 'sg-res', 't'));
  // A signal below what the reflected surroundings alone give has no physical solution.
  await setValue(page, 'sg-eps', '0.5');
  await setValue(page, 'sg-tr', '400');
  assert.equal(await page.getAttribute('#sg-ssig-msg', 'data-code'), 'NO_PHYSICAL_SOLUTION');
  assert.deepEqual(consoleErrors, []);
  await context.close();
});

test('signal → temperature: the ratio of two equal bands inverts band radiances computed by the band section', async () => {
  const { page, context, consoleErrors } = await open(browser);
  assert.ok(await page.$('#sg-mode option[value="ratio"]'), 'ratio mode offered');
  // Forward: band radiances at 800 K from the band section's sweep CSV (full precision).
  const bandAt800 = async (lo, hi) => {
    await select(page, 'bd-bu', 'um');
    await select(page, 'bd-swu', 'K');
    await setValue(page, 'bd-lo', lo);
    await setValue(page, 'bd-hi', hi);
    await setValue(page, 'bd-t0', '800');
    await setValue(page, 'bd-t1', '900');
    await setValue(page, 'bd-n', '2');
    return parseCsv((await downloadText(page, '#bd-csv')).text).rows.find((r) => r[0] === 800)[1];
  };
  const ratio = (await bandAt800('3.9', '4.1')) / (await bandAt800('4.9', '5.1'));
  // Inverse: the ratio reading of the signal section (two 0.2 µm wide channels at 4 and 5 µm,
  // grey body, ε1/ε2 = 1) gives 800 K back.
  await select(page, 'sg-mode', 'ratio');
  await select(page, 'sg-rin', 'ratio');
  await select(page, 'sg-lu', 'um');
  await setValue(page, 'sg-l1', '4');
  await setValue(page, 'sg-l2', '5');
  await setValue(page, 'sg-lw', '0.2');
  await setValue(page, 'sg-er', '1');
  await setValue(page, 'sg-ratio', String(ratio));
  assert.equal(await page.getAttribute('#signal', 'data-state'), 'ok', await page.textContent('#signal'));
  assert.ok(Math.abs(num(await resultText(page, 'sg-res', 't')) - 800) < 1e-3, await resultText(page, 'sg-res', 't'));
  // Channels in the wrong order: a message under the channel 2 wavelength.
  await setValue(page, 'sg-l2', '3');
  assert.match(await page.textContent('#sg-l2-msg'), /Channel 2 wavelength \(3 µm\) must be longer than channel 1 \(4 µm\)/);
  await page.locator('#signal').screenshot({ path: resolve(ARTIFACTS, 'section-signal-ratio.png') });
  assert.deepEqual(consoleErrors, []);
  await context.close();
});

test('calibration: a Sakuma–Hattori fit through three reference band signals reproduces them', async () => {
  const t = thermo();
  const pts = [250, 300, 600].map((k) => t.integrals.find((r) => r.response === 'rect_8_14um' && r.temperature_k === k));
  const moments = t.response_moments.find((m) => m.response === 'rect_8_14um');
  const { page, context, consoleErrors } = await open(browser);
  assert.match(await page.getAttribute('body', 'data-sections'), /calib/, 'calibration section present');
  await select(page, 'cf-ptu', 'K');
  await select(page, 'cf-ru', 'um');
  await page.fill('#cf-resp', '# rectangular 8-14 um\n8, 1\n14, 1');
  // Points loaded from a local file through the page's file picker (read with FileReader).
  const csvText = `temperature_K,signal\n${pts.map((p) => `${p.temperature_k},${p.signal}`).join('\n')}\n`;
  await page.setInputFiles('#cf-pts-file', { name: 'points.csv', mimeType: 'text/csv', buffer: Buffer.from(csvText) });
  await page.waitForFunction(() => document.getElementById('cf-pts').value.startsWith('temperature_K'));
  await settle(page);
  await setValue(page, 'cf-eps', '1');
  await setValue(page, 'cf-tau', '1');
  await setValue(page, 'cf-n', String(pts[1].signal));
  await setValue(page, 'cf-un', '0');
  assert.equal(await page.getAttribute('#calib', 'data-state'), 'ok', await page.textContent('#calib-msg'));
  assert.ok(rel(num(await resultText(page, 'cf-fit', 'lm')), moments.mean_m * 1e6) < 1e-6);
  assert.ok(rel(num(await resultText(page, 'cf-fit', 'ls')), moments.spread_m * 1e6) < 1e-5);
  // Three points, three parameters: the curve passes through them.
  assert.ok(Math.abs(num(await resultText(page, 'cf-fit', 'rmax'))) < 1e-3, await resultText(page, 'cf-fit', 'rmax')); // mK
  assert.ok(Math.abs(num(await resultText(page, 'cf-res', 't')) - 300) < 1e-5, await resultText(page, 'cf-res', 't'));
  // Too few points: the core's TOO_FEW_POINTS under the points field.
  await page.fill('#cf-pts', '300, 54.9');
  await settle(page);
  assert.equal(await page.getAttribute('#cf-pts-msg', 'data-code'), 'TOO_FEW_POINTS');
  assert.deepEqual(consoleErrors, []);
  await context.close();
});

test('the URL fragment keeps the state and restores it on load', async () => {
  const first = await open(browser);
  await select(first.page, 'bd-tu', 'degC');
  await setValue(first.page, 'bd-t', '150');
  await setValue(first.page, 'bd-lo', '3');
  await setValue(first.page, 'bd-hi', '5');
  await first.page.waitForFunction(() => ['bd-t=150', 'bd-lo=3', 'bd-hi=5'].every((s) => location.hash.includes(s)));
  const hash = await first.page.evaluate(() => location.hash);
  const value = await resultText(first.page, 'bd-res', 'L');
  await first.context.close();
  assert.match(hash, /bd-tu=degC/);
  const second = await open(browser, hash);
  assert.equal(await second.page.inputValue('#bd-t'), '150');
  assert.equal(await second.page.inputValue('#bd-tu'), 'degC');
  assert.equal(await second.page.inputValue('#bd-lo'), '3');
  assert.equal(await resultText(second.page, 'bd-res', 'L'), value);
  assert.deepEqual(second.consoleErrors, []);
  await second.context.close();
});

test('keyboard: Tab walks the band inputs in order, each labelled and visibly focused', async () => {
  const { page, context } = await open(browser);
  await page.focus('#bd-lo');
  const seen = [];
  for (let i = 0; i < 10; i++) {
    const info = await page.evaluate(() => {
      const e = document.activeElement;
      const cs = getComputedStyle(e);
      return {
        id: e.id,
        tag: e.tagName,
        labelled: (e.labels && e.labels.length > 0 && e.labels[0].textContent.trim().length > 0) || !!e.getAttribute('aria-label'),
        outline: cs.outlineStyle !== 'none' && parseFloat(cs.outlineWidth) >= 2,
      };
    });
    seen.push(info.id);
    if (['INPUT', 'SELECT', 'TEXTAREA'].includes(info.tag)) {
      assert.ok(info.labelled, `${info.id} has a label`);
      if (i > 0) assert.ok(info.outline, `${info.id} shows a focus outline`);
    }
    await page.keyboard.press('Tab');
  }
  assert.deepEqual(seen.slice(0, 8), ['bd-lo', 'bd-hi', 'bd-bu', 'bd-t', 'bd-tu', 'bd-eps', 'bd-g', 'bd-t0']);
  await context.close();
});

test('printing a section gives a one-page record (each section)', async () => {
  const { page, context } = await open(browser);
  const sections = (await page.getAttribute('body', 'data-sections')).split(' ');
  for (const id of sections) {
    await page.evaluate((s) => window.quantabandPrintSection(s), id);
    await page.emulateMedia({ media: 'print' });
    if (id === 'band') await page.screenshot({ path: resolve(ARTIFACTS, 'print-band.png'), fullPage: true });
    const pdf = await page.pdf({ format: 'A4', printBackground: false });
    const pages = (pdf.toString('latin1').match(/\/Type\s*\/Page[^s]/g) || []).length;
    assert.equal(pages, 1, `section ${id} prints on ${pages} page(s)`);
    // The record carries the cautions and a link to the state.
    const text = await page.evaluate(() => document.body.innerText);
    assert.match(text, /not for medical or fever temperature screening/i);
    await page.emulateMedia({ media: 'screen' });
  }
  await context.close();
});

test('plot readout follows the pointer and the arrow keys', async () => {
  const { page, context } = await open(browser);
  const svg = page.locator('#sp-plot > svg');
  await svg.scrollIntoViewIfNeeded();
  const box = await svg.boundingBox();
  await page.mouse.move(box.x + box.width * 0.5, box.y + box.height * 0.5);
  const text1 = await page.textContent('#sp-plot-readout');
  assert.match(text1, /wavelength = [0-9.]+ µm/);
  assert.match(text1, /K: [0-9.]+/);
  await svg.focus();
  for (let i = 0; i < 5; i++) await page.keyboard.press('ArrowRight');
  const text2 = await page.textContent('#sp-plot-readout');
  assert.notEqual(text2, text1);
  await context.close();
});

test('text keeps WCAG AA contrast (≥ 4.5:1) against its background', async () => {
  const { page, context } = await open(browser);
  // Relative luminance and contrast ratio as defined in WCAG 2.1 (§1.4.3, "relative luminance").
  const worst = await page.evaluate(() => {
    const parse = (c) => (c.match(/[\d.]+/g) || []).map(Number);
    const lum = ([r, g, b]) => {
      const f = (v) => { v /= 255; return v <= 0.03928 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4; };
      return 0.2126 * f(r) + 0.7152 * f(g) + 0.0722 * f(b);
    };
    const bgOf = (el) => {
      for (let e = el; e; e = e.parentElement) {
        const c = parse(getComputedStyle(e).backgroundColor);
        if (c.length === 3 || (c.length === 4 && c[3] > 0.5)) return c.slice(0, 3);
      }
      return [255, 255, 255];
    };
    const out = [];
    for (const el of document.querySelectorAll('label, legend, dt, dd, td, th, p, li, button, h1, h2, h3, caption, figcaption, .readout, input, select, textarea, a')) {
      if (!el.textContent.trim() && !('value' in el)) continue;
      if (el.closest('[hidden]') || el.offsetParent === null) continue;
      const cs = getComputedStyle(el);
      const fg = parse(cs.color).slice(0, 3);
      const l1 = lum(fg);
      const l2 = lum(bgOf(el));
      const ratio = (Math.max(l1, l2) + 0.05) / (Math.min(l1, l2) + 0.05);
      out.push({ ratio, what: `${el.tagName}#${el.id || ''}.${el.className || ''} "${el.textContent.trim().slice(0, 30)}"` });
    }
    out.sort((a, b) => a.ratio - b.ratio);
    return out.slice(0, 3);
  });
  assert.ok(worst.length > 0);
  assert.ok(worst[0].ratio >= 4.5, `lowest contrast ${worst[0].ratio.toFixed(2)} at ${worst[0].what}`);
  await context.close();
});

test('frame: the invented scene converts to a temperature map with the dead pixels flagged', async () => {
  const { page, context, consoleErrors } = await open(browser);
  assert.ok(await page.$('#cf-canvas'), 'frame view present (convertFrame bound)');
  assert.equal(num(await resultText(page, 'cf-frame-res', 'invalid')), 5, 'five dead pixels are invalid');
  assert.equal(num(await resultText(page, 'cf-frame-res', 'valid')), 160 * 120 - 5);
  // The colour scale's CIE 1976 lightness L* (sRGB, IEC 61966-2-1 transfer function) rises
  // monotonically from the bottom (cold) to the top (hot) row.
  const lum = await page.evaluate(() => {
    const c = document.getElementById('cf-scale');
    const d = c.getContext('2d').getImageData(0, 0, 1, 256).data;
    const lin = (v) => { v /= 255; return v <= 0.04045 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4; };
    const out = [];
    for (let i = 0; i < 256; i++) {
      const Y = 0.2126 * lin(d[4 * i]) + 0.7152 * lin(d[4 * i + 1]) + 0.0722 * lin(d[4 * i + 2]);
      out.push(Y > 216 / 24389 ? 116 * Math.cbrt(Y) - 16 : (24389 / 27) * Y);
    }
    return out;
  });
  for (let i = 1; i < 256; i++) assert.ok(lum[i] < lum[i - 1], `scale lightness not monotone at row ${i}`);
  assert.ok(lum[0] - lum[255] > 80, 'the scale spans most of the lightness range');
  // Pointer readout over the conveyor mesh (pixel 4, 4): reads colder with one frame emissivity (0.93)
  // than with the scene's emissivity map (mesh 0.35).
  const canvas = page.locator('#cf-canvas');
  await canvas.scrollIntoViewIfNeeded();
  const box = await canvas.boundingBox();
  const at = async () => {
    await page.mouse.move(box.x + (4.5 / 160) * box.width, box.y + (4.5 / 120) * box.height);
    return Number(await page.getAttribute('#cf-canvas', 'data-readout-k'));
  };
  const single = await at();
  await page.check('#cf-emap');
  await settle(page);
  const mapped = await at();
  assert.ok(Number.isFinite(single) && Number.isFinite(mapped));
  assert.ok(mapped > single + 20, `emissivity map raises the mesh reading (${single} → ${mapped} K)`);
  await page.locator('#calib').screenshot({ path: resolve(ARTIFACTS, 'section-calib-emissivity-map.png') });
  assert.deepEqual(consoleErrors, []);
  await context.close();
});

test('also works when served over http (loopback server), still without further requests', async () => {
  const { createServer } = await import('node:http');
  const { readFileSync } = await import('node:fs');
  const html = readFileSync(PAGE);
  const server = createServer((req, res) => {
    res.writeHead(200, { 'content-type': 'text/html; charset=utf-8' });
    res.end(html);
  });
  await new Promise((r) => server.listen(0, '127.0.0.1', r));
  const url = `http://127.0.0.1:${server.address().port}/quantaband.html`;
  const context = await browser.newContext();
  const page = await context.newPage();
  const requests = [];
  const errors = [];
  page.on('request', (r) => requests.push(r.url()));
  page.on('console', (m) => m.type() === 'error' && errors.push(m.text()));
  try {
    await page.goto(url);
    await page.waitForSelector('body[data-ready="1"]', { timeout: 30000 });
    assert.match(await page.getAttribute('body', 'data-sections'), /spectrum/);
    assert.deepEqual(errors, []);
    assert.deepEqual(requests.filter((u) => u !== url && !u.startsWith('data:') && !u.startsWith('blob:')), []);
  } finally {
    await context.close();
    server.close();
  }
});

test('every control on the page has a visible label and a message slot', async () => {
  const { page, context } = await open(browser);
  const problems = await page.evaluate(() => {
    const out = [];
    for (const c of document.querySelectorAll('input, select, textarea')) {
      const label = c.labels && c.labels[0];
      if (!label || !label.textContent.trim()) out.push(`${c.id}: no label`);
      if (c.closest('.fld') && !document.getElementById(`${c.id}-msg`)) out.push(`${c.id}: no message element`);
      if (c.id && document.querySelectorAll(`[id="${c.id}"]`).length > 1) out.push(`${c.id}: duplicate id`);
    }
    return out;
  });
  assert.deepEqual(problems, []);
  await context.close();
});
