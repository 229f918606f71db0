// The probe the tarball smoke test (smoke.mjs) runs in every environment: Node through the
// package's node entry, Node through its web entry, a browser page and a module web worker.
// Plain ES2020, no imports: the same file is served to the browser. `m` is the package's module
// namespace (already initialised); `ref` is reference.json. Returns plain data; smoke.mjs checks it.
export async function runProbe(m, ref) {
  const out = {
    exportCount: Object.keys(m).length,
    errorCodes: Array.from(m.ERROR_CODES),
    // Unit conversions (exact by definition, see reference.json "units").
    units: {
      degCToK: ref.units.map((u) => m.convertTemperature(u.celsius, 'degC', 'K')),
      degCToKArray: Array.from(m.convertTemperatureArray(new Float64Array(ref.units.map((u) => u.celsius)), 'degC', 'K')),
      umToPerCm: m.convertSpectral(10, 'um', 'cm-1'),
    },
  };
  // Blackbody spectral radiance per wavelength (SI, wavelength given in metres): a prepared
  // Spectrum, freed at the end.
  const spectrum = new m.Spectrum({ unit: 'm' });
  out.radiance = ref.cases.map((c) => spectrum.point(c.wavelength_m, c.temperature_k));
  out.radianceArray = Array.from(spectrum.points([ref.cases[0].wavelength_m], ref.cases[0].temperature_k));
  try {
    spectrum.point(ref.cases[0].wavelength_m, -1);
    out.badTemperature = 'no error thrown for T = -1 K';
  } catch (e) {
    out.badTemperature = { instanceOfClass: e instanceof m.QuantabandError, code: e.code };
  }
  try {
    m.convertTemperature(-300, 'degC', 'K');
    out.badInput = 'no error thrown for -300 degC';
  } catch (e) {
    out.badInput = {
      instanceOfClass: e instanceof m.QuantabandError,
      instanceOfError: e instanceof Error,
      name: e.name,
      code: e.code,
    };
  }
  try {
    m.convertTemperatureArray(new Float64Array([20, Number.NaN, 30]), 'degC', 'K');
    out.badElement = 'no error thrown for a NaN element';
  } catch (e) {
    out.badElement = { code: e.code, index: e.index };
  }
  out.afterError = m.convertTemperature(ref.units[0].celsius, 'degC', 'K');
  out.radianceAfterError = spectrum.point(ref.cases[0].wavelength_m, ref.cases[0].temperature_k);
  spectrum.free();
  try {
    spectrum.point(ref.cases[0].wavelength_m, ref.cases[0].temperature_k);
    out.afterFree = 'no error thrown after free()';
  } catch (e) {
    out.afterFree = e.code;
  }
  return out;
}
