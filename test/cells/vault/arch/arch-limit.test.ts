import { describe, it, expect } from 'vitest';
import { expectClose } from '../../../helpers/close.js';
import { archRing } from '../../../../cells/vault/arch/arch-ring.js';
import { archLimit } from './loose-limit.js';
import { isNotAvailable } from '../../../../cells/not-available.js';

const deg = (rad: number) => (rad * 180) / Math.PI;
// The published semicircle values are for the ring scaled with its own weight (the minimum-thickness arch).
const semicircle = (thickness: number, extra: object = {}) =>
  archRing({ shape: 'circular', radius: 1, half_angle: Math.PI / 2, thickness, unit_weight: 1, gsf: 'ring_scaled', ...extra });

/** t_min, and the minimum-thrust state of the ring built at t_min (where it is also the only state). */
function leastThickness(extra: object) {
  const t = archLimit(semicircle(0.15, extra)).t_min!;
  const at = archLimit(semicircle(t * (1 + 1e-8), extra));
  return { t, at };
}

describe('archLimit: semicircular arch under self-weight, radial joints', () => {
  // 800 voussoirs put a joint 0.05° from the continuous haunch hinge; the t/R error is then < 1e-6.
  it('archLimit(semicircle) with true centroids: t/R = 0.1075, hinges near 54.5° — Milankovitch (1907), from memory of the published value, restated in Makris & Alexakis, Arch. Appl. Mech. 83 (2013) abstract', () => {
    const { t, at } = leastThickness({ voussoirs: 800 });
    expect(t.toFixed(4)).toBe('0.1075');
    // Five hinges: extrados at crown and springings, intrados at the haunches.
    expect(at.hinges!.map((h) => h.face)).toEqual(['extrados', 'intrados', 'extrados', 'intrados', 'extrados']);
    expect(Math.abs(deg(at.hinges![3]!.angle) - 54.5)).toBeLessThan(0.2);
    expect(at.hinges![1]!.angle).toBeCloseTo(-at.hinges![3]!.angle, 12);
  });

  it('archLimit(semicircle) with true centroids matches our closed-form five-hinge solution (annular-sector centroids): t/R 0.1074780, β 54.484°, H/(wR) 0.620881', () => {
    // Derived here, independently of the LP: moments of the crown-to-β block about the intrados hinge and of
    // the half arch about the extrados springing, with the annular-sector first moment (R² + t²/12)(1 − cos β).
    const { t, at } = leastThickness({ voussoirs: 800 });
    expectClose(t, 0.107478038, 2e-6);
    expectClose(at.H_min! / (t * 1), 0.6208812, 2e-6);
    expect(Math.abs(deg(at.hinges![3]!.angle) - 54.484)).toBeLessThan(0.12);
  });

  it('archLimit(semicircle) with the weight on the centreline: t/R 0.107426, hinge 54.4963°, H/(wR) 0.621772 — Cocchetti & Rizzi, Frattura ed Integrità Strutturale 51 (2020), eq. (4), confirmed in the text', () => {
    const { t, at } = leastThickness({ voussoirs: 800, centroids: 'centreline' });
    expectClose(t, 0.107426, 5e-6);
    expectClose(at.H_min! / (t * 1), 0.621772, 5e-6);
    // The hinge sits on a joint: within half a joint spacing (0.1125°) of the published angle.
    expect(Math.abs(deg(at.hinges![3]!.angle) - 54.4963)).toBeLessThan(0.1125);
  });

  it("archLimit(semicircle) lies just above Heyman's simplified t/R ≈ 0.106 — Heyman, Int. J. Mech. Sci. 11 (1969), from memory", () => {
    const t = archLimit(semicircle(0.15)).t_min!;
    expect(t).toBeGreaterThan(0.106);
    expect(t).toBeLessThan(0.106 * 1.02);
  });

  it('archLimit(semicircle) converges in the voussoir count: the default (200) is within 2e-4 of 800 (4 significant figures)', () => {
    const t200 = archLimit(semicircle(0.15)).t_min!;
    const t800 = archLimit(semicircle(0.15, { voussoirs: 800 })).t_min!;
    expect(semicircle(0.15).voussoirs).toBe(200);
    expectClose(t200, t800, 2e-4);
    // A coarse ring can only under-estimate: fewer joints, fewer constraints (safe theorem on a subset).
    expect(archLimit(semicircle(0.15, { voussoirs: 30 })).t_min!).toBeLessThanOrEqual(t800 * (1 + 1e-9));
  });

  it('archLimit(semicircle).gsf = t / t_min, and the minimum-thrust line has three hinges for t > t_min — Heyman, The Stone Skeleton (1995), from memory', () => {
    const a = archLimit(semicircle(0.2));
    expectClose(a.gsf, 0.2 / a.t_min!, 1e-12);
    expect(a.safe).toBe(true);
    expect(a.hinges!.map((h) => h.face)).toEqual(['intrados', 'extrados', 'intrados']);
    expect(a.hinges![1]!.angle).toBeCloseTo(0, 12);
    expect(a.H_min!).toBeLessThan(a.H_max!);
    // Symmetric loads: equal vertical reactions summing to the weight (statics).
    expectClose(a.V_left!, a.V_right!, 1e-9);
    expectClose(a.V_left! + a.V_right!, semicircle(0.2).weight, 1e-12);
    expect(isNotAvailable(a.load_factor)).toBe(true);
  });
});

describe('archLimit: funicular loads (common practice)', () => {
  it('archLimit(thin parabola, plan load ≫ self-weight): H_min ≈ H_max ≈ wL²/(8f) and t_min → 0 — H = wL²/(8f), any statics text', () => {
    const q = 1e6; // N/m² on a ring of 0.02 m × 20 kN/m³ = 0.4 kN/m²
    for (const t of [0.04, 0.02, 0.01]) {
      const ring = archRing({ shape: 'parabolic', span: 10, rise: 2.5, thickness: t, unit_weight: 20e3 });
      const a = archLimit(ring, { dead: q });
      const H = (q * 10 * 10) / (8 * 2.5);
      expect(a.H_min!).toBeLessThan(H);
      expect(a.H_max!).toBeGreaterThan(H);
      expectClose((a.H_min! + a.H_max!) / 2, H, 0.005);
      // A funicular line scaled by H0/H moves by |H0/H − 1|·f at the crown, which must stay within ±t/2
      // (normal to inclined joints a little more): the range is about 2t/f and closes as the ring thins.
      expect((a.H_max! - a.H_min!) / a.H_min!).toBeLessThan((2.6 * t) / 2.5);
      expect(a.t_min! / t).toBeLessThan(0.01);
    }
  });

  it('archLimit(catenary under self-weight): t_min/t < 1% and the thrust range shrinks with t, while a semicircle needs t/R ≈ 0.1075', () => {
    let last = Infinity;
    for (const t of [0.2, 0.1, 0.05]) {
      const a = archLimit(archRing({ shape: 'catenary', span: 10, rise: 2.5, thickness: t, unit_weight: 20e3 }));
      expect(a.t_min! / t).toBeLessThan(0.01);
      const range = (a.H_max! - a.H_min!) / a.H_min!;
      expect(range).toBeLessThan(last * 0.6);
      last = range;
    }
  });
});

describe('archLimit: shape and load (common practice)', () => {
  it('archLimit(segmental arches): minimum thickness falls as the embrace angle falls', () => {
    const tmins = [90, 75, 60, 45, 30].map((a) =>
      archLimit(archRing({ shape: 'circular', radius: 5, half_angle: (a * Math.PI) / 180, thickness: 0.8, unit_weight: 2e4, voussoirs: 120 })).t_min!);
    for (let k = 1; k < tmins.length; k++) expect(tmins[k]!).toBeLessThan(tmins[k - 1]!);
  });

  it('archLimit(pointed vs semicircular, same span and thickness, crown point load): the pointed arch has the higher λ', () => {
    const common = { span: 10, thickness: 0.8, unit_weight: 2e4, voussoirs: 120 };
    const loads = { P: 50e3, P_at: 5 };
    const semi = archLimit(archRing({ shape: 'circular', rise: 5, ...common }), loads);
    const pointed = archLimit(archRing({ shape: 'pointed', ...common }), loads);
    expect(pointed.load_factor!).toBeGreaterThan(semi.load_factor!);
    // A mechanism needs at least four hinges (Heyman, The Stone Skeleton, 1995, from memory).
    expect(semi.mechanism!.length).toBeGreaterThanOrEqual(4);
    expect(pointed.mechanism!.length).toBeGreaterThanOrEqual(4);
  });

  it('archLimit(asymmetric point load): λ is the factor at which the load can no longer be carried (safe below, not above)', () => {
    const ring = archRing({ shape: 'circular', span: 10, rise: 5, thickness: 0.8, unit_weight: 2e4, voussoirs: 120 });
    const lam = archLimit(ring, { P: 50e3, P_at: 3 }).load_factor!;
    expect(archLimit(ring, { P: 50e3 * lam * 0.999, P_at: 3 }).safe).toBe(true);
    expect(archLimit(ring, { P: 50e3 * lam * 1.001, P_at: 3 }).safe).toBe(false);
    // The collapse load λ·P is a property of the ring: halving P doubles λ.
    expectClose(archLimit(ring, { P: 25e3, P_at: 3 }).load_factor!, 2 * lam, 1e-7);
  });

  it('archLimit(semicircle with fill to above the crown): reactions carry ring, fill and live load — plane geometry of the semicircle', () => {
    const ring = archRing({ shape: 'circular', span: 10, rise: 5, thickness: 0.9, unit_weight: 2e4, depth: 2 });
    const Re = 5 + 0.9;
    const level = 6.2;
    const fillArea = 2 * Re * level - (Math.PI * Re * Re) / 2; // rectangle over the extrados minus the half disc
    const loads = { fill_unit_weight: 18e3, fill_level: level, live: 5e3, live_from: 0, live_to: 5 };
    const a = archLimit(ring, loads);
    // Live load from the left springing of the intrados (x = 0) to mid-span (x = 5 m).
    const total = ring.weight + 18e3 * 2 * fillArea + 5e3 * 2 * 5;
    expectClose(a.V_left! + a.V_right!, total, 1e-9);
    expect(a.V_left!).toBeGreaterThan(a.V_right!);
    expect(a.load_factor!).toBeGreaterThan(1);
  });
});

describe('archLimit and archRing: bad input', () => {
  const ok = { shape: 'circular', span: 4, rise: 2, thickness: 0.3, unit_weight: 2e4 };
  it('archRing(thickness ≥ span) is a RangeError naming thickness', () => {
    expect(() => archRing({ ...ok, thickness: 4.5 })).toThrow(/thickness/);
    expect(() => archRing({ ...ok, thickness: 4.5 })).toThrow(RangeError);
  });
  it('archRing(voussoirs: 0) is a RangeError naming voussoirs', () => {
    expect(() => archRing({ ...ok, voussoirs: 0 })).toThrow(/voussoirs/);
  });
  it('archRing refuses fewer than 20 voussoirs (2 gave t_min 6e-9 m and gsf 1.3e8) and more than 10000; 20 is accepted', () => {
    for (const n of [2, 19, 10001]) expect(() => archRing({ ...ok, voussoirs: n })).toThrow(/voussoirs must be a whole number from 20 to 10000, got/);
    expect(archRing({ ...ok, voussoirs: 20 }).voussoirs).toBe(20);
  });
  it('archRing(unknown shape, missing rise, both span and radius) are RangeErrors naming the option', () => {
    expect(() => archRing({ ...ok, shape: 'gothic' })).toThrow(/shape/);
    expect(() => archRing({ ...ok, rise: undefined })).toThrow(/rise/);
    expect(() => archRing({ ...ok, radius: 2, half_angle: 1 })).toThrow(/radius/);
    expect(() => archRing({ ...ok, unit_weight: -1 })).toThrow(/unit_weight/);
  });
  it('archLimit(fill level below the springing, negative loads) are RangeErrors naming the option', () => {
    const ring = archRing(ok);
    expect(() => archLimit(ring, { fill_unit_weight: 18e3, fill_level: -0.5 })).toThrow(/fill_level/);
    expect(() => archLimit(ring, { fill_unit_weight: 18e3 })).toThrow(/fill_level/);
    expect(() => archLimit(ring, { dead: -1 })).toThrow(/dead/);
    expect(() => archLimit(ring, { live: -1 })).toThrow(/live/);
    expect(() => archLimit(ring, { P: -1, P_at: 1 })).toThrow(/P must/);
    expect(() => archLimit(ring, { P: 1e3 })).toThrow(/P_at/);
    expect(() => archLimit(ring, { P: 1e3, P_at: 9 })).toThrow(/P_at/);
    expect(() => archLimit(ring, { live: 1, live_from: 3, live_to: 1 })).toThrow(/live_from/);
  });
  it('archLimit(a ring too thin to stand) returns safe = false and gsf < 1, not an exception', () => {
    const a = archLimit(semicircle(0.05));
    expect(a.safe).toBe(false);
    expect(a.gsf).toBeLessThan(1);
    expectClose(a.gsf, 0.05 / 0.1075, 0.01);
    expect(isNotAvailable(a.H_min)).toBe(true);
    expect(a.notes.join(' ')).toMatch(/not safe/);
  });
  it('archLimit(a point load no thickness can carry) returns safe = false, gsf 0 and a note', () => {
    const ring = archRing({ shape: 'circular', span: 4, rise: 2, thickness: 0.3, unit_weight: 1, voussoirs: 40 });
    const a = archLimit(ring, { P: 1e9, P_at: 1 });
    expect(a.safe).toBe(false);
    expect(a.gsf).toBeLessThan(1);
    expect(a.notes.length).toBeGreaterThan(0);
  });
  it('archLimit(a flat segment) reports H_max = Infinity (unbounded) and says so in the notes', () => {
    const a = archLimit(archRing({ shape: 'circular', span: 10, rise: 0.3, thickness: 0.5, unit_weight: 2e4, voussoirs: 60 }));
    expect(a.H_max).toBe(Infinity);
    expect(a.notes.join(' ')).toMatch(/H_max is unbounded/);
    expect(a.H_min).toBeGreaterThan(0);
  });
});

describe('hinge T: the force of the left part on the right part, along the joint, + towards the extrados', () => {
  it('every hinge of the least-thrust state of a segment gives back H from N and T, and mirror joints have opposite T', () => {
    // Equilibrium of the part left of a joint (Heyman, The Stone Skeleton, 1995, ch. 2): with no horizontal loads
    // the force it passes on has horizontal component H at every joint; n = (cos φ, −sin φ), u = (sin φ, cos φ).
    const ring = archRing({ shape: 'circular', span: 6, rise: 1.5, thickness: 0.3, unit_weight: 18e3, voussoirs: 120 });
    const a = archLimit(ring);
    const hinges = a.hinges!;
    expect(hinges.length).toBeGreaterThanOrEqual(3);
    for (const h of hinges) expectClose(h.N * Math.cos(h.angle) + h.T * Math.sin(h.angle), a.H_min!, 1e-6);
    const left = hinges.find((h) => h.angle < -0.1)!;
    const right = hinges.find((h) => Math.abs(h.angle + left.angle) < 1e-9)!;
    expect(left.T).toBeGreaterThan(0);
    expect(right.T).toBeCloseTo(-left.T, 6);
  });
});
