/** Edit distance, for "did you mean" suggestions. */
function distance(a: string, b: string): number {
  const prev = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    let diag = prev[0]!;
    prev[0] = i;
    for (let j = 1; j <= b.length; j++) {
      const tmp = prev[j]!;
      prev[j] = Math.min(prev[j]! + 1, prev[j - 1]! + 1, diag + (a[i - 1] === b[j - 1] ? 0 : 1));
      diag = tmp;
    }
  }
  return prev[b.length]!;
}

/** The closest known name, if it is close enough to be a likely typo. */
export function suggestName(name: string, known: Iterable<string>): string | null {
  let best: string | null = null;
  let bestD = Infinity;
  const limit = name.length <= 3 ? 1 : name.length <= 6 ? 2 : 3;
  const lower = name.toLowerCase();
  for (const k of known) {
    if (Math.abs(k.length - name.length) > limit) continue; // the distance is at least the difference in length
    const d = distance(lower, k.toLowerCase());
    if (d < bestD && d <= limit && k !== name) { best = k; bestD = d; }
  }
  return best;
}
