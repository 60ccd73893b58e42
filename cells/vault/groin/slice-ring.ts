/**
 * One slice of a web, cut by two vertical planes across its generators, as a ring of the arch kernel.
 */
import type { Profile } from '../profile.js';
import { archRing } from '../arch/arch-ring.js';
import { ringJoints } from '../arch/ring-joints.js';
import { voussoirSections } from '../arch/voussoir-sections.js';
import type { ArchRing } from '../arch/types.js';
import type { WebArc } from './cross-webs.js';

/** Voussoirs of each slice: enough for the thrust range to 1 % (checked in the tests against 200), few enough for a bay in a fraction of a second. */
export const SLICE_VOUSSOIRS = 24;

/**
 * The slice of a web between the crown and φ_g, where it springs (at the groin, or on the solid
 * pocket), `depth` thick along the generators. A one-centred web gives a circular ring by arch_ring's
 * own radius and half-angle; a pointed web gives the two arcs of its middle surface from the apex to
 * φ_g, with the arch kernel's joints and voussoirs (ringJoints, voussoirSections) exactly as arch_ring
 * builds a pointed ring. Ring frame: x from the crown axis, y above the intrados at the springing.
 * @param w the web
 * @param phiG φ at the slice's springing joint (rad)
 * @param depth thickness of the slice along the generators (m)
 * @param unitWeight unit weight of the masonry (N/m³)
 * @returns the ring, and the height of its frame's origin above the springing of the bay (m)
 * @example sliceRing(web, 1.2, 0.3, 2e4).ring.half_angle // 1.2
 */
export function sliceRing(w: WebArc, phiG: number, depth: number, unitWeight: number): { ring: ArchRing; z0: number } {
  const t = 2 * w.h;
  const z0 = w.zc + (w.r - w.h) * Math.cos(phiG);
  if (w.c === 0) {
    return { ring: archRing({ shape: 'circular', radius: w.r, half_angle: phiG, thickness: t, unit_weight: unitWeight, depth, voussoirs: SLICE_VOUSSOIRS }), z0 };
  }
  const y0 = (w.r - w.h) * Math.cos(phiG);
  const centreline: Profile = {
    shape: 'pointed', phiCrown: w.phiC, phiSpringing: phiG,
    point: (phi) => ({ x: w.r * Math.sin(phi) - w.c, y: w.r * Math.cos(phi) - y0 }),
    radius: () => w.r,
    arcLength: (phi) => w.r * (phi - w.phiC),
  };
  const joints = ringJoints(centreline, SLICE_VOUSSOIRS);
  const area = voussoirSections(centreline, joints, t).reduce((s, v) => s + v.area, 0);
  const span = 2 * ((w.r - w.h) * Math.sin(phiG) - w.c);
  const ring = {
    shape: 'pointed', span, rise: (w.r - w.h) * (Math.cos(w.phiC) - Math.cos(phiG)), half_angle: phiG,
    thickness: t, unit_weight: unitWeight, depth, voussoirs: SLICE_VOUSSOIRS, weight: unitWeight * depth * area,
  };
  Object.defineProperty(ring, 'centreline', { value: centreline, enumerable: false });
  Object.defineProperty(ring, 'joints', { value: joints, enumerable: false });
  Object.defineProperty(ring, 'centroids', { value: 'exact', enumerable: false });
  return { ring: ring as ArchRing, z0 };
}
