// The downloads of a stream-year: its slacks and strongest floods and ebbs as CSV and JSON, with the
// same notes as the tide downloads (what the numbers are, both cautions, provenance, invented data).
import { mkdir, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { StreamYear } from '../../engine/index.js';
import { wordsFor, type Words } from '../locale/index.js';
import { csvTable, csvText, type ExportRecord } from './fields.js';
import { calendarStamp, calendarText } from './calendar.js';

const SAFE_ID = /^[a-z0-9-]+$/;
const oneLine = (text: string): string => text.replace(/[\r\n\t]+/g, ' ').trim();

export interface StreamExportFileNames {
  csv: string;
  json: string;
  ics: string;
}

/** File names of a stream-year's downloads; the id is checked so no name can leave the folder. */
export function streamExportFileNames(model: StreamYear): StreamExportFileNames {
  const id = model.station.id;
  if (!SAFE_ID.test(id) || !Number.isInteger(model.year)) {
    throw new Error(`station id "${id}" / year ${model.year}: ids may hold only a-z, 0-9 and "-"`);
  }
  return { csv: `${id}-${model.year}-streams.csv`, json: `${id}-${model.year}-streams.json`, ics: `${id}-${model.year}-streams.ics` };
}

export function streamNotes(model: StreamYear, words: Words = wordsFor()): string[] {
  const st = model.station;
  const notes = [
    `${words.t('stream.caption', { station: oneLine(st.name), month: `(${st.id})`, year: model.year })}.`,
    `${words.t('stream.ratesLabel')} ${words.t('stream.knots')} ${words.t('stream.directionsLabel')} `
      + `${words.t('stream.directionsText', { flood: model.floodDirection, ebb: model.ebbDirection })} (${model.timezone})`,
    `${words.t('caution.heading')}: ${oneLine(words.caution)}`,
    `${words.t('stream.streamsVary')} ${oneLine(words.t('caution.streams'))}`,
  ];
  if (model.invented) notes.push(words.t('export.invented'));
  notes.push(`${words.t('fact.provenance')}: ${oneLine(st.provenance)}`);
  notes.push(words.t('site.madeWith', { generator: `${model.generator.name} ${model.generator.version}` }));
  return notes;
}

/** A stream event in the exports' one vocabulary (fields.ts; README "Fields of the exports"). */
function streamRecord(model: StreamYear, e: StreamYear['events'][number]): ExportRecord {
  return { station_id: model.station.id, time: e.time, time_local: e.local, type: e.type, speed_kn: e.speed, direction_deg_true: e.direction };
}

const STREAM_FIELDS = ['station_id', 'time', 'time_local', 'type', 'speed_kn', 'direction_deg_true'];

export function streamEventsCsv(model: StreamYear, words: Words = wordsFor()): string {
  const notes = streamNotes(model, words).map((note) => `# ${note}`);
  const records = model.events.map((e) => streamRecord(model, e));
  return csvText([...notes, ...csvTable(STREAM_FIELDS, records, { speed_kn: 2, direction_deg_true: 1 })]);
}

export function streamEventsJson(model: StreamYear, words: Words = wordsFor()): string {
  const st = model.station;
  const doc = {
    kind: 'tidewright-stream-events',
    version: 2,
    station: {
      id: st.id, name: st.name, kind: st.kind, reference: model.reference, position: st.position, timezone: model.timezone,
      flood_direction_deg_true: model.floodDirection, ebb_direction_deg_true: model.ebbDirection,
    },
    year: model.year,
    units: { speed: 'kn', direction: 'degrees true' },
    invented: model.invented,
    caution: words.caution,
    stream_caution: words.t('caution.streams'),
    provenance: st.provenance,
    generator: model.generator,
    events: model.events.map((e) => streamRecord(model, e)),
  };
  return `${JSON.stringify(doc, null, 2)}\n`;
}

const bearing = (d: number | null): string => (d === null ? '' : `${String(Math.round(d) % 360).padStart(3, '0')}°`);

/** Slack water and the strongest floods and ebbs as one iCalendar file (RFC 5545), reproducible like the tide calendar. */
export function streamEventsICalendar(model: StreamYear, words: Words = wordsFor(), stampMs?: number): string {
  const st = model.station;
  const w = words;
  const invented = model.invented ? ` ${w.t('export.invented')}` : '';
  const cautions = `${w.caution} ${w.t('caution.streams')}${invented}`;
  return calendarText({
    name: `${w.t('stream.groupName')} ${model.year}: ${st.name}`,
    description: `${w.t('stream.caption', { station: st.name, month: '', year: model.year })}. ${w.t('caution.heading')}: ${cautions} ${w.t('fact.provenance')}: ${st.provenance}`,
    generatorVersion: model.generator.version,
  }, w, st, calendarStamp(model.year, stampMs), model.events.map((e) => {
    const what = w.t(e.type === 'slack' ? 'stream.colSlack' : e.type === 'flood' ? 'stream.strongestFlood' : 'stream.strongestEbb');
    const rate = e.type === 'slack' ? '' : ` ${w.number(e.speed, 1)} kn, ${bearing(e.direction)}`;
    return { what: e.type, start: e.time, summary: `${what}${rate}`, description: `${what}, ${st.name}: ${e.clock} (${w.offset(e.offset)})${rate}.` };
  }));
}

export async function writeStreamExports(
  model: StreamYear, dataDir: string, words: Words = wordsFor(), stamp?: number,
): Promise<StreamExportFileNames> {
  const names = streamExportFileNames(model);
  await mkdir(dataDir, { recursive: true });
  await Promise.all([
    writeFile(join(dataDir, names.csv), streamEventsCsv(model, words)),
    writeFile(join(dataDir, names.json), streamEventsJson(model, words)),
    writeFile(join(dataDir, names.ics), streamEventsICalendar(model, words, stamp)),
  ]);
  return names;
}
