import { describe, expect, it } from 'vitest';
import { CONSTITUENTS, CONSTITUENT_NAMES, constituentSpeed, findConstituent } from '../../engine/constituents.js';

// Schureman (1958) Table 2, degrees per mean solar hour (REFERENCE-VALUES §1, from memory), tolerance 1e-6.
const SCHUREMAN_SPEEDS: Record<string, number> = {
  M2: 28.9841042, S2: 30.0, N2: 28.4397295, K2: 30.0821373, K1: 15.0410686, O1: 13.9430356,
  P1: 14.9589314, Q1: 13.3986609, '2N2': 27.8953548, MU2: 27.9682084, NU2: 28.5125831, L2: 29.5284789,
  T2: 29.9589333, J1: 15.5854433, OO1: 16.1391017, M4: 57.9682084, MS4: 58.9841042, MN4: 57.4238337,
  M6: 86.9523127, M8: 115.9364166, Mf: 1.0980331, Mm: 0.5443747, MSf: 1.0158958, Ssa: 0.0821373,
  Sa: 0.0410686, S4: 60.0, S6: 90.0,
};

describe('constituent table', () => {
  it('computes the speeds of Schureman Table 2 from Doodson numbers', () => {
    for (const [name, speed] of Object.entries(SCHUREMAN_SPEEDS)) {
      expect(Math.abs(constituentSpeed(name) - speed), name).toBeLessThan(1e-6);
    }
  });

  it('holds at least 60 constituents across every species', () => {
    expect(CONSTITUENTS.length).toBeGreaterThanOrEqual(60);
    const species = new Set(CONSTITUENTS.map((c) => c.species));
    for (const s of ['long-period', 'diurnal', 'semidiurnal', 'terdiurnal', 'quarter-diurnal', 'sixth-diurnal', 'eighth-diurnal']) {
      expect(species.has(s as never), s).toBe(true);
    }
    expect(new Set(CONSTITUENT_NAMES).size).toBe(CONSTITUENT_NAMES.length);
    for (const name of ['Sa', 'Ssa', 'Mm', 'MSf', 'Mf', 'Q1', 'O1', 'M1', 'P1', 'S1', 'K1', 'J1', 'OO1', '2Q1', 'SIGMA1',
      'RHO1', 'CHI1', 'PI1', 'PHI1', 'THETA1', 'SO1', '2N2', 'MU2', 'N2', 'NU2', 'M2', 'LAMBDA2', 'L2', 'T2', 'S2', 'R2',
      'K2', 'EPSILON2', 'ETA2', '2SM2', 'MSN2', 'M3', 'MK3', 'SO3', 'SK3', 'MO3', 'M4', 'MS4', 'MN4', 'S4', 'MK4', 'SN4',
      'M6', '2MS6', '2MN6', 'MSN6', 'S6', '2SM6', 'M8', '3MS8']) {
      expect(findConstituent(name), name).toBeDefined();
    }
  });

  it('puts each constituent in the species its speed says (cycles per lunar day ≈ speed / 14.49)', () => {
    const perSpecies = { 'long-period': 0, diurnal: 1, semidiurnal: 2, terdiurnal: 3, 'quarter-diurnal': 4, 'sixth-diurnal': 6, 'eighth-diurnal': 8 };
    for (const c of CONSTITUENTS) {
      expect(Math.round(c.speed / 14.4920521), c.name).toBe(perSpecies[c.species]);
    }
  });

  it('gives compounds the sum of their parents\' speeds, arguments and phases', () => {
    for (const c of CONSTITUENTS) {
      if (!c.parents) continue;
      const sum = c.parents.reduce((acc, [p, n]) => acc + n * constituentSpeed(p), 0);
      expect(c.speed, c.name).toBeCloseTo(sum, 10);
    }
    const ms4 = findConstituent('MS4')!;
    expect(ms4.multipliers).toEqual([4, -2, 2, 0, 0, 0]); // Schureman: MS4 = 4T − 2s + 2h
    const mk3 = findConstituent('MK3')!;
    expect(mk3.phase).toBe(-90); // Schureman: MK3 = 3T − 2s + 3h − 90°
  });

  it('uses Schureman\'s arguments for the main constituents', () => {
    // Schureman (1958) Table 2 (REFERENCE-VALUES §4 quotes K1 = T + h − 90°, O1 = T − 2s + h + 90°, Mf = 2s).
    const v = (name: string) => [...findConstituent(name)!.multipliers, findConstituent(name)!.phase];
    expect(v('M2')).toEqual([2, -2, 2, 0, 0, 0, 0]);
    expect(v('S2')).toEqual([2, 0, 0, 0, 0, 0, 0]);
    expect(v('K1')).toEqual([1, 0, 1, 0, 0, 0, -90]);
    expect(v('O1')).toEqual([1, -2, 1, 0, 0, 0, 90]);
    expect(v('P1')).toEqual([1, 0, -1, 0, 0, 0, 90]);
    expect(v('Q1')).toEqual([1, -3, 1, 1, 0, 0, 90]);
    expect(v('N2')).toEqual([2, -3, 2, 1, 0, 0, 0]);
    expect(v('L2')).toEqual([2, -1, 2, -1, 0, 0, 180]);
    expect(v('Mf')).toEqual([0, 2, 0, 0, 0, 0, 0]);
    expect(v('Mm')).toEqual([0, 1, 0, -1, 0, 0, 0]);
  });

  it('finds names case-insensitively and by alias, and refuses unknown names', () => {
    expect(findConstituent('m2')?.name).toBe('M2');
    expect(findConstituent('MSF')?.name).toBe('MSf');
    expect(findConstituent('μ2')?.name).toBe('MU2');
    expect(findConstituent('LAM2')?.name).toBe('LAMBDA2');
    expect(findConstituent('X9')).toBeUndefined();
    expect(() => constituentSpeed('X9')).toThrow(/unknown constituent/);
  });

  it('gives the spring–neap period of 14.765 days', () => {
    // REFERENCE-VALUES §5: 360/(30 − 28.9841042) h = 14.765 d.
    const days = 360 / (constituentSpeed('S2') - constituentSpeed('M2')) / 24;
    expect(days).toBeCloseTo(14.765, 3);
  });
});
