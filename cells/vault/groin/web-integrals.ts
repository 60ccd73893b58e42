/**
 * Surface, load and first moments of one web of a cross vault, integrated in
 * the angle φ of the web's normal.
 */
import { gaussLegendre } from './gauss.js';
import type { BarrelSection } from './sections.js';
import type { WebLoad } from './web-load.js';

export interface WebIntegrals {
  /** Surface area of one web (m²). */
  area: number;
  /** Vertical load on one web (N). */
  load: number;
  /** ∫ u dW over the half web u > 0 (N·m): moment about the web's crown line. */
  momentAlong: number;
  /** ∫ v dW over the whole web (N·m): moment about the centre line of the bay parallel to u. */
  momentAcross: number;
}

/**
 * Integrals over one web of the barrel `own`, bounded by the face arch at
 * v = e (of `other`) and by the groins, where the two middle surfaces meet:
 * v_g(φ) = other.planAt(own.z(φ)). With u = r·sin φ − c, a strip of the web
 * between φ and φ + dφ has surface r·dφ·w and width w = e_other − v_g, so
 *   A = 2∫ w r dφ,  W = 2∫ q w r dφ,  M_u = ∫ u q w r dφ,  M_v = 2∫ q (e² − v_g²)/2 · r dφ,
 * φ from the crown to where the web pinches out at the groin (π/2, or where a
 * stilted neighbour springs). Exact closed forms exist for the square round
 * vault — one web (π − 2)R² — and are checked in the tests; here the
 * integrals are taken by 8-point Gauss–Legendre on 16 panels between the kinks
 * (fill edge), where the integrands are smooth.
 * @param own middle-surface section of the web's own barrel
 * @param other section of the crossing barrel
 * @param load vertical load per unit surface area of this web
 * @returns area, load and moments of one web
 * @example webIntegrals(s.x, s.y, webLoad(s.x, input)).area // (π − 2)R² for a square round vault
 */
export function webIntegrals(own: BarrelSection, other: BarrelSection, load: WebLoad): WebIntegrals {
  const start = own.phiCrown;
  // Does the web pinch out before the springing? Only where the crossing barrel is stilted above it.
  const end = other.s > own.s ? Math.acos(Math.min(1, (other.s - own.s) / own.r)) : Math.PI / 2;
  const cuts = [start, ...load.kinks.filter((k) => k > start && k < end).sort((a, b) => a - b), end];
  const strip = (phi: number): number[] => {
    const vg = other.planAt(own.z(phi));
    const w = other.e - vg;
    const q = load.q(phi);
    return [w * own.r, q * w * own.r, own.u(phi) * q * w * own.r, (q * (other.e ** 2 - vg ** 2) / 2) * own.r];
  };
  const sum = [0, 0, 0, 0];
  for (let i = 0; i + 1 < cuts.length; i++) {
    const part = gaussLegendre(strip, cuts[i]!, cuts[i + 1]!, 16);
    for (let j = 0; j < 4; j++) sum[j] = sum[j]! + part[j]!;
  }
  return { area: 2 * sum[0]!, load: 2 * sum[1]!, momentAlong: sum[2]!, momentAcross: 2 * sum[3]! };
}
