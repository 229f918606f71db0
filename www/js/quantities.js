// Names and unit strings of the radiometric quantities shown on the page.

const PER = { um: 'µm⁻¹', nm: 'nm⁻¹', 'cm-1': 'cm', THz: 'THz⁻¹', GHz: 'GHz⁻¹', m: 'm⁻¹', 'm-1': 'm', Hz: 'Hz⁻¹' };

/** Unit of a band (integrated) quantity. */
export function bandUnit(quantity, geometry) {
  const base = quantity === 'photon' ? 's⁻¹·m⁻²' : 'W·m⁻²';
  return geometry === 'radiance' ? `${base}·sr⁻¹` : base;
}

/** Unit of a spectral density per display unit `unit` of the spectral variable. */
export function densityUnit(quantity, geometry, unit) {
  return `${bandUnit(quantity, geometry)}·${PER[unit] || `(${unit})⁻¹`}`;
}

export function variableName(variable) {
  return { wavelength: 'wavelength', wavenumber: 'wavenumber', frequency: 'frequency', photonEnergy: 'photon energy' }[variable] || variable;
}

export function quantityName(quantity, geometry) {
  return `${quantity === 'photon' ? 'photon ' : ''}${geometry === 'exitance' ? 'exitance' : 'radiance'}`;
}
