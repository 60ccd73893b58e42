// Source: statics of a rigid block (any statics text) — ΣF = 0 and ΣM = 0 on every voussoir, recomputed
// from the loads alone.
import { describe, it, expect } from 'vitest';
import { expectClose, numberField } from '../../../helpers/close.js';
import { archRing, type ArchRingOptions } from '../../../../cells/vault/arch/arch-ring.js';
import { archLimit } from './loose-limit.js';
import { thrustProgram } from '../../../../cells/vault/arch/thrust-program.js';
import { admissibleProgram } from '../../../../cells/vault/arch/admissible-program.js';
import { thrustState, type ThrustState } from '../../../../cells/vault/arch/thrust-state.js';
import { seidelLP } from '../../../../cells/vault/arch/seidel-lp.js';
import { voussoirLoads } from '../../../../cells/vault/arch/voussoir-loads.js';
import type { ArchLoads, ArchRing } from '../../../../cells/vault/arch/types.js';
import { liveActions } from '../../../../cells/vault/arch/live-actions.js';
import { analysisSections } from '../../../../cells/vault/arch/analysis-sections.js';

/**
 * Statics of every voussoir, rebuilt from the loads alone (not from the
 * kernel's linear forms): the joint force F_j = (H + Σ Fx left of j, V − Σ W
 * left of j) acts at the centre of pressure mid_j + e_j·u_j. Returns the
 * largest force and moment residuals, the largest |N_j − F_j·n_j| and the
 * least margin to the section's bounds (Heyman's admissibility), over every
 * section (joints and the vertical cuts under point loads).
 */
function residuals(ring: ArchRing, loads: ArchLoads, s: ThrustState) {
  const acts = liveActions(ring, loads);
  const { joints, sections } = analysisSections(ring, ring.thickness, acts);
  const { fixed, live } = voussoirLoads(ring, ring.thickness, loads, joints, acts);
  const onJoint = sections.map((sec, k) => ({ sec, a: s.joints[k]! })).filter((p) => p.sec.kind === 'joint');
  expect(onJoint.length).toBe(joints.length);
  const F = [{ x: s.H, y: s.V }];
  const load = fixed.map((f, i) => ({
    W: f.W + s.lambda * live[i]!.W, Wx: f.W * f.x + s.lambda * live[i]!.W * live[i]!.x, Fx: f.Fx ?? 0, Fxy: (f.Fx ?? 0) * (f.y ?? 0),
  }));
  load.forEach((l) => F.push({ x: F[F.length - 1]!.x + l.Fx, y: F[F.length - 1]!.y - l.W }));
  const P = joints.map((j, k) => ({ x: j.mid.x + onJoint[k]!.a.e * j.u.x, y: j.mid.y + onJoint[k]!.a.e * j.u.y }));
  const cross = (p: { x: number; y: number }, f: { x: number; y: number }) => p.x * f.y - p.y * f.x;
  let force = 0;
  let moment = 0;
  let normal = 0;
  let margin = Infinity;
  load.forEach((l, i) => {
    // Voussoir i: +F_i at P_i from the left, −F_{i+1} at P_{i+1} from the right, its loads (down, and Fx at its height).
    force = Math.max(force, Math.abs(F[i]!.x + l.Fx - F[i + 1]!.x), Math.abs(F[i]!.y - F[i + 1]!.y - l.W));
    moment = Math.max(moment, Math.abs(cross(P[i]!, F[i]!) - cross(P[i + 1]!, F[i + 1]!) - l.Wx - l.Fxy));
  });
  joints.forEach((j, k) => {
    normal = Math.max(normal, Math.abs(onJoint[k]!.a.N - (F[k]!.x * j.n.x + F[k]!.y * j.n.y)));
  });
  sections.forEach((sec, k) => {
    margin = Math.min(margin, sec.up - s.joints[k]!.e, sec.down + s.joints[k]!.e);
  });
  const scale = load.reduce((sum, l) => sum + l.W, 0);
  return { force: force / scale, moment: moment / (scale * ring.span), normal: normal / scale, margin: margin / ring.thickness };
}

const cases: [string, ArchRingOptions, ArchLoads][] = [
  ['semicircle, self-weight', { shape: 'circular', radius: 5, half_angle: Math.PI / 2, thickness: 0.75, unit_weight: 2e4 }, {}],
  ['pointed, crown point load', { shape: 'pointed', span: 8, thickness: 0.6, unit_weight: 2e4, voussoirs: 60 }, { P: 40e3, P_at: 4 }],
  ['parabola, fill and part live load', { shape: 'parabolic', span: 9, rise: 3, thickness: 0.5, unit_weight: 2e4, voussoirs: 80 },
    { fill_unit_weight: 17e3, fill_level: 3.8, live: 8e3, live_from: 1, live_to: 4.5 }],
  ['ellipse, dead load and offset point load', { shape: 'elliptical', span: 10, rise: 4, thickness: 0.9, unit_weight: 2e4, voussoirs: 90 },
    { dead: 4e3, P: 30e3, P_at: 2.5 }],
  ['segment, fill with side pressure, spread axle', { shape: 'circular', span: 6, rise: 1.5, thickness: 0.34, unit_weight: 18e3, voussoirs: 80 },
    { fill_unit_weight: 19e3, fill_level: 2.24, fill_pressure: 0.3, spread: 0.5, axles: [{ W: 60e3, at: 1.6 }, { W: 60e3, at: 3.4 }] }],
  ['semicircle, two point loads, no spread', { shape: 'circular', span: 8, rise: 4, thickness: 0.6, unit_weight: 2e4, voussoirs: 41 },
    { P: 20e3, P_at: 1.9, axles: [{ W: 20e3, at: 5.3 }] }],
];

describe('equilibrium of every voussoir in the returned states — statics of a rigid block (any statics text)', () => {
  for (const [name, options, loads] of cases) {
    it(`archLimit(${name}): minimum-, maximum-thrust and collapse states balance to 1e-9 and stay within the ring`, () => {
      const ring = archRing(options);
      const p = thrustProgram(ring, ring.thickness, loads);
      const result = archLimit(ring, loads);
      const states: ThrustState[] = [];
      for (const [c, free] of [[[-1, 0, 0], false], [[1, 0, 0], false], [[0, 0, 0, 1], true]] as const) {
        if (free && p.live === 0) continue;
        const r = seidelLP(admissibleProgram(p, [...c], free));
        // A flat segment's greatest thrust may be unbounded; the box then holds it and the state is still in equilibrium.
        expect(r.feasible).toBe(true);
        if (r.feasible) states.push(thrustState(p, r.x));
      }
      // These are the states arch_limit reports.
      expectClose(states[0]!.H, numberField(result.H_min), 1e-12);
      expectClose(states[1]!.H, numberField(result.H_max), 1e-12);
      if (states[2]) expectClose(states[2].lambda, numberField(result.load_factor), 1e-12);
      for (const s of states) {
        const r = residuals(ring, loads, s);
        expect(r.force).toBeLessThan(1e-9);
        expect(r.moment).toBeLessThan(1e-9);
        expect(r.normal).toBeLessThan(1e-9);
        expect(r.margin).toBeGreaterThan(-1e-9);
      }
    });
  }
});
