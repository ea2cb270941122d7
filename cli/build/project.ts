// tidewright.yaml: what a publisher sets once, kept beside the station files. Optional; every key optional.
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { isMap, parseDocument } from 'yaml';
import * as z from 'zod';
import { StationFileError, nearestName } from '../../engine/index.js';
import { LANGUAGES, languageOf } from '../../templates/locale/catalogue.js';
import {
  FIRST_YEAR, IMPOSITIONS, LAST_YEAR, PAGE_SIZES, UNITS, type Imposition, type PageSize, type Units,
} from './options.js';

export const PROJECT_FILE_NAME = 'tidewright.yaml';

/** The settings as read (the schema below is their one definition). */
export type ProjectSettings = z.output<typeof projectSchema>;

const FIELD_FIX: Readonly<Record<keyof ProjectSettings, string>> = {
  title: 'write the almanac title as text, e.g. title: Brinewold Bay Tide Almanac',
  publisher: 'write who publishes it as text, e.g. publisher: Brinewold Bay Harbour Office',
  year: `write a whole year from ${FIRST_YEAR} to ${LAST_YEAR}, e.g. year: 2027, or leave the key out for next year`,
  page: `write one of ${PAGE_SIZES.join(', ')}, e.g. page: a5`,
  units: 'write units: m (metres) or units: ft (feet)',
  locale: `write one of ${LANGUAGES.join(', ')} (a regional tag such as fr-CA or pt-BR also works)`,
  imposition: 'write imposition: none, or imposition: saddle-stitch for fold-and-staple booklets',
  caution: 'write the caution as plain text, e.g. caution: Predictions only; check the official tables. Every output carries one, so it cannot be empty',
  hourly: 'write hourly: true for a page of heights on every hour after each month in the books, or leave it out',
  press: 'write press: true for print-shop books (bleed, crop marks, page boxes), or press: false',
  pocket: 'write pocket: true for a folded one-sheet pocket table beside each book, or pocket: false',
};
const KEYS = Object.keys(FIELD_FIX) as (keyof ProjectSettings)[];

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

const text = z.string().trim().min(1, 'is empty').max(200, 'is longer than 200 characters');

const projectSchema = z.strictObject({
  title: text.optional(),
  publisher: text.optional(),
  year: z.int().min(FIRST_YEAR).max(LAST_YEAR).optional(),
  page: z.enum(PAGE_SIZES).optional(),
  units: z.enum(UNITS).optional(),
  locale: z.string().check(checkLocale).optional(),
  imposition: z.enum(IMPOSITIONS).optional(),
  caution: z.string().trim().min(1, 'is empty').max(2000, 'is longer than 2000 characters').optional(),
  hourly: z.boolean().optional(),
  pocket: z.boolean().optional(),
  press: z.boolean().optional(),
});

function describe(value: unknown): string {
  if (value === null || value === undefined) return 'nothing';
  if (typeof value === 'string') return `"${value.length > 40 ? `${value.slice(0, 40)}…` : value}"`;
  if (typeof value === 'object') return Array.isArray(value) ? 'a list' : 'a map';
  return String(value);
}

function firstProblem(file: string, data: Record<string, unknown>, issues: readonly z.core.$ZodIssue[]): StationFileError {
  const issue = issues[0]!;
  if (issue.code === 'unrecognized_keys') {
    const key = issue.keys[0]!;
    const near = nearestName(key, KEYS) ?? KEYS.find((k) => key.toLowerCase().includes(k));
    return new StationFileError(file, key, 'is not a setting tidewright knows',
      `${near ? `did you mean ${near}? ` : ''}the settings are ${KEYS.join(', ')}`);
  }
  const field = String(issue.path[0] ?? '') as keyof ProjectSettings;
  const ownWords = issue.code === 'custom' || issue.code === 'too_small' || issue.code === 'too_big';
  const problem = ownWords && typeof data[field] === 'string'
    ? issue.message
    : `${describe(data[field])} is not allowed here`;
  return new StationFileError(file, field, problem, FIELD_FIX[field] ?? `the settings are ${KEYS.join(', ')}`);
}

/** Reads the project file beside the stations, if there is one; a bad one is a StationFileError. */
export function loadProjectFile(stationsDir: string): { file: string | null; settings: ProjectSettings } {
  const file = join(stationsDir, PROJECT_FILE_NAME);
  if (!existsSync(file)) return { file: null, settings: {} };
  const doc = parseDocument(readFileSync(file, 'utf8'), { uniqueKeys: true });
  const syntax = doc.errors[0];
  if (syntax) {
    const where = syntax.linePos?.[0];
    const what = (syntax.message.split('\n')[0] ?? '').replace(/ at line \d+, column \d+:?$/, '');
    throw new StationFileError(file, where ? `line ${where.line}, column ${where.col}` : '(file)',
      `YAML syntax error: ${what}`,
      'write one setting per line as key: value, e.g. page: a5');
  }
  if (doc.contents === null) return { file, settings: {} };
  if (!isMap(doc.contents)) {
    throw new StationFileError(file, '(file)', 'is not a list of key: value settings',
      `write settings such as title:, publisher:, year:, page:, units:, locale:, imposition:, caution:`);
  }
  const data = doc.toJS() as Record<string, unknown>;
  const parsed = projectSchema.safeParse(data);
  if (!parsed.success) throw firstProblem(file, data, parsed.error.issues);
  return { file, settings: parsed.data };
}
