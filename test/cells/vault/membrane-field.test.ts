import { describe, it, expect } from 'vitest';
import { expectClose } from '../../helpers/close.js';
import { offsetProfile, type Profile } from '../../../cells/vault/profile.js';
import { profileFromSpanRise, isCrownRadiusProfile } from '../../../cells/vault/profiles/profileFrom.js';
import { radiusLaw } from '../../../cells/vault/membrane-radius.js';
import { numericRadiusLaw } from '../../../cells/vault/membrane-radius-numeric.js';
import { membraneField } from '../../../cells/vault/membrane-field.js';
import { membraneSummary } from '../../../cells/vault/membrane-summary.js';

/**
 * Closed forms for R = R0·cos^n φ, derived from the membrane equations of a cylindrical shell
 * (Flügge, Stresses in Shells, ch. 3; equations from memory, see membrane-field.ts) with
 * R′/R = −n tan φ:  Nφ = −R (g cos φ + p cos²φ),  Nxφ = −[(n+2) g sin φ + (n+3) p sin φ cos φ]·x,
 * Nx = −[(n+2) g cos φ + (n+3) p cos 2φ]·(l² − x²)/(2R). n = 0 gives the textbook circle.
 */
function closedForm(n: number, R0: number, g: number, p: number, l: number, x: number, phi: number) {
  const c = Math.cos(phi), s = Math.sin(phi), R = R0 * c ** n;
  return {
    N_phi: -R * (g * c + p * c * c),
    N_xphi: -((n + 2) * g * s + (n + 3) * p * s * c) * x,
    N_x: (-((n + 2) * g * c + (n + 3) * p * Math.cos(2 * phi)) * (l * l - x * x)) / (2 * R),
  };
}

const NAMED: Array<[string, Profile]> = [
  ['circular', profileFromSpanRise('circular', 8, 2.5)],
  ['catenary', profileFromSpanRise('catenary', 8, 3)],
  ['parabolic', profileFromSpanRise('parabolic', 8, 3)],
  ['cycloid', profileFromSpanRise('cycloid', 8, 2)],
  ['power n = 0.5', profileFromSpanRise(0.5, 8, 2.4)],
  ['power n = −1.5', profileFromSpanRise(-1.5, 8, 4)],
];
const g = 2400, p = 3000, l = 5;

describe.each(NAMED)('membraneField(law, loads, l) for the %s profile', (_, profile) => {
  if (!isCrownRadiusProfile(profile)) throw new Error('expected a R0·cos^n φ profile');
  const { n, R0, phiSpringing: phiS } = profile;
  const points = [[0, 0], [2, 0.3 * phiS], [-4, 0.7 * phiS], [5, -phiS]] as const;
  const scale = R0 * (g + p);
  type Forces = { N_phi: number; N_xphi: number; N_x: number };
  /** Nφ, Nxφ and Nx of two fields agree at every point, each to its own relative tolerance. */
  const expectForcesClose = (a: (x: number, phi: number) => Forces, b: (x: number, phi: number) => Forces, [tPhi, tXphi, tX]: [number, number, number]) => {
    for (const [x, phi] of points) {
      const [fa, fb] = [a(x, phi), b(x, phi)];
      expectClose(fa.N_phi, fb.N_phi, tPhi, scale);
      expectClose(fa.N_xphi, fb.N_xphi, tXphi, scale);
      expectClose(fa.N_x, fb.N_x, tX, scale);
    }
  };

  it('with the exact radius law equals the closed forms (re-derived from Flügge ch. 3)', () => {
    const field = membraneField(radiusLaw(profile), { g, p }, l);
    expectForcesClose((x, phi) => field.at(x, phi), (x, phi) => closedForm(n, R0, g, p, l, x, phi), [1e-12, 1e-12, 1e-12]);
  });

  it('with the numerical (Chebyshev) radius law, the general R(φ) solution equals the closed forms', () => {
    const field = membraneField(numericRadiusLaw(profile), { g, p }, l);
    expectForcesClose((x, phi) => field.at(x, phi), (x, phi) => closedForm(n, R0, g, p, l, x, phi), [1e-9, 1e-9, 1e-7]);
  });

  it('radiusLaw(profile, d) (exact R′, R″ of the offset) agrees with the numerical law of offsetProfile(profile, d)', () => {
    const exact = membraneField(radiusLaw(profile, 0.2), { g, p }, l);
    const numeric = membraneField(numericRadiusLaw(offsetProfile(profile, 0.2)), { g, p }, l);
    for (const [x, phi] of points) {
      const a = exact.at(x, phi), b = numeric.at(x, phi);
      expectClose(a.N_xphi, b.N_xphi, 1e-9, scale);
      expectClose(a.N_x, b.N_x, 1e-7, scale);
    }
  });
});

describe('membraneSummary on profiles outside the cos^n family (numerical radius law)', () => {
  it.each([[8, 2], [6, 4.5]])('elliptical(%d, %d): edge reactions balance the total load (statics)', (span, rise) => {
    const e = profileFromSpanRise('elliptical', span, rise);
    const m = membraneSummary(e, radiusLaw(e), { g: 2000, p: 1500 }, 4);
    expectClose(2 * 8 * m.V_wall + 2 * m.end_shear, m.W, 1e-9);
    // A semi-ellipse meets the wall with a vertical tangent, so Nφ there has no horizontal component.
    expectClose(m.H_wall, 0, 1e-12, 1e3);
  });

  it('refuses a pointed profile: its apex would need a ridge line load that a membrane cannot supply', () => {
    const pt = profileFromSpanRise('pointed', 6);
    expect(() => membraneSummary(pt, radiusLaw(pt), { g: 2000, p: 0 }, 4)).toThrow(/not smooth at the crown/);
  });
});
