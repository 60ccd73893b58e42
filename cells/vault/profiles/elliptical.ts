/**
 * Semi-elliptical vault profile (the "basket" curve drawn as a true ellipse).
 */
import type { Metres, Profile, Radians } from '../profile.js';
import { integrate } from './integrate.js';
import { requirePositive } from './positive.js';

/**
 * Semi-ellipse with horizontal semi-axis a = L/2 and vertical semi-axis b = f,
 * centred on the springing line. Parametrisation by φ, the inclination of the
 * normal: the normal of x²/a² + y²/b² = 1 is along (x/a², y/b²), which gives,
 * with D(φ) = √(a² sin²φ + b² cos²φ),
 *   x = a² sin φ / D,  y = b² cos φ / D,  R = a² b² / D³
 * (equivalently the eccentric angle θ, x = a sin θ, y = b cos θ, has
 * tan θ = (a/b)·tan φ). R(0) = a²/b at the crown, b²/a at the springing
 * (φ = 90°). The arc length is an elliptic integral, evaluated numerically.
 * Any rise is allowed: rise < L/2 is a flat ellipse, rise > L/2 a tall one.
 * @param span clear span L (m)
 * @param rise rise f (m)
 * @returns the profile
 * @example elliptical(8, 2).radius(0) // 8 — a²/b = 16/2
 */
export function elliptical(span: Metres, rise: Metres): Profile {
  requirePositive('elliptical', 'span', span, 'm');
  requirePositive('elliptical', 'rise', rise, 'm');
  const a = span / 2, b = rise;
  const D = (phi: Radians): number => Math.hypot(a * Math.sin(phi), b * Math.cos(phi));
  const radius = (phi: Radians): Metres => (a * a * b * b) / D(phi) ** 3;
  return {
    shape: 'elliptical',
    phiCrown: 0,
    phiSpringing: Math.PI / 2,
    point: (phi) => ({ x: (a * a * Math.sin(phi)) / D(phi), y: (b * b * Math.cos(phi)) / D(phi) }),
    radius,
    arcLength: (phi) => integrate(radius, 0, phi),
  };
}
