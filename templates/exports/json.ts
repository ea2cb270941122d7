// The events of a station-year as JSON: the station's identity, what the heights are measured from,
// the caution, and every high and low water (UTC instant, local time, metres above datum).
import type { StationYear } from '../../engine/index.js';
import { wordsFor, type Words } from '../locale/index.js';

export function eventsJson(model: StationYear, words: Words = wordsFor()): string {
  const st = model.station;
  const doc = {
    kind: 'tidewright-events',
    version: 1,
    station: {
      id: st.id,
      name: st.name,
      type: st.kind,
      reference: model.reference,
      position: st.position,
      timezone: model.timezone,
      datum: st.datum,
    },
    year: model.year,
    units: 'm',
    invented: model.invented,
    caution: words.caution,
    provenance: st.provenance,
    generator: model.generator,
    events: model.events.map((e) => ({
      time: e.time,
      local: e.local,
      date: e.date,
      type: e.type,
      height: e.height,
      belowDatum: e.belowDatum,
    })),
  };
  return `${JSON.stringify(doc, null, 2)}\n`;
}
