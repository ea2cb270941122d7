// tidewright.yaml: what a publisher sets once, kept beside the station files. Optional; every key optional.
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { isMap, parseDocument } from 'yaml';
import * as z from 'zod';
import { StationFileError, nearestName, readTextFile } from '../../engine/index.js';
import { LANGUAGES, languageOf } from '../../templates/locale/catalogue.js';
import { ACCENT_PATTERN, contrastRatio, MIN_CONTRAST } from './accent.js';
import { COMBINED_MODES, MAX_VOLUME_PAGES, MIN_VOLUME_PAGES } from './volume-options.js';
import { checkLogo, checkPicture } from './logo.js';
import { readPages } from './pages.js';
import type { PublisherPage } from '../../templates/pages/types.js';
import {
  FIRST_YEAR, IMPOSITIONS, LAST_YEAR, PAGE_SIZES, UNITS, type Imposition, type PageSize, type Units,
} from './options.js';
import { MAX_BUILD_YEARS, yearSpan } from '../years.js';

export const PROJECT_FILE_NAME = 'tidewright.yaml';

/** The settings as read (the schema below is their one definition). */
export type ProjectSettings = z.output<typeof projectSchema>;

const FIELD_FIX: Readonly<Record<keyof ProjectSettings, string>> = {
  title: 'write the almanac title as text, e.g. title: Brinewold Bay Tide Almanac',
  publisher: 'write who publishes it as text, e.g. publisher: Brinewold Bay Harbour Office',
  year: `write a whole year from ${FIRST_YEAR} to ${LAST_YEAR}, e.g. year: 2027, a range of at most ${MAX_BUILD_YEARS} years, e.g. year: 2027-2029, or leave the key out for next year`,
  page: `write one of ${PAGE_SIZES.join(', ')}, e.g. page: a5`,
  units: 'write units: m (metres) or units: ft (feet)',
  locale: `write one of ${LANGUAGES.join(', ')} (a regional tag such as fr-CA or pt-BR also works)`,
  imposition: 'write imposition: none, or imposition: saddle-stitch for fold-and-staple booklets',
  caution: 'write the caution as plain text, e.g. caution: Predictions only; check the official tables. Every output carries one, so it cannot be empty',
  hourly: 'write hourly: true for a page of heights on every hour after each month in the books, or leave it out',
  edition: 'write the date of this edition as YYYY-MM-DD, e.g. edition: 2026-11-15',
  contact: 'write who to call as text, one to four lines, e.g. contact: "Harbour Office, Quay Road · office@example.invalid"',
  accent: 'write a darker colour as "#rrggbb" in quotes, e.g. accent: "#0b5d7a"',
  logo: 'write the path of an SVG, PNG or JPEG file, relative to tidewright.yaml, e.g. logo: brand/logo.svg',
  cover_image: 'write the path of a photo or drawing (JPEG, PNG or SVG), relative to tidewright.yaml, e.g. cover_image: brand/cover.jpg',
  pages: 'write the folder of your Markdown pages, relative to tidewright.yaml, e.g. pages: pages/',
  press: 'write press: true for print-shop books (bleed, crop marks, page boxes), or press: false',
  pocket: 'write pocket: true for a folded one-sheet pocket table beside each book, or pocket: false',
  combined: `write combined: full (every station's months), compact (reference ports in full, secondary ports as differences and datums) or none, or leave it out`,
  volume_pages: `write the most pages a combined volume may have, a whole number from ${MIN_VOLUME_PAGES} to ${MAX_VOLUME_PAGES}, e.g. volume_pages: 600`,
};
/** Every setting tidewright.yaml may hold, in the order messages list them. */
export const PROJECT_KEYS = Object.keys(FIELD_FIX) as (keyof ProjectSettings)[];
const KEYS = PROJECT_KEYS;

function checkLocale(ctx: z.core.ParsePayload<string>): void {
  let canonical: string[] = [];
  try {
    canonical = Intl.getCanonicalLocales(ctx.value);
  } catch {
    // not a well-formed BCP 47 tag: reported below
  }
  if (canonical.length !== 1) {
    ctx.issues.push({ code: 'custom', input: ctx.value, message: `"${ctx.value}" is not a language tag` });
  } else if (languageOf(ctx.value) === null) {
    ctx.issues.push({ code: 'custom', input: ctx.value, message: `"${ctx.value}" is not a language tidewright publishes in` });
  }
}

function checkYears(ctx: z.core.ParsePayload<number | string>): void {
  const span = yearSpan(String(ctx.value));
  if ('problem' in span) ctx.issues.push({ code: 'custom', input: ctx.value, message: span.problem });
}

function checkDay(ctx: z.core.ParsePayload<string>): void {
  const day = ctx.value;
  const valid = /^\d{4}-\d{2}-\d{2}$/.test(day) && new Date(`${day}T00:00:00Z`).toISOString().slice(0, 10) === day;
  if (!valid) ctx.issues.push({ code: 'custom', input: day, message: `"${day}" is not a date written YYYY-MM-DD` });
}

function checkAccent(ctx: z.core.ParsePayload<string>): void {
  const colour = ctx.value;
  if (!ACCENT_PATTERN.test(colour)) {
    ctx.issues.push({ code: 'custom', input: colour, message: `"${colour}" is not a colour written #rrggbb` });
    return;
  }
  const ratio = contrastRatio(colour, '#ffffff');
  if (ratio < MIN_CONTRAST) {
    ctx.issues.push({ code: 'custom', input: colour, message: `"${colour}" against white (white text on it, and it as text on the page) ` +
      `has a contrast of ${ratio.toFixed(2)}:1, below ${MIN_CONTRAST}:1` });
  }
}

const text = z.string().trim().min(1, 'is empty').max(200, 'is longer than 200 characters');

const projectSchema = z.strictObject({
  title: text.optional(),
  publisher: text.optional(),
  // One year, or a range (YAML reads 2027-2029 as text): the years built, in order.
  year: z.union([z.int(), z.string()]).check(checkYears).transform((v) => (yearSpan(String(v)) as { years: number[] }).years).optional(),
  page: z.enum(PAGE_SIZES).optional(),
  units: z.enum(UNITS).optional(),
  locale: z.string().check(checkLocale).optional(),
  imposition: z.enum(IMPOSITIONS).optional(),
  caution: z.string().trim().min(1, 'is empty').max(2000, 'is longer than 2000 characters').optional(),
  hourly: z.boolean().optional(),
  edition: z.string().check(checkDay).optional(),
  contact: z.string().trim().min(1, 'is empty').max(400, 'is longer than 400 characters').optional(),
  accent: z.string().check(checkAccent).optional(),
  logo: z.string().trim().min(1, 'is empty').optional(),
  cover_image: z.string().trim().min(1, 'is empty').optional(),
  pages: z.string().trim().min(1, 'is empty').optional(),
  pocket: z.boolean().optional(),
  press: z.boolean().optional(),
  combined: z.enum(COMBINED_MODES).optional(),
  volume_pages: z.int().min(MIN_VOLUME_PAGES).max(MAX_VOLUME_PAGES).optional(),
});

function describe(value: unknown): string {
  if (value === null || value === undefined) return 'nothing';
  if (typeof value === 'string') return `"${value.length > 40 ? `${value.slice(0, 40)}…` : value}"`;
  if (typeof value === 'object') return Array.isArray(value) ? 'a list' : 'a map';
  return String(value);
}

function problemOf(file: string, data: Record<string, unknown>, issue: z.core.$ZodIssue): StationFileError[] {
  if (issue.code === 'unrecognized_keys') {
    return issue.keys.map((key) => {
      const near = nearestName(key, KEYS) ?? KEYS.find((k) => key.toLowerCase().includes(k));
      return new StationFileError(file, describeKey(key), 'is not a setting tidewright knows',
        `${near ? `did you mean ${near}? ` : ''}the settings are ${KEYS.join(', ')}`);
    });
  }
  const field = String(issue.path[0] ?? '') as keyof ProjectSettings;
  const ownWords = issue.code === 'custom' || issue.code === 'too_small' || issue.code === 'too_big';
  const problem = ownWords && typeof data[field] === 'string'
    ? issue.message
    : `${describe(data[field])} is not allowed here`;
  return [new StationFileError(file, field, problem, FIELD_FIX[field] ?? `the settings are ${KEYS.join(', ')}`)];
}

function describeKey(key: string): string {
  return key.length > 40 ? `${key.slice(0, 40)}…` : key;
}

/** The most a project file may hold (a handful of settings). */
export const MAX_PROJECT_FILE_BYTES = 64 * 1024;

export interface ProjectCheck {
  file: string | null;
  settings: ProjectSettings; // the settings that are valid
  problems: StationFileError[];
  pages: PublisherPage[]; // the publisher's own pages (`pages:`), read and checked
}

/** Every problem of the project file beside the stations, if there is one. */
export function checkProjectFile(stationsDir: string): ProjectCheck {
  const file = join(stationsDir, PROJECT_FILE_NAME);
  if (!existsSync(file)) return { file: null, settings: {}, problems: [], pages: [] };
  const read = readTextFile(file, MAX_PROJECT_FILE_BYTES, `a ${PROJECT_FILE_NAME} of key: value settings`);
  if (!('text' in read)) return { file, settings: {}, problems: [new StationFileError(file, '(file)', read.problem, read.fix)], pages: [] };
  const doc = parseDocument(read.text, { uniqueKeys: true });
  if (doc.errors.length > 0) {
    return {
      file, settings: {}, pages: [], problems: doc.errors.map((syntax) => {
        const where = syntax.linePos?.[0];
        const what = (syntax.message.split('\n')[0] ?? '').replace(/ at line \d+, column \d+:?$/, '');
        return new StationFileError(file, where ? `line ${where.line}, column ${where.col}` : '(file)',
          `YAML syntax error: ${what}`, 'write one setting per line as key: value, e.g. page: a5');
      }),
    };
  }
  if (doc.contents === null) return { file, settings: {}, problems: [], pages: [] };
  if (!isMap(doc.contents)) {
    return {
      file, settings: {}, pages: [], problems: [new StationFileError(file, '(file)', 'is not a list of key: value settings',
        'write settings such as title:, publisher:, year:, page:, units:, locale:, imposition:, caution:, edition:, contact:, accent:, logo:, cover_image:, pages:')],
    };
  }
  let data: Record<string, unknown>;
  try {
    data = doc.toJS({ maxAliasCount: 100 }) as Record<string, unknown>;
  } catch (error) {
    const what = error instanceof Error ? (error.message.split('\n')[0] ?? '') : String(error);
    return { file, settings: {}, pages: [], problems: [new StationFileError(file, '(file)', `YAML could not be read: ${what}`, 'write plain key: value lines without aliases')] };
  }
  const parsed = projectSchema.safeParse(data);
  if (parsed.success) {
    const settings = parsed.data;
    let pages: PublisherPage[] = [];
    try {
      if (settings.logo !== undefined) settings.logo = checkLogo(file, settings.logo).path;
      if (settings.cover_image !== undefined) settings.cover_image = checkPicture(file, 'cover_image', settings.cover_image, FIELD_FIX.cover_image).path;
      if (settings.pages !== undefined) pages = readPages(file, settings.pages);
    } catch (error) {
      if (error instanceof StationFileError) return { file, settings: {}, problems: [error], pages: [] };
      throw error;
    }
    return { file, settings, problems: [], pages };
  }
  return { file, settings: {}, pages: [], problems: parsed.error.issues.flatMap((issue) => problemOf(file, data, issue)) };
}

/** Reads the project file beside the stations, if there is one; a bad one is a StationFileError (its first problem). */
export function loadProjectFile(stationsDir: string): { file: string | null; settings: ProjectSettings; pages: PublisherPage[] } {
  const { file, settings, problems, pages } = checkProjectFile(stationsDir);
  if (problems[0]) throw problems[0];
  return { file, settings, pages };
}
