// Layout of the offline page, opened from file://: at 1366 × 768 every section shows its inputs
// and its main result within its first 768 px (in every mode of the signal section); plots are
// drawn at their container's width, and at 400 px wide their text is still ≥ 10 px as rendered;
// the frame keeps its 4:3 aspect; menus are wide enough for their text. Also the CSV exports:
// a UTF-8 byte-order mark, one header row of unique names, empty cells for undefined values.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { resolve } from 'node:path';
import { ARTIFACTS, launch, open, select, setValue, settle, parseCsv, downloadText } from './harness.mjs';

let browser;
before(async () => {
  browser = await launch();
});
after(async () => {
  await browser?.close();
});

/** Bottom of the lowest visible input and of the main result, relative to the section's top. */
function extents(page, id) {
  return page.evaluate((sid) => {
    const s = document.getElementById(sid);
    window.scrollTo(0, s.getBoundingClientRect().top + window.scrollY);
    const top = s.getBoundingClientRect().top;
    const shown = (e) => !e.closest('[hidden]') && e.getClientRects().length > 0;
    const inputs = [...s.querySelectorAll('.inputs input, .inputs select, .inputs textarea, .inputs button')].filter(shown);
    const main = s.querySelector('.main-result');
    return {
      inputs: Math.max(...inputs.map((e) => e.getBoundingClientRect().bottom - top)),
      main: main.getBoundingClientRect().bottom - top,
      mainHeight: main.getBoundingClientRect().height,
    };
  }, id);
}

/** Visible <select>s too narrow for the text of their chosen option. */
function clippedSelects(page) {
  return page.evaluate(() => {
    const ctx = document.createElement('canvas').getContext('2d');
    return [...document.querySelectorAll('select')].filter((s) => !s.closest('[hidden]') && s.getClientRects().length > 0).map((s) => {
      const cs = getComputedStyle(s);
      ctx.font = `${cs.fontSize} ${cs.fontFamily}`;
      const text = ctx.measureText(s.selectedOptions[0]?.textContent ?? '').width;
      return { id: s.id, need: text + parseFloat(cs.paddingLeft) + 16, have: s.clientWidth };
    }).filter((x) => x.need > x.have).map((x) => `${x.id}: ${x.have} px < ${Math.ceil(x.need)} px`);
  });
}

test('1366 × 768: inputs and the main result of each section fit in its first 768 px', async () => {
  const { page, context } = await open(browser, '', { viewport: { width: 1366, height: 768 } });
  const sections = (await page.getAttribute('body', 'data-sections')).split(' ');
  const check = async (id, what) => {
    const e = await extents(page, id);
    console.log(`${what}: inputs end at ${e.inputs.toFixed(0)} px, main result at ${e.main.toFixed(0)} px`);
    assert.ok(e.mainHeight > 20, `${what}: a main result is shown`);
    assert.ok(e.inputs <= 768, `${what}: inputs end at ${e.inputs} px`);
    assert.ok(e.main <= 768, `${what}: main result ends at ${e.main} px`);
  };
  for (const id of sections) {
    await check(id, id);
    await page.screenshot({ path: resolve(ARTIFACTS, `screen-1366-${id}.png`) });
  }
  for (const [mode, extra] of [['radiance', ['sg-resp', 'band']], ['radiance', ['sg-resp', 'point']], ['counts'], ['ratio', ['sg-rin', 'ratio']], ['ratio', ['sg-rin', 'indicated']]]) {
    await select(page, 'sg-mode', mode);
    if (extra) await select(page, extra[0], extra[1]);
    await check('signal', `signal (${mode}${extra ? `, ${extra[1]}` : ''})`);
    assert.deepEqual(await clippedSelects(page), []);
  }
  // A message under a field does not push the result off the screen.
  await setValue(page, 'sg-l2', '0.8');
  await check('signal', 'signal with a message');
  assert.deepEqual(await clippedSelects(page), []);
  await context.close();
});

test('400 px wide: plots redraw at their width with text ≥ 10 px; the frame keeps its aspect', async () => {
  const { page, context, consoleErrors } = await open(browser, '', { viewport: { width: 1366, height: 900 } });
  const plots = () => page.$$eval('figure.plot', (figs) => figs.filter((f) => f.querySelector(':scope > svg')).map((f) => {
    const svg = f.querySelector(':scope > svg');
    const r = svg.getBoundingClientRect();
    const scale = r.width / svg.viewBox.baseVal.width;
    const sizes = [...svg.querySelectorAll('text')].map((t) => parseFloat(getComputedStyle(t).fontSize) * scale);
    for (const e of f.querySelectorAll('.ytitle, .xtitle, ul.legend li')) sizes.push(parseFloat(getComputedStyle(e).fontSize));
    return { id: f.id, drawn: svg.viewBox.baseVal.width, shown: r.width, box: f.clientWidth, minFont: Math.min(...sizes), texts: sizes.length };
  }));
  const wide = await plots();
  await page.setViewportSize({ width: 400, height: 900 });
  await settle(page);
  await settle(page);
  const narrow = await plots();
  assert.equal(narrow.length, 7, 'seven plots (with the spectral inputs of the signal section)');
  for (const p of narrow) {
    const w = wide.find((x) => x.id === p.id);
    console.log(`${p.id}: drawn ${w.drawn} px wide at 1366, ${p.drawn} px at 400; smallest text ${p.minFont.toFixed(1)} px`);
    assert.ok(Math.abs(p.drawn - p.box) <= 2, `${p.id} redrawn at its container's width (${p.drawn} vs ${p.box})`);
    assert.ok(p.drawn < w.drawn, `${p.id} narrower than at 1366 px`);
    assert.ok(p.texts > 5 && p.minFont >= 10, `${p.id}: smallest text ${p.minFont} px`);
  }
  const aspect = await page.$eval('#cf-canvas', (c) => c.getBoundingClientRect().width / c.getBoundingClientRect().height);
  assert.ok(Math.abs(aspect - 4 / 3) < 0.01, `frame aspect ${aspect}`);
  assert.ok(await page.$eval('#cf-canvas', (c) => c.getBoundingClientRect().right <= window.innerWidth), 'the frame fits the screen');
  assert.deepEqual(await clippedSelects(page), []);
  for (const id of ['spectrum', 'signal', 'mode', 'calib']) await page.locator(`#${id}`).screenshot({ path: resolve(ARTIFACTS, `screen-400-${id}.png`) });
  // No horizontal scrolling of the page itself at 400 px.
  assert.ok(await page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth + 1), 'no horizontal scroll');
  assert.deepEqual(consoleErrors, []);
  await context.close();
});

test('CSV: byte-order mark, one row of unique headers, empty cells for undefined values', async () => {
  const { page, context } = await open(browser);
  await select(page, 'bd-ou', 'K'); // the sweep CSV in K must not repeat "temperature (K)"
  await setValue(page, 'sp-t', '600, 600, 900');
  for (const id of ['sp-csv', 'bd-csv', 'oc-csv', 'dz-csv']) {
    const { name, text, bytes } = await downloadText(page, `#${id}`);
    assert.deepEqual([...bytes.subarray(0, 3)], [0xef, 0xbb, 0xbf], `${name} starts with the UTF-8 BOM`);
    const csv = parseCsv(text);
    assert.equal(new Set(csv.header).size, csv.header.length, `${name}: unique headers ${csv.header.join(' | ')}`);
    assert.doesNotMatch(text, /NaN|Infinity|undefined/);
    for (const r of csv.rows) assert.equal(r.length, csv.header.length, `${name}: one cell per header`);
    const headerLines = text.replace(/^\uFEFF/, '').split('\r\n').filter((l) => l && !l.startsWith('#') && !/^[-0-9"]/.test(l));
    assert.equal(headerLines.length, 1, `${name}: one header row`);
  }
  // Occupancy: Bose–Einstein is undefined at E ≤ μ: empty cells there, numbers above.
  const occ = parseCsv((await downloadText(page, '#oc-csv')).text);
  const be = occ.header.indexOf('Bose-Einstein occupancy');
  assert.ok(occ.rows.filter((r) => r[0] <= 0).every((r) => Number.isNaN(r[be])), 'empty cells at E ≤ μ');
  assert.ok(occ.rows.filter((r) => r[0] > 0).every((r) => r[be] > 0));
  await select(page, 'bd-ou', 'degC');
  const sweep = parseCsv((await downloadText(page, '#bd-csv')).text);
  assert.deepEqual(sweep.header.slice(0, 2), ['temperature (K)', 'temperature (°C)']);
  await context.close();
});
