// UTC offsets in print, in both renderers: every zone whose offset is not a whole hour in the current
// rules, and offsets with seconds (local mean time).
// The tz database (through Intl/luxon) is the outside reference for every offset and change.
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { instant, wordsFor } from '../../templates/locale/index.js';
import { renderStationBook } from '../../templates/pdf/book.js';
import { renderSite } from '../../templates/site/render.js';
import { read, rowById, textOf } from './site-build.js';
import { testBankStation, testBankYear } from '../fixtures/test-bank.js';
import { firstOf, itemAt, type StationYear } from '../../engine/index.js';

const POPPLER = existsSync('/usr/bin/pdftotext');
if (!POPPLER) console.warn('poppler-utils not found in /usr/bin: the PDF text checks of local time are SKIPPED');

const en = wordsFor();

const station = testBankStation;
const model = testBankYear;

// Zones with an offset that is not a whole hour in the current rules, with a date on which it is in force.
const PART_HOUR = [
  { zone: 'Asia/Kathmandu', latitude: 15, longitude: 87, year: 2027, offsets: ['+05:45'] },
  { zone: 'Asia/Kolkata', latitude: 12, longitude: 70, year: 2027, offsets: ['+05:30'] },
  { zone: 'Australia/Adelaide', latitude: -40, longitude: 136, year: 2027, offsets: ['+10:30', '+09:30'] },
  { zone: 'Australia/Lord_Howe', latitude: -33, longitude: 161, year: 2028, offsets: ['+11:00', '+10:30'] },
  { zone: 'Pacific/Chatham', latitude: -45.5, longitude: 179, year: 2027, offsets: ['+13:45', '+12:45'] },
  { zone: 'America/St_Johns', latitude: 45, longitude: -48, year: 2027, offsets: ['-03:30', '-02:30'] },
  { zone: 'Australia/Eucla', latitude: -36, longitude: 129, year: 2027, offsets: ['+08:45'] },
  { zone: 'Asia/Kabul', latitude: 20, longitude: 65, year: 2027, offsets: ['+04:30'] },
  { zone: 'Asia/Yangon', latitude: 14, longitude: 95, year: 2027, offsets: ['+06:30'] },
  { zone: 'Pacific/Marquesas', latitude: -11, longitude: -142, year: 2027, offsets: ['-09:30'] },
];

const KATHMANDU_LMT = { zone: 'Asia/Kathmandu', latitude: 15, longitude: 87 };

let tmp = '';
let site = '';
const partHour = new Map<string, StationYear>();

beforeAll(async () => {
  tmp = mkdtempSync(join(tmpdir(), 'tidewright-offsets-'));
  site = join(tmp, 'site');
  for (const p of PART_HOUR) {
    partHour.set(p.zone, model(station(`part-${itemAt(p.zone.split('/'), 1, p.zone).toLowerCase().replace('_', '-')}`, p.zone, p.latitude, p.longitude), p.year));
  }
  await renderSite([...partHour.values()], site, { units: 'm', quiet: true });
}, 120_000);

afterAll(() => {
  if (tmp) rmSync(tmp, { recursive: true, force: true });
});

const pdfText = async (m: StationYear): Promise<string> => {
  const file = join(tmp, `${m.station.id}-${m.year}.pdf`);
  writeFileSync(file, await renderStationBook(m, { units: 'm', page: 'a5' }));
  return execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8', maxBuffer: 64 << 20 });
};

describe('UTC offsets that are not whole hours', () => {
  it.each(PART_HOUR)('$zone: the model keeps the minutes', ({ zone, offsets }) => {
    const m = partHour.get(zone)!;
    const seen = new Set(m.days.flatMap((d) => [d.offsetStart, d.offsetEnd]));
    for (const o of offsets) expect(seen.has(o)).toBe(true);
  });

  it.each(PART_HOUR)('$zone: the website prints every offset in full, on month pages and clock-change days', ({ zone, offsets }) => {
    const m = partHour.get(zone)!;
    const pages = m.months.map((mo) => textOf(read(site, `${m.station.id}/${m.year}/${mo.slug}/index.html`))).join(' ');
    for (const o of offsets) expect(pages).toContain(en.offset(o));
    for (const d of m.days.filter((x) => x.offsetChange)) {
      const row = textOf(rowById(read(site, `${m.station.id}/${m.year}/${String(d.month).padStart(2, '0')}/index.html`), `day-${d.dayOfMonth}`));
      for (const e of d.events) expect(row).toContain(`${e.clock} ${en.heightNumber(e.height)} ${en.offset(e.offset)}`);
    }
  });

  it.skipIf(!POPPLER)('the book prints every offset in full, never cut to the hour', async () => {
    for (const { zone, offsets } of PART_HOUR) {
      const m = partHour.get(zone)!;
      const text = await pdfText(m);
      for (const o of offsets) expect(text, zone).toContain(en.offset(o));
      // on a clock-change day every time carries its own offset: none may be cut to "+10" or "UTC+10"
      expect(text, zone).not.toMatch(/UTC[+\u2212]\d\d(?![:\d])/);
      for (const d of m.days.filter((x) => x.offsetChange)) {
        for (const e of d.events) expect(text, zone).toContain(en.offset(e.offset));
      }
    }
  }, 120_000);

  it('Lord Howe Island on 2 April 2028: the half-hour change back is worded and printed with minutes', () => {
    const day = partHour.get('Australia/Lord_Howe')!.days.find((d) => d.date === '2028-04-02')!;
    expect(day.offsetChange).toMatchObject({ from: '+11:00', to: '+10:30' });
    expect(en.offsetChange(day.offsetChange!)).toMatch(/^Clocks go back 30 minutes at 15:00 UTC \(02:00 → 01:30 local\)$/);
  });
});

describe('offsets with seconds (local mean time before standard time)', () => {
  it('Asia/Kathmandu 1919 is UTC+05:41:16 and its 1920 change is 11 minutes 16 seconds, never a fraction', () => {
    const m1919 = model(station('lmt-1919', KATHMANDU_LMT.zone, KATHMANDU_LMT.latitude, KATHMANDU_LMT.longitude), 1919);
    expect(firstOf(m1919.days, 'days').offsetStart).toBe('+05:41:16');
    expect(en.offset(firstOf(m1919.days, 'days').offsetStart)).toBe('UTC+05:41:16');
    // the change falls on the last day of 1919: LMT midnight is 11 min 16 s before the new one
    const change = firstOf(m1919.offsetChanges, 'offsetChanges');
    expect(m1919.days.find((d) => d.offsetChange)!.date).toBe('1919-12-31');
    expect(change).toMatchObject({ from: '+05:41:16', to: '+05:30' });
    expect(en.offsetChange(change)).toMatch(/^Clocks go back 11 minutes 16 seconds at /);
    // an event's local time agrees with its own instant to the second
    for (const e of m1919.events.slice(0, 50)) {
      const local = instant(e.local.replace(/([+-]\d\d:\d\d):(\d\d)$/, '$1')) - Number(e.local.slice(-2)) * 1000 * (e.local.at(-9) === '-' ? -1 : 1);
      expect(local).toBe(instant(e.time));
    }
  }, 60_000);
});
