/**
 * Benchmark (not a timed test): a two-axle vehicle rolled across a
 * segmental arch with fill — arch_scan at 100 positions (plus its refinement)
 * against 100 independent arch_limit calls at the same positions — and the
 * finite-strength programme: tangent-cut rounds and time per collapse solve.
 */
import { archRing } from '../../cells/vault/arch/arch-ring.js';
import { archLimit } from '../../cells/vault/arch/arch-limit.js';
import { archScan } from '../../cells/vault/arch/arch-scan.js';
import { thrustProgram } from '../../cells/vault/arch/thrust-program.js';
import { solveAdmissible } from '../../cells/vault/arch/admissible-program.js';
import { seidelLP } from '../../cells/vault/arch/seidel-lp.js';

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;

export async function run(): Promise<string[]> {
  const options = { shape: 'circular', span: 6, rise: 1.5, thickness: 0.34, unit_weight: 18e3 };
  const loads = { fill_unit_weight: 19e3, fill_level: 2.24, dead: 2.3e3 };
  const ring = archRing(options);
  const lines = ['arch-scan: segment 6 m × 1.5 m, t = 0.34 m, fill to 2.24 m, 200 voussoirs; two axles of 50 kN at 1.8 m'];
  const vehicle = { axles: [50e3, 50e3], spacing: [1.8], steps: 99 };
  const scans: number[] = [];
  let s = archScan(ring, loads, vehicle);
  for (let k = 0; k < 3; k++) {
    const t0 = performance.now();
    s = archScan(ring, loads, vehicle);
    scans.push(performance.now() - t0);
  }
  const xs = Array.from({ length: 100 }, (_, k) => (7.8 * k) / 99);
  const t0 = performance.now();
  let worst = Infinity;
  for (const x of xs) {
    const a = archLimit(ring, { ...loads, axles: [{ W: 50e3, at: x }, { W: 50e3, at: x - 1.8 }] });
    if (typeof a.load_factor === 'number') worst = Math.min(worst, a.load_factor);
  }
  const limits = performance.now() - t0;
  const scan = median(scans);
  lines.push(`  arch_scan, 100 positions + ${s.curve.length - 100} refining: ${scan.toFixed(0)} ms (median of 3); 100 arch_limit calls: ${limits.toFixed(0)} ms; ratio ${(limits / scan).toFixed(1)}x`);
  lines.push(`  λ_min ${(s.lambda_min as number).toFixed(4)} at x = ${(s.x_worst as number).toFixed(3)} m (refined); best of the 100 arch_limit positions ${worst.toFixed(4)}`);
  for (const f_c of [20e6, 5e6, 2e6]) {
    const p = thrustProgram(archRing({ ...options, f_c }), 0.34, { ...loads, P: 60e3, P_at: 1.5 });
    const times: number[] = [];
    let rounds = 0;
    for (let k = 0; k < 9; k++) {
      const t1 = performance.now();
      rounds = solveAdmissible(p, [0, 0, 0, 1], { lambdaFree: true }, seidelLP).rounds;
      times.push(performance.now() - t1);
    }
    lines.push(`  finite strength f_c = ${f_c / 1e6} MPa, collapse LP (P = 60 kN at 1.5 m): ${rounds} programmes solved (tangent-cut rounds), ${median(times).toFixed(1)} ms`);
  }
  return lines;
}
