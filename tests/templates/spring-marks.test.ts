// Springs and neaps: the marks follow the station's own largest predicted range of each fortnight, which
// the Moon's distance moves away from the age of the tide. Site and book print both numbers, and both
// numbers are checked here against the model and against sources outside it.
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { MoonPhase, SearchMoonQuarter, type MoonQuarter } from 'astronomy-engine';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadStationSet } from '../../engine/index.js';
import type { StationYear } from '../../engine/index.js';
import { springKeyText } from '../../templates/pdf/caution.js';
import { wordsFor } from '../../templates/locale/index.js';
import { renderSite } from '../../templates/site/render.js';
import { demoModels, textOf } from './site-build.js';

let model: StationYear;
let tmp: string;

beforeAll(async () => {
  [model] = demoModels(['brinewold-head']);
  tmp = mkdtempSync(join(tmpdir(), 'tidewright-springs-'));
  await renderSite([model], join(tmp, 'site'), { units: 'm', quiet: true });
});
afterAll(() => { if (tmp) rmSync(tmp, { recursive: true, force: true }); });

/** New and full moons of the year and its edges, from astronomy-engine (an ephemeris outside the engine). */
function syzygies(year: number): number[] {
  const out: number[] = [];
  let q: MoonQuarter = SearchMoonQuarter(new Date(Date.UTC(year - 1, 11, 1)));
  while (q.time.date.getTime() < Date.UTC(year + 1, 1, 1)) {
    if (q.quarter === 0 || q.quarter === 2) out.push(q.time.date.getTime());
    q = SearchMoonQuarter(new Date(q.time.date.getTime() + 86_400_000));
  }
  return out;
}

describe('spring marks against the model', () => {
  it('age of the tide from the constants: (g_S2 − g_M2)/(30 − 28.9841042) h (Pugh 1987; Schureman speeds)', () => {
    const station = loadStationSet(join(import.meta.dirname, '..', '..', 'stations-demo')).byId.get('brinewold-head')!;
    if (station.kind !== 'reference') throw new Error('expected a reference port');
    const { M2, S2 } = station.constituents;
    // 251.0° − 205.0° = 46°, / 1.0158958 °/h = 45.3 h
    expect(model.ageOfTideHours).toBeCloseTo((S2!.phase - M2!.phase) / (30 - 28.9841042), 1);
  });

  it('mean lag of the spring marks: the mean over the marks, each after its new or full moon (astronomy-engine)', () => {
    const springs = model.springNeap.filter((s) => s.kind === 'spring');
    expect(springs.length).toBeGreaterThanOrEqual(24);
    const mean = springs.reduce((a, s) => a + s.lagHours, 0) / springs.length;
    expect(model.springLagHours).toBeCloseTo(mean, 1);
    // Independently: from each mark's local noon back to the latest new or full moon before it.
    const moons = syzygies(model.year);
    const lags = springs.map((s) => {
      const noon = Date.parse(`${s.date}T12:00:00Z`);
      const before = moons.filter((t) => t <= noon + 12 * 3_600_000).pop()!;
      const phase = MoonPhase(new Date(before)) % 180;
      expect(Math.min(phase, 180 - phase)).toBeLessThan(1); // a syzygy indeed
      return (noon - before) / 3_600_000;
    });
    const independent = lags.reduce((a, b) => a + b, 0) / lags.length;
    expect(Math.abs(independent - model.springLagHours!)).toBeLessThan(12); // marks are days: half a day
    // The marks come later than the age of the tide here (the largest range waits for perigee).
    expect(model.springLagHours!).toBeGreaterThan(model.ageOfTideHours);
  });
});

describe('both numbers printed', () => {
  const w = wordsFor();

  it('in the book: the key of a station book, and a pointer to the facts pages in a combined book', () => {
    const text = springKeyText({ model, words: w }, false);
    expect(text).toContain(`this year on average ${w.hours(model.springLagHours!)} after new or full moon`);
    expect(text).toContain(`The age of the tide from the constants is ${w.hours(model.ageOfTideHours)}`);
    expect(springKeyText({ model, words: w }, true)).toContain('Each facts page gives');
  });

  it('on the site: the station page and each month page’s key', () => {
    const site = join(tmp, 'site');
    const year = textOf(readFileSync(join(site, 'brinewold-head/2027/index.html'), 'utf8'));
    expect(year).toContain(`Age of the tide ${w.hours(model.ageOfTideHours)}, from the constants (S2 and M2)`);
    expect(year).toContain(`Spring marks on average ${w.hours(model.springLagHours!)} after new or full moon this year`);
    const month = textOf(readFileSync(join(site, 'brinewold-head/2027/05/index.html'), 'utf8'));
    expect(month).toContain(`This year the spring marks come on average ${w.hours(model.springLagHours!)} after new or full moon; `
      + `the age of the tide from the constants is ${w.hours(model.ageOfTideHours)}`);
    // the numbers are the model's: hours as a reader reads them, here e.g. "2 days 2 h"
    expect(w.hours(model.springLagHours!)).toMatch(/^\d+ days? \d+ h$/);
  });

  it('on the site’s datums page: no fixed lag that the station pages contradict, a pointer to both numbers instead', () => {
    const page = textOf(readFileSync(join(tmp, 'site', 'datums/index.html'), 'utf8'));
    expect(page).not.toMatch(/a day or two/);
    expect(page).toContain('each station’s page gives both numbers, the age from its constants and the mean lag of its marks this year');
    // and the lag the pages print here is indeed more than "a day or two" after the syzygy
    expect(model.springLagHours!).toBeGreaterThan(48);
  });
});
