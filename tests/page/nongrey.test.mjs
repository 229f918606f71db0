// The non-grey part of the "Signal → temperature" section, opened from file://: spectral tables
// for the target, path and window (pasted, or read from a local file) and the instrument's
// response, the spectral measurement equation, ε_eff and the terms of the signal.
//
// Reference values: tests/data/spectral_reference.json, written by tests/data/gen_spectral.py
// (mpmath 1.3.0 at 30 digits: quadrature of the same piecewise-linear interpolants, root
// finding for the inverse and for the correction of a reading). The page's own output is never
// the reference.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { resolve } from 'node:path';
import { ARTIFACTS, launch, open, reference, select, setValue, settle, resultText, num, rel } from './harness.mjs';

const REF = reference('spectral_reference.json');

// What a message must never contain (as in messages.test.mjs): a parameter name in camelCase
// or snake_case, "NaN", "undefined", "index", "inf", or an interval written in brackets.
const INTERNAL = /\b(?!meV\b)[a-z]{2,}[A-Z][A-Za-z]*\b|\b[a-z]+_[a-z]+\b|NaN|undefined|\bindex\b|\binf\b|[[(]\s*-?\d+(\.\d+)?\s*,\s*[\w.]+\s*[\])]/;

let browser;
before(async () => {
  browser = await launch();
});
after(async () => {
  await browser?.close();
});

/** A JSON table (wavelengths in metres) as two-column text in µm. */
const text = (t, header = '# wavelength (um), value') =>
  [header, ...t.wavelengths_m.map((w, i) => `${+(w * 1e6).toPrecision(15)}, ${t.values[i]}`)].join('\n');

/** The message under field `id`, checked to be in page words. */
async function message(page, id) {
  const m = (await page.textContent(`#${id}-msg`)).trim();
  assert.ok(m.length > 0, `a message under ${id}`);
  assert.doesNotMatch(m, INTERNAL, `page words under ${id}: ${m}`);
  assert.equal(await page.getAttribute(`#${id}`, 'aria-invalid'), 'true');
  return m;
}

/** The full-precision value (data-value) of the terms table row named `name`, column 3. */
async function term(page, name) {
  return page.$$eval('#sg-terms tbody tr', (trs, n) => {
    const tr = trs.find((r) => r.children[0].textContent === n);
    return tr ? Number(tr.children[2].dataset.value) : NaN;
  }, name);
}

test('a stepped emissivity table (loaded from a file) behind a flat 8–14 µm band: T, ε_eff and terms against mpmath', async () => {
  const c = REF.spectral.step_emissivity;
  const sc = c.scene;
  assert.deepEqual(sc.response.wavelengths_m, [8e-6, 14e-6]);
  assert.equal(sc.path_transmittance.constant, 1);
  const { page, context, consoleErrors } = await open(browser);
  await select(page, 'sg-mode', 'radiance');
  await select(page, 'sg-resp', 'band');
  await setValue(page, 'sg-lo', '8');
  await setValue(page, 'sg-hi', '14');
  await setValue(page, 'sg-tr', String(sc.reflected_temperature_k));
  await setValue(page, 'sg-tp', String(sc.path_temperature_k));
  await setValue(page, 'sg-tau', '1');
  await select(page, 'sg-ek', 'table');
  // The table comes from a file on this computer (read with FileReader, no request).
  await page.setInputFiles('#sg-etab-file', { name: 'coupon.csv', mimeType: 'text/csv', buffer: Buffer.from(`\ufeff${text(sc.emissivity)}\n`) });
  await page.waitForFunction(() => document.getElementById('sg-etab').value.includes('9.99'));
  await settle(page);
  await setValue(page, 'sg-sig', String(c.signal));
  assert.equal(await page.getAttribute('#signal', 'data-state'), 'ok', await page.textContent('#signal'));
  const T = num(await resultText(page, 'sg-res', 't'));
  assert.ok(Math.abs(T - c.temperature_k) < 2e-4, `object temperature ${T} K (mpmath root: ${c.temperature_k} K)`);
  const eps = num(await resultText(page, 'sg-res', 'epseff'));
  assert.ok(rel(eps, c.effective.emissivity) < 1e-5, `ε_eff ${eps} (mpmath quadrature: ${c.effective.emissivity})`);
  assert.ok(Math.abs(eps - c.grey_mean_emissivity) > 0.02, 'ε_eff is not the plain mean of the table');
  // The terms at the result temperature, at full precision (mpmath quadrature; the result
  // temperature itself carries the solver's ~1e-12 relative error).
  assert.ok(rel(await term(page, 'Target emission'), c.terms[0]) < 1e-9, 'target term (mpmath)');
  assert.ok(rel(await term(page, 'Surroundings reflected by the target'), c.terms[1]) < 1e-9, 'reflected term (mpmath)');
  assert.ok(rel(await term(page, 'Total (the reading)'), c.signal) < 1e-9, 'total (mpmath)');
  assert.match(await page.textContent('#sg-assume'), /spectral measurement equation.*flat \(rectangular\) response from 8 to 14 µm.*ε from its table/);
  // The plot shows the table with the response.
  assert.equal(await page.locator('#sg-ngplot .series').count(), 3);
  assert.deepEqual(consoleErrors, []);
  await context.close();
});

test('a reading corrected through a window table (indicated temperature, decimal commas): against mpmath', async () => {
  const c = REF.spectral_correction;
  const sc = c.scene;
  assert.equal(sc.window_reflectance.constant, 0.03);
  const { page, context, consoleErrors } = await open(browser);
  await select(page, 'tu', 'degC');
  await select(page, 'sg-mode', 'indicated');
  await setValue(page, 'sg-lo', '8');
  await setValue(page, 'sg-hi', '14');
  await setValue(page, 'sg-ti', String(c.indicated_k - 273.15));
  await setValue(page, 'sg-eset', '0,9');
  await setValue(page, 'sg-trset', String(c.setting.reflected_temperature_k - 273.15));
  await setValue(page, 'sg-tr', String(sc.reflected_temperature_k - 273.15));
  await setValue(page, 'sg-tp', String(sc.path_temperature_k - 273.15));
  await setValue(page, 'sg-tau', '1');
  await select(page, 'sg-ek', 'table');
  await setValue(page, 'sg-etab', text(sc.emissivity).replace(/, /g, '; ').replace(/(\d)\.(\d)/g, '$1,$2'));
  await select(page, 'sg-wk', 'table');
  await setValue(page, 'sg-wttab', text(sc.window_transmittance));
  await select(page, 'sg-wrk', 'grey');
  await setValue(page, 'sg-wrho', '0.03');
  await setValue(page, 'sg-wtemp', String(sc.window_temperature_k - 273.15));
  await setValue(page, 'sg-wtr', String(sc.window_reflected_temperature_k - 273.15));
  assert.equal(await page.getAttribute('#signal', 'data-state'), 'ok', await page.textContent('#signal'));
  const T = await resultText(page, 'sg-res', 't');
  assert.match(T, /°C$/);
  assert.ok(Math.abs(num(T) + 273.15 - c.expected) < 2e-4, `object temperature ${T} (mpmath: ${c.expected} K)`);
  assert.ok(await page.locator('#sg-res [data-key="twineff"]').count(), 'the window’s τ_eff is shown');
  await page.locator('#signal').screenshot({ path: resolve(ARTIFACTS, 'nongrey-window.png') });
  assert.deepEqual(consoleErrors, []);
  await context.close();
});

test('table errors appear under their table, in page words, naming the line', async () => {
  const { page, context } = await open(browser);
  await select(page, 'sg-mode', 'radiance');
  await select(page, 'sg-ek', 'table');
  // Not a number on line 3 (line 1 is a header the package skips).
  await setValue(page, 'sg-etab', 'wavelength, emissivity\n8, 0.9\n9, x\n14, 0.7');
  let m = await message(page, 'sg-etab');
  assert.match(m, /line 3/);
  assert.equal(await page.getAttribute('#sg-etab-msg', 'data-code'), 'INVALID_LINE');
  // An emissivity above 1 on line 2.
  await setValue(page, 'sg-etab', '8, 0.9\n11, 1.2\n14, 0.7');
  m = await message(page, 'sg-etab');
  assert.match(m, /line 2/);
  assert.match(m, /0 to 1/);
  // A table that does not cover the band.
  await setValue(page, 'sg-etab', '9, 0.9\n14, 0.7');
  m = await message(page, 'sg-etab');
  assert.equal(await page.getAttribute('#sg-etab-msg', 'data-code'), 'OUTSIDE_TABLE');
  assert.match(m, /covers 9 to 14 µm/);
  // …accepted once its end values are extended.
  await page.check('#sg-ends');
  await settle(page);
  assert.equal(await page.getAttribute('#signal', 'data-state'), 'ok');
  await page.uncheck('#sg-ends');
  await setValue(page, 'sg-etab', '8, 0.9\n14, 0.7');
  // A window whose transmittance plus reflectance exceeds 1 at the fourth line of its table.
  await select(page, 'sg-wk', 'table');
  await setValue(page, 'sg-wttab', '# tau\n8, 0.90\n10, 0.93\n11, 0.97\n14, 0.90');
  await setValue(page, 'sg-wrho', '0.05');
  m = await message(page, 'sg-wttab');
  assert.equal(await page.getAttribute('#sg-wttab-msg', 'data-code'), 'INVALID_TABLE_ENTRY');
  assert.match(m, /line 4/);
  assert.match(m, /cannot exceed 1/);
  await setValue(page, 'sg-wrho', '0.02');
  assert.equal(await page.getAttribute('#signal', 'data-state'), 'ok');
  await context.close();
});

test('the unit menu of a table converts its wavelength column and changes no result', async () => {
  const { page, context } = await open(browser);
  await select(page, 'sg-mode', 'radiance');
  await select(page, 'sg-ek', 'table');
  await setValue(page, 'sg-etab', '# wavelength, emissivity\n8, 0.9\n10, 0.6\n14, 0.8');
  const before = await resultText(page, 'sg-res', 't');
  const eff = await resultText(page, 'sg-res', 'epseff');
  await select(page, 'sg-etu', 'nm');
  const nm = await page.inputValue('#sg-etab');
  assert.match(nm, /^8000, 0\.9$/m, nm); // 1 µm = 1000 nm (definition of the prefixes)
  assert.match(nm, /^14000, 0\.8$/m, nm);
  assert.equal(await resultText(page, 'sg-res', 't'), before);
  await select(page, 'sg-etu', 'cm-1');
  const wn = await page.inputValue('#sg-etab');
  assert.match(wn, /^1250, 0\.9$/m, wn); // 8 µm ↔ 10⁴/8 cm⁻¹ = 1250 cm⁻¹ (reciprocal)
  assert.match(wn, /^1000, 0\.6$/m, wn);
  assert.equal(await resultText(page, 'sg-res', 't'), before);
  assert.equal(await resultText(page, 'sg-res', 'epseff'), eff);
  await context.close();
});

test('the invented demo set loads every table, says it is invented, and gives a result', async () => {
  const { page, context, consoleErrors, requests } = await open(browser, '', { viewport: { width: 1366, height: 768 } });
  assert.match(await page.textContent('#sg-ngp'), /invented demo set/);
  await page.click('#sg-demo');
  await settle(page);
  assert.equal(await page.getAttribute('#signal', 'data-state'), 'ok', await page.textContent('#signal'));
  for (const [id, v] of [['sg-ek', 'table'], ['sg-pk', 'table'], ['sg-wk', 'table'], ['sg-wrk', 'table'], ['sg-rk', 'energy']]) {
    assert.equal(await page.inputValue(`#${id}`), v);
  }
  for (const id of ['sg-etab', 'sg-ptab', 'sg-wttab', 'sg-wrtab', 'sg-rtab']) assert.match(await page.inputValue(`#${id}`), /^# INVENTED demo/);
  // ε_eff is a weighted mean of the emissivity table, so it lies between its extremes.
  const e = num(await resultText(page, 'sg-res', 'epseff'));
  const table = (await page.inputValue('#sg-etab')).split('\n').filter((l) => /^\d/.test(l)).map((l) => Number(l.split(',')[1]));
  assert.ok(e > Math.min(...table) && e < Math.max(...table), `ε_eff ${e} inside the table's range`);
  // The five terms add up to the reading (within the 5 digits shown).
  const terms = await page.$$eval('#sg-terms tbody tr', (trs) => trs.map((tr) => Number(tr.children[2].dataset.value)));
  assert.equal(terms.length, 6);
  assert.ok(rel(terms.slice(0, 5).reduce((a, b) => a + b, 0), terms[5]) < 1e-12);
  assert.equal(await page.locator('#sg-ngplot .series').count(), 5);
  assert.ok(await page.locator('#sg-mc').isHidden(), 'the grey-only Monte Carlo panel is not offered for tables');
  // At 1366 × 768 the inputs and the (longer) main result still fit the section's first screen.
  const ext = await page.evaluate(() => {
    const s = document.getElementById('signal');
    const top = s.getBoundingClientRect().top;
    const shown = [...s.querySelectorAll('.inputs input, .inputs select, .inputs textarea, .inputs button')].filter((x) => !x.closest('[hidden]') && x.getClientRects().length > 0);
    return { inputs: Math.max(...shown.map((x) => x.getBoundingClientRect().bottom - top)), main: s.querySelector('.main-result').getBoundingClientRect().bottom - top };
  });
  assert.ok(ext.inputs <= 768 && ext.main <= 768, `inputs end at ${ext.inputs} px, main result at ${ext.main} px`);
  // The cautions of the page stand above every section (process safety, medical screening).
  assert.match(await page.textContent('.cautions'), /process-safety/);
  assert.match(await page.textContent('.cautions'), /oxidised-steel sample/);
  assert.deepEqual(consoleErrors, []);
  assert.equal(requests.filter((u) => !u.startsWith('data:') && !u.startsWith('blob:') && !u.startsWith('file:')).length, 0);
  await page.locator('#signal').screenshot({ path: resolve(ARTIFACTS, 'nongrey-demo.png') });
  await context.close();
});

test('grey inputs through the spectral equation (a fully transparent window) give the grey route’s result and budget', async () => {
  // Issue 15: "grey inputs remain the special case and must give today's numbers to rounding".
  const { page, context } = await open(browser);
  const snap = async () => ({
    t: await resultText(page, 'sg-res', 't'),
    rows: await page.$$eval('#sg-table tbody tr', (trs) => trs.map((r) => [Number(r.children[3].dataset.value), Number(r.children[4].dataset.value)])),
  });
  for (const mode of ['indicated', 'radiance']) {
    await select(page, 'sg-mode', mode);
    await select(page, 'sg-wk', 'none');
    await setValue(page, 'sg-tau', '0.95');
    await setValue(page, 'sg-utau', '0.01');
    await setValue(page, 'sg-utp', '2');
    const grey = await snap();
    await select(page, 'sg-wk', 'grey');
    await setValue(page, 'sg-wtau', '1');
    await setValue(page, 'sg-wrho', '0');
    assert.equal(await page.getAttribute('#signal', 'data-state'), 'ok');
    assert.match(await page.textContent('#sg-assume'), /spectral measurement equation/);
    const spec = await snap();
    assert.equal(spec.t, grey.t, `${mode}: object temperature`);
    // reading, ε, T_refl, τ, T_path and u_c: sensitivities and contributions to 1e-12
    const pick = (r) => [...r.slice(0, 5), r[r.length - 1]];
    pick(spec.rows).forEach(([s, c], i) => {
      const [s0, c0] = pick(grey.rows)[i];
      if (Number.isFinite(s0)) assert.ok(Math.abs(s - s0) <= 1e-12 * Math.abs(s0), `${mode} row ${i}: sensitivity ${s} vs ${s0}`);
      assert.ok(Math.abs(c - c0) <= 1e-12 * Math.abs(c0) + 1e-15, `${mode} row ${i}: contribution ${c} vs ${c0}`);
    });
  }
  await context.close();
});
