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
  // Self-weight alone needs no extrados.
  const bare = !loads.fill_unit_weight && !loads.dead && !loads.live && !loads.P;
  const pieces = bare ? sections.map(() => []) : extradosPieces(ring.centreline, ring.joints, t);
  const x0 = -ring.span / 2;
  const liveFrom = loads.live_from === undefined ? -Infinity : x0 + loads.live_from;
  const liveTo = loads.live_to === undefined ? Infinity : x0 + loads.live_to;
  // A point load near a springing stays on the ring when a trial thickness narrows the extrados.
  let pointAt = NaN;
  if (loads.P) {
    const loaded = pieces.filter((p) => p.length > 0);
    const [first, last] = [loaded[0]![0]!, loaded[loaded.length - 1]!.at(-1)!];
    pointAt = clamp(x0 + (loads.P_at ?? ring.span / 2), first.xa, last.xb);
  }
  const fixed: VerticalLoad[] = [];
  const live: VerticalLoad[] = [];
  const fillWeight = loads.fill_unit_weight && loads.fill_level !== undefined ? loads.fill_unit_weight * ring.depth : 0;
  for (let i = 0; i < sections.length; i++) {
    // Resultants as sums of forces (W) and of their moments about x = 0 (M).
    let fW = g * sections[i]!.area;
    let fM = fW * sections[i]!.x;
    let lW = 0;
    let lM = 0;
    for (let k = 0; k < pieces[i]!.length; k++) {
      const piece = pieces[i]![k]!;
      const { xa, xb } = piece;
      if (fillWeight) {
        const column = fillColumn(piece, loads.fill_level!);
        fW += fillWeight * column.area;
        fM += fillWeight * column.moment;
      }
      if (loads.dead) {
        fW += loads.dead * ring.depth * (xb - xa);
        fM += (loads.dead * ring.depth * (xb - xa) * (xa + xb)) / 2;
      }
      const la = Math.max(xa, liveFrom);
      const lb = Math.min(xb, liveTo);
      if (loads.live && lb > la) {
        lW += loads.live * ring.depth * (lb - la);
        lM += (loads.live * ring.depth * (lb - la) * (la + lb)) / 2;
      }
      if (pointAt >= xa && pointAt <= xb) {
        lW += loads.P!;
        lM += loads.P! * pointAt;
        pointAt = NaN;
      }
    }
    fixed.push({ W: fW, x: fW === 0 ? 0 : fM / fW });
    live.push({ W: lW, x: lW === 0 ? 0 : lM / lW });
  }
  return { fixed, live };
}

function clamp(x: number, lo: number, hi: number): number {
  return Math.min(Math.max(x, lo), hi);
}

/** ∫ (h − y) dx and ∫ x·(h − y) dx over the part of the piece below the fill level h (y is monotone on a piece). */
function fillColumn(piece: ExtradosPiece, h: Metres): { area: number; moment: number } {
  let { from: a, to: b } = piece;
  const below = (tau: number) => piece.at(tau).y <= h;
  if (!below(a) && !below(b)) return { area: 0, moment: 0 };
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
  const column = { area: 0, moment: 0 };
  gaussLegendre(a, b, (s, g) => {
    const p = piece.at(s);
    column.area += g * (h - p.y) * p.dx;
    column.moment += g * p.x * (h - p.y) * p.dx;
  });
  return column;
}
