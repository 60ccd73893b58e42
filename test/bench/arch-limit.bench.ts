/**
 * Benchmark (not a timed test): arch_limit with the kernel's exact small-LP
 * solver against the same programmes given to javascript-lp-solver, side by
 * side in one run, medians over repeats; also checks that the answers agree,
 * and prints the voussoir-count convergence of the semicircle's t/R.
 */
import { archRing } from '../../cells/vault/arch/arch-ring.js';
import { archLimit } from '../../cells/vault/arch/arch-limit.js';
import { thrustProgram } from '../../cells/vault/arch/thrust-program.js';
import { admissibleProgram } from '../../cells/vault/arch/admissible-program.js';
import { seidelLP, type LpSolver } from '../../cells/vault/arch/seidel-lp.js';
import { simplexLP } from '../cells/vault/arch/lp-solver-adapter.js';

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;

function timeBoth(repeats: number, a: () => unknown, b: () => unknown): [number, number] {
  const ta: number[] = [];
  const tb: number[] = [];
  a();
  b();
  for (let k = 0; k < repeats; k++) {
    // Alternate the two so drift in the machine's speed hits both alike.
    let t0 = performance.now();
    a();
    ta.push(performance.now() - t0);
    t0 = performance.now();
    b();
    tb.push(performance.now() - t0);
  }
  return [median(ta), median(tb)];
}

export async function run(): Promise<string[]> {
  const lines = ['arch-limit: semicircle, centreline radius 5 m, t = 0.75 m, 20 kN/m^3, 200 voussoirs, P = 30 kN at 3 m'];
  const ring = archRing({ shape: 'circular', radius: 5, half_angle: Math.PI / 2, thickness: 0.75, unit_weight: 20e3, voussoirs: 200 });
  const loads = { P: 30e3, P_at: 3 };
  const limit = (solve: LpSolver) => () => archLimit(ring, loads, solve);
  const [tSeidel, tSimplex] = timeBoth(31, limit(seidelLP), limit(simplexLP));
  lines.push(`  arch_limit, whole call: seidelLP ${tSeidel.toFixed(2)} ms, javascript-lp-solver ${tSimplex.toFixed(2)} ms, ratio ${(tSimplex / tSeidel).toFixed(1)}x`);
  const lp = admissibleProgram(thrustProgram(ring, ring.thickness, loads), [0, 0, 0, 1], true);
  const [lSeidel, lSimplex] = timeBoth(41, () => seidelLP(lp), () => simplexLP(lp));
  lines.push(`  one collapse LP (${lp.b.length} rows, 4 unknowns): seidelLP ${lSeidel.toFixed(3)} ms, javascript-lp-solver ${lSimplex.toFixed(3)} ms, ratio ${(lSimplex / lSeidel).toFixed(1)}x`);
  const a = archLimit(ring, loads, seidelLP);
  const b = archLimit(ring, loads, simplexLP);
  const rel = (x: unknown, y: unknown) => (typeof x === 'number' && typeof y === 'number' ? (x === y ? 0 : Math.abs(x - y) / Math.abs(y)) : x === y ? 0 : Infinity);
  const worst = Math.max(rel(a.H_min, b.H_min), rel(a.H_max, b.H_max), rel(a.load_factor, b.load_factor), rel(a.t_min, b.t_min));
  lines.push(`  answers agree: largest relative difference in H_min, H_max, load_factor, t_min = ${worst.toExponential(1)} ${worst < 1e-6 ? '(ok)' : '(DISAGREE)'}`);
  lines.push('  semicircle under self-weight, t_min / R by voussoir count (exact centroids | weight on centreline):');
  for (const n of [20, 50, 100, 200, 400, 800, 1600]) {
    const row = (['exact', 'centreline'] as const).map((centroids) =>
      (archLimit(archRing({ shape: 'circular', radius: 1, half_angle: Math.PI / 2, thickness: 0.15, unit_weight: 1, voussoirs: n, centroids })).t_min as number).toFixed(7));
    lines.push(`    ${String(n).padStart(5)}  ${row.join('  |  ')}`);
  }
  return lines;
}
