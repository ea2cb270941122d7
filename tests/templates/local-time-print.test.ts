// Local time in print, in both renderers: days whose local midnight does not exist, and an extreme of
// the year in the last seconds before midnight.
// The tz database (through Intl/luxon) is the outside reference for every offset and change.
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { instant, wordsFor } from '../../templates/locale/index.js';
import { renderStationBook } from '../../templates/pdf/book.js';
import { nightSpans } from '../../templates/pdf/day-curve.js';
import { CURVE_WIDTH, dayCurve, heightScale } from '../../templates/site/curve.js';
import { renderSite } from '../../templates/site/render.js';
import { read, rowById, textOf } from './site-build.js';
import { testBankStation, testBankYear } from '../fixtures/test-bank.js';
import { firstOf, itemAt, type StationYear } from '../../engine/index.js';

const POPPLER = existsSync('/usr/bin/pdftotext');
if (!POPPLER) console.warn('poppler-utils not found in /usr/bin: the PDF text checks of local time are SKIPPED');

const en = wordsFor();

const station = testBankStation;
const model = testBankYear;

// Days whose local midnight was skipped in 2027 (tz database rules: the clocks jump from 00:00 to 01:00).
const SKIPPED = [
  { zone: 'America/Santiago', date: '2027-09-05', latitude: -36, longitude: -76 },
  { zone: 'America/Havana', date: '2027-03-14', latitude: 24.5, longitude: -86 },
  { zone: 'Asia/Beirut', date: '2027-03-28', latitude: 33.5, longitude: 32.5 },
];

const NEAR_MIDNIGHT = { zone: 'Europe/Lisbon', latitude: 40, longitude: -20 };

let tmp = '';
let site = '';
const skipped = new Map<string, StationYear>();
let nearMidnight: StationYear;

// The year's highest water moved to 23:59:40 local on 14 May: it prints 00:00 on 15 May (the model's rule).
function withHighestJustBeforeMidnight(m: StationYear): StationYear {
  const copy = structuredClone(m);
  const day = copy.days.find((d) => d.date === '2027-05-15')!;
  const t = instant(day.start) - 20_000;
  const highest = { ...copy.extremes.highest, time: new Date(t).toISOString().slice(0, 19) + 'Z', clock: '00:00',
    date: '2027-05-15', height: 9.99 };
  copy.extremes.highest = highest;
  return copy;
}

beforeAll(async () => {
  tmp = mkdtempSync(join(tmpdir(), 'tidewright-localtime-'));
  site = join(tmp, 'site');
  for (const s of SKIPPED) skipped.set(s.zone, model(station(`skip-${itemAt(s.zone.split('/'), 1, s.zone).toLowerCase()}`, s.zone, s.latitude, s.longitude), 2027));
  nearMidnight = withHighestJustBeforeMidnight(model(station('near-midnight', 'Europe/Lisbon', NEAR_MIDNIGHT.latitude, NEAR_MIDNIGHT.longitude), 2027));
  await renderSite([...skipped.values(), nearMidnight], site, { units: 'm', quiet: true });
}, 120_000);

afterAll(() => {
  if (tmp) rmSync(tmp, { recursive: true, force: true });
});

const pdfText = async (m: StationYear): Promise<string> => {
  const file = join(tmp, `${m.station.id}-${m.year}.pdf`);
  writeFileSync(file, await renderStationBook(m, { units: 'm', page: 'a5' }));
  return execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8', maxBuffer: 64 << 20 });
};

describe('a day whose local midnight was skipped', () => {
  it.each(SKIPPED)('$zone $date: the day starts at 01:00 local, 23 hours long', ({ zone, date }) => {
    const day = skipped.get(zone)!.days.find((d) => d.date === date)!;
    expect(day.hours).toBe(23);
    expect(en.clockAt(day.start, day.offsetStart)).toBe('01:00');
  });

  it.each(SKIPPED)('$zone $date: the website draws each event at its elapsed share of the day', ({ zone, date }) => {
    const m = skipped.get(zone)!;
    const day = m.days.find((d) => d.date === date)!;
    const curve = dayCurve(day, m.curveStepMinutes, heightScale(m));
    const start = instant(day.start);
    const length = instant(day.end) - start;
    expect(day.events.length).toBeGreaterThan(2);
    day.events.forEach((e, i) => {
      expect(itemAt(curve.dots, i, 'dots').x).toBeCloseTo(((instant(e.time) - start) / length) * CURVE_WIDTH, 0);
    });
    // 06:00, 12:00 and 18:00 on the clock are 5, 11 and 17 hours into a day that began at 01:00
    expect(curve.ticks).toEqual([5, 11, 17].map((h) => Math.round((h / 23) * CURVE_WIDTH * 10) / 10));
  });

  it.each(SKIPPED)('$zone $date: the book shades the night from the day\u2019s own start', ({ zone, date }) => {
    const day = skipped.get(zone)!.days.find((d) => d.date === date)!;
    const start = instant(day.start);
    const length = instant(day.end) - start;
    const spans = nightSpans(day);
    expect(day.sunrise).not.toBeNull();
    expect(firstOf(spans, 'spans')[1]).toBeCloseTo((instant(day.sunrise!) - start) / length, 6);
  });

  it.skipIf(!POPPLER)('the book prints every event of those days with its clock time', async () => {
    for (const { zone, date } of SKIPPED) {
      const m = skipped.get(zone)!;
      const text = await pdfText(m);
      const day = m.days.find((d) => d.date === date)!;
      for (const e of day.events) expect(text).toContain(e.clock);
      expect(text).toContain(en.offsetChange(day.offsetChange!));
    }
  }, 60_000);
});

describe('an extreme of the year in the last seconds before midnight', () => {
  it('the website prints it under the date of its printed minute', () => {
    const text = textOf(read(site, 'near-midnight/2027/index.html'));
    expect(text).toContain(`on ${en.date('2027-05-15', { weekday: true })} at 00:00`);
    expect(text).not.toContain(en.date('2027-05-14', { weekday: true }));
  });

  it.skipIf(!POPPLER)('the book prints it under the same date', async () => {
    const text = (await pdfText(nearMidnight)).replace(/\s+/g, ' ');
    expect(text).toContain(`${en.date('2027-05-15')} at 00:00`);
    expect(text).not.toContain(`${en.date('2027-05-14')} at 00:00`);
  }, 30_000);
});

