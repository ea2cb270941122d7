// Tidal current ellipses and their east and north components.
//
// Convention (Pugh 1987, Tides, Surges and Mean Sea-Level, §4.3 on current ellipses; the parameters as
// in Foreman 1978, Manual for Tidal Currents Analysis and Prediction, Pacific Marine Science Report
// 78-6): for a constituent with phase θ = V₀ + u + ωt − g (g the Greenwich phase lag, UTC, as for
// heights) and node factor f, the velocity in a frame whose x axis points along the inclination φ
// (degrees counter-clockwise from east) is
//     (x, y) = (f·major·cos θ, f·minor·sin θ);
// minor > 0 turns the vector counter-clockwise, minor < 0 clockwise. Rotated to east and north,
//     east  = f·Re[(major·cos φ + i·minor·sin φ)·e^{iθ}],
//     north = f·Re[(major·sin φ − i·minor·cos φ)·e^{iθ}],
// so each component is a height-like term f·A·cos(V₀ + u + ωt − G) with A = |c| and G = g − arg c:
// the height engine's kernel predicts each component unchanged.
//
// Back from components (Foreman's conversion through the rotary components): with U = A_e·e^{−iG_e},
// V = A_n·e^{−iG_n}, the velocity east + i·north = W₊·e^{i(V₀+u+ωt)} + W₋·e^{−i(V₀+u+ωt)} with
//     W₊ = (U + iV)/2,   W₋ = (Ū + iV̄)/2,
//     major = |W₊| + |W₋|,   minor = |W₊| − |W₋|,
//     φ = (arg W₊ + arg W₋)/2,   g = (arg W₋ − arg W₊)/2,
// taken with φ in [0°, 180°) (φ and g both turned by 180° describe the same ellipse).
//
// Worked values (by hand from the formulas above; tests/engine/streams-ellipse.test.ts checks them):
//   east 2·cos(θ₀ − 30°), north 2·cos(θ₀ − 30°)  → major 2√2, minor 0, φ 45°, g 30° (to and fro, NE–SW)
//   east 3·cos(θ₀ − 40°), north 1·cos(θ₀ − 130°) → major 3, minor +1, φ 0°, g 40° (counter-clockwise)
//   east 3·cos(θ₀ − 40°), north 1·cos(θ₀ − 310°) → major 3, minor −1, φ 0°, g 40° (clockwise)
//   east 0,               north 1.5·cos(θ₀ − 200°) → major 1.5, minor 0, φ 90°, g 200°
// where θ₀ = V₀ + u + ωt.

import type { CurrentEllipse } from './types.js';

const DEG = Math.PI / 180;

/** One component as a height-like constant: amplitude A and phase lag G (degrees, [0, 360)). */
export interface ComponentConstant {
  amplitude: number;
  phase: number;
}

const wrap360 = (x: number): number => {
  const r = x % 360;
  return r < 0 ? r + 360 : r + 0;
};

/** The east and north components of one constituent's ellipse. */
export function ellipseToComponents(e: CurrentEllipse): { east: ComponentConstant; north: ComponentConstant } {
  const phi = e.inclination * DEG;
  const eastRe = e.major * Math.cos(phi);
  const eastIm = e.minor * Math.sin(phi);
  const northRe = e.major * Math.sin(phi);
  const northIm = -e.minor * Math.cos(phi);
  return {
    east: { amplitude: Math.hypot(eastRe, eastIm), phase: wrap360(e.phase - Math.atan2(eastIm, eastRe) / DEG) },
    north: { amplitude: Math.hypot(northRe, northIm), phase: wrap360(e.phase - Math.atan2(northIm, northRe) / DEG) },
  };
}

/** The ellipse of one constituent from its east and north components (Foreman's conversion). */
export function componentsToEllipse(east: ComponentConstant, north: ComponentConstant): CurrentEllipse {
  // U = A_e e^{−iG_e}, V = A_n e^{−iG_n}
  const ur = east.amplitude * Math.cos(east.phase * DEG);
  const ui = -east.amplitude * Math.sin(east.phase * DEG);
  const vr = north.amplitude * Math.cos(north.phase * DEG);
  const vi = -north.amplitude * Math.sin(north.phase * DEG);
  // W₊ = (U + iV)/2, W₋ = (Ū + iV̄)/2
  const pr = (ur - vi) / 2;
  const pi = (ui + vr) / 2;
  const mr = (ur + vi) / 2;
  const mi = (-ui + vr) / 2;
  const plus = Math.hypot(pr, pi);
  const minus = Math.hypot(mr, mi);
  const argPlus = Math.atan2(pi, pr) / DEG;
  const argMinus = Math.atan2(mi, mr) / DEG;
  let inclination = (argPlus + argMinus) / 2; // (−180, 180]
  let phase = (argMinus - argPlus) / 2;
  // rounding can leave −1e-15 for an axis due east: that is 0°, not 179.999…°
  if (inclination < -1e-9) {
    inclination += 180;
    phase += 180;
  } else if (inclination >= 180 - 1e-9) {
    inclination -= 180;
    phase -= 180;
  }
  return { major: plus + minus, minor: plus - minus, inclination: Math.max(0, inclination) + 0, phase: wrap360(phase) };
}
