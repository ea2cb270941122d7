// Ellipse ↔ component conversion. Expected values are the worked examples written out by hand in the
// comment of engine/streams/ellipse.ts from the published formulas (Foreman 1978's rotary-component
// conversion; the ellipse convention of Pugh 1987 §4.3):
//   east 2·cos(θ₀ − 30°), north 2·cos(θ₀ − 30°)    → major 2√2, minor 0,  φ 45°, g 30°
//   east 3·cos(θ₀ − 40°), north 1·cos(θ₀ − 130°)   → major 3,   minor +1, φ 0°,  g 40°
//   east 3·cos(θ₀ − 40°), north 1·cos(θ₀ − 310°)   → major 3,   minor −1, φ 0°,  g 40°
//   east 0,               north 1.5·cos(θ₀ − 200°) → major 1.5, minor 0,  φ 90°, g 200°
import { describe, expect, test } from 'vitest';
import { componentsToEllipse, ellipseToComponents } from '../../engine/streams/ellipse.js';

const angleDiff = (a: number, b: number): number => Math.abs(((a - b + 540) % 360) - 180);

describe('componentsToEllipse on worked values', () => {
  const cases = [
    { east: [2, 30], north: [2, 30], major: 2 * Math.SQRT2, minor: 0, inclination: 45, phase: 30 },
    { east: [3, 40], north: [1, 130], major: 3, minor: 1, inclination: 0, phase: 40 },
    { east: [3, 40], north: [1, 310], major: 3, minor: -1, inclination: 0, phase: 40 },
    { east: [0, 0], north: [1.5, 200], major: 1.5, minor: 0, inclination: 90, phase: 200 },
  ] as const;
  test.each(cases)('east $east, north $north', (c) => {
    const e = componentsToEllipse({ amplitude: c.east[0], phase: c.east[1] }, { amplitude: c.north[0], phase: c.north[1] });
    expect(e.major).toBeCloseTo(c.major, 12);
    expect(e.minor).toBeCloseTo(c.minor, 12);
    expect(angleDiff(e.inclination, c.inclination)).toBeLessThan(1e-9);
    expect(angleDiff(e.phase, c.phase)).toBeLessThan(1e-9);
    expect(e.inclination).toBeGreaterThanOrEqual(0);
    expect(e.inclination).toBeLessThan(180);
  });

  test('ellipseToComponents gives back the worked components', () => {
    const { east, north } = ellipseToComponents({ major: 3, minor: 1, inclination: 0, phase: 40 });
    expect(east.amplitude).toBeCloseTo(3, 12);
    expect(angleDiff(east.phase, 40)).toBeLessThan(1e-9);
    expect(north.amplitude).toBeCloseTo(1, 12);
    expect(angleDiff(north.phase, 130)).toBeLessThan(1e-9);
  });
});

describe('round trip component → ellipse → component', () => {
  // a small seeded generator (xorshift32), so the cases are the same on every run
  let seed = 0x2f6b3a1d;
  const random = (): number => {
    seed ^= seed << 13;
    seed ^= seed >>> 17;
    seed ^= seed << 5;
    return (seed >>> 0) / 2 ** 32;
  };
  test('2000 random pairs agree to 1e-9', () => {
    for (let i = 0; i < 2000; i++) {
      const east = { amplitude: 3 * random(), phase: 360 * random() };
      const north = { amplitude: 3 * random(), phase: 360 * random() };
      const e = componentsToEllipse(east, north);
      expect(Math.abs(e.minor)).toBeLessThanOrEqual(e.major + 1e-12);
      const back = ellipseToComponents(e);
      // compare as complex numbers A·e^{−iG}: a phase is meaningless when the amplitude is zero
      const gap = (a: { amplitude: number; phase: number }, b: { amplitude: number; phase: number }) =>
        Math.hypot(
          a.amplitude * Math.cos((a.phase * Math.PI) / 180) - b.amplitude * Math.cos((b.phase * Math.PI) / 180),
          a.amplitude * Math.sin((a.phase * Math.PI) / 180) - b.amplitude * Math.sin((b.phase * Math.PI) / 180),
        );
      expect(gap(back.east, east)).toBeLessThan(1e-9);
      expect(gap(back.north, north)).toBeLessThan(1e-9);
    }
  });
});
