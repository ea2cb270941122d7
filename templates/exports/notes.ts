// The plain-text notes every export carries: what the numbers are, the caution, provenance, and for
// demo data that it is invented. One line each, no line breaks inside (station text is flattened).
import type { StationYear } from '../../engine/index.js';
import type { Words } from '../locale/index.js';

const oneLine = (text: string): string => text.replace(/[\r\n\t]+/g, ' ').trim();

export function exportNotes(model: StationYear, words: Words): string[] {
  const st = model.station;
  const notes = [
    words.t('export.eventsFor', { station: oneLine(st.name), id: st.id, year: model.year }),
    words.t('export.heightsTimes', { unit: words.unitName(), datum: oneLine(st.datum), zone: model.timezone }),
    `${words.t('caution.heading')}: ${oneLine(words.caution)}`,
  ];
  if (model.invented) notes.push(words.t('export.invented'));
  notes.push(`${words.t('fact.provenance')}: ${oneLine(st.provenance)}`);
  notes.push(words.t('site.madeWith', { generator: `${model.generator.name} ${model.generator.version}` }));
  return notes;
}
