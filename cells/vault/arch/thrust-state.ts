import type { Metres } from '../profile.js';
import type { Newtons } from './types.js';
import type { ThrustProgram } from './thrust-program.js';

/** Actions at one section, of the part left of it on the part right of it: normal force N (N, compression positive), tangential force T along u (N, + towards the extrados), moment M about the mid-point (N·m), e = −M/N (m, + towards the extrados). */
export interface JointAction {
  N: Newtons;
  T: Newtons;
  M: number;
  e: Metres;
}

/** An equilibrium state of the ring: left springing reaction, live-load multiplier, and every joint's actions. */
export interface ThrustState {
  H: Newtons;
  V: Newtons;
  M0: number;
  lambda: number;
  t: Metres;
  joints: JointAction[];
}

/**
 * Undoes the scaling of thrustProgram: the SI state for scaled unknowns z =
 * (h, v, m) at λ = 1, or (h, v, m, ℓ) with λ free (a trailing margin ρ is ignored).
 * @param p the scaled joint forms
 * @param z the unknowns (3 or 4 numbers)
 * @param lambdaFree whether z[3] is ℓ (default: when z has 4 numbers)
 * @returns the state in N, N·m, m
 * @example thrustState(p, [0.6, 0.5, -0.01]).H // 0.6 · p.W
 */
export function thrustState(p: ThrustProgram, z: readonly number[], lambdaFree = z.length === 4): ThrustState {
  const ell = lambdaFree ? z[3]! : p.live / p.W;
  const zz = [z[0]!, z[1]!, z[2]!, ell];
  const joints = p.joints.map((_, j) => {
    let n = p.nB[j]!;
    let m = p.mB[j]!;
    let tt = p.tB[j]!;
    for (let i = 0; i < 4; i++) {
      n += p.nA[j * 4 + i]! * zz[i]!;
      m += p.mA[j * 4 + i]! * zz[i]!;
      tt += p.tA[j * 4 + i]! * zz[i]!;
    }
    const N = n * p.W;
    const M = m * p.W * p.L;
    return { N, T: tt * p.W, M, e: N > 0 ? -M / N : Number.NaN };
  });
  return {
    H: zz[0]! * p.W,
    V: zz[1]! * p.W,
    M0: zz[2]! * p.W * p.L,
    lambda: p.live > 0 ? (ell * p.W) / p.live : 1,
    t: p.t,
    joints,
  };
}
