import type { Metres } from '../profile.js';
import type { ArchLoads, ArchRing, Newtons } from './types.js';
import { ringPoint } from './ring-point.js';
import { extradosAngle } from './extrados-angle.js';

/** A point load at x (ring frame, m) and a uniform plan load q (N per m of plan, whole strip) on [xa, xb]. */
export interface LiveActions {
  points: { W: Newtons; x: Metres }[];
  patches: { q: number; xa: Metres; xb: Metres }[];
  /** Where a point or axle load spread through the fill, in words, for the result. */
  spread: string;
}

/**
 * The loads the multiplier λ scales, in the ring's frame: the live plan
 * load over [live_from, live_to], the point load P and the axles. With
 * `spread` s > 0 and fill, a point load on the road surface (the fill level)
 * spreads to the extrados as a uniform plan load over a width 2·s·d, d the
 * depth of fill over the extrados at the load (a 2 vertical : 1 horizontal
 * spread is s = 0.5, common practice); the part of a spread patch beyond the
 * ring's extrados goes straight into the abutment and is dropped, as are
 * axles off the ring. Spread depths use the ring as built.
 * @param ring the ring
 * @param loads validated loads
 * @returns point loads, plan-load patches, and a sentence on the spread
 * @example liveActions(ring, {P: 50e3, P_at: 2}).points // [{W: 50000, x: 2 - span/2}]
 */
export function liveActions(ring: ArchRing, loads: ArchLoads): LiveActions {
  const x0 = -ring.span / 2;
  const c = ring.centreline;
  const reach = ringPoint(c, Math.min(c.phiSpringing, Math.PI / 2), ring.thickness / 2).x;
  const out: LiveActions = { points: [], patches: [], spread: '' };
  if (loads.live) {
    const xa = Math.max(loads.live_from === undefined ? -reach : x0 + loads.live_from, -reach);
    const xb = Math.min(loads.live_to === undefined ? reach : x0 + loads.live_to, reach);
    if (xb > xa) out.patches.push({ q: loads.live * ring.depth, xa, xb });
  }
  const wheels = [...(loads.P ? [{ W: loads.P, at: loads.P_at! }] : []), ...(loads.axles ?? [])];
  const s = loads.spread ?? 0;
  const fill = loads.fill_level !== undefined && (loads.fill_unit_weight ?? 0) > 0 ? loads.fill_level : undefined;
  let spread = 0;
  for (const w of wheels) {
    const x = x0 + w.at;
    if (!(w.W > 0) || Math.abs(x) > reach) continue;
    const th = extradosAngle(c, x, ring.thickness / 2);
    const depth = fill === undefined || th === null ? 0 : Math.max(0, fill - ringPoint(c, th, ring.thickness / 2).y);
    if (s > 0 && depth > 0) {
      const half = s * depth;
      spread = Math.max(spread, depth);
      const [xa, xb] = [Math.max(x - half, -reach), Math.min(x + half, reach)];
      out.patches.push({ q: w.W / (2 * half), xa, xb });
    } else {
      out.points.push({ W: w.W, x });
    }
  }
  out.spread = wheels.length === 0 ? 'no point or axle loads'
    : s > 0 && spread > 0 ? `point and axle loads spread through the fill at ${s} horizontal per unit depth (each over 2·${s}·d, d the fill over the extrados at the load, up to ${spread.toFixed(3)} m)`
      : s > 0 ? 'point and axle loads act on the extrados: no fill over it to spread through'
        : 'no spread: point and axle loads act on the extrados at a point (conservative)';
  return out;
}
