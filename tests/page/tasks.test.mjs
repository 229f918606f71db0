// Three practitioner tasks, each done in ONE section of the offline page (file://), with the
// values a practitioner has at hand; the link state proves no other section was touched.
// Reference values: tests/data/thermometry_reference.json and stats_reference.json (mpmath,
// generators committed in tests/data/).
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { resolve } from 'node:path';
import { ARTIFACTS, launch, open, reference, select, setValue, resultText, num, rel } from './harness.mjs';

let browser;
before(async () => {
  browser = await launch();
});
after(async () => {
  await browser?.close();
});

/** The ids the link state holds (every control changed from its default). */
async function touched(page) {
  await page.waitForTimeout(250); // the state is written 150 ms after the last change
  return [...new URLSearchParams((await page.evaluate(() => location.hash)).slice(1)).keys()];
}

/** Budget rows of a table: { name: { text: [...cells], value: [...data-value] } }. */
function budget(page, id) {
  return page.$$eval(`#${id} tbody tr`, (trs) => Object.fromEntries(trs.map((tr) => [tr.children[0].textContent,
    { text: [...tr.children].map((c) => c.textContent), value: [...tr.children].map((c) => Number(c.dataset.value)) }])));
}

test('task 1: an LWIR camera reading a painted surface with reflected surroundings (signal section only)', async () => {
  const t = reference('thermometry_reference.json');
  const S = (k) => t.integrals.find((r) => r.response === 'rect_8_14um' && r.temperature_k === k).signal;
  // A camera (flat 8–14 µm band) set to ε = 0.5 and a reflected temperature of 250 K shows
  // 300 K: it saw 0.5·S(300) + 0.5·S(250). An object at 600 K with reflected surroundings at
  // 250 K gives that signal when ε·S(600) + (1 − ε)·S(250) is equal, i.e. for this ε:
  const eps = (0.5 * (S(300) - S(250))) / (S(600) - S(250));
  const { page, context, consoleErrors } = await open(browser);
  // The practitioner works in °C: one page-wide choice.
  await select(page, 'tu', 'degC');
  await select(page, 'sg-mode', 'indicated');
  await select(page, 'sg-resp', 'band');
  await setValue(page, 'sg-lo', '8');
  await setValue(page, 'sg-hi', '14');
  await setValue(page, 'sg-ti', '26.85');
  await setValue(page, 'sg-uti', '0.5');
  await setValue(page, 'sg-eset', '0,5'); // typed with a decimal comma
  await setValue(page, 'sg-trset', '-23.15');
  await setValue(page, 'sg-eps', String(eps));
  await setValue(page, 'sg-tr', '-23.15');
  await setValue(page, 'sg-tau', '1');
  assert.equal(await page.getAttribute('#signal', 'data-state'), 'ok', await page.textContent('#signal'));
  const T = await resultText(page, 'sg-res', 't');
  assert.match(T, /°C$/);
  assert.ok(Math.abs(num(T) - 326.85) < 2e-4, `object temperature ${T} (reference 600 K = 326.85 °C)`);
  // The correction and the uncertainty are °C differences; the budget is in °C.
  assert.ok(Math.abs(num(await resultText(page, 'sg-res', 'corr')) - 300) < 2e-3);
  const b = await budget(page, 'sg-table');
  assert.match(b['Indicated temperature'].text[1], /^26\.85 °C$/);
  assert.match(b['Reflected temperature'].text[3], /°C\/°C$/);
  assert.match(await page.textContent('#sg-assume'), /flat \(rectangular\) response from 8 to 14 µm.*grey body/);
  await page.locator('#signal').screenshot({ path: resolve(ARTIFACTS, 'task-lwir.png') });

  // The same instrument described by its calibration curve (counts): the GUM budget of the
  // reference (Sakuma–Hattori A = 10 µm, B = 180 µm·K, C = 10⁶ counts, object at 350 K).
  const r = t.budget;
  await select(page, 'tu', 'K');
  await select(page, 'sg-mode', 'counts');
  await setValue(page, 'sg-ca', '10');
  await setValue(page, 'sg-cb', '180');
  await setValue(page, 'sg-cc', '1e6');
  await setValue(page, 'sg-n', String(r.signal));
  await setValue(page, 'sg-un', String(r.standard_uncertainties[0]));
  await setValue(page, 'sg-eps', '0.9');
  await setValue(page, 'sg-ueps', '0.02');
  await setValue(page, 'sg-tr', '295');
  await setValue(page, 'sg-utr', '5');
  await setValue(page, 'sg-tau', '0.98');
  await setValue(page, 'sg-utau', '0.01');
  await setValue(page, 'sg-tp', '293');
  await setValue(page, 'sg-utp', '3');
  assert.ok(Math.abs(num(await resultText(page, 'sg-res', 't')) - 350) < 1e-4, await resultText(page, 'sg-res', 't'));
  const rows = await budget(page, 'sg-table');
  const names = ['Signal', 'Emissivity ε', 'Reflected temperature', 'Path transmittance τ', 'Path temperature'];
  names.forEach((n, i) => {
    assert.ok(rel(rows[n].value[3], r.sensitivities[i]) < 1e-5, `${n} sensitivity ${rows[n].value[3]} vs ${r.sensitivities[i]}`);
    assert.ok(rel(rows[n].value[4], r.contributions_k[i]) < 1e-5, `${n} contribution`);
    assert.ok(Math.abs(rows[n].value[5] - r.shares[i]) < 1e-6, `${n} share`);
  });
  const combined = Object.entries(rows).find(([k]) => k.startsWith('Combined'))[1];
  assert.ok(rel(combined.value[4], r.combined_k) < 1e-6, `u_c ${combined.value[4]} vs ${r.combined_k}`);
  // A curve fitted in the calibration section is taken over with one button (no copying).
  await page.click('#sg-take');
  await page.waitForTimeout(50);
  assert.equal(num(await page.inputValue('#sg-ca')).toPrecision(7), num(await resultText(page, 'cf-fit', 'A')).toPrecision(7));
  assert.equal(await page.getAttribute('#signal', 'data-state'), 'ok');
  assert.deepEqual((await touched(page)).filter((id) => !id.startsWith('sg-') && id !== 'tu'), [], 'only the signal section was used');
  assert.deepEqual(consoleErrors, []);
  await context.close();
});

test('task 2: a two-colour pyrometer with an emissivity-ratio error (signal section only)', async () => {
  const r = reference('thermometry_reference.json').two_colour;
  const { page, context, consoleErrors } = await open(browser);
  await select(page, 'sg-mode', 'ratio');
  // The page guides toward two equal narrow bands and takes their wavelengths.
  assert.match(await page.textContent('#sg-form'), /two narrow bands of equal width/);
  await select(page, 'sg-lu', 'nm');
  await setValue(page, 'sg-l1', String(r.wavelength1_m * 1e9));
  await setValue(page, 'sg-l2', String(r.wavelength2_m * 1e9));
  await setValue(page, 'sg-lw', '0');
  await select(page, 'sg-rin', 'ratio');
  await setValue(page, 'sg-ratio', String(r.ratio));
  await setValue(page, 'sg-er', String(r.emissivity_ratio));
  assert.ok(Math.abs(num(await resultText(page, 'sg-res', 't')) - r.temperature_k) < 1e-3, await resultText(page, 'sg-res', 't'));
  const rows = await budget(page, 'sg-table');
  assert.ok(rel(rows['Radiance ratio L₁/L₂'].value[3], r.d_t_d_ratio) < 1e-6);
  assert.ok(rel(rows['Emissivity ratio ε₁/ε₂'].value[3], r.d_t_d_emissivity_ratio) < 1e-6);
  assert.match(await page.textContent('#sg-assume'), /single wavelengths 900 and 1050 nm.*grey-body ratio/);
  // What the pyrometer shows when set to ε₁/ε₂ = 1 …
  await setValue(page, 'sg-er', '1');
  const shown = await resultText(page, 'sg-res', 't');
  // … and the true temperature from that display, with the true emissivity ratio.
  await select(page, 'sg-rin', 'indicated');
  await setValue(page, 'sg-rti', String(num(shown)));
  await setValue(page, 'sg-erset', '1');
  await setValue(page, 'sg-er', String(r.emissivity_ratio));
  assert.ok(Math.abs(num(await resultText(page, 'sg-res', 't')) - r.temperature_k) < 0.01, await resultText(page, 'sg-res', 't'));
  const err = num(await resultText(page, 'sg-res', 'err'));
  assert.ok(Math.abs(err - (num(shown) - r.temperature_k)) < 0.01, `error of the display ${err} K`);
  await page.locator('#signal').screenshot({ path: resolve(ARTIFACTS, 'task-two-colour.png') });
  assert.deepEqual((await touched(page)).filter((id) => !id.startsWith('sg-')), [], 'only the signal section was used');
  assert.deepEqual(consoleErrors, []);
  await context.close();
});

test('task 3: photons in a 1 THz mode at room temperature and at 4.2 K (mode section only)', async () => {
  const rows = reference('stats_reference.json').rows;
  const ref = (table, f, t) => Number(rows.find((x) => x[0] === table && x[1] === f && x[2] === t)[3]);
  const { page, context, consoleErrors } = await open(browser);
  await select(page, 'md-fu', 'THz');
  await setValue(page, 'md-f', '1');
  await setValue(page, 'md-t', '300');
  assert.ok(rel(num(await resultText(page, 'md-res', 'n')), ref('thermal_photon_number', '1e12', '300')) < 1e-6);
  assert.ok(Math.abs(num(await resultText(page, 'md-res', 'tnoise')) - ref('quantum_noise_temperature', '1e12', '300')) < 1e-4);
  assert.ok(Math.abs(num(await resultText(page, 'md-res', 'trj')) - ref('rayleigh_jeans_temperature', '1e12', '300')) < 1e-4);
  // The same mode given as a wavelength (c / 1 THz = 299.792458 µm).
  await select(page, 'md-fu', 'um');
  assert.equal(await page.inputValue('#md-f'), '299.792458');
  await select(page, 'md-fu', 'THz');
  // Its own temperature, in °C if wished, and its own plot.
  await select(page, 'md-tu', 'degC');
  await setValue(page, 'md-t', '-268.95'); // 4.2 K
  assert.ok(rel(num(await resultText(page, 'md-res', 'n')), ref('thermal_photon_number', '1e12', '4.2')) < 1e-5);
  assert.ok(rel(num(await resultText(page, 'md-res', 'trj')), ref('rayleigh_jeans_temperature', '1e12', '4.2')) < 1e-5);
  assert.match(await page.textContent('#md-plot'), /n̄ at 4\.2 K/); // results in the output unit (K) …
  await select(page, 'md-ou', 'degC'); // … which is chosen on its own
  assert.match(await page.textContent('#md-plot'), /n̄ at −268\.95 °C/);
  await page.locator('#mode').screenshot({ path: resolve(ARTIFACTS, 'task-thz.png') });
  assert.deepEqual((await touched(page)).filter((id) => !id.startsWith('md-')), [], 'only the mode section was used');
  assert.deepEqual(consoleErrors, []);
  await context.close();
});
