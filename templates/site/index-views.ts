// The index of a large set: stations grouped by their `region:` (when any station has one; else the
// reference-port groups alone), an A–Z jump list to the groups, the words the in-page search needs,
// and the map of every station. Built once from the models; the template only places it.
import type { StreamYear } from '../../engine/index.js';
import { CATALOGUES, type Words } from '../locale/index.js';
import { stationMap, type MapStation, type StationMap } from './map.js';
import type { StationYearSummary } from './summary.js';
import { indexGroups, type IndexGroup } from './views.js';

export interface IndexRegion {
  name: string | null; // null: no station has a region, or these stations have none
  id: string; // anchor
  count: number; // stations listed in it (tide and stream)
  groups: IndexGroup[];
}

export interface JumpLetter {
  letter: string;
  target: string | null; // anchor of the first group (region, or reference port) under this letter
}

export interface SiteIndex {
  byRegion: boolean;
  regions: IndexRegion[];
  jump: JumpLetter[];
  map: StationMap | null;
  /** The search's "n stations match" in each plural form of the language, `{count}` left in. */
  countForms: { form: string; text: string }[];
}

const ALPHABET = [...'ABCDEFGHIJKLMNOPQRSTUVWXYZ'];

/** The letter a name is filed under: its first letter without accents, upper case ("Île" → "I"). */
export function initialOf(name: string): string {
  const first = [...name.trim().normalize('NFD').replace(/[\u0300-\u036f]/g, '')][0] ?? '#';
  return first.toLocaleUpperCase('en');
}

function anchorOf(text: string, taken: Set<string>): string {
  const slug = text.normalize('NFKD').replace(/[\u0300-\u036f]/g, '').toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '') || 'region';
  let id = `region-${slug}`;
  for (let n = 2; taken.has(id); n++) id = `region-${slug}-${n}`;
  taken.add(id);
  return id;
}

/** Every letter A–Z (and any other initial a name starts with), each linked to its first group. */
function jumpLetters(named: readonly { name: string; id: string }[]): JumpLetter[] {
  const first = new Map<string, string>();
  for (const { name, id } of named) {
    const letter = initialOf(name);
    if (!first.has(letter)) first.set(letter, id);
  }
  const extra = [...first.keys()].filter((l) => !ALPHABET.includes(l)).sort();
  return [...ALPHABET, ...extra].map((letter) => ({ letter, target: first.get(letter) ?? null }));
}

function countOf(groups: readonly IndexGroup[]): number {
  return groups.reduce((n, g) => n + (g.reference ? 1 : 0) + g.secondaries.length + g.streams.length, 0);
}

/** Every station once (its first year's page), tide stations then streams, for the map. */
function mapStations(models: readonly StationYearSummary[], streams: readonly StreamYear[]): MapStation[] {
  const seen = new Map<string, MapStation>();
  for (const m of [...models, ...streams].sort((a, b) => a.year - b.year)) {
    const st = m.station;
    if (!seen.has(st.id)) {
      seen.set(st.id, { id: st.id, name: st.name, url: `/${st.id}/${m.year}/`, latitude: st.position.latitude, longitude: st.position.longitude });
    }
  }
  return [...seen.values()].sort((a, b) => a.name.localeCompare(b.name, 'en'));
}

function countForms(words: Words): { form: string; text: string }[] {
  const message = CATALOGUES[words.language]['index.searchCount'];
  if (typeof message === 'string') return [{ form: 'other', text: message }];
  return Object.entries(message).filter(([form]) => form !== 'count').map(([form, text]) => ({ form, text: String(text) }));
}

export function siteIndex(models: readonly StationYearSummary[], streams: readonly StreamYear[], words: Words, groups: IndexGroup[]): SiteIndex {
  const regionOf = (m: StationYearSummary | StreamYear): string | null => m.station.region ?? null;
  const byRegion = [...models, ...streams].some((m) => regionOf(m) !== null);
  const common = { map: stationMap(mapStations(models, streams)), countForms: countForms(words) };
  if (!byRegion) {
    const regions = [{ name: null, id: 'stations', count: countOf(groups), groups }];
    return { byRegion, regions, jump: jumpLetters(groups.map((g) => ({ name: g.referenceName, id: g.id }))), ...common };
  }
  // A secondary port listed in another region than its reference port links to it there.
  const placed = new Map<string, { url: string; region: string | null }>();
  for (const m of [...models].sort((a, b) => a.year - b.year)) {
    if (!placed.has(m.station.id)) placed.set(m.station.id, { url: `/${m.station.id}/${m.year}/`, region: regionOf(m) });
  }
  const names = [...new Set([...models, ...streams].map(regionOf))]
    .sort((a, b) => (a === null ? 1 : b === null ? -1 : a.localeCompare(b, words.tag)));
  const taken = new Set<string>();
  const regions = names.map((name): IndexRegion => {
    const id = anchorOf(name ?? words.t('index.noRegion'), taken);
    const own = indexGroups(models.filter((m) => regionOf(m) === name), streams.filter((m) => regionOf(m) === name), words)
      .map((g) => ({
        ...g,
        id: `${id}-${g.id}`,
        elsewhere: g.reference === null && g.referenceId !== null ? placed.get(g.referenceId) ?? null : null,
      }));
    return { name, id, count: countOf(own), groups: own };
  });
  const jump = jumpLetters(regions.filter((r) => r.name !== null).map((r) => ({ name: r.name!, id: r.id })));
  return { byRegion, regions, jump, ...common };
}
