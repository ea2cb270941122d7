// The command line of `tidewright build`: parsed and checked, nothing else decided here.
import { UsageError } from '../../engine/index.js';
import { LANGUAGES, languageOf } from '../../templates/locale/catalogue.js';
import { oneOf, parseCommandLine, positionalArguments } from '../args.js';
import { FIRST_YEAR, LAST_YEAR, MAX_BUILD_YEARS, yearsOption } from '../years.js';
import {
  IMPOSITIONS, MAX_WORKERS, PAGE_SIZES, UNITS,
  type Imposition, type PageSize, type Units,
} from './options.js';

export interface BuildArgs {
  stations?: string;
  years?: number[]; // one year, or each year of a range
  out?: string;
  units?: Units;
  page?: PageSize;
  imposition?: Imposition;
  locale?: string;
  workers?: number;
  press: boolean;
  quiet: boolean;
  help: boolean;
}

export const BUILD_USAGE = `Usage: tidewright build [options]

Builds the website, the PDF tide books and the data downloads for every station in a folder.

  --stations DIR      folder of station files (default: stations-demo)
  --year YYYY         year of the almanac, ${FIRST_YEAR} to ${LAST_YEAR} (default: next calendar year);
                      YYYY-YYYY builds every year of a range (at most ${MAX_BUILD_YEARS}) into one site
  --out DIR           output folder, replaced whole when the build succeeds (default: out)
  --units m|ft        heights in metres or feet (default: m)
  --page SIZE         PDF page: ${PAGE_SIZES.join(', ')} (default: a5)
  --imposition KIND   none, or saddle-stitch for fold-and-staple booklets (default: none)
  --locale TAG        language of the site, the books and the calendar text: ${LANGUAGES.join(', ')}
                      (a regional tag such as fr-CA or pt-BR picks its dates and numbers; default: en)
  --press             books for a print shop: 3 mm bleed, crop marks, TrimBox and BleedBox
  --workers N         worker threads for the station computations (default: one per core)
  --quiet             print nothing but errors
  --help              show this text

Settings a publisher keeps can go in tidewright.yaml beside the station files
(title, publisher, year, page, units, locale, imposition, caution, edition, contact, accent, logo, hourly,
pocket, press); options given here win. caution: replaces the translated safety caution with the publisher's
own words (plain text). CSV and JSON downloads keep English field names and '.' decimals in every language.
Every output is stamped with the edition date, or SOURCE_DATE_EPOCH when set (never later).`;

const OPTIONS = {
  stations: { type: 'string' },
  year: { type: 'string' },
  out: { type: 'string' },
  units: { type: 'string' },
  page: { type: 'string' },
  imposition: { type: 'string' },
  locale: { type: 'string' },
  workers: { type: 'string' },
  press: { type: 'boolean' },
  quiet: { type: 'boolean', short: 'q' },
  help: { type: 'boolean', short: 'h' },
} as const;

function integer(option: string, text: string, min: number, max: number, example: string): number {
  const value = /^\d+$/.test(text) ? Number(text) : NaN;
  if (!Number.isInteger(value) || value < min || value > max) {
    throw new UsageError(option, `"${text}" is not a whole number from ${min} to ${max}`, `write e.g. ${option} ${example}`);
  }
  return value;
}

function folder(option: string, text: string | undefined): string | undefined {
  if (text === undefined) return undefined;
  if (text.trim() === '') throw new UsageError(option, 'is empty', `write a folder after ${option}`);
  return text;
}

/** A language tidewright publishes in, or a UsageError listing them. */
export function localeOption(option: string, text: string): string {
  const language = languageOf(text);
  if (language === null) {
    throw new UsageError(option, `"${text}" is not a language tidewright publishes in`, `write one of ${LANGUAGES.join(', ')}`);
  }
  return new Intl.Locale(text).toString();
}

/** Turns the arguments after `build` into checked values; a bad one is a UsageError. */
export function parseBuildArgs(argv: readonly string[]): BuildArgs {
  const { values, positionals } = parseCommandLine('build', argv, OPTIONS);
  positionalArguments('build', positionals, []);
  return {
    stations: folder('--stations', values.stations),
    out: folder('--out', values.out),
    years: values.year === undefined ? undefined : yearsOption('--year', values.year),
    units: values.units === undefined ? undefined : oneOf('--units', values.units, UNITS),
    page: values.page === undefined ? undefined : oneOf('--page', values.page, PAGE_SIZES),
    imposition: values.imposition === undefined ? undefined : oneOf('--imposition', values.imposition, IMPOSITIONS),
    locale: values.locale === undefined ? undefined : localeOption('--locale', values.locale),
    workers: values.workers === undefined ? undefined : integer('--workers', values.workers, 1, MAX_WORKERS, '2'),
    press: values.press ?? false,
    quiet: values.quiet ?? false,
    help: values.help ?? false,
  };
}
