import { describe, expect, it } from 'vitest';
import { ARGUMENT_RATES, fundamentalArguments, lunarOrbit } from '../../engine/astro.js';

const J2000 = Date.UTC(2000, 0, 1, 12, 0, 0);
const YEAR_MS = 365.25 * 86_400_000;

function angleDiff(a: number, b: number): number {
  return Math.abs(((a - b + 540) % 360) - 180);
}

describe('fundamental arguments', () => {
  it('match Meeus at J2000.0', () => {
    // Meeus (1998), Astronomical Algorithms, ch. 47 and 25 (REFERENCE-VALUES §2, from memory), tolerance 0.01°.
    // J2000.0 is 12:00 TT; the engine reads its instants as UTC (ΔT ignored by design), so 12:00 UTC here.
    const a = fundamentalArguments(J2000);
    expect(angleDiff(a.s, 218.3164)).toBeLessThan(0.01);
    expect(angleDiff(a.h, 280.4665)).toBeLessThan(0.01);
    expect(angleDiff(a.p, 83.3532)).toBeLessThan(0.01);
    expect(angleDiff(a.N, 125.0445)).toBeLessThan(0.01);
    expect(angleDiff(a.pp, 282.9373)).toBeLessThan(0.01);
  });

  it('have the rates of Schureman Table 1', () => {
    // Schureman (1958) Table 1 (REFERENCE-VALUES §1, from memory), given to 7 decimals.
    expect(ARGUMENT_RATES.T).toBe(15);
    expect(ARGUMENT_RATES.s).toBeCloseTo(0.5490165, 7);
    expect(ARGUMENT_RATES.h).toBeCloseTo(0.0410686, 7);
    expect(ARGUMENT_RATES.p).toBeCloseTo(0.0046418, 7);
    expect(ARGUMENT_RATES.N).toBeCloseTo(-0.0022064, 7);
    expect(ARGUMENT_RATES.pp).toBeCloseTo(0.000002, 7);
  });

  it('advance at those rates between two instants (up to the tiny T² terms)', () => {
    const t0 = Date.UTC(2027, 2, 1);
    const hours = 1000;
    const a = fundamentalArguments(t0);
    const b = fundamentalArguments(t0 + hours * 3_600_000);
    const advance = (x: number, y: number) => (((y - x) % 360) + 360) % 360;
    expect(advance(a.s, b.s)).toBeCloseTo((ARGUMENT_RATES.s * hours) % 360, 5);
    expect(advance(a.h, b.h)).toBeCloseTo((ARGUMENT_RATES.h * hours) % 360, 5);
    expect(advance(a.T, b.T)).toBeCloseTo((15 * hours) % 360, 9);
  });

  it('put the mean sun on the Greenwich meridian at 12:00 UTC (T = 0) and opposite at 00:00 (T = 180°)', () => {
    // Schureman (1958): T is the hour angle of the mean sun, so S2's argument 2T is 0 at noon and midnight.
    expect(fundamentalArguments(Date.UTC(2031, 6, 4, 12)).T).toBeCloseTo(0, 9);
    expect(fundamentalArguments(Date.UTC(2031, 6, 4, 0)).T).toBeCloseTo(180, 9);
    expect(fundamentalArguments(Date.UTC(2031, 6, 4, 18)).T).toBeCloseTo(90, 9);
    expect(fundamentalArguments(Date.UTC(1969, 6, 4, 6)).T).toBeCloseTo(270, 9); // before 1970 too
  });

  it('bring the node round in 18.61 years', () => {
    // Nodal cycle 18.61 years (REFERENCE-VALUES §5; common practice).
    const t0 = Date.UTC(2020, 0, 1);
    const a = fundamentalArguments(t0);
    const b = fundamentalArguments(t0 + 18.6 * YEAR_MS);
    expect(angleDiff(a.N, b.N)).toBeLessThan(0.4);
    const c = fundamentalArguments(t0 + 9.3 * YEAR_MS);
    expect(angleDiff(a.N, c.N)).toBeGreaterThan(179);
  });
});

describe('lunar orbit terms', () => {
  it('give the obliquity I of the Moon\'s orbit at N = 0° and 180°', () => {
    // Schureman (1958), REFERENCE-VALUES §3: I = 28.60° and 18.31° (ω = 23.452°, i = 5.145°), given to 0.01°.
    expect(lunarOrbit(0).I).toBeCloseTo(28.6, 2);
    expect(lunarOrbit(180).I).toBeCloseTo(18.31, 2);
  });

  it('keep I within ω ± i and the intersection angles zero at the extremes', () => {
    for (let N = 0; N < 360; N += 7.5) {
      const o = lunarOrbit(N);
      expect(o.I).toBeGreaterThanOrEqual(23.452 - 5.145 - 1e-9);
      expect(o.I).toBeLessThanOrEqual(23.452 + 5.145 + 1e-9);
    }
    expect(lunarOrbit(0).nu).toBeCloseTo(0, 12);
    expect(lunarOrbit(180).xi).toBeCloseTo(0, 12);
  });

  it('satisfy the sine rule of the node triangle, sin ν = sin i sin N / sin I', () => {
    // Schureman (1958), the formula for ν; our ν comes from Napier's analogies, so this is an independent check.
    const rad = Math.PI / 180;
    for (let N = -170; N <= 170; N += 10) {
      const o = lunarOrbit(N);
      const expected = Math.asin((Math.sin(5.145 * rad) * Math.sin(N * rad)) / Math.sin(o.I * rad)) / rad;
      expect(o.nu).toBeCloseTo(expected, 9);
    }
  });

  it('reach the published extremes of ν and ξ', () => {
    // Schureman (1958) tables of ν and ξ: largest values about 13.0° and 12.0° (from memory, ±0.1°).
    let nuMax = 0;
    let xiMax = 0;
    for (let N = 0; N < 360; N += 0.25) {
      nuMax = Math.max(nuMax, lunarOrbit(N).nu);
      xiMax = Math.max(xiMax, lunarOrbit(N).xi);
    }
    expect(nuMax).toBeGreaterThan(12.9);
    expect(nuMax).toBeLessThan(13.1);
    expect(xiMax).toBeGreaterThan(11.9);
    expect(xiMax).toBeLessThan(12.1);
  });
});
