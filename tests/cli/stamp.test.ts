// The date every output carries: the edition of tidewright.yaml, or SOURCE_DATE_EPOCH (never later
// than the edition), else 1 January of the year; never the clock. Checked from the setting through the
// plan to the PDF's creation date, the iCalendar DTSTAMP and the site's edition line.
import { execFileSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { buildStationYear, entryOf } from '../../engine/index.js';
import { StationFileError, UsageError } from '../../engine/index.js';
import { loadStationSet } from '../../engine/index.js';
import { makePlan } from '../../cli/build/plan.js';
import { outputStamp } from '../../cli/build/stamp.js';
import { STARTER_FILES } from '../../cli/init-files.js';
import { eventsICalendar } from '../../templates/exports/icalendar.js';
import { wordsFor } from '../../templates/locale/index.js';
import { renderStationBook } from '../../templates/pdf/book.js';
import { buildSiteData } from '../../templates/site/views.js';

const dir = mkdtempSync(join(tmpdir(), 'tidewright-stamp-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
for (const [name, text] of Object.entries(STARTER_FILES)) {
  mkdirSync(dirname(join(dir, name)), { recursive: true });
  writeFileSync(join(dir, name), text);
}
const EDITION = Date.UTC(2026, 10, 15);

describe('outputStamp', () => {
  it('is the edition, or SOURCE_DATE_EPOCH but never after the edition, or 1 January of the year', () => {
    expect(outputStamp(2027, '2026-11-15', undefined)).toBe(EDITION);
    expect(outputStamp(2027, undefined, '1790000000')).toBe(1_790_000_000_000);
    expect(outputStamp(2027, '2026-11-15', '1760000000')).toBe(1_760_000_000_000); // earlier than the edition
    expect(outputStamp(2027, '2026-11-15', '1800000000')).toBe(EDITION); // later: held at the edition
    expect(outputStamp(2027, undefined, undefined)).toBe(Date.UTC(2027, 0, 1));
    expect(outputStamp(2027, undefined, '')).toBe(Date.UTC(2027, 0, 1));
    expect(() => outputStamp(2027, undefined, 'yesterday')).toThrow(UsageError);
    expect(() => outputStamp(2027, undefined, 'yesterday')).toThrow(/^SOURCE_DATE_EPOCH: "yesterday" is not a whole number of seconds/);
  });

  it('comes from tidewright.yaml\'s edition: and the environment into the build plan', () => {
    writeFileSync(join(dir, 'tidewright.yaml'), 'edition: 2026-11-15\n');
    const args = { stations: dir, quiet: true } as Parameters<typeof makePlan>[0];
    expect(makePlan(args, dir, new Date(), {}).render).toMatchObject({ edition: '2026-11-15', stamp: EDITION });
    expect(makePlan(args, dir, new Date(), { SOURCE_DATE_EPOCH: '1760000000' }).render.stamp).toBe(1_760_000_000_000);
    writeFileSync(join(dir, 'tidewright.yaml'), 'edition: 2026-11-31\n');
    expect(() => makePlan(args, dir, new Date(), {})).toThrow(StationFileError);
    expect(() => makePlan(args, dir, new Date(), {}))
      .toThrow(/tidewright\.yaml: edition: "2026-11-31" is not a date written YYYY-MM-DD; write the date of this edition as YYYY-MM-DD/);
    writeFileSync(join(dir, 'tidewright.yaml'), entryOf(STARTER_FILES, 'tidewright.yaml', 'STARTER_FILES'));
  });
});

describe('every output carries the stamp', () => {
  const set = loadStationSet(dir);
  const model = buildStationYear(set.byId.get('storm-petrel-bank')!, set, 2027);

  it('as the PDF book\'s creation and modification date', async () => {
    const file = join(dir, 'book.pdf');
    writeFileSync(file, await renderStationBook(model, { units: 'm', page: 'a5', stamp: EDITION }));
    let info: string;
    try {
      info = execFileSync('pdfinfo', ['-isodates', file], { encoding: 'utf8' });
    } catch {
      console.warn('pdfinfo (poppler-utils) is not installed: the PDF date check is skipped');
      return;
    }
    expect(info).toMatch(/^CreationDate: +2026-11-15T00:00:00Z$/m);
    expect(info).toMatch(/^ModDate: +2026-11-15T00:00:00Z$/m);
  }, 30_000);

  it('as every DTSTAMP of the calendar', () => {
    const ics = eventsICalendar(model, wordsFor(), EDITION);
    const stamps = new Set(ics.match(/^DTSTAMP:.*$/gm));
    expect([...stamps]).toEqual(['DTSTAMP:20261115T000000Z']);
    expect(new Set(eventsICalendar(model).match(/^DTSTAMP:.*$/gm))).toEqual(new Set(['DTSTAMP:20270101T000000Z']));
  });

  it('as the site\'s edition line', () => {
    expect(buildSiteData([model], { units: 'm', stamp: EDITION }).computed).toBe('2026-11-15');
    expect(buildSiteData([model], { units: 'm' }).computed).toBe('2027-01-01');
  });
});
