// Filling combined volumes: the set's order kept, a reference port with its secondary ports, a region
// to itself, no volume over the page limit, and the default mode (full while one volume holds it all);
// the index volume lists each station under the region it is bound with.
import { describe, expect, it } from 'vitest';
import { planVolumes, volumeLength, type PlanStation } from '../../cli/build/volume-plan.js';
import { indexEntries } from '../../cli/build/volumes.js';
import { firstOf } from '../../engine/index.js';

const frame = { front: (n: number) => 2 + Math.ceil(n / 40), back: 1 };
const ref = (id: string, region?: string): PlanStation => ({ id, name: id, kind: 'reference', ...(region && { region }), sections: { full: [30, 31], compact: [30, 31] } });
const sec = (id: string, reference: string, region?: string): PlanStation => ({ id, name: id, kind: 'secondary', reference, ...(region && { region }), sections: { full: [28, 29], compact: [2, 2] } });

function set(groups: number, secondaries: number, region?: (g: number) => string | undefined): PlanStation[] {
  const out: PlanStation[] = [];
  for (let g = 0; g < groups; g++) {
    out.push(ref(`r${g}`, region?.(g)));
    for (let k = 0; k < secondaries; k++) out.push(sec(`s${g}-${k}`, `r${g}`));
  }
  return out;
}

describe('planning the combined volumes', () => {
  it('keeps one full book while the whole set fits in one volume', () => {
    const plan = planVolumes(set(2, 1), { pages: 600 }, frame);
    expect(plan.mode).toBe('full');
    expect(plan.volumes).toHaveLength(1);
    expect(firstOf(plan.volumes, 'volumes').stations.map((s) => s.id)).toEqual(['r0', 's0-0', 'r1', 's1-0']);
    expect(firstOf(plan.volumes, 'volumes').stations.every((s) => !s.compact)).toBe(true);
  });

  it('goes compact by default when it does not, and never passes the page limit', () => {
    const stations = set(60, 3);
    const plan = planVolumes(stations, { pages: 300 }, frame);
    expect(plan.mode).toBe('compact');
    expect(plan.volumes.length).toBeGreaterThan(1);
    const byId = new Map(stations.map((s) => [s.id, s]));
    for (const v of plan.volumes) {
      expect(v.pages).toBeLessThanOrEqual(300);
      expect(v.pages).toBe(volumeLength(v.stations.map((s) => byId.get(s.id)!), true, frame));
      // each reference port's group whole, in one volume
      for (const s of v.stations) if (s.id.startsWith('s')) expect(v.stations.some((r) => r.id === `r${s.id.slice(1).split('-')[0]}`)).toBe(true);
    }
    expect(plan.volumes.flatMap((v) => v.stations.map((s) => s.id))).toEqual(stations.map((s) => s.id));
    expect(firstOf(plan.volumes, 'volumes').label).toMatch(/^r0 \u2013 r\d+$/);
  });

  it('gives each region volumes of its own, A to Z, numbering the parts of a long one; secondary ports follow their reference', () => {
    const stations = set(30, 2, (g) => (g % 3 === 0 ? 'Outer Skerries' : g % 3 === 1 ? 'Brine Coast' : undefined));
    const plan = planVolumes(stations, { pages: 200, mode: 'full' }, frame);
    const labels = plan.volumes.map((v) => v.label);
    expect(labels[0]).toMatch(/^Brine Coast \(1\/\d+\)$/);
    expect(labels.filter((l) => l.startsWith('Outer Skerries')).length).toBeGreaterThan(1);
    const regionOf = (id: string) => { const g = Number(id.slice(1).split('-')[0]); return g % 3 === 0 ? 'O' : g % 3 === 1 ? 'B' : '-'; };
    for (const v of plan.volumes) expect(new Set(v.stations.map((s) => regionOf(s.id))).size).toBe(1);
  });

  it('splits a group longer than a volume station by station, and binds nothing for combined: none', () => {
    const stations = set(1, 20);
    const plan = planVolumes(stations, { pages: 150, mode: 'full' }, frame);
    expect(plan.volumes.length).toBeGreaterThan(3);
    for (const v of plan.volumes) expect(v.pages).toBeLessThanOrEqual(150);
    expect(planVolumes(stations, { pages: 150, mode: 'none' }, frame).volumes).toEqual([]);
  });
});

describe('the index volume', () => {
  it('lists a secondary port without a region of its own under its reference port\'s region', () => {
    const stations = [ref('r0', 'Brine Coast'), sec('s0-0', 'r0'), sec('s0-1', 'r0', 'Outer Skerries'), ref('r1'), sec('s1-0', 'r1')];
    const results = [{ index: 0, pages: 10, cached: false, entries: stations.map((s, i) => ({ id: s.id, page: 1 + i })) }];
    expect(indexEntries(results, stations).map((e) => [e.name, e.region ?? null])).toEqual([
      ['r0', 'Brine Coast'], ['s0-0', 'Brine Coast'], ['s0-1', 'Outer Skerries'], ['r1', null], ['s1-0', null],
    ]);
  });
});
