/**
 * Sources: standard calculus. For a curve parametrised by the normal's inclination φ, |dP/dφ| is the
 * radius of curvature and the tangent makes the angle φ with the horizontal; arc length is the limit of
 * chord lengths. Radii of the named curves (catenary a/cos²φ, parabola p/cos³φ, cycloid 4r·cos φ) as
 * listed in ../shared/REFERENCES.md ("Profile geometry", standard calculus).
 */
import { describe, it, expect } from 'vitest';
import { expectClose } from '../../../helpers/close.js';
import { offsetProfile, type Profile } from '../../../../cells/vault/profile.js';
import {
  profileFromSpanRise, profileFromCrownRadius, PROFILE_EXPONENTS, isCrownRadiusProfile,
} from '../../../../cells/vault/profiles/profileFrom.js';
import { powerArc, power } from '../../../../cells/vault/profiles/power.js';
import { pointed } from '../../../../cells/vault/profiles/pointed.js';

/** dP/dφ by a 4th-order central difference of point(φ), independent of radius(). */
function tangent(p: Profile, phi: number, h = 1e-4): { x: number; y: number } {
  const at = (k: number) => p.point(phi + k * h);
  const [a, b, c, d] = [at(-2), at(-1), at(1), at(2)];
  return {
    x: (a.x - 8 * b.x + 8 * c.x - d.x) / (12 * h),
    y: (a.y - 8 * b.y + 8 * c.y - d.y) / (12 * h),
  };
}

/** Length of the polyline through point(φ), Richardson-extrapolated from N and 2N chords. */
function chordLength(p: Profile, phi0: number, phi1: number, N = 400): number {
  const poly = (m: number) => {
    let s = 0, prev = p.point(phi0);
    for (let i = 1; i <= m; i++) {
      const q = p.point(phi0 + ((phi1 - phi0) * i) / m);
      s += Math.hypot(q.x - prev.x, q.y - prev.y);
      prev = q;
    }
    return s;
  };
  const a = poly(N), b = poly(2 * N);
  return b + (b - a) / 3;
}

const CASES: Array<[Parameters<typeof profileFromSpanRise>[0], number, number]> = [
  ['circular', 8, 4], ['circular', 8, 1.5], ['pointed', 6, 6], ['pointed', 6, 3.2],
  ['elliptical', 8, 2], ['elliptical', 4, 3], ['parabolic', 8, 2], ['parabolic', 3, 5],
  ['catenary', 10, 5], ['catenary', 12, 0.8], ['cycloid', 2 * Math.PI, 2], ['cycloid', 9, 1.5],
  [0.5, 7, 2.5], [-1, 6, 2], [-2.5, 6, 2],
];

describe.each(CASES)('profileFromSpanRise(%s, %d, %d)', (shape, span, rise) => {
  const p = profileFromSpanRise(shape, span, rise);
  // Inner points only, where the central difference stencil stays on the curve's domain.
  const phis = [0.15, 0.35, 0.55, 0.75, 0.95].map((t) => p.phiCrown + t * (p.phiSpringing - p.phiCrown - 3e-4));

  it('reproduces the span and the rise (definition of the protocol)', () => {
    const crown = p.point(p.phiCrown), spring = p.point(p.phiSpringing);
    expectClose(crown.x, 0, 1e-12, 1);
    expectClose(crown.y, rise, 1e-11);
    expectClose(spring.x, span / 2, 1e-11);
    expectClose(spring.y, 0, 1e-12, rise);
  });

  it('is parametrised by the inclination of the normal: dP/dφ = R·(cos φ, −sin φ) (plane curve calculus, R = ds/dφ)', () => {
    for (const phi of phis) {
      const t = tangent(p, phi);
      expectClose(Math.hypot(t.x, t.y), p.radius(phi), 1e-8);
      expectClose(Math.atan2(-t.y, t.x), phi, 1e-8);
    }
  });

  it('arcLength(φ) matches the length of a fine polyline through point(φ) (numeric integration)', () => {
    for (const phi of [phis[1]!, p.phiSpringing]) {
      expectClose(p.arcLength(phi), chordLength(p, p.phiCrown, phi), 1e-9);
    }
    expect(p.arcLength(p.phiCrown)).toBe(0);
  });

  it('offsetProfile(p, d) is the parallel curve: points a distance |d| apart along the normal, radius R + d', () => {
    const d = 0.05 * rise;
    const o = offsetProfile(p, d);
    for (const phi of phis) {
      const a = p.point(phi), b = o.point(phi);
      expectClose(Math.hypot(b.x - a.x, b.y - a.y), d, 1e-12);
      const t = tangent(o, phi);
      expectClose(Math.hypot(t.x, t.y), p.radius(phi) + d, 1e-8);
    }
    expectClose(o.arcLength(p.phiSpringing), chordLength(o, p.phiCrown, p.phiSpringing), 1e-9);
  });
});

describe('profile closed forms (standard calculus, as listed in REFERENCES.md)', () => {
  it('profileFromSpanRise("parabolic", L, f) lies on y = 4f·x(L − x)/L², with R = (L²/8f)/cos³φ', () => {
    const L = 8, f = 2, p = profileFromSpanRise('parabolic', L, f);
    for (const phi of [0.2, 0.6, 1.0]) {
      const q = p.point(phi), xs = q.x + L / 2; // x from the left springing
      expectClose(q.y, (4 * f * xs * (L - xs)) / (L * L), 1e-12);
      expectClose(p.radius(phi), (L * L) / (8 * f) / Math.cos(phi) ** 3, 1e-12);
    }
  });

  it('profileFromSpanRise("catenary", L, f) lies on y = f + a − a·cosh(x/a) with R = a/cos²φ', () => {
    const p = profileFromSpanRise('catenary', 10, 5);
    if (!isCrownRadiusProfile(p)) throw new Error('expected R0 and n');
    const a = p.R0;
    for (const phi of [0.3, 0.9]) {
      const q = p.point(phi);
      expectClose(q.y, 5 + a - a * Math.cosh(q.x / a), 1e-11);
      expectClose(p.radius(phi), a / Math.cos(phi) ** 2, 1e-12);
    }
    expectClose(5 + a - a * Math.cosh(5 / a), 0, 1e-12, 1); // the springing is on y = 0
  });

  it('profileFromSpanRise("cycloid", 2πr, 2r) is the full cycloid: R = 4r·cos φ, half-angle 90°', () => {
    const r = 1.3, p = profileFromSpanRise('cycloid', 2 * Math.PI * r, 2 * r);
    expectClose(p.phiSpringing, Math.PI / 2, 1e-12);
    expectClose(p.radius(0.7), 4 * r * Math.cos(0.7), 1e-12);
    expectClose(p.arcLength(Math.PI / 2), 4 * r, 1e-12); // half of the 8r arch of a cycloid
  });

  it('profileFromSpanRise("elliptical", L, f) lies on x²/a² + y²/b² = 1 with R = a²/b at the crown, b²/a at the springing', () => {
    const p = profileFromSpanRise('elliptical', 8, 2);
    for (const phi of [0.1, 0.8, 1.4]) {
      const q = p.point(phi);
      expectClose(q.x ** 2 / 16 + q.y ** 2 / 4, 1, 1e-12);
    }
    expectClose(p.radius(0), 8, 1e-12);
    expectClose(p.radius(Math.PI / 2), 1, 1e-12);
  });

  it('pointed(L) is equilateral by default: radius L, apex angle 30° from the vertical, rise L·√3/2', () => {
    const p = pointed(6);
    expectClose(p.radius(1), 6, 1e-12);
    expectClose(p.phiCrown, Math.PI / 6, 1e-12);
    expectClose(p.point(p.phiCrown).y, 3 * Math.sqrt(3), 1e-12);
    expect(p.phiCrown).toBeGreaterThan(0);
  });

  it('circular(L, L/2) is the semicircle and circular(L, f) has R = (L²/4 + f²)/(2f)', () => {
    const s = profileFromSpanRise('circular', 8, 4), seg = profileFromSpanRise('circular', 8, 1);
    expectClose(s.phiSpringing, Math.PI / 2, 1e-15);
    expectClose(seg.radius(0.1), (16 + 1) / 2, 1e-12);
  });
});

describe('the R0·cos^n φ family', () => {
  it('PROFILE_EXPONENTS maps circle 0, cycloid 1, catenary −2, parabola −3', () => {
    expect(PROFILE_EXPONENTS).toEqual({ circular: 0, cycloid: 1, catenary: -2, parabolic: -3 });
  });

  it.each(Object.entries(PROFILE_EXPONENTS))('powerArc(n, R0, φs) integrated numerically equals the %s closed form', (shape, n) => {
    const phiS = n < 0 ? 1.1 : Math.PI / 2;
    const named = profileFromCrownRadius(shape as keyof typeof PROFILE_EXPONENTS, 2.5, phiS);
    const generic = powerArc(n, 2.5, phiS);
    expect(named.shape).toBe(shape);
    for (const phi of [0.2, 0.7, phiS]) {
      expectClose(generic.point(phi).x, named.point(phi).x, 1e-12);
      expectClose(generic.point(phi).y, named.point(phi).y, 1e-12, 1);
      expectClose(generic.arcLength(phi), named.arcLength(phi), 1e-12);
      expectClose(generic.radius(phi), named.radius(phi), 1e-12, 1);
    }
  });

  it.each(Object.entries(PROFILE_EXPONENTS).filter(([s]) => s !== 'cycloid'))('power(n, L, f) solves the same span and rise as %s', (shape, n) => {
    const a = power(n, 7, 2.2), b = profileFromSpanRise(shape as 'circular', 7, 2.2);
    if (!isCrownRadiusProfile(b)) throw new Error('expected R0 and n');
    expectClose(a.R0, b.R0, 1e-12);
    expectClose(a.phiSpringing, b.phiSpringing, 1e-12);
  });

  it('power(1, L, f) solves the same span and rise as the cycloid', () => {
    const a = power(1, 9, 1.5), b = profileFromSpanRise('cycloid', 9, 1.5);
    if (!isCrownRadiusProfile(b)) throw new Error('expected R0 and n');
    expectClose(a.R0, b.R0, 1e-12);
  });

  it('profileFromCrownRadius(n, …) with a named exponent returns the named closed form', () => {
    expect(profileFromCrownRadius(-2, 3, 1).shape).toBe('catenary');
    expect(profileFromCrownRadius(0.5, 3, 1).shape).toBe('power');
  });
});

describe('profile domain errors', () => {
  it.each([
    [() => profileFromSpanRise('circular', -6, 2), /circular: span must be positive, got -6 m/],
    [() => profileFromSpanRise('catenary', 0, 2), /catenary: span must be positive, got 0 m/],
    [() => profileFromSpanRise('parabolic', 6, -0.2), /parabolic: rise must be positive, got -0.2 m/],
    [() => profileFromSpanRise('circular', 6, 3.5), /circular: rise must be at most span\/2/],
    [() => profileFromSpanRise('cycloid', 6, 2.5), /cycloid: rise must be at most span\/π/],
    [() => profileFromSpanRise('pointed', 6, 2), /pointed: rise must be at least span\/2/],
    [() => profileFromCrownRadius('catenary', 3, Math.PI / 2), /catenary: half_angle must be below 90°, got 90°/],
    [() => profileFromCrownRadius('parabolic', 3, 1.7), /parabolic: half_angle must be below 90°/],
    [() => profileFromCrownRadius(-0.5, 3, Math.PI / 2), /power: half_angle must be below 90° for n = -0.5/],
    [() => profileFromSpanRise('ogee' as 'circular', 6, 2), /unknown shape "ogee"/],
    [() => profileFromSpanRise('circular', 6), /circular: rise is required/],
    [() => profileFromSpanRise('circular', NaN, 2), /circular: span must be positive, got NaN m/],
  ])('%#: throws a RangeError naming the option', (fn, message) => {
    expect(fn).toThrow(RangeError);
    expect(fn).toThrow(message);
  });
});
