// The invented demo scene for the frame converter: tiles leaving a made-up roller kiln on a
// metal-mesh conveyor, seen by a made-up 160 × 120 thermal imager. Returns the scene's "true"
// temperature (K) and emissivity per pixel; these are demo INPUTS — every temperature the page
// shows for the frame is computed by the core from the raw counts derived from them.

export const SCENE_W = 160;
export const SCENE_H = 120;

export function kilnConveyorScene() {
  const n = SCENE_W * SCENE_H;
  const temperatureK = new Float64Array(n);
  const emissivity = new Float64Array(n);
  const dead = new Uint8Array(n);
  for (let y = 0; y < SCENE_H; y++) {
    for (let x = 0; x < SCENE_W; x++) {
      const i = y * SCENE_W + x;
      // conveyor mesh: warm near the kiln mouth (left), cooling to the right; rollers every 20 px
      const roller = y % 20 < 3 ? 12 : 0;
      temperatureK[i] = 405 - 0.35 * x + roller + 4 * Math.sin(x * 0.9) * Math.sin(y * 0.7);
      emissivity[i] = 0.35;
    }
  }
  // three columns × two rows of tiles, hotter near the kiln, each with a cooler rim
  for (let r = 0; r < 2; r++) {
    for (let c = 0; c < 3; c++) {
      const x0 = 12 + c * 50;
      const y0 = 14 + r * 52;
      const core = 905 - 45 * c - 12 * r;
      for (let y = y0; y < y0 + 38; y++) {
        for (let x = x0; x < x0 + 38; x++) {
          const i = y * SCENE_W + x;
          const dx = (x - x0 - 18.5) / 19;
          const dy = (y - y0 - 18.5) / 19;
          const rim = Math.max(Math.abs(dx), Math.abs(dy));
          temperatureK[i] = core - 70 * rim ** 3;
          emissivity[i] = 0.93;
        }
      }
    }
  }
  // a crack in the middle tile of the top row: a thin hotter line
  for (let k = 0; k < 26; k++) {
    const x = 68 + k;
    const y = 22 + Math.round(k * 0.8);
    temperatureK[y * SCENE_W + x] += 25;
  }
  // a cluster of dead detector pixels
  for (const [x, y] of [[140, 100], [141, 100], [140, 101], [141, 101], [142, 101]]) dead[y * SCENE_W + x] = 1;
  return { temperatureK, emissivity, dead };
}
