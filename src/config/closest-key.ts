/**
 * "Did you mean" suggestions: the closest candidate by optimal-string-alignment distance
 * (Damerau–Levenshtein with adjacent transpositions, each edit costing 1), compared without case.
 */

/** Edit distance with insertions, deletions, substitutions and adjacent transpositions. */
function editDistance(a: string, b: string): number {
  const n = a.length;
  const m = b.length;
  const width = m + 1;
  const d = new Uint32Array((n + 1) * width);
  for (let i = 0; i <= n; i++) d[i * width] = i;
  for (let j = 0; j <= m; j++) d[j] = j;
  for (let i = 1; i <= n; i++) {
    for (let j = 1; j <= m; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      let best = Math.min((d[(i - 1) * width + j] ?? 0) + 1, (d[i * width + j - 1] ?? 0) + 1, (d[(i - 1) * width + j - 1] ?? 0) + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) {
        best = Math.min(best, (d[(i - 2) * width + j - 2] ?? 0) + 1);
      }
      d[i * width + j] = best;
    }
  }
  return d[n * width + m] ?? 0;
}

/** Largest distance accepted for a word of this length: 1 up to 5 characters, 2 up to 8, then 3. */
function maxDistanceFor(length: number): number {
  if (length <= 5) return 1;
  return length <= 8 ? 2 : 3;
}

/**
 * The candidate closest to `key`, if its distance is small relative to the length (see
 * {@link maxDistanceFor}); ties go to the earlier candidate. Never returns `key` itself.
 */
export function closestKey(key: string, candidates: readonly string[]): string | undefined {
  const k = key.toLowerCase();
  let best: string | undefined;
  let bestDistance = Number.POSITIVE_INFINITY;
  for (const c of candidates) {
    if (c === key) continue;
    const dist = editDistance(k, c.toLowerCase());
    if (dist < bestDistance && dist <= maxDistanceFor(Math.max(key.length, c.length))) {
      best = c;
      bestDistance = dist;
    }
  }
  return best;
}
