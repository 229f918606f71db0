// Messages of the offline page, opened from file://: an invalid value of each kind of input is
// reported under that input, in the page's words (the field's label, the value as entered with
// its unit, the list entry or line concerned), never with the core's parameter names, "NaN" or
// array indices; the core's error code is kept in data-code; the page recovers.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { launch, open, setValue, select, settle } from './harness.mjs';

let browser;
before(async () => {
  browser = await launch();
});
after(async () => {
  await browser?.close();
});

// What a message must never contain: a core or JavaScript parameter name (camelCase or
// snake_case: temperatureK, emissivityRatio, mu_j; unit symbols such as eV, meV are fine),
// "NaN", "undefined", "index", "inf", or an interval written in brackets.
const INTERNAL = /\b(?!meV\b)[a-z]{2,}[A-Z][A-Za-z]*\b|\b[a-z]+_[a-z]+\b|NaN|undefined|\bindex\b|\binf\b|[[(]\s*-?\d+(\.\d+)?\s*,\s*[\w.]+\s*[\])]/;

async function expectMessage(page, id, { code, has = [], section }) {
  const msg = (await page.textContent(`#${id}-msg`)).trim();
  assert.ok(msg.length > 0, `a message under ${id}`);
  assert.doesNotMatch(msg, INTERNAL, `page words under ${id}: ${msg}`);
  for (const h of has) assert.ok(msg.includes(h), `message under ${id} mentions "${h}": ${msg}`);
  if (code) assert.equal(await page.getAttribute(`#${id}-msg`, 'data-code'), code, `${id}: ${msg}`);
  assert.equal(await page.getAttribute(`#${id}`, 'aria-invalid'), 'true');
  if (section) {
    assert.equal(await page.getAttribute(`#${section}`, 'data-state'), 'error');
    // Only this field carries a message in its section.
    const others = await page.$$eval(`#${section} .msg`, (ms, own) => ms.filter((m) => m.textContent && m.id !== own).map((m) => m.id), `${id}-msg`);
    assert.deepEqual(others, [], `no other message in ${section}`);
  }
  return msg;
}

async function recover(page, id, value, section) {
  await setValue(page, id, value);
  assert.equal(await page.textContent(`#${id}-msg`), '');
  assert.equal(await page.getAttribute(`#${section}`, 'data-state'), 'ok', `${section} recovers with ${id} = ${value}`);
}

test('temperatures, lists, decimal commas and empty fields', async () => {
  const { page, context, consoleErrors } = await open(browser);
  // A list entry below absolute zero: named by its position, with the unit.
  await setValue(page, 'sp-t', '600, -5');
  await expectMessage(page, 'sp-t', { code: 'NON_POSITIVE_TEMPERATURE', has: ['Temperatures', 'entry 2', '−5 K', 'absolute zero'], section: 'spectrum' });
  // "600,900": two entries or a decimal comma? Asked, not guessed.
  await setValue(page, 'sp-t', '600,900');
  await expectMessage(page, 'sp-t', { code: 'PAGE_INPUT', has: ['ambiguous', '“;”'] });
  await setValue(page, 'sp-t', '600; 900,5');
  assert.equal(await page.getAttribute('#spectrum', 'data-state'), 'ok');
  assert.match(await page.textContent('#sp-table tbody tr:nth-child(2) th'), /^900\.5 K$/);
  await setValue(page, 'sp-t', '600, abc, 900');
  await expectMessage(page, 'sp-t', { has: ['entry 2', '“abc”', 'not a number'] });
  await recover(page, 'sp-t', '600, 900, 1300', 'spectrum');
  // A single temperature in °C below absolute zero; a decimal comma; "1,500" refused as ambiguous.
  await select(page, 'bd-tu', 'degC');
  await setValue(page, 'bd-t', '-300');
  await expectMessage(page, 'bd-t', { code: 'NON_POSITIVE_TEMPERATURE', has: ['Temperature', '−300 °C', '−273.15 °C'], section: 'band' });
  await setValue(page, 'bd-t', '1,500');
  await expectMessage(page, 'bd-t', { has: ['1.5', '1500'] });
  await setValue(page, 'bd-t', '');
  await expectMessage(page, 'bd-t', { has: ['Temperature: enter a value'] });
  await recover(page, 'bd-t', '26,85', 'band');
  // A temperature difference: a standard uncertainty below 0 (converted as a difference).
  await setValue(page, 'sg-utr', '-1');
  await expectMessage(page, 'sg-utr', { code: 'OUT_OF_RANGE', has: ['Standard uncertainty of the reflected temperature', '0 or more', '−1 K'], section: 'signal' });
  await recover(page, 'sg-utr', '3', 'signal');
  // The sweep: its end below its start; a step count that is not a whole number.
  await setValue(page, 'bd-t1', '-250');
  await expectMessage(page, 'bd-t1', { has: ['Sweep end'] });
  await recover(page, 'bd-t1', '326.85', 'band');
  await setValue(page, 'bd-n', '2.5');
  await expectMessage(page, 'bd-n', { code: 'PAGE_INPUT', has: ['Steps must be a whole number from 2 to 200', '2.5'] });
  await recover(page, 'bd-n', '8', 'band');
  assert.deepEqual(consoleErrors, []);
  await context.close();
});

test('numbers in a range, spectral limits and their order', async () => {
  const { page, context, consoleErrors } = await open(browser);
  // A number the core bounds: the interval in words, no brackets.
  await setValue(page, 'bd-eps', '1.5');
  await expectMessage(page, 'bd-eps', { code: 'OUT_OF_RANGE', has: ['Emissivity ε must be greater than 0 and at most 1', 'you entered 1.5'], section: 'band' });
  await setValue(page, 'bd-eps', 'abc');
  await expectMessage(page, 'bd-eps', { code: 'PAGE_INPUT', has: ['Emissivity ε: “abc” is not a number'] });
  await recover(page, 'bd-eps', '0,9', 'band'); // decimal comma
  // Limits in the wrong order: under the limit edited last, naming both with their unit.
  await setValue(page, 'bd-lo', '20');
  await expectMessage(page, 'bd-lo', { code: 'INVALID_BAND', has: ['Band', 'upper limit (14 µm)', 'lower limit (20 µm)'], section: 'band' });
  await setValue(page, 'bd-hi', '5');
  await expectMessage(page, 'bd-hi', { code: 'INVALID_BAND', has: ['upper limit (5 µm)'] });
  await setValue(page, 'bd-lo', '3');
  assert.equal(await page.getAttribute('#band', 'data-state'), 'ok');
  // A limit that must be positive, in its own unit.
  await setValue(page, 'sp-blo', '-1');
  await expectMessage(page, 'sp-blo', { code: 'NON_POSITIVE_SPECTRAL', has: ['Band lower limit must be greater than 0', '−1 µm'], section: 'spectrum' });
  await recover(page, 'sp-blo', '3', 'spectrum');
  // A frequency, in any frequency unit: 0 is refused, "1" THz accepted.
  await setValue(page, 'md-f', '0');
  await expectMessage(page, 'md-f', { code: 'NON_POSITIVE_SPECTRAL', has: ['Frequency must be greater than 0', '0 GHz'], section: 'mode' });
  await select(page, 'md-fu', 'THz');
  await recover(page, 'md-f', '1', 'mode');
  // Level energies: the highest below the lowest; a chemical potential that is not a number.
  await setValue(page, 'oc-e1', '-0.2');
  await expectMessage(page, 'oc-e1', { has: ['Level energies', 'highest (−0.2 eV)', 'lowest (−0.1 eV)'], section: 'occupancy' });
  await recover(page, 'oc-e1', '0.3', 'occupancy');
  await setValue(page, 'oc-mu', '0.1.2');
  await expectMessage(page, 'oc-mu', { has: ['Chemical potential μ: “0.1.2” is not a number'] });
  await recover(page, 'oc-mu', '0', 'occupancy');
  assert.deepEqual(consoleErrors, []);
  await context.close();
});

test('readings: indicated temperatures, radiances, counts, ratios and their uncertainties', async () => {
  const { page, context, consoleErrors } = await open(browser);
  // Indicated temperature that the surroundings alone would exceed: no physical solution.
  await setValue(page, 'sg-eps', '0.1');
  await setValue(page, 'sg-tr', '400');
  await expectMessage(page, 'sg-ti', { code: 'NO_PHYSICAL_SOLUTION', has: ['ε = 0.1', 'reflected'], section: 'signal' });
  await setValue(page, 'sg-tr', '308.15');
  await recover(page, 'sg-eps', '0.92', 'signal');
  await setValue(page, 'sg-eset', '0');
  await expectMessage(page, 'sg-eset', { code: 'OUT_OF_RANGE', has: ['Emissivity set on the instrument', 'greater than 0 and at most 1'] });
  await recover(page, 'sg-eset', '1', 'signal');
  await setValue(page, 'sg-ueps', '-0.02');
  await expectMessage(page, 'sg-ueps', { code: 'OUT_OF_RANGE', has: ['Standard uncertainty of the emissivity', '0 or more'] });
  await recover(page, 'sg-ueps', '0.02', 'signal');
  await setValue(page, 'sg-tau', '0');
  await expectMessage(page, 'sg-tau', { code: 'OUT_OF_RANGE', has: ['Path transmittance τ'] });
  await recover(page, 'sg-tau', '1', 'signal');
  // A band radiance below the background, with its unit and the background's value.
  await select(page, 'sg-mode', 'radiance');
  await setValue(page, 'sg-sig', '1');
  await expectMessage(page, 'sg-sig', { code: 'NO_PHYSICAL_SOLUTION', has: ['Band radiance 1 W·m⁻²·sr⁻¹ is below the', 'W·m⁻²·sr⁻¹ that the reflected surroundings'] });
  await recover(page, 'sg-sig', '40', 'signal');
  await setValue(page, 'sg-usig', '-2');
  await expectMessage(page, 'sg-usig', { code: 'OUT_OF_RANGE', has: ['Standard uncertainty of the band radiance', '−2 W·m⁻²·sr⁻¹'] });
  await recover(page, 'sg-usig', '0.2', 'signal');
  // A single-wavelength instrument: the wavelength must be positive.
  await select(page, 'sg-resp', 'point');
  await setValue(page, 'sg-x', '0');
  await expectMessage(page, 'sg-x', { code: 'NON_POSITIVE_SPECTRAL', has: ['Wavelength must be greater than 0', '0 µm'] });
  await recover(page, 'sg-x', '0.9', 'signal');
  // Counts through a curve: a coefficient out of its range.
  await select(page, 'sg-mode', 'counts');
  await setValue(page, 'sg-cc', '0');
  await expectMessage(page, 'sg-cc', { code: 'NON_POSITIVE', has: ['Curve coefficient C must be greater than 0', '0 counts'] });
  await recover(page, 'sg-cc', '5.28e6', 'signal');
  await setValue(page, 'sg-un', '-300');
  await expectMessage(page, 'sg-un', { code: 'OUT_OF_RANGE', has: ['Standard uncertainty of the signal', '−300 counts'] });
  await recover(page, 'sg-un', '300', 'signal');
  // Two-colour: channels in the wrong order, a negative width, an emissivity ratio of 0.
  await select(page, 'sg-mode', 'ratio');
  await setValue(page, 'sg-l2', '0.8');
  await expectMessage(page, 'sg-l2', { has: ['Channel 2 wavelength (0.8 µm) must be longer than channel 1 (0.9 µm)'] });
  await recover(page, 'sg-l2', '1.05', 'signal');
  await setValue(page, 'sg-lw', '-0.01');
  await expectMessage(page, 'sg-lw', { has: ['Channel width must be 0', '−0.01 µm'] });
  await recover(page, 'sg-lw', '0.02', 'signal');
  await setValue(page, 'sg-er', '0');
  await expectMessage(page, 'sg-er', { code: 'NON_POSITIVE', has: ['True emissivity ratio ε₁/ε₂ must be greater than 0'] });
  await recover(page, 'sg-er', '1.03', 'signal');
  await setValue(page, 'sg-urti', '-2');
  await expectMessage(page, 'sg-urti', { has: ['Standard uncertainty of the indicated ratio temperature must be 0 or more', '−2 K'] });
  await recover(page, 'sg-urti', '2', 'signal');
  assert.deepEqual(consoleErrors, []);
  await context.close();
});

test('tables: calibration points and spectral responses name the line concerned', async () => {
  const { page, context, consoleErrors } = await open(browser);
  const fill = async (id, text) => {
    await page.fill(`#${id}`, text);
    await settle(page);
  };
  const points = await page.inputValue('#cf-pts');
  await fill('cf-pts', '300, 54.9');
  await expectMessage(page, 'cf-pts', { code: 'TOO_FEW_POINTS', has: ['Calibration points: at least 3 points are needed; there is 1'], section: 'calib' });
  await fill('cf-pts', '300, 10\n400, x\n500, 30');
  await expectMessage(page, 'cf-pts', { has: ['line 2', '“x”', 'not a number'] });
  await fill('cf-pts', '300, 10\n400, 20, 5\n500, 30');
  await expectMessage(page, 'cf-pts', { has: ['line 2 has 3 numbers', 'needs 2'] });
  await fill('cf-pts', '# run\n300, 10\n400, 20\n300, 30');
  await expectMessage(page, 'cf-pts', { code: 'DEGENERATE_FIT', has: ['lines 2 and 4 have the same temperature'] });
  await fill('cf-pts', '300, 10\n400, 20\n-500, 30');
  await expectMessage(page, 'cf-pts', { code: 'NON_POSITIVE_TEMPERATURE', has: ['line 3', '−500 K', 'absolute zero'] });
  await fill('cf-pts', points.replace('393.15', '393,15').replace(/, /g, '; ')); // decimal comma with ";" separators
  assert.equal(await page.getAttribute('#calib', 'data-state'), 'ok', await page.textContent('#cf-pts-msg'));
  const resp = await page.inputValue('#cf-resp');
  await fill('cf-resp', '8, 1\n9, 1\n8.5, 1\n14, 1');
  await expectMessage(page, 'cf-resp', { code: 'NOT_INCREASING', has: ['Spectral response', 'line 3 is not above line 2'] });
  await fill('cf-resp', '8, 1\n9, -1\n14, 1');
  await expectMessage(page, 'cf-resp', { code: 'OUT_OF_RANGE', has: ['0 or more', 'line 2'] });
  await fill('cf-resp', resp);
  await setValue(page, 'cf-ueps', '-1');
  await expectMessage(page, 'cf-ueps', { code: 'OUT_OF_RANGE', has: ['Standard uncertainty of the emissivity'], section: 'calib' });
  await recover(page, 'cf-ueps', '0.02', 'calib');
  await setValue(page, 'cf-n', '10');
  await expectMessage(page, 'cf-n', { code: 'NO_PHYSICAL_SOLUTION', has: ['Instrument signal 10 counts'] });
  await recover(page, 'cf-n', '300000', 'calib');
  assert.deepEqual(consoleErrors, []);
  await context.close();
});
