// The language of a command's output for people (tables and summaries; JSON and CSV stay
// locale-neutral): --locale, else `locale:` in the tidewright.yaml of the station set, else English.
// The publisher's `caution:` there replaces the catalogue's caution, as it does in the build.
import { DateTime } from 'luxon';
import { wordsFor, type Words } from '../templates/locale/index.js';
import { localeOption } from './build/args.js';
import { checkProjectFile } from './build/project.js';

/** The --locale option as every command that prints for people declares it. */
export const LOCALE_OPTION = { locale: { type: 'string' } } as const;

export const LOCALE_HELP = '  --locale TAG      language of the table (en, fr, es, pt, de, nl, nb; default: locale: in the\n'
  + '                    tidewright.yaml of the station set, else en); JSON and CSV are the same in every language\n';

/** The words a command speaks with; a project file with problems is left to `check` and `build`. */
export function commandWords(locale: string | undefined, stationsDir: string): Words {
  const { settings } = checkProjectFile(stationsDir);
  return wordsFor({
    locale: locale === undefined ? settings.locale : localeOption('--locale', locale),
    caution: settings.caution,
  });
}

/** A local instant for a table: ISO date, the locale's short weekday, clock (and seconds), offset. */
export function tableStamp(words: Words, t: number, zone: string, seconds = false): { date: string; weekday: string; clock: string; offset: string } {
  const local = DateTime.fromMillis(t, { zone });
  return {
    date: local.toFormat('yyyy-MM-dd'),
    weekday: words.weekdayShort(local.weekday),
    clock: local.toFormat(seconds ? 'HH:mm:ss' : 'HH:mm'),
    offset: local.toFormat('ZZ'),
  };
}

/** Width of the widest short weekday in the language, for table columns. */
export function weekdayWidth(words: Words): number {
  return Math.max(...[1, 2, 3, 4, 5, 6, 7].map((d) => words.weekdayShort(d).length));
}

/** Each column's width: the length of its head or the least width given for it, whichever is more. */
export function columnWidths(heads: readonly string[], least: readonly number[]): number[] {
  return heads.map((head, i) => Math.max(head.length, least[i] ?? 0));
}

/** Pads a row of cells to the widths of the column heads (at least), two spaces apart; a cell without a width is not padded. */
export function row(cells: readonly string[], widths: readonly number[]): string {
  return cells.map((c, i) => (i === cells.length - 1 ? c : c.padEnd(widths[i] ?? 0))).join('  ').trimEnd();
}

/** The lines above a table: the station, where and when, how to read it, its provenance and the caution. */
export function tableHeader(words: Words, lines: { station: string; where: string; what: string; from: number; to: number; zone: string; reading: string; provenance: string }): string[] {
  const span = (t: number): string => DateTime.fromMillis(t, { zone: lines.zone }).toFormat('yyyy-MM-dd HH:mm');
  return [
    lines.station,
    lines.where,
    words.t('cli.span', { what: lines.what, from: span(lines.from), to: span(lines.to) }),
    lines.reading,
    words.t('cli.constants', { provenance: lines.provenance }),
    `${words.t('caution.heading')}: ${words.caution}`,
  ];
}
