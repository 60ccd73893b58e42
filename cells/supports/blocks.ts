/**
 * The masonry of a wall or buttress as a stack of rectangular blocks, and the
 * options of the support checked at the domain edge.
 */

/** Options of `buttress`, in SI units (m, N, Pa, N/m³). */
export interface ButtressOptions {
  /** Total height from the base to the top (m). */
  height: number;
  /** Width in the direction of the thrust at the top block (m); the whole width when there are no steps. */
  width: number;
  /** Dimension perpendicular to the thrust (m): 1 m for a wall checked per metre. */
  depth: number;
  unit_weight: number;
  /** Horizontal thrust of the vault, pushing outwards (N); zero for a wall under vertical load only. */
  T: number;
  /** Height of the thrust above the base (m); needed when T > 0. */
  z_T?: number;
  /** Vertical load from the vault (N), at x_V from the inner face (m). */
  V?: number;
  x_V?: number;
  /** Wider blocks below the top one, listed from the base up, aligned at the inner face. */
  steps?: Array<{ height: number; width: number }>;
  /** Coefficient of friction at the base, in (0, 1.5]. */
  friction?: number;
  /** Allowable bearing pressure under the base (Pa). */
  bearing?: number;
}

/** One block: base level z0, height h and width b, spanning 0 ≤ x ≤ b from the inner face. */
export interface Block { z0: number; h: number; b: number }

function positive(name: string, v: number | undefined, unit: string): number {
  if (!(typeof v === 'number' && Number.isFinite(v) && v > 0)) throw new RangeError(`buttress: ${name} must be positive, got ${v} ${unit}`);
  return v;
}

/**
 * Checks the support's options and stacks its blocks. Steps are setbacks of
 * the outer face: each step is a block of its own height and width, stacked
 * from the base up with the inner (vault-side) face plumb; the top block has
 * the given `width` and the rest of the height.
 * @param o options in SI units
 * @returns the blocks from the base up
 * @example buttressBlocks({height: 6, width: 1, depth: 1, unit_weight: 2e4, T: 1e4, z_T: 6, steps: [{height: 2, width: 1.5}]})
 *   // [{z0: 0, h: 2, b: 1.5}, {z0: 2, h: 4, b: 1}]
 */
export function buttressBlocks(o: ButtressOptions): Block[] {
  const height = positive('height', o.height, 'm');
  positive('width', o.width, 'm');
  positive('depth', o.depth, 'm');
  positive('unit_weight', o.unit_weight, 'N/m^3');
  if (!(typeof o.T === 'number' && Number.isFinite(o.T) && o.T >= 0)) throw new RangeError(`buttress: T must be zero or more, got ${o.T} N`);
  if (o.T > 0 && o.z_T === undefined) throw new RangeError('buttress: z_T, the height of the thrust above the base, is required when T > 0');
  if (o.z_T !== undefined && !(o.z_T > 0)) throw new RangeError(`buttress: z_T must be above the base, got ${o.z_T} m`);
  if (o.z_T !== undefined && o.z_T > height) throw new RangeError(`buttress: the thrust acts at z_T = ${o.z_T} m, above the top of the buttress (height ${height} m)`);
  if (o.V !== undefined && !(o.V >= 0)) throw new RangeError(`buttress: V must be zero or more, got ${o.V} N`);
  if (o.x_V !== undefined && !(o.x_V >= 0 && o.x_V <= o.width)) {
    throw new RangeError(`buttress: x_V must lie on the top, between 0 and width ${o.width} m from the inner face, got ${o.x_V} m`);
  }
  if (o.friction !== undefined && !(o.friction > 0 && o.friction <= 1.5)) {
    throw new RangeError(`buttress: friction must be in (0, 1.5], got ${o.friction}`);
  }
  if (o.bearing !== undefined) positive('bearing', o.bearing, 'Pa');
  const blocks: Block[] = [];
  let z = 0;
  (o.steps ?? []).forEach((s, i) => {
    const h = positive(`steps[${i + 1}].height`, s.height, 'm');
    blocks.push({ z0: z, h, b: positive(`steps[${i + 1}].width`, s.width, 'm') });
    z += h;
  });
  if (!(z < height)) throw new RangeError(`buttress: the steps add up to ${z} m, which leaves nothing of the height ${height} m for the top block`);
  blocks.push({ z0: z, h: height - z, b: o.width });
  return blocks;
}
