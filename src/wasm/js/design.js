// Instrument design: DetectorDesign (one pixel's optics, detector and scene, read and checked
// once, then evaluated at scene temperatures) and the design free functions (throughput,
// figures of merit, background limit, cavity, size of source, spot). Wraps QbDesign and
// designNumber (src/wasm/design.rs); result objects are built here from the numbers the module
// writes to f64 scratch buffer 0.
//
// These are design estimates, not measurements (see the README "Instrument design" cautions).

import { QuantabandError, disposed, wrongType } from './errors.js';
import { bulk, config, figures, glue, num, ready, result, some, str } from './runtime.js';

// Bulk operation numbers of QbDesign.bulk.
const NETDS = 0;
const SNRS = 1;
const WELL_FILLS = 2;

// Operation numbers of QbDesign.number.
const NETD_FROM_D_STAR = 0;
const D_STAR_FROM_NETD = 1;
const REPORT = 2;

const RADIANCE_KINDS = ['energy', 'photon', 'current', 'electron'];

// Operation numbers of designNumber (src/wasm/design.rs, design_op).
const OP = Object.freeze({
  projectedSolidAngle: 0,
  etendue: 1,
  etendueThroughAperture: 2,
  etendueBetweenDiscs: 3,
  irradianceFactor: 4,
  noiseBandwidth: 5,
  nep: 6,
  dStarFromNep: 7,
  netdFromDStar: 8,
  dStarFromNetd: 9,
  backgroundPhotonFlux: 10,
  blipDStar: 11,
  blipDStarFromFlux: 12,
  responsivityFromQuantumEfficiency: 13,
  quantumEfficiencyFromResponsivity: 14,
  dStarToJones: 15,
  jonesToDStar: 16,
  cavityEmissivityGouffe: 17,
  sizeOfSourceChange: 18,
  sizeOfSourceCorrectedSignal: 19,
  spotDiameter: 20,
  spotDiameterFocused: 21,
  spotFill: 22,
});

const CONES = ['exact', 'smallAngle'];
const MECHANISMS = ['photovoltaic', 'photoconductive'];
const SHAPES = ['cylinder', 'cone'];
const HEMISPHERE = 2;

/** The index of string option `value` (parameter `name`) in `options`; `fallback` if undefined. */
function choice(value, name, options, fallback) {
  if (value === undefined && fallback !== undefined) return fallback;
  str(value, name, 'UNSUPPORTED');
  const i = options.indexOf(value);
  if (i < 0) {
    throw new QuantabandError(
      'UNSUPPORTED',
      `${name} must be one of ${options.map((o) => `"${o}"`).join(', ')} (got "${value}")`,
    );
  }
  return i;
}

/** [f-number, code] of a background view: a cold-stop f-number (with its cone form) or "hemisphere". */
function viewOf(view, cone) {
  const c = choice(cone, 'cone', CONES, 0);
  if (typeof view === 'number') return [view, c];
  if (view === 'hemisphere') return [0, HEMISPHERE];
  if (typeof view === 'string') {
    throw new QuantabandError(
      'UNSUPPORTED',
      `view must be a cold-stop f-number or "hemisphere" (got "${view.length > 64 ? `${view.slice(0, 64)}…` : view}")`,
    );
  }
  throw wrongType('view', 'a cold-stop f-number or "hemisphere"', view);
}

/** One designNumber call with checked number arguments. */
function call(op, ...args) {
  return result(glue.designNumber(op, ...args, 0, 0, 0, 0, 0, 0));
}

/**
 * One pixel of an instrument being designed: `new DetectorDesign({ optics, detector, scene })`.
 * The configuration is read and checked once; methods take scene temperatures in K.
 */
export class DetectorDesign {
  #h = null;

  constructor(design) {
    ready();
    this.#h = some(glue.QbDesign.create(config(design, 'design')));
  }

  #live() {
    const h = this.#h;
    if (h === null) throw disposed('DetectorDesign');
    return h;
  }

  /** Releases the object's WebAssembly memory now (later calls throw DISPOSED). */
  free() {
    const h = this.#h;
    if (h !== null) {
      this.#h = null;
      h.free();
    }
  }

  evaluate(temperatureK) {
    const h = this.#live();
    num(temperatureK, 'temperatureK');
    const v = figures(h.number(REPORT, 0, temperatureK, undefined));
    return {
      flux: { kind: RADIANCE_KINDS[v[0]], flux: v[1], dFluxDt: v[2] },
      photocurrentA: v[3],
      signalElectrons: v[4],
      dSignalElectronsDt: v[5],
      backgroundElectrons: v[6],
      darkElectrons: v[7],
      wellFill: v[8],
      saturated: v[9] === 1,
      noise: {
        signalShotElectrons: v[10],
        backgroundShotElectrons: v[11],
        darkShotElectrons: v[12],
        readElectrons: v[13],
        totalElectrons: v[14],
      },
      snr: v[15],
      netdK: v[16],
    };
  }

  netd(temperatureK) {
    return this.evaluate(temperatureK).netdK;
  }

  netds(temperaturesK, out) {
    const h = this.#live();
    return bulk(temperaturesK, 'temperaturesK', out, () => h.bulk(NETDS));
  }

  snrs(temperaturesK, out) {
    const h = this.#live();
    return bulk(temperaturesK, 'temperaturesK', out, () => h.bulk(SNRS));
  }

  wellFills(temperaturesK, out) {
    const h = this.#live();
    return bulk(temperaturesK, 'temperaturesK', out, () => h.bulk(WELL_FILLS));
  }

  netdFromDStar(dStar, temperatureK, peakWavelengthM) {
    const h = this.#live();
    num(dStar, 'dStar');
    num(temperatureK, 'temperatureK');
    if (peakWavelengthM !== undefined) num(peakWavelengthM, 'peakWavelengthM');
    return result(h.number(NETD_FROM_D_STAR, dStar, temperatureK, peakWavelengthM));
  }

  dStarFromNetd(netdK, temperatureK, peakWavelengthM) {
    const h = this.#live();
    num(netdK, 'netdK');
    num(temperatureK, 'temperatureK');
    if (peakWavelengthM !== undefined) num(peakWavelengthM, 'peakWavelengthM');
    return result(h.number(D_STAR_FROM_NETD, netdK, temperatureK, peakWavelengthM));
  }
}

if (typeof Symbol.dispose === 'symbol') DetectorDesign.prototype[Symbol.dispose] = DetectorDesign.prototype.free;

// ---- throughput

export function projectedSolidAngle(fNumber, cone) {
  ready();
  num(fNumber, 'fNumber');
  return call(OP.projectedSolidAngle, fNumber, choice(cone, 'cone', CONES, 0));
}

export function etendue(areaM2, fNumber, cone) {
  ready();
  num(areaM2, 'areaM2');
  num(fNumber, 'fNumber');
  return call(OP.etendue, areaM2, fNumber, choice(cone, 'cone', CONES, 0));
}

export function etendueThroughAperture(areaM2, apertureDiameterM, distanceM, cone) {
  ready();
  num(areaM2, 'areaM2');
  num(apertureDiameterM, 'apertureDiameterM');
  num(distanceM, 'distanceM');
  return call(OP.etendueThroughAperture, areaM2, apertureDiameterM, distanceM, choice(cone, 'cone', CONES, 0));
}

export function etendueBetweenDiscs(stopDiameterM, apertureDiameterM, distanceM, cone) {
  ready();
  num(stopDiameterM, 'stopDiameterM');
  num(apertureDiameterM, 'apertureDiameterM');
  num(distanceM, 'distanceM');
  return call(OP.etendueBetweenDiscs, stopDiameterM, apertureDiameterM, distanceM, choice(cone, 'cone', CONES, 0));
}

export function irradianceFactor(fNumber, transmittance, fieldAngleRad = 0, cone) {
  ready();
  num(fNumber, 'fNumber');
  num(transmittance, 'transmittance');
  num(fieldAngleRad, 'fieldAngleRad');
  return call(OP.irradianceFactor, fNumber, transmittance, fieldAngleRad, choice(cone, 'cone', CONES, 0));
}

// ---- detector and figures of merit

export function responsivityFromQuantumEfficiency(efficiency, wavelengthM) {
  ready();
  num(efficiency, 'efficiency');
  num(wavelengthM, 'wavelengthM');
  return call(OP.responsivityFromQuantumEfficiency, efficiency, wavelengthM);
}

export function quantumEfficiencyFromResponsivity(amperesPerWatt, wavelengthM) {
  ready();
  num(amperesPerWatt, 'amperesPerWatt');
  num(wavelengthM, 'wavelengthM');
  return call(OP.quantumEfficiencyFromResponsivity, amperesPerWatt, wavelengthM);
}

export function noiseBandwidth(integrationTimeS) {
  ready();
  num(integrationTimeS, 'integrationTimeS');
  return call(OP.noiseBandwidth, integrationTimeS);
}

export function nep(dStar, areaM2, bandwidthHz) {
  ready();
  num(dStar, 'dStar');
  num(areaM2, 'areaM2');
  num(bandwidthHz, 'bandwidthHz');
  return call(OP.nep, dStar, areaM2, bandwidthHz);
}

export function dStarFromNep(nepW, areaM2, bandwidthHz) {
  ready();
  num(nepW, 'nepW');
  num(areaM2, 'areaM2');
  num(bandwidthHz, 'bandwidthHz');
  return call(OP.dStarFromNep, nepW, areaM2, bandwidthHz);
}

export function netdFromDStar(dStar, areaM2, bandwidthHz, dPowerDtWPerK) {
  ready();
  num(dStar, 'dStar');
  num(areaM2, 'areaM2');
  num(bandwidthHz, 'bandwidthHz');
  num(dPowerDtWPerK, 'dPowerDtWPerK');
  return call(OP.netdFromDStar, dStar, areaM2, bandwidthHz, dPowerDtWPerK);
}

export function dStarFromNetd(netdK, areaM2, bandwidthHz, dPowerDtWPerK) {
  ready();
  num(netdK, 'netdK');
  num(areaM2, 'areaM2');
  num(bandwidthHz, 'bandwidthHz');
  num(dPowerDtWPerK, 'dPowerDtWPerK');
  return call(OP.dStarFromNetd, netdK, areaM2, bandwidthHz, dPowerDtWPerK);
}

export function dStarToJones(dStar) {
  ready();
  num(dStar, 'dStar');
  return call(OP.dStarToJones, dStar);
}

export function jonesToDStar(jones) {
  ready();
  num(jones, 'jones');
  return call(OP.jonesToDStar, jones);
}

export function backgroundPhotonFlux(cutoffWavelengthM, backgroundTemperatureK, view, cone) {
  ready();
  num(cutoffWavelengthM, 'cutoffWavelengthM');
  num(backgroundTemperatureK, 'backgroundTemperatureK');
  const [f, code] = viewOf(view, cone);
  return call(OP.backgroundPhotonFlux, cutoffWavelengthM, backgroundTemperatureK, f, code);
}

export function blipDStar(cutoffWavelengthM, quantumEfficiency, backgroundTemperatureK, view, mechanism, cone) {
  ready();
  num(cutoffWavelengthM, 'cutoffWavelengthM');
  num(quantumEfficiency, 'quantumEfficiency');
  num(backgroundTemperatureK, 'backgroundTemperatureK');
  const [f, code] = viewOf(view, cone);
  const m = choice(mechanism, 'mechanism', MECHANISMS, 0);
  return call(OP.blipDStar, cutoffWavelengthM, quantumEfficiency, backgroundTemperatureK, f, code, m);
}

export function blipDStarFromFlux(wavelengthM, quantumEfficiency, backgroundPhotonFlux, mechanism) {
  ready();
  num(wavelengthM, 'wavelengthM');
  num(quantumEfficiency, 'quantumEfficiency');
  num(backgroundPhotonFlux, 'backgroundPhotonFlux');
  const m = choice(mechanism, 'mechanism', MECHANISMS, 0);
  return call(OP.blipDStarFromFlux, wavelengthM, quantumEfficiency, backgroundPhotonFlux, m);
}

// ---- sources and geometry

export function cavityEmissivityGouffe(wallEmissivity, shape, radiusM, depthM, apertureRadiusM) {
  ready();
  num(wallEmissivity, 'wallEmissivity');
  const s = choice(shape, 'shape', SHAPES);
  num(radiusM, 'radiusM');
  num(depthM, 'depthM');
  num(apertureRadiusM, 'apertureRadiusM');
  return call(OP.cavityEmissivityGouffe, wallEmissivity, s, radiusM, depthM, apertureRadiusM);
}

export function sizeOfSourceChange(sseAtMeasurement, sseAtCalibration) {
  ready();
  num(sseAtMeasurement, 'sseAtMeasurement');
  num(sseAtCalibration, 'sseAtCalibration');
  return call(OP.sizeOfSourceChange, sseAtMeasurement, sseAtCalibration);
}

export function sizeOfSourceCorrectedSignal(signal, relativeChange) {
  ready();
  num(signal, 'signal');
  num(relativeChange, 'relativeChange');
  return call(OP.sizeOfSourceCorrectedSignal, signal, relativeChange);
}

export function spotDiameter(distanceM, distanceToSpotRatio) {
  ready();
  num(distanceM, 'distanceM');
  num(distanceToSpotRatio, 'distanceToSpotRatio');
  return call(OP.spotDiameter, distanceM, distanceToSpotRatio);
}

export function spotDiameterFocused(distanceM, apertureDiameterM, focusDistanceM, focusSpotDiameterM) {
  ready();
  num(distanceM, 'distanceM');
  num(apertureDiameterM, 'apertureDiameterM');
  num(focusDistanceM, 'focusDistanceM');
  num(focusSpotDiameterM, 'focusSpotDiameterM');
  return call(OP.spotDiameterFocused, distanceM, apertureDiameterM, focusDistanceM, focusSpotDiameterM);
}

export function spotFill(targetDiameterM, spotDiameterM) {
  ready();
  num(targetDiameterM, 'targetDiameterM');
  num(spotDiameterM, 'spotDiameterM');
  const v = figures(glue.designNumber(OP.spotFill, targetDiameterM, spotDiameterM, 0, 0, 0, 0));
  return { diameterRatio: v[0], fillFraction: v[1], fills: v[2] === 1 };
}
