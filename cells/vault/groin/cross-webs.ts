/**
 * The webs of a cross vault of any bay, as circular arcs (one- or two-centred) of their middle
 * surface, with the crowns of the two directions brought to one height.
 */

/** One barrel of the bay, by the middle surface of its webs. Heights above the springing of the bay. */
export interface WebArc {
  /** "semicircular", "segmental", "pointed" or "stilted": the family of this web's intrados. */
  shape: string;
  /** Clear span (m), rise of the intrados arc above its own springing (m), and the stilt below it (m). */
  span: number; rise: number; stilt: number;
  /** Radius of the middle surface (m); how far the centre of the right half lies across the axis (m, 0 when one-centred); height of the centre (m). */
  r: number; c: number; zc: number;
  /** φ at the crown (0, or the apex of a pointed web) and at the springing joint (rad). */
  phiC: number; phiEnd: number;
  /** Half-thickness (m). */
  h: number;
  /** Plan half-span of the middle surface at its springing joint (m): where the corner stands. */
  e: number;
  /** Height of the middle surface at the crown (m). */
  crown: number;
}

/** Plan position of the middle surface at φ (m). */
export const webU = (w: WebArc, phi: number): number => w.r * Math.sin(phi) - w.c;
/** Height of the middle surface at φ (m). */
export const webZ = (w: WebArc, phi: number): number => w.zc + w.r * Math.cos(phi);

/** Height of the middle surface over the plan point u (0 ≤ u ≤ e), m. */
export function webZAtPlan(w: WebArc, u: number): number {
  const s = (Math.min(Math.max(u, 0), w.e) + w.c) / w.r;
  return Math.max(webZ(w, w.phiEnd), w.zc + w.r * Math.sqrt(Math.max(0, 1 - s * s)));
}

/** φ at which the middle surface stands at height z, clamped to [phiC, phiEnd]. */
export function webPhiAt(w: WebArc, z: number): number {
  const cos = (z - w.zc) / w.r;
  const phi = Math.acos(Math.min(1, Math.max(-1, cos)));
  return Math.min(w.phiEnd, Math.max(w.phiC, phi));
}

function arc(shape: string, span: number, rise: number, stilt: number, rho: number, c: number, zcIntrados: number, phiEnd: number, h: number): WebArc {
  const r = rho + h;
  const phiC = Math.asin(c / r);
  return {
    shape, span, rise, stilt, r, c, zc: zcIntrados, phiC, phiEnd, h,
    e: r * Math.sin(phiEnd) - c, crown: zcIntrados + Math.sqrt(r * r - c * c),
  };
}

/**
 * The wide web from its own shape; the narrow web is brought to the same crown height (of the middle
 * surface) with its own curvature where its family allows — a segmental web with the same rise, a
 * pointed web two-centred through the same crown — and otherwise (a semicircular or stilted narrow
 * web, or a segmental one whose rise would exceed its half-span) as a semicircle raised on a stilt.
 * Geometry of the circle only (chord and sagitta: ρ = (A² + F²)/(2F); two-centred: ρ = (A² + F²)/(2A)).
 * @param spanX clear span of the webs spanning x (m); spanY likewise
 * @param shape "semicircular", "segmental", "pointed" or "stilted"
 * @param t thickness (m)
 * @param rise rise of the wider web's intrados arc (m): required for segmental, optional for pointed (equilateral)
 * @param stilt stilt under both webs (m), for "stilted"
 * @returns the two webs
 * @example crossWebs(6, 4.2, 'pointed', 0.2).y.crown // = crossWebs(6, 4.2, 'pointed', 0.2).x.crown
 */
export function crossWebs(spanX: number, spanY: number, shape: string, t: number, rise?: number, stilt = 0): { x: WebArc; y: WebArc } {
  const h = t / 2, Ax = spanX / 2, Ay = spanY / 2, Aw = Math.max(Ax, Ay);
  const semicircle = (A: number, S: number) => arc(S > 0 ? 'stilted' : 'semicircular', 2 * A, A, S, A, 0, S, Math.PI / 2, h);
  let wide: (A: number) => WebArc, Hm: number;
  switch (shape) {
    // The stilts and rises are written as differences of the given lengths, not recovered from the crown
    // height Hm: (stilt + Aw + h) − A − h left a residue of ~1e-16 m, so a square semicircular web came out "stilted".
    case 'semicircular':
    case 'stilted': {
      Hm = stilt + Aw + h;
      wide = (A) => semicircle(A, stilt + (Aw - A));
      break;
    }
    case 'segmental': {
      const F = rise!;
      Hm = stilt + F + h;
      wide = (A) => {
        const f = F;
        if (f >= A) return semicircle(A, stilt + (F - A));
        const rho = (A * A + f * f) / (2 * f);
        return arc('segmental', 2 * A, f, stilt, rho, 0, stilt + f - rho, Math.asin(A / rho), h);
      };
      break;
    }
    case 'pointed': {
      const F = rise ?? Aw * Math.sqrt(3);
      const rhoW = (Aw * Aw + F * F) / (2 * Aw);
      Hm = stilt + Math.sqrt((rhoW + h) ** 2 - (rhoW - Aw) ** 2);
      wide = (A) => {
        const H = Hm - stilt;
        const rho = A === Aw ? rhoW : (H * H - h * h + A * A) / (2 * (A + h));
        const c = rho - A;
        return arc('pointed', 2 * A, Math.sqrt(rho * rho - c * c), stilt, rho, c, stilt, Math.PI / 2, h);
      };
      break;
    }
    default:
      throw new RangeError(`cross_vault: shape must be "semicircular", "segmental", "pointed" or "stilted", got "${shape}"`);
  }
  return { x: wide(Ax), y: wide(Ay) };
}
