/**
 * The options of a dome as a document gives them, checked at the domain edge and turned into the
 * middle surface and the loads the statics needs.
 */

/** Options of `dome`, in SI units (m, rad, N, Pa, N/m³). */
export interface DomeOptions {
  /** "spherical" (default) or "pointed" (each meridian a two-centred arc, centres on the base plane). */
  shape?: string;
  /** Radius of the middle surface's meridian (m), with half_angle; spherical only. */
  radius?: number;
  /** Angle from the crown (the axis) to the base joint, measured at the centre of the meridian (rad). */
  half_angle?: number;
  /** Clear span (inner diameter at the base) and rise of the intrados (m). */
  span?: number; rise?: number;
  thickness?: number;
  unit_weight?: number;
  /** Self-weight per unit surface area (Pa), instead of thickness × unit_weight. */
  g?: number;
  /** Load uniform on plan (Pa): snow, roofing carried on plan. */
  p?: number;
  /** Angle from the axis to the edge of the oculus (rad); 0 (closed) when omitted. */
  oculus_angle?: number;
  /** Total weight of a lantern standing on the oculus ring (N). */
  lantern?: number;
}

/** The checked dome: middle surface and loads. */
export interface DomeInput {
  shape: 'spherical' | 'pointed';
  /** Meridian radius of the middle surface (m) and the offset of its centre across the axis (m), 0 when spherical. */
  a: number; c: number;
  /** φ at the top edge (the apex of a pointed dome, or the oculus) and at the base (rad). */
  phiTop: number; phiBase: number;
  /** True when the top edge is an oculus (open), false at a closed crown or apex. */
  open: boolean;
  t: number; gamma: number;
  /** Self-weight per unit surface (Pa), plan load (Pa), lantern (N). */
  q: number; p: number; P: number;
}

function check(name: string, v: number | undefined, ok: (v: number) => boolean, what: string, unit: string): number | undefined {
  if (v === undefined) return undefined;
  if (!(Number.isFinite(v) && ok(v))) throw new RangeError(`dome: ${name} must be ${what}, got ${v} ${unit}`);
  return v;
}

/**
 * Checks the options of a dome and applies the defaults. Span and rise are the intrados'; the
 * middle surface is the intrados offset by t/2 about the same centre(s). A spherical dome by span and
 * rise is a cap (rise ≤ span/2); a pointed dome by span and rise has its centres on the base plane
 * (rise ≥ span/2), e = (f² − L²/4)/L across the axis, like a pointed arch.
 * @param o options in SI units
 * @returns the middle surface and loads
 * @example domeInput({radius: 5, half_angle: Math.PI / 2, g: 1000}).phiBase // π/2
 */
export function domeInput(o: DomeOptions): DomeInput {
  const shape = o.shape ?? 'spherical';
  if (shape !== 'spherical' && shape !== 'pointed') throw new RangeError(`dome: shape must be "spherical" or "pointed", got "${shape}"`);
  const positive = (v: number) => v > 0, notNeg = (v: number) => v >= 0;
  const t = check('thickness', o.thickness, positive, 'positive', 'm') ?? 0;
  const gamma = check('unit_weight', o.unit_weight, positive, 'positive', 'N/m^3');
  let q = check('g', o.g, notNeg, 'zero or more', 'Pa');
  if (q !== undefined && gamma !== undefined) throw new RangeError('dome: give either g or thickness × unit_weight, not both');
  if (q === undefined) {
    if (gamma === undefined || t === 0) throw new RangeError('dome: self-weight needs g, or thickness and unit_weight');
    q = gamma * t;
  }
  const p = check('p', o.p, notNeg, 'zero or more', 'Pa') ?? 0;
  const P = check('lantern', o.lantern, notNeg, 'zero or more', 'N') ?? 0;
  const byRadius = o.radius !== undefined || o.half_angle !== undefined;
  const bySpan = o.span !== undefined || o.rise !== undefined;
  if (byRadius && bySpan) throw new RangeError('dome: give span and rise, or radius and half_angle, not both');
  let a: number, c = 0, phiBase: number;
  if (byRadius) {
    if (shape === 'pointed') throw new RangeError('dome: a pointed dome is given by span and rise');
    a = check('radius', o.radius, positive, 'positive', 'm') ?? NaN;
    phiBase = check('half_angle', o.half_angle, (v) => v > 0 && v <= Math.PI / 2 * (1 + 1e-12), 'in (0°, 90°]', 'rad') ?? NaN;
    if (!(a > 0) || !(phiBase > 0)) throw new RangeError('dome: radius and half_angle go together');
    if (!(t / 2 < a)) throw new RangeError(`dome: thickness must be less than twice the radius, got ${t} m`);
  } else {
    const L = check('span', o.span, positive, 'positive', 'm'), f = check('rise', o.rise, positive, 'positive', 'm');
    if (L === undefined || f === undefined) throw new RangeError('dome: give span and rise (of the intrados), or radius and half_angle (of the middle surface)');
    if (shape === 'spherical') {
      if (f > (L / 2) * (1 + 1e-12)) throw new RangeError(`dome: a spherical dome has a rise of at most span/2 = ${L / 2} m (a hemisphere), got ${f} m`);
      const ai = (L * L) / 4 / (2 * f) + f / 2;
      a = ai + t / 2;
      phiBase = Math.asin(Math.min(1, L / 2 / ai));
    } else {
      if (f < (L / 2) * (1 - 1e-12)) throw new RangeError(`dome: a pointed dome has a rise of at least span/2 = ${L / 2} m, got ${f} m`);
      c = Math.max(0, (f * f - (L * L) / 4) / L);
      a = L / 2 + c + t / 2;
      phiBase = Math.PI / 2;
    }
  }
  const apex = Math.asin(c / a);
  const oc = check('oculus_angle', o.oculus_angle, (v) => v >= 0 && v < phiBase, `between 0 and the half-angle ${phiBase} rad`, 'rad') ?? 0;
  if (oc > 0 && oc <= apex) throw new RangeError(`dome: the oculus of a pointed dome must open below its apex, at more than ${apex} rad, got ${oc} rad`);
  const open = oc > apex;
  if (P > 0 && !open) throw new RangeError('dome: a lantern stands on the ring of an oculus; give oculus_angle (a point load at a closed crown has no membrane state)');
  return { shape, a, c, phiTop: open ? oc : apex, phiBase, open, t, gamma: gamma ?? (t > 0 ? q / t : 0), q, p, P };
}
