/**
 * The indices 0…m−1 in a reproducible random order: Fisher–Yates shuffle
 * (Knuth, TAOCP vol. 2, §3.4.2, Algorithm P) driven by the mulberry32
 * generator, so a given seed always gives the same order.
 * @param m how many indices
 * @param seed any 32-bit integer
 * @returns a permutation of 0…m−1
 * @example randomOrder(4, 1) // a fixed permutation of [0, 1, 2, 3]
 */
export function randomOrder(m: number, seed: number): number[] {
  const out = Array.from({ length: m }, (_, i) => i);
  let s = seed >>> 0;
  const next = () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = Math.imul(s ^ (s >>> 15), 1 | s);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  for (let i = m - 1; i > 0; i--) {
    const j = Math.floor(next() * (i + 1));
    [out[i], out[j]] = [out[j]!, out[i]!];
  }
  return out;
}
