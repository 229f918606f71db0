// The page's one door to the WebAssembly package. Every number the page shows comes through
// here from the quantaband core; the sections never call the package directly. A section asks
// `api.has(...)` for the bindings it needs and is left out when the package lacks them.

let qb = null;

/** Installs the initialised package. */
export function bindApi(pkg) {
  qb = pkg;
}

function fn(name) {
  const f = qb && qb[name];
  if (typeof f !== 'function') throw new Error(`the quantaband package has no ${name}()`);
  return f;
}

export const api = {
  /** True when every named export exists. */
  has(...names) {
    return !!qb && names.every((n) => typeof qb[n] === 'function');
  },
  isError(e) {
    return !!qb && typeof qb.QuantabandError === 'function' && e instanceof qb.QuantabandError;
  },
  // ---- units (conversion lives in the core's unit module)
  toKelvin(value, unit) {
    return fn('toKelvin')(value, unit);
  },
  fromKelvin(kelvin, unit) {
    return fn('fromKelvin')(kelvin, unit);
  },
  spectralToSi(value, unit) {
    return fn('spectralToSi')(value, unit);
  },
  spectralFromSi(valueSi, unit) {
    return fn('spectralFromSi')(valueSi, unit);
  },
  spectralKind(unit) {
    return fn('spectralKind')(unit);
  },
};
