// The filters templates use: every number is formatted and every drawing computed here, so the
// templates only place what these return. Registered by renderSite (or by .eleventy.js on its own).
import type { DayEntry, Datums, MoonPhaseEntry, MoonPhaseName, StationYear } from '../../engine/types.js';
import { dayCurve, heightScale, type DayCurve, type HeightScale } from './curve.js';
import { datumLadder, ladderSpan, type DatumRow } from './datums.js';
import {
  clockIn, heightNumber, localLongDate, heightSigned, heightText, hoursText, minutesSigned, offsetText,
  phaseName, positionText, unitName, type Units,
} from './format.js';
import { glanceMonth, yearMaxRange, type GlanceMonth } from './glance.js';
import { moonLitPath } from './moon.js';
import { relativeUrl } from './paths.js';

export interface FilterHost {
  addFilter(name: string, fn: (...args: never[]) => unknown): unknown;
}

/** "3", "3 and 17", "3, 17 and 31". */
export function listWords(items: (string | number)[]): string {
  const words = items.map(String);
  if (words.length <= 1) return words.join('');
  return `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`;
}

export function siteFilters(units: Units): Record<string, (...args: never[]) => unknown> {
  const scales = new WeakMap<StationYear, HeightScale>();
  const glances = new WeakMap<StationYear, GlanceMonth[]>();
  const moons = new WeakMap<StationYear, Map<string, MoonPhaseEntry>>();
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
    height: (metres: number): string => heightText(metres, units),
    heightNumber: (metres: number): string => heightNumber(metres, units),
    heightSigned: (metres: number): string => heightSigned(metres, units),
    unitName: (): string => unitName(units),
    position: (p: { latitude: number; longitude: number }): string => positionText(p),
    offset: (offset: string): string => offsetText(offset),
    localLongDate: (iso: string, zone: string): string => localLongDate(iso, zone),
    clockIn: (iso: string, offset: string): string => clockIn(iso, offset),
    hours: (h: number): string => hoursText(h),
    minutesSigned: (m: number): string => minutesSigned(m),
    phaseName: (p: string): string => phaseName(p),
    eventName: (type: string): string => (type === 'high' ? 'High water' : 'Low water'),
    listWords: (items: (string | number)[]): string => listWords(items),
    fixed: (value: number, digits: number): string => value.toFixed(digits),
    bearing: (degrees: number | null): string => (degrees === null ? '' : `${String(Math.round(degrees) % 360).padStart(3, '0')}°`),
    moonLit: (phase: MoonPhaseName, latitude: number): string => moonLitPath(phase, latitude < 0),
    tideCurve: (day: DayEntry, model: StationYear): DayCurve => dayCurve(day, model.curveStepMinutes, scaleOf(model)),
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
    datumLadder: (datums: Datums): DatumRow[] => datumLadder(datums),
    // a height above chart datum as a height above the land-levelling datum, which lies chart_datum_below higher
    aboveLand: (metres: number, levelling: { chart_datum_below: number }): number => metres - levelling.chart_datum_below,
    ladderSpan: (rows: DatumRow[]): number => ladderSpan(rows),
  };
}

export function registerSiteFilters(config: FilterHost, units: Units): void {
  for (const [name, fn] of Object.entries(siteFilters(units))) config.addFilter(name, fn);
}
