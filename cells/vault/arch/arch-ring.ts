import type { Metres, Profile, Radians } from '../profile.js';
import { circularArc, offsetProfile } from '../profile.js';
import { profileFromSpanRise, PROFILE_SHAPES, type ProfileShape } from '../profiles/profileFrom.js';
import type { ArchRing } from './types.js';
import { notAvailable, type NotAvailable } from '../../not-available.js';
import { ringJoints } from './ring-joints.js';
import { voussoirSections } from './voussoir-sections.js';

/** Options of arch_ring (SI). */
export interface ArchRingOptions {
  /** A profile family, or the exponent n of the R0·cos^n φ family. */
  shape: string | number;
  span?: Metres;
  rise?: Metres;
  radius?: Metres;
  half_angle?: Radians;
  thickness: Metres;
  unit_weight: number;
  depth?: Metres;
  voussoirs?: number;
  /** Design compressive strength (Pa) over the whole depth; none: uncrushable. */
  f_c?: number;
  /** Coefficient of friction μ at the joints; none: no sliding. */
  friction?: number;
  /** Definition of the geometric factor of safety: 'loads_as_built' (default, Heyman) or 'ring_scaled'. */
  gsf?: string;
  /** Kernel only: 'centreline' puts each voussoir's weight on the centreline, as the simplified published solutions do. */
  centroids?: 'exact' | 'centreline';
}

/** Voussoirs when none are asked for: t_min of a semicircle then agrees with 800 to 5 significant figures. */
export const DEFAULT_VOUSSOIRS = 200;
/** The fewest and most voussoirs a ring may be cut into (see archRing). */
export const MIN_VOUSSOIRS = 20;
export const MAX_VOUSSOIRS = 10000;

/**
 * A ring of constant thickness: the intrados of the given shape (by span and
 * rise), or for a circular ring the centreline radius and the half-angle
 * from the crown to the springing joint. The centreline is the parallel curve
 * at t/2 outside the intrados (offsetProfile); the ring's frame has y = 0 at
 * the springing of the intrados and x = 0 on the crown axis.
 * @param o options (SI): shape, span + rise or radius + half_angle, thickness, unit_weight, depth (1 m), voussoirs, f_c, friction, gsf
 * @returns the ring, with its centreline and joints attached but hidden from documents
 * @example archRing({shape: 'circular', radius: 5, half_angle: Math.PI / 2, thickness: 0.5, unit_weight: 2e4}).span // 9.5
 */
export function archRing(o: ArchRingOptions): ArchRing {
  const { thickness: t, unit_weight, depth = 1, voussoirs = DEFAULT_VOUSSOIRS } = o;
  positive('thickness', t, 'm');
  positive('unit_weight', unit_weight, 'N/m^3');
  positive('depth', depth, 'm');
  if (o.f_c !== undefined) positive('f_c', o.f_c, 'Pa');
  if (o.friction !== undefined) positive('friction', o.friction, '');
  const gsf = o.gsf ?? 'loads_as_built';
  if (gsf !== 'loads_as_built' && gsf !== 'ring_scaled') {
    throw new RangeError(`arch_ring: gsf must be "loads_as_built" (Heyman: loads as built, the default) or "ring_scaled" (the ring shrinks with its weight, fill replacing it), got "${gsf}"`);
  }
  // Below 20 joints the hinges fall where the joints happen to be, and t_min and gsf lose their meaning
  // (2 voussoirs gave t_min 6e-9 m); 21 is tested within 1 % of 3200 (point-loads.test.ts). Above
  // MAX_VOUSSOIRS the programme only gets slower.
  if (!Number.isInteger(voussoirs) || voussoirs < MIN_VOUSSOIRS || voussoirs > MAX_VOUSSOIRS) {
    throw new RangeError(`arch_ring: voussoirs must be a whole number from ${MIN_VOUSSOIRS} to ${MAX_VOUSSOIRS}, got ${voussoirs}: fewer joints miss where the hinges form`);
  }
  if (typeof o.shape !== 'string' && typeof o.shape !== 'number') {
    throw new RangeError(`arch_ring: shape must be a family name in quotes or an exponent n, got ${String(o.shape)}`);
  }
  const byRadius = o.radius !== undefined || o.half_angle !== undefined;
  const bySpan = o.span !== undefined || o.rise !== undefined;
  if (byRadius && bySpan) throw new RangeError('arch_ring: give span and rise, or radius and half_angle, not both');
  let centre: Profile;
  if (byRadius) {
    if (o.shape !== 'circular') throw new RangeError(`arch_ring: radius and half_angle describe a circular ring, got shape "${o.shape}"`);
    positive('radius', o.radius, 'm');
    positive('half_angle', o.half_angle, 'rad');
    if (!(o.radius! > t / 2)) throw new RangeError(`arch_ring: thickness must be less than twice the radius, got ${t} m`);
    centre = circularArc(o.radius!, o.half_angle!);
  } else {
    positive('span', o.span, 'm');
    if (o.shape !== 'pointed') positive('rise', o.rise, 'm');
    centre = offsetProfile(intradosProfile(o.shape, o.span!, o.rise), t / 2);
  }
  // The ring's frame: y above the intrados springing.
  const phiS = centre.phiSpringing;
  const y0 = centre.point(phiS).y - (t / 2) * Math.cos(phiS);
  const centreline: Profile = { ...centre, point: (phi) => { const q = centre.point(phi); return { x: q.x, y: q.y - y0 }; } };
  const intradosSpring = offsetProfile(centreline, -t / 2).point(phiS);
  const span = o.span ?? 2 * intradosSpring.x;
  if (!(t < span)) throw new RangeError(`arch_ring: thickness must be less than the span ${span} m, got ${t} m`);
  // Rise of the intrados: the crown (or apex) of the intrados above its springing.
  const rise = offsetProfile(centreline, -t / 2).point(centreline.phiCrown).y;
  const joints = ringJoints(centreline, voussoirs);
  const area = voussoirSections(centreline, joints, t).reduce((s, v) => s + v.area, 0);
  const ring = {
    shape: typeof o.shape === 'number' ? `power n = ${o.shape}` : o.shape, span, rise, radius: ringRadius(o.shape, centreline), half_angle: phiS,
    thickness: t, unit_weight, depth, voussoirs, weight: unit_weight * depth * area,
    f_c: o.f_c ?? Infinity, friction: o.friction ?? Infinity, gsf_definition: gsf,
  };
  Object.defineProperty(ring, 'centreline', { value: centreline, enumerable: false });
  Object.defineProperty(ring, 'joints', { value: joints, enumerable: false });
  Object.defineProperty(ring, 'centroids', { value: o.centroids ?? 'exact', enumerable: false });
  return ring as ArchRing;
}

/** The intrados of a named family (or exponent) by clear span and rise: the profiles' factory. */
function intradosProfile(shape: string | number, span: Metres, rise: Metres | undefined): Profile {
  if (typeof shape !== 'number' && !PROFILE_SHAPES.includes(shape as ProfileShape)) {
    throw new RangeError(`arch_ring: unknown shape "${shape}"; known shapes: ${PROFILE_SHAPES.join(', ')}, or an exponent n`);
  }
  return profileFromSpanRise(shape as ProfileShape | number, span, rise);
}

function positive(name: string, v: number | undefined, unit: string): void {
  if (v === undefined) throw new RangeError(`arch_ring: ${name} is required`);
  if (!(v > 0 && Number.isFinite(v))) throw new RangeError(`arch_ring: ${name} must be positive, got ${v} ${unit}`);
}

/** The centreline radius of a circular ring; other shapes have no single radius. */
function ringRadius(shape: string | number, centreline: Profile): Metres | NotAvailable {
  if (shape === 'circular') return centreline.radius(centreline.phiCrown);
  return notAvailable(`a ${typeof shape === 'number' ? 'power' : shape} ring has no single radius (only a circular ring has one)`);
}
