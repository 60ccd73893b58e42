import type { Metres } from '../profile.js';
import type { ArchLoads, ArchRing, VerticalLoad } from './types.js';
import { gaussLegendre } from './gauss-legendre.js';
import { voussoirSections } from './voussoir-sections.js';
import { extradosPieces, type ExtradosPiece } from './extrados-pieces.js';

/** Resultant vertical loads per voussoir: `fixed` (self-weight, fill, dead) and `live` (live, point load). */
export interface VoussoirLoads {
  fixed: VerticalLoad[];
  live: VerticalLoad[];
}

/**
 * Vertical loads on each voussoir of the ring at thickness t (the frame and
 * load positions stay those of the ring as built, so t can be varied).
 * - self-weight γ·depth·A at the true centroid (voussoirSections);
 * - fill: the vertical column of fill between the upward-facing extrados and
 *   the fill level bears on that voussoir, at the column's centroid. This is
 *   the usual assumption that fill only loads, it neither spreads load nor
 *   gives passive resistance (Heyman, The Stone Skeleton, 1995, ch. 3 — from memory);
 * - dead and live per unit plan area over the extrados' plan projection;
 * - the point load on the voussoir whose extrados spans P_at.
 * @param ring the ring (centreline, joints, unit weight, depth)
 * @param t thickness (m)
 * @param loads validated loads (checkLoads)
 * @returns per voussoir, the fixed and live resultants (N at x in m)
 * @example voussoirLoads(ring, ring.thickness, {}).fixed.reduce((s, l) => s + l.W, 0) // ring.weight
 */
export function voussoirLoads(ring: ArchRing, t: Metres, loads: ArchLoads): VoussoirLoads {
  const g = ring.unit_weight * ring.depth;
  const sections = voussoirSections(ring.centreline, ring.joints, t, ring.centroids === 'centreline');
  const pieces = extradosPieces(ring.centreline, ring.joints, t);
  const x0 = -ring.span / 2;
  const liveFrom = loads.live_from === undefined ? -Infinity : x0 + loads.live_from;
  const liveTo = loads.live_to === undefined ? Infinity : x0 + loads.live_to;
  // A point load near a springing stays on the ring when a trial thickness narrows the extrados.
  const all = pieces.flat();
  let pointAt = loads.P ? clamp(x0 + (loads.P_at ?? ring.span / 2), all[0]!.xa, all[all.length - 1]!.xb) : NaN;
  const fixed: VerticalLoad[] = [];
  const live: VerticalLoad[] = [];
  sections.forEach((s, i) => {
    const f = new Resultant();
    const l = new Resultant();
    f.add(g * s.area, s.x);
    for (const piece of pieces[i]!) {
      if (loads.fill_unit_weight && loads.fill_level !== undefined) {
        const [w, wx] = fillColumn(piece, loads.fill_level);
        f.add(loads.fill_unit_weight * ring.depth * w, wx / (w || 1));
      }
      const { xa, xb } = piece;
      if (loads.dead) f.add(loads.dead * ring.depth * (xb - xa), (xa + xb) / 2);
      const la = Math.max(xa, liveFrom);
      const lb = Math.min(xb, liveTo);
      if (loads.live && lb > la) l.add(loads.live * ring.depth * (lb - la), (la + lb) / 2);
      if (pointAt >= xa && pointAt <= xb) {
        l.add(loads.P!, pointAt);
        pointAt = NaN;
      }
    }
    fixed.push(f.load());
    live.push(l.load());
  });
  return { fixed, live };
}

function clamp(x: number, lo: number, hi: number): number {
  return Math.min(Math.max(x, lo), hi);
}

/** Sum of parallel vertical forces and their moment about x = 0. */
class Resultant {
  W = 0;
  Wx = 0;
  add(W: number, x: number): void {
    this.W += W;
    this.Wx += W * x;
  }
  load(): VerticalLoad {
    return { W: this.W, x: this.W === 0 ? 0 : this.Wx / this.W };
  }
}

/** ∫ (h − y) dx and ∫ x (h − y) dx over the part of the piece below the fill level h (y is monotone on a piece). */
function fillColumn(piece: ExtradosPiece, h: Metres): [number, number] {
  let { from: a, to: b } = piece;
  const below = (tau: number) => piece.at(tau).y <= h;
  if (!below(a) && !below(b)) return [0, 0];
  if (below(a) !== below(b)) {
    let lo = a;
    let hi = b;
    for (let k = 0; k < 80; k++) {
      const mid = (lo + hi) / 2;
      if (below(mid) === below(a)) lo = mid;
      else hi = mid;
    }
    if (below(a)) b = lo;
    else a = hi;
  }
  let w = 0;
  let wx = 0;
  gaussLegendre(a, b, (s, g) => {
    const p = piece.at(s);
    w += g * (h - p.y) * p.dx;
    wx += g * p.x * (h - p.y) * p.dx;
  });
  return [w, wx];
}
