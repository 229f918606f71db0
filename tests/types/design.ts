// Pins the TypeScript surface of the instrument-design area (DetectorDesign and the design free
// functions), strict with exactOptionalPropertyTypes. Each `@ts-expect-error` line proves a
// wrong call is rejected at compile time.
import {
  DetectorDesign,
  backgroundPhotonFlux,
  blipDStar,
  blipDStarFromFlux,
  cavityEmissivityGouffe,
  dStarFromNep,
  dStarFromNetd,
  dStarToJones,
  etendue,
  etendueBetweenDiscs,
  etendueThroughAperture,
  irradianceFactor,
  jonesToDStar,
  nep,
  netdFromDStar,
  noiseBandwidth,
  projectedSolidAngle,
  quantumEfficiencyFromResponsivity,
  responsivityFromQuantumEfficiency,
  sizeOfSourceChange,
  sizeOfSourceCorrectedSignal,
  spotDiameter,
  spotDiameterFocused,
  spotFill,
} from '../../pkg/quantaband.js';
import type {
  BandScene,
  CavityShape,
  ConeForm,
  DesignDetector,
  DesignOptics,
  DetectorConversion,
  DetectorDesignDefinition,
  ModelScene,
  NoiseBudget,
  PixelReport,
  RadianceKind,
  SpotFill,
} from '../../pkg/quantaband.js';
import type * as QB from '../../pkg/quantaband.js';

// ---- the prepared design ---------------------------------------------------------------------
const optics: DesignOptics = { fNumber: 2, transmittance: 0.9 };
const detector: DesignDetector = {
  pixelAreaM2: 2.25e-10,
  conversion: { kind: 'quantumEfficiency', efficiency: 0.7 },
  integrationTimeS: 1e-3,
  fullWellElectrons: 1.1e7,
  darkCurrentA: 1e-12,
  readNoiseElectrons: 200,
};
const band: BandScene = { kind: 'band', lower: 3.7, upper: 4.8, unit: 'um' };
const definition: DetectorDesignDefinition = { optics, detector, scene: band };
const design = new DetectorDesign(definition);
const report: PixelReport = design.evaluate(300);
const netdK: number = report.netdK;
const saturated: boolean = report.saturated;
const noise: NoiseBudget = report.noise;
const kind: RadianceKind = report.flux.kind;
const curve: Float64Array = design.netds([250, 300, 350]);
design.snrs(new Float32Array([300]), new Float64Array(1));
design.wellFills([300] as readonly number[]);
const netd: number = design.netd(300);
const fromD: number = design.netdFromDStar(1e9, 300);
design.netdFromDStar(1e9, 300, 5e-6);
design.dStarFromNetd(0.03, 300, 5e-6);
design.free();

// options written out
const full: DetectorDesignDefinition = {
  optics: { fNumber: 1.4, transmittance: 0.8, cone: 'smallAngle', fieldAngleRad: 0.2 },
  detector: { ...detector, conversion: { kind: 'responsivity', amperesPerWatt: 2 } },
  scene: { kind: 'band', lower: 2000, upper: 2700, unit: 'cm-1', emissivity: 0.95, c2: 'its90' },
  backgroundElectronsPerS: 1e6,
};
const model: ModelScene = {
  kind: 'model',
  model: { kind: 'response', wavelengths: [8, 14], values: [2, 2], unit: 'um' },
  radianceKind: 'current',
};
const included: DetectorConversion = { kind: 'included' };
new DetectorDesign({ optics, detector: { ...detector, conversion: included }, scene: model });

// @ts-expect-error the scene is required
new DetectorDesign({ optics, detector });
// @ts-expect-error a band needs a spectral unit
new DetectorDesign({ optics, detector, scene: { kind: 'band', lower: 3, upper: 5 } });
// @ts-expect-error an unknown unit name
new DetectorDesign({ optics, detector, scene: { kind: 'band', lower: 3, upper: 5, unit: 'furlong' } });
// @ts-expect-error an unknown cone form
new DetectorDesign({ optics: { fNumber: 2, transmittance: 1, cone: 'wide' }, detector, scene: band });
// @ts-expect-error a quantum efficiency has no amperesPerWatt
const badConversion: DetectorConversion = { kind: 'quantumEfficiency', amperesPerWatt: 2 };
// @ts-expect-error an unknown field of the optics
const badOptics: DesignOptics = { fNumber: 2, transmittance: 1, fnumber: 2 };
// @ts-expect-error a model scene needs its radiance kind
const badModel: ModelScene = { kind: 'model', model: { kind: 'spectralPoint', wavelength: 10, unit: 'um' } };
// @ts-expect-error optional fields may not be undefined (exactOptionalPropertyTypes)
const undefinedCone: DesignOptics = { fNumber: 2, transmittance: 1, cone: undefined };
// @ts-expect-error temperatures are numbers
design.evaluate('300');
// @ts-expect-error the result fields are readonly
report.netdK = 1;
// @ts-expect-error out must be a Float64Array
design.netds([300], new Float32Array(1));
// @ts-expect-error no definition getter
design.definition;

// ---- free functions ---------------------------------------------------------------------------
const cones: ConeForm[] = ['exact', 'smallAngle'];
const omega: number = projectedSolidAngle(2) + projectedSolidAngle(2, 'smallAngle');
etendue(2.25e-10, 2, 'exact');
etendueThroughAperture(1e-6, 0.01, 0.05);
etendueBetweenDiscs(0.002, 0.002, 0.001, 'smallAngle');
const k: number = irradianceFactor(2, 0.9) + irradianceFactor(2, 0.9, 0.1, 'exact');
responsivityFromQuantumEfficiency(0.7, 4e-6);
quantumEfficiencyFromResponsivity(2, 4e-6);
const df: number = noiseBandwidth(1e-3);
dStarFromNep(nep(1e9, 2.25e-10, df), 2.25e-10, df);
dStarFromNetd(netdFromDStar(1e9, 2.25e-10, df, 1e-10), 2.25e-10, df, 1e-10);
jonesToDStar(dStarToJones(1e9));
backgroundPhotonFlux(5e-6, 300, 2);
backgroundPhotonFlux(5e-6, 300, 'hemisphere');
blipDStar(5e-6, 0.7, 300, 2, 'photovoltaic', 'smallAngle');
blipDStar(5e-6, 0.7, 300, 'hemisphere', 'photoconductive');
blipDStarFromFlux(5e-6, 0.7, 1e20, 'photovoltaic');
const shape: CavityShape = 'cone';
cavityEmissivityGouffe(0.9, shape, 0.025, 0.2, 0.0125);
sizeOfSourceCorrectedSignal(100, sizeOfSourceChange(0.01, 0.004));
spotDiameterFocused(0.5, 0.03, 1, 0.01);
const fill: SpotFill = spotFill(0.1, spotDiameter(0.6, 12));
const fills: boolean = fill.fills;

// @ts-expect-error an unknown cone form
projectedSolidAngle(2, 'wide');
// @ts-expect-error the view is an f-number or "hemisphere"
blipDStar(5e-6, 0.7, 300, 'dome');
// @ts-expect-error an unknown mechanism
blipDStar(5e-6, 0.7, 300, 2, 'bolometer');
// @ts-expect-error the cavity shape is required
cavityEmissivityGouffe(0.9, 0.025, 0.2, 0.0125);
// @ts-expect-error an unknown cavity shape
cavityEmissivityGouffe(0.9, 'sphere', 0.025, 0.2, 0.0125);
// @ts-expect-error numbers, not strings
spotDiameter('0.6', 12);
// @ts-expect-error SpotFill is readonly
fill.fills = false;

// ---- no `any` in the class ----------------------------------------------------------------------
type IsAny<T> = 0 extends 1 & T ? true : false;
type AnyParam<F> = F extends (...args: infer P) => unknown
  ? true extends { [K in keyof P]: IsAny<P[K]> }[number]
    ? true
    : false
  : false;
type AnyReturn<F> = F extends (...args: never[]) => infer R ? IsAny<R> : false;
type HasAny<F> = IsAny<F> extends true ? true : AnyParam<F> extends true ? true : AnyReturn<F>;
type MemberOffenders<T> = { [K in keyof T]: HasAny<T[K]> extends true ? K : never }[keyof T];
const noAnyDesign: [MemberOffenders<QB.DetectorDesign>] extends [never] ? true : MemberOffenders<QB.DetectorDesign> = true;

export {
  badConversion,
  badModel,
  badOptics,
  cones,
  curve,
  fills,
  fromD,
  full,
  k,
  kind,
  netd,
  netdK,
  noAnyDesign,
  noise,
  omega,
  saturated,
  undefinedCone,
};
