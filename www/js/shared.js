// Results one section offers another (so that a task never needs copying between sections):
// `curve` is the Sakuma–Hattori curve last fitted by the calibration section ({ aM, bMK, c, c2 }).
export const shared = { curve: null };
