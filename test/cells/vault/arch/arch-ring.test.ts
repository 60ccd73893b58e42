// Sources: centroids of quarter circles and circular sectors from standard tables of plane areas; areas by
// polar integration done here; radius-of-curvature laws of the profile families from standard calculus.
import { describe, it, expect } from 'vitest';
import { expectClose } from '../../../helpers/close.js';
import { archRing } from '../../../../cells/vault/arch/arch-ring.js';
import { voussoirSections } from '../../../../cells/vault/arch/voussoir-sections.js';
import { gaussLegendre } from '../../../../cells/vault/arch/gauss-legendre.js';

const R = 5;
const t = 0.6;
const [ri, re] = [R - t / 2, R + t / 2];
const semicircle = (extra: object = {}) =>
  archRing({ shape: 'circular', radius: R, half_angle: Math.PI / 2, thickness: t, unit_weight: 2e4, depth: 1.5, voussoirs: 40, ...extra });

describe('archRing: geometry of the ring', () => {
  it('archRing(radius, half_angle) reports the intrados span and rise and the self-weight γ·depth·π·R·t of a half annulus', () => {
    const ring = semicircle();
    expectClose(ring.span, 2 * ri, 1e-12);
    expectClose(ring.rise, ri, 1e-12);
    expectClose(ring.weight, 2e4 * 1.5 * Math.PI * R * t, 1e-12);
  });

  it('archRing(span, rise) builds the ring on that intrados: a semicircle of span 8 and thickness 0.5 has centreline radius 4.25', () => {
    const ring = archRing({ shape: 'circular', span: 8, rise: 4, thickness: 0.5, unit_weight: 1 });
    expectClose(ring.span, 8, 1e-12);
    expectClose(ring.rise, 4, 1e-12);
    expectClose(ring.centreline.radius(0), 4.25, 1e-12);
    expectClose(ring.weight, Math.PI * 4.25 * 0.5, 1e-12);
  });

  it('voussoirSections(semicircle): the right half has the centroid 4(re³ − ri³)/(3π(re² − ri²)) of a quarter annulus — quarter-circle centroid 4r/3π, standard tables (e.g. Gere, Mechanics of Materials, appendix of plane areas)', () => {
    const ring = semicircle();
    const right = voussoirSections(ring.centreline, ring.joints, t).slice(20);
    const A = right.reduce((s, v) => s + v.area, 0);
    const x = right.reduce((s, v) => s + v.area * v.x, 0) / A;
    const y = right.reduce((s, v) => s + v.area * v.y, 0) / A;
    const expected = (4 * (re ** 3 - ri ** 3)) / (3 * Math.PI * (re ** 2 - ri ** 2));
    expectClose(A, (Math.PI / 4) * (re ** 2 - ri ** 2), 1e-12);
    expectClose(x, expected, 1e-12);
    expectClose(y, expected, 1e-12); // the centre of the circle is on the springing line y = 0
  });

  it('voussoirSections(semicircle): each voussoir is an annular sector with centroid (2/3)(re³ − ri³)/(re² − ri²)·sin α/α from the centre — sector centroid 2r sin α/(3α), standard tables', () => {
    const ring = semicircle();
    const alpha = Math.PI / 40 / 2;
    const r = ((2 / 3) * (re ** 3 - ri ** 3)) / (re ** 2 - ri ** 2) * (Math.sin(alpha) / alpha);
    for (const v of voussoirSections(ring.centreline, ring.joints, t)) expectClose(Math.hypot(v.x, v.y), r, 1e-12);
    // With the weight on the centreline the centroid is that of the arc, R sin α/α (the simplified model).
    for (const v of voussoirSections(ring.centreline, ring.joints, t, true)) expectClose(Math.hypot(v.x, v.y), (R * Math.sin(alpha)) / alpha, 1e-12);
  });

  it('voussoirSections(pointed ring): the area is that of the two annular arcs cut by the axis, keystone bounded by the true arcs — polar integration of the region', () => {
    // Equilateral pointed intrados of span 8: radius 8, centres on the springing line at x = ∓4.
    const ring = archRing({ shape: 'pointed', span: 8, thickness: 0.5, unit_weight: 1, voussoirs: 40 });
    const area = voussoirSections(ring.centreline, ring.joints, 0.5).reduce((s, v) => s + v.area, 0);
    // Right half: points at radius r from (−4, 0) with x ≥ 0 and y ≥ 0, i.e. φ from asin(4/r) to 90°.
    let half = 0;
    gaussLegendre(8, 8.5, (r, w) => (half += w * r * (Math.PI / 2 - Math.asin(4 / r))));
    // The keystone's top follows the extrados arcs to the axis. Its former tangent lines added the sliver
    // between a tangent of length τ and its circle, ≈ τ³/(6R) each (R = 8.5, τ = t·tan 30°): 0.00094 m² here,
    // which the comparison below would see (1.1e-4 relative, tolerance 2e-6).
    const tau = 0.5 * Math.tan(Math.PI / 6);
    expectClose(area, 2 * half, 2e-6);
    expect(Math.abs(area - (2 * half + (2 * tau ** 3) / (6 * 8.5)))).toBeGreaterThan(50 * 2e-6 * area);
    expect(ring.joints.length).toBe(42);
    expectClose(ring.rise, 8 * Math.sin(Math.PI / 3), 1e-12);
  });

  it('archRing(parabolic) cuts voussoirs of equal centreline length', () => {
    const ring = archRing({ shape: 'parabolic', span: 10, rise: 3, thickness: 0.4, unit_weight: 1, voussoirs: 30 });
    const c = ring.centreline;
    const s = ring.joints.map((j) => Math.sign(j.angle) * (c.arcLength(Math.abs(j.angle)) - c.arcLength(0)));
    for (let k = 1; k < s.length; k++) expectClose(s[k]! - s[k - 1]!, (2 * s[s.length - 1]!) / 30, 1e-9);
    // Area of a parallel strip: t times the centreline length (Jacobian R + d integrates to t·R).
    expectClose(ring.weight, 0.4 * 2 * s[s.length - 1]!, 1e-10);
  });

  it('archRing(shape: n) takes the exponent of R = R0·cos^n φ: −3, −2 and 1 give the parabola, catenary and cycloid — radius of curvature p/cos³φ, a/cos²φ, 4r·cos φ (standard calculus)', () => {
    const common = { span: 10, rise: 3, thickness: 0.5, unit_weight: 2e4, voussoirs: 40 };
    for (const [n, name] of [[-3, 'parabolic'], [-2, 'catenary'], [1, 'cycloid']] as const) {
      expectClose(archRing({ shape: n, ...common }).weight, archRing({ shape: name, ...common }).weight, 1e-12);
    }
    expect(archRing({ shape: 0.5, ...common }).shape).toBe('power n = 0.5');
  });
});
