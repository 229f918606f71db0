// The instrument-design section of the offline page (file://): one pixel, two bands.
// References: tests/data/design_reference.json, written by tests/data/gen_design.py (mpmath at
// 40 digits: band photon radiance by quadrature of Planck's law, then the pixel model
// Φ = L·A·τ·π/(4F²+1), N = η·Φ·t, σ² = N_s + N_d + σ_r², NETD = σ/(∂N_s/∂T)).
// Unit conversions are checked with the definitions (ν̃ = 1/λ; T/K = t/°C + 273.15).
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { launch, open, reference, select, setValue, resultText, num, rel, parseCsv, downloadText } from './harness.mjs';

const INTERNAL = /\b(?!meV\b)[a-z]{2,}[A-Z][A-Za-z]*\b|\b[a-z]+_[a-z]+\b|NaN|undefined|\bindex\b|\binf\b/;

let browser;
before(async () => {
  browser = await launch();
});
after(async () => {
  await browser?.close();
});

/** The NETD and well-fill columns of the exported curves, at the first plotted temperature. */
async function firstRow(page) {
  const { text } = await downloadText(page, '#dz-csv');
  const { header, rows } = parseCsv(text);
  const col = (name) => header.findIndex((h) => h.startsWith(name));
  return { netdA: rows[0][col('NETD band A')], fillA: rows[0][col('well fill band A')], netdB: rows[0][col('NETD band B')], header, rows };
}

test('design task: the mid-wave reference pixel against mpmath, saturation and the 1/√t law', async () => {
  const ref = reference('design_reference.json').detector;
  const doc = ref.find((r) => r.name === 'mwir_doc');
  const hot = ref.find((r) => r.name === 'mwir_hot');
  const { page, context, consoleErrors } = await open(browser);
  // The reference pixel: 15 µm pitch (2.25×10⁻¹⁰ m²), F/2, τ 0.9, η 0.7, 1 ms, 1.1×10⁷ e⁻,
  // 1 pA dark current, 200 e⁻ read noise, black scene at 300 K in 3.7–4.8 µm.
  const set = { 'dz-f': '2', 'dz-tau': '0.9', 'dz-th': '0', 'dz-pitch': '15', 'dz-qe': '0.7', 'dz-ti': '1', 'dz-fw': '1.1e7', 'dz-id': '1', 'dz-rn': '200', 'dz-a0': '3.7', 'dz-a1': '4.8', 'dz-eps': '1', 'dz-t': '300', 'dz-p0': '300', 'dz-p1': '700' };
  await select(page, 'dz-cone', 'exact');
  await select(page, 'dz-conv', 'qe');
  for (const [id, v] of Object.entries(set)) await setValue(page, id, v);
  assert.equal(await page.getAttribute('#design', 'data-state'), 'ok', await page.textContent('#design-msg'));
  // Shown results (3 or 4 significant digits) against the reference.
  const netdText = await resultText(page, 'dz-res', 'netdA');
  assert.match(netdText, / mK$/);
  assert.ok(Math.abs(num(netdText) / 1000 - Number(doc.netd_k)) <= 0.05e-3, `NETD ${netdText} vs ${doc.netd_k} K`);
  assert.ok(rel(num(await resultText(page, 'dz-res', 'snrA')), Number(doc.snr)) < 1e-3);
  assert.ok(Math.abs(num(await resultText(page, 'dz-res', 'fillA')) - 100 * Number(doc.well_fill)) < 0.01);
  const cells = await page.$$eval('#dz-table tbody tr', (trs) => Object.fromEntries(trs.map((tr) => [tr.children[0].textContent, tr.children[1].textContent])));
  assert.ok(rel(num(cells['Signal electrons Nₛ']), Number(doc.signal_electrons)) < 1e-3, cells['Signal electrons Nₛ']);
  assert.ok(rel(num(cells.Photocurrent), Number(doc.photocurrent_a)) < 1e-3, cells.Photocurrent);
  assert.ok(rel(num(cells['Total noise']), Number(doc.noise_electrons)) < 1e-3, cells['Total noise']);
  // Full precision from the exported curve at 300 K.
  const r300 = await firstRow(page);
  assert.ok(rel(r300.netdA / 1000, Number(doc.netd_k)) < 1e-6, `NETD ${r300.netdA} mK vs ${doc.netd_k} K`);
  assert.ok(rel(r300.fillA, Number(doc.well_fill)) < 1e-6);
  // 600 K saturates the well (reference well fill 16.9): warned, and the fill is marked.
  await setValue(page, 'dz-t', '600');
  assert.equal(await page.isVisible('#dz-warn'), true);
  assert.match(await page.textContent('#dz-warn'), /Saturated: band A/);
  assert.match(await resultText(page, 'dz-res', 'fillA'), /saturated/);
  assert.ok(rel(num(await resultText(page, 'dz-res', 'fillA')), 100 * Number(hot.well_fill)) < 3e-3, await resultText(page, 'dz-res', 'fillA'));
  // Shot-noise limit (no dark current, no read noise): NETD ∝ 1/√t (issue 17's limiting case).
  await setValue(page, 'dz-t', '300');
  await setValue(page, 'dz-id', '0');
  await setValue(page, 'dz-rn', '0');
  const a = await firstRow(page);
  await setValue(page, 'dz-ti', '0.25');
  const b = await firstRow(page);
  assert.ok(rel(b.netdA / a.netdA, 2) < 1e-9, `NETD ratio ${b.netdA / a.netdA}`);
  assert.ok(rel(b.netdB / a.netdB, 2) < 1e-9);
  assert.deepEqual(consoleErrors, []);
  await context.close();
});

test('design: a band unit change converts the limits and changes no result; NETD unit menu', async () => {
  const { page, context } = await open(browser);
  const values = () => page.$$eval('#dz-res dd, #dz-table td', (ds) => ds.map((d) => d.textContent));
  const before = await values();
  await select(page, 'dz-au', 'cm-1');
  // 3.7–4.8 µm is 10⁴/4.8 … 10⁴/3.7 cm⁻¹ (ν̃ = 1/λ): the pair is swapped into increasing order.
  assert.ok(rel(Number(await page.inputValue('#dz-a0')), 1e4 / 4.8) < 1e-10, await page.inputValue('#dz-a0'));
  assert.ok(rel(Number(await page.inputValue('#dz-a1')), 1e4 / 3.7) < 1e-10, await page.inputValue('#dz-a1'));
  assert.deepEqual(await values(), before);
  // The scene temperature in °C: the field converts and the results stay.
  await select(page, 'dz-tu', 'degC');
  assert.ok(Math.abs(Number(await page.inputValue('#dz-t')) - (300 - 273.15)) < 1e-9);
  assert.deepEqual(await values(), before);
  const netdK = num(await resultText(page, 'dz-res', 'netdB')) / 1000;
  await select(page, 'dz-nu', 'K');
  assert.match(await resultText(page, 'dz-res', 'netdB'), / K$/);
  assert.ok(rel(num(await resultText(page, 'dz-res', 'netdB')), netdK) < 1e-2);
  await context.close();
});

test('design: messages under the field concerned, in page words', async () => {
  const { page, context } = await open(browser);
  const expect = async (id, value, has, code) => {
    await setValue(page, id, value);
    assert.equal(await page.getAttribute('#design', 'data-state'), 'error');
    const msg = (await page.textContent(`#${id}-msg`)).trim();
    for (const h of has) assert.ok(msg.includes(h), `${id}: "${msg}" mentions ${h}`);
    assert.doesNotMatch(msg, INTERNAL, msg);
    if (code) assert.equal(await page.getAttribute(`#${id}-msg`, 'data-code'), code);
    const others = await page.$$eval('#design .msg', (ms, own) => ms.filter((m) => m.textContent && m.id !== own).map((m) => m.id), `${id}-msg`);
    assert.deepEqual(others, []);
  };
  const recover = async (id, value) => {
    await setValue(page, id, value);
    assert.equal(await page.getAttribute('#design', 'data-state'), 'ok');
  };
  await expect('dz-f', '0', ['f-number', 'greater than 0', 'you entered 0'], 'NON_POSITIVE');
  await recover('dz-f', '2');
  await expect('dz-tau', '1,2', ['Optics transmittance', 'at most 1', '1,2'], 'OUT_OF_RANGE');
  await recover('dz-tau', '0.9');
  await expect('dz-b1', '7', ['Band B', 'upper limit (7 µm)', 'lower limit (8 µm)'], 'INVALID_BAND');
  await recover('dz-b1', '9.5');
  await expect('dz-pitch', '-15', ['Pixel pitch', 'greater than 0', '−15 µm']);
  await recover('dz-pitch', '15');
  await expect('dz-ti', '', ['Integration time', 'enter a value']);
  await recover('dz-ti', '0.5');
  await expect('dz-t', '-300', ['Scene temperature', 'absolute zero'], 'NON_POSITIVE_TEMPERATURE');
  await recover('dz-t', '300');
  await context.close();
});
