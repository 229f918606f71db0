// The page's false-colour ramp ("ember"): lightness rises monotonically from near-black to
// near-white (CIE L* 8 → 97) while the hue turns from violet through red and orange to pale
// yellow, so the map reads in order in colour, in grey-scale print and for common colour-vision
// deficiencies. Built here from CIELAB, not copied from any product.

function labToSrgb(L, a, b) {
  // D65 white
  const fy = (L + 16) / 116;
  const fx = fy + a / 500;
  const fz = fy - b / 200;
  const inv = (t) => (t > 6 / 29 ? t ** 3 : 3 * (6 / 29) ** 2 * (t - 4 / 29));
  const X = 0.95047 * inv(fx);
  const Y = 1.0 * inv(fy);
  const Z = 1.08883 * inv(fz);
  const rl = 3.2404542 * X - 1.5371385 * Y - 0.4985314 * Z;
  const gl = -0.969266 * X + 1.8760108 * Y + 0.041556 * Z;
  const bl = 0.0556434 * X - 0.2040259 * Y + 1.0572252 * Z;
  const g = (c) => (c <= 0.0031308 ? 12.92 * c : 1.055 * c ** (1 / 2.4) - 0.055);
  return [g(rl), g(gl), g(bl)];
}

function inGamut(rgb) {
  return rgb.every((c) => c >= -1e-4 && c <= 1 + 1e-4);
}

/** Returns a 256×3 Uint8ClampedArray of sRGB colours, index 0 = coldest. */
export function emberRamp(n = 256) {
  const lut = new Uint8ClampedArray(n * 3);
  for (let i = 0; i < n; i++) {
    const t = i / (n - 1);
    const L = 8 + 89 * t;
    const h = (((300 + 145 * t) % 360) * Math.PI) / 180; // 300° violet → 0° red → 85° yellow
    let C = 20 + 70 * Math.sin(Math.PI * Math.min(1, t * 1.1));
    let rgb = labToSrgb(L, C * Math.cos(h), C * Math.sin(h));
    while (!inGamut(rgb) && C > 0) { // reduce chroma until the colour is displayable
      C -= 1;
      rgb = labToSrgb(L, C * Math.cos(h), C * Math.sin(h));
    }
    lut[3 * i] = Math.round(255 * rgb[0]);
    lut[3 * i + 1] = Math.round(255 * rgb[1]);
    lut[3 * i + 2] = Math.round(255 * rgb[2]);
  }
  return lut;
}
