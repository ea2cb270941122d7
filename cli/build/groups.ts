// Which stations go to which worker: a secondary port rides with its reference port, so the worker
// that has computed the reference's events and datums reuses them (the engine caches per worker).

export interface StationRef {
  id: string;
  kind: 'reference' | 'secondary';
  reference?: string; // for a secondary port
}

/**
 * Work units in the order they should be handed out: each reference port with its secondary ports,
 * biggest first so the last unit to finish is a small one. A group bigger than an even share of the
 * stations is split (each part then computes the reference's datums again, which costs less than a
 * worker sitting idle). Ties keep the set's order, so the plan is the same on every run.
 */
export function workUnits(stations: readonly StationRef[], workers: number): string[][] {
  const groups = new Map<string, string[]>();
  for (const s of stations) {
    const key = s.kind === 'secondary' && s.reference !== undefined ? s.reference : s.id;
    const group = groups.get(key);
    if (group) group.push(s.id);
    else groups.set(key, [s.id]);
  }
  // A reference port listed after its secondaries still leads its group.
  const ordered = [...groups.entries()].map(([key, ids]) => (ids.includes(key) ? [key, ...ids.filter((id) => id !== key)] : ids));
  const share = Math.max(1, Math.ceil(stations.length / Math.max(1, workers)));
  const units: string[][] = [];
  for (const ids of ordered) {
    for (let i = 0; i < ids.length; i += share) units.push(ids.slice(i, i + share));
  }
  return units
    .map((ids, index) => ({ ids, index }))
    .sort((a, b) => b.ids.length - a.ids.length || a.index - b.index)
    .map((u) => u.ids);
}

/** The pool size: as asked, else one per core; never more than there are units of work, never zero. */
export function poolSize(requested: number | null, cores: number, units: number): number {
  const wanted = requested ?? Math.max(1, cores);
  return Math.max(1, Math.min(wanted, units));
}
