// High and low waters of a station-year (and its windows' openings) as one iCalendar file, written by
// the one calendar writer (calendar.ts).
import type { StationYear } from '../../engine/index.js';
import { wordsFor, type Words } from '../locale/index.js';
import { calendarStamp, calendarText, type CalendarEvent } from './calendar.js';
import { windowCalendarEvents } from './windows.js';

export function eventsICalendar(model: StationYear, words: Words = wordsFor(), stampMs?: number): string {
  const st = model.station;
  const w = words;
  const invented = model.invented ? ` ${w.t('export.invented')}` : '';
  const tides: CalendarEvent[] = model.events.map((e) => {
    const what = w.eventName(e.type);
    const height = w.height(e.height).replace('\u00a0', ' '); // plain text: an ordinary space
    const below = e.belowDatum ? ` (${w.t('ical.below', { datum: st.datum })})` : '';
    return {
      what: e.type, start: e.time,
      summary: `${what} ${height}${below}`,
      description: `${w.t('ical.event', { what, clock: e.clock, offset: w.offset(e.offset), height, datum: st.datum })}${below}.`,
    };
  });
  return calendarText({
    name: w.t('ical.name', { year: model.year, station: st.name }),
    description: `${w.t('ical.description', { station: st.name, datum: st.datum })} ${w.t('caution.heading')}: ${w.caution}${invented} `
      + `${w.t('fact.provenance')}: ${st.provenance}`,
    generatorVersion: model.generator.version,
  }, w, st, calendarStamp(model.year, stampMs), [...tides, ...windowCalendarEvents(model, w)]);
}
