// "Did you mean …?" for names a person typed: a case-insensitive exact match wins, otherwise the
// candidate with the smallest edit distance, if it is close enough to be a plausible typo.
import { itemAt } from '../item.js';

/** Edit distance with adjacent transpositions (optimal string alignment; Damerau 1964): form → from is 1. */
export function editDistance(a: string, b: string): number {
  const rows = a.length + 1;
  const cols = b.length + 1;
  const d = new Array<number>(rows * cols);
  for (let i = 0; i < rows; i++) d[i * cols] = i;
  for (let j = 0; j < cols; j++) d[j] = j;
  for (let i = 1; i < rows; i++) {
    for (let j = 1; j < cols; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      let best = Math.min(itemAt(d, (i - 1) * cols + j, 'd') + 1, itemAt(d, i * cols + j - 1, 'd') + 1, itemAt(d, (i - 1) * cols + j - 1, 'd') + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) best = Math.min(best, itemAt(d, (i - 2) * cols + j - 2, 'd') + 1);
      d[i * cols + j] = best;
    }
  }
  return itemAt(d, rows * cols - 1, 'd');
}

const MAX_TYPED = 100;

/** The candidate the user most likely meant, or undefined when nothing is close. */
export function nearestName(typed: string, candidates: Iterable<string>): string | undefined {
  if (typed.length > MAX_TYPED) return undefined; // no typo of a name is that long, and the distance would cost much
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
