import type { Metres } from '../profile.js';
import type { ArchLoads, ArchRing, Joint } from './types.js';
import { voussoirLoads } from './voussoir-loads.js';

/**
 * Joint actions as linear forms in the unknowns z = (h, v, m, ℓ), scaled so
 * that every coefficient is of order one: H = W·h, V = W·v, M0 = W·L·m and
 * λ·(total live) = W·ℓ, with W the total fixed load and L the span. Row j of
 * nA/mA (4 numbers) with nB/mB gives N_j / W and M_j / (W·L).
 */
export interface ThrustProgram {
  joints: readonly Joint[];
  t: Metres;
  W: number;
  L: Metres;
  live: number;
  nA: Float64Array;
  nB: Float64Array;
  mA: Float64Array;
  mB: Float64Array;
}

/**
 * Equilibrium of the part of the ring left of each joint, for the three
 * redundants of a fixed-ended arch — the left springing reaction (H, V) and
 * its moment M0 about the springing joint's mid-point — and the live-load
 * multiplier λ. The left part carries the reaction and the voussoir loads left
 * of joint j, so the force it passes on is F_j = (H, V − ΣW_i − λΣL_i) and,
 * about the joint mid-point m_j,
 *   M_j = M0 + (m_0 − m_j) × (H, V) − Σ W_i (x_i − x_mj) − λ Σ L_i (x_i − x_mj),
 *   N_j = F_j · n_j   (n_j the centreline tangent),
 * all linear in (H, V, M0, λ) (Heyman, The Stone Skeleton, 1995, ch. 2–3;
 * Block & Ochsendorf, Lower-bound analysis of masonry vaults, SAHC 2008 — the
 * thrust-line construction written as equilibrium of the free body).
 * The resultant crosses the joint at e_j = −M_j / N_j from the mid-point,
 * towards the extrados when positive.
 * @param ring the ring
 * @param t thickness (m), the ring's own or a trial one for minimum thickness
 * @param loads validated loads
 * @returns the scaled forms for every joint
 * @example thrustProgram(ring, ring.thickness, {}).W // ring.weight
 */
export function thrustProgram(ring: ArchRing, t: Metres, loads: ArchLoads): ThrustProgram {
  const { fixed, live } = voussoirLoads(ring, t, loads);
  const joints = ring.joints;
  const W = fixed.reduce((s, l) => s + l.W, 0);
  const total = live.reduce((s, l) => s + l.W, 0);
  const L = ring.span;
  const J = joints.length;
  const nA = new Float64Array(J * 4);
  const nB = new Float64Array(J);
  const mA = new Float64Array(J * 4);
  const mB = new Float64Array(J);
  const m0 = joints[0]!.mid;
  let w = 0; // Σ W_i / W left of the joint
  let q = 0; // Σ W_i x_i / (W L)
  let l = 0; // Σ L_i / total live
  let ql = 0; // Σ L_i x_i / (total live · L)
  joints.forEach((jt, j) => {
    if (j > 0) {
      w += fixed[j - 1]!.W / W;
      q += (fixed[j - 1]!.W * fixed[j - 1]!.x) / (W * L);
      if (total > 0) {
        l += live[j - 1]!.W / total;
        ql += (live[j - 1]!.W * live[j - 1]!.x) / (total * L);
      }
    }
    const s = Math.sin(jt.angle);
    const xm = jt.mid.x / L;
    const k = 4 * j;
    nA[k] = Math.cos(jt.angle);
    nA[k + 1] = -s;
    nA[k + 3] = l * s;
    nB[j] = w * s;
    mA[k] = -(m0.y - jt.mid.y) / L;
    mA[k + 1] = (m0.x - jt.mid.x) / L;
    mA[k + 2] = 1;
    mA[k + 3] = l * xm - ql;
    mB[j] = w * xm - q;
  });
  return { joints, t, W, L, live: total, nA, nB, mA, mB };
}
