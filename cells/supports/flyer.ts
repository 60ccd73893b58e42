/**
 * A flying buttress: an inclined bar of masonry, straight or arched, carrying the thrust of a vault
 * from the clerestory wall head across the aisle to an outer pier.
 */
import { simplex } from '../vault/dome/simplex.js';
import { notAvailable, type NotAvailable } from '../not-available.js';

export interface FlyerOptions {
  /** "straight" (default) or "arched". */
  shape?: string;
  /** Horizontal distance from the face of the clerestory wall to the face of the pier (m). */
  span: number;
  /** Height of the upper end (at the wall head) above the lower end (on the pier), measured on the centreline (m); ≥ 0. */
  rise: number;
  /** Sagitta of an arched flyer's centreline above the chord between its ends (m). */
  sag?: number;
  /** Thickness perpendicular to the centreline (m), width across it (m, default 1) and unit weight (N/m³). */
  thickness: number; width?: number; unit_weight: number;
  /** Design compressive strength of the masonry (Pa), for H_crush. */
  strength?: number;
}

export interface FlyerPoint { x: number; z: number }

export interface Flyer {
  /** Weight of the flyer (N). */
  W: number;
  /** Least horizontal thrust it exerts under its own weight, and the greatest it can carry (N). */
  H_min: number; H_max: number;
  /** Horizontal thrust at which the masonry crushes, with the force along the bar: min over sections of f·b·t·cos α (N); not available without strength. */
  H_crush: number | NotAvailable;
  /** Vertical reactions at the wall head (upwards on the flyer; negative when the wall presses it down) and on the pier in the least-thrust state (N). */
  V_wall: number; V_pier: number;
  /** Lines of thrust of the two states: heights above the lower end's centreline, x from the wall face (m). */
  thrust_min: FlyerPoint[]; thrust_max: FlyerPoint[];
  /** Hidden: the geometry, for the figure. */
  readonly model: { xs: number[]; zi: number[]; ze: number[]; zc: number[] };
}

/** Vertical sections along the flyer. */
const SECTIONS = 120;

/**
 * Limit analysis of a flying buttress cut into vertical sections (Heyman, "The stone skeleton",
 * Int. J. Solids Struct. 2, 1966, and The Stone Skeleton, 1995, on the flying buttress; from memory).
 * Under vertical loads the horizontal thrust H is the same in every section and the line of thrust is
 * z(x) = z0 + s·x − M(x)/H, M(x) = ∫₀ˣ (x − ξ)·w(ξ) dξ the moment of the weight w per unit length.
 * With A = H·z0 and B = H·s the conditions z_i(x) ≤ z(x) ≤ z_e(x) at every section are linear in
 * (H, A, B), so the least and the greatest H are linear programmes. The least thrust is what the
 * flyer exerts of itself on the wall (its "dead" shore); a vault thrust between H_min and H_max can
 * be passed across to the pier with the line of thrust within the flyer (the safe theorem).
 * @param o geometry and unit weight (SI)
 * @returns thrust range, reactions and the lines of thrust of both states
 * @example flyingButtress({span: 4, rise: 2, thickness: 0.4, unit_weight: 2e4}).H_min
 */
export function flyingButtress(o: FlyerOptions): Flyer {
  const shape = o.shape ?? 'straight';
  if (shape !== 'straight' && shape !== 'arched') throw new RangeError(`flying_buttress: shape must be "straight" or "arched", got "${shape}"`);
  const pos = (name: string, v: number | undefined, unit: string) => {
    if (!(typeof v === 'number' && Number.isFinite(v) && v > 0)) throw new RangeError(`flying_buttress: ${name} must be positive, got ${v} ${unit}`);
    return v;
  };
  const L = pos('span', o.span, 'm'), t = pos('thickness', o.thickness, 'm'), gamma = pos('unit_weight', o.unit_weight, 'N/m^3');
  const b = o.width === undefined ? 1 : pos('width', o.width, 'm');
  const rise = o.rise;
  if (!(Number.isFinite(rise) && rise >= 0)) throw new RangeError(`flying_buttress: rise must be zero or more, got ${rise} m`);
  const sag = shape === 'arched' ? pos('sag', o.sag, 'm') : 0;
  const strength = o.strength === undefined ? undefined : pos('strength', o.strength, 'Pa');
  if (shape === 'straight' && o.sag !== undefined) throw new RangeError('flying_buttress: sag belongs to an arched flyer');
  const chord = Math.hypot(L, rise);
  if (!(t < chord / 3)) throw new RangeError(`flying_buttress: thickness must be less than a third of the length ${chord.toFixed(3)} m, got ${t} m`);
  // Centreline: the chord from (0, rise) to (L, 0), bowed up by the sagitta of a circular arc.
  let zc: (x: number) => number, slope: (x: number) => number;
  if (sag === 0) {
    zc = (x) => rise * (1 - x / L); slope = () => -rise / L;
  } else {
    if (!(sag < chord / 2)) throw new RangeError(`flying_buttress: sag must be less than half the chord ${(chord / 2).toFixed(3)} m, got ${sag} m`);
    const R = (chord * chord) / (8 * sag) + sag / 2;
    // Centre: from the chord's midpoint, R − sag along the downward normal of the chord.
    const mx = L / 2, mz = rise / 2, nx = -rise / chord, nz = -L / chord; // unit normal pointing below the chord
    const cx = mx + (R - sag) * nx, cz = mz + (R - sag) * nz;
    zc = (x) => cz + Math.sqrt(Math.max(0, R * R - (x - cx) ** 2));
    slope = (x) => -(x - cx) / Math.sqrt(Math.max(1e-12, R * R - (x - cx) ** 2));
  }
  const xs = Array.from({ length: SECTIONS + 1 }, (_, i) => (L * i) / SECTIONS);
  const half = xs.map((x) => (t / 2) * Math.sqrt(1 + slope(x) ** 2)); // half the vertical depth of the section
  const zi = xs.map((x, i) => zc(x) - half[i]!), ze = xs.map((x, i) => zc(x) + half[i]!);
  const w = half.map((hv) => gamma * b * 2 * hv); // weight per unit length in x
  // M(x) = ∫₀ˣ (x − ξ)·w(ξ) dξ with w linear between sections (exact for that w): shear then moment.
  const M = [0];
  let shear = 0, W = 0;
  for (let i = 1; i <= SECTIONS; i++) {
    const dx = xs[i]! - xs[i - 1]!, dw = ((w[i - 1]! + w[i]!) / 2) * dx;
    M.push(M[i - 1]! + shear * dx + (dx * dx * (2 * w[i - 1]! + w[i]!)) / 6);
    shear += dw; W += dw;
  }
  // Unknowns y = (H, A⁺, A⁻, B⁺, B⁻) ≥ 0, scaled by W and L.
  const A: number[][] = [], rhs: number[] = [];
  xs.forEach((x, i) => {
    const u = x / L;
    // H·z_i − A − B·x ≤ −M  and  A + B·x − H·z_e ≤ M   (in units of W·L)
    A.push([zi[i]! / L, -1, 1, -u, u]); rhs.push(-M[i]! / (W * L));
    A.push([-ze[i]! / L, 1, -1, u, -u]); rhs.push(M[i]! / (W * L));
  });
  const solve = (sign: number) => simplex({ A, b: rhs, c: [sign, 0, 0, 0, 0] });
  const least = solve(-1), most = solve(1);
  if (least.status !== 'optimal') throw new RangeError('flying_buttress: no line of thrust fits within the flyer under its own weight; it is too slender');
  const line = (y: number[]): FlyerPoint[] => {
    const H = y[0]!, a = y[1]! - y[2]!, bb = y[3]! - y[4]!;
    return xs.map((x, i) => ({ x, z: H > 0 ? (a + bb * (x / L) - M[i]! / (W * L)) / (H / L) : zc(x) }));
  };
  const Hmin = least.x[0]! * W, sMin = least.x[0]! > 0 ? (least.x[3]! - least.x[4]!) / least.x[0]! : 0;
  const Hmax = most.status === 'optimal' ? most.x[0]! * W : Infinity;
  const result = {
    W, H_min: Hmin, H_max: Hmax,
    // The force along the bar N ≈ H/cos α, against f·b·t (the line of thrust taken along the bar, uniform stress).
    H_crush: strength === undefined ? notAvailable('strength (the design compressive strength of the masonry) is not given')
      : Math.min(...xs.map((x) => (strength * b * t) / Math.sqrt(1 + slope(x) ** 2))),
    // The wall pushes on the upper end along the line of thrust, (H, H·s): up when the line rises into the flyer.
    V_wall: Hmin * sMin, V_pier: W - Hmin * sMin,
    thrust_min: line(least.x), thrust_max: most.status === 'optimal' ? line(most.x) : [],
  };
  return Object.defineProperty(result, 'model', { value: { xs, zi, ze, zc: xs.map(zc) }, enumerable: false }) as Flyer;
}
