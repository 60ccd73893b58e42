// Sources: the uniqueness theorem of limit analysis (Heyman, The Stone Skeleton, 1995, ch. 3 — from memory):
// the collapse factor found statically equals the one found by virtual work on the mechanism, and every
// other mechanism gives a larger factor (upper-bound theorem). Convergence in the voussoir count is checked
// against the same kernel at 16 times the voussoirs (an independent discretisation of the same continuum).
import { describe, it, expect } from 'vitest';
import { expectClose } from '../../../helpers/close.js';
import { archRing, type ArchRingOptions } from '../../../../cells/vault/arch/arch-ring.js';
import { archLimit } from './loose-limit.js';
import { collapse } from '../../../../cells/vault/arch/arch-limit.js';
import { thrustProgram } from '../../../../cells/vault/arch/thrust-program.js';
import { seidelLP } from '../../../../cells/vault/arch/seidel-lp.js';
import { voussoirLoads } from '../../../../cells/vault/arch/voussoir-loads.js';
import { liveActions } from '../../../../cells/vault/arch/live-actions.js';
import { analysisSections } from '../../../../cells/vault/arch/analysis-sections.js';
import type { ArchLoads, Hinge } from '../../../../cells/vault/arch/types.js';

const lambda = (options: ArchRingOptions, loads: ArchLoads) => {
  const ring = archRing(options);
  return collapse(thrustProgram(ring, ring.thickness, loads), seidelLP, ring.span / 2).load_factor as number;
};

describe('point loads: a joint under each load and a check of the kink on its vertical line', () => {
  const semicircle = { shape: 'circular', span: 9.25, rise: 4.625, thickness: 0.75, unit_weight: 2e4 };
  const segment = { shape: 'circular', span: 6, rise: 1.5, thickness: 0.34, unit_weight: 18e3 };
  const fill = { fill_unit_weight: 19e3, fill_level: 2.24, dead: 2.3e3 };
  // Positions across the span (fractions), the crown included.
  const at = [0.09, 0.21, 0.3, 0.37, 0.5, 0.63, 0.81];
  for (const [name, ring, base, P] of [['semicircle, no fill', semicircle, {}, 30e3], ['segment under fill', segment, fill, 50e3]] as const) {
    it(`λ(${name}) at the default 200 voussoirs, and at 201 (a keystone over the crown), is within 0.3 % of λ at 3200, for loads anywhere on the span`, () => {
      for (const f of at) {
        const loads = { ...base, P, P_at: f * ring.span };
        const fine = lambda({ ...ring, voussoirs: 3200 }, loads);
        for (const n of [200, 201]) {
          const coarse = lambda({ ...ring, voussoirs: n }, loads);
          expect(Math.abs(coarse / fine - 1), `${name}, P at ${f}·L, ${n} voussoirs: ${coarse} against ${fine}`).toBeLessThan(0.003);
        }
      }
    }, 60_000);
  }

  it('a coarse ring of 21 voussoirs with a crown load stays within 1 % of the fine one (the kink is checked, not the nearest joints)', () => {
    const loads = { P: 30e3, P_at: semicircle.span / 2 };
    expectClose(lambda({ ...semicircle, voussoirs: 21 }, loads), lambda({ ...semicircle, voussoirs: 3200 }, loads), 0.01);
  });
});

/** λ of a four-hinge mechanism by virtual work on its three rigid bodies (instantaneous centres). */
function virtualWork(options: ArchRingOptions, loads: ArchLoads, hinges: { j: number; extrados: boolean }[]): number {
  const ring = archRing(options);
  const acts = liveActions(ring, loads);
  const { joints } = analysisSections(ring, ring.thickness, acts);
  const { fixed, live } = voussoirLoads(ring, ring.thickness, loads, joints, acts);
  const t = ring.thickness;
  // The hinge points: joint j, on the face the mechanism opens about.
  const pts = hinges.map((h) => {
    const j = joints[h.j]!;
    const d = h.extrados ? t / 2 : -t / 2;
    return { x: j.mid.x + d * j.u.x, y: j.mid.y + d * j.u.y };
  });
  const [A, B, C, D] = pts as [typeof pts[0], typeof pts[0], typeof pts[0], typeof pts[0]];
  // Instantaneous centre of the middle body: where lines AB and CD meet.
  const cross = (p: { x: number; y: number }, q: { x: number; y: number }) => p.x * q.y - p.y * q.x;
  const r = { x: B.x - A.x, y: B.y - A.y };
  const s = { x: C.x - D.x, y: C.y - D.y };
  const k = cross({ x: D.x - A.x, y: D.y - A.y }, s) / cross(r, s);
  const I = { x: A.x + k * r.x, y: A.y + k * r.y };
  // Rotation rates: body 1 about A at 1; body 2 about I and body 3 about D match velocities at B and at C.
  const w1 = 1;
  const w2 = Math.abs(B.x - I.x) > Math.abs(B.y - I.y) ? (w1 * (B.x - A.x)) / (B.x - I.x) : (w1 * (B.y - A.y)) / (B.y - I.y);
  const w3 = Math.abs(C.x - D.x) > Math.abs(C.y - D.y) ? (w2 * (C.x - I.x)) / (C.x - D.x) : (w2 * (C.y - I.y)) / (C.y - D.y);
  const bodies = [{ c: A, w: w1 }, { c: I, w: w2 }, { c: D, w: w3 }];
  const js = hinges.map((h) => h.j);
  let dead = 0;
  let liveWork = 0;
  fixed.forEach((f, i) => {
    // Voussoir i lies between joints i and i + 1; outside A…D it does not move.
    if (i < js[0]! || i >= js[3]!) return;
    const b = bodies[i < js[1]! ? 0 : i < js[2]! ? 1 : 2]!;
    // Downward load W at x: its work under rotation w about c is −W·w·(x − c.x).
    dead += -f.W * b.w * (f.x - b.c.x);
    liveWork += -live[i]!.W * b.w * (live[i]!.x - b.c.x);
  });
  return -dead / liveWork;
}

describe('hinges: one per touching region, with angle, position and force', () => {
  const options = { shape: 'circular', span: 8, rise: 3, thickness: 0.4, unit_weight: 2e4, voussoirs: 120 };
  const loads = { dead: 2e3, live: 30e3, live_from: 0.8, live_to: 3.2 };

  it('archLimit(segment, partial live load): four hinges, faces alternating, each on its face with N > 0 there', () => {
    const a = archLimit(archRing(options), loads);
    expect(a.mechanism.length).toBe(4);
    for (let k = 1; k < 4; k++) expect(a.mechanism[k]!.face).not.toBe(a.mechanism[k - 1]!.face);
    for (const h of a.mechanism) {
      expect(h.N).toBeGreaterThan(0);
      expect(h.x).toBeGreaterThanOrEqual(-0.4);
      expect(h.x).toBeLessThanOrEqual(8.4);
    }
    expect(a.governs).toBe('hinges');
  });

  it('λ of that mechanism by virtual work equals the kernel\'s λ (uniqueness), and moving any hinge one joint raises it (upper-bound theorem)', () => {
    const ring = archRing(options);
    const a = archLimit(ring, loads);
    const { joints } = analysisSections(ring, ring.thickness, liveActions(ring, loads));
    const index = (h: Hinge) => {
      const j = joints.findIndex((jt) => Math.abs(jt.angle - h.angle) < 1e-9);
      expect(j).toBeGreaterThanOrEqual(0);
      return { j, extrados: h.face === 'extrados' };
    };
    const found = a.mechanism.map(index);
    expectClose(virtualWork(options, loads, found), a.load_factor, 1e-6);
    let tried = 0;
    for (let k = 0; k < 4; k++) {
      for (const step of [-1, 1]) {
        const moved = found.map((h, i) => (i === k ? { ...h, j: h.j + step } : h));
        if (moved[k]!.j < 0 || moved[k]!.j >= joints.length || (k > 0 && moved[k]!.j <= moved[k - 1]!.j) || (k < 3 && moved[k]!.j >= moved[k + 1]!.j)) continue;
        expect(virtualWork(options, loads, moved)).toBeGreaterThanOrEqual(a.load_factor * (1 - 1e-9));
        tried++;
      }
    }
    expect(tried).toBeGreaterThanOrEqual(6);
  });

  it('a crown load on a semicircle gives a symmetric five-hinge mechanism, and the notes say so', () => {
    const a = archLimit(archRing({ shape: 'circular', span: 9.25, rise: 4.625, thickness: 0.75, unit_weight: 2e4 }), { P: 30e3, P_at: 4.625 });
    expect(a.mechanism.length).toBe(5);
    expect(a.notes.join(' ')).toMatch(/symmetric and shows five hinges/);
    expectClose(a.mechanism[2]!.x, 4.625, 1e-9);
  });

  it('with many voussoirs the least-thrust line of a semicircle still has three hinges, not a cluster (800 voussoirs)', () => {
    const a = archLimit(archRing({ shape: 'circular', radius: 1, half_angle: Math.PI / 2, thickness: 0.2, unit_weight: 1, voussoirs: 800 }));
    expect(a.hinges.map((h) => h.face)).toEqual(['intrados', 'extrados', 'intrados']);
    expectClose(a.hinges[1]!.z, 1.1, 1e-9); // the crown's extrados: radius 1 + t/2 above the springing of the intrados
  });
});
