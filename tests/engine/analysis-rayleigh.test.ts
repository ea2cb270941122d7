import { describe, expect, it } from 'vitest';
import { selectConstituents, separationHours, ANALYSIS_CANDIDATES } from '../../engine/analysis/rayleigh.js';
import { CONSTITUENT_NAMES } from '../../engine/constituents.js';

const DAY = 24;
const select = (days: number, intervalHours = 1, rayleigh = 1) =>
  selectConstituents({ spanHours: days * DAY, intervalHours, rayleigh });
const excludedBy = (days: number, name: string) => select(days).excluded.find((e) => e.name === name);

// Separations from REFERENCE-VALUES §5 (Godin 1972; Pugh 1987): |σ₁ − σ₂|·T ≥ 360°:
// M2/S2 14.77 d, M2/N2 27.55 d, K1/P1 and S2/K2 182.6 d.
describe('Rayleigh separation times (REFERENCE-VALUES §5)', () => {
  it.each([
    ['M2', 'S2', 14.77],
    ['M2', 'N2', 27.55],
    ['K1', 'P1', 182.6],
    ['S2', 'K2', 182.6],
  ])('%s/%s needs %f days', (a, b, days) => {
    expect(separationHours(a, b) / DAY).toBeCloseTo(days, days > 100 ? 1 : 2);
  });
});

describe('selectConstituents', () => {
  it('15 days: M2 and S2 apart, N2 not (needs 27.55 d), nor K2 or P1', () => {
    const s = select(15);
    expect(s.admitted).toEqual(expect.arrayContaining(['M2', 'S2', 'K1', 'O1']));
    expect(s.admitted).not.toContain('N2');
    expect(excludedBy(15, 'N2')).toMatchObject({ reason: 'rayleigh', conflictsWith: 'M2' });
    expect(excludedBy(15, 'N2')!.daysNeeded).toBeCloseTo(27.55, 2);
    expect(excludedBy(15, 'K2')).toMatchObject({ conflictsWith: 'S2' });
    expect(excludedBy(15, 'P1')).toMatchObject({ conflictsWith: 'K1' });
  });

  it('just under 14.77 days S2 is not separable from M2; just over it is', () => {
    expect(select(14.7).admitted).not.toContain('S2');
    expect(excludedBy(14.7, 'S2')).toMatchObject({ conflictsWith: 'M2' });
    expect(select(14.8).admitted).toContain('S2');
  });

  it('30 days: N2 admitted, K2 and P1 not (182.6 d)', () => {
    const s = select(30);
    expect(s.admitted).toEqual(expect.arrayContaining(['M2', 'S2', 'N2', 'K1', 'O1', 'Q1', 'M4', 'MS4']));
    expect(s.admitted).not.toContain('K2');
    expect(s.admitted).not.toContain('P1');
    expect(excludedBy(30, 'K2')!.daysNeeded).toBeCloseTo(182.6, 1);
  });

  it('183 days: K2 and P1 admitted (182.6 d), Sa not (needs a year)', () => {
    const s = select(183);
    expect(s.admitted).toEqual(expect.arrayContaining(['K2', 'P1', 'Ssa']));
    expect(s.admitted).not.toContain('Sa');
    expect(select(182).admitted).not.toContain('K2');
  });

  it('a year (365.25 d): Sa separated from the mean level, the large and most small lines admitted', () => {
    const s = select(365.25);
    expect(s.admitted).toEqual(expect.arrayContaining(['Sa', 'Ssa', 'K2', 'P1', 'NU2', 'MU2', 'L2', 'J1', 'OO1']));
    // T2 is S2 less one cycle per anomalistic year (speed of h − p′): 365.26 d, a few minutes too long
    expect(s.excluded.find((e) => e.name === 'T2')!.daysNeeded).toBeCloseTo(365.26, 2);
    expect(select(366).admitted).toContain('T2');
    expect(select(365).admitted).not.toContain('Sa');
    expect(select(365).excluded.find((e) => e.name === 'Sa')).toMatchObject({ conflictsWith: 'Z0' });
  });

  it('a larger Rayleigh factor admits fewer constituents', () => {
    expect(select(30, 1, 2).admitted).not.toContain('N2'); // 30 d < 2 × 27.55 d
    expect(select(60, 1, 2).admitted).toContain('N2');
  });

  it('leaves out constituents at or above the Nyquist speed 180°/Δt', () => {
    const s = select(30, 3); // 3-hourly: Nyquist 60°/h
    expect(s.admitted).toEqual(expect.arrayContaining(['M4', 'MS4']));
    expect(s.admitted).not.toContain('M6');
    expect(s.excluded.find((e) => e.name === 'M6')).toEqual({ name: 'M6', reason: 'nyquist' });
  });

  it('considers every constituent the engine knows, under its canonical name', () => {
    expect([...ANALYSIS_CANDIDATES].sort()).toEqual([...CONSTITUENT_NAMES].sort());
    expect(selectConstituents({ spanHours: 720, intervalHours: 1, candidates: ['m2', 'SIG1', 'M2'] }).admitted)
      .toEqual(['M2', 'SIGMA1']);
  });
});
