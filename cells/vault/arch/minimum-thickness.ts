import type { Metres } from '../profile.js';
import type { ArchLoads, ArchRing, GsfDefinition } from './types.js';
import type { LpSolver } from './seidel-lp.js';
import { solveAdmissible, BOX, type AdmissibleOptions } from './admissible-program.js';
import { thrustProgram, type ThrustProgram } from './thrust-program.js';
import { extradosAngle } from './extrados-angle.js';
import { ringPoint } from './ring-point.js';

/**
 * Least thickness of a ring about the same centreline for which a thrust
 * line fits; the geometric factor of safety is t / t_min. Two definitions:
 * - 'loads_as_built' (the default): every load — self-weight of the ring as
 *   built at its centroids, fill, surfacing, live — stays as it is and only
 *   the ring's bounds shrink about the centreline: t / t_min is the factor by
 *   which the thickness could be divided and still contain a line of thrust
 *   of the actual loads (Heyman, "The safety of masonry arches", Int. J. Mech.
 *   Sci. 11, 1969; The Masonry Arch, 1982, ch. 4 — from memory);
 * - 'ring_scaled': the ring is rebuilt at each trial thickness, its
 *   self-weight and centroids change with t and fill replaces the removed
 *   masonry (the minimum-thickness arch of Milankovitch, 1907, and of the
 *   published semicircle t/R = 0.1075 — from memory).
 *
 * t is the root of the fitting margin ρ(t): the largest ρ with
 * |M_j| + ρ·W·L ≤ N_j·t/2 at every section — an LP in (H, V, M0, ρ) at each
 * trial t, positive when a line fits with room to spare and negative when
 * none fits (fitting is taken to be monotone in t); friction and finite
 * strength, when given, hold in every trial. The root is bracketed
 * and closed by the Illinois variant of regula falsi (Dowell & Jarratt, BIT
 * 11, 1971), which keeps the bracket of plain bisection but needs far fewer
 * trials. Trial thicknesses stay below the span and twice the least
 * centreline radius (where the intrados folds over).
 * @param ring the ring
 * @param loads validated loads
 * @param solve the LP solver
 * @returns t_min (m) to a relative 1e-10, on the side where a line fits; undefined when no admissible thickness fits
 * @example minimumThickness(semicircle, {}, seidelLP) / 5 // ≈ 0.1075 for a centreline radius of 5 m
 */
export function minimumThickness(ring: ArchRing, loads: ArchLoads, solve: LpSolver,
  definition: GsfDefinition = ring.gsf_definition ?? 'loads_as_built'): Metres | undefined {
  const c = ring.centreline;
  let least = Infinity;
  for (let k = 0; k <= 64; k++) least = Math.min(least, c.radius(c.phiCrown + ((c.phiSpringing - c.phiCrown) * k) / 64));
  const cap = Math.min(ring.span, 2 * least) * (1 - 1e-9);
  const built = definition === 'loads_as_built' ? thrustProgram(ring, ring.thickness, loads) : undefined;
  const margin = (t: Metres): number => {
    const o: AdmissibleOptions = { margin: true };
    let p: ThrustProgram;
    if (built) [p, o.offsets] = [built, shrunkOffsets(ring, built, t)];
    else p = thrustProgram(ring, t, loads);
    const r = solveAdmissible(p, [0, 0, 0, 1], o, solve);
    return r.feasible ? r.x[3]! : -BOX;
  };
  // Bracket: [lo, hi] with no fit at lo and a fit at hi.
  let hi = Math.min(ring.thickness, cap);
  let fhi = margin(hi);
  let lo = hi;
  let flo = fhi;
  while (fhi < 0) {
    if (hi >= cap) return undefined;
    [lo, flo] = [hi, fhi];
    hi = Math.min(hi * 1.5, cap);
    fhi = margin(hi);
  }
  while (flo >= 0) {
    if (lo < 1e-9 * ring.span) return lo;
    [hi, fhi] = [lo, flo];
    lo /= 2;
    flo = margin(lo);
  }
  // Illinois: regula falsi that halves the weight of an end that stays put twice running.
  let side = 0;
  for (let k = 0; k < 200 && hi - lo > 1e-10 * hi; k++) {
    const t = Math.min(Math.max(hi - (fhi * (hi - lo)) / (fhi - flo), lo + 1e-3 * (hi - lo)), hi - 1e-3 * (hi - lo));
    const f = margin(t);
    // A margin of exactly zero (to the solver's precision) is the least thickness itself.
    if (f === 0) return t;
    if (f >= 0) {
      [hi, fhi] = [t, f];
      if (side === 1) flo /= 2;
      side = 1;
    } else {
      [lo, flo] = [t, f];
      if (side === -1) fhi /= 2;
      side = -1;
    }
  }
  return hi;
}

/** Extents of the sections of the ring as built within the ring shrunk to thickness t about the same centreline. */
function shrunkOffsets(ring: ArchRing, p: ThrustProgram, t: Metres): { down: number[]; up: number[] } {
  const down: number[] = [];
  const up: number[] = [];
  for (const s of p.joints) {
    if (s.kind === 'joint') {
      down.push(t / 2);
      up.push(t / 2);
      continue;
    }
    // A vertical cut: where its line meets the shrunk faces.
    const face = (d: number) => {
      const th = extradosAngle(ring.centreline, s.mid.x, d);
      return th === null ? s.mid.y + (d / ring.thickness) * (d > 0 ? 2 * s.up : 2 * s.down) : ringPoint(ring.centreline, th, d).y;
    };
    up.push(face(t / 2) - s.mid.y);
    down.push(s.mid.y - face(-t / 2));
  }
  return { down, up };
}
