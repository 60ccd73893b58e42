/**
 * The two barrels whose intersection makes a cross vault, described by the
 * middle surface of their webs. Coordinates of one barrel: u horizontal,
 * across its span, from the vault's centre line; z vertical above the
 * springing of the bay; φ the inclination of the web's normal from the
 * vertical, so u = r·sin φ − c and z = s + r·cos φ on the right half.
 */
export type Metres = number;

export interface BarrelSection {
  /** Radius of the middle surface (m). */
  readonly r: Metres;
  /** How far the centre of the right half's arc lies beyond the centre line, on the left (m): 0 for a semicircle. */
  readonly c: Metres;
  /** Stilt: height of the arc's springing above the springing of the bay (m). */
  readonly s: Metres;
  /** Half the shell thickness (m). */
  readonly h: Metres;
  /** Half span of the middle surface in plan (m), r − c: the corner lies at u = e. */
  readonly e: Metres;
  /** φ at the crown: 0 for a round barrel, asin(c/r) along the ridge of a pointed one. */
  readonly phiCrown: number;
  /** Height of the middle surface at the crown (m). */
  readonly crown: Metres;
  /** Plan position u(φ) (m). */
  u(phi: number): Metres;
  /** Height of the middle surface z(φ) (m). */
  z(phi: number): Metres;
  /** u at which the middle surface stands at height z, clamped to [0, e] (m). */
  planAt(z: Metres): Metres;
  /** Height of the extrados above the plan point u(φ) (m). */
  extrados(phi: number): Metres;
}

function section(r: Metres, c: Metres, s: Metres, h: Metres): BarrelSection {
  const crown = s + Math.sqrt(r * r - c * c);
  return {
    r, c, s, h, crown, e: r - c, phiCrown: Math.asin(c / r),
    u: (phi) => r * Math.sin(phi) - c,
    z: (phi) => s + r * Math.cos(phi),
    planAt: (z) => (z >= crown ? 0 : z <= s ? r - c : Math.min(r - c, Math.max(0, Math.sqrt(r * r - (z - s) ** 2) - c))),
    extrados: (phi) => s + Math.sqrt(Math.max(0, (r + h) ** 2 - (r * Math.sin(phi)) ** 2)),
  };
}

/**
 * The barrel spanning x and the barrel spanning y of a cross vault, with
 * equal crown heights so the groins meet at the centre of the bay. Spans are
 * clear spans at the intrados; the middle surface is the intrados offset by
 * half the thickness about the same centres, so it reaches the corner at
 * u = span/2 + t/2.
 * - "semicircular": both barrels round; on an oblong plan the narrower one is
 *   stilted by the difference of the half spans (its arc springs that much
 *   higher; the stilt itself belongs to the wall, not to the webs).
 * - "pointed": the wider barrel is an equilateral two-centred arch (intrados
 *   radius = span, centres at the opposite springings); the narrower barrel is
 *   two-centred with the radius that brings its middle-surface crown to the
 *   same height: (ρ + h)² − (ρ − a)² = H² gives ρ = (H² − h² + a²)/(2(a + h)).
 * Geometry from the circle; no textbook needed beyond Pythagoras.
 * @param spanX clear span of the barrel spanning x (m)
 * @param spanY clear span of the barrel spanning y (m)
 * @param shape "semicircular" or "pointed"
 * @param t shell thickness (m), 0 for a thin shell
 * @returns the two middle-surface sections
 * @example groinSections(8, 8, 'semicircular', 0).x.crown // 4
 */
export function groinSections(spanX: Metres, spanY: Metres, shape: string, t: Metres): { x: BarrelSection; y: BarrelSection } {
  const h = t / 2, ax = spanX / 2, ay = spanY / 2, aWide = Math.max(ax, ay);
  if (shape === 'semicircular') {
    return { x: section(ax + h, 0, aWide - ax, h), y: section(ay + h, 0, aWide - ay, h) };
  }
  // Equilateral wide barrel: intrados radius 2a, centre a beyond the centre line.
  const crown2 = (2 * aWide + h) ** 2 - aWide ** 2;
  const pointed = (a: Metres): BarrelSection => {
    const rho = a === aWide ? 2 * a : (crown2 - h * h + a * a) / (2 * (a + h));
    return section(rho + h, rho - a, 0, h);
  };
  return { x: pointed(ax), y: pointed(ay) };
}
