// Uncertainty on the offline page, opened from file://: the GUM budget with degrees of freedom,
// a correlation and the coverage (k, ν_eff, U) against a hand calculation; the Monte Carlo panel
// running in slices while the page keeps answering clicks, its result against the linear case;
// the calibration transfer and the ITS-90 fixed points; messages under the right field; a unit
// menu of the new fields.
//
// Oracles (none of them the page's or the core's own code):
//   * the measurement equation S = τ·[ε·S(T) + (1 − ε)·S(T_refl)] + (1 − τ)·S(T_path) with the
//     Sakuma–Hattori curve S(T) = C/(exp(c2/(A·T + B)) − 1) inverted in closed form here,
//     sensitivity coefficients by central differences, JCGM 100:2008 eq. (16) (correlated
//     inputs), the Welch–Satterthwaite formula eq. (G.2b) and Student's t from a published table
//     (t0.975 at ν = 27: 2.052, e.g. NIST/SEMATECH e-Handbook, table 1.3.6.7.2);
//   * c2 = h·c/k with the exact SI 2019 constants;
//   * the standard deviation of a scaled and shifted t with ν degrees of freedom, u·√(ν/(ν − 2))
//     (JCGM 101:2008 §6.4.9), for the Monte Carlo check of the linear case;
//   * ITS-90 fixed-point temperatures from Preston-Thomas, Metrologia 27 (1990), Table 1.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { resolve } from 'node:path';
import { ARTIFACTS, launch, open, select, setValue, settle, resultText, num, rel } from './harness.mjs';

let browser;
before(async () => {
  browser = await launch();
});
after(async () => {
  await browser?.close();
});

const C2 = (6.62607015e-34 * 299792458) / 1.380649e-23; // m·K, SI 2019 exact constants
const SH = { A: 10e-6, B: 180e-6, C: 1e6 }; // invented curve: A = 10 µm, B = 180 µm·K, C = 10⁶ counts
const sh = (t) => SH.C / Math.expm1(C2 / (SH.A * t + SH.B));
const shInv = (s) => (C2 / Math.log1p(SH.C / s) - SH.B) / SH.A;
/** Object temperature from the inputs x = [S, ε, T_refl, τ, T_path] (the measurement equation inverted). */
const objectT = ([s, eps, tr, tau, tp]) => shInv(((s - (1 - tau) * sh(tp)) / tau - (1 - eps) * sh(tr)) / eps);

// An invented furnace-wall reading: 10 readings of the signal (Type A, ν = 9), ε = 0.9 ± 0.02
// (rectangular, u = 0.02/√3), reflected and path temperatures from one sensor (r = 0.8).
const X = [30000, 0.9, 295, 0.98, 293];
const U = [300, 0.02 / Math.sqrt(3), 3, 0, 3];
const R_TR_TP = 0.8;

/** The hand calculation: c_i, u_c (JCGM 100 eq. 16), ν_eff (eq. G.2b; only the signal has finite ν). */
function handBudget() {
  const c = X.map((x, i) => {
    const h = 1e-6 * Math.abs(x);
    const up = [...X];
    const dn = [...X];
    up[i] += h;
    dn[i] -= h;
    return (objectT(up) - objectT(dn)) / (2 * h);
  });
  const v = c.reduce((a, ci, i) => a + (ci * U[i]) ** 2, 0) + 2 * R_TR_TP * c[2] * U[2] * c[4] * U[4];
  const uc = Math.sqrt(v);
  const nuEff = uc ** 4 / ((c[0] * U[0]) ** 4 / 9);
  return { t: objectT(X), c, uc, nuEff };
}

async function enterFurnace(page) {
  await select(page, 'tu', 'K');
  await select(page, 'sg-mode', 'counts');
  const fields = { 'sg-ca': '10', 'sg-cb': '180', 'sg-cc': '1e6', 'sg-n': '30000', 'sg-un': '300', 'sg-eps': '0.9', 'sg-ueps': String(U[1]),
    'sg-tr': '295', 'sg-utr': '3', 'sg-tau': '0.98', 'sg-utau': '0', 'sg-tp': '293', 'sg-utp': '3', 'sg-nu-sig': '9' };
  for (const [id, v] of Object.entries(fields)) await setValue(page, id, v);
  await select(page, 'sg-d-eps', 'rectangular');
  await select(page, 'sg-ca1', 'tr');
  await select(page, 'sg-cb1', 'tp');
  await setValue(page, 'sg-cr1', String(R_TR_TP));
  await select(page, 'sg-cov', 'p');
  await setValue(page, 'sg-p', '95');
  assert.equal(await page.getAttribute('#signal', 'data-state'), 'ok', await page.textContent('#signal-msg'));
}

const foot = (page, table, key) => page.$eval(`#${table} tfoot tr[data-key="${key}"] td`, (td) => ({ text: td.textContent, value: Number(td.dataset.value) }));

test('GUM budget with a correlation, Type A degrees of freedom and a coverage probability (hand calculation)', async () => {
  const { page, context, consoleErrors } = await open(browser);
  await enterFurnace(page);
  const h = handBudget();
  assert.ok(Math.abs(num(await resultText(page, 'sg-res', 't')) - h.t) < 1e-3, await resultText(page, 'sg-res', 't'));
  const rows = await page.$$eval('#sg-table tbody tr', (trs) => trs.map((tr) => [...tr.children].map((c) => ({ text: c.textContent, value: Number(c.dataset.value) }))));
  ['Signal', 'Emissivity ε', 'Reflected temperature', 'Path transmittance τ', 'Path temperature'].forEach((name, i) => {
    const r = rows.find((x) => x[0].text === name);
    assert.ok(Math.abs(r[3].value - h.c[i]) <= 1e-6 * Math.abs(h.c[i]), `${name}: sensitivity ${r[3].value} vs ${h.c[i]}`);
    assert.ok(Math.abs(r[4].value - Math.abs(h.c[i]) * U[i]) <= 1e-6 * Math.abs(h.c[i] * U[i]) + 1e-12, `${name}: contribution`);
  });
  const sig = rows.find((x) => x[0].text === 'Signal');
  assert.equal(sig[6].text, '9');
  assert.match(sig[7].text, /^A, scaled t$/);
  assert.match(rows.find((x) => x[0].text === 'Emissivity ε')[7].text, /^B, rectangular$/);
  const uc = rows.find((x) => x[0].text.startsWith('Combined'))[4].value;
  // With r = 0.8 the combined uncertainty is not the root sum of squares of the contributions.
  assert.ok(rel(uc, h.uc) < 1e-6, `u_c ${uc} vs hand ${h.uc}`);
  const rss = Math.sqrt(rows.filter((x) => !x[0].text.startsWith('Combined')).reduce((a, x) => a + x[4].value ** 2, 0));
  assert.ok(uc - rss > 1e-4, 'the correlation adds to u_c');
  const nuEff = await foot(page, 'sg-table', 'nueff');
  assert.ok(rel(nuEff.value, h.nuEff) < 1e-5, `ν_eff ${nuEff.value} vs hand ${h.nuEff}`);
  assert.equal(Math.floor(h.nuEff), 27, 'the table value below is for ν = 27');
  const k = await foot(page, 'sg-table', 'k');
  assert.ok(Math.abs(k.value - 2.052) < 5e-4, `k ${k.value} vs t0.975(27) = 2.052 (published t table)`);
  assert.match(k.text, /95\.0 %/);
  const Ux = await foot(page, 'sg-table', 'U');
  assert.ok(rel(Ux.value, 2.052 * h.uc) < 3e-4, `U ${Ux.value}`);
  assert.match(await page.textContent('#sg-table tfoot td.method'), /r\(reflected temperature, path temperature\) = 0\.8.*with correlations \(eq\. 16\)/);
  assert.match(await page.innerHTML('#sg-res [data-key="U"] dt'), /<i>k<\/i> = 2\.05, <i>p<\/i> = 95\.0 %/);
  // A stated k = 2 instead: U = 2·u_c.
  await select(page, 'sg-cov', 'k');
  assert.ok(rel((await foot(page, 'sg-table', 'U')).value, 2 * h.uc) < 1e-6);
  assert.match(await page.textContent('#sg-table tfoot tr[data-key="k"] th'), /stated/);
  await page.locator('#signal').screenshot({ path: resolve(ARTIFACTS, 'uncertainty-budget.png') });
  assert.deepEqual(consoleErrors, []);
  await context.close();
});

test('Monte Carlo panel: runs in slices (a click is handled while it runs), then matches the linear case', async () => {
  const { page, context, consoleErrors } = await open(browser);
  await enterFurnace(page);
  const h = handBudget();
  // 10⁶ trials; while they run, the band section answers an edit and the Stop button its click.
  await select(page, 'sg-mcn', '1000000');
  const band0 = await resultText(page, 'bd-res', 'L');
  await page.click('#sg-mcrun');
  await page.waitForFunction(() => document.getElementById('signal').dataset.mc === 'running');
  await setValue(page, 'bd-t', '400');
  assert.notEqual(await resultText(page, 'bd-res', 'L'), band0, 'the band section recomputed during the run');
  assert.equal(await page.getAttribute('#signal', 'data-mc'), 'running', 'the run was still going');
  await page.waitForFunction(() => /Running: [1-9]/.test(document.getElementById('sg-mcstatus').textContent));
  await page.click('#sg-mcstop');
  await page.waitForFunction(() => document.getElementById('signal').dataset.mc !== 'running');
  const stopped = await resultText(page, 'sg-mcres', 'n');
  assert.match(stopped, /\(stopped\)/);
  assert.ok(num(stopped.replace(/,/g, '')) < 1e6, `stopped early: ${stopped}`);

  // A complete run of 10⁵ trials.
  await select(page, 'sg-mcn', '100000');
  await page.click('#sg-mcrun');
  await page.waitForFunction(() => document.getElementById('signal').dataset.mc === 'done', null, { timeout: 120000 });
  assert.match(await resultText(page, 'sg-mcres', 'n'), /^100,000/);
  const mean = num(await resultText(page, 'sg-mcres', 'mean'));
  const sd = num(await resultText(page, 'sg-mcres', 'sd'));
  // Linear case: the output's standard deviation, with the signal sampled as a scaled t (ν = 9):
  // u_c² − (c_S·u_S)² + (c_S·u_S)²·ν/(ν − 2). Sampling error at 10⁵ trials ≈ 0.3 %, non-linearity
  // of this model over ±3u ≈ 0.1 %: 1.5 % tolerance.
  const cs = h.c[0] * U[0];
  const sdLinear = Math.sqrt(h.uc ** 2 - cs ** 2 + cs ** 2 * (9 / 7));
  assert.ok(rel(sd, sdLinear) < 0.015, `u(y) ${sd} K vs linear ${sdLinear} K`);
  assert.ok(Math.abs(mean - h.t) < 0.05, `mean ${mean} K vs ${h.t} K`);
  const sym = (await resultText(page, 'sg-mcres', 'sym')).split(' to ').map(num);
  assert.ok(sym[0] < h.t && h.t < sym[1] && Math.abs(sym[1] - sym[0] - 2 * 1.96 * sdLinear) < 0.1 * sdLinear, `interval ${sym}`);
  assert.match(await resultText(page, 'sg-mcres', 'valid'), /^(yes|no): ends differ by .* tolerance δ = /);
  assert.ok(Number(await page.getAttribute('#sg-mchist', 'data-points')) > 100, 'histogram drawn');
  assert.match(await page.textContent('#sg-mchist'), /GUM distribution/);
  // A changed input marks the run as stale.
  await setValue(page, 'sg-ueps', '0.02');
  assert.match(await page.textContent('#sg-mcstatus'), /inputs have changed/);
  await page.locator('#sg-mc').screenshot({ path: resolve(ARTIFACTS, 'uncertainty-monte-carlo.png') });
  assert.deepEqual(consoleErrors, []);
  await context.close();
});

// What a message must never contain (as in messages.test.mjs).
const INTERNAL = /\b(?!meV\b)[a-z]{2,}[A-Z][A-Za-z]*\b|\b[a-z]+_[a-z]+\b|NaN|undefined|\bindex\b|\binf\b|[[(]\s*-?\d+(\.\d+)?\s*,\s*[\w.]+\s*[\])]/;

async function expectMessage(page, id, section, has, code) {
  const msg = (await page.textContent(`#${id}-msg`)).trim();
  assert.ok(msg.length > 0, `a message under ${id}`);
  assert.doesNotMatch(msg, INTERNAL, `page words under ${id}: ${msg}`);
  for (const x of has) assert.ok(msg.includes(x), `message under ${id} mentions "${x}": ${msg}`);
  if (code) assert.equal(await page.getAttribute(`#${id}-msg`, 'data-code'), code, msg);
  const others = await page.$$eval(`#${section} .msg`, (ms, own) => ms.filter((m) => m.textContent && m.id !== own).map((m) => m.id), `${id}-msg`);
  assert.deepEqual(others, [], `no other message in ${section}`);
}

test('messages of the budget settings and the fixed points sit under their fields', async () => {
  const { page, context, consoleErrors } = await open(browser);
  await enterFurnace(page);
  await setValue(page, 'sg-cr1', '1.5');
  await expectMessage(page, 'sg-cr1', 'signal', ['Correlation coefficient 1', 'from −1 to 1', '1.5']);
  await setValue(page, 'sg-cr1', '0.9');
  await select(page, 'sg-ca2', 'tr');
  await select(page, 'sg-cb2', 'eps');
  await setValue(page, 'sg-cr2', '0.9');
  await expectMessage(page, 'sg-cr2', 'signal', ['cannot hold together'], 'INVALID_CORRELATION');
  await setValue(page, 'sg-cr2', '0');
  await setValue(page, 'sg-cr1', '0.8');
  await setValue(page, 'sg-nu-sig', '0');
  await expectMessage(page, 'sg-nu-sig', 'signal', ['Degrees of freedom of the reading', 'greater than 0', 'you entered 0']);
  await setValue(page, 'sg-nu-sig', '9');
  await setValue(page, 'sg-p', '100');
  await expectMessage(page, 'sg-p', 'signal', ['Coverage probability', 'less than 100 %', '100 %']);
  await setValue(page, 'sg-p', '95');
  // A correlated Type A input: ν_eff is not defined, so a coverage probability cannot be used.
  await select(page, 'sg-ca2', 'sig');
  await select(page, 'sg-cb2', 'tp');
  await setValue(page, 'sg-cr2', '0.3');
  await expectMessage(page, 'sg-p', 'signal', ['stated coverage factor'], 'UNSUPPORTED');
  await setValue(page, 'sg-cr2', '0');
  assert.equal(await page.getAttribute('#signal', 'data-state'), 'ok');
  // Monte Carlo: a correlated input must be normal.
  await select(page, 'sg-d-tr', 'rectangular');
  await page.click('#sg-mcrun');
  await expectMessage(page, 'sg-d-tr', 'signal', ['joint normal distribution'], 'UNSUPPORTED');
  assert.notEqual(await page.getAttribute('#signal', 'data-mc'), 'running');
  // Fixed points: a repeated one; a negative realisation uncertainty.
  await select(page, 'cf-fp2', 'indium');
  await expectMessage(page, 'cf-fp2', 'calib', ['Fixed point 2 repeats'], 'DEGENERATE_FIT');
  await select(page, 'cf-fp2', 'tin');
  await setValue(page, 'cf-fput', '-0.01');
  await expectMessage(page, 'cf-fput', 'calib', ['Standard uncertainty of the fixed-point temperatures', '0 or more', '−0.01 K'], 'OUT_OF_RANGE');
  await setValue(page, 'cf-fput', '0.02');
  assert.equal(await page.getAttribute('#calib', 'data-state'), 'ok');
  assert.deepEqual(consoleErrors, []);
  await context.close();
});

test('calibration transfer and ITS-90 fixed points: T90 table values, ∂T/∂Ti summing to 1, a converting unit menu', async () => {
  const { page, context, consoleErrors } = await open(browser);
  await select(page, 'cf-ou', 'K');
  // ITS-90 Table 1 (Preston-Thomas 1990): freezing points In, Sn, Zn, Al.
  const t90 = { indium: 429.7485, tin: 505.078, zinc: 692.677, aluminium: 933.473 };
  await select(page, 'cf-fp1', 'indium');
  await select(page, 'cf-fp2', 'zinc');
  await select(page, 'cf-fp3', 'aluminium');
  const table = () => page.$$eval('#cf-fptable tbody tr', (trs) => trs.map((tr) => [...tr.children].map((c) => ({ text: c.textContent, value: Number(c.dataset.value) }))));
  let rows = await table();
  assert.deepEqual(rows.map((r) => num(r[1].text)), [t90.indium, t90.zinc, t90.aluminium]);
  const sum = (rs) => rs.reduce((a, r) => a + r[3].value, 0);
  assert.ok(Math.abs(sum(rows) - 1) < 1e-9, `Σ ∂T/∂Ti = ${sum(rows)} (a common shift of the references shifts the reading)`);
  assert.ok(num(await resultText(page, 'cf-fpres', 'between')) > 0);
  // A reading above the highest point: extrapolation is reported.
  await setValue(page, 'cf-fpt', '1000');
  assert.ok(num(await resultText(page, 'cf-fpres', 'above')) > 0);
  // The least-squares points: their ∂T/∂Ti for the reading also sum to 1.
  const lsq = await page.$$eval('#cf-table tbody tr', (trs) => trs.map((tr) => Number(tr.children[5].dataset.value)));
  assert.equal(lsq.length, 6);
  assert.ok(Math.abs(lsq.reduce((a, b) => a + b, 0) - 1) < 1e-9);
  // Unit menu of the realisation uncertainty converts as a difference (9 °F = 5 K); u_cal unchanged.
  const ucal = await resultText(page, 'cf-fpres', 'ucal');
  await select(page, 'cf-fputu', 'degF');
  assert.equal(await page.inputValue('#cf-fput'), '0.036');
  assert.equal(await resultText(page, 'cf-fpres', 'ucal'), ucal);
  rows = await table();
  assert.ok(Math.abs(sum(rows) - 1) < 1e-9);
  assert.match(await page.textContent('#cf-xfer'), /ITS-90 temperatures T₉₀.*not thermodynamic temperatures/);
  await page.locator('#cf-xfer').screenshot({ path: resolve(ARTIFACTS, 'uncertainty-fixed-points.png') });
  assert.deepEqual(consoleErrors, []);
  await context.close();
});
