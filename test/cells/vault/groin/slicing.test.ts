import { describe, it, expect } from 'vitest';
import { groinVault } from '../../../../cells/vault/groin/groin-vault.js';
import { archRing } from '../../../../cells/vault/arch/arch-ring.js';
import { archLimit } from '../../../../cells/vault/arch/arch-limit.js';
import { expectClose, numberField } from '../../../helpers/close.js';

/**
 * Heyman's slicing (Equilibrium of Shell Structures 1977; The Stone Skeleton 1995; from memory):
 * cut each web of the square round vault into arches parallel to its face arch. The slice at
 * distance y from the centre line is a circular ring of centreline radius R, springing from the
 * groins at |x| = y, i.e. half-angle asin(y/R), dy deep; the arch limit analysis gives its
 * reactions and its range of thrust. Midpoint slicing in y.
 */
function slices(R: number, t: number, gamma: number, n: number) {
  const dy = R / n, out: Array<{ y: number; V: number; Hmin?: number; Hmax?: number }> = [];
  for (let i = 0; i < n; i++) {
    const y = (i + 0.5) * dy, alpha = Math.asin(y / R);
    if (2 * (R - t / 2) * Math.sin(alpha) <= t) {
      // Too short to be a ring (span under the thickness): it hands its weight straight to the groins.
      out.push({ y, V: gamma * t * R * alpha * dy });
      continue;
    }
    const a = archLimit(archRing({ shape: 'circular', radius: R, half_angle: alpha, thickness: t, unit_weight: gamma, depth: dy, voussoirs: 60 }));
    out.push({ y, V: numberField(a.V_left), Hmin: numberField(a.H_min), Hmax: typeof a.H_max === 'number' && Number.isFinite(a.H_max) ? a.H_max : undefined });
  }
  return out;
}

describe('groinVault against the sliced webs (arch limit analysis of each slice)', () => {
  const R = 4, t = 0.6, gamma = 20e3, n = 16;
  // Clear span 2R − t puts the middle surface at radius R.
  const v = groinVault({ span_x: 2 * R - t, thickness: t, unit_weight: gamma });
  const s = slices(R, t, gamma, n);

  it('groinVault: the corner carries the same vertical load as the slices landing on its groin (within the slicing error)', () => {
    // One groin takes one end of every slice of the x-web and of the y-web beside it.
    const V = 2 * s.reduce((sum, x) => sum + x.V, 0);
    expectClose(V, v.V_corner, 5e-3);
  });

  it('groinVault: the membrane crown thrust gR fits the slices away from the face arch, not the full semicircle beside it', () => {
    const gR = gamma * t * R, dy = R / n;
    for (const x of s.filter((x) => x.Hmin !== undefined)) {
      expect(x.Hmin!).toBeLessThan(gR * dy);
      // Slices whose groins spring less than 60° from the crown can take the membrane thrust.
      if (x.y < R * Math.sin(Math.PI / 3)) expect(x.Hmax ?? Infinity).toBeGreaterThan(gR * dy);
    }
    // The last slice is nearly the whole semicircle: its greatest thrust is below gR,
    // so there the membrane state leans on the shear between slices (N_xφ).
    expect(s[n - 1]!.Hmax!).toBeLessThan(gR * (R / n));
  });

  it('groinVault: the least corner thrust of the sliced vault lies below the membrane one', () => {
    const Hmin = s.reduce((sum, x) => sum + (x.Hmin ?? 0), 0);
    expect(Hmin).toBeLessThan(v.H_corner_x);
    expect(Hmin).toBeGreaterThan(0.25 * v.H_corner_x);
  });
});
