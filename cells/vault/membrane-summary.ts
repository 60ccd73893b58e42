/**
 * The figures an engineer reads off a barrel vault's membrane state: crown
 * and springing forces, peaks, tension, wall reactions and total load.
 */
import type { Metres, Profile } from './profile.js';
import type { RadiusLaw } from './membrane-radius-law.js';
import { membraneField, type MembraneField, type MembraneForces } from './membrane-field.js';
import { largest } from './membrane-extremes.js';
import { integrate } from './profiles/integrate.js';
import { notAvailable, type NotAvailable } from '../not-available.js';

/** Summary of a barrel vault's membrane state (SI; compression negative). */
export interface BarrelMembrane {
  /** Nφ at the crown (N/m). */
  N_phi_crown: number;
  /** Nφ at the springing (N/m). */
  N_phi_springing: number;
  /** Largest |Nxφ| (N/m). */
  N_xphi_max: number;
  /** Most compressive Nx, ≤ 0 (N/m). */
  N_x_max: number;
  /** Most tensile Nx, ≥ 0 (N/m). */
  N_x_min: number;
  /** Is the larger principal membrane force tensile anywhere? */
  tension: boolean;
  /** Downward force per unit length on each lateral wall from Nφ (N/m); negative = uplift. */
  V_wall: number;
  /** Outward thrust per unit length on each lateral wall from Nφ (N/m). */
  H_wall: number;
  /** Net (vertical) force delivered to each end wall by Nxφ (N); its horizontal parts cancel by symmetry. */
  end_shear: number;
  /** Total load on the vault (N). */
  W: number;
  /** Largest principal compressive stress |N2|/t (Pa); not available when no thickness is given. */
  sigma_max: number | NotAvailable;
  /** The field, for membrane_at (not shown in a sheet). */
  readonly field: MembraneField;
  /** The middle surface (not shown in a sheet). */
  readonly profile: Profile;
}

/** Principal membrane forces [N1 ≥ N2], the smaller one from N1·N2 = Nx·Nφ − Nxφ² to avoid cancellation. */
export function principalForces(f: MembraneForces): [number, number] {
  const mean = (f.N_x + f.N_phi) / 2, r = Math.hypot((f.N_x - f.N_phi) / 2, f.N_xphi);
  const det = f.N_x * f.N_phi - f.N_xphi * f.N_xphi;
  if (mean < 0) { const n2 = mean - r; return [det / n2, n2]; }
  const n1 = mean + r;
  return [n1, n1 === 0 ? 0 : det / n1];
}

/**
 * The membrane forces at x = 0 and x = l for one φ, where N_x = G·(l² − x²) and N_xφ = F·x: along
 * a generatrix the principal forces are largest or smallest at one of these two. With u = x²,
 * N1,2 = (N_x + N_φ)/2 ± √Q, Q = (N_x − N_φ)²/4 + F²·u; dN1,2/du = 0 needs
 * (F² − G·(N_x − N_φ)/2)² = G²·Q, which reduces to F² − G²l² + G·N_φ = 0, free of u. So neither
 * has a stationary point inside (0, l²) unless its slope is zero wherever that holds: each is
 * monotone in u, and its extremes are at the ends. (The reduction divides by F²; with F = 0 the
 * forces are the larger and smaller of N_x and N_φ, N_x linear in u, so monotone again.)
 * @example endExtremes(-20e3, 1e3, -500, 6) // [{N_phi: -20e3, N_x: -18e3, N_xphi: 0}, {N_phi: -20e3, N_x: 0, N_xphi: 6e3}]
 */
export function endExtremes(N_phi: number, F: number, G: number, l: Metres): [MembraneForces, MembraneForces] {
  return [{ N_phi, N_x: G * l * l, N_xphi: 0 }, { N_phi, N_x: 0, N_xphi: F * l }];
}

/**
 * Summary of the membrane state (membraneField) of a barrel vault.
 * Edge reactions, from the shell's edge tractions: on a lateral wall (φ = ±φs)
 * Nφ acts along the tangent, inclined φs to the horizontal, so per unit length
 * V_wall = −Nφ(φs)·sin φs and H_wall = −Nφ(φs)·cos φs (Nxφ there acts along
 * the wall: a longitudinal shear that sums to zero over each wall). On each
 * end wall Nxφ(±l, φ) acts along the tangent (cos φ, −sin φ); its vertical
 * resultant is end_shear = −2l ∫₀^φs F sin φ R dφ. Vertical equilibrium:
 * 2·(2l)·V_wall + 2·end_shear = W = 2l·(2 s(φs)·g + 2 x(φs)·p).
 * @param profile middle surface (smooth at the crown)
 * @param law its radius law
 * @param loads g (Pa, per unit surface), p (Pa, per unit plan area)
 * @param halfLength l, half the distance between the end walls (m)
 * @param thickness shell thickness (m), for sigma_max; optional
 * @returns the summary
 * @example membraneSummary(p, radiusLaw(p), {g: 2160, p: 0}, 6, 0.12).W
 */
export function membraneSummary(
  profile: Profile, law: RadiusLaw, loads: { g: number; p: number }, halfLength: Metres, thickness?: Metres,
): BarrelMembrane {
  if (profile.phiCrown !== 0) throw new RangeError(`barrel_membrane: the ${profile.shape} profile is not smooth at the crown`);
  const field = membraneField(law, loads, halfLength), l = halfLength, phiS = profile.phiSpringing;
  const NphiS = field.Nphi(phiS);
  const Fmax = largest((phi) => Math.abs(field.F(phi)), 0, phiS).value;
  const Gmax = largest((phi) => field.G(phi), 0, phiS).value, Gmin = -largest((phi) => -field.G(phi), 0, phiS).value;
  // Principal forces depend on x through x² and on φ through Nxφ², so one quarter of the vault
  // suffices; and along x their extremes lie at x = 0 or x = l (endExtremes).
  const worst = (pick: (f: MembraneForces) => number) => largest((phi) => {
    const N_phi = field.Nphi(phi), F = field.F(phi), G = field.G(phi);
    return Math.max(...endExtremes(N_phi, F, G, l).map(pick));
  }, 0, phiS, 120).value;
  const N1 = worst((f) => principalForces(f)[0]), N2 = -worst((f) => -principalForces(f)[1]);
  const scale = Math.max(Math.abs(field.Nphi(0)), Math.abs(NphiS), Fmax * l, Math.abs(Gmax) * l * l, Math.abs(Gmin) * l * l);
  const endShear = -2 * l * integrate((phi) => field.F(phi) * Math.sin(phi) * law.R(phi), 0, phiS);
  const W = 2 * l * (2 * profile.arcLength(phiS) * loads.g + 2 * profile.point(phiS).x * loads.p);
  const out = {
    N_phi_crown: field.Nphi(0), N_phi_springing: NphiS, N_xphi_max: Fmax * l,
    N_x_max: Math.min(0, Gmin * l * l), N_x_min: Math.max(0, Gmax * l * l),
    tension: N1 > 1e-9 * scale,
    V_wall: -NphiS * Math.sin(phiS), H_wall: -NphiS * Math.cos(phiS), end_shear: endShear, W,
    sigma_max: thickness === undefined ? notAvailable('no thickness is given (the load came as g)') : Math.max(0, -N2) / thickness,
  };
  for (const [name, value] of Object.entries(out) as Array<[keyof typeof out, unknown]>) {
    if (typeof value !== 'number') continue;
    if (!Number.isFinite(value)) {
      throw new RangeError(`barrel_membrane: ${name} is unbounded for this profile and load (the membrane solution breaks down)`);
    }
    // cos 90° is 6e-17 in floating point: a force below 1e-12 of the largest is rounding noise, shown as 0.
    const noise = name !== 'W' && name !== 'end_shear' && name !== 'sigma_max' && Math.abs(value) < 1e-12 * scale;
    if (noise || value === 0) (out as unknown as Record<string, number>)[name] = 0; // also turns −0 into 0
  }
  return Object.defineProperties(out, {
    field: { value: field, enumerable: false },
    profile: { value: profile, enumerable: false },
  }) as BarrelMembrane;
}
