/**
 * Limit analysis of a masonry dome (spherical or pointed) cut into lunes, with hoop compression and no hoop tension.
 */
import { notAvailable, type NotAvailable } from '../../not-available.js';
import type { Dome } from './dome.js';
import type { DomeInput } from './options.js';
import { simplex, type StandardLp } from './simplex.js';

/** Rings (voussoir courses) of the lune from the top edge to the base, equal in angle. */
export const DOME_RINGS = 32;

export interface DomeLimit {
  /** Least thickness (m) for which a thrust surface fits, scaling the thickness about the fixed middle surface. */
  t_min: number | NotAvailable;
  /** Geometric factor of safety t / t_min; ∞ when a thrust surface fits however thin the shell. */
  gsf: number;
  /** Least and greatest horizontal thrust per metre of the base circle (N/m); not available when none fits. */
  H_min: number | NotAvailable; H_max: number | NotAvailable;
  /** Total hoop compression in the least-thrust state (N per radian of the circle). */
  hoop_min_state: number | NotAvailable;
  /** Line of thrust of a lune in the least-thrust state: points {r, z} where it cuts each joint (m), z above the base joint's centre. */
  thrust_min: Array<{ r: number; z: number }> | NotAvailable;
  safe: boolean;
}

interface Lune {
  lp: StandardLp;
  /** Index of the first hoop variable, and whether there is a crown thrust. */
  k0: number;
  rings: number;
  joint: Array<{ I: [number, number]; E: [number, number] }>;
}

/**
 * The lune programme at thickness 2h·a (lengths in units of a, forces in units of γa³ per radian).
 * Unknowns x ≥ 0: crown thrust H0 and u0 = H0·(z0 − z_lo) (closed crown only), then for each ring i
 * its hoop force F_i (compression, pushing the lune outwards) and u_i = F_i·(z_F − z_lo,i), the
 * height z_F of its line of action anywhere within the ring's section (u_i ≤ F_i·(z_hi − z_lo)).
 * At each joint the moment of everything above about the intrados point is ≤ 0 and about the
 * extrados point ≥ 0: the resultant crosses the joint within the thickness, in compression.
 */
function lune(d: DomeInput, h: number, rings: number): Lune {
  const closed = !d.open, k0 = closed ? 2 : 0, nv = k0 + 2 * rings;
  const phi = (i: number) => d.phiTop + ((d.phiBase - d.phiTop) * i) / rings;
  const g = d.gamma > 0 ? d.gamma : d.q / Math.max(d.t, 1e-9);
  const pTilde = d.p / (g * d.a), PTilde = d.P / (2 * Math.PI) / (g * d.a ** 3);
  const cube = ((1 + h) ** 3 - (1 - h) ** 3) / 3, quart = ((1 + h) ** 4 - (1 - h) ** 4) / 4, sq = 2 * h;
  // Offset of a pointed dome's meridian centre across the axis, in units of a (0 when spherical):
  // a point of the section is r = (1 + ζ)·sin φ − cc, z = (1 + ζ)·cos φ.
  const cc = d.c / d.a;
  const ring = Array.from({ length: rings }, (_, i) => {
    const a0 = phi(i), a1 = phi(i + 1);
    // ∫∫ r·(1 + ζ) dζ dφ and ∫∫ r²·(1 + ζ) dζ dφ over the course (volume and its moment about the axis, per radian).
    const S1 = Math.cos(a0) - Math.cos(a1), S2 = (a1 - a0) / 2 - (Math.sin(2 * a1) - Math.sin(2 * a0)) / 4;
    const W = S1 * cube - cc * (a1 - a0) * sq;
    const M = S2 * quart - 2 * cc * S1 * cube + cc * cc * (a1 - a0) * sq;
    const r0 = Math.sin(a0) - cc, r1 = Math.sin(a1) - cc;
    const Wp = (pTilde * (r1 * r1 - r0 * r0)) / 2;
    return { W, x: M / W, Wp, xp: Wp > 0 ? ((2 / 3) * (r1 ** 3 - r0 ** 3)) / (r1 * r1 - r0 * r0) : 0, zlo: (1 - h) * Math.cos(a1), zhi: (1 + h) * Math.cos(a0) };
  });
  const joint = Array.from({ length: rings + 1 }, (_, j) => {
    const s = Math.sin(phi(j)), c = Math.cos(phi(j));
    return { I: [(1 - h) * s - cc, (1 - h) * c] as [number, number], E: [(1 + h) * s - cc, (1 + h) * c] as [number, number] };
  });
  const A: number[][] = [], b: number[] = [];
  const rP = Math.sin(d.phiTop) - cc, zTop = Math.cos(d.phiTop);
  for (let j = 1; j <= rings; j++) {
    for (const [X, sign] of [[joint[j]!.I, 1], [joint[j]!.E, -1]] as const) {
      const [rX, zX] = X;
      const row = new Array<number>(nv).fill(0);
      let k = -PTilde * (rP - rX);
      if (closed) { row[0] = zX - (1 - h) * zTop; row[1] = -1; }
      for (let i = 0; i < j; i++) {
        const R = ring[i]!;
        row[k0 + 2 * i] = zX - R.zlo;
        row[k0 + 2 * i + 1] = -1;
        k -= R.W * (R.x - rX) + R.Wp * (R.xp - rX);
      }
      // sign·(row·x + k) ≤ 0
      A.push(row.map((v) => sign * v));
      b.push(-sign * k);
    }
  }
  const bound = (col: number, range: number) => {
    const row = new Array<number>(nv).fill(0);
    row[col + 1] = 1; row[col] = -range;
    A.push(row); b.push(0);
  };
  if (closed) bound(0, 2 * h * zTop);
  ring.forEach((R, i) => bound(k0 + 2 * i, R.zhi - R.zlo));
  return { lp: { A, b, c: new Array<number>(nv).fill(0) }, k0, rings, joint };
}

/** Horizontal thrust at the base: H0 + ΣF_i, as an objective. */
function baseThrust(l: Lune, sign: number): number[] {
  return l.lp.c.map((_, j) => (j === 0 && l.k0 === 2) || (j >= l.k0 && (j - l.k0) % 2 === 0) ? sign : 0);
}

/**
 * Limit analysis of a dome after Heyman (The Stone Skeleton, Cambridge 1995, ch. on the
 * dome; Equilibrium of Shell Structures, Oxford 1977): the dome is cut into lunes by meridian cracks
 * (no hoop tension); each lune is an arch of varying width that may be pushed outwards by hoop
 * compression, which can act anywhere within each course's section. By the safe theorem the dome
 * stands if some such state keeps every lune's line of thrust within its thickness; the states form
 * a polyhedron, so the least and greatest base thrust are linear programmes (solved by simplex.ts)
 * and the least thickness is found by bisection on the thickness about the fixed middle surface.
 * Heyman's hemisphere needs t/R ≈ 0.042 (from memory).
 * A pointed dome's closed apex is the radial joint through the apex of its middle surface, where the
 * two halves of each lune's pair meet (as the arch kernel cuts a pointed arch).
 * @param v a dome from dome(), with thickness and unit_weight
 * @returns t_min, gsf, H_min, H_max and the least-thrust line of a lune
 * @example domeLimit(dome({radius: 10, half_angle: Math.PI / 2, thickness: 0.6, unit_weight: 2e4})).gsf // ≈ 1.4
 */
export function domeLimit(v: Dome): DomeLimit {
  const d = v.model;
  if (!(d.t > 0)) throw new RangeError('dome_limit: the dome needs a thickness (and unit_weight)');
  // The programme is scaled by the shell's own weight (forces in units of γa³); a weightless shell has no scale.
  if (!(d.q > 0)) throw new RangeError(`dome_limit: the dome needs its self-weight (unit_weight, or g above zero), got g = ${d.q} Pa`);
  const rings = DOME_RINGS, a = d.a, g = d.gamma;
  const feasible = (h: number) => simplex(lune(d, h, rings).lp).status !== 'infeasible';
  // Bisection on the half-thickness ratio h = t/(2a): fitting is taken to be monotone in t.
  const h = d.t / (2 * a), cap = 0.45;
  let hi = h, lo = 1e-4;
  let tMin: number;
  if (feasible(lo)) tMin = 0;
  else {
    while (!feasible(hi)) {
      lo = hi;
      hi = Math.min(cap, hi * 1.6);
      if (lo >= cap) { hi = NaN; break; }
    }
    if (Number.isNaN(hi)) tMin = NaN;
    else {
      for (let i = 0; i < 40 && hi - lo > 1e-5 * hi; i++) {
        const mid = (lo + hi) / 2;
        if (feasible(mid)) hi = mid; else lo = mid;
      }
      tMin = 2 * hi * a;
    }
  }
  const l = lune(d, h, rings);
  const least = simplex({ ...l.lp, c: baseThrust(l, -1) });
  const rb = a * Math.sin(d.phiBase) - d.c, perMetre = (g * a ** 3) / rb;
  const none = 'no thrust surface fits within the dome: it is not safe at this thickness';
  if (least.status !== 'optimal') {
    return { t_min: Number.isNaN(tMin) ? notAvailable('no thickness up to 0.9 of the radius fits a thrust surface') : tMin, gsf: Number.isNaN(tMin) ? 0 : d.t / tMin, H_min: notAvailable(none), H_max: notAvailable(none), hoop_min_state: notAvailable(none), thrust_min: notAvailable(none), safe: false };
  }
  const most = simplex({ ...l.lp, c: baseThrust(l, 1) });
  const x = least.x;
  const hoop = x.reduce((s, xi, j) => (j >= l.k0 && (j - l.k0) % 2 === 0 ? s + xi : s), 0);
  return {
    t_min: tMin,
    gsf: tMin > 0 ? d.t / tMin : Infinity,
    H_min: -least.value * perMetre,
    H_max: most.status === 'optimal' ? most.value * perMetre : Infinity,
    hoop_min_state: hoop * g * a ** 3,
    thrust_min: thrustPoints(d, l, x),
    safe: true,
  };
}

/** Where the least-thrust resultant cuts each joint (m), from the moments about its two faces. */
function thrustPoints(d: DomeInput, l: Lune, x: number[]): Array<{ r: number; z: number }> {
  const a = d.a, zBase = Math.cos(d.phiBase);
  const rows = l.lp.A, out: Array<{ r: number; z: number }> = [];
  for (let j = 1; j <= l.rings; j++) {
    const mI = rows[2 * (j - 1)]!.reduce((s, v, k) => s + v * x[k]!, 0) - l.lp.b[2 * (j - 1)]!; // M_I ≤ 0
    const mE = -(rows[2 * (j - 1) + 1]!.reduce((s, v, k) => s + v * x[k]!, 0) - l.lp.b[2 * (j - 1) + 1]!); // M_E ≥ 0
    const s = mE - mI > 0 ? -mI / (mE - mI) : 0.5;
    const { I, E } = l.joint[j]!;
    out.push({ r: a * (I[0] + s * (E[0] - I[0])), z: a * (I[1] + s * (E[1] - I[1]) - zBase) });
  }
  return out;
}
