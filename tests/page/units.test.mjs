// Unit menus of the offline page, opened from file://: every input-unit menu converts the
// values of the fields it governs (the physical quantity does not change, and neither does any
// result); every output-unit menu changes how results are written, never the inputs; the
// page-wide temperature unit converts every temperature field and is kept in the link.
//
// The test converts with the unit definitions themselves, independently of the core:
// T/K = t/°C + 273.15 and t/°F = 1.8·t/°C + 32 (ITS-90 / SI Brochure 9th ed. §2.3.1 and the
// definition of the Fahrenheit scale); SI prefixes; ν = c/λ and ν = c·ν̃ with c = 299 792 458 m/s
// and E = hν with h = 6.626 070 15×10⁻³⁴ J·s, e = 1.602 176 634×10⁻¹⁹ C (exact, SI 2019).
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { launch, open, select, setValue, settle, num, rel, parseCsv, downloadText } from './harness.mjs';

let browser;
before(async () => {
  browser = await launch();
});
after(async () => {
  await browser?.close();
});

const C = 299792458;
const H = 6.62607015e-34;
const E = 1.602176634e-19;
const LENGTH = { um: 1e-6, nm: 1e-9, mm: 1e-3, m: 1 };
const FREQ = { THz: 1e12, GHz: 1e9, MHz: 1e6, kHz: 1e3, Hz: 1 };

/** A spectral value as a frequency in Hz (any kind), so values of any two units compare. */
function toHz(v, unit) {
  if (unit in LENGTH) return C / (v * LENGTH[unit]);
  if (unit === 'cm-1') return C * v * 100;
  if (unit in FREQ) return v * FREQ[unit];
  if (unit === 'eV') return (v * E) / H;
  if (unit === 'meV') return (v * 1e-3 * E) / H;
  throw new Error(`unit ${unit}`);
}
const toK = (v, u) => ({ K: v, degC: v + 273.15, degF: ((v + 459.67) * 5) / 9 })[u];
const diffToK = (v, u) => ({ K: v, degC: v, degF: (v * 5) / 9 })[u];

/** The text of a number as written in a field (decimal point, ×10ⁿ or e notation). */
function fieldNumber(text) {
  const s = text.trim().replace(/\u2212/g, '-');
  const m = /^(-?[0-9.]+)(?:×10([⁻⁰¹²³⁴⁵⁶⁷⁸⁹]+))?$/.exec(s);
  if (m && m[2]) return num(s);
  return Number(s);
}

/**
 * The physical value(s) a field holds, in SI-comparable form. `lengths`: the menu offers only
 * lengths (a width or a wavelength is then compared as a length, so 0 stays comparable).
 */
function physical(kind, text, unit, lengths = false) {
  const one = (v) => {
    switch (kind) {
      case 'temperature':
      case 'temperatures':
        return toK(v, unit);
      case 'tdiff':
        return diffToK(v, unit);
      case 'spectral':
        return lengths ? v * LENGTH[unit] : toHz(v, unit);
      case 'density':
        return v / LENGTH[unit]; // spectral radiance per metre of wavelength
      default:
        throw new Error(kind);
    }
  };
  if (kind === 'temperatures') return text.split(/\s*,\s*/).map((t) => one(fieldNumber(t)));
  if (kind === 'table') {
    return text.split('\n').filter((l) => /^\s*[0-9.]/.test(l)).map((l) => l.split(/\s*,\s*/)[0]);
  }
  if (text.trim() === '') return [];
  return [one(fieldNumber(text))];
}

/** The texts the test compares before/after an input-unit change: every section's results. */
async function results(page) {
  return page.evaluate(() => Object.fromEntries(
    [...document.querySelectorAll('.calc')].map((s) => [s.id,
      [...s.querySelectorAll('dl.main-result dd, #sp-table tbody td:nth-child(n+4), #oc-res dd, #cf-fit dd')].map((d) => d.textContent).join(' | ')]),
  ));
}

async function menuInfo(page) {
  return page.$$eval('select[data-unit][data-for]', (ss) => ss.map((s) => ({
    id: s.id,
    hidden: !!s.closest('[hidden]'),
    kind: s.dataset.unit,
    value: s.value,
    options: [...s.options].map((o) => o.value),
    fields: s.dataset.for.split(/\s+/).map((id) => {
      const f = document.getElementById(id);
      return { id, kind: f.dataset.kind, colKind: f.dataset.colKind, text: f.value };
    }),
  })));
}

async function tableFirstColumn(page, id) {
  const text = await page.inputValue(`#${id}`);
  return parseCsv(`a,b\n${text.split('\n').filter((l) => /^\s*[0-9.-]/.test(l)).join('\n')}`).rows.map((r) => r[0]);
}

test('every input-unit menu converts its fields and changes no result', async () => {
  const { page, context, consoleErrors } = await open(browser);
  const tested = new Set();
  // Unit menus shown only in some modes: visit each mode that shows them.
  const configurations = [[], [['sg-mode', 'radiance'], ['sg-resp', 'point']], [['sg-mode', 'ratio'], ['sg-rin', 'indicated']],
    [['sg-mode', 'indicated'], ['click', '#sg-demo']], // the signal section's spectral tables (the invented demo set)
    [['oc-task', 'multi']], [['oc-task', 'raman'], ['oc-rm-dir', 'temp']], [['oc-task', 'yfactor']], [['oc-task', 'carriers']]];
  for (const config of configurations) {
    for (const [id, v] of config) {
      if (id === 'click') {
        await page.click(v);
        await settle(page);
      } else await select(page, id, v);
    }
    for (const m of await menuInfo(page)) {
      if (m.hidden || tested.has(m.id)) continue;
      tested.add(m.id);
      const before = await results(page);
      const original = m.value;
      const lengthsOnly = m.options.every((o) => o in LENGTH);
      const phys0 = {};
      for (const f of m.fields) {
        phys0[f.id] = f.kind === 'table' ? await tableFirstColumn(page, f.id) : physical(f.kind, f.text, original, lengthsOnly);
      }
      // Every other temperature unit; for a spectral menu, the first unit of each other kind and
      // one more unit of the same kind (µm → nm → cm⁻¹ → THz …); then back to the original.
      const kindOf = (u) => (u in LENGTH ? 'length' : u in FREQ ? 'frequency' : u === 'cm-1' ? 'wavenumber' : u.endsWith('eV') ? 'energy' : u);
      const seen = new Set([kindOf(original)]);
      const targets = m.options.filter((o) => {
        if (o === original) return false;
        if (m.kind !== 'spectral' || !seen.has(kindOf(o))) {
          seen.add(kindOf(o));
          return true;
        }
        return false;
      });
      const same = m.options.find((o) => o !== original && kindOf(o) === kindOf(original));
      if (m.kind === 'spectral' && same && !targets.includes(same)) targets.unshift(same);
      for (const target of targets.concat([original])) {
        const from = await page.inputValue(`#${m.id}`);
        await select(page, m.id, target);
        assert.equal(await page.inputValue(`#${m.id}`), target, `${m.id} switched to ${target}`);
        for (const f of m.fields) {
          const text = await page.inputValue(`#${f.id}`);
          if (f.kind === 'table') {
            const now = await tableFirstColumn(page, f.id);
            const was = phys0[f.id];
            // A wavelength column in metres (a wavenumber column: λ = 1/ν̃, 1 cm⁻¹ ↔ 0.01 m).
            const metres = (v, u) => (u === 'cm-1' ? 0.01 / v : v * LENGTH[u]);
            const conv = f.colKind === 'temperature' ? (v) => toK(v, target) : (v) => metres(v, target);
            const orig = f.colKind === 'temperature' ? (v) => toK(v, original) : (v) => metres(v, original);
            now.forEach((v, i) => assert.ok(rel(conv(v), orig(was[i])) < 1e-10, `${f.id} line ${i + 1} in ${target}: ${v}`));
            continue;
          }
          const got = physical(f.kind, text, target, lengthsOnly).sort((a, b) => a - b);
          const want = [...phys0[f.id]].sort((a, b) => a - b);
          // A pair of limits converted to a reciprocal unit swaps: compare the pair as a set.
          const pairIds = m.fields.map((x) => x.id);
          if (m.fields.length === 2 && m.fields.every((x) => x.kind === 'spectral') && pairIds.includes(f.id)) {
            const both = (await Promise.all(pairIds.map((id) => page.inputValue(`#${id}`)))).map((t) => physical('spectral', t, target, lengthsOnly)[0]).sort((a, b) => a - b);
            const both0 = pairIds.map((id) => phys0[id][0]).sort((a, b) => a - b);
            both.forEach((v, i) => assert.ok(rel(v, both0[i]) < 1e-10, `${m.id} ${from}→${target}: range ${both} vs ${both0}`));
            continue;
          }
          assert.equal(got.length, want.length, `${f.id}: ${text}`);
          got.forEach((v, i) => assert.ok(Math.abs(v - want[i]) <= Math.abs(want[i]) * 1e-10 + 1e-12, `${f.id} ${from}→${target}: "${text}" = ${v} vs ${want[i]}`));
        }
        const after = await results(page);
        for (const [sec, txt] of Object.entries(before)) assert.equal(after[sec], txt, `${m.id} → ${target}: results of ${sec} unchanged`);
      }
    }
  }
  const all = (await menuInfo(page)).map((m) => m.id);
  assert.deepEqual(all.filter((id) => !tested.has(id)), [], 'every input-unit menu was switched');
  console.log(`${tested.size} unit menus switched`);
  assert.deepEqual(consoleErrors, []);
  await context.close();
});

test('output-unit menus change how results are written, never the inputs', async () => {
  const { page, context } = await open(browser);
  const inputs = () => page.$$eval('[data-kind]', (fs) => fs.map((f) => `${f.id}=${f.value}`).join('\n'));
  const in0 = await inputs();
  const dd = (dl, key) => page.textContent(`#${dl} [data-key="${key}"] dd`);
  // Temperature outputs: the object temperature converts as a temperature, u_c as a difference.
  for (const [menu, dl] of [['sg-ou', 'sg-res'], ['cf-ou', 'cf-res']]) {
    const t0 = num(await dd(dl, 't'));
    const u0 = num(await dd(dl, 'uc'));
    await select(page, menu, 'degF');
    assert.match(await dd(dl, 't'), /°F$/);
    assert.ok(Math.abs(toK(num(await dd(dl, 't')), 'degF') - t0) < 1e-3, `${menu}: ${await dd(dl, 't')}`);
    assert.ok(rel(diffToK(num(await dd(dl, 'uc')), 'degF'), u0) < 0.05, `${menu}: u in °F as a difference`);
    assert.match(await page.textContent(`#${dl === 'sg-res' ? 'sg-table' : 'cf-budget'}`), /°F\/°F/);
    await select(page, menu, 'degC');
    assert.ok(Math.abs(num(await dd(dl, 't')) + 273.15 - t0) < 1e-3);
    assert.equal(num(await dd(dl, 'uc')), u0, 'a difference of 1 °C is 1 K');
    await select(page, menu, 'K');
  }
  const tn = num(await dd('md-res', 'tnoise'));
  await select(page, 'md-ou', 'degC');
  assert.ok(Math.abs(num(await dd('md-res', 'tnoise')) + 273.15 - tn) < 1e-5);
  const bd = await dd('bd-res', 'dLdT');
  await select(page, 'bd-ou', 'degF');
  assert.ok(rel(num(await dd('bd-res', 'dLdT')) * 1.8, num(bd)) < 1e-6, 'dL/dT per °F is 5/9 of dL/dT per K');
  const sp = await page.textContent('#sp-table tbody tr:first-child th');
  await select(page, 'sp-ou', 'degC');
  assert.equal(await page.textContent('#sp-table tbody tr:first-child th'), `${(num(sp) - 273.15).toFixed(2)} °C`);
  // Spectral outputs: the plot axis changes; band values do not; kT converts as an energy.
  const band = await page.$$eval('#sp-table tbody td:nth-child(4)', (tds) => tds.map((t) => t.textContent));
  await select(page, 'sp-xu', 'cm-1');
  assert.deepEqual(await page.$$eval('#sp-table tbody td:nth-child(4)', (tds) => tds.map((t) => t.textContent)), band);
  const csv = parseCsv((await downloadText(page, '#sp-csv')).text);
  assert.equal(csv.header[0], 'wavenumber (cm⁻¹)');
  assert.ok(rel(csv.rows[0][0], 1e4 / 20) < 1e-9, 'the plot starts at 20 µm = 500 cm⁻¹');
  const kT = num(await dd('oc-res', 'kT'));
  await select(page, 'oc-xu', 'THz');
  assert.ok(rel(num(await dd('oc-res', 'kT')), (kT * E) / H / 1e12) < 1e-5);
  const n = await dd('md-res', 'n');
  await select(page, 'md-xu', 'THz');
  assert.equal(await dd('md-res', 'n'), n);
  assert.equal(await inputs(), in0, 'no input field changed');
  await context.close();
});

test('one temperature unit for all sections: converted fields and results, kept in the link', async () => {
  const first = await open(browser);
  const { page } = first;
  const values = () => page.$$eval('[data-kind="temperature"], [data-kind="tdiff"]', (fs) => Object.fromEntries(fs.map((f) => [f.id, f.value])));
  const k = await values();
  const tObj = num(await page.textContent('#sg-res [data-key="t"] dd'));
  await select(page, 'tu', 'degF');
  const f = await values();
  for (const [id, v] of Object.entries(k)) {
    const kind = await page.getAttribute(`#${id}`, 'data-kind');
    const back = kind === 'tdiff' ? diffToK(Number(f[id]), 'degF') : toK(Number(f[id]), 'degF');
    assert.ok(Math.abs(back - Number(v)) < 1e-9 * Math.max(1, Number(v)), `${id}: ${v} K → ${f[id]} °F`);
  }
  assert.equal(await page.inputValue('#bd-t'), '80.33');
  assert.match(await page.textContent('#sg-res [data-key="t"] dd'), /°F$/);
  assert.ok(Math.abs(toK(num(await page.textContent('#sg-res [data-key="t"] dd')), 'degF') - tObj) < 1e-3);
  await page.waitForFunction(() => location.hash.includes('tu=degF'));
  const hash = await page.evaluate(() => location.hash);
  await first.context.close();
  // The link gives the same fields and results, in °F.
  const second = await open(browser, hash);
  assert.deepEqual(await second.page.$$eval('[data-kind="temperature"], [data-kind="tdiff"]', (fs) => Object.fromEntries(fs.map((x) => [x.id, x.value]))), f);
  assert.equal(await second.page.inputValue('#tu'), 'degF');
  await select(second.page, 'tu', 'K');
  assert.deepEqual(await second.page.$$eval('[data-kind="temperature"], [data-kind="tdiff"]', (fs) => Object.fromEntries(fs.map((x) => [x.id, x.value]))), k);
  // A field in a unit other than the page-wide one, or typed with its default text in the
  // page-wide unit, comes back from the link in the same unit.
  await select(second.page, 'tu', 'degC');
  await select(second.page, 'bd-tu', 'K');
  await setValue(second.page, 'bd-t', '350');
  await setValue(second.page, 'oc-t', '300'); // 300 °C, the default text of a 300 K field
  await second.page.waitForFunction(() => location.hash.includes('bd-t=350') && location.hash.includes('oc-t=300'));
  const link = await second.page.evaluate(() => location.hash);
  const third = await open(browser, link);
  assert.equal(await third.page.inputValue('#bd-t'), '350');
  assert.equal(await third.page.inputValue('#bd-tu'), 'K');
  assert.equal(await third.page.inputValue('#oc-t'), '300');
  assert.equal(await third.page.inputValue('#oc-tu'), 'degC');
  assert.equal(await third.page.inputValue('#bd-t0'), '-23.15', 'an untouched field: its default, converted');
  await third.context.close();
  // "Reset this section" restores its defaults in the page-wide unit.
  await select(second.page, 'tu', 'degC');
  await second.page.fill('#bd-t', '99');
  await second.page.click('#band button.reset-sec');
  await settle(second.page);
  assert.equal(await second.page.inputValue('#bd-t'), '26.85');
  assert.equal(await second.page.inputValue('#bd-tu'), 'degC');
  assert.deepEqual(second.consoleErrors, []);
  await second.context.close();
});

test('a value that cannot be converted leaves the unit as it was, with a note under the field', async () => {
  const { page, context } = await open(browser);
  await page.fill('#oc-e0', '-0.1');
  await select(page, 'oc-eu', 'THz'); // energies and frequencies are proportional: converts
  assert.ok(Math.abs(Number(await page.inputValue('#oc-e0')) - (-0.1 * E) / H / 1e12) < 1e-9);
  await page.fill('#md-f', 'abc');
  await settle(page);
  await select(page, 'md-fu', 'THz');
  assert.equal(await page.inputValue('#md-fu'), 'GHz');
  assert.equal(await page.inputValue('#md-f'), 'abc');
  assert.match(await page.textContent('#md-f-msg'), /“abc” is not a number.*The unit was left at GHz/);
  await page.fill('#md-f', '0');
  await settle(page);
  await select(page, 'md-fu', 'um'); // 0 GHz has no wavelength
  assert.equal(await page.inputValue('#md-fu'), 'GHz');
  assert.match(await page.textContent('#md-f-msg'), /0 GHz has no equivalent in µm/);
  await context.close();
});
