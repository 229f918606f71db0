// A CommonJS consumer: `require('quantaband')` loads the package's ES module entry (require of an
// ES module without top-level await, unflagged on the Node versions of the package's engines).
// Prints what it found as JSON for tests/consumers/consumers.test.mjs.
'use strict';
const quantaband = require('quantaband');
const { Spectrum, QuantabandError, convertTemperature } = quantaband;

const spectrum = new Spectrum({ unit: 'um' });
const out = {
  resolved: require.resolve('quantaband'),
  requireModule: process.features.require_module === true,
  radiance: spectrum.point(10, 300), // W·m⁻²·sr⁻¹·µm⁻¹
  kelvin: convertTemperature(25, 'degC', 'K'),
};
try {
  spectrum.point(10, -1);
  out.error = 'no error thrown for T = -1 K';
} catch (e) {
  out.error = { instanceOfClass: e instanceof QuantabandError, code: e.code };
}
spectrum.free();
process.stdout.write(JSON.stringify(out));
