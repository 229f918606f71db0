// Pins the TypeScript surface of multi-wavelength pyrometry, Raman and Y-factor thermometry and
// semiconductor carrier statistics (src/wasm/js/quantum.d.ts). Each `@ts-expect-error` line
// proves a wrong call is rejected at compile time.
import {
  Instrument,
  MultiwavelengthFit,
  RamanMode,
  Semiconductor,
  YFactorLoads,
  bandCarrierDensity,
  decibelsToPowerRatio,
  fitMultiwavelength,
  powerRatioToDecibels,
} from '../../pkg/quantaband.js';
import type * as QB from '../../pkg/quantaband.js';
import type {
  CarrierDensity,
  EmissivityModel,
  IntrinsicCarriers,
  MultiwavelengthMeasurement,
  MultiwavelengthOptions,
  MultiwavelengthWarning,
  RamanReading,
  SemiconductorMaterial,
  YFactorReading,
} from '../../pkg/quantaband.js';

// ---- multi-wavelength fit -------------------------------------------------------------------
const model: EmissivityModel = { kind: 'logPolynomial', order: 1 };
const options: MultiwavelengthOptions = { model, maxConditionNumber: 1e3, maxAbsCorrelation: 0.999 };
const spectral: MultiwavelengthMeasurement = {
  wavelengths: [0.7, 0.825, 0.95, 1.075, 1.2],
  unit: 'um',
  radiances: new Float64Array(5),
  uncertainties: [1, 1, 1, 1, 1] as readonly number[],
  c2: 'its90',
};
const fit: MultiwavelengthFit = fitMultiwavelength(spectral, options);
const tK: number = fit.temperatureK;
const uK: number = fit.uTemperatureK;
const ill: boolean = fit.illConditioned;
const why: readonly MultiwavelengthWarning[] = fit.warnings;
const cov00: number | undefined = fit.covariance[0]?.[0];
const a: readonly number[] = fit.coefficients;
const corr: number | undefined = fit.correlationTemperatureSlope;
const tc: number | undefined = fit.greyTwoColourTemperatureK;
const tb: readonly number[] = fit.brightnessTemperaturesK;
const eps: number = fit.emissivity(0.9);
const epsAll: Float64Array = fit.emissivities(new Float32Array([0.8, 0.9]), new Float64Array(2));
fit.free();
const grey: MultiwavelengthFit = fitMultiwavelength(spectral);
const ch = new Instrument({ model: { kind: 'spectralPoint', wavelength: 0.8, unit: 'um' } });
const bands = fitMultiwavelength({ channels: [ch, ch, ch], wavelengths: [0.8, 0.9, 1], unit: 'um', signals: [1, 2, 3], uncertainties: [0.1, 0.1, 0.1] });
// @ts-expect-error order above 4
const m5: EmissivityModel = { kind: 'polynomial', order: 5 };
// @ts-expect-error unknown model kind
const m6: EmissivityModel = { kind: 'cubic', order: 1 };
// @ts-expect-error a wavenumber unit is not a wavelength unit
fitMultiwavelength({ ...spectral, unit: 'cm-1' });
// @ts-expect-error radiances belong to the spectral form, not with channels
fitMultiwavelength({ channels: [ch], wavelengths: [1], unit: 'um', signals: [1], uncertainties: [1], radiances: [1] });
// @ts-expect-error c2 is the channels' own in the band form
fitMultiwavelength({ channels: [ch], wavelengths: [1], unit: 'um', signals: [1], uncertainties: [1], c2: 'its90' });
// @ts-expect-error channels are Instruments, not model definitions
fitMultiwavelength({ channels: [{ kind: 'spectralPoint', wavelength: 1, unit: 'um' }], wavelengths: [1], unit: 'um', signals: [1], uncertainties: [1] });
// @ts-expect-error a fit is made by fitMultiwavelength
new MultiwavelengthFit();
// @ts-expect-error the figures are read-only
fit.temperatureK = 1;
// @ts-expect-error not a warning name
const w1: MultiwavelengthWarning = 'noise';

// ---- Raman ----------------------------------------------------------------------------------
const raman = new RamanMode({ shiftPerCm: 520.7, excitation: 532, unit: 'nm', detection: 'energy' });
const f: number = raman.frequencyFactor;
const r: number = raman.ratio(300);
const rd: RamanReading = raman.temperature(0.1);
const dT: number = rd.dTdRatio;
const rs: Float64Array = raman.ratios([300, 400]);
const ts: Float64Array = raman.temperatures(new Float64Array([0.1]));
// @ts-expect-error unknown detection
new RamanMode({ shiftPerCm: 520.7, excitation: 532, unit: 'nm', detection: 'ccd' });
// @ts-expect-error the shift is in cm⁻¹ under its own name
new RamanMode({ shift: 520.7, excitation: 532, unit: 'nm' });
// @ts-expect-error frequencyFactor is read-only
raman.frequencyFactor = 2;

// ---- Y factor -------------------------------------------------------------------------------
const loads = new YFactorLoads({ hotLoadK: 295, coldLoadK: 77, unit: 'GHz', loadModel: 'planck' });
const yr: YFactorReading = loads.receiverTemperature(decibelsToPowerRatio(3.2), 230);
const tr: number = yr.receiverNoiseTemperatureK;
const diff: number = yr.planckMinusRayleighJeansK;
const y: number = loads.yFactor(60, 230);
const db: number = powerRatioToDecibels(y);
// @ts-expect-error unknown load convention
new YFactorLoads({ hotLoadK: 295, coldLoadK: 77, unit: 'GHz', loadModel: 'quantum' });
// @ts-expect-error unit is required
new YFactorLoads({ hotLoadK: 295, coldLoadK: 77 });
// @ts-expect-error the frequency is a number
loads.receiverTemperature(2, '230');

// ---- semiconductors -------------------------------------------------------------------------
const si: SemiconductorMaterial = { electronMassRatio: 1.08, holeMassRatio: 0.81, bandGap0K: 1.17, varshniAlpha: 4.73e-4, varshniBetaK: 636, energyUnit: 'eV' };
const s = new Semiconductor(si);
const eg: number = s.bandGap(300);
const nc: number = s.conductionBandDensityOfStates(300);
const n: CarrierDensity = s.electronDensity(0.3, 300);
const p: CarrierDensity = s.holeDensity(0.3, 300);
const ef: number = s.fermiLevelFromElectronDensity(1e22, 300);
const ni: IntrinsicCarriers = s.intrinsic(300);
const nis: Float64Array = s.intrinsicDensities([250, 300]);
const c: CarrierDensity = bandCarrierDensity(1e25, 0);
// @ts-expect-error energies are J, eV or meV
new Semiconductor({ ...si, energyUnit: 'nm' });
// @ts-expect-error the intrinsic result is read-only
ni.densityPerM3 = 0;
// @ts-expect-error no Boltzmann-only density method
s.boltzmannDensity(0.3, 300);

// ---- no `any` in the new classes ------------------------------------------------------------
type IsAny<T> = 0 extends 1 & T ? true : false;
type AnyParam<F> = F extends (...args: infer P) => unknown
  ? true extends { [K in keyof P]: IsAny<P[K]> }[number]
    ? true
    : false
  : false;
type AnyReturn<F> = F extends (...args: never[]) => infer R ? IsAny<R> : false;
type HasAny<F> = IsAny<F> extends true ? true : AnyParam<F> extends true ? true : AnyReturn<F>;
type MemberOffenders<T> = { [K in keyof T]: HasAny<T[K]> extends true ? K : never }[keyof T];
const noAnyFit: [MemberOffenders<QB.MultiwavelengthFit>] extends [never] ? true : MemberOffenders<QB.MultiwavelengthFit> = true;
const noAnyRaman: [MemberOffenders<QB.RamanMode>] extends [never] ? true : MemberOffenders<QB.RamanMode> = true;
const noAnyLoads: [MemberOffenders<QB.YFactorLoads>] extends [never] ? true : MemberOffenders<QB.YFactorLoads> = true;
const noAnySemiconductor: [MemberOffenders<QB.Semiconductor>] extends [never] ? true : MemberOffenders<QB.Semiconductor> = true;

export { tK, uK, ill, why, cov00, a, corr, tc, tb, eps, epsAll, grey, bands, f, r, dT, rs, ts, tr, diff, db, eg, nc, n, p, ef, nis, c };
export { noAnyFit, noAnyRaman, noAnyLoads, noAnySemiconductor };
