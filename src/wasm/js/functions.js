// Free functions of plain numbers (no options): occupancies, Bose–Einstein and Fermi–Dirac
// integrals, photon-gas quantities, blackbody fractions, Planck integrals, unit conversions,
// constants, ITS-90 radiance ratios and two-colour temperatures. Each checks its arguments'
// types and wraps one export of src/wasm/{stats,fractions,units,its90}.rs.

import { QuantabandError } from './errors.js';
import { bulk, glue, num, ready, result, some, str } from './runtime.js';
import { _scratchNumbers } from './uncertainty_results.js';

// ---- occupancies and integrals (src/wasm/stats.rs)

export function boseEinstein(x) {
  ready();
  num(x, 'x');
  return result(glue.boseEinstein(x));
}

export function fermiDirac(x) {
  ready();
  num(x, 'x');
  return result(glue.fermiDirac(x));
}

export function maxwellBoltzmann(x) {
  ready();
  num(x, 'x');
  return result(glue.maxwellBoltzmann(x));
}

export function boseEinsteinArray(xs, out) {
  ready();
  return bulk(xs, 'xs', out, () => glue.statsBulk(0, 0));
}

export function fermiDiracArray(xs, out) {
  ready();
  return bulk(xs, 'xs', out, () => glue.statsBulk(1, 0));
}

export function maxwellBoltzmannArray(xs, out) {
  ready();
  return bulk(xs, 'xs', out, () => glue.statsBulk(2, 0));
}

export function boseEinsteinEnergy(energyJ, chemicalPotentialJ, temperatureK) {
  ready();
  num(energyJ, 'energyJ');
  num(chemicalPotentialJ, 'chemicalPotentialJ');
  num(temperatureK, 'temperatureK');
  return result(glue.boseEinsteinEnergy(energyJ, chemicalPotentialJ, temperatureK));
}

export function fermiDiracEnergy(energyJ, chemicalPotentialJ, temperatureK) {
  ready();
  num(energyJ, 'energyJ');
  num(chemicalPotentialJ, 'chemicalPotentialJ');
  num(temperatureK, 'temperatureK');
  return result(glue.fermiDiracEnergy(energyJ, chemicalPotentialJ, temperatureK));
}

export function maxwellBoltzmannEnergy(energyJ, chemicalPotentialJ, temperatureK) {
  ready();
  num(energyJ, 'energyJ');
  num(chemicalPotentialJ, 'chemicalPotentialJ');
  num(temperatureK, 'temperatureK');
  return result(glue.maxwellBoltzmannEnergy(energyJ, chemicalPotentialJ, temperatureK));
}

export function thermalPhotonNumber(frequencyHz, temperatureK) {
  ready();
  num(frequencyHz, 'frequencyHz');
  num(temperatureK, 'temperatureK');
  return result(glue.thermalPhotonNumber(frequencyHz, temperatureK));
}

export function boseEinsteinIntegral(order, fugacity) {
  ready();
  num(order, 'order');
  num(fugacity, 'fugacity');
  return result(glue.boseEinsteinIntegral(order, fugacity));
}

export function boseCriticalTemperature(numberDensityPerM3, massKg) {
  ready();
  num(numberDensityPerM3, 'numberDensityPerM3');
  num(massKg, 'massKg');
  return result(glue.boseCriticalTemperature(numberDensityPerM3, massKg));
}

export function fermiDiracIntegral(order, eta) {
  ready();
  num(order, 'order');
  num(eta, 'eta');
  return result(glue.fermiDiracIntegral(order, eta));
}

export function fermiDiracIntegralArray(order, etas, out) {
  ready();
  num(order, 'order');
  return bulk(etas, 'etas', out, () => glue.statsBulk(3, order));
}

export function inverseFermiDiracHalf(reducedDensity) {
  ready();
  num(reducedDensity, 'reducedDensity');
  return result(glue.inverseFermiDiracHalf(reducedDensity));
}

// ---- photon gas and noise temperatures (src/wasm/stats.rs)

export function quantumNoiseTemperature(frequencyHz, temperatureK) {
  ready();
  num(frequencyHz, 'frequencyHz');
  num(temperatureK, 'temperatureK');
  return result(glue.quantumNoiseTemperature(frequencyHz, temperatureK));
}

export function rayleighJeansBrightnessTemperature(frequencyHz, temperatureK) {
  ready();
  num(frequencyHz, 'frequencyHz');
  num(temperatureK, 'temperatureK');
  return result(glue.rayleighJeansBrightnessTemperature(frequencyHz, temperatureK));
}

export function physicalTemperatureFromRayleighJeans(frequencyHz, brightnessTemperatureK) {
  ready();
  num(frequencyHz, 'frequencyHz');
  num(brightnessTemperatureK, 'brightnessTemperatureK');
  return result(glue.physicalTemperatureFromRayleighJeans(frequencyHz, brightnessTemperatureK));
}

export function availableNoisePowerDensity(frequencyHz, temperatureK) {
  ready();
  num(frequencyHz, 'frequencyHz');
  num(temperatureK, 'temperatureK');
  return result(glue.availableNoisePowerDensity(frequencyHz, temperatureK));
}

export function availableNoisePowerDensityWithZeroPoint(frequencyHz, temperatureK) {
  ready();
  num(frequencyHz, 'frequencyHz');
  num(temperatureK, 'temperatureK');
  return result(glue.availableNoisePowerDensityWithZeroPoint(frequencyHz, temperatureK));
}

export function photonEntropyDensity(temperatureK) {
  ready();
  num(temperatureK, 'temperatureK');
  return result(glue.photonEntropyDensity(temperatureK));
}

export function photonPressure(temperatureK) {
  ready();
  num(temperatureK, 'temperatureK');
  return result(glue.photonPressure(temperatureK));
}

export function photonDensityOfStates(energyJ) {
  ready();
  num(energyJ, 'energyJ');
  return result(glue.photonDensityOfStates(energyJ));
}

export function spectralEnergyDensityEnergy(energyJ, temperatureK) {
  ready();
  num(energyJ, 'energyJ');
  num(temperatureK, 'temperatureK');
  return result(glue.spectralEnergyDensityEnergy(energyJ, temperatureK));
}

export function spectralEnergyDensityFrequency(frequencyHz, temperatureK) {
  ready();
  num(frequencyHz, 'frequencyHz');
  num(temperatureK, 'temperatureK');
  return result(glue.spectralEnergyDensityFrequency(frequencyHz, temperatureK));
}

export function photonNumberDensity(temperatureK) {
  ready();
  num(temperatureK, 'temperatureK');
  return result(glue.photonNumberDensity(temperatureK));
}

export function energyDensity(temperatureK) {
  ready();
  num(temperatureK, 'temperatureK');
  return result(glue.energyDensity(temperatureK));
}

export function meanPhotonEnergy(temperatureK) {
  ready();
  num(temperatureK, 'temperatureK');
  return result(glue.meanPhotonEnergy(temperatureK));
}

// ---- blackbody fractions and Planck integrals (src/wasm/fractions.rs)

export function fractionBelow(lambdaTMK) {
  ready();
  num(lambdaTMK, 'lambdaTMK');
  return result(glue.fractionBelow(lambdaTMK));
}

export function photonFractionBelow(lambdaTMK) {
  ready();
  num(lambdaTMK, 'lambdaTMK');
  return result(glue.photonFractionBelow(lambdaTMK));
}

export function lambdaTAtFraction(fraction) {
  ready();
  num(fraction, 'fraction');
  return result(glue.lambdaTAtFraction(fraction));
}

export function photonLambdaTAtFraction(fraction) {
  ready();
  num(fraction, 'fraction');
  return result(glue.photonLambdaTAtFraction(fraction));
}

export function planckIntegral(kernel, xLower, xUpper) {
  ready();
  str(kernel, 'kernel', 'UNSUPPORTED');
  num(xLower, 'xLower');
  num(xUpper, 'xUpper');
  return result(glue.planckIntegralOf(kernel, 0, xLower, xUpper));
}

export function planckIntegralUpper(kernel, x) {
  ready();
  str(kernel, 'kernel', 'UNSUPPORTED');
  num(x, 'x');
  return result(glue.planckIntegralOf(kernel, 1, x, 0));
}

export function planckIntegralLower(kernel, x) {
  ready();
  str(kernel, 'kernel', 'UNSUPPORTED');
  num(x, 'x');
  return result(glue.planckIntegralOf(kernel, 2, 0, x));
}

export function planckIntegralTotal(kernel) {
  ready();
  str(kernel, 'kernel', 'UNSUPPORTED');
  return result(glue.planckIntegralOf(kernel, 3, 0, 0));
}

// ---- units and constants (src/wasm/units.rs)

function units(from, to) {
  str(from, 'from', 'UNKNOWN_UNIT');
  str(to, 'to', 'UNKNOWN_UNIT');
}

export function convertSpectral(value, from, to) {
  ready();
  num(value, 'value');
  units(from, to);
  return result(glue.convertUnit(0, value, from, to));
}

export function convertSpectralArray(values, from, to, out) {
  ready();
  units(from, to);
  return bulk(values, 'values', out, () => glue.convertUnitBulk(0, from, to));
}

export function spectralUnitKind(unit) {
  ready();
  str(unit, 'unit', 'UNKNOWN_UNIT');
  return some(glue.spectralUnitKind(unit));
}

export function convertTemperature(value, from, to) {
  ready();
  num(value, 'value');
  units(from, to);
  return result(glue.convertUnit(1, value, from, to));
}

export function convertTemperatureArray(values, from, to, out) {
  ready();
  units(from, to);
  return bulk(values, 'values', out, () => glue.convertUnitBulk(1, from, to));
}

export function convertTemperatureDifference(value, from, to) {
  ready();
  num(value, 'value');
  units(from, to);
  return result(glue.convertUnit(2, value, from, to));
}

let theConstants = null;

export function constants() {
  ready();
  if (theConstants === null) theConstants = Object.freeze(some(glue.constants()));
  return theConstants;
}

// ---- ITS-90 radiance ratios and two-colour temperatures (src/wasm/its90.rs)

function c2Name(c2) {
  if (c2 === undefined) return '';
  str(c2, 'c2', 'UNSUPPORTED');
  if (c2 === '') throw new QuantabandError('UNSUPPORTED', 'c2 must be one of "codata2018", "its90" (got "")');
  return c2;
}

export function fixedPointTemperature(fixedPoint) {
  ready();
  str(fixedPoint, 'fixedPoint', 'UNSUPPORTED');
  return result(glue.qbRatio(0, 0, 0, 0, 0, '', fixedPoint));
}

export function temperatureFromRatio(ratio, wavelength, unit, referenceTemperatureK, c2) {
  ready();
  num(ratio, 'ratio');
  num(wavelength, 'wavelength');
  str(unit, 'unit', 'UNKNOWN_UNIT');
  num(referenceTemperatureK, 'referenceTemperatureK');
  return result(glue.qbRatio(1, ratio, wavelength, referenceTemperatureK, 0, unit, c2Name(c2)));
}

export function radianceRatio(temperatureK, wavelength, unit, referenceTemperatureK, c2) {
  ready();
  num(temperatureK, 'temperatureK');
  num(wavelength, 'wavelength');
  str(unit, 'unit', 'UNKNOWN_UNIT');
  num(referenceTemperatureK, 'referenceTemperatureK');
  return result(glue.qbRatio(2, temperatureK, wavelength, referenceTemperatureK, 0, unit, c2Name(c2)));
}

export function its90Temperature(ratio, wavelength, unit, fixedPoint) {
  ready();
  num(ratio, 'ratio');
  num(wavelength, 'wavelength');
  str(unit, 'unit', 'UNKNOWN_UNIT');
  str(fixedPoint, 'fixedPoint', 'UNSUPPORTED');
  const v = _scratchNumbers(glue.qbRatio(4, ratio, wavelength, 0, 0, unit, fixedPoint));
  return { t90K: v[0], tCodataC2K: v[1], c2EffectK: v[2], belowSilverPoint: v[3] === 1 };
}

export function twoColourTemperature(wavelength1, wavelength2, unit, ratio, emissivityRatio, c2) {
  ready();
  num(wavelength1, 'wavelength1');
  num(wavelength2, 'wavelength2');
  str(unit, 'unit', 'UNKNOWN_UNIT');
  num(ratio, 'ratio');
  num(emissivityRatio, 'emissivityRatio');
  const v = _scratchNumbers(glue.qbRatio(5, wavelength1, wavelength2, ratio, emissivityRatio, unit, c2Name(c2)));
  return { temperatureK: v[0], dTdRatio: v[1], dTdEmissivityRatio: v[2] };
}
