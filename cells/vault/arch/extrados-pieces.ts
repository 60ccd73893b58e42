import type { Metres, Profile, Radians } from '../profile.js';
import type { Joint } from './types.js';
import { ringPoint } from './ring-point.js';
import { axisAngle } from './extrados-angle.js';

/** A stretch of extrados facing upwards, x increasing from `xa` to `xb` as τ goes `from` → `to`. */
export interface ExtradosPiece {
  from: number;
  to: number;
  xa: Metres;
  xb: Metres;
  /** Point (m), dx/dτ and dy/dτ at τ. */
  at(tau: number): { x: Metres; y: Metres; dx: number; dy: number };
}

/**
 * The upward-facing extrados of every voussoir, which is where fill and plan
 * loads bear. On a half the extrados is e(θ) = c(θ) + (t/2)·u(θ), with
 * dx/dθ = (R + t/2)·cos θ; only |θ| ≤ 90° faces upwards, so a horseshoe ring
 * carries nothing on the overhang. The keystone of a pointed ring bears on the
 * two extrados arcs, continued to where they meet on the axis (as in voussoirSections).
 * @param centreline ring centreline in the ring frame
 * @param joints joints from ringJoints
 * @param t ring thickness (m)
 * @returns per voussoir, its upward-facing pieces (possibly none)
 * @example extradosPieces(circularArc(5, Math.PI / 2), joints, 0.5)[0][0].xa // -5.25
 */
export function extradosPieces(centreline: Profile, joints: readonly Joint[], t: Metres): ExtradosPiece[][] {
  const half = Math.PI / 2;
  // Each joint's extrados end (angles past 90° clamped: the overhang of a horseshoe carries nothing).
  const ends = joints.map((j) => Math.min(Math.max(j.angle, -half), half));
  const xs = ends.map((th) => ringPoint(centreline, th, t / 2).x);
  const out: ExtradosPiece[][] = [];
  for (let i = 0; i + 1 < joints.length; i++) {
    const [a, b] = [ends[i]!, ends[i + 1]!];
    if (a < 0 && b > 0 && centreline.phiCrown > 0) {
      const top = axisAngle(centreline, t / 2);
      const xe = xs[i + 1]!;
      out.push([new CurvePiece(centreline, t, -b, -top, -xe, 0), new CurvePiece(centreline, t, top, b, 0, xe)]);
    } else {
      out.push(a < b ? [new CurvePiece(centreline, t, a, b, xs[i]!, xs[i + 1]!)] : []);
    }
  }
  return out;
}

class CurvePiece implements ExtradosPiece {
  constructor(readonly c: Profile, readonly t: Metres, readonly from: Radians, readonly to: Radians,
    readonly xa: Metres, readonly xb: Metres) {}
  at(th: Radians) {
    const p = ringPoint(this.c, th, this.t / 2);
    const r = this.c.radius(Math.abs(th)) + this.t / 2;
    return { x: p.x, y: p.y, dx: r * Math.cos(th), dy: -r * Math.sin(th) };
  }
}
