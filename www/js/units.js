// Units the page offers in its menus, with their display symbols. The conversions themselves
// are done by the core's unit module (api.js → convertTemperature, convertSpectral); this file
// only lists names and symbols.

/** Temperature units: [core name, symbol]. */
export const TEMPERATURE_UNITS = [['K', 'K'], ['degC', '°C'], ['degF', '°F']];

/** Spectral units by kind: [core name, symbol]. */
export const SPECTRAL_UNITS = {
  wavelength: [['um', 'µm'], ['nm', 'nm'], ['mm', 'mm']],
  wavenumber: [['cm-1', 'cm⁻¹']],
  frequency: [['THz', 'THz'], ['GHz', 'GHz'], ['MHz', 'MHz'], ['kHz', 'kHz'], ['Hz', 'Hz']],
  photonEnergy: [['eV', 'eV'], ['meV', 'meV']],
};

/** Menu text of a spectral unit (with its variable when the menu mixes kinds). */
const KIND_WORD = { wavelength: 'wavelength', wavenumber: 'wavenumber', frequency: 'frequency', photonEnergy: 'photon energy' };

/** Symbols of every unit name the page uses. */
export const SYMBOL = {
  K: 'K', degC: '°C', degF: '°F',
  um: 'µm', nm: 'nm', mm: 'mm', m: 'm', 'cm-1': 'cm⁻¹', 'm-1': 'm⁻¹',
  THz: 'THz', GHz: 'GHz', MHz: 'MHz', kHz: 'kHz', Hz: 'Hz', eV: 'eV', meV: 'meV', J: 'J',
};

export function symbol(unit) {
  return SYMBOL[unit] ?? unit;
}

export function kindWord(kind) {
  return KIND_WORD[kind] ?? kind;
}

/** Option list of a unit menu. type: temperature | spectral | density; kinds: spectral kinds. */
export function unitOptions(type, kinds, verbose = false) {
  if (type === 'temperature') return TEMPERATURE_UNITS.map(([v, t]) => [v, t]);
  const list = (kinds && kinds.length ? kinds : Object.keys(SPECTRAL_UNITS)).filter((k) => SPECTRAL_UNITS[k]);
  if (type === 'density') {
    // spectral radiance per wavelength unit: W·m⁻²·sr⁻¹ per µm, nm, m
    return [['um', 'W·m⁻²·sr⁻¹·µm⁻¹'], ['nm', 'W·m⁻²·sr⁻¹·nm⁻¹'], ['m', 'W·m⁻²·sr⁻¹·m⁻¹']];
  }
  const mixed = verbose && list.length > 1;
  return list.flatMap((k) => SPECTRAL_UNITS[k].map(([v, t]) => [v, mixed ? `${KIND_WORD[k]}, ${t}` : t]));
}

const PER = { um: 'µm⁻¹', nm: 'nm⁻¹', mm: 'mm⁻¹', m: 'm⁻¹', 'cm-1': 'cm', 'm-1': 'm', THz: 'THz⁻¹', GHz: 'GHz⁻¹', MHz: 'MHz⁻¹', kHz: 'kHz⁻¹', Hz: 'Hz⁻¹', eV: 'eV⁻¹', meV: 'meV⁻¹' };

/** Unit of a band (integrated) radiometric quantity. */
export function bandUnit(quantity, geometry) {
  const base = quantity === 'photon' ? 's⁻¹·m⁻²' : 'W·m⁻²';
  return geometry === 'exitance' ? base : `${base}·sr⁻¹`;
}

/** Unit of a spectral density per `unit` of the spectral variable. */
export function densityUnit(quantity, geometry, unit) {
  return `${bandUnit(quantity, geometry)}·${PER[unit] ?? `(${symbol(unit)})⁻¹`}`;
}

/** "radiance", "photon exitance", … */
export function quantityName(quantity, geometry) {
  return `${quantity === 'photon' ? 'photon ' : ''}${geometry === 'exitance' ? 'exitance' : 'radiance'}`;
}
