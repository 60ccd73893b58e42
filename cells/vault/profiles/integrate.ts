/**
 * Definite integrals for profile geometry (arc length, abscissa) where no
 * closed form exists: elliptical arcs and the general R0·cos^n φ family.
 */

// Gauss–Kronrod 7/15-point rule: nodes and weights of QUADPACK's QK15
// (Piessens, de Doncker-Kapenga, Überhuber & Kahaner, QUADPACK, Springer 1983).
const XGK = [
  0.991455371120812639206854697526329, 0.949107912342758524526189684047851,
  0.864864423359769072789712788640926, 0.741531185599394439863864773280788,
  0.586087235467691130294144845693013, 0.405845151377397166906606412076961,
  0.207784955007898467600689403773245, 0,
];
const WGK = [
  0.02293532201052922496373200805897, 0.063092092629978553290700663189204,
  0.104790010322250183839876322541518, 0.140653259715525918745189590510238,
  0.16900472663926790282658342659855, 0.190350578064785409913256402421014,
  0.204432940075298892414161999234649, 0.209482141084727828012999174891714,
];
// Gauss 7-point weights, for the Kronrod nodes with odd index (1, 3, 5, 7).
const WG = [0.129484966168869693270611432679082, 0.27970539148927666790146777142378,
  0.381830050505118944950369775488975, 0.417959183673469387755102040816327];

function rule(f: (t: number) => number, a: number, b: number): { kronrod: number; gauss: number } {
  const c = (a + b) / 2, h = (b - a) / 2;
  const fc = f(c);
  let kronrod = WGK[7]! * fc, gauss = WG[3]! * fc;
  for (let i = 0; i < 7; i++) {
    const sum = f(c - h * XGK[i]!) + f(c + h * XGK[i]!);
    kronrod += WGK[i]! * sum;
    if (i % 2 === 1) gauss += WG[(i - 1) / 2]! * sum;
  }
  return { kronrod: kronrod * h, gauss: gauss * h };
}

/**
 * ∫ f(t) dt from a to b by globally adaptive Gauss–Kronrod (7/15) quadrature,
 * in the manner of QUADPACK's QAG: the piece with the largest error estimate
 * |Kronrod − Gauss| is halved until the summed estimate is below relTol times
 * the integral. Nodes are interior, so an integrable singularity at an end
 * (cos^n t at π/2 with −1 < n < 0) or a steep end (n < −1 near π/2) is met by
 * halving the pieces beside it.
 * @param f integrand
 * @param a lower limit
 * @param b upper limit
 * @param relTol relative tolerance on the whole integral
 * @returns the integral
 * @example integrate(Math.cos, 0, Math.PI / 2) // 1
 */
export function integrate(f: (t: number) => number, a: number, b: number, relTol = 1e-14): number {
  if (a === b) return 0;
  type Piece = { lo: number; hi: number; value: number; error: number };
  const piece = (lo: number, hi: number): Piece => {
    const r = rule(f, lo, hi);
    return { lo, hi, value: r.kronrod, error: Math.abs(r.kronrod - r.gauss) };
  };
  const pieces: Piece[] = [piece(a, b)];
  for (let k = 0; k < 2000; k++) {
    let value = 0, error = 0, worst = 0;
    for (let i = 0; i < pieces.length; i++) {
      value += pieces[i]!.value;
      error += pieces[i]!.error;
      if (pieces[i]!.error > pieces[worst]!.error) worst = i;
    }
    // Converged, or down to the rounding noise of the sum?
    if (error <= Math.max(relTol, 64 * Number.EPSILON) * Math.abs(value)) break;
    const w = pieces[worst]!, mid = (w.lo + w.hi) / 2;
    if (mid <= w.lo || mid >= w.hi) break;
    pieces.splice(worst, 1, piece(w.lo, mid), piece(mid, w.hi));
  }
  const value = pieces.reduce((sum, p) => sum + p.value, 0);
  if (!Number.isFinite(value)) throw new RangeError(`integrate: the integral from ${a} to ${b} is not finite`);
  return value;
}
