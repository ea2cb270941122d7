// The plain-text notes every export carries: what the numbers are, the caution, provenance, and for
// demo data that it is invented. One line each, no line breaks inside (station text is flattened).
import type { StationYear } from '../../engine/types.js';
import { unitName, type Units } from '../site/format.js';

const oneLine = (text: string): string => text.replace(/[\r\n\t]+/g, ' ').trim();

export function exportNotes(model: StationYear, units: Units): string[] {
  const st = model.station;
  const notes = [
    `Tide events for ${oneLine(st.name)} (${st.id}), ${model.year}.`,
    `Heights in ${unitName(units)} above ${oneLine(st.datum)}; times in UTC and in local time (${model.timezone}).`,
    `Caution: ${oneLine(model.caution)}`,
  ];
  if (model.invented) notes.push('These data are INVENTED for a demonstration: never use them for navigation.');
  notes.push(`Provenance: ${oneLine(st.provenance)}`);
  notes.push(`Made with ${model.generator.name} ${model.generator.version}.`);
  return notes;
}
