/**
 * The protocol every vault profile implements.
 *
 * A profile is a symmetric plane curve parametrised by φ, the inclination of
 * its normal from the vertical: φ = 0 at the crown of a smooth profile, rising
 * to `phiSpringing` at the springing. Coordinates: x horizontal from the crown
 * axis (right half positive), y vertical above the springing line of the curve.
 * With φ as parameter, the radius of curvature is R(φ) = ds/dφ and the parallel
 * curve at normal distance d is just point(φ) + d·(sin φ, cos φ), radius R + d,
 * which is how intrados, centreline and extrados are built from one another.
 */
export type Metres = number;
export type Radians = number;

export interface Point {
  x: Metres;
  y: Metres;
}

export interface Profile {
  /** Name of the family: 'circular', 'pointed', 'elliptical', 'parabolic', 'catenary', 'cycloid', 'power'. */
  readonly shape: string;
  /** φ where the right half starts: 0 for smooth profiles, > 0 at the apex of a pointed arch. */
  readonly phiCrown: Radians;
  /** φ at the springing (rad, < π/2 for profiles whose normal never becomes horizontal). */
  readonly phiSpringing: Radians;
  /** Point of the right half at φ ∈ [phiCrown, phiSpringing]; y above the springing line of the reference curve. */
  point(phi: Radians): Point;
  /** Radius of curvature at φ (m). */
  radius(phi: Radians): Metres;
  /** Arc length from the crown to φ (m). */
  arcLength(phi: Radians): Metres;
}

/**
 * Circular arc of radius R from the crown to the springing angle.
 * @param R radius (m)
 * @param phiSpringing half-angle from the crown to the springing (rad), π/2 for a semicircle
 * @returns a Profile with y measured from the springing line
 * @example circularArc(4, Math.PI / 2).point(Math.PI / 2) // {x: 4, y: 0}
 */
export function circularArc(R: Metres, phiSpringing: Radians): Profile {
  if (!(R > 0)) throw new RangeError(`circular: radius must be positive, got ${R}`);
  if (!(phiSpringing > 0 && phiSpringing <= Math.PI)) {
    throw new RangeError(`circular: half_angle must be in (0°, 180°], got ${(phiSpringing * 180) / Math.PI}°`);
  }
  const yc = -R * Math.cos(phiSpringing);
  return {
    shape: 'circular',
    phiCrown: 0,
    phiSpringing,
    point: (phi) => ({ x: R * Math.sin(phi), y: yc + R * Math.cos(phi) }),
    radius: () => R,
    arcLength: (phi) => R * phi,
  };
}

/**
 * The parallel curve at normal distance d (outwards positive), in the same frame.
 * @param p base profile
 * @param d offset (m): +t/2 from the intrados gives the centreline
 * @returns a Profile sharing p's parametrisation and reference springing line
 * @example offsetProfile(circularArc(4, Math.PI / 2), 0.1).radius(0) // 4.1
 */
export function offsetProfile(p: Profile, d: Metres): Profile {
  return {
    shape: p.shape,
    phiCrown: p.phiCrown,
    phiSpringing: p.phiSpringing,
    point: (phi) => {
      const q = p.point(phi);
      return { x: q.x + d * Math.sin(phi), y: q.y + d * Math.cos(phi) };
    },
    radius: (phi) => p.radius(phi) + d,
    arcLength: (phi) => p.arcLength(phi) + d * (phi - p.phiCrown),
  };
}
