// Which stations go into which combined volume. Stations are grouped by region (stations without one
// by their reference port's region), each reference port followed by its secondary ports, and packed
// into volumes of at most `pages` pages; a region starts a volume of its own and a reference port's
// group is split only when it alone is longer than a volume.
import { firstOf, lastOf } from '../../engine/index.js';
import type { SectionPages } from '../../templates/pdf/volume.js';
import type { CombinedMode, VolumeChoices } from './volume-options.js';

export interface PlanStation {
  id: string;
  name: string;
  kind: 'reference' | 'secondary';
  reference?: string;
  region?: string;
  invented?: boolean;
  sections: SectionPages;
}

export interface PlannedVolume {
  label: string; // the region, else the first and last reference port
  stations: { id: string; compact: boolean }[];
  pages: number; // as planned (the drawn volume reports its own)
}

export interface VolumePlan {
  mode: CombinedMode;
  volumes: PlannedVolume[];
}

/** Page arithmetic of a volume: pages before the first section (by station count) and after the last. */
export interface VolumeFrame { front(stations: number): number; back: number }

/** The region a station is listed under: its own, else (a secondary port) its reference port's; '' for none. */
export function regionOf(s: PlanStation, byId: ReadonlyMap<string, PlanStation>): string {
  if (s.region !== undefined) return s.region;
  const ref = s.kind === 'secondary' && s.reference !== undefined ? byId.get(s.reference) : undefined;
  return ref?.region ?? '';
}

/** Regions A to Z (stations without one last), each a list of reference-port groups in the set's order. */
function groupsByRegion(stations: readonly PlanStation[]): [string, PlanStation[][]][] {
  const byId = new Map(stations.map((s) => [s.id, s]));
  const regions = new Map<string, Map<string, PlanStation[]>>();
  for (const s of stations) {
    const region = regionOf(s, byId);
    const head = s.kind === 'secondary' && s.reference !== undefined && regionOf(byId.get(s.reference) ?? s, byId) === region ? s.reference : s.id;
    const groups = regions.get(region) ?? new Map<string, PlanStation[]>();
    regions.set(region, groups);
    const group = groups.get(head) ?? [];
    groups.set(head, group);
    if (s.id === head) group.unshift(s); else group.push(s);
  }
  const collator = new Intl.Collator('en', { sensitivity: 'base', numeric: true });
  return [...regions.entries()]
    .sort(([a], [b]) => (a === '' ? 1 : b === '' ? -1 : collator.compare(a, b)))
    .map(([region, groups]) => [region, [...groups.values()]]);
}

function sectionLength(s: PlanStation, compact: boolean, firstPage: number): number {
  const pair = compact ? s.sections.compact : s.sections.full;
  return pair[firstPage % 2 === 1 ? 0 : 1];
}

/** Pages of a volume holding these stations, each section starting where the last one ended. */
export function volumeLength(stations: readonly PlanStation[], compact: boolean, frame: VolumeFrame): number {
  let page = frame.front(stations.length) + 1;
  for (const s of stations) page += sectionLength(s, compact && s.kind === 'secondary', page);
  return page - 1 + frame.back;
}

function labelOf(region: string, members: readonly PlanStation[]): string {
  if (region !== '') return region;
  const refs = members.filter((s) => s.kind === 'reference');
  const named = refs.length > 0 ? refs : members;
  const first = firstOf(named, 'volume members');
  const last = lastOf(named, 'volume members');
  return first === last ? first.name : `${first.name} \u2013 ${last.name}`;
}

export function planVolumes(stations: readonly PlanStation[], choices: VolumeChoices, frame: VolumeFrame): VolumePlan {
  const regions = groupsByRegion(stations);
  const ordered = regions.flatMap(([, groups]) => groups.flat());
  const fitsOne = volumeLength(ordered, false, frame) <= choices.pages;
  const mode: CombinedMode = choices.mode ?? (fitsOne ? 'full' : 'compact');
  if (mode === 'none' || stations.length === 0) return { mode, volumes: [] };
  const compact = mode === 'compact';
  if (volumeLength(ordered, compact, frame) <= choices.pages) {
    return { mode, volumes: [{ label: '', stations: ordered.map((s) => ({ id: s.id, compact: compact && s.kind === 'secondary' })), pages: volumeLength(ordered, compact, frame) }] };
  }
  const volumes: PlannedVolume[] = [];
  for (const [region, groups] of regions) {
    let current: PlanStation[] = [];
    const close = (): void => {
      if (current.length === 0) return;
      volumes.push({ label: labelOf(region, current), stations: current.map((s) => ({ id: s.id, compact: compact && s.kind === 'secondary' })),
        pages: volumeLength(current, compact, frame) });
      current = [];
    };
    for (const group of groups) {
      if (volumeLength([...current, ...group], compact, frame) <= choices.pages) {
        current.push(...group);
        continue;
      }
      close();
      // A group longer than a volume: station by station (a single station longer than a volume gets one of its own).
      for (const s of group) {
        if (current.length > 0 && volumeLength([...current, s], compact, frame) > choices.pages) close();
        current.push(s);
      }
    }
    close();
  }
  // The same region in more than one volume: number its parts.
  const parts = new Map<string, number>();
  for (const v of volumes) parts.set(v.label, (parts.get(v.label) ?? 0) + 1);
  const seen = new Map<string, number>();
  for (const v of volumes) {
    const total = parts.get(v.label)!;
    if (total > 1) {
      const n = (seen.get(v.label) ?? 0) + 1;
      seen.set(v.label, n);
      v.label = `${v.label} (${n}/${total})`;
    }
  }
  return { mode, volumes };
}
