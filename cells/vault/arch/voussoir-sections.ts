import type { Metres, Point, Profile } from '../profile.js';
import type { Joint } from './types.js';
import { gaussLegendre } from './gauss-legendre.js';
import { ringPoint } from './ring-point.js';
import { axisAngle } from './extrados-angle.js';

/** Area (m^2, per metre depth) and centroid (m) of one voussoir. */
export interface VoussoirSection {
  area: number;
  x: Metres;
  y: Metres;
}

/**
 * Area and true centroid of every voussoir of a ring of thickness t.
 *
 * In (θ, d) coordinates a point is c(θ) + d·u(θ), with c the centreline and
 * u = (sin θ, cos θ) its normal; since dc/dθ = R·(cos θ, −sin θ) and
 * du/dθ = (cos θ, −sin θ), the area element is (R + d) dθ dd (Jacobian of the
 * parallel-curve map, e.g. do Carmo, Differential Geometry of Curves and
 * Surfaces, §1-5). Integrating d over [−t/2, t/2]:
 *   A = t·∫ R dθ,   A·centroid = t·∫ R·c dθ + t³/12·∫ u dθ,
 * so the centroid sits outside the centreline by the t³/12 term, which the
 * "weight on the centreline" model (onCentreline = true) leaves out. The
 * θ-integrals do not depend on t: they are done once per set of joints by
 * Gauss–Legendre and kept. The keystone of a pointed ring (between the joints
 * at ±phiCrown, which cross at the centreline's apex) is bounded by its two
 * joints and the true arcs of intrados and extrados continued to the axis,
 * sampled finely (shoelace formula; the self-crossing outline subtracts the
 * part below the apex that both neighbouring voussoirs already count).
 * @param centreline ring centreline in the ring frame
 * @param joints joints from ringJoints
 * @param t ring thickness (m)
 * @param onCentreline take each centroid on the centreline (published simplified model)
 * @returns one section per voussoir, left to right
 * @example voussoirSections(circularArc(5, Math.PI / 2), joints, 0.5)[0].area // 0.5·5·Δθ
 */
export function voussoirSections(centreline: Profile, joints: readonly Joint[], t: Metres, onCentreline = false): VoussoirSection[] {
  const basis = integrals(centreline, joints);
  const k = onCentreline ? 0 : t ** 3 / 12;
  return basis.map((v, i) => {
    if (v === null) return keystone(centreline, joints[i + 1]!.angle, t);
    return { area: t * v.R, x: (t * v.Rx + k * v.ux) / (t * v.R), y: (t * v.Ry + k * v.uy) / (t * v.R) };
  });
}

interface Integrals { R: number; Rx: number; Ry: number; ux: number; uy: number }

/** Per centreline, the integrals of each voussoir met so far, keyed by its two joint angles (joints inserted under loads reuse the rest). */
const CACHE = new WeakMap<Profile, Map<string, Integrals | null>>();

/** ∫R, ∫R·c and ∫u over each voussoir (null for a pointed ring's keystone). */
function integrals(c: Profile, joints: readonly Joint[]): (Integrals | null)[] {
  let cache = CACHE.get(c);
  if (!cache) CACHE.set(c, (cache = new Map()));
  return joints.slice(1).map((jb, i) => {
    const a = joints[i]!.angle;
    const b = jb.angle;
    const key = `${a},${b}`;
    const hit = cache.get(key);
    if (hit !== undefined) return hit;
    const v = voussoirIntegrals(c, a, b);
    cache.set(key, v);
    return v;
  });
}

function voussoirIntegrals(c: Profile, a: number, b: number): Integrals | null {
  {
    if (a < 0 && b > 0 && c.phiCrown > 0) return null;
    const s = { R: 0, Rx: 0, Ry: 0, ux: 0, uy: 0 };
    gaussLegendre(a, b, (th, w) => {
      const R = c.radius(Math.abs(th));
      const p = ringPoint(c, th, 0);
      s.R += w * R;
      s.Rx += w * R * p.x;
      s.Ry += w * R * p.y;
      s.ux += w * Math.sin(th);
      s.uy += w * Math.cos(th);
    });
    return s;
  }
}

/**
 * Keystone of a pointed ring: the outline B → (intrados arc) → I_r → E_r →
 * (extrados arc) → T → E_l → I_l → (intrados arc) → B, with B and T where the
 * right-hand intrados and extrados arcs, continued, meet the axis (x̄ = 0 by symmetry).
 */
function keystone(c: Profile, phi: number, t: Metres): VoussoirSection {
  const n = 64;
  const arc = (d: number, from: number, to: number): Point[] =>
    Array.from({ length: n + 1 }, (_, k) => ringPoint(c, from + ((to - from) * k) / n, d));
  const mirror = (p: Point): Point => ({ x: -p.x, y: p.y });
  const lower = arc(-t / 2, axisAngle(c, -t / 2), phi); // B … I_r
  const upper = arc(t / 2, phi, axisAngle(c, t / 2)); // E_r … T
  const poly = [...lower, ...upper, ...[...upper].reverse().map(mirror), ...[...lower].reverse().map(mirror)];
  let A = 0;
  let Sy = 0;
  poly.forEach((p, k) => {
    const q = poly[(k + 1) % poly.length]!;
    const cross = p.x * q.y - q.x * p.y;
    A += cross / 2;
    Sy += ((p.y + q.y) * cross) / 6;
  });
  return { area: A, x: 0, y: A === 0 ? lower[n]!.y : Sy / A };
}
