// "Did you mean …?" for names a person typed: a case-insensitive exact match wins, otherwise the
// candidate with the smallest edit distance, if it is close enough to be a plausible typo.

/** Levenshtein distance (Levenshtein 1966), two-row dynamic programme. */
export function editDistance(a: string, b: string): number {
  let prev = new Array<number>(b.length + 1);
  let curr = new Array<number>(b.length + 1);
  for (let j = 0; j <= b.length; j++) prev[j] = j;
  for (let i = 1; i <= a.length; i++) {
    curr[0] = i;
    for (let j = 1; j <= b.length; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      curr[j] = Math.min(prev[j]! + 1, curr[j - 1]! + 1, prev[j - 1]! + cost);
    }
    [prev, curr] = [curr, prev];
  }
  return prev[b.length]!;
}

/** The candidate the user most likely meant, or undefined when nothing is close. */
export function nearestName(typed: string, candidates: Iterable<string>): string | undefined {
  const lower = typed.toLowerCase();
  let best: string | undefined;
  let bestDistance = Infinity;
  let bestExact = Infinity;
  for (const candidate of candidates) {
    const candidateLower = candidate.toLowerCase();
    if (candidateLower === lower) return candidate;
    const d = editDistance(lower, candidateLower);
    // Ties go to the candidate closer with capitals kept (SS2 → S2 rather than Ssa).
    const exact = d <= bestDistance ? editDistance(typed, candidate) : Infinity;
    if (d < bestDistance || (d === bestDistance && exact < bestExact)) {
      best = candidate;
      bestDistance = d;
      bestExact = exact;
    }
  }
  // Short names tolerate one slip, longer ones about a third of their length.
  const allowed = Math.max(1, Math.floor(Math.min(typed.length, best?.length ?? 0) / 3));
  return bestDistance <= allowed ? best : undefined;
}
