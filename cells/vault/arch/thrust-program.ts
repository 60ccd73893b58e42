import type { Metres } from '../profile.js';
import type { ArchLoads, ArchRing, Section } from './types.js';
import { voussoirLoads } from './voussoir-loads.js';
import { liveActions } from './live-actions.js';
import { analysisSections } from './analysis-sections.js';

/**
 * Section actions as linear forms in the unknowns z = (h, v, m, ℓ), scaled
 * so that every coefficient is of order one: H = W·h, V = W·v, M0 = W·L·m
 * and λ·(total live) = W·ℓ, with W the total fixed vertical load and L the
 * span. Row j of nA/mA/tA (4 numbers) with nB/mB/tB gives N_j / W,
 * M_j / (W·L) and T_j / W.
 */
export interface ThrustProgram {
  /** Where admissibility is checked (joints and vertical cuts), along the ring. */
  joints: readonly Section[];
  t: Metres;
  W: number;
  L: Metres;
  live: number;
  nA: Float64Array;
  nB: Float64Array;
  mA: Float64Array;
  mB: Float64Array;
  tA: Float64Array;
  tB: Float64Array;
  /** Design strength × depth (N/m): f_c·b, Infinity for uncrushable masonry. */
  fb: number;
  /** Friction coefficient at the joints (Infinity: no sliding). */
  mu: number;
}

/**
 * Equilibrium of the part of the ring left of each section, for the three
 * redundants of a fixed-ended arch — the left springing reaction (H, V) and
 * its moment M0 about the springing joint's mid-point — and the live-load
 * multiplier λ. The left part carries the reaction and the loads left of
 * section j, so the force it passes on is
 *   F_j = (H + ΣFx_i, V − ΣW_i − λΣL_i)
 * and, about the section's mid-point m_j (moment of a force F at p: (p − m_j) × F),
 *   M_j = M0 + (m_0 − m_j) × (H, V) − Σ W_i (x_i − x_mj) − Σ Fx_i (y_i − y_mj) − λ Σ L_i (x_i − x_mj),
 *   N_j = F_j · n_j (normal, compression positive),  T_j = F_j · u_j (along the section),
 * all linear in (H, V, M0, λ) (Heyman, The Stone Skeleton, 1995, ch. 2–3;
 * Block & Ochsendorf, Lower-bound analysis of masonry vaults, SAHC 2008 — the
 * thrust-line construction written as equilibrium of the free body). A
 * vertical cut's body is its joint's plus the sliver between them
 * (analysisSections). The resultant crosses section j at e_j = −M_j / N_j
 * from the mid-point along u_j (towards the extrados when positive).
 * @param ring the ring
 * @param t thickness (m), the ring's own or a trial one for minimum thickness
 * @param loads validated loads
 * @returns the scaled forms for every section
 * @example thrustProgram(ring, ring.thickness, {}).W // ring.weight
 */
export function thrustProgram(ring: ArchRing, t: Metres, loads: ArchLoads): ThrustProgram {
  const acts = liveActions(ring, loads);
  const { joints, sections, base, extraA, extraAx } = analysisSections(ring, t, acts);
  const { fixed, live } = voussoirLoads(ring, t, loads, joints, acts);
  const W = fixed.reduce((s, l) => s + l.W, 0);
  const total = live.reduce((s, l) => s + l.W, 0);
  const L = ring.span;
  const J = joints.length;
  // Running sums left of each joint: Σ W_i / W, Σ W_i x_i / (W L), Σ Fx_i / W, Σ Fx_i y_i / (W L), and the live ones.
  const sums = Array.from({ length: J }, () => ({ w: 0, q: 0, f: 0, fy: 0, l: 0, ql: 0 }));
  for (let j = 1; j < J; j++) {
    const s = { ...sums[j - 1]! };
    const a = fixed[j - 1]!;
    s.w += a.W / W;
    s.q += (a.W * a.x) / (W * L);
    if (a.Fx) {
      s.f += a.Fx / W;
      s.fy += (a.Fx * a.y!) / (W * L);
    }
    if (total > 0) {
      s.l += live[j - 1]!.W / total;
      s.ql += (live[j - 1]!.W * live[j - 1]!.x) / (total * L);
    }
    sums[j] = s;
  }
  const S = sections.length;
  const [nA, mA, tA] = [new Float64Array(S * 4), new Float64Array(S * 4), new Float64Array(S * 4)];
  const [nB, mB, tB] = [new Float64Array(S), new Float64Array(S), new Float64Array(S)];
  const g = ring.unit_weight * ring.depth;
  const m0 = joints[0]!.mid;
  sections.forEach((sec, j) => {
    const s = sums[base[j]!]!;
    // A cut's sliver of ring, added to (or taken from) its joint's body.
    const w = s.w + (g * extraA[j]!) / W;
    const q = s.q + (g * extraAx[j]!) / (W * L);
    const { n, u, mid } = sec;
    const xm = mid.x / L;
    const ym = mid.y / L;
    const k = 4 * j;
    // F = (H + f·W, V − w·W − ℓ·l·W)
    nA[k] = n.x;
    nA[k + 1] = n.y;
    nA[k + 3] = -s.l * n.y;
    nB[j] = s.f * n.x - w * n.y;
    tA[k] = u.x;
    tA[k + 1] = u.y;
    tA[k + 3] = -s.l * u.y;
    tB[j] = s.f * u.x - w * u.y;
    mA[k] = -(m0.y - mid.y) / L;
    mA[k + 1] = (m0.x - mid.x) / L;
    mA[k + 2] = 1;
    mA[k + 3] = s.l * xm - s.ql;
    mB[j] = w * xm - q - s.fy + s.f * ym;
  });
  return { joints: sections, t, W, L, live: total, nA, nB, mA, mB, tA, tB, fb: ring.f_c * ring.depth, mu: ring.friction };
}
