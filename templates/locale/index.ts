// What every renderer speaks with: the reader's language (`t` and the catalogue), the one formatter,
// and the sentences built from the model's facts (clock changes, the time zone, warnings, the caution).
import type {
  DayEntry, EventType, ModelWarning, MoonPhaseName, OffsetChange, SpringNeapKind, TideTypeCode,
} from '../../engine/index.js';
import {
  CATALOGUES, LANGUAGES, languageOf, translator, type Language, type MessageKey, type Params,
} from './catalogue.js';
import { createFormat, offsetSeconds, type Format, type Units } from './format.js';

export { LANGUAGES, languageOf, type Language, type MessageKey } from './catalogue.js';
export { inUnits, instant, MINUS, offsetSeconds, type Format, type Units } from './format.js';

/** What a time-zone description reads of each day (tide and stream days alike). */
export type ZoneDay = Pick<DayEntry, 'date' | 'offsetStart' | 'offsetChange'>;

export interface Words extends Format {
  readonly tag: string; // BCP 47 tag of the output (the site's lang, the PDF's language entry)
  readonly language: Language;
  readonly units: Units;
  readonly caution: string;
  readonly cautionShort: string; // for page feet; the publisher's own caution when one is given
  t(key: MessageKey, params?: Params): string;
  unitName(): string;
  tideType(code: TideTypeCode): string;
  phaseName(phase: MoonPhaseName): string;
  eventName(type: EventType): string;
  eventShort(type: EventType): string;
  springNeapName(kind: SpringNeapKind): string;
  offsetChange(change: OffsetChange): string;
  zoneSummary(model: { days: readonly ZoneDay[] }): string;
  warning(w: ModelWarning, datumLabel: string): string;
}

export interface WordsOptions {
  locale?: string; // BCP 47 tag; default en
  units?: Units;
  caution?: string; // the publisher's own caution, replacing the catalogue's
}

/** Thrown for a locale tidewright has no catalogue for; the message is the one line a user sees. */
export class UnsupportedLocaleError extends Error {
  constructor(readonly tag: string) {
    super(`"${tag}" is not a language tidewright publishes in; write one of ${LANGUAGES.join(', ')}`);
    this.name = 'UnsupportedLocaleError';
  }
}

/** The canonical tag for a locale, or an UnsupportedLocaleError. */
export function checkLocale(tag: string): { tag: string; language: Language } {
  const language = languageOf(tag);
  if (language === null) throw new UnsupportedLocaleError(tag);
  return { tag: new Intl.Locale(tag).toString(), language };
}

const cache = new Map<string, Words>();

export function wordsFor(options: WordsOptions = {}): Words {
  const key = `${options.locale ?? 'en'}|${options.units ?? 'm'}|${options.caution ?? ''}`;
  let w = cache.get(key);
  if (!w) {
    w = createWords(options);
    cache.set(key, w);
  }
  return w;
}

function createWords(options: WordsOptions): Words {
  const { tag, language } = checkLocale(options.locale ?? 'en');
  const units = options.units ?? 'm';
  let f: Format | null = null;
  const t = translator(language, (n) => (Number.isInteger(n) ? String(n) : f!.number(n, 2)));
  f = createFormat(tag, units, t);
  const format = f;
  const offsetChange = (c: OffsetChange): string => {
    const from = offsetSeconds(c.from);
    const to = offsetSeconds(c.to);
    return t(to > from ? 'clock.forward' : 'clock.back', {
      amount: format.duration(Math.abs(to - from)),
      utc: format.clockAt(c.time, '+00:00'),
      before: format.clockAt(c.time, c.from),
      after: format.clockAt(c.time, c.to),
    });
  };
  return {
    ...format,
    tag,
    language,
    units,
    caution: options.caution ?? t('caution.full'),
    cautionShort: options.caution ?? t('caution.short'),
    t,
    unitName: () => t(units === 'ft' ? 'unit.feet' : 'unit.metres'),
    tideType: (code) => t(`tideType.${code}`),
    phaseName: (phase) => t(`moon.${phase}`),
    eventName: (type) => t(type === 'high' ? 'event.high' : 'event.low'),
    eventShort: (type) => t(type === 'high' ? 'event.highShort' : 'event.lowShort'),
    springNeapName: (kind) => t(kind === 'spring' ? 'tide.springs' : 'tide.neaps'),
    offsetChange,
    zoneSummary: (model) => zoneSummary(model.days, format, t),
    warning: (w, datumLabel) => {
      switch (w.code) {
        case 'window-never-opens':
        case 'window-never-closes':
          return t(w.code === 'window-never-opens' ? 'warning.windowNeverOpens' : 'warning.windowNeverCloses', {
            window: w.window, rule: t(w.side === 'above' ? 'window.ruleAbove' : 'window.ruleBelow', { level: format.height(w.level) }),
            year: w.year, lowest: format.height(w.lowest), highest: format.height(w.highest) });
        case 'lat-above-datum':
          return t('warning.latAboveDatum', { lat: format.height(w.LAT), datum: datumLabel, epoch: `${w.epoch.from}–${w.epoch.to}` });
        case 'low-water-below-lat':
          return t('warning.lowWaterBelowLat', {
            height: format.height(w.height), date: format.date(w.date), clock: w.clock, offset: format.offset(w.offset),
            lat: format.height(w.LAT), epoch: `${w.epoch.from}–${w.epoch.to}`,
          });
      }
    },
  };
}

// "UTC+00:00; summer time UTC+01:00 from 28 March to 31 October" (or "UTC+05:30 all year", or each
// change in turn for zones that change otherwise).
function zoneSummary(days: readonly ZoneDay[], f: Format, t: (key: MessageKey, params?: Params) => string): string {
  const first = days[0];
  if (!first) return '';
  const changes = days.filter((d) => d.offsetChange !== null);
  if (changes.length === 0) return t('zone.allYear', { offset: f.offset(first.offsetStart) });
  const date = (d: ZoneDay): string => f.date(d.date, { year: false });
  const [a, b] = changes;
  if (changes.length === 2 && a && b && a.offsetChange!.from === b.offsetChange!.to
    && a.offsetChange!.to === b.offsetChange!.from) {
    const ahead = offsetSeconds(a.offsetChange!.to) > offsetSeconds(a.offsetChange!.from);
    if (ahead) {
      return t('zone.summerBetween', { standard: f.offset(a.offsetChange!.from), summer: f.offset(a.offsetChange!.to),
        from: date(a), to: date(b) });
    }
    return t('zone.summerUntilFrom', { standard: f.offset(a.offsetChange!.to), summer: f.offset(a.offsetChange!.from),
      until: date(a), from: date(b) });
  }
  const steps = changes.map((d) => t('zone.fromDate', { offset: f.offset(d.offsetChange!.to), date: date(d) }));
  return `${f.offset(first.offsetStart)}; ${steps.join('; ')}`;
}

/** The language of a tag for lang attributes, and whether a build can speak it. */
export function supportedLanguages(): readonly Language[] {
  return LANGUAGES;
}

export { CATALOGUES };
