/**
 * Membrane statics of a masonry dome: meridional and hoop forces, where the hoop turns to tension,
 * the thrust at the base and the tension of a base ring.
 */
import { notAvailable, type NotAvailable } from '../../not-available.js';
import { domeInput, type DomeInput, type DomeOptions } from './options.js';
import { heightAt, loadAbove, membraneForces, parallelRadius } from './meridian.js';

export interface Dome {
  shape: string;
  /** Meridian radius of the middle surface (m), half-angle at the base (rad), top edge angle (rad). */
  radius: number; half_angle: number; phi_top: number;
  /** Diameter of the middle surface at the base (m) and its height from the base to the crown or apex (m). */
  base_diameter: number; height: number;
  /** Total load on the base (N). */
  W: number;
  /** Where the hoop tension zone that reaches the base begins (else the first tension zone), angle from the crown (rad); not available when there is no hoop tension. */
  phi_hoop_tension: number | NotAvailable;
  /** Largest hoop tension (N/m); 0 when the hoop is in compression everywhere. */
  N_theta_max: number;
  /** Angle at which the largest hoop tension acts (rad); not available when there is none. */
  phi_N_theta_max: number | NotAvailable;
  /** Largest meridional compression, as a negative force (N/m). */
  N_phi_min: number;
  /** Meridional force at the base (N/m), compression negative. */
  N_phi_base: number;
  /** Horizontal thrust (outwards) and vertical load per metre of the base circle (N/m). */
  H_base: number; V_base: number;
  /** Tension of a ring at the base taking all of H_base: H_base·r_base (N). */
  ring_tension: number;
  /** Hidden: the checked input, for dome_at, dome_limit and figures. */
  readonly model: DomeInput;
}

/** Samples along the meridian for the extremes (the forces are smooth; the extremes are refined by bisection or lie at the ends). */
const SAMPLES = 720;

/**
 * Membrane analysis of a dome (Timoshenko & Woinowsky-Krieger 1959, §§128–129): see membraneForces.
 * A hemisphere under self-weight turns to hoop tension at cos φ = (√5 − 1)/2, φ = 51.83°; under a load
 * uniform on plan at 45°. The base ring takes H_base·r_base (the ring formula T = p·r of a thin ring).
 * @param o options (SI): shape, radius + half_angle or span + rise, thickness, unit_weight or g, p, oculus_angle, lantern
 * @returns forces along the meridian, the base thrust and the ring tension
 * @example dome({radius: 10, half_angle: Math.PI / 2, g: 2000}).phi_hoop_tension // 0.9046 rad = 51.83°
 */
export function dome(o: DomeOptions): Dome {
  const d = domeInput(o);
  const N = (phi: number) => membraneForces(d, phi);
  const at = (k: number) => d.phiTop + ((d.phiBase - d.phiTop) * k) / SAMPLES;
  // Starts of the tension zones, from the top down.
  const starts: number[] = [];
  let thetaMax = 0, phiMax: number | undefined, phiMin = 0;
  let prev = N(at(0)).N_theta;
  if (prev > 0) starts.push(d.phiTop);
  for (let k = 0; k <= SAMPLES; k++) {
    const phi = at(k), f = N(phi);
    phiMin = Math.min(phiMin, f.N_phi);
    if (f.N_theta > thetaMax) [thetaMax, phiMax] = [f.N_theta, phi];
    if (k > 0 && prev <= 0 && f.N_theta > 0) {
      let lo = at(k - 1), hi = phi;
      for (let i = 0; i < 60; i++) { const mid = (lo + hi) / 2; if (N(mid).N_theta > 0) hi = mid; else lo = mid; }
      starts.push((lo + hi) / 2);
    }
    prev = f.N_theta;
  }
  // The zone that reaches the base (where the dome cracks along its meridians) when there is one, else the first.
  const phiT = prev > 0 ? starts[starts.length - 1] : starts[0];
  const base = N(d.phiBase);
  const rb = parallelRadius(d, d.phiBase);
  const H = -base.N_phi * Math.cos(d.phiBase);
  const result = {
    shape: d.shape, radius: d.a, half_angle: d.phiBase, phi_top: d.phiTop,
    base_diameter: 2 * rb, height: heightAt(d, Math.asin(Math.min(1, d.c / d.a))),
    W: loadAbove(d, d.phiBase),
    phi_hoop_tension: phiT ?? notAvailable('the hoop force stays in compression from the top to the base'),
    N_theta_max: thetaMax,
    phi_N_theta_max: phiMax ?? notAvailable('there is no hoop tension'),
    N_phi_min: phiMin,
    N_phi_base: base.N_phi,
    H_base: H, V_base: -base.N_phi * Math.sin(d.phiBase),
    ring_tension: H * rb,
  };
  return Object.defineProperty(result, 'model', { value: d, enumerable: false }) as Dome;
}

/**
 * Membrane forces at a point of the dome's meridian.
 * @param v a dome from dome()
 * @param phi angle from the axis (the crown) to the point, measured at the meridian's centre (rad)
 * @returns N_phi (meridional) and N_theta (hoop), N/m, compression negative
 * @example domeAt(dome({radius: 1, half_angle: Math.PI / 2, g: 1}), 0).N_phi // −0.5
 */
export function domeAt(v: Dome, phi: number): { N_phi: number; N_theta: number } {
  const d = v.model;
  if (!(phi >= d.phiTop - 1e-12 && phi <= d.phiBase + 1e-12)) {
    throw new RangeError(`dome_at: phi must lie on the shell, between the ${d.open ? 'oculus' : d.c > 0 ? 'apex' : 'crown'} at ${d.phiTop} rad and the base at ${d.phiBase} rad, got ${phi} rad`);
  }
  return membraneForces(d, Math.min(d.phiBase, Math.max(d.phiTop, phi)));
}
