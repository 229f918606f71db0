// Pins the TypeScript surface of the uncertainty bindings (checked by `tsc -p tests/types`,
// strict, exactOptionalPropertyTypes). Each `@ts-expect-error` line proves a wrong call is
// rejected at compile time.
import {
  CalibrationCurve,
  Instrument,
  MonteCarlo,
  coverageFactor,
  propagateUncertainty,
  ratioTemperatureSensitivities,
  studentTCdf,
  studentTQuantile,
  typeA,
  typeACorrelation,
} from '../../pkg/quantaband.js';
import type {
  BudgetEntry,
  BudgetOptions,
  CalibratedReading,
  FixedPointReport,
  InputCorrelation,
  MeasurementUncertainties,
  MonteCarloProgress,
  MonteCarloResult,
  ParameterCovariance,
  PropagationResult,
  RatioSensitivities,
  TypeAEvaluation,
  UncertaintyBudget,
} from '../../pkg/quantaband.js';

// ---- Student's t and Type A ------------------------------------------------------------------
const k95: number = coverageFactor(0.95, 9);
const kInf: number = coverageFactor(0.95, Infinity);
const q: number = studentTQuantile(0.975, 4.5);
const cdf: number = studentTCdf(2.1, 12);
const ta: TypeAEvaluation = typeA([5.007, 4.994, 5.005]);
const r12: number = typeACorrelation(new Float64Array([1, 2, 3]), [2, 4, 7]);
// @ts-expect-error degrees of freedom are a number (Infinity for ∞), not a string
coverageFactor(0.95, 'inf');
// @ts-expect-error results are read-only
ta.mean = 1;

// ---- the GUM budget of an instrument -------------------------------------------------------
const inst = new Instrument({
  model: { kind: 'sakumaHattori', aM: 1e-5, bMK: 1.8e-4, c: 1e6 },
  conditions: { emissivity: 0.9, reflectedTemperatureK: 295, window: { transmittance: 0.9, temperatureK: 300 } },
});
const u: MeasurementUncertainties = {
  signal: { standardUncertainty: 3, degreesOfFreedom: 9, evaluation: 'typeA' },
  emissivity: { standardUncertainty: 0.01, distribution: 'rectangular' },
  reflectedTemperatureK: 2,
  windowTemperatureK: { standardUncertainty: 1, degreesOfFreedom: null },
};
const pair: InputCorrelation = { inputs: ['reflectedTemperatureK', 'pathTemperatureK'], coefficient: 0.8 };
const opts: BudgetOptions = { correlations: [pair], coverageProbability: 0.99 };
const b: UncertaintyBudget = inst.uncertaintyBudget(3e4, u, opts);
const bk: UncertaintyBudget = inst.uncertaintyBudget(3e4, u, { coverageFactor: 2 });
const nuEff: number | undefined = b.effectiveDegreesOfFreedom;
const row: BudgetEntry | undefined = b.entries[0];
const statement: string = b.method.statement;
const uc: number = b.combinedStandardUncertaintyK + b.expandedUncertaintyK;
// @ts-expect-error coverage probability or stated factor, not both
inst.uncertaintyBudget(3e4, u, { coverageProbability: 0.95, coverageFactor: 2 });
// @ts-expect-error unknown input (the key carries its unit: reflectedTemperatureK)
inst.uncertaintyBudget(3e4, { reflectedTemperature: 2 });
// @ts-expect-error unknown distribution
inst.uncertaintyBudget(3e4, { signal: { standardUncertainty: 1, distribution: 'uniform' } });
// @ts-expect-error a correlation names two inputs
inst.uncertaintyBudget(3e4, u, { correlations: [{ inputs: ['signal'], coefficient: 0.5 }] });
// @ts-expect-error the object form needs its standard uncertainty
inst.uncertaintyBudget(3e4, { signal: { degreesOfFreedom: 4 } });
// @ts-expect-error budget rows are read-only
b.entries[0] = b.entries[1]!;

// ---- any model -------------------------------------------------------------------------------
const pr: PropagationResult = propagateUncertainty([1, -2], [0.1, { standardUncertainty: 0.2, degreesOfFreedom: 4 }], {
  correlation: [
    [1, 0.3],
    [0.3, 1],
  ],
  coverageFactor: 2,
});
const pr2: PropagationResult = propagateUncertainty(new Float64Array([1]), [1], { correlation: new Float64Array([1]) });
const contribution: number | undefined = pr.entries[0]?.contribution;
// @ts-expect-error inputs are numbers or input objects
propagateUncertainty([1], ['0.1']);
// @ts-expect-error a measurement budget's correlations name inputs; a model's take a matrix
propagateUncertainty([1], [1], { correlations: [pair] });

// ---- Monte Carlo -----------------------------------------------------------------------------
const mc: MonteCarlo<UncertaintyBudget> = MonteCarlo.measurement(inst, 3e4, u, { correlations: [pair], seed: 7, trials: 100_000 });
const p: MonteCarloProgress = mc.step(10_000);
const done: boolean = p.done;
const res: MonteCarloResult<UncertaintyBudget> = mc.result(60);
const gumT: number | undefined = res.gum?.temperatureK;
const counts: Float64Array = res.histogram.counts;
const passed: boolean | undefined = res.validation?.passed;
const lin: MonteCarloResult<PropagationResult> = MonteCarlo.linear([1, 1], [1, { standardUncertainty: 1, distribution: 'arcsine' }], {
  estimates: [2, 3],
  interval: 'shortest',
  maxTrials: 200_000,
}).result();
mc.free();
// @ts-expect-error created by MonteCarlo.measurement or MonteCarlo.linear
new MonteCarlo();
// @ts-expect-error interval kind literal
MonteCarlo.linear([1], [1], { interval: 'central' });
// @ts-expect-error a linear model's estimates belong to MonteCarlo.linear, not to measurement runs
MonteCarlo.measurement(inst, 3e4, u, { estimates: [1] });
// @ts-expect-error the progress is read-only
p.trials = 0;

// ---- calibration transfer and fixed points ---------------------------------------------------
const cal = CalibrationCurve.fit([600, 800, 1000], [1, 20, 200], { uTemperaturesK: 0.05, uSignals: [0.01, 0.1, 1] });
const cov: ParameterCovariance = cal.parameterCovariance();
const rd: CalibratedReading = cal.readingUncertainty(50, 0.05);
const w: Float64Array = rd.dTdReferenceTemperatures;
const point = new Instrument({ model: { kind: 'spectralPoint', wavelength: 650, unit: 'nm', c2: 'its90' } });
const fpc = CalibrationCurve.throughFixedPoints(point, ['zinc', 'aluminium', 'copper'], { uTemperaturesK: [0.003, 0.005, 0.02], tMaxK: 2500 });
const fpr: FixedPointReport | undefined = fpc.fixedPointReport;
const above: number | undefined = fpr?.interpolationErrors.above?.maxErrorK;
const rs: RatioSensitivities = ratioTemperatureSensitivities(10, 650, 'nm', 1337.33, 'its90');
// @ts-expect-error three fixed points
CalibrationCurve.throughFixedPoints(point, ['zinc', 'copper']);
// @ts-expect-error not an ITS-90 fixed point of the package
CalibrationCurve.throughFixedPoints(point, ['zinc', 'aluminium', 'platinum']);
// @ts-expect-error the fit's uncertainties are numbers or arrays of numbers
CalibrationCurve.fit([600, 800, 1000], [1, 20, 200], { uTemperaturesK: '0.05' });

// ---- nothing a user touches is `any` (as tests/types/no-any.ts for the other classes) -------
type IsAny<T> = 0 extends 1 & T ? true : false;
type AnyMember<T> = { [K in keyof T]: IsAny<T[K]> extends true ? K : T[K] extends (...a: infer P) => infer R ? (true extends { [I in keyof P]: IsAny<P[I]> }[number] ? K : IsAny<R> extends true ? K : never) : never }[keyof T];
const noAnyMonteCarlo: [AnyMember<MonteCarlo<UncertaintyBudget>>] extends [never] ? true : AnyMember<MonteCarlo<UncertaintyBudget>> = true;
const noAnyMonteCarloStatics: [AnyMember<typeof MonteCarlo>] extends [never] ? true : AnyMember<typeof MonteCarlo> = true;

export { noAnyMonteCarlo, noAnyMonteCarloStatics, k95, kInf, q, cdf, r12, bk, nuEff, row, statement, uc, pr2, contribution, done, gumT, counts, passed, lin, cov, w, above, rs };
