import { describe, it, expect } from 'vitest';
import { groinVault } from '../../../../cells/vault/groin/groin-vault.js';
import { webMembrane } from '../../../../cells/vault/groin/web-membrane.js';
import { expectClose } from '../../../helpers/close.js';

describe('webMembrane, self-weight only', () => {
  const R = 4, g = 3e3;
  const v = groinVault({ span_x: 2 * R, g });

  it('webMembrane(v, x, φ) is the circular barrel under dead weight (Timoshenko & Woinowsky-Krieger §110; l = half length, from memory)', () => {
    // N_φ = −gR cos φ; N_xφ = −2g x sin φ; N_x = −(g/R) cos φ (l² − x²), l = R between the face arches.
    for (const [x, phi] of [[3, 0.3], [-3.5, 1.0], [4, 0.7], [-4, 1.5]] as const) {
      const m = webMembrane(v, x, phi);
      expectClose(m.N_phi, -g * R * Math.cos(phi), 1e-12);
      expectClose(m.N_xphi, -2 * g * x * Math.sin(phi), 1e-7);
      expectClose(m.N_x, -(g / R) * Math.cos(phi) * (R * R - x * x), 1e-7, 1e-3);
    }
  });

  it('webMembrane: N_x = 0 where the web meets the face arch, N_xφ = 0 along the crown line', () => {
    expect(Math.abs(webMembrane(v, R, 0.8).N_x)).toBeLessThan(1e-9 * g * R);
    expect(Math.abs(webMembrane(v, -R, 0.2, 'y').N_x)).toBeLessThan(1e-9 * g * R);
    expect(Math.abs(webMembrane(v, 2, 0).N_xphi)).toBeLessThan(1e-9 * g * R);
  });

  it('webMembrane refuses points beyond the groin, off the arc, or an unknown web', () => {
    // At φ = 0.5 the x-web runs from the groin at |x| = R sin 0.5 to the face arch.
    expect(() => webMembrane(v, 0.5 * R * Math.sin(0.5), 0.5)).toThrow(/groin/);
    expect(() => webMembrane(v, 3, -0.1)).toThrow(RangeError);
    expect(() => webMembrane(v, 5, 0.3)).toThrow(/face arches/);
    expect(() => webMembrane(v, 3, 0.3, 'z')).toThrow(/web must be "x" or "y"/);
  });
});

describe('webMembrane under dead, live and pocket fill', () => {
  const v = groinVault({ span_x: 9, span_y: 7, thickness: 0.3, unit_weight: 18e3, dead: 1.2e3, live: 2e3, fill_level: 2.2, fill_unit_weight: 16e3 });

  it('webMembrane satisfies the three membrane equilibrium equations of a shell element (Flügge ch. 3), checked by finite differences', () => {
    for (const web of ['x', 'y'] as const) {
      const r = v.model[web].section.r, q = v.model[web].load.q;
      const l = v.model[web === 'x' ? 'y' : 'x'].section.e;
      for (const phi of [0.25, 0.6, 1.0, 1.3]) {
        // Halfway between the groin and the face arch.
        const x = (v.model[web === 'x' ? 'y' : 'x'].section.planAt(v.model[web].section.z(phi)) + l) / 2;
        const dx = 1e-4, dp = 1e-4;
        const m = webMembrane(v, x, phi, web);
        // Radial: N_φ/R = p_r = −q cos φ.
        expectClose(m.N_phi / r, -q(phi) * Math.cos(phi), 1e-12);
        // Tangential: ∂N_xφ/∂x + (1/R)∂N_φ/∂φ + p_φ = 0.
        const dNxphi = (webMembrane(v, x + dx, phi, web).N_xphi - webMembrane(v, x - dx, phi, web).N_xphi) / (2 * dx);
        const dNphi = (webMembrane(v, x, phi + dp, web).N_phi - webMembrane(v, x, phi - dp, web).N_phi) / (2 * dp);
        expect(Math.abs(dNxphi + dNphi / r + q(phi) * Math.sin(phi))).toBeLessThan(1e-5 * q(phi));
        // Along the generators: ∂N_x/∂x + (1/R)∂N_xφ/∂φ = 0.
        const dNx = (webMembrane(v, x + dx, phi, web).N_x - webMembrane(v, x - dx, phi, web).N_x) / (2 * dx);
        const dNxphiPhi = (webMembrane(v, x, phi + dp, web).N_xphi - webMembrane(v, x, phi - dp, web).N_xphi) / (2 * dp);
        expect(Math.abs(dNx + dNxphiPhi / r)).toBeLessThan(1e-4 * q(phi) * l);
      }
    }
  });

  it('webMembrane: the hoop forces along the crown add up to the force across the cut', () => {
    // ∫ N_φ cos φ_crown dx over the crowns of both x-webs (2·2e_y of crown line, N_φ uniform along it).
    const ey = v.model.y.section.e;
    expectClose(-webMembrane(v, 0.5 * ey, 0).N_phi * 4 * ey, 2 * v.thrust_cut, 1e-12);
  });
});
