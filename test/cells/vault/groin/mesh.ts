/**
 * Independent numerical integration of a cross-vault surface for the tests:
 * the webs are triangulated with vertices on the surface and the flat
 * triangles summed (a polyhedral surface converges to the true one as h²).
 * The geometry is written here again from the circle, and the groins are
 * found by bisection, so nothing is shared with the kernel's φ-quadrature.
 */

/** Half of a barrel's profile: height z at plan distance u ≥ 0 from its centre line, and its extent e. */
export interface TestProfile {
  e: number;
  z(u: number): number;
  /** Plan point at parameter τ ∈ [0, 1], densest near the springing where the surface is steep. */
  at(tau: number): number;
}

/** Round arch of radius R springing at height s. */
export function round(R: number, s = 0): TestProfile {
  return { e: R, z: (u) => s + Math.sqrt(Math.max(0, R * R - u * u)), at: (t) => R * Math.sin((t * Math.PI) / 2) };
}

/** Two-centred arch of radius R whose centres lie c beyond the centre line. */
export function twoCentred(R: number, c: number): TestProfile {
  const a0 = Math.asin(c / R);
  return { e: R - c, z: (u) => Math.sqrt(Math.max(0, R * R - (u + c) ** 2)), at: (t) => R * Math.sin(a0 + t * (Math.PI / 2 - a0)) - c };
}

export interface MeshTotals { area: number; load: number; mx: number; my: number }

/**
 * Integrals over the half webs u ≥ 0 of the barrel `own` (its webs lie along the sides v = ±e_other):
 * area, ∫q dA, ∫u q dA, ∫|v| q dA over one web's half (v > 0).
 * @param q vertical load per unit surface area at (u, v, z, dz/du)
 */
export function meshHalfWeb(own: TestProfile, other: TestProfile, n: number,
  q: (u: number, v: number, z: number) => number = () => 1): MeshTotals {
  // Groin: the v ≥ 0 where the other barrel stands as high as this one, by bisection.
  const groin = (z: number): number => {
    if (other.z(0) <= z) return 0;
    if (other.z(other.e) >= z) return other.e;
    let lo = 0, hi = other.e;
    for (let i = 0; i < 80; i++) { const m = (lo + hi) / 2; if (other.z(m) > z) lo = m; else hi = m; }
    return (lo + hi) / 2;
  };
  const pts: Array<Array<[number, number, number]>> = [];
  for (let i = 0; i <= n; i++) {
    const u = own.at(i / n), z = own.z(u), vg = groin(z);
    const row: Array<[number, number, number]> = [];
    for (let j = 0; j <= n; j++) row.push([u, vg + (j / n) * (other.e - vg), z]);
    pts.push(row);
  }
  const t = { area: 0, load: 0, mx: 0, my: 0 };
  const tri = (a: number[], b: number[], c: number[]): void => {
    const ab = [b[0]! - a[0]!, b[1]! - a[1]!, b[2]! - a[2]!], ac = [c[0]! - a[0]!, c[1]! - a[1]!, c[2]! - a[2]!];
    const cr = [ab[1]! * ac[2]! - ab[2]! * ac[1]!, ab[2]! * ac[0]! - ab[0]! * ac[2]!, ab[0]! * ac[1]! - ab[1]! * ac[0]!];
    const area = Math.hypot(cr[0]!, cr[1]!, cr[2]!) / 2;
    const g = [0, 1, 2].map((k) => (a[k]! + b[k]! + c[k]!) / 3);
    const w = q(g[0]!, g[1]!, g[2]!) * area;
    t.area += area; t.load += w; t.mx += g[0]! * w; t.my += g[1]! * w;
  };
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
    const p00 = pts[i]![j]!, p01 = pts[i]![j + 1]!, p10 = pts[i + 1]![j]!, p11 = pts[i + 1]![j + 1]!;
    tri(p00, p10, p11); tri(p00, p11, p01);
  }
  return t;
}
