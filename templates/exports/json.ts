// The events of a station-year as JSON: the station's identity, what the heights are measured from,
// the caution, and every high and low water as a record of the exports' one vocabulary (fields.ts).
import type { StationYear } from '../../engine/index.js';
import { wordsFor, type Words } from '../locale/index.js';
import { eventRecord } from './fields.js';

export function eventsJson(model: StationYear, words: Words = wordsFor()): string {
  const st = model.station;
  const doc = {
    kind: 'tidewright-events',
    version: 2,
    station: {
      id: st.id,
      name: st.name,
      kind: st.kind,
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
    events: model.events.map((e) => eventRecord(st.id, e.time, e.local, e.date, e.type, e.height, 'm')),
  };
  return `${JSON.stringify(doc, null, 2)}\n`;
}
