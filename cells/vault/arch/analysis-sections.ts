import type { Metres, Profile } from '../profile.js';
import type { ArchRing, Joint, Section } from './types.js';
import type { LiveActions } from './live-actions.js';
import { ringPoint } from './ring-point.js';
import { extradosAngle } from './extrados-angle.js';
import { gaussLegendre } from './gauss-legendre.js';

/** The voussoir joints of one analysis and the sections where admissibility is checked. */
export interface AnalysisSections {
  /** The ring's joints with one more wherever the extrados meets a point load or the end of a patch load. */
  joints: Joint[];
  /** Every joint as a section, each vertical cut right after the joint it hangs from. */
  sections: Section[];
  /** For each section: the joint whose left-hand body it starts from. */
  base: number[];
  /** Signed area (m²) and first moment ∫x dA (m³) of ring added to that body (the sliver between joint and cut). */
  extraA: number[];
  extraAx: number[];
}

/**
 * Where the analysis checks the line of thrust. A point load makes the line
 * of thrust kink on the load's vertical line, possibly between two joints,
 * where joint checks alone miss it (λ then comes out too high). So:
 * - a joint is inserted where the extrados meets each point load and each
 *   end of a patch load (the loads then split exactly at joints);
 * - a vertical cut at each point load checks the kink itself: the free body
 *   left of the cut is the body left of the inserted joint θe plus (right
 *   half) or minus (left half) the sliver of ring between that joint and the
 *   vertical line, ∫∫ (R + d) dθ dd over θ from θe to θ_P(d) (signed), the
 *   load's own line passing through the cut adds no moment there. Any cut of
 *   a no-tension continuum must carry its resultant within it (Heyman, The
 *   Stone Skeleton, 1995, ch. 2 — from memory), so this is the continuous
 *   admissibility of the line of thrust at the kink.
 * A cut is left out where the vertical line leaves the ring through a
 * springing joint or lies in the keystone of a pointed ring.
 * @param ring the ring
 * @param t thickness (m)
 * @param live the multiplied loads (liveActions)
 * @returns joints, sections and the slivers' geometry
 * @example analysisSections(ring, ring.thickness, {points: [], patches: [], spread: ''}).joints === ring.joints
 */
export function analysisSections(ring: ArchRing, t: Metres, live: LiveActions): AnalysisSections {
  const c = ring.centreline;
  const base = ring.joints;
  const at = [...live.points.map((p) => p.x), ...live.patches.flatMap((p) => [p.xa, p.xb])];
  const extra: number[] = [];
  for (const x of at) {
    const th = extradosAngle(c, x, t / 2);
    if (th === null || Math.abs(th) >= c.phiSpringing - 1e-12) continue;
    if (base.some((j) => Math.abs(j.angle - th) < 1e-9) || extra.some((a) => Math.abs(a - th) < 1e-9)) continue;
    extra.push(th);
  }
  const joints: Joint[] = extra.length === 0 ? [...base] : [...base, ...extra.map((a) => jointAt(c, a))].sort((p, q) => p.angle - q.angle);
  const sections: Section[] = [];
  const owner: number[] = [];
  const extraA: number[] = [];
  const extraAx: number[] = [];
  const cuts = live.points.map((p) => cutAt(c, t, p.x)).filter((k): k is Cut => k !== null);
  joints.forEach((j, k) => {
    sections.push({ ...j, kind: 'joint', down: t / 2, up: t / 2, angleDown: j.angle, angleUp: j.angle });
    owner.push(k);
    extraA.push(0);
    extraAx.push(0);
    for (const cut of cuts) {
      if (Math.abs(cut.theta - j.angle) > 1e-9) continue;
      sections.push(cut.section);
      owner.push(k);
      extraA.push(cut.A);
      extraAx.push(cut.Ax);
    }
  });
  return { joints, sections, base: owner, extraA, extraAx };
}

/** A joint normal to the centreline at θ. */
export function jointAt(c: Profile, angle: number): Joint {
  return { angle, mid: ringPoint(c, angle, 0), u: { x: Math.sin(angle), y: Math.cos(angle) }, n: { x: Math.cos(angle), y: -Math.sin(angle) } };
}

interface Cut { theta: number; section: Section; A: number; Ax: number }

/** The vertical cut at x: extents on the line, and the sliver between it and the joint θe through its extrados end. */
function cutAt(c: Profile, t: Metres, x: Metres): Cut | null {
  const theta = (d: number) => extradosAngle(c, x, d);
  const [te, ti, tm] = [theta(t / 2), theta(-t / 2), theta(0)];
  if (te === null || ti === null || tm === null) return null;
  if (Math.max(Math.abs(te), Math.abs(ti)) >= Math.min(c.phiSpringing, Math.PI / 2) - 1e-12) return null;
  let A = 0;
  let Ax = 0;
  let ok = true;
  gaussLegendre(-t / 2, t / 2, (d, wd) => {
    const tp = theta(d);
    if (tp === null) return void (ok = false);
    gaussLegendre(te, tp, (th, w) => {
      const jac = c.radius(Math.abs(th)) + d;
      A += wd * w * jac;
      Ax += wd * w * jac * ringPoint(c, th, d).x;
    });
  });
  if (!ok) return null;
  const yRef = ringPoint(c, tm, 0).y;
  const section: Section = {
    kind: 'cut', angle: tm, mid: { x, y: yRef }, u: { x: 0, y: 1 }, n: { x: 1, y: 0 },
    up: ringPoint(c, te, t / 2).y - yRef, down: yRef - ringPoint(c, ti, -t / 2).y, angleUp: te, angleDown: ti,
  };
  return { theta: te, section, A, Ax };
}
