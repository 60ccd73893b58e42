import type { Metres } from '../profile.js';
import type { ArchLoads, ArchRing, AxleLoad, Hinge } from './types.js';
import { seidelLP, type LpSolver } from './seidel-lp.js';
import { thrustProgram } from './thrust-program.js';
import { collapse } from './arch-limit.js';
import { checkLoads } from './check-loads.js';
import { liveActions } from './live-actions.js';
import { notAvailable, type NotAvailable } from '../../not-available.js';

/** Options of arch_scan (SI). */
export interface ArchScanOptions {
  /** Axle loads (N), lead axle first. */
  axles: number[];
  /** Distances between consecutive axles (m), one fewer than the axles. */
  spacing?: Metres[];
  /** Lead axle's first and last position (m from the left springing of the intrados); default 0 to span + vehicle length. */
  from?: Metres;
  to?: Metres;
  /** Positions of the first pass (default 100). */
  steps?: number;
}

/** What arch_scan reports. */
export interface ArchScan {
  lambda_min: number | NotAvailable;
  x_worst: Metres | NotAvailable;
  curve: { x: Metres; lambda: number }[];
  mechanism: Hinge[] | NotAvailable;
  governs: string | NotAvailable;
  load_spread: string;
  notes: string[];
}

/** Width of the final bracket around the worst position, as a fraction of the span. */
const REFINE = 1e-3;

/**
 * A vehicle — a train of axle loads at given spacings — rolled across the
 * ring from left to right: at each position of the lead axle the collapse
 * load factor λ on the vehicle (and on any live or point load in `loads`),
 * with the fixed loads as given. Axles off the ring are carried by the
 * abutments and left out. A first pass at `steps` even positions, then a
 * golden-section search (Kiefer, Proc. AMS 4, 1953) around the two lowest
 * local minima until the bracket is 0.001·span; λ between positions is taken
 * to be unimodal within a step. The ring is reused: only the loads change.
 * @param ring from archRing
 * @param loads the fixed loads (and spread), as for arch_limit
 * @param o axles, spacing, from, to, steps
 * @param solve LP solver
 * @returns λ_min, x_worst (lead axle from the left springing of the intrados), the curve, the mechanism there
 * @example archScan(ring, {}, {axles: [50e3, 50e3], spacing: [1.8]}).x_worst
 */
export function archScan(ring: ArchRing, loads: ArchLoads, o: ArchScanOptions, solve: LpSolver = seidelLP): ArchScan {
  checkLoads('arch_scan', ring, loads);
  const { axles, spacing = [], steps = 100 } = o;
  if (!Array.isArray(axles) || axles.length === 0) throw new RangeError('arch_scan: axles must be a list of one or more axle loads, e.g. [50 kN, 50 kN]');
  axles.forEach((w, i) => {
    if (!(w > 0 && Number.isFinite(w))) throw new RangeError(`arch_scan: axles[${i + 1}] must be positive, got ${w} N`);
  });
  if (spacing.length !== axles.length - 1) {
    throw new RangeError(`arch_scan: spacing needs ${axles.length - 1} distance${axles.length === 2 ? '' : 's'} for ${axles.length} axles, got ${spacing.length}`);
  }
  spacing.forEach((s, i) => {
    if (!(s > 0 && Number.isFinite(s))) throw new RangeError(`arch_scan: spacing[${i + 1}] must be positive, got ${s} m`);
  });
  if (!Number.isInteger(steps) || steps < 2 || steps > 10000) throw new RangeError(`arch_scan: steps must be a whole number from 2 to 10000, got ${steps}`);
  const length = spacing.reduce((a, b) => a + b, 0);
  const from = o.from ?? 0;
  const to = o.to ?? ring.span + length;
  if (!(Number.isFinite(from) && Number.isFinite(to) && from < to)) throw new RangeError(`arch_scan: from must be less than to, got ${from} m and ${to} m`);
  const x0 = ring.span / 2;
  const train = (lead: Metres): AxleLoad[] => {
    let at = lead;
    return axles.map((W, i) => {
      if (i > 0) at -= spacing[i - 1]!;
      return { W, at };
    });
  };
  const program = (x: Metres) => thrustProgram(ring, ring.thickness, { ...loads, axles: [...(loads.axles ?? []), ...train(x)] });
  const evaluate = (x: Metres) => {
    // λ only at each position; what governs is judged at the worst one.
    const c = collapse(program(x), solve, x0, false);
    return { c, lambda: typeof c.load_factor === 'number' ? c.load_factor : Infinity };
  };
  const curve: { x: Metres; lambda: number }[] = [];
  const seen = new Map<number, ReturnType<typeof evaluate>>();
  const at = (x: Metres) => {
    let r = seen.get(x);
    if (!r) {
      r = evaluate(x);
      seen.set(x, r);
      curve.push({ x, lambda: r.lambda });
    }
    return r.lambda;
  };
  const xs = Array.from({ length: steps + 1 }, (_, k) => from + ((to - from) * k) / steps);
  const lam = xs.map(at);
  // Local minima of the first pass, lowest first; refine the two lowest.
  const minima = xs.map((_, k) => k).filter((k) => lam[k]! <= (lam[k - 1] ?? Infinity) && lam[k]! <= (lam[k + 1] ?? Infinity) && Number.isFinite(lam[k]!))
    .sort((a, b) => lam[a]! - lam[b]!).slice(0, 2);
  const phi = (Math.sqrt(5) - 1) / 2;
  for (const k of minima) {
    let [a, b] = [xs[Math.max(k - 1, 0)]!, xs[Math.min(k + 1, steps)]!];
    let c = b - phi * (b - a);
    let d = a + phi * (b - a);
    while (b - a > REFINE * ring.span) {
      if (at(c) <= at(d)) {
        b = d;
        d = c;
        c = b - phi * (b - a);
      } else {
        a = c;
        c = d;
        d = a + phi * (b - a);
      }
    }
  }
  curve.sort((p, q) => p.x - q.x);
  const worst = curve.reduce((m, p) => (p.lambda < m.lambda ? p : m), curve[0]!);
  const notes: string[] = [];
  const spread = liveActions(ring, { ...loads, axles: train(worst.x) }).spread;
  if (!Number.isFinite(worst.lambda)) {
    const why = 'the vehicle never causes collapse at any position scanned';
    return { lambda_min: Infinity, x_worst: notAvailable(why), curve, mechanism: notAvailable(why), governs: notAvailable(why), load_spread: spread, notes: [why] };
  }
  const c = collapse(program(worst.x), solve, x0);
  if (minima.length > 1) notes.push(`a second local minimum λ = ${lam[minima[1]!]!.toPrecision(4)} near x = ${xs[minima[1]!]!.toFixed(2)} m`);
  return { lambda_min: worst.lambda, x_worst: worst.x, curve, mechanism: c.mechanism, governs: c.governs, load_spread: spread, notes };
}
