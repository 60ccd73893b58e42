/**
 * Radius law of an arbitrary smooth profile, by a Chebyshev fit of R(φ).
 */
import type { Profile, Radians } from './profile.js';
import { lawFromDerivatives, type RadiusLaw } from './membrane-radius-law.js';

/** Chebyshev coefficients of the interpolant through f at the N+1 Lobatto points cos(πj/N). */
function coefficients(f: (t: number) => number, N: number): number[] {
  const v = Array.from({ length: N + 1 }, (_, j) => f(Math.cos((Math.PI * j) / N)));
  return Array.from({ length: N + 1 }, (_, k) => {
    let sum = 0;
    for (let j = 0; j <= N; j++) sum += (j === 0 || j === N ? 0.5 : 1) * v[j]! * Math.cos((Math.PI * j * k) / N);
    return ((k === 0 || k === N ? 1 : 2) / N) * sum;
  });
}

/** Coefficients of the derivative d/dt of Σ c_k T_k(t) (Mason & Handscomb, Chebyshev Polynomials, 2003, §2.4.5). */
function derivative(c: number[]): number[] {
  const N = c.length - 1, d = new Array<number>(N + 2).fill(0);
  for (let k = N; k >= 1; k--) d[k - 1] = d[k + 1]! + 2 * k * c[k]!;
  d[0]! /= 2;
  return d.slice(0, N + 1);
}

/** Σ c_k T_k(t) by Clenshaw's recurrence. */
function clenshaw(c: number[], t: number): number {
  let b1 = 0, b2 = 0;
  for (let k = c.length - 1; k >= 1; k--) [b1, b2] = [2 * t * b1 - b2 + c[k]!, b1];
  return t * b1 - b2 + c[0]!;
}

/**
 * Radius law of any smooth profile: R(φ) is interpolated at Chebyshev–Lobatto
 * points of [phiCrown, phiSpringing] (never outside the curve), the degree
 * doubled from 32 up to 512 until the last coefficients fall below 1e-14 of
 * the largest, and R′, R″ taken from the differentiated series. For a radius
 * analytic on the interval this converges geometrically (Trefethen,
 * Approximation Theory and Approximation Practice, 2013, ch. 8 and 21).
 * @param profile smooth profile with R > 0 on the whole interval
 * @returns the law, φ in [phiCrown, phiSpringing]
 * @example numericRadiusLaw(elliptical(8, 2)).R(0) // 8
 */
export function numericRadiusLaw(profile: Profile): RadiusLaw {
  const lo = profile.phiCrown, hi = profile.phiSpringing, half = (hi - lo) / 2;
  const fromT = (t: number): Radians => lo + half * (t + 1);
  const toT = (phi: Radians): number => (phi - lo) / half - 1;
  let c: number[] = [];
  for (let N = 32; N <= 512; N *= 2) {
    c = coefficients((t) => profile.radius(fromT(t)), N);
    const top = Math.max(...c.map(Math.abs));
    if (Math.max(...c.slice(-3).map(Math.abs)) <= 1e-14 * top) break;
  }
  if (!c.every(Number.isFinite)) throw new RangeError(`${profile.shape}: radius of curvature is not finite on the profile`);
  const d1 = derivative(c), d2 = derivative(d1);
  return lawFromDerivatives(
    hi,
    (phi) => clenshaw(c, toT(phi)),
    (phi) => clenshaw(d1, toT(phi)) / half,
    (phi) => clenshaw(d2, toT(phi)) / (half * half),
  );
}
