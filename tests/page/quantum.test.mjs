// The quantum-statistics section of the offline page (file://): multi-wavelength pyrometry,
// Raman anti-Stokes/Stokes thermometry and the Y-factor receiver noise temperature.
// References: tests/data/quantum_reference.json, written by tests/data/gen_quantum.py (mpmath at
// 40 digits: the multi-wavelength fits by its own least-squares solution of the full Planck
// model, R = F·n/(n + 1) with Bose–Einstein n, the three load conventions). The dB scale is
// checked with its definition, Y = 10^(dB/10).
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { launch, open, reference, select, setValue, resultText, num, rel } from './harness.mjs';

const INTERNAL = /\b(?!meV\b)[a-z]{2,}[A-Z][A-Za-z]*\b|\b[a-z]+_[a-z]+\b|NaN|undefined|\bindex\b|\binf\b/;

let browser;
let q;
before(async () => {
  browser = await launch();
  q = reference('quantum_reference.json');
});
after(async () => {
  await browser?.close();
});

/** The channel table of a reference fit, wavelengths in µm and radiances per µm. */
function channels(m) {
  return m.wavelengths_m.map((w, i) => `${Number(w) * 1e6}, ${Number(m.radiances[i]) * 1e-6}, ${Number(m.uncertainties[i]) * 1e-6}`).join('\n');
}

test('multi-wavelength task: fitted temperature, u(T) and two-colour reading against mpmath; a unit switch; the warning', async () => {
  const { page, context, consoleErrors } = await open(browser);
  await select(page, 'oc-task', 'multi');
  const ll = q.multiwavelength.find((m) => m.name.startsWith('exact log-linear'));
  await setValue(page, 'oc-mw-data', channels(ll));
  await select(page, 'oc-mw-kind', 'logPolynomial');
  await select(page, 'oc-mw-order', '1');
  assert.equal(await page.getAttribute('#occupancy', 'data-state'), 'ok', await page.textContent('#occupancy-msg'));
  const T = await resultText(page, 'oc-mw-res', 't');
  assert.match(T, / K$/);
  assert.ok(Math.abs(num(T) - Number(ll.temperature_k)) < 2e-3, `T ${T} vs ${ll.temperature_k}`);
  const uT = Math.sqrt(Number(ll.covariance[0][0]));
  assert.ok(rel(num(await resultText(page, 'oc-mw-res', 'ut')), uT) < 0.02, `u(T) vs ${uT}`);
  assert.ok(Math.abs(num(await resultText(page, 'oc-mw-res', 'grey2')) - Number(ll.two_colour_k)) < 2e-3);
  const bright = await page.$$eval('#oc-mw-table tbody tr', (trs) => trs.map((tr) => Number(tr.children[2].textContent)));
  bright.forEach((b, i) => assert.ok(Math.abs(b - Number(ll.brightness_k[i])) < 2e-3, `channel ${i + 1}: ${b}`));
  // The main result is the task's own (the layout test measures it).
  assert.equal(await page.$eval('#occupancy .main-result', (e) => e.id), 'oc-mw-res');
  // µm → nm converts the wavelength column (×1000) and changes no result.
  const before = await page.textContent('#oc-mw-res');
  await select(page, 'oc-mw-u', 'nm');
  const first = (await page.inputValue('#oc-mw-data')).split('\n')[0];
  assert.ok(rel(Number(first.split(',')[0]), Number(ll.wavelengths_m[0]) * 1e9) < 1e-10, first);
  assert.equal(await page.textContent('#oc-mw-res'), before);
  // Grey data through a grey model: the reference 1800 K, no warning.
  const grey = q.multiwavelength.find((m) => m.name.startsWith('exact grey'));
  await select(page, 'oc-mw-u', 'um');
  await setValue(page, 'oc-mw-data', channels(grey));
  await select(page, 'oc-mw-kind', 'polynomial');
  await select(page, 'oc-mw-order', '0');
  assert.ok(Math.abs(num(await resultText(page, 'oc-mw-res', 't')) - 1800) < 2e-3);
  assert.equal(await page.isVisible('#oc-mw-warn'), false);
  // An ill-conditioned fit (order 4 on six close channels) is flagged where it cannot be missed.
  const ill = q.multiwavelength.find((m) => m.name.startsWith('ill-conditioned'));
  await setValue(page, 'oc-mw-data', channels(ill));
  await select(page, 'oc-mw-order', '4');
  assert.equal(await page.isVisible('#oc-mw-warn'), true);
  assert.match(await page.textContent('#oc-mw-warn'), /Do not trust the digits/);
  assert.match(await page.textContent('#oc-mw-res [data-key="t"] dt'), /ill-conditioned/);
  assert.deepEqual(consoleErrors, []);
  await context.close();
});

test('Raman and Y-factor tasks against mpmath; the dB menu converts the value typed', async () => {
  const { page, context, consoleErrors } = await open(browser);
  await select(page, 'oc-task', 'raman');
  // [shift m⁻¹, excitation m, ratio, detection, T K, dT/dR K]
  const [shift, exc, ratio, det, tK, dTdR] = q.raman_inverse[0];
  await setValue(page, 'oc-rm-shift', String(Number(shift) / 100));
  await setValue(page, 'oc-rm-x', String(Number(exc) * 1e9));
  await select(page, 'oc-rm-det', det);
  await setValue(page, 'oc-rm-r', ratio);
  assert.ok(Math.abs(num(await resultText(page, 'oc-rm-res', 't')) - Number(tK)) < 2e-4, await resultText(page, 'oc-rm-res', 't'));
  assert.ok(rel(num(await resultText(page, 'oc-rm-res', 'dtdr')), Number(dTdR)) < 1e-3);
  // The excitation in cm⁻¹ (ν̃ = 1/λ): converted, same temperature.
  const t0 = await resultText(page, 'oc-rm-res', 't');
  await select(page, 'oc-rm-xu', 'cm-1');
  assert.ok(rel(Number(await page.inputValue('#oc-rm-x')), 1 / (Number(exc) * 100)) < 1e-10);
  assert.equal(await resultText(page, 'oc-rm-res', 't'), t0);
  // Temperature → ratio: [shift, excitation, T, detection, ratio, θ/T].
  const fwd = q.raman.find((r) => r[2] === '77' && r[3] === 'photonCounting');
  await select(page, 'oc-rm-xu', 'nm');
  await select(page, 'oc-rm-det', 'photonCounting');
  await select(page, 'oc-rm-dir', 'temp');
  await setValue(page, 'oc-rm-t', '77');
  assert.ok(rel(num(await resultText(page, 'oc-rm-res', 'ratio')), Number(fwd[4])) < 1e-5, await resultText(page, 'oc-rm-res', 'ratio'));

  await select(page, 'oc-task', 'yfactor');
  // [Y, T_hot, T_cold, f Hz, T_R RJ, T_R Planck, T_R CW, Planck − RJ, CW − RJ]
  const [y, th, tc, f, rj, pl, cw, plMinusRj, cwMinusRj] = q.y_factor.find((r) => r[3] === '230e9');
  await setValue(page, 'oc-yf-th', th);
  await setValue(page, 'oc-yf-tc', tc);
  await setValue(page, 'oc-yf-f', '230');
  await select(page, 'oc-yf-yu', 'linear');
  await setValue(page, 'oc-yf-y', y);
  assert.equal(await page.getAttribute('#occupancy', 'data-state'), 'ok', await page.textContent('#occupancy'));
  assert.ok(Math.abs(num(await resultText(page, 'oc-yf-res', 'tr')) - Number(cw)) < 2e-4, await resultText(page, 'oc-yf-res', 'tr'));
  const rows = await page.$$eval('#oc-yf-table tbody tr', (trs) => trs.map((tr) => [Number(tr.children[3].dataset.value), Number(tr.children[4].dataset.value)]));
  [[rj, 0], [pl, plMinusRj], [cw, cwMinusRj]].forEach(([tr, d], i) => {
    assert.ok(rel(rows[i][0], Number(tr)) < 1e-9, `row ${i + 1}: ${rows[i][0]} vs ${tr}`);
    assert.ok(Math.abs(rows[i][1] - Number(d)) <= 1e-9 * Math.abs(Number(tr)), `row ${i + 1} difference ${rows[i][1]} vs ${d}`);
  });
  // linear → dB: 10·log10(1.8) dB, and the result is unchanged.
  const tr0 = await resultText(page, 'oc-yf-res', 'tr');
  await select(page, 'oc-yf-yu', 'dB');
  assert.ok(Math.abs(Number(await page.inputValue('#oc-yf-y')) - 10 * Math.log10(1.8)) < 1e-10, await page.inputValue('#oc-yf-y'));
  assert.equal(await resultText(page, 'oc-yf-res', 'tr'), tr0);
  // The load temperatures in °C (T/K = t/°C + 273.15): converted, result unchanged.
  await select(page, 'oc-yf-tu', 'degC');
  assert.ok(Math.abs(Number(await page.inputValue('#oc-yf-th')) - (Number(th) - 273.15)) < 1e-9);
  assert.equal(await resultText(page, 'oc-yf-res', 'tr'), tr0);
  assert.deepEqual(consoleErrors, []);
  await context.close();
});

test('carrier task: intrinsic density and Fermi level from a density against mpmath; n·p = nᵢ²', async () => {
  const { page, context, consoleErrors } = await open(browser);
  const E = 1.602176634e-19; // J per eV (SI 2019, exact)
  await select(page, 'oc-task', 'carriers');
  // [m_e*, m_h*, Eg0 J, alpha J/K, beta K, T K, E_i J, n_i m⁻³, …]: the demo material is this row's.
  const row = q.intrinsic.find((r) => r[5] === '300');
  assert.ok(rel(Number(row[2]) / E, 1.17) < 1e-12 && rel(Number(row[3]) / E, 0.473e-3) < 1e-9, 'demo = reference material');
  assert.equal(await page.getAttribute('#occupancy', 'data-state'), 'ok', await page.textContent('#occupancy'));
  assert.ok(rel(num(await resultText(page, 'oc-sc-res', 'ni')) * 1e6, Number(row[7])) < 1e-4, await resultText(page, 'oc-sc-res', 'ni'));
  assert.ok(Math.abs(num(await resultText(page, 'oc-sc-res', 'ei')) - Number(row[6]) / E) < 1e-6);
  // Non-degenerate: n·p = nᵢ² (issue 18's limiting case), to the 5 digits shown.
  const np = num(await resultText(page, 'oc-sc-res', 'n')) * num(await resultText(page, 'oc-sc-res', 'p'));
  assert.ok(rel(np, (Number(row[7]) * 1e-6) ** 2) < 1e-3, `n·p ${np}`);
  // The Fermi level giving n = 10¹⁵ cm⁻³ at 200 K: [… T, n m⁻³, E_F J].
  const ff = q.fermi_from_density.find((r) => r[5] === '200' && r[6] === '1e21');
  await setValue(page, 'oc-sc-t', '200');
  await select(page, 'oc-sc-from', 'n');
  await setValue(page, 'oc-sc-n', '1e15');
  assert.ok(Math.abs(num(await resultText(page, 'oc-sc-res', 'ef')) - Number(ff[7]) / E) < 2e-6, await resultText(page, 'oc-sc-res', 'ef'));
  assert.ok(rel(num(await resultText(page, 'oc-sc-res', 'n')), 1e15) < 1e-4);
  // The band gap in meV: converted (×1000), same results.
  const before = await page.textContent('#oc-sc-res');
  await select(page, 'oc-sc-egu', 'meV');
  assert.ok(Math.abs(Number(await page.inputValue('#oc-sc-eg')) - 1170) < 1e-9);
  assert.equal(await page.textContent('#oc-sc-res'), before);
  // A mass of 0 is reported under its field.
  await setValue(page, 'oc-sc-me', '0');
  assert.match(await page.textContent('#oc-sc-me-msg'), /Electron density-of-states mass ratio must be greater than 0/);
  assert.deepEqual(consoleErrors, []);
  await context.close();
});

test('quantum statistics: messages under the field concerned, in page words', async () => {
  const { page, context } = await open(browser);
  const expect = async (id, value, has) => {
    await setValue(page, id, value);
    assert.equal(await page.getAttribute('#occupancy', 'data-state'), 'error');
    const msg = (await page.textContent(`#${id}-msg`)).trim();
    for (const h of has) assert.ok(msg.includes(h), `${id}: "${msg}" mentions ${h}`);
    assert.doesNotMatch(msg, INTERNAL, msg);
    const others = await page.$$eval('#occupancy .msg', (ms, own) => ms.filter((m) => m.textContent && m.id !== own).map((m) => m.id), `${id}-msg`);
    assert.deepEqual(others, []);
  };
  const recover = async (id, value) => {
    await setValue(page, id, value);
    assert.equal(await page.getAttribute('#occupancy', 'data-state'), 'ok');
  };
  await select(page, 'oc-task', 'multi');
  await select(page, 'oc-mw-order', '4');
  await expect('oc-mw-data', '0.9, 122, 0.6\n1.05, 368, 1.8\n1.2, 761, 3.8\n1.35, 1220, 6.1\n1.5, 1638, 8.2', ['Channels', 'at least 6 channels', 'there are 5']);
  await select(page, 'oc-mw-order', '1');
  await expect('oc-mw-data', '0.9, 122, 0.6\n1.05, -368, 1.8\n1.2, 761, 3.8', ['Channels', 'line 2', 'radiance', 'greater than 0']);
  await expect('oc-mw-data', '0.9, 122, 0.6\n1.2, 368, 1.8\n1.05, 761, 3.8', ['Channels', 'increase', 'line 3']);
  await recover('oc-mw-data', '0.9, 122.03, 0.61\n1.05, 368.36, 1.84\n1.2, 761.01, 3.81\n1.35, 1220.7, 6.10');
  await select(page, 'oc-task', 'raman');
  await expect('oc-rm-r', '5', ['Anti-Stokes/Stokes ratio', 'less than the frequency factor', 'you entered 5']);
  await expect('oc-rm-r', '0', ['Anti-Stokes/Stokes ratio', 'greater than 0']);
  await recover('oc-rm-r', '0.1');
  await expect('oc-rm-shift', '30000', ['Raman shift', 'below the excitation']);
  await recover('oc-rm-shift', '520.7');
  await select(page, 'oc-task', 'yfactor');
  await expect('oc-yf-y', '−1', ['Y-factor', 'greater than 1', '−1 dB']);
  await expect('oc-yf-y', '10', ['Y-factor', 'must be below', 'dB']);
  await recover('oc-yf-y', '2.55');
  // A linear Y ≤ 0 has no value in dB: the scale stays linear and the message says why.
  await select(page, 'oc-yf-yu', 'linear');
  await expect('oc-yf-y', '-2', ['Y-factor', 'greater than 1']);
  await select(page, 'oc-yf-yu', 'dB');
  assert.equal(await page.inputValue('#oc-yf-yu'), 'linear');
  assert.equal(await page.inputValue('#oc-yf-y'), '-2');
  assert.match(await page.textContent('#oc-yf-y-msg'), /greater than 1/);
  await recover('oc-yf-y', '1.8');
  await expect('oc-yf-th', '50', ['Hot load temperature', 'above the cold load temperature', '77 K']);
  await recover('oc-yf-th', '295');
  await context.close();
});

test('quantum statistics at 1366 × 768: each task shows its inputs and its main result in the first 768 px', async () => {
  const { page, context } = await open(browser, '', { viewport: { width: 1366, height: 768 } });
  for (const task of ['occupancy', 'multi', 'raman', 'yfactor', 'carriers']) {
    await select(page, 'oc-task', task);
    const e = await page.evaluate(() => {
      const s = document.getElementById('occupancy');
      const top = s.getBoundingClientRect().top;
      const shown = (x) => !x.closest('[hidden]') && x.getClientRects().length > 0;
      const inputs = [...s.querySelectorAll('.inputs input, .inputs select, .inputs textarea')].filter(shown);
      const main = s.querySelector('.main-result');
      return { inputs: Math.max(...inputs.map((x) => x.getBoundingClientRect().bottom - top)), main: main.getBoundingClientRect().bottom - top, h: main.getBoundingClientRect().height };
    });
    assert.ok(e.h > 20, `${task}: a main result is shown`);
    assert.ok(e.inputs <= 768 && e.main <= 768, `${task}: inputs end at ${e.inputs} px, main result at ${e.main} px`);
  }
  await context.close();
});
