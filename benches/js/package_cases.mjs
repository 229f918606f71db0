// Maps the benchmark cases onto the wasm package's exports. Each entry returns
// {case, fn, extra} when the package has what the case needs, or {case, skip} otherwise, so the
// bench never times a substitute under a wrong name.

const CASES = [];

/** The cases that this package build can run. */
export function packageCases(pkg, shared) {
  return CASES.map(([kase, make]) => {
    try {
      const c = make(pkg, shared);
      return c ? { case: kase, ...c } : { case: kase, skip: "export not found in pkg/" };
    } catch (e) {
      return { case: kase, skip: `failed: ${e && e.message}` };
    }
  });
}
