/**
 * The vertical load a web carries, per unit of its surface area, as a
 * function of φ alone: every load on a barrel web is uniform along its
 * generators, which is what lets the web be treated as a barrel segment.
 */
import type { BarrelSection } from './sections.js';
import type { GroinInput } from './options.js';

export interface WebLoad {
  /** Vertical load per unit surface area at φ (Pa). */
  q(phi: number): number;
  /** φ inside (phiCrown, π/2) where the load has a kink: the edge of the pocket fill. */
  kinks: number[];
}

/**
 * Vertical load per unit surface area of a web:
 *   q(φ) = g + (p + γ_f·⟨z_f − z_e(φ)⟩)·cos φ,
 * where g is the self-weight per unit surface, p the dead + live load per unit
 * plan area (a plan area dA·cos φ of surface dA), and the fill is the depth of
 * fill above the web's own extrados z_e at that plan point (the extrados is the
 * circle of radius r + t/2 about the web's centre), ⟨·⟩ = max(0, ·).
 * Projection of plan loads onto the surface: Flügge, Stresses in Shells, ch. 3.
 * @param sec middle-surface section of the web's barrel
 * @param input checked vault options
 * @returns q(φ) and the fill edge
 * @example webLoad(groinSections(8, 8, 'semicircular', 0).x, input).q(0) // g + p
 */
export function webLoad(sec: BarrelSection, input: GroinInput): WebLoad {
  const { g, plan, fillLevel, fillWeight } = input;
  const q = (phi: number): number => {
    const fill = fillWeight * Math.max(0, fillLevel - sec.extrados(phi));
    return g + (plan + fill) * Math.cos(phi);
  };
  const kinks: number[] = [];
  // Where does the extrados pass through the fill level? sin φ = √((r+h)² − (z_f − s)²)/r.
  const dz = fillLevel - sec.s;
  if (fillWeight > 0 && dz > 0 && dz < sec.r + sec.h) {
    const sin = Math.sqrt((sec.r + sec.h) ** 2 - dz * dz) / sec.r;
    if (sin > Math.sin(sec.phiCrown) && sin < 1) kinks.push(Math.asin(sin));
  }
  return { q, kinks };
}
