import type { Metres } from '../profile.js';
import type { ArchLoads, ArchRing, Joint, VerticalLoad } from './types.js';
import { liveActions, type LiveActions } from './live-actions.js';
import { gaussLegendre } from './gauss-legendre.js';
import { voussoirSections } from './voussoir-sections.js';
import { extradosPieces, type ExtradosPiece } from './extrados-pieces.js';

/** Resultant loads per voussoir: `fixed` (self-weight, fill, dead, fill pressure) and `live` (multiplied by λ). */
export interface VoussoirLoads {
  fixed: VerticalLoad[];
  live: VerticalLoad[];
}

/**
 * Loads on each voussoir of the ring at thickness t (the frame and load
 * positions stay those of the ring as built, so t can be varied).
 * - self-weight γ·depth·A at the true centroid (voussoirSections);
 * - fill: the vertical column of fill between the upward-facing extrados and
 *   the fill level bears on that voussoir, at the column's centroid (the usual
 *   assumption that fill loads the ring and gives no passive resistance:
 *   Heyman, The Stone Skeleton, 1995, ch. 3 — from memory);
 * - with `fill_pressure` k: a horizontal pressure k·γ_fill·(h − y) on the
 *   extrados below the fill level h, pushing towards the crown on each half
 *   (at rest or a fraction of passive, as the engineer chooses: common practice);
 * - dead per unit plan area over the extrados' plan projection;
 * - the multiplied loads (liveActions): patches over their plan length, point
 *   loads on the voussoir whose extrados spans them.
 * @param ring the ring (centreline, unit weight, depth)
 * @param t thickness (m)
 * @param loads validated loads (checkLoads)
 * @param joints the voussoirs' joints (the ring's own, or those of analysisSections)
 * @param live the multiplied loads (default: liveActions(ring, loads))
 * @returns per voussoir, the fixed and live resultants (N at x, y in m)
 * @example voussoirLoads(ring, ring.thickness, {}).fixed.reduce((s, l) => s + l.W, 0) // ring.weight
 */
export function voussoirLoads(ring: ArchRing, t: Metres, loads: ArchLoads, joints: readonly Joint[] = ring.joints,
  live: LiveActions = liveActions(ring, loads)): VoussoirLoads {
  const g = ring.unit_weight * ring.depth;
  const sections = voussoirSections(ring.centreline, joints, t, ring.centroids === 'centreline');
  // Self-weight alone needs no extrados.
  const bare = !loads.fill_unit_weight && !loads.dead && live.points.length === 0 && live.patches.length === 0;
  const pieces = bare ? sections.map(() => []) : extradosPieces(ring.centreline, joints, t);
  // A point load near a springing stays on the ring when a trial thickness narrows the extrados.
  const points = live.points.map((p) => ({ ...p }));
  if (points.length) {
    const loaded = pieces.filter((p) => p.length > 0);
    const [first, last] = [loaded[0]![0]!, loaded[loaded.length - 1]!.at(-1)!];
    for (const p of points) p.x = clamp(p.x, first.xa, last.xb);
  }
  const fixed: VerticalLoad[] = [];
  const out: VerticalLoad[] = [];
  const fillWeight = loads.fill_unit_weight && loads.fill_level !== undefined ? loads.fill_unit_weight * ring.depth : 0;
  const pressure = fillWeight * (loads.fill_pressure ?? 0);
  for (let i = 0; i < sections.length; i++) {
    // Resultants as sums of forces (W, Fx) and of their moments (W·x, Fx·y).
    let fW = g * sections[i]!.area;
    let fM = fW * sections[i]!.x;
    let fX = 0;
    let fXy = 0;
    let lW = 0;
    let lM = 0;
    for (let k = 0; k < pieces[i]!.length; k++) {
      const piece = pieces[i]![k]!;
      const { xa, xb } = piece;
      if (fillWeight) {
        const column = fillColumn(piece, loads.fill_level!);
        fW += fillWeight * column.area;
        fM += fillWeight * column.moment;
        if (pressure) {
          // Towards the crown: +x on the left half, −x on the right.
          const sign = xa + xb < 0 ? 1 : -1;
          fX += sign * pressure * column.side;
          fXy += sign * pressure * column.sideMoment;
        }
      }
      if (loads.dead) {
        fW += loads.dead * ring.depth * (xb - xa);
        fM += (loads.dead * ring.depth * (xb - xa) * (xa + xb)) / 2;
      }
      for (const patch of live.patches) {
        const la = Math.max(xa, patch.xa);
        const lb = Math.min(xb, patch.xb);
        if (lb > la) {
          lW += patch.q * (lb - la);
          lM += (patch.q * (lb - la) * (la + lb)) / 2;
        }
      }
      for (const p of points) {
        if (p.x >= xa && p.x <= xb) {
          lW += p.W;
          lM += p.W * p.x;
          p.x = NaN;
        }
      }
    }
    fixed.push({ W: fW, x: fW === 0 ? 0 : fM / fW, ...(fX !== 0 ? { Fx: fX, y: fXy / fX } : {}) });
    out.push({ W: lW, x: lW === 0 ? 0 : lM / lW });
  }
  return { fixed, live: out };
}

function clamp(x: number, lo: number, hi: number): number {
  return Math.min(Math.max(x, lo), hi);
}

/**
 * ∫ (h − y) dx, ∫ x·(h − y) dx, and for the side pressure ∫ (h − y) |dy| and ∫ y·(h − y) |dy|, over the
 * part of the piece below the fill level h (y is monotone on a piece).
 */
function fillColumn(piece: ExtradosPiece, h: Metres): { area: number; moment: number; side: number; sideMoment: number } {
  let { from: a, to: b } = piece;
  const below = (tau: number) => piece.at(tau).y <= h;
  if (!below(a) && !below(b)) return { area: 0, moment: 0, side: 0, sideMoment: 0 };
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
  const column = { area: 0, moment: 0, side: 0, sideMoment: 0 };
  gaussLegendre(a, b, (s, g) => {
    const p = piece.at(s);
    column.area += g * (h - p.y) * p.dx;
    column.moment += g * p.x * (h - p.y) * p.dx;
    column.side += g * (h - p.y) * Math.abs(p.dy);
    column.sideMoment += g * p.y * (h - p.y) * Math.abs(p.dy);
  });
  return column;
}
