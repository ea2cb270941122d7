import { describe, expect, it } from 'vitest';
import { fundamentalArguments, type FundamentalArguments } from '../../engine/astro.js';
import { findConstituent } from '../../engine/constituents.js';
import { equilibriumArguments, nodeFactors, nodeFactorsFromArguments } from '../../engine/nodal.js';
import { entryOf, firstOf, itemAt } from '../../engine/index.js';

const at = (N: number, p = 0): FundamentalArguments => ({ T: 0, s: 0, h: 0, p, N, pp: 0 });

describe('node factors', () => {
  it('match Schureman at N = 0° and 180°', () => {
    // Schureman (1958) formulas 73, 74, 75, 78, 227, 235 (REFERENCE-VALUES §3), tolerance 0.002.
    const names = ['M2', 'O1', 'K1', 'K2', 'Mf', 'Mm'];
    const table: Record<number, number[]> = {
      0: [0.9632, 1.1828, 1.1128, 1.3162, 1.4518, 0.8715],
      180: [1.0378, 0.8057, 0.8817, 0.7462, 0.6252, 1.1313],
    };
    for (const N of [0, 180]) {
      const { f, u } = nodeFactorsFromArguments(names, at(N));
      names.forEach((name, k) => {
        expect(Math.abs(itemAt(f, k, 'f') - itemAt(entryOf(table, N, 'table'), k, 'table row')), `${name} at N = ${N}`).toBeLessThan(0.002);
        expect(Math.abs(itemAt(u, k, 'u')), `u of ${name} at N = ${N}`).toBeLessThan(1e-9); // ν = ξ = 0 there
      });
    }
  });

  it('average about 1 over a nodal cycle for the main constituents', () => {
    // Schureman (1958): f is the term divided by its mean value (from memory); for M2, O1, K1 and Mm the
    // cycle average comes out within 1 % of 1 (the small-term factors such as OO1 or Mf stray further).
    const names = ['M2', 'O1', 'K1', 'Mm'];
    const sums = new Float64Array(names.length);
    const steps = 3600;
    for (let k = 0; k < steps; k++) {
      const { f } = nodeFactorsFromArguments(names, at((360 * k) / steps));
      f.forEach((v, i) => (sums[i] = itemAt(sums, i, 'sums') + v / steps));
    }
    names.forEach((name, i) => expect(Math.abs(itemAt(sums, i, 'sums') - 1), name).toBeLessThan(0.01));
  });

  it('give compounds the product of their parents\' f and the sum of their u', () => {
    const t = Date.UTC(2029, 4, 17, 6);
    const { f, u } = nodeFactors(['M2', 'S2', 'K2', 'N2', 'MS4', 'M4', 'MK3', 'K1', 'MSN2', 'MSf'], t);
    const [fM2, , fK2, , fMS4, fM4, fMK3, fK1, fMSN2, fMSf] = f;
    const [uM2, , uK2, , uMS4, uM4, uMK3, uK1, uMSN2, uMSf] = u;
    expect(fMS4).toBeCloseTo(fM2!, 12);
    expect(uMS4).toBeCloseTo(uM2!, 12);
    expect(fM4).toBeCloseTo(fM2! ** 2, 12);
    expect(uM4).toBeCloseTo(2 * uM2!, 12);
    expect(fMK3).toBeCloseTo(fM2! * fK1!, 12);
    expect(uMK3).toBeCloseTo(uM2! + uK1!, 12);
    expect(fMSN2).toBeCloseTo(fM2! * fM2!, 12); // M2·S2/N2: f multiplies over all parents
    expect(uMSN2).toBeCloseTo(0, 12);
    expect(fMSf).toBeCloseTo(fM2!, 12);
    expect(uMSf).toBeCloseTo(-uM2!, 12);
    expect(fK2).toBeGreaterThan(0.7);
    expect(uK2).not.toBe(0);
  });

  it('give L2 and M1 the special formulas that depend on the perigee', () => {
    // Schureman (1958) formulas 213–215 (L2) and 197, 206 (M1): at N = 0 (ξ = ν = 0, I = 28.597°) and
    // P = p = 0, 1/Ra = 1 − 6 tan²½I and 1/Qa = ½ + 1.5 cos I / cos²½I, both with no extra angle.
    const rad = Math.PI / 180;
    const I = 28.597 * rad;
    const { f, u } = nodeFactorsFromArguments(['L2', 'M1', 'M2', 'O1'], at(0, 0));
    expect(firstOf(f, 'f') / itemAt(f, 2, 'f')).toBeCloseTo(1 - 6 * Math.tan(I / 2) ** 2, 3);
    expect(itemAt(f, 1, 'f') / itemAt(f, 3, 'f')).toBeCloseTo(0.5 + (1.5 * Math.cos(I)) / Math.cos(I / 2) ** 2, 3);
    expect(u[0]).toBeCloseTo(0, 9);
    expect(u[1]).toBeCloseTo(0, 9);
    // with the perigee at 90°, cos 2P = −1: 1/Ra = 1 + 6 tan²½I, 1/Qa = |1.5 cos I / cos²½I − ½|
    const q = nodeFactorsFromArguments(['L2', 'M1', 'M2', 'O1'], at(0, 90));
    expect(firstOf(q.f, 'f') / itemAt(q.f, 2, 'f')).toBeCloseTo(1 + 6 * Math.tan(I / 2) ** 2, 3);
    expect(itemAt(q.f, 1, 'f') / itemAt(q.f, 3, 'f')).toBeCloseTo((1.5 * Math.cos(I)) / Math.cos(I / 2) ** 2 - 0.5, 3);
  });
});

describe('equilibrium arguments', () => {
  it('give S2 = 2T, K1 = T + h − 90°, O1 = T − 2s + h + 90°, M2 = 2T − 2s + 2h', () => {
    // Schureman (1958) Table 2 (REFERENCE-VALUES §4).
    const t = Date.UTC(2027, 7, 9, 3, 17);
    const a = fundamentalArguments(t);
    const V = equilibriumArguments(['S2', 'K1', 'O1', 'M2', 'Mf'], t);
    const norm = (x: number) => ((x % 360) + 360) % 360;
    expect(V[0]).toBeCloseTo(norm(2 * a.T), 9);
    expect(V[1]).toBeCloseTo(norm(a.T + a.h - 90), 9);
    expect(V[2]).toBeCloseTo(norm(a.T - 2 * a.s + a.h + 90), 9);
    expect(V[3]).toBeCloseTo(norm(2 * a.T - 2 * a.s + 2 * a.h), 9);
    expect(V[4]).toBeCloseTo(norm(2 * a.s), 9);
  });

  it('advance at each constituent\'s speed', () => {
    const names = ['M2', 'K1', 'M4', 'Mf', '2MS6', 'MSf'];
    const t0 = Date.UTC(2030, 0, 1);
    const hours = 5.5;
    const V0 = equilibriumArguments(names, t0);
    const V1 = equilibriumArguments(names, t0 + hours * 3_600_000);
    names.forEach((name, k) => {
      const expected = (findConstituent(name)!.speed * hours) % 360;
      const got = (((itemAt(V1, k, 'V1') - itemAt(V0, k, 'V0')) % 360) + 360) % 360;
      expect(got, name).toBeCloseTo(expected, 6);
    });
  });

  it('refuse an unknown constituent', () => {
    expect(() => equilibriumArguments(['M2', 'Z7'], 0)).toThrow(/unknown constituent "Z7"/);
    expect(() => nodeFactors(['Z7'], 0)).toThrow(/unknown constituent/);
  });
});
