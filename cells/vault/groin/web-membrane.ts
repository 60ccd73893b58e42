/**
 * Membrane forces at a point of one web of a cross vault.
 */
import type { GroinVault } from './groin-vault.js';

export interface WebMembrane {
  /** Hoop force across the generators (N/m), compression negative. */
  N_phi: number;
  /** Force along the generators (N/m), compression negative. */
  N_x: number;
  /** Membrane shear (N/m). */
  N_xphi: number;
}

// Step for the numerical derivatives of the load in φ (rad): 5-point
// stencils, truncation ~δ⁴, rounding ~1e-16/δ², both far below 1e-8.
const STEP = 1e-3;

/**
 * Membrane state of a web treated as a barrel segment bounded by the groin.
 * Membrane theory of the circular cylinder (Flügge, Stresses in Shells, ch. 3;
 * Timoshenko & Woinowsky-Krieger §110), load q(φ) per unit surface, vertical,
 * uniform along the generators, so p_φ = q·sin φ, p_r = −q·cos φ:
 *   N_φ = p_r·R = −q R cos φ
 *   ∂N_xφ/∂x = −p_φ − (1/R)∂N_φ/∂φ = −A(φ),  A = 2q sin φ − q′ cos φ
 *   ∂N_x/∂x = −(1/R)∂N_xφ/∂φ = A′(φ)·x/R
 * x runs along the generators from the centre line of the bay. Boundary
 * conditions: by symmetry about that centre line N_xφ = 0 at x = 0, and the
 * face (lateral) arch at x = ±l takes no force along the generators, N_x = 0:
 *   N_xφ = −A·x,  N_x = A′·(x² − l²)/(2R).
 * So the web carries the state of the whole barrel between the face arches,
 * cut off at the groin; what its edge forces leave at the groin is what the
 * groin collects. Self-weight g gives Timoshenko's N_x = −(g/R) cos φ (l² − x²).
 * A kink of the load (the edge of the pocket fill) makes N_xφ jump there.
 * @param v a cross vault from groinVault
 * @param x distance along the generators from the centre line of the bay (m)
 * @param phi inclination of the normal from the vertical (rad)
 * @param web "x" for the webs of the barrel spanning x (along the y-sides), "y" for the others
 * @returns N_phi, N_x, N_xphi (N/m)
 * @example webMembrane(groinVault({span_x: 8, g: 1}), 3, 0.2).N_phi // −4·cos 0.2
 */
export function webMembrane(v: GroinVault, x: number, phi: number, web = 'x'): WebMembrane {
  if (web !== 'x' && web !== 'y') throw new RangeError(`web_membrane_at: web must be "x" or "y", got "${web}"`);
  const own = v.model[web], other = v.model[web === 'x' ? 'y' : 'x'].section;
  const { r, phiCrown } = own.section;
  if (!(phi >= phiCrown - 1e-12 && phi <= Math.PI / 2)) {
    throw new RangeError(`web_membrane_at: phi must lie between the crown ${phiCrown} rad and the springing π/2, got ${phi} rad`);
  }
  const l = other.e;
  if (!(Math.abs(x) <= l)) throw new RangeError(`web_membrane_at: x must lie between the face arches ±${l} m, got ${x} m`);
  // Is the point on this web, or beyond the groin on the crossing barrel's web?
  const groin = other.planAt(own.section.z(phi));
  if (Math.abs(x) < groin - 1e-9 * l) {
    throw new RangeError(`web_membrane_at: at phi = ${phi} rad the ${web}-web runs from the groin at |x| = ${groin} m to the face arch; got x = ${x} m`);
  }
  const q = own.load.q, d = STEP;
  const [qm2, qm1, q0, q1, q2] = [-2, -1, 0, 1, 2].map((k) => q(phi + k * d)) as [number, number, number, number, number];
  const dq = (qm2 - 8 * qm1 + 8 * q1 - q2) / (12 * d);
  const ddq = (-qm2 + 16 * qm1 - 30 * q0 + 16 * q1 - q2) / (12 * d * d);
  const s = Math.sin(phi), c = Math.cos(phi);
  const A = 2 * q0 * s - dq * c;
  const dA = 3 * dq * s + 2 * q0 * c - ddq * c;
  return { N_phi: -q0 * r * c, N_x: (dA * (x * x - l * l)) / (2 * r), N_xphi: -A * x };
}
