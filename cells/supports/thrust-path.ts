/**
 * The line of thrust through a support: where the resultant of everything
 * above a horizontal section cuts that section, level by level.
 */
import type { Block } from './blocks.js';

export interface PathPoint {
  /** Level above the base (m). */
  z: number;
  /** Where the resultant cuts the section at z, from the outer toe of the base, positive towards the vault (m). */
  x: number;
}

/**
 * Resultant of the masonry above z, the vertical load V at x_V and the
 * thrust T at z_T (when z ≤ z_T, lever z_T − z), by moments about the inner
 * face: x_inner(z) = (Σ W·b/2 + V·x_V + T·(z_T − z)) / (Σ W + V). Statics of
 * the free body above the section (Heyman, The Stone Skeleton, 1995, on the
 * buttress; from memory). Levels: 24 equal divisions of the height, every
 * step and the thrust level, from the top down; a level with nothing above
 * it (the top when V = 0) is left out.
 * @param blocks the support from the base up
 * @param k unit weight × depth (N/m²)
 * @returns the points from the top down; the last is the base (z = 0)
 * @example thrustPath([{z0: 0, h: 6, b: 1}], 2e4, 0, 0, 1e4, 6)[24] // {z: 0, x: 0.5 − 1e4·6/(2e4·6)}
 */
export function thrustPath(blocks: Block[], k: number, V: number, xV: number, T: number, zT: number): PathPoint[] {
  const top = blocks[blocks.length - 1]!;
  const height = top.z0 + top.h, B = blocks[0]!.b;
  const levels = new Set<number>([zT, ...blocks.map((b) => b.z0)]);
  for (let i = 0; i <= 24; i++) levels.add((height * i) / 24);
  const points: PathPoint[] = [];
  for (const z of [...levels].sort((a, b) => b - a)) {
    let N = V, M = V * xV + T * Math.max(0, zT - z);
    for (const { z0, h, b } of blocks) {
      const above = Math.min(h, Math.max(0, z0 + h - z));
      N += k * above * b;
      M += (k * above * b * b) / 2;
    }
    if (N > 0) points.push({ z, x: B - M / N });
  }
  return points;
}
