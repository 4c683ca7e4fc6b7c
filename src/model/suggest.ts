// "Did you mean" for misspelt field names and ids, by edit distance (Levenshtein, 1966).

export function editDistance(a: string, b: string): number {
  if (a === b) return 0;
  let previous = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const current = [i];
    for (let j = 1; j <= b.length; j++) {
      const substitution = previous[j - 1] + (a[i - 1] === b[j - 1] ? 0 : 1);
      current[j] = Math.min(previous[j] + 1, current[j - 1] + 1, substitution);
    }
    previous = current;
  }
  return previous[b.length];
}

/** The closest candidate within a distance that still reads as a typo, or undefined. */
export function closest(word: string, candidates: Iterable<string>): string | undefined {
  // A word this long is no typo of a field name or id, and its edit distance would be slow to find.
  if (word.length > 100) return undefined;
  const lower = word.toLowerCase();
  const limit = Math.max(1, Math.floor(word.length / 3));
  let best: string | undefined;
  let bestDistance = Infinity;
  for (const candidate of candidates) {
    // The distance is at least the difference in length: skip what cannot be close.
    if (Math.abs(candidate.length - word.length) > limit) continue;
    const distance = candidate.toLowerCase() === lower ? 0 : editDistance(lower, candidate.toLowerCase());
    if (distance < bestDistance) {
      best = candidate;
      bestDistance = distance;
    }
  }
  return bestDistance <= limit ? best : undefined;
}
