/**
 * The meridian of a dome's middle surface and the membrane forces along it.
 */
import type { DomeInput } from './options.js';

/** Radius of the parallel circle at φ (m): r0 = a·sin φ − c. */
export function parallelRadius(d: DomeInput, phi: number): number {
  return d.a * Math.sin(phi) - d.c;
}

/** Height of the middle surface at φ above the base joint's centre (m). */
export function heightAt(d: DomeInput, phi: number): number {
  return d.a * (Math.cos(phi) - Math.cos(d.phiBase));
}

/**
 * Vertical load (N) carried across the parallel circle at φ: the lantern, the self-weight of the
 * shell above (surface element 2π·r0·a·dφ) and the plan load on the plan ring above,
 *   W(φ) = P + 2π·q·a·(a(cos φ0 − cos φ) − c(φ − φ0)) + π·p·(r0(φ)² − r0(φ0)²).
 * @param d the dome
 * @param phi angle from the axis (rad)
 * @returns W (N)
 * @example loadAbove(domeInput({radius: 1, half_angle: Math.PI / 2, g: 1}), Math.PI / 2) // 2π (hemisphere)
 */
export function loadAbove(d: DomeInput, phi: number): number {
  const p0 = d.phiTop, a = d.a;
  const shell = 2 * Math.PI * d.q * a * (a * (Math.cos(p0) - Math.cos(phi)) - d.c * (phi - p0));
  const plan = Math.PI * d.p * (parallelRadius(d, phi) ** 2 - parallelRadius(d, p0) ** 2);
  return d.P + shell + plan;
}

/**
 * Membrane forces of a shell of revolution under axisymmetric vertical load (Timoshenko &
 * Woinowsky-Krieger, Theory of Plates and Shells, 2nd ed. 1959, §§128–129, eqs. for shells of
 * revolution): vertical equilibrium of the cap above φ, N_φ = −W/(2π·r0·sin φ), and equilibrium
 * normal to the surface, N_φ/r1 + N_θ/r2 = −Z, with r1 = a the meridian radius, r2 = r0/sin φ and
 * Z = q·cos φ + p·cos²φ the inward normal load per unit surface. Compression negative (N/m).
 * For a sphere this is N_φ = −aq/(1 + cos φ), N_θ = aq(1/(1 + cos φ) − cos φ) under self-weight and
 * N_φ = −pa/2, N_θ = −(pa/2)·cos 2φ under a load uniform on plan.
 * @param d the dome
 * @param phi angle from the axis (rad), φ_top < φ ≤ φ_base
 * @returns N_phi, N_theta (N/m)
 * @example membraneForces(domeInput({radius: 1, half_angle: Math.PI / 2, g: 1}), Math.PI / 2) // {N_phi: −1, N_theta: 1}
 */
export function membraneForces(d: DomeInput, phi: number): { N_phi: number; N_theta: number } {
  const s = Math.sin(phi), cph = Math.cos(phi);
  const Z = d.q * cph + d.p * cph * cph;
  const r0 = parallelRadius(d, phi);
  if (r0 <= 1e-12 * d.a) {
    // At a closed crown the cap is small: N_φ = N_θ = −a·Z/2 on a sphere, the limit of both formulas;
    // at the apex of a pointed dome r2 → 0 and both vanish.
    const n = d.c > 0 ? 0 : (-d.a * Z) / 2;
    return { N_phi: n, N_theta: n };
  }
  const N_phi = -loadAbove(d, phi) / (2 * Math.PI * r0 * s);
  const r2 = r0 / s;
  return { N_phi, N_theta: r2 * (-Z - N_phi / d.a) };
}
