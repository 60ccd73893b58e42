/**
 * The options of a cross vault as a document gives them, checked at the
 * domain edge and turned into the few numbers the statics needs.
 */

/** Options of `groin_vault`, in SI units (m, Pa = N/m², N/m³). */
export interface GroinVaultOptions {
  /** Clear span of the barrel spanning x: the bay's side along x (m). */
  span_x: number;
  /** Clear span of the barrel spanning y (m); the plan is square when omitted. */
  span_y?: number;
  /** "semicircular" (default) or "pointed". */
  shape?: string;
  /** Shell thickness (m); 0 (a thin shell) when omitted and g is given. */
  thickness?: number;
  /** Unit weight of the masonry (N/m³); self-weight = thickness × unit_weight. */
  unit_weight?: number;
  /** Self-weight per unit surface area (Pa), instead of thickness × unit_weight. */
  g?: number;
  /** Height of the pocket fill above the springing (m). */
  fill_level?: number;
  /** Unit weight of the fill (N/m³). */
  fill_unit_weight?: number;
  /** Superimposed dead load per unit plan area (Pa). */
  dead?: number;
  /** Live load per unit plan area (Pa). */
  live?: number;
}

/** Checked options: plain numbers, defaults applied. */
export interface GroinInput {
  spanX: number; spanY: number; shape: 'semicircular' | 'pointed'; t: number;
  /** Self-weight per unit surface area (Pa). */
  g: number;
  /** Dead + live per unit plan area (Pa). */
  plan: number;
  fillLevel: number; fillWeight: number;
}

function positive(name: string, v: number | undefined, unit: string): number | undefined {
  if (v === undefined) return undefined;
  if (!(Number.isFinite(v) && v > 0)) throw new RangeError(`groin_vault: ${name} must be positive, got ${v} ${unit}`);
  return v;
}

function notNegative(name: string, v: number | undefined, unit: string): number {
  if (v === undefined) return 0;
  if (!(Number.isFinite(v) && v >= 0)) throw new RangeError(`groin_vault: ${name} must be zero or more, got ${v} ${unit}`);
  return v;
}

/**
 * Checks the options of a cross vault and applies the defaults.
 * @param o options in SI units
 * @returns plain numbers for the statics
 * @example groinInput({span_x: 8, g: 3600}).spanY // 8
 */
export function groinInput(o: GroinVaultOptions): GroinInput {
  const spanX = positive('span_x', o.span_x, 'm');
  if (spanX === undefined) throw new RangeError('groin_vault: span_x is required');
  const spanY = positive('span_y', o.span_y, 'm') ?? spanX;
  const shape = o.shape ?? 'semicircular';
  if (shape !== 'semicircular' && shape !== 'pointed') {
    throw new RangeError(`groin_vault: shape must be "semicircular" or "pointed", got "${shape}"`);
  }
  const t = positive('thickness', o.thickness, 'm') ?? 0;
  if (t >= Math.min(spanX, spanY) / 2) {
    throw new RangeError(`groin_vault: thickness must be less than half the smaller span, got ${t} m`);
  }
  const gamma = positive('unit_weight', o.unit_weight, 'N/m^3');
  let g = positive('g', o.g, 'Pa');
  if (g !== undefined && gamma !== undefined) {
    throw new RangeError('groin_vault: give either g or thickness × unit_weight, not both');
  }
  if (g === undefined) {
    if (gamma === undefined || t === 0) throw new RangeError('groin_vault: self-weight needs g, or thickness and unit_weight');
    g = gamma * t;
  }
  const fillLevel = notNegative('fill_level', o.fill_level, 'm');
  const fillWeight = notNegative('fill_unit_weight', o.fill_unit_weight, 'N/m^3');
  if (fillLevel > 0 && fillWeight === 0) throw new RangeError('groin_vault: fill_level needs fill_unit_weight');
  const plan = notNegative('dead', o.dead, 'Pa') + notNegative('live', o.live, 'Pa');
  return { spanX, spanY, shape, t, g, plan, fillLevel, fillWeight };
}
