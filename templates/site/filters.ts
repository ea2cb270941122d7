// The filters templates use: every number is formatted and every drawing computed here, so the
// templates only place what these return. Registered by renderSite (or by .eleventy.js on its own).
import type {
  DayEntry, Datums, MoonPhaseEntry, MoonPhaseName, StationYear, ModelWarning, OffsetChange, TideTypeCode,
} from '../../engine/index.js';
import type { MessageKey, Words } from '../locale/index.js';
import { dayCurve, heightScale, type DayCurve, type HeightScale } from './curve.js';
import { datumLadder, ladderSpan, type DatumRow } from './datums.js';
import { glanceMonth, yearMaxRange, type GlanceMonth } from './glance.js';
import { moonLitPath } from './moon.js';
import { sunTimes } from '../night.js';
import { dayLanes } from '../day-lanes.js';
import { latBelowChartDatum } from '../datum-order.js';
import { relativeUrl } from './paths.js';
import { streamCurve, streamScale, type StreamCurve } from './stream-curve.js';
import type { StreamDayEntry, StreamYear } from '../../engine/index.js';
import { windowFilters } from './windows.js';

export interface FilterHost {
  addFilter(name: string, fn: (...args: never[]) => unknown): unknown;
}

export function siteFilters(w: Words): Record<string, (...args: never[]) => unknown> {
  const scales = new WeakMap<StationYear, HeightScale>();
  const glances = new WeakMap<StationYear, GlanceMonth[]>();
  const moons = new WeakMap<StationYear, Map<string, MoonPhaseEntry>>();
  const streamScales = new WeakMap<StreamYear, number>();
  // a day's curve is drawn on its month page and on its hours page: drawn once, for the same model
  const curves = new WeakMap<DayEntry, { model: StationYear; curve: DayCurve }>();
  const scaleOf = (model: StationYear): HeightScale => {
    let s = scales.get(model);
    if (!s) {
      s = heightScale(model);
      scales.set(model, s);
    }
    return s;
  };
  return {
    rel: (to: string, fromUrl: string): string => relativeUrl(to, fromUrl),
    t: (key: MessageKey, params?: Record<string, string | number>): string => w.t(key, params),
    height: (metres: number): string => w.height(metres),
    heightNumber: (metres: number): string => w.heightNumber(metres),
    heightSigned: (metres: number): string => w.heightSigned(metres),
    unit: (): string => w.unit(),
    unitName: (): string => w.unitName(),
    position: (p: { latitude: number; longitude: number }): string => w.position(p),
    offset: (offset: string): string => w.offset(offset),
    date: (date: string, year = true): string => w.date(date, { year }),
    longDate: (date: string): string => w.date(date, { weekday: true }),
    monthName: (month: number): string => w.monthName(month),
    monthShort: (month: number): string => w.monthShort(month),
    weekday: (weekday: number): string => w.weekdayShort(weekday),
    clockIn: (iso: string, offset: string): string => w.clockAt(iso, offset),
    hours: (h: number): string => w.hours(h),
    minutesSigned: (m: number): string => w.minutesSigned(m),
    phaseName: (p: MoonPhaseName): string => w.phaseName(p),
    eventName: (type: 'high' | 'low'): string => w.eventName(type),
    dayLanes: (events: DayEntry['events']) => dayLanes(events),
    eventShort: (type: 'high' | 'low'): string => w.eventShort(type),
    tideType: (code: TideTypeCode): string => w.tideType(code),
    offsetChange: (c: OffsetChange): string => w.offsetChange(c),
    zoneSummary: (model: StationYear): string => w.zoneSummary(model),
    warning: (warning: ModelWarning, datum: string): string => w.warning(warning, datum),
    listWords: (items: (string | number)[]): string => w.list(items.map(String)),
    fixed: (value: number, digits: number): string => w.number(value, digits),
    // numbers inside SVG attributes: always '.' and '-', whatever the language of the page
    svgNumber: (value: number, digits: number): string => value.toFixed(digits),
    latBelowChartDatum: (datums: Datums): number | null => latBelowChartDatum(datums),
    bearing: (degrees: number | null): string => (degrees === null ? '' : `${String(Math.round(degrees) % 360).padStart(3, '0')}°`),
    moonLit: (phase: MoonPhaseName, latitude: number): string => moonLitPath(phase, latitude < 0),
    tideCurve: (day: DayEntry, model: StationYear): DayCurve => {
      const kept = curves.get(day);
      if (kept?.model === model) return kept.curve;
      const curve = dayCurve(day, model.curveStepMinutes, scaleOf(model));
      curves.set(day, { model, curve });
      return curve;
    },
    glance: (model: StationYear): GlanceMonth[] => {
      let g = glances.get(model);
      if (!g) {
        const max = yearMaxRange(model);
        g = model.months.map((m) => glanceMonth(model, m, max));
        glances.set(model, g);
      }
      return g;
    },
    moonOn: (date: string, model: StationYear): MoonPhaseEntry | null => {
      let byDate = moons.get(model);
      if (!byDate) {
        byDate = new Map(model.moonPhases.map((m) => [m.date, m]));
        moons.set(model, byDate);
      }
      return byDate.get(date) ?? null;
    },
    sunTimes: (day: DayEntry) => sunTimes(day),
    streamCurve: (day: StreamDayEntry, model: StreamYear): StreamCurve => {
      let max = streamScales.get(model);
      if (max === undefined) {
        max = streamScale(model);
        streamScales.set(model, max);
      }
      return streamCurve(day, max);
    },
    datumLadder: (datums: Datums): DatumRow[] => datumLadder(datums).map((r) => ({ ...r, name: w.t(`datum.${r.key}` as MessageKey) })),
    // a height above chart datum as a height above the land-levelling datum, which lies chart_datum_below higher
    aboveLand: (metres: number, levelling: { chart_datum_below: number }): number => metres - levelling.chart_datum_below,
    ladderSpan: (rows: DatumRow[]): number => ladderSpan(rows),
    ...windowFilters(w),
  };
}

export function registerSiteFilters(config: FilterHost, words: Words): void {
  for (const [name, fn] of Object.entries(siteFilters(words))) config.addFilter(name, fn);
}
