// SpectralInstrument.uncertaintyBudget: the GUM budget of a spectral (non-grey) measurement.
//
// Reference values: tests/data/spectral_budget_reference.json, written by
// tests/data/gen_spectral_budget.py — JCGM 100:2008 eq. (10), (16) and (G.2b) evaluated in
// mpmath (30 digits) on the mpmath finite-difference sensitivity coefficients of
// tests/data/spectral_reference.json, with the coverage factor from mpmath root finding on
// Student's t CDF (regularized incomplete beta) or the normal quantile. Tolerance 1e-12 (measured
// 2.2e-16): the analytic coefficients agree with the mpmath finite differences to 1.5e-15.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { qb, close, throwsCode, loadReference, spectralDefinition as definition } from './helpers.mjs';

const REF = loadReference('spectral_reference.json');
const BUDGET = loadReference('spectral_budget_reference.json');

/** The uncertainties of a reference case as the method takes them. */
const uncertainties = (c) =>
  Object.fromEntries(Object.entries(c.uncertainties).map(([k, v]) => [k, v.nu === null ? v.u : { standardUncertainty: v.u, degreesOfFreedom: v.nu, evaluation: 'typeA' }]));

test('budgets against JCGM 100 eq. 10/16/G.2b in mpmath (1e-12)', () => {
  for (const [n, c] of BUDGET.cases.entries()) {
    const sens = REF.sensitivities[c.scene];
    const si = new qb.SpectralInstrument(definition(sens.scene));
    const options = {
      ...(c.k !== undefined ? { coverageFactor: c.k } : { coverageProbability: c.p }),
      ...(c.correlations.length ? { correlations: c.correlations.map(([a, b, r]) => ({ inputs: [a, b], coefficient: r })) } : {}),
    };
    const b = si.uncertaintyBudget(sens.coefficients.signal, uncertainties(c), options);
    const what = `case ${n}`;
    close(b.temperatureK, sens.coefficients.temperature_k, 1e-13, `${what} temperature`);
    close(b.combinedStandardUncertaintyK, c.combined_k, 1e-12, `${what} u_c`);
    close(b.coverageFactor, c.coverage_factor, 1e-12, `${what} k`);
    close(b.expandedUncertaintyK, c.expanded_k, 1e-12, `${what} U`);
    if (c.effective_dof !== undefined) {
      close(b.effectiveDegreesOfFreedom, c.effective_dof, 1e-12, `${what} nu_eff`);
      assert.equal(b.method.degreesOfFreedomUsed, c.dof_used);
    }
    assert.equal(b.method.propagation, c.correlations.length ? 'firstOrderCorrelated' : 'firstOrderUncorrelated');
    // rows: every input, minus reflectanceScale for the opaque scene (window present in both)
    const rows = b.entries.map((e) => e.input);
    assert.equal(rows.includes('reflectanceScale'), !sens.opaque, `${what} reflectance row`);
    assert.equal(rows.length, sens.opaque ? 10 : 11);
    for (const e of b.entries) {
      const key = e.input.endsWith('Temperature') ? `${e.input}K` : e.input;
      const want = c.contributions_k[key] ?? 0;
      if (want === 0) assert.equal(e.contributionK, 0, `${what} ${key} contributes nothing`);
      else close(e.contributionK, want, 1e-12, `${what} contribution ${key}`);
    }
    // the variance shares sum to 1 (JCGM 100 eq. 10/16 divided by u_c²)
    const shares = b.entries.reduce((s, e) => s + e.varianceShare, 0);
    assert.ok(Math.abs(shares - 1) < 1e-12, `${what} shares sum ${shares}`);
    si.free();
  }
});

test('rows, refusals and the instance after an error', () => {
  const sens = REF.sensitivities[0]; // opaque target
  const signal = sens.coefficients.signal;
  const noWindow = new qb.SpectralInstrument(definition(sens.scene, false));
  const rows = noWindow.uncertaintyBudget(signal, { signal: 0.1 }).entries.map((e) => e.input);
  assert.deepEqual(rows, ['signal', 'emissivityScale', 'pathTransmittanceScale', 'responseScale', 'reflectedTemperature', 'pathTemperature']);
  throwsCode(() => noWindow.uncertaintyBudget(signal, { windowTemperatureK: 1 }), 'UNSUPPORTED');
  throwsCode(() => noWindow.uncertaintyBudget(signal, { reflectanceScale: 0.01 }), 'UNSUPPORTED');
  throwsCode(() => noWindow.uncertaintyBudget(signal, { emissivity: 0.01 }), 'UNSUPPORTED'); // the grey key
  throwsCode(() => noWindow.uncertaintyBudget(signal, { signal: -1 }), 'OUT_OF_RANGE');
  throwsCode(() => noWindow.uncertaintyBudget(signal, { signal: 'x' }), 'WRONG_TYPE');
  throwsCode(
    () => noWindow.uncertaintyBudget(signal, { signal: 0.1 }, { correlations: [{ inputs: ['signal', 'windowTemperatureK'], coefficient: 0.5 }] }),
    'UNSUPPORTED',
  );
  throwsCode(
    () => noWindow.uncertaintyBudget(signal, { signal: 0.1 }, { correlations: [{ inputs: ['signal', 'signal'], coefficient: 0.5 }] }),
    'INVALID_CORRELATION',
  );
  throwsCode(() => noWindow.uncertaintyBudget(signal, { signal: 0.1 }, { coverageProbability: 0.95, coverageFactor: 2 }), 'UNSUPPORTED');
  throwsCode(() => noWindow.uncertaintyBudget(1e-30, { signal: 0.1 }), 'NO_PHYSICAL_SOLUTION');
  // still usable, and the same numbers as before the errors
  const again = noWindow.uncertaintyBudget(signal, { signal: 0.1 });
  close(again.combinedStandardUncertaintyK, Math.abs(again.entries[0].sensitivity) * 0.1, 1e-15, 'u_c of one input is |c|·u');
  noWindow.free();
  throwsCode(() => noWindow.uncertaintyBudget(signal, { signal: 0.1 }), 'DISPOSED');
});
